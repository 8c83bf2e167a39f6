export * from './contour-levels';
export * from './contour-grid';
export * from './contour-excess';
export * from './contour-mask';
export * from './contour-geojson';
export { pixelToSite, ringSignedArea, type XY } from './grid-frame';
