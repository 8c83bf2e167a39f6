export * from './engine-protocol';
export * from './engine-client';
export * from './import-protocol';
export * from './import-client';
export * from './packed-lines';
