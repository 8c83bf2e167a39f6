/** Shared bits of the export-writer tests: the real field engine and a tolerance check. */
import { expect } from 'vitest';
import { evaluateGrid, evaluatePoints } from '../../../shared/field';
import type { FieldEngine } from '../../../shared/exports';

export const engine: FieldEngine = { evaluateGrid, evaluatePoints };

/** |actual − expected| ≤ abs + rel·|expected|; the label names the source of `expected`. */
export function expectClose(actual: number, expected: number, tolerance: { abs?: number; rel?: number }, label: string): void {
  const allowed = (tolerance.abs ?? 0) + (tolerance.rel ?? 0) * Math.abs(expected);
  expect(Math.abs(actual - expected), `${label}: got ${actual}, expected ${expected} ± ${allowed}`).toBeLessThanOrEqual(allowed);
}
