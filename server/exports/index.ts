/** Serving exports and computed views of stored revisions. */
export * from './send-export';
export * from './computed-views';
export * from './computed-view';
export * from './design-for';
export * from './field-engine';
export * from './render-export-body';
export * from './plan-compute';
