export * from './leaflet-map-controller';
export * from './field-canvas-layer';
export * from './colour-scale';
export * from './affine-image';
export * from './plan-grid-layer';
export * from './site-import-layer';
