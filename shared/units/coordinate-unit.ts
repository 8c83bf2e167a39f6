/**
 * The unit site coordinates are shown in. Inside, coordinates are metres on the site grid. With a
 * projected CRS the grid is that CRS (every definition in `shared/crs` is in metres: UTM, national
 * grids, a pasted proj4 with `+units=m`), so eastings and northings stay in its unit whatever the
 * display system: a UTM easting is never converted to feet. A local site grid (no CRS) follows
 * the display length system. The caption under the map says which.
 */
import type { DisplayUnits } from './display-units';
import type { UnitId } from './unit-definitions';

export interface CoordinateUnitOptions {
  /** The scenario's EPSG code, if any. */
  crs?: string | undefined;
  /** A pasted proj4 definition, if any. */
  proj4?: string | undefined;
  /** The display units (their length system decides a local grid's unit). */
  units: Pick<DisplayUnits, 'length'>;
}

export interface CoordinateUnit {
  unit: UnitId;
  /** Caption for the map's read-out, e.g. "Site grid, feet" or "EPSG:32633 grid, metres". */
  caption: string;
}

/** The coordinate display unit and its caption (see the file comment). */
export function coordinateUnit({ crs, proj4, units }: CoordinateUnitOptions): CoordinateUnit {
  const projected = crs !== undefined || proj4 !== undefined;
  const footGrid = projected ? /\+units=(ft|us-ft)\b/.test(proj4 ?? '') : units.length === 'ft';
  const words = footGrid ? 'feet' : 'metres';
  return { unit: footGrid ? 'ft E/N' : 'm E/N', caption: projected ? `${crs ?? 'Projected'} grid, ${words}` : `Site grid, ${words}` };
}
