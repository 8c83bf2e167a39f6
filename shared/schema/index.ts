export * from './scenario-schema';
export * from './validate-scenario';
export * from './error-table';
export * from './design-options-schema';
export * from './monitoring-schema';
export * from './view-schema';
export * from './section-schema';
export * from './validate-section';
