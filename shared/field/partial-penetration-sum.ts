/**
 * Partial penetration in superposition: each source of a well screened over part of the aquifer
 * adds amp·f_s (Hantush 1961, `partialPenetrationCorrection`) to the superposed variable.
 * Plan points are read as piezometers at the top of the aquifer (the water table when
 * unconfined, the head under the confining layer otherwise — the level an excavation floor
 * meets); a well's own face is read as the mean over its own screen (the level in the well).
 */
import type { Scenario } from '../schema';
import { partialPenetrationCorrection } from '../wells';
import type { FieldModel } from './field-model';
import type { SourceSet } from './source-set';
import type { GridSpec } from './types';

/** Beyond r·√(Kv/Kh) > this × D a source adds less than K0(4π) ≈ 1.2e-6 of its scale per term: skipped (keeps grids fast). */
const REACH_THICKNESSES = 4;

/** Depths below the aquifer top of each well's screen (null: fully penetrating, no correction). */
export interface PenetrationTable {
  thickness_m: number;
  anisotropyKhKv: number;
  leakageFactor_m?: number;
  /** Per scenario well: [top depth, bottom depth] m, or null. */
  screens: Array<readonly [number, number] | null>;
  /** Squared reach beyond which nothing is added, m². */
  reach2_m2: number;
  /** Steady sources carry Q/(2πT): the correction is on the Q/(4πT) scale, so × 1/2. */
  ampScale: number;
  /** Index of the partially penetrating well whose radius holds (x, y), −1 for none. */
  wellAt: (x: number, y: number) => number;
}

/** The screens of partially penetrating wells, or null when every well penetrates fully. */
export function buildPenetrationTable(scenario: Scenario, model: FieldModel): PenetrationTable | null {
  const a = scenario.aquifer;
  const top = model.kind === 'unconfined' ? model.staticLevel_m : (model.top_m ?? model.staticLevel_m);
  const D = model.thickness_m;
  const screens = scenario.wells.map((w): readonly [number, number] | null => {
    const screenTop = Math.min(w.screenTop_m ?? top, top);
    const screenBottom = Math.max(w.screenBottom_m ?? model.base_m, model.base_m);
    if (!(screenTop > screenBottom)) return null;
    const dTop = top - screenTop;
    const dBottom = top - screenBottom;
    if (dTop <= 1e-9 && dBottom >= D - 1e-9) return null;
    return [dTop, dBottom] as const;
  });
  if (screens.every((s) => s === null)) return null;
  const ratio = a.anisotropyKhKv ?? 1;
  const reach = REACH_THICKNESSES * D * Math.sqrt(ratio);
  const table: PenetrationTable = {
    thickness_m: D,
    anisotropyKhKv: ratio,
    screens,
    reach2_m2: reach * reach,
    ampScale: model.time_s === null ? 0.5 : 1,
    wellAt: (x, y) =>
      scenario.wells.findIndex((w, i) => screens[i] !== null && (x - w.x) ** 2 + (y - w.y) ** 2 <= w.radius_m * w.radius_m),
  };
  if (model.leakageFactor_m !== undefined) table.leakageFactor_m = model.leakageFactor_m;
  return table;
}

/**
 * The correction to the superposed variable at (x, y) from the sources of partially
 * penetrating wells: into `row[rowOffset + column[well]]` per well when `column` is given,
 * else summed and returned.
 * A point within r_w of a partially penetrating well's axis is inside that well: its level is
 * read over that well's screen (the pumping level).
 * @param faceOf index of the well whose face this point is; −1: the well the point lies inside, if any
 */
export function partialPenetrationAt(
  table: PenetrationTable,
  set: SourceSet,
  x: number,
  y: number,
  faceOf = -1,
  byWell?: { row: Float64Array; rowOffset: number; column: Int32Array },
): number {
  const face = faceOf >= 0 ? faceOf : table.wellAt(x, y);
  const observed = face >= 0 ? (table.screens[face] ?? null) : null;
  let sum = 0;
  for (let k = 0; k < set.count; k++) {
    const well = set.well[k]!;
    const screen = table.screens[well];
    if (!screen) continue;
    const col = byWell ? byWell.column[well]! : 0;
    if (col < 0) continue;
    const dx = x - set.x[k]!;
    const dy = y - set.y[k]!;
    let r2 = dx * dx + dy * dy;
    if (r2 >= table.reach2_m2 || r2 >= set.r2cut[k]!) continue;
    if (r2 < set.r2min[k]!) r2 = set.r2min[k]!;
    const f = partialPenetrationCorrection({
      distance_m: Math.sqrt(r2),
      thickness_m: table.thickness_m,
      screenTopDepth_m: screen[0],
      screenBottomDepth_m: screen[1],
      observationTopDepth_m: observed ? observed[0] : 0,
      observationBottomDepth_m: observed ? observed[1] : 0,
      anisotropyKhKv: table.anisotropyKhKv,
      ...(table.leakageFactor_m !== undefined ? { leakageFactor_m: table.leakageFactor_m } : {}),
    });
    const v = set.amp[k]! * table.ampScale * f;
    if (byWell) byWell.row[byWell.rowOffset + col]! += v;
    else sum += v;
  }
  return sum;
}

/** Nodes of the f_s(ln r) table a grid evaluation interpolates (linear in ln r; error ≈ Δ²/8·|f''|, below 1e-6 of the scale). */
const GRID_TABLE_NODES = 2048;

/** f_s at plan points (aquifer top) against ln r for one screen, tabulated for a grid. */
function tabulateCorrection(table: PenetrationTable, screen: readonly [number, number], rMin_m: number, rMax_m: number): { lnMin: number; step: number; values: Float64Array } {
  const lnMin = Math.log(rMin_m);
  const step = (Math.log(rMax_m) - lnMin) / (GRID_TABLE_NODES - 1);
  const values = new Float64Array(GRID_TABLE_NODES);
  for (let i = 0; i < GRID_TABLE_NODES; i++)
    values[i] = partialPenetrationCorrection({
      distance_m: Math.exp(lnMin + i * step),
      thickness_m: table.thickness_m,
      screenTopDepth_m: screen[0],
      screenBottomDepth_m: screen[1],
      observationTopDepth_m: 0,
      anisotropyKhKv: table.anisotropyKhKv,
      ...(table.leakageFactor_m !== undefined ? { leakageFactor_m: table.leakageFactor_m } : {}),
    });
  return { lnMin, step, values };
}

/**
 * Adds the correction on every grid node within reach of a partially penetrating source (plan
 * points), from a table of f_s in ln r per distinct screen (the series per node would cost ten
 * times the rest of the grid).
 */
/** The smallest well radius among the partially penetrating sources of `set`, m: where the grid's correction tables start. */
export function penetrationTableStart(table: PenetrationTable, set: SourceSet): number {
  let r2minAll = Infinity;
  for (let k = 0; k < set.count; k++) if (table.screens[set.well[k]!]) r2minAll = Math.min(r2minAll, set.r2min[k]!);
  return Math.sqrt(r2minAll);
}

/**
 * Adds the partial-penetration corrections of `set`'s sources to `value` (rows j0 … j1−1).
 * `rMin_m` is where the correction tables start (default: from `set` itself); the incremental
 * grid passes the whole field's, so one well's share is tabulated exactly as in the whole sum.
 */
export function addPartialPenetrationOnGrid(
  table: PenetrationTable, set: SourceSet, grid: GridSpec, value: Float64Array,
  rows: readonly [number, number] = [0, grid.counts[1]], rMin_m: number = penetrationTableStart(table, set),
): void {
  const [nx, ny] = grid.counts;
  const [ox, oy] = grid.origin;
  const [hx, hy] = grid.spacing_m;
  const tables = new Map<string, ReturnType<typeof tabulateCorrection>>();
  const rMin = rMin_m;
  const rMax = Math.sqrt(table.reach2_m2);
  if (!(rMax > rMin)) return;
  for (let k = 0; k < set.count; k++) {
    const screen = table.screens[set.well[k]!];
    if (!screen) continue;
    const key = `${screen[0]}:${screen[1]}`;
    let tab = tables.get(key);
    if (!tab) {
      tab = tabulateCorrection(table, screen, rMin, rMax);
      tables.set(key, tab);
    }
    const { lnMin, step, values } = tab;
    const reach2 = Math.min(table.reach2_m2, set.r2cut[k]!);
    const reach = Math.sqrt(reach2);
    const sx = set.x[k]!;
    const sy = set.y[k]!;
    const j0 = Math.max(rows[0], Math.ceil((sy - reach - oy) / hy));
    const j1 = Math.min(ny - 1, rows[1] - 1, Math.floor((sy + reach - oy) / hy));
    const i0 = Math.max(0, Math.ceil((sx - reach - ox) / hx));
    const i1 = Math.min(nx - 1, Math.floor((sx + reach - ox) / hx));
    const scale = set.amp[k]! * table.ampScale;
    const r2min = set.r2min[k]!;
    for (let j = j0; j <= j1; j++) {
      const dy = oy + j * hy - sy;
      for (let i = i0; i <= i1; i++) {
        const dx = ox + i * hx - sx;
        let r2 = dx * dx + dy * dy;
        if (r2 >= reach2) continue;
        if (r2 < r2min) r2 = r2min;
        const x = Math.min((0.5 * Math.log(r2) - lnMin) / step, GRID_TABLE_NODES - 1.000001);
        const m = Math.max(0, x | 0);
        const t = x - m;
        value[j * nx + i]! += scale * (values[m]! * (1 - t) + values[m + 1]! * t);
      }
    }
  }
}
