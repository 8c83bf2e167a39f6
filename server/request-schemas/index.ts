export * from './error-response-schema';
export * from './evaluate-schemas';
export * from './health-schema';
