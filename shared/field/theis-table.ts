/**
 * A tabulated interpolant of theisWellFunction for the grid hot path (small u only).
 *
 * W(u) = −γ − ln u + Ein(u) with Ein(u) = Σ_{k≥1} (−1)^(k+1) u^k/(k·k!) entire (A&S 5.1.11, 5.1.39);
 * Ein is tabulated from theisWellFunction itself at spacing h in u, with its exact derivative
 * Ein'(u) = (1 − e^(−u))/u, and interpolated by cubic Hermite. The error of cubic Hermite on an
 * interval of length h is at most h⁴/384·max|Ein⁗|, and Ein⁗(u) = −∫₀¹ s³e^(−us) ds so
 * |Ein⁗| ≤ 1/4: with h = 1/256 the interpolation error is below h⁴/1536 ≈ 1.5e-13 in W, on top of
 * rounding (a few 1e-15). Above THEIS_TABLE_MAX_U the grid calls theisWellFunction directly (its
 * relative accuracy matters there, where W is small). Points and well levels always use
 * theisWellFunction.
 */
import { EULER_GAMMA, theisWellFunction } from '../wells';

/** Table spacing in u. */
export const THEIS_TABLE_STEP = 1 / 256;
/** Largest u served from the table. */
export const THEIS_TABLE_MAX_U = 2;
/** Bound on |interpolated − theisWellFunction| for 0 < u ≤ THEIS_TABLE_MAX_U (interpolation h⁴/1536 plus rounding margin). */
export const THEIS_TABLE_MAX_ERROR = 5e-13;

/** Ein values and h·Ein' at u = k·h, k = 0 … n. */
export interface TheisTable {
  value: Float64Array;
  slope: Float64Array;
}

let cached: TheisTable | undefined;

/** The table, built once on first use from theisWellFunction (514 calls, well under 1 ms). */
export function getTheisTable(): TheisTable {
  if (cached) return cached;
  const n = Math.ceil(THEIS_TABLE_MAX_U / THEIS_TABLE_STEP) + 2;
  const value = new Float64Array(n);
  const slope = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    const u = k * THEIS_TABLE_STEP;
    value[k] = u === 0 ? 0 : theisWellFunction(u) + EULER_GAMMA + Math.log(u);
    slope[k] = (u === 0 ? 1 : -Math.expm1(-u) / u) * THEIS_TABLE_STEP;
  }
  cached = { value, slope };
  return cached;
}

/**
 * W(u) from the table for 0 < u ≤ THEIS_TABLE_MAX_U, theisWellFunction beyond; within
 * THEIS_TABLE_MAX_ERROR of theisWellFunction everywhere. The grid kernel inlines the same steps.
 */
export function theisWellFunctionTabulated(u: number): number {
  if (!(u > 0 && u <= THEIS_TABLE_MAX_U)) return theisWellFunction(u);
  const { value, slope } = getTheisTable();
  const x = u / THEIS_TABLE_STEP;
  const k = x | 0;
  const t = x - k;
  const t2 = t * t;
  const t3 = t2 * t;
  const ein = (2 * t3 - 3 * t2 + 1) * value[k]! + (t3 - 2 * t2 + t) * slope[k]! + (3 * t2 - 2 * t3) * value[k + 1]! + (t3 - t2) * slope[k + 1]!;
  return -EULER_GAMMA - Math.log(u) + ein;
}
