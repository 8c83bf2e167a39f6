export * from './auth-plugin';
export * from './passwords';
export * from './roles';
export * from './setup-link';
