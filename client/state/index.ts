export * from './scenario-store';
export * from './view-settings';
export * from './monitoring-section';
export * from './ground-profile-edits';
export * from './design-inputs-key';
