/**
 * Set-out table of the wells for the site engineer: id, kind, easting and northing in the site
 * CRS, latitude/longitude where the scenario is georeferenced, rate and screen levels.
 */
import type { Scenario, Well } from '../schema';
import { csvRows, roundTo } from './csv-cell';
import type { SiteProjection } from '../crs';

/** One row of the set-out table. */
export interface SetoutRow {
  /** 1-based number shown beside the well on the plan. */
  number: number;
  id: string;
  kind: Well['kind'];
  easting_m: number;
  northing_m: number;
  /** WGS 84, degrees; null for a local grid. */
  latitude_deg: number | null;
  longitude_deg: number | null;
  /** Constant rate, or the first scheduled rate, m³/s. */
  rate_m3_s: number;
  /** True when the rate changes over time (see the schedule). */
  scheduled: boolean;
  screenTop_m: number | null;
  screenBottom_m: number | null;
  active: boolean;
}

/** The set-out rows, in scenario order. */
export function buildSetoutRows(scenario: Scenario, projection: SiteProjection | null): SetoutRow[] {
  return scenario.wells.map((w, i) => {
    const lonLat = projection ? projection.toLonLat(w.x, w.y) : null;
    return {
      number: i + 1,
      id: w.id,
      kind: w.kind,
      easting_m: w.x,
      northing_m: w.y,
      latitude_deg: lonLat ? lonLat[1] : null,
      longitude_deg: lonLat ? lonLat[0] : null,
      rate_m3_s: w.rate_m3_s ?? w.schedule?.[0]?.rate_m3_s ?? 0,
      scheduled: w.schedule !== undefined && w.schedule.length > 1,
      screenTop_m: w.screenTop_m ?? null,
      screenBottom_m: w.screenBottom_m ?? null,
      active: w.active !== false,
    };
  });
}

/** Options for `writeSetoutCsv`. */
export interface SetoutCsvOptions {
  scenario: Scenario;
  /** Site CRS ↔ WGS 84; null for a local grid (latitude/longitude columns left empty). */
  projection: SiteProjection | null;
}

/**
 * The set-out CSV. Coordinates to the millimetre, lat/lon to 1e-8° (about a millimetre), rates in
 * L/s (the unit on site; the header says so).
 */
export function writeSetoutCsv(options: SetoutCsvOptions): string {
  const rows = buildSetoutRows(options.scenario, options.projection);
  const crs = options.scenario.crs ?? 'local site grid';
  const header = [
    'number', 'well_id', 'kind', `easting_m (${crs})`, `northing_m (${crs})`, 'latitude_deg (WGS 84)', 'longitude_deg (WGS 84)',
    'rate_L_s', 'rate_changes_over_time', 'screen_top_m', 'screen_bottom_m', 'active',
  ];
  return csvRows([
    header,
    ...rows.map((r) => [
      r.number, r.id, r.kind, roundTo(r.easting_m, 3), roundTo(r.northing_m, 3),
      r.latitude_deg === null ? null : roundTo(r.latitude_deg, 8), r.longitude_deg === null ? null : roundTo(r.longitude_deg, 8),
      roundTo(r.rate_m3_s * 1000, 4), r.scheduled ? 'yes' : 'no', r.screenTop_m, r.screenBottom_m, r.active ? 'yes' : 'no',
    ]),
  ]);
}
