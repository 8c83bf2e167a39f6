export * from './projection-registry';
export * from './format-lonlat';
