/** Engine work of requests on one pool of worker threads, shared fairly between clients. */
export * from './compute-pool';
export * from './compute-context';
export * from './compute-plugin';
export * from './compute-tasks';
export * from './fair-queue';
export * from './work-size';
export * from './run-design-on-pool';
