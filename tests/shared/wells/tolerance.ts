import { expect } from 'vitest';

/** |actual − expected| / |expected|; 0 when both are 0, Infinity when only expected is 0. */
export function relativeError(actual: number, expected: number): number {
  if (actual === expected) return 0;
  if (expected === 0) return Infinity;
  return Math.abs(actual - expected) / Math.abs(expected);
}

/** Asserts a relative error no larger than `tolerance`, with a message naming the case. */
export function expectRelativelyClose(actual: number, expected: number, tolerance: number, label: string): void {
  const err = relativeError(actual, expected);
  expect(err, `${label}: got ${actual}, expected ${expected}, relative error ${err.toExponential(2)}`)
    .toBeLessThanOrEqual(tolerance);
}

/** Smallest positive normal double; results below it are subnormal and carry fewer bits. */
export const MIN_NORMAL = 2.2250738585072014e-308;

/** Spacing of subnormal doubles (Number.MIN_VALUE). */
export const SUBNORMAL_SPACING = Number.MIN_VALUE;
