/** Pure export writers: scenario JSON, set-out CSV, GeoJSON, DXF, report HTML, monitoring plan and CSV. */
export * from './design-cautions';
export { createSiteProjection, type SiteProjection } from '../crs';
export * from './csv-cell';
export * from './escape-html';
export * from './field-engine';
export * from './plan-results';
export * from './plan-svg';
export * from './setout-csv';
export * from './scenario-json';
export * from './geojson';
export * from './dxf';
export * from './monitoring-plan';
export * from './monitoring-csv';
export * from './method-references';
export * from './report-html';
export * from './section-floor-csv';
export * from './section-report-html';
