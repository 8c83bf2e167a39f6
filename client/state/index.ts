export * from './scenario-store';
export * from './view-settings';
