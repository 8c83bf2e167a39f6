export * from './ring-layout';
export * from './well-screens';
export * from './nearby-wells';
