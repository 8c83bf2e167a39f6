/**
 * The Theis grid kernel: one row of nodes against every source, with one logarithm per node
 * for a whole chunk of sources instead of one per source–node pair.
 *
 * W(u) = −γ − ln u + Ein(u) (A&S 5.1.11, 5.1.39), u = r²·coef, so a source's share is
 * amp·(−γ − ln coef + Ein(u)) − amp·ln r². The logarithm is two thirds of the cost of a pair.
 * Sources of one well carry the same |amp| (a well and its images: +amp across a no-flow line,
 * −amp across a constant-head line), and wells at the same rate carry the same |amp| too; for
 * such a group Σ −amp_k·ln r²_k = −A·(ln Π₊ r² − ln Π₋ r²), so the kernel multiplies r² into two
 * per-node products and takes the logarithm of their quotient once per chunk of sources. Sources with their own
 * |amp| form groups of one and take the direct path.
 *
 * Exactness: each product of c factors carries a relative rounding error ≤ c·2⁻⁵³, so ln Π is
 * within c·1.2e-16 + 1 ulp of Σ ln r²; with c ≤ 32 that is ≤ 4e-15 in W per chunk, far below
 * THEIS_TABLE_MAX_ERROR (5e-13), so the grid keeps the stated bound against theisWellFunction
 * (|ΔW| < 5e-13 per source, plus 4e-15 per chunk). Chunks are sized so that no product can
 * overflow or underflow: c·max(|log10 r²|) < 140 over the group's clamped range of r².
 */
import { EULER_GAMMA, theisWellFunction } from '../wells';
import { getTheisTable, THEIS_TABLE_MAX_U, THEIS_TABLE_STEP } from './theis-table';
import type { SourceSet } from './source-set';
import type { GridSpec } from './types';

/** Most sources whose r² share one product (bounds the rounding of the product, see above). */
const MAX_CHUNK = 32;

/** Sources ordered by |amp| group, with each group's chunk size (computed once per grid). */
export interface TheisGroups {
  /** Source indices, group after group. */
  order: Int32Array;
  /** Group g holds order[start[g] … start[g+1]−1]. */
  start: Int32Array;
  /** |amp| of each group, m. */
  magnitude: Float64Array;
  /** Sources per product for each group (1: direct path). */
  chunk: Int32Array;
  /** −γ − ln coef per source (indexed by source). */
  constant: Float64Array;
}

/** Farthest squared distance from (x, y) to the grid's corners, m². */
function farthestR2(grid: GridSpec, x: number, y: number): number {
  const x0 = grid.origin[0] - x;
  const x1 = grid.origin[0] + (grid.counts[0] - 1) * grid.spacing_m[0] - x;
  const y0 = grid.origin[1] - y;
  const y1 = grid.origin[1] + (grid.counts[1] - 1) * grid.spacing_m[1] - y;
  return Math.max(x0 * x0, x1 * x1) + Math.max(y0 * y0, y1 * y1);
}

/** Groups the sources by |amp| and sizes each group's chunks for this grid. */
export function groupTheisSources(set: SourceSet, grid: GridSpec): TheisGroups {
  const n = set.count;
  const byMagnitude = new Map<number, number[]>();
  for (let k = 0; k < n; k++) {
    const a = Math.abs(set.amp[k]!);
    let list = byMagnitude.get(a);
    if (!list) byMagnitude.set(a, (list = []));
    list.push(k);
  }
  const order = new Int32Array(n);
  const start = new Int32Array(byMagnitude.size + 1);
  const magnitude = new Float64Array(byMagnitude.size);
  const chunk = new Int32Array(byMagnitude.size);
  const constant = new Float64Array(n);
  for (let k = 0; k < n; k++) constant[k] = -EULER_GAMMA - Math.log(set.coef[k]!);
  let at = 0;
  let g = 0;
  for (const [a, list] of byMagnitude) {
    start[g] = at;
    magnitude[g] = a;
    let decades = 1;
    for (const k of list) {
      order[at++] = k;
      const hi = Math.min(set.r2cut[k]!, farthestR2(grid, set.x[k]!, set.y[k]!));
      decades = Math.max(decades, Math.abs(Math.log10(Math.max(hi, 1e-300))), Math.abs(Math.log10(set.r2min[k]!)));
    }
    // 140 decades per product keeps both products, and their quotient, inside the doubles' range.
    chunk[g] = list.length === 1 ? 1 : Math.max(1, Math.min(MAX_CHUNK, Math.floor(140 / decades)));
    g++;
  }
  start[g] = at;
  return { order, start, magnitude, chunk, constant };
}

/** Per-row scratch: the two products of a chunk. */
export interface TheisRowScratch {
  positive: Float64Array;
  negative: Float64Array;
}

export function makeTheisRowScratch(nx: number): TheisRowScratch {
  return { positive: new Float64Array(nx).fill(1), negative: new Float64Array(nx).fill(1) };
}

/**
 * Adds every source's Theis share to row j of `value` (row-major, j·nx + i). Only the column span
 * within each source's cutoff radius is visited; r² is clamped to r_w² (the well face).
 */
export function theisGridRow(set: SourceSet, grid: GridSpec, j: number, value: Float64Array, groups: TheisGroups, scratch: TheisRowScratch): void {
  const { value: einValue, slope: einSlope } = getTheisTable();
  const scale = 1 / THEIS_TABLE_STEP;
  const [nx] = grid.counts;
  const ox = grid.origin[0];
  const hx = grid.spacing_m[0];
  const y = grid.origin[1] + j * grid.spacing_m[1];
  const row = j * nx;
  const { order, start, magnitude, chunk, constant } = groups;
  const { positive, negative } = scratch;
  for (let g = 0; g < magnitude.length; g++) {
    const size = chunk[g]!;
    const A = magnitude[g]!;
    for (let c0 = start[g]!; c0 < start[g + 1]!; c0 += size) {
      const c1 = Math.min(start[g + 1]!, c0 + size);
      // Columns touched by this chunk's products, and whether any source of it has −amp.
      let lo = nx;
      let hi = -1;
      let anyNegative = false;
      for (let c = c0; c < c1; c++) {
        const k = order[c]!;
        const dy = y - set.y[k]!;
        const dy2 = dy * dy;
        const rest = set.r2cut[k]! - dy2;
        if (!(rest > 0)) continue;
        const half = Math.sqrt(rest);
        const sx = set.x[k]!;
        const i0 = Math.max(0, Math.ceil((sx - half - ox) / hx));
        const i1 = Math.min(nx - 1, Math.floor((sx + half - ox) / hx));
        if (i1 < i0) continue;
        const amp = set.amp[k]!;
        const coef = set.coef[k]!;
        const r2min = set.r2min[k]!;
        const base = constant[k]!;
        const direct = size === 1;
        const product = amp >= 0 ? positive : negative;
        if (!direct) {
          if (i0 < lo) lo = i0;
          if (i1 > hi) hi = i1;
          if (amp < 0) anyNegative = true;
        }
        for (let i = i0; i <= i1; i++) {
          const dx = ox + i * hx - sx;
          let r2 = dx * dx + dy2;
          if (r2 < r2min) r2 = r2min;
          const u = r2 * coef;
          if (u <= THEIS_TABLE_MAX_U) {
            // Ein by cubic Hermite on the table (theis-table.ts); the −ln r² part waits for the product.
            const x = u * scale;
            const m = x | 0;
            const t = x - m;
            const t2 = t * t;
            const t3 = t2 * t;
            const ein = (2 * t3 - 3 * t2 + 1) * einValue[m]! + (t3 - 2 * t2 + t) * einSlope[m]! + (3 * t2 - 2 * t3) * einValue[m + 1]! + (t3 - t2) * einSlope[m + 1]!;
            if (direct) value[row + i]! += amp * (base - Math.log(r2) + ein);
            else {
              value[row + i]! += amp * (base + ein);
              product[i]! *= r2;
            }
          } else {
            value[row + i]! += amp * theisWellFunction(u);
          }
        }
      }
      if (hi < lo) continue;
      if (anyNegative) {
        // One logarithm for both products: ln Π₊ − ln Π₋ = ln(Π₊/Π₋).
        for (let i = lo; i <= hi; i++) {
          value[row + i]! -= A * Math.log(positive[i]! / negative[i]!);
          positive[i] = 1;
          negative[i] = 1;
        }
      } else {
        for (let i = lo; i <= hi; i++) {
          value[row + i]! -= A * Math.log(positive[i]!);
          positive[i] = 1;
        }
      }
    }
  }
}
