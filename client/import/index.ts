export * from './geojson-outlines';
export * from './csv-outline';
export * from './site-plan-to-scenario';
export * from './ground-profile-to-scenario';
export * from './logger-to-test-readings';
