/** Coordinate reference systems: the definitions drydig ships and site ↔ WGS 84 projection (proj4). */
export * from './lookup-projection-definition';
export * from './resolve-site-projection';
export * from './create-site-projection';
