/**
 * The CRS definitions drydig ships. proj4 itself carries only a handful of codes, so the common
 * UTM zones are built by formula and a few national grids are written out; any other CRS needs
 * its proj4 text in the scenario's `proj4` field.
 */

/** A proj4 definition with the name shown to the user. */
export interface ProjectionDefinition {
  /** Short description, e.g. "WGS 84 / UTM zone 33N". */
  label: string;
  /** proj4 definition text. */
  def: string;
}

// Definitions from the EPSG registry parameters (from memory; checked against EPSG Guidance
// Note 7-2 identities in tests/shared/crs). Datum shifts are the published 7-parameter
// approximations: good to a few metres, enough to place a site on a background map.
const NATIONAL_GRIDS: Readonly<Record<string, ProjectionDefinition>> = {
  'EPSG:27700': {
    label: 'OSGB 1936 / British National Grid',
    def: '+proj=tmerc +lat_0=49 +lon_0=-2 +k=0.9996012717 +x_0=400000 +y_0=-100000 +ellps=airy +towgs84=446.448,-125.157,542.06,0.15,0.247,0.842,-20.489 +units=m +no_defs',
  },
  'EPSG:2154': {
    label: 'RGF93 / Lambert-93',
    def: '+proj=lcc +lat_0=46.5 +lon_0=3 +lat_1=49 +lat_2=44 +x_0=700000 +y_0=6600000 +ellps=GRS80 +towgs84=0,0,0,0,0,0,0 +units=m +no_defs',
  },
  'EPSG:28992': {
    label: 'Amersfoort / RD New',
    def: '+proj=sterea +lat_0=52.1561605555556 +lon_0=5.38763888888889 +k=0.9999079 +x_0=155000 +y_0=463000 +ellps=bessel +towgs84=565.4171,50.3319,465.5524,1.9342,-1.6677,9.1019,4.0725 +units=m +no_defs',
  },
  'EPSG:2056': {
    label: 'CH1903+ / LV95',
    def: '+proj=somerc +lat_0=46.9524055555556 +lon_0=7.43958333333333 +k_0=1 +x_0=2600000 +y_0=1200000 +ellps=bessel +towgs84=674.374,15.056,405.346,0,0,0,0 +units=m +no_defs',
  },
  'EPSG:3857': { label: 'WGS 84 / Pseudo-Mercator', def: '+proj=merc +a=6378137 +b=6378137 +lat_ts=0 +lon_0=0 +x_0=0 +y_0=0 +k=1 +units=m +nadgrids=@null +no_defs' },
};

/**
 * proj4 definition and label for an EPSG code drydig ships, or null.
 * UTM by formula: WGS 84 326zz (north) / 327zz (south), ETRS89 258zz (zones 28–38),
 * NAD83 269zz (zones 1–23); central meridian −183° + 6°·zz, k0 0.9996, false easting 500 km,
 * false northing 10 000 km in the south (the UTM definition).
 */
export function lookupProjectionDefinition(code: string): ProjectionDefinition | null {
  const m = /^EPSG:(\d{4,6})$/.exec(code.trim());
  if (!m) return null;
  const n = Number(m[1]);
  const utm = (zone: number, south: boolean, datum: string, ellps: string, label: string): ProjectionDefinition => ({
    label: `${label} / UTM zone ${zone}${south ? 'S' : 'N'}`,
    def: `+proj=utm +zone=${zone}${south ? ' +south' : ''} ${ellps} ${datum} +units=m +no_defs`,
  });
  if (n >= 32601 && n <= 32660) return utm(n - 32600, false, '+datum=WGS84', '+ellps=WGS84', 'WGS 84');
  if (n >= 32701 && n <= 32760) return utm(n - 32700, true, '+datum=WGS84', '+ellps=WGS84', 'WGS 84');
  if (n >= 25828 && n <= 25838) return utm(n - 25800, false, '+towgs84=0,0,0,0,0,0,0', '+ellps=GRS80', 'ETRS89');
  if (n >= 26901 && n <= 26923) return utm(n - 26900, false, '+datum=NAD83', '+ellps=GRS80', 'NAD83');
  return NATIONAL_GRIDS[`EPSG:${n}`] ?? null;
}
