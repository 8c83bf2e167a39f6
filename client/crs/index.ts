export * from '../../shared/crs';
export * from './format-lonlat';
