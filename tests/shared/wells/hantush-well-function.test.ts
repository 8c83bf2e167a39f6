import { describe, expect, it } from 'vitest';
import { WELL_FUNCTION_ACCURACY, besselK0, hantushWellFunction, theisWellFunction } from '../../../shared/wells';
import { loadWellFunctionReference } from './reference-values';
import { MIN_NORMAL, expectRelativelyClose, relativeError } from './tolerance';

const reference = loadWellFunctionReference();
const box = reference.hantush.filter((p) => p.inBox);
const edges = reference.hantush.filter((p) => !p.inBox);

const logGrid = (lo: number, hi: number, n: number): number[] =>
  Array.from({ length: n }, (_, i) => lo * (hi / lo) ** (i / (n - 1)));

describe('hantushWellFunction(u, r/B)', () => {
  it('matches the mpmath quadrature to 1e-6 relative on the 21 × 21 grid 1e-8 ≤ u ≤ 20, 1e-4 ≤ r/B ≤ 10', () => {
    // Reference: fixtures/reference/well-functions.json, mpmath.quad at 32 digits, two routes.
    expect(box.length).toBeGreaterThanOrEqual(400);
    let worst = 0;
    for (const p of box) {
      expectRelativelyClose(hantushWellFunction(p.u, p.rOverB), p.value, 1e-6, `W(${p.u}, ${p.rOverB})`);
      worst = Math.max(worst, relativeError(hantushWellFunction(p.u, p.rOverB), p.value));
    }
    expect(worst).toBeLessThanOrEqual(WELL_FUNCTION_ACCURACY.hantushWellFunction.maxRelativeError);
  });

  it('matches mpmath outside the box too (u to 300, r/B from 1e-8 to 200) to 1e-12, or 0 below the normal range', () => {
    expect(edges.length).toBeGreaterThanOrEqual(80);
    for (const p of edges) {
      const got = hantushWellFunction(p.u, p.rOverB);
      if (p.value < MIN_NORMAL) expect(Math.abs(got - p.value)).toBeLessThanOrEqual(1e-300);
      else expectRelativelyClose(got, p.value, 1e-12, `W(${p.u}, ${p.rOverB})`);
    }
  });

  it('equals E1(u) at r/B = 0 exactly', () => {
    for (const u of logGrid(1e-12, 700, 60)) expect(hantushWellFunction(u, 0)).toBe(theisWellFunction(u));
  });

  it('tends to 2·K0(r/B) as u → 0 (de Glee steady state)', () => {
    for (const beta of logGrid(1e-4, 10, 21)) {
      for (const u of [1e-12, 1e-16, 1e-30]) {
        // W(u, β) = 2K0(β) − W(β²/4u, β) and W(v, β) ≤ E1(v): the gap is bounded by E1(β²/4u).
        const gap = 2 * besselK0(beta) - hantushWellFunction(u, beta);
        expect(gap).toBeGreaterThanOrEqual(-1e-15 * besselK0(beta));
        expect(gap).toBeLessThanOrEqual(theisWellFunction((beta * beta) / (4 * u)) + 1e-15 * besselK0(beta));
      }
      expectRelativelyClose(hantushWellFunction(1e-30, beta), 2 * besselK0(beta), 1e-14, `W(1e-30, ${beta})`);
    }
  });

  it('satisfies Hantush’s symmetry W(u, β) + W(β²/(4u), β) = 2·K0(β) across the box to 1e-6', () => {
    // The implementation uses this identity for u < β/2, so the check mainly guards the branch
    // logic; the mpmath comparisons above are the independent test.
    for (const beta of logGrid(1e-4, 10, 21)) {
      for (const u of logGrid(1e-8, 20, 21)) {
        const sum = hantushWellFunction(u, beta) + hantushWellFunction((beta * beta) / (4 * u), beta);
        expectRelativelyClose(sum, 2 * besselK0(beta), 1e-6, `symmetry at u = ${u}, β = ${beta}`);
      }
    }
  });

  it('decreases with u for fixed r/B (the integrand is positive)', () => {
    for (const beta of [1e-4, 1e-2, 0.3, 1, 3, 4, 4.5, 10, 30]) {
      let previous = Number.POSITIVE_INFINITY;
      for (const u of logGrid(1e-8, 50, 200)) {
        const w = hantushWellFunction(u, beta);
        expect(w, `W(${u}, ${beta})`).toBeLessThanOrEqual(previous);
        previous = w;
      }
    }
  });

  it('lies below both E1(u) and 2·K0(r/B) (exp(−β²/4y) ≤ 1; the full integral is 2·K0)', () => {
    for (const beta of logGrid(1e-4, 10, 11)) {
      for (const u of logGrid(1e-8, 20, 11)) {
        const w = hantushWellFunction(u, beta);
        expect(w).toBeLessThanOrEqual(theisWellFunction(u) * (1 + 1e-15));
        expect(w).toBeLessThanOrEqual(2 * besselK0(beta) * (1 + 1e-15));
      }
    }
  });

  it('is continuous where it switches from the series to quadrature (r/B = 4)', () => {
    for (const u of [1e-6, 0.1, 1.9, 2, 2.1, 5, 20]) {
      const below = hantushWellFunction(u, 4 * (1 - 1e-13));
      const above = hantushWellFunction(u, 4 * (1 + 1e-13));
      expectRelativelyClose(above, below, 1e-11, `W(${u}, 4±)`);
    }
  });

  it('returns a finite, non-negative number (or 0 on underflow) for extreme arguments, never NaN', () => {
    const us = [Number.MIN_VALUE, 1e-300, 1e-100, 1e-20, 1e-8, 1, 100, 740, 741, 1e10, 1e300, Number.POSITIVE_INFINITY];
    const betas = [0, Number.MIN_VALUE, 1e-300, 1e-160, 1e-20, 1e-8, 1, 20, 745, 747, 1e10, 1e300, Number.POSITIVE_INFINITY];
    for (const u of us) {
      for (const beta of betas) {
        const w = hantushWellFunction(u, beta);
        expect(Number.isFinite(w), `W(${u}, ${beta}) = ${w}`).toBe(true);
        expect(w).toBeGreaterThanOrEqual(0);
      }
    }
    expect(hantushWellFunction(1, 1e6)).toBe(0);
    expect(hantushWellFunction(1e6, 1)).toBe(0);
  });

  it.each([
    [0, 1, /argument u must be a number > 0/],
    [-1, 1, /argument u must be a number > 0/],
    [Number.NaN, 1, /argument u must be a number > 0/],
    [1, -0.5, /argument rOverB must be a number >= 0/],
    [1, Number.NaN, /argument rOverB must be a number >= 0/],
  ])('throws a RangeError naming the argument for (u, r/B) = (%s, %s)', (u, beta, message) => {
    expect(() => hantushWellFunction(u, beta)).toThrow(RangeError);
    expect(() => hantushWellFunction(u, beta)).toThrow(message);
  });
});
