/** Tolerance helper for numeric checks: |actual − expected| ≤ abs + rel·|expected|. */
import { expect } from 'vitest';

export interface Tolerance {
  /** Absolute tolerance, in the unit of the value. Default 0. */
  abs?: number;
  /** Relative tolerance (−). Default 0. */
  rel?: number;
}

export function expectClose(actual: number, expected: number, tolerance: Tolerance, label: string): void {
  const allowed = (tolerance.abs ?? 0) + (tolerance.rel ?? 0) * Math.abs(expected);
  const error = Math.abs(actual - expected);
  expect(Number.isFinite(actual), `${label}: ${actual} is not finite`).toBe(true);
  expect(error <= allowed, `${label}: got ${actual}, expected ${expected} ± ${allowed} (error ${error})`).toBe(true);
}
