export * from './scenario-store';
export * from './view-settings';
export * from './monitoring-section';
export * from './receptor-section';
