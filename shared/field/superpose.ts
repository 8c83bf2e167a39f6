/**
 * The inner loops: superposition of all sources at one point and over a regular grid.
 * The summed quantity is drawdown (confined, leaky) or discharge-potential drawdown s_c
 * (unconfined), both linear in the rates.
 */
import { besselK0, hantushWellFunction, theisWellFunction } from '../wells';
import type { SourceSet } from './source-set';
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
 * Sums the sources on every grid node. For each source only the rows and the column span
 * inside its cutoff radius are visited, so far sources cost nothing per node; squared x and y
 * offsets are separable and computed once per row / per column span.
 */
export function superposeOnGrid(set: SourceSet, grid: GridSpec): GridSum {
  const [nx, ny] = grid.counts;
  const [ox, oy] = grid.origin;
  const [hx, hy] = grid.spacing_m;
  const n = nx * ny;
  const value = new Float64Array(n);
  const withinWell = new Uint8Array(n);
  const reached = new Uint8Array(n);
  const dx2 = new Float64Array(nx);
  const { kind, invB } = set;

  for (let k = 0; k < set.count; k++) {
    const sx = set.x[k]!;
    const sy = set.y[k]!;
    const amp = set.amp[k]!;
    const coef = set.coef[k]!;
    const r2cut = set.r2cut[k]!;
    const r2min = set.r2min[k]!;
    if (!(r2cut > 0)) continue;
    const reach = Math.sqrt(r2cut);
    // Rows within reach (j such that |oy + j·hy − sy| < reach); hy > 0 by validation.
    const j0 = Math.max(0, Math.ceil((sy - reach - oy) / hy));
    const j1 = Math.min(ny - 1, Math.floor((sy + reach - oy) / hy));
    if (j0 > j1) continue;
    const iLo = Math.max(0, Math.ceil((sx - reach - ox) / hx));
    const iHi = Math.min(nx - 1, Math.floor((sx + reach - ox) / hx));
    if (iLo > iHi) continue;
    for (let i = iLo; i <= iHi; i++) {
      const dx = ox + i * hx - sx;
      dx2[i] = dx * dx;
    }
    for (let j = j0; j <= j1; j++) {
      const dy = oy + j * hy - sy;
      const dy2 = dy * dy;
      const rest = r2cut - dy2;
      if (!(rest > 0)) continue;
      const half = Math.sqrt(rest);
      const i0 = Math.max(iLo, Math.ceil((sx - half - ox) / hx));
      const i1 = Math.min(iHi, Math.floor((sx + half - ox) / hx));
      const row = j * nx;
      switch (kind) {
        case 'theis':
          for (let i = i0; i <= i1; i++) {
            let r2 = dx2[i]! + dy2;
            if (r2 < r2min) r2 = r2min;
            value[row + i]! += amp * theisWellFunction(r2 * coef);
          }
          break;
        case 'thiem':
          for (let i = i0; i <= i1; i++) {
            let r2 = dx2[i]! + dy2;
            // Rounding at the rim of the span can put r² a hair past R²: that node gets nothing.
            if (r2 >= r2cut) continue;
            if (r2 < r2min) r2 = r2min;
            value[row + i]! += amp * 0.5 * Math.log(r2cut / r2);
            reached[row + i] = 1;
          }
          break;
        case 'hantush':
          for (let i = i0; i <= i1; i++) {
            let r2 = dx2[i]! + dy2;
            if (r2 < r2min) r2 = r2min;
            value[row + i]! += amp * hantushWellFunction(r2 * coef, Math.sqrt(r2) * invB);
          }
          break;
        case 'de-glee':
          for (let i = i0; i <= i1; i++) {
            let r2 = dx2[i]! + dy2;
            if (r2 < r2min) r2 = r2min;
            value[row + i]! += amp * besselK0(Math.sqrt(r2) * invB);
          }
          break;
      }
    }
    // Nodes inside a real well's radius (rare: a few nodes at most).
    if (set.real[k] === 1) {
      const rw = Math.sqrt(r2min);
      const a0 = Math.max(0, Math.ceil((sy - rw - oy) / hy));
      const a1 = Math.min(ny - 1, Math.floor((sy + rw - oy) / hy));
      const b0 = Math.max(0, Math.ceil((sx - rw - ox) / hx));
      const b1 = Math.min(nx - 1, Math.floor((sx + rw - ox) / hx));
      for (let j = a0; j <= a1; j++) {
        const dy = oy + j * hy - sy;
        for (let i = b0; i <= b1; i++) {
          const dx = ox + i * hx - sx;
          if (dx * dx + dy * dy < r2min) withinWell[j * nx + i] = 1;
        }
      }
    }
  }
  return { value, withinWell, reached };
}
