import { DrydigError } from '../schema';
import { isInsideBoundaries } from './image-wells';
import { emptyFlagCounts, interpretSum, type InterpretedSum } from './interpret-sum';
import { prepareField, type PreparedField } from './prepare-field';
import { superposeOnGrid } from './superpose';
import { addPartialPenetrationOnGrid } from './partial-penetration-sum';
import { FLAG_BITS, type EvaluateGridOptions, type GridResult, type GridSpec, type PointFlag } from './types';

/** Most nodes one grid evaluation accepts (about 80 MB of results). */
export const MAX_GRID_NODES = 4_000_000;

/** Checks a grid spec; names the bad field (`/grid/spacing_m/0`). */
export function checkGridSpec(grid: GridSpec): void {
  const bad = (path: string, message: string, code: 'DRYDIG_ERR_INVALID_REQUEST' | 'DRYDIG_ERR_GRID_TOO_LARGE' = 'DRYDIG_ERR_INVALID_REQUEST'): never => {
    throw new DrydigError(code, `${path}: ${message}`, [{ path, message }]);
  };
  if (!grid || typeof grid !== 'object') bad('/grid', 'must be an object with origin, spacing_m and counts');
  for (const k of [0, 1] as const) {
    if (!Number.isFinite(grid.origin?.[k])) bad(`/grid/origin/${k}`, 'must be a finite number (m)');
    const h = grid.spacing_m?.[k];
    if (!(typeof h === 'number' && Number.isFinite(h) && h > 0)) bad(`/grid/spacing_m/${k}`, 'must be a finite number > 0 (m)');
    const c = grid.counts?.[k];
    if (!(typeof c === 'number' && Number.isInteger(c) && c >= 1)) bad(`/grid/counts/${k}`, 'must be a whole number ≥ 1');
  }
  const nodes = grid.counts[0] * grid.counts[1];
  if (nodes > MAX_GRID_NODES) bad('/grid/counts', `${nodes} nodes exceed the limit of ${MAX_GRID_NODES}`, 'DRYDIG_ERR_GRID_TOO_LARGE');
}

/** One band of grid rows: values for rows j0 … j1−1 only (row-major within the band). */
export interface GridBand {
  rows: readonly [number, number];
  drawdown_m: Float64Array;
  level_m: Float64Array;
  flags: Uint8Array;
  flagCounts: GridResult['flagCounts'];
  time_s: number | null;
  model: GridResult['model'];
}

/**
 * Level and drawdown on a regular grid at one time (the hot path behind contour maps).
 * Same model, flags and conventions as {@link evaluatePoints}; values row-major, j·nx + i.
 *
 * @throws DrydigError naming the field for an unusable scenario, grid or time
 */
export function evaluateGrid(options: EvaluateGridOptions): GridResult {
  const { grid } = options;
  const band = evaluateGridBand(options, [0, grid.counts[1]]);
  return { grid, time_s: band.time_s, drawdown_m: band.drawdown_m, level_m: band.level_m, flags: band.flags, flagCounts: band.flagCounts, model: band.model };
}

/**
 * Rows j0 … j1−1 of {@link evaluateGrid}, bit for bit: nodes keep the whole grid's coordinates
 * (origin + j·spacing) and the kernel's chunks are sized for the whole grid, so bands evaluated
 * apart (one per thread) and put together equal the whole-grid evaluation exactly.
 */
export function evaluateGridBand({ scenario, grid, time_s, kernel }: EvaluateGridOptions, rows: readonly [number, number]): GridBand {
  checkGridSpec(grid);
  const ny = grid.counts[1];
  const j0 = Math.max(0, Math.min(ny, Math.floor(rows[0])));
  const j1 = Math.max(j0, Math.min(ny, Math.floor(rows[1])));
  const field = prepareField({ scenario, time_s });
  const { sources } = field;
  const sums = superposeOnGrid(sources, grid, { rows: [j0, j1], ...(kernel ? { kernel } : {}) });
  if (field.penetration) addPartialPenetrationOnGrid(field.penetration, sources, grid, sums.value, [j0, j1]);
  return interpretGridBand({ field, grid, rows: [j0, j1], value: sums.value, withinWell: sums.withinWell, reached: sums.reached });
}

/** What {@link interpretGridBand} reads: the prepared field and the whole grid's sums. */
export interface InterpretGridBandOptions {
  field: PreparedField;
  grid: GridSpec;
  rows: readonly [number, number];
  /** Σ of the sources per node of the whole grid (row-major). */
  value: ArrayLike<number>;
  /** > 0 where a real well's face covers the node. */
  withinWell: ArrayLike<number>;
  /** > 0 where a source reached the node (read for Thiem only). */
  reached: ArrayLike<number>;
}

/** Level, drawdown and flags of rows j0 … j1−1 from the summed sources (evaluateGrid and the incremental grid share it). */
export function interpretGridBand({ field, grid, rows, value, withinWell, reached }: InterpretGridBandOptions): GridBand {
  const { model, sources, geometry } = field;
  const [nx] = grid.counts;
  const [j0, j1] = rows;
  const n = nx * (j1 - j0);
  const drawdown = new Float64Array(n);
  const level = new Float64Array(n);
  const flags = new Uint8Array(n);
  const out: InterpretedSum = { level_m: 0, drawdown_m: 0, flagBits: 0 };
  const steadyClipped = sources.kind === 'thiem' && sources.count > 0;
  const bounded = geometry.configuration !== 'none';
  // Nodes per flag mask (masks fit a byte): one increment per node, flags counted at the end.
  const perMask = new Int32Array(256);
  for (let j = j0; j < j1; j++) {
    const y = grid.origin[1] + j * grid.spacing_m[1];
    for (let i = 0; i < nx; i++) {
      const idx = j * nx + i;
      const at = idx - j0 * nx;
      let bits: number;
      if (bounded && !isInsideBoundaries(geometry, grid.origin[0] + i * grid.spacing_m[0], y)) {
        level[at] = model.staticLevel_m;
        drawdown[at] = 0;
        bits = FLAG_BITS['beyond-boundary'];
      } else {
        interpretSum(model, value[idx]!, out);
        level[at] = out.level_m;
        drawdown[at] = out.drawdown_m;
        bits = out.flagBits;
        if (withinWell[idx]! > 0) bits |= FLAG_BITS['within-well-radius'];
        if (steadyClipped && reached[idx] === 0) bits |= FLAG_BITS['beyond-influence-radius'];
      }
      flags[at] = bits;
      perMask[bits]!++;
    }
  }
  const counts = emptyFlagCounts();
  const flagList = Object.keys(FLAG_BITS) as PointFlag[];
  for (let mask = 1; mask < 256; mask++) {
    const c = perMask[mask]!;
    if (c > 0) for (const f of flagList) if (mask & FLAG_BITS[f]) counts[f] += c;
  }
  return { rows: [j0, j1], time_s: model.time_s, drawdown_m: drawdown, level_m: level, flags, flagCounts: counts, model: field.info };
}
