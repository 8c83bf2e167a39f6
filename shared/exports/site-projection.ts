/**
 * Georeferencing of the site grid: scenario CRS (EPSG code, optionally with its proj4 text) to
 * WGS 84 longitude/latitude and back, with proj4. A scenario without a CRS is a local grid and
 * has no projection; nothing is invented for it.
 */
import proj4 from 'proj4';
import type { Scenario } from '../schema';

/** A working transform between the site CRS and WGS 84 (EPSG:4326). */
export interface SiteProjection {
  /** The site CRS, e.g. 'EPSG:32633'. */
  crs: string;
  /** Site easting/northing (m) → [longitude, latitude] in degrees. */
  toLonLat(x: number, y: number): [number, number];
  /** [longitude, latitude] degrees → site [easting, northing], m. */
  fromLonLat(lon: number, lat: number): [number, number];
}

/**
 * proj4 text for EPSG codes proj4 does not carry itself: ETRS89 / UTM zones 28–38 N
 * (EPSG:25828–25838, GRS 80 ellipsoid; EPSG registry). WGS 84 UTM (326xx/327xx), 4326 and 3857
 * are built into proj4.
 */
export function knownProj4Definition(crs: string): string | undefined {
  const m = /^EPSG:258(2[89]|3[0-8])$/.exec(crs);
  if (m) return `+proj=utm +zone=${m[1]} +ellps=GRS80 +towgs84=0,0,0,0,0,0,0 +units=m +no_defs`;
  return undefined;
}

/** The transform for a scenario, or null for a local grid or a CRS proj4 cannot resolve. */
export function createSiteProjection(scenario: Pick<Scenario, 'crs' | 'proj4'>): SiteProjection | null {
  const crs = scenario.crs;
  if (!crs) return null;
  const definition = scenario.proj4 ?? knownProj4Definition(crs) ?? (proj4.defs(crs) ? crs : undefined);
  if (!definition) return null;
  let converter: proj4.Converter;
  try {
    converter = proj4(definition, 'EPSG:4326');
  } catch {
    return null;
  }
  return {
    crs,
    toLonLat(x, y) {
      const [lon, lat] = converter.forward([x, y]);
      return [lon ?? Number.NaN, lat ?? Number.NaN];
    },
    fromLonLat(lon, lat) {
      const [x, y] = converter.inverse([lon, lat]);
      return [x ?? Number.NaN, y ?? Number.NaN];
    },
  };
}
