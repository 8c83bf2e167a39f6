import { DrydigError } from '../schema';
import { isInsideBoundaries } from './image-wells';
import { emptyFlagCounts, interpretSum, type InterpretedSum } from './interpret-sum';
import { prepareField } from './prepare-field';
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

/**
 * Level and drawdown on a regular grid at one time (the hot path behind contour maps).
 * Same model, flags and conventions as {@link evaluatePoints}; values row-major, j·nx + i.
 *
 * @throws DrydigError naming the field for an unusable scenario, grid or time
 */
export function evaluateGrid({ scenario, grid, time_s }: EvaluateGridOptions): GridResult {
  checkGridSpec(grid);
  const field = prepareField({ scenario, time_s });
  const { model, sources, geometry } = field;
  const sums = superposeOnGrid(sources, grid);
  if (field.penetration) addPartialPenetrationOnGrid(field.penetration, sources, grid, sums.value);
  const [nx, ny] = grid.counts;
  const n = nx * ny;
  const drawdown = new Float64Array(n);
  const level = new Float64Array(n);
  const flags = new Uint8Array(n);
  const counts = emptyFlagCounts();
  const out: InterpretedSum = { level_m: 0, drawdown_m: 0, flagBits: 0 };
  const steadyClipped = sources.kind === 'thiem' && sources.count > 0;
  const bounded = geometry.configuration !== 'none';
  const flagList = Object.keys(FLAG_BITS) as PointFlag[];

  for (let j = 0; j < ny; j++) {
    const y = grid.origin[1] + j * grid.spacing_m[1];
    for (let i = 0; i < nx; i++) {
      const idx = j * nx + i;
      let bits: number;
      if (bounded && !isInsideBoundaries(geometry, grid.origin[0] + i * grid.spacing_m[0], y)) {
        level[idx] = model.staticLevel_m;
        drawdown[idx] = 0;
        bits = FLAG_BITS['beyond-boundary'];
      } else {
        interpretSum(model, sums.value[idx]!, out);
        level[idx] = out.level_m;
        drawdown[idx] = out.drawdown_m;
        bits = out.flagBits;
        if (sums.withinWell[idx] === 1) bits |= FLAG_BITS['within-well-radius'];
        if (steadyClipped && sums.reached[idx] === 0) bits |= FLAG_BITS['beyond-influence-radius'];
      }
      flags[idx] = bits;
      if (bits !== 0) for (const f of flagList) if (bits & FLAG_BITS[f]) counts[f]++;
    }
  }
  return { grid, time_s: model.time_s, drawdown_m: drawdown, level_m: level, flags, flagCounts: counts, model: field.info };
}
