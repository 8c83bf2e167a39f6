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
 * National grids by their EPSG registry parameters, with the published 7-parameter datum shifts
 * (good to a few metres). The same definitions as the client's projection registry
 * (client/crs/projection-registry.ts); a test keeps the two in agreement.
 */
const NATIONAL_GRIDS: Readonly<Record<string, string>> = {
  'EPSG:27700': '+proj=tmerc +lat_0=49 +lon_0=-2 +k=0.9996012717 +x_0=400000 +y_0=-100000 +ellps=airy +towgs84=446.448,-125.157,542.06,0.15,0.247,0.842,-20.489 +units=m +no_defs',
  'EPSG:2154': '+proj=lcc +lat_0=46.5 +lon_0=3 +lat_1=49 +lat_2=44 +x_0=700000 +y_0=6600000 +ellps=GRS80 +towgs84=0,0,0,0,0,0,0 +units=m +no_defs',
  'EPSG:28992': '+proj=sterea +lat_0=52.1561605555556 +lon_0=5.38763888888889 +k=0.9999079 +x_0=155000 +y_0=463000 +ellps=bessel +towgs84=565.4171,50.3319,465.5524,1.9342,-1.6677,9.1019,4.0725 +units=m +no_defs',
  'EPSG:2056': '+proj=somerc +lat_0=46.9524055555556 +lon_0=7.43958333333333 +k_0=1 +x_0=2600000 +y_0=1200000 +ellps=bessel +towgs84=674.374,15.056,405.346,0,0,0,0 +units=m +no_defs',
};

/**
 * proj4 text for EPSG codes proj4 does not carry itself: ETRS89 / UTM zones 28–38 N
 * (EPSG:25828–25838, GRS 80), NAD83 / UTM zones 1–23 N (EPSG:26901–26923) and the national grids
 * above. WGS 84 UTM (326xx/327xx), 4326 and 3857 are built into proj4.
 */
export function knownProj4Definition(crs: string): string | undefined {
  const etrs = /^EPSG:258(2[89]|3[0-8])$/.exec(crs);
  if (etrs) return `+proj=utm +zone=${etrs[1]} +ellps=GRS80 +towgs84=0,0,0,0,0,0,0 +units=m +no_defs`;
  const nad = /^EPSG:269(0[1-9]|1[0-9]|2[0-3])$/.exec(crs);
  if (nad) return `+proj=utm +zone=${Number(nad[1])} +datum=NAD83 +units=m +no_defs`;
  return NATIONAL_GRIDS[crs];
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
