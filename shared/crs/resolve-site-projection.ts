/**
 * Site CRS → WGS 84 longitude/latitude and back, by proj4, for the plan map, the site view and
 * the export writers alike (so set-out latitude/longitude and GPS placement agree).
 */
import proj4 from 'proj4';
import { lookupProjectionDefinition } from './lookup-projection-definition';

/** A resolved projection between site metres and WGS 84 degrees. */
export interface SiteProjection {
  ok: true;
  /** The scenario's CRS code, e.g. "EPSG:32633". */
  code: string;
  /** Short description for the status line, e.g. "EPSG:32633 — WGS 84 / UTM zone 33N". */
  label: string;
  /** Site easting/northing (m) → [longitude, latitude] in degrees. */
  toLonLat: (x: number, y: number) => [number, number];
  /** [longitude, latitude] degrees → site [easting, northing], m. */
  fromLonLat: (lon: number, lat: number) => [number, number];
}

/** Why no projection is available. */
export interface ProjectionProblem {
  ok: false;
  /** Shown to the user as is. */
  message: string;
}

/** Options for `resolveSiteProjection`. */
export interface ResolveSiteProjectionOptions {
  /** The scenario's `crs` (e.g. "EPSG:32633"); absent = local grid. */
  crs?: string;
  /** The scenario's `proj4` definition; overrides the built-in one when present. */
  proj4?: string;
}

/**
 * The projection for a scenario, or a message saying why there is none (local grid, unknown
 * code, a proj4 text that does not parse). Never throws.
 */
export function resolveSiteProjection(options: ResolveSiteProjectionOptions): SiteProjection | ProjectionProblem {
  const code = options.crs;
  if (!code) return { ok: false, message: 'Local site grid: no coordinate reference system is set, so latitude/longitude are not shown.' };
  let def = options.proj4?.trim();
  let label = 'custom proj4 definition';
  if (!def) {
    const known = lookupProjectionDefinition(code);
    if (!known) {
      return {
        ok: false,
        message: `${code} is not one of the coordinate systems drydig knows (UTM zones, ETRS89/NAD83 UTM, and a few national grids). Paste its proj4 definition in Backdrop → Coordinate system to show latitude/longitude.`,
      };
    }
    def = known.def;
    label = known.label;
  }
  try {
    const converter = proj4(def, 'EPSG:4326');
    const test = converter.forward([500000, 5000000]);
    if (!Number.isFinite(test[0]) || !Number.isFinite(test[1])) throw new Error('non-finite result');
    return {
      ok: true,
      code,
      label: `${code} — ${label}`,
      toLonLat: (x, y) => {
        const [lon, lat] = converter.forward([x, y]);
        return [lon!, lat!];
      },
      fromLonLat: (lon, lat) => {
        const [x, y] = converter.inverse([lon, lat]);
        return [x!, y!];
      },
    };
  } catch (error) {
    return { ok: false, message: `The proj4 definition for ${code} could not be used (${(error as Error).message}). Check the text pasted in Backdrop → Coordinate system.` };
  }
}
