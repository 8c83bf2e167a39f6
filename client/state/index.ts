export * from './scenario-store';
export * from './view-settings';
export * from './monitoring-section';
