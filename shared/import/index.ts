export * from './parse-ags4';
export * from './ags-boreholes';
export * from './classify-stratum';
export * from './ground-from-boreholes';
export * from './parse-logger-readings';
export * from './read-dxf-site-plan';
export * from './sha256-hex';
