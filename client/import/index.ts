export * from './geojson-outlines';
export * from './csv-outline';
