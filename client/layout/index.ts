export * from './ring-layout';
