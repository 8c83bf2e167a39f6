/**
 * The inner loops: superposition of all sources at one point and over a regular grid.
 * The summed quantity is drawdown (confined, leaky) or discharge-potential drawdown s_c
 * (unconfined), both linear in the rates.
 */
import { besselK0, EULER_GAMMA, hantushWellFunction, theisWellFunction } from '../wells';
import { getTheisTable, THEIS_TABLE_MAX_U, THEIS_TABLE_STEP } from './theis-table';
import type { SourceSet } from './source-set';
import { groupTheisSources, makeTheisRowScratch, theisGridRow } from './theis-grid-rows';
import type { GridSpec } from './types';

/** Side results of {@link superposeAtPoint}, reused to keep the call allocation-free. */
export interface PointSum {
  /** Σ contributions, m. */
  value: number;
  /** The point was nearer than r_w to a real well (other than `skipWell`) and evaluated at r_w. */
  withinWell: boolean;
  /** At least one source reached the point (r² < r2cut). */
  reached: boolean;
}

/**
 * Sums the sources at (x, y).
 * @param skipWell index of a well whose r_w clamp is expected (its own face), not flagged; −1 for none
 * @param onlyWell when ≥ 0, sum only the sources of that well (unit responses)
 */
export function superposeAtPoint(set: SourceSet, x: number, y: number, out: PointSum, skipWell = -1, onlyWell = -1): PointSum {
  let sum = 0;
  let within = false;
  let reached = false;
  const { kind, invB } = set;
  for (let k = 0; k < set.count; k++) {
    if (onlyWell >= 0 && set.well[k] !== onlyWell) continue;
    const dx = x - set.x[k]!;
    const dy = y - set.y[k]!;
    let r2 = dx * dx + dy * dy;
    if (r2 >= set.r2cut[k]!) continue;
    reached = true;
    const r2min = set.r2min[k]!;
    if (r2 < r2min) {
      if (set.real[k] === 1 && set.well[k] !== skipWell) within = true;
      r2 = r2min;
    }
    const amp = set.amp[k]!;
    switch (kind) {
      case 'theis':
        sum += amp * theisWellFunction(r2 * set.coef[k]!);
        break;
      case 'thiem':
        sum += amp * 0.5 * Math.log(set.r2cut[k]! / r2);
        break;
      case 'hantush':
        sum += amp * hantushWellFunction(r2 * set.coef[k]!, Math.sqrt(r2) * invB);
        break;
      case 'de-glee':
        sum += amp * besselK0(Math.sqrt(r2) * invB);
        break;
    }
  }
  out.value = sum;
  out.withinWell = within;
  out.reached = reached;
  return out;
}

/**
 * Sums the sources at (x, y) separately per parent well: `row[column[well]] += contribution`
 * for wells with column ≥ 0 (one pass over the sources for a whole matrix row).
 */
export function superposeByWell(set: SourceSet, x: number, y: number, row: Float64Array, rowOffset: number, column: Int32Array): void {
  const { kind, invB } = set;
  for (let k = 0; k < set.count; k++) {
    const col = column[set.well[k]!]!;
    if (col < 0) continue;
    const dx = x - set.x[k]!;
    const dy = y - set.y[k]!;
    let r2 = dx * dx + dy * dy;
    if (r2 >= set.r2cut[k]!) continue;
    const r2min = set.r2min[k]!;
    if (r2 < r2min) r2 = r2min;
    const amp = set.amp[k]!;
    let v = 0;
    switch (kind) {
      case 'theis':
        v = amp * theisWellFunction(r2 * set.coef[k]!);
        break;
      case 'thiem':
        v = amp * 0.5 * Math.log(set.r2cut[k]! / r2);
        break;
      case 'hantush':
        v = amp * hantushWellFunction(r2 * set.coef[k]!, Math.sqrt(r2) * invB);
        break;
      case 'de-glee':
        v = amp * besselK0(Math.sqrt(r2) * invB);
        break;
    }
    row[rowOffset + col]! += v;
  }
}

/** Output buffers of {@link superposeOnGrid}. */
export interface GridSum {
  /** Σ contributions per node, m (row-major, index j·nx + i). */
  value: Float64Array;
  /** 1 where a real well's r_w clamp applied. */
  withinWell: Uint8Array;
  /** 1 where at least one source reached the node. */
  reached: Uint8Array;
}

/**
 * Sums the sources on every grid node. Rows are the outer loop so one row of sums stays in the
 * first-level cache while every source sweeps it; for each source only the column span inside
 * its cutoff radius is visited, so far sources cost nothing per node. Theis sources with small u
 * use the tabulated interpolant of theis-table.ts (|ΔW| < THEIS_TABLE_MAX_ERROR = 5e-13), and
 * sources of equal |amp| share one logarithm per node per chunk (theis-grid-rows.ts, ≤ 4e-15 more),
 * so the grid may differ from evaluatePoints by at most 5e-13 times Σ|ΔQ|/(4πT).
 *
 * `kernel: 'pairwise'` keeps the previous Theis kernel (one logarithm per source–node pair); the
 * bench times both side by side. Rows j0 … j1−1 only when `rows` is given (a thread's share);
 * the result still has the whole grid's length, zero outside those rows.
 */
export function superposeOnGrid(set: SourceSet, grid: GridSpec, options: { kernel?: 'grouped' | 'pairwise'; rows?: readonly [number, number] } = {}): GridSum {
  const [nx, ny] = grid.counts;
  const n = nx * ny;
  const value = new Float64Array(n);
  const withinWell = new Uint8Array(n);
  const reached = new Uint8Array(n);
  const span = { i0: 0, i1: -1 };
  const grouped = set.kind === 'theis' && options.kernel !== 'pairwise';
  const groups = grouped ? groupTheisSources(set, grid) : null;
  const scratch = grouped ? makeTheisRowScratch(nx) : null;
  const [j0, j1] = options.rows ?? [0, ny];
  for (let j = Math.max(0, j0); j < Math.min(ny, j1); j++) {
    switch (set.kind) {
      case 'theis':
        if (groups) theisGridRow(set, grid, j, value, groups, scratch!);
        else theisRow(set, grid, j, value, span);
        break;
      case 'thiem':
        thiemRow(set, grid, j, value, reached, span);
        break;
      case 'hantush':
        leakyRow(set, grid, j, value, span, true);
        break;
      case 'de-glee':
        leakyRow(set, grid, j, value, span, false);
        break;
    }
  }
  markWithinWell(set, grid, withinWell);
  return { value, withinWell, reached };
}

/** Columns of row j within source k's cutoff, into `span` (i1 < i0 when none); returns dy². */
function rowSpan(set: SourceSet, grid: GridSpec, j: number, k: number, span: { i0: number; i1: number }): number {
  const dy = grid.origin[1] + j * grid.spacing_m[1] - set.y[k]!;
  const dy2 = dy * dy;
  const rest = set.r2cut[k]! - dy2;
  if (!(rest > 0)) {
    span.i1 = -1;
    span.i0 = 0;
    return dy2;
  }
  const half = Math.sqrt(rest);
  const sx = set.x[k]!;
  const [ox] = grid.origin;
  const hx = grid.spacing_m[0];
  span.i0 = Math.max(0, Math.ceil((sx - half - ox) / hx));
  span.i1 = Math.min(grid.counts[0] - 1, Math.floor((sx + half - ox) / hx));
  return dy2;
}

function theisRow(set: SourceSet, grid: GridSpec, j: number, value: Float64Array, span: { i0: number; i1: number }): void {
  const { value: einValue, slope: einSlope } = getTheisTable();
  const scale = 1 / THEIS_TABLE_STEP;
  const ox = grid.origin[0];
  const hx = grid.spacing_m[0];
  const row = j * grid.counts[0];
  for (let k = 0; k < set.count; k++) {
    const dy2 = rowSpan(set, grid, j, k, span);
    const { i0, i1 } = span;
    if (i1 < i0) continue;
    const sx = set.x[k]!;
    const amp = set.amp[k]!;
    const coef = set.coef[k]!;
    const r2min = set.r2min[k]!;
    for (let i = i0; i <= i1; i++) {
      const dx = ox + i * hx - sx;
      let r2 = dx * dx + dy2;
      if (r2 < r2min) r2 = r2min;
      const u = r2 * coef;
      let w: number;
      if (u <= THEIS_TABLE_MAX_U) {
        // Inlined theisWellFunctionTabulated: W = −γ − ln u + Ein(u), Ein by cubic Hermite.
        const x = u * scale;
        const m = x | 0;
        const t = x - m;
        const t2 = t * t;
        const t3 = t2 * t;
        w = -EULER_GAMMA - Math.log(u) + ((2 * t3 - 3 * t2 + 1) * einValue[m]! + (t3 - 2 * t2 + t) * einSlope[m]! + (3 * t2 - 2 * t3) * einValue[m + 1]! + (t3 - t2) * einSlope[m + 1]!);
      } else {
        w = theisWellFunction(u);
      }
      value[row + i]! += amp * w;
    }
  }
}

function thiemRow(set: SourceSet, grid: GridSpec, j: number, value: Float64Array, reached: Uint8Array, span: { i0: number; i1: number }): void {
  const ox = grid.origin[0];
  const hx = grid.spacing_m[0];
  const row = j * grid.counts[0];
  for (let k = 0; k < set.count; k++) {
    const dy2 = rowSpan(set, grid, j, k, span);
    const { i0, i1 } = span;
    if (i1 < i0) continue;
    const sx = set.x[k]!;
    const amp = set.amp[k]!;
    const r2cut = set.r2cut[k]!;
    const r2min = set.r2min[k]!;
    for (let i = i0; i <= i1; i++) {
      const dx = ox + i * hx - sx;
      let r2 = dx * dx + dy2;
      // Rounding at the rim of the span can put r² a hair past R²: that node gets nothing.
      if (r2 >= r2cut) continue;
      if (r2 < r2min) r2 = r2min;
      value[row + i]! += amp * 0.5 * Math.log(r2cut / r2);
      reached[row + i] = 1;
    }
  }
}

function leakyRow(set: SourceSet, grid: GridSpec, j: number, value: Float64Array, span: { i0: number; i1: number }, transient: boolean): void {
  const ox = grid.origin[0];
  const hx = grid.spacing_m[0];
  const row = j * grid.counts[0];
  const invB = set.invB;
  for (let k = 0; k < set.count; k++) {
    const dy2 = rowSpan(set, grid, j, k, span);
    const { i0, i1 } = span;
    if (i1 < i0) continue;
    const sx = set.x[k]!;
    const amp = set.amp[k]!;
    const coef = set.coef[k]!;
    const r2min = set.r2min[k]!;
    for (let i = i0; i <= i1; i++) {
      const dx = ox + i * hx - sx;
      let r2 = dx * dx + dy2;
      if (r2 < r2min) r2 = r2min;
      const beta = Math.sqrt(r2) * invB;
      value[row + i]! += amp * (transient ? hantushWellFunction(r2 * coef, beta) : besselK0(beta));
    }
  }
}

/** Calls `visit` with each node inside a real source's well radius (a few nodes per well at most). */
export function visitNodesWithinWell(set: SourceSet, grid: GridSpec, visit: (node: number) => void): void {
  const [nx, ny] = grid.counts;
  const [ox, oy] = grid.origin;
  const [hx, hy] = grid.spacing_m;
  for (let k = 0; k < set.count; k++) {
    if (set.real[k] !== 1) continue;
    const sx = set.x[k]!;
    const sy = set.y[k]!;
    const r2min = set.r2min[k]!;
    const rw = Math.sqrt(r2min);
    const a0 = Math.max(0, Math.ceil((sy - rw - oy) / hy));
    const a1 = Math.min(ny - 1, Math.floor((sy + rw - oy) / hy));
    const b0 = Math.max(0, Math.ceil((sx - rw - ox) / hx));
    const b1 = Math.min(nx - 1, Math.floor((sx + rw - ox) / hx));
    for (let j = a0; j <= a1; j++) {
      const dy = oy + j * hy - sy;
      for (let i = b0; i <= b1; i++) {
        const dx = ox + i * hx - sx;
        if (dx * dx + dy * dy < r2min) visit(j * nx + i);
      }
    }
  }
}

/** Marks nodes inside a real well's radius. */
function markWithinWell(set: SourceSet, grid: GridSpec, withinWell: Uint8Array): void {
  visitNodesWithinWell(set, grid, (node) => (withinWell[node] = 1));
}
