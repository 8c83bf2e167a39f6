export * from './engine-protocol';
export * from './engine-client';
