import { describe, expect, it } from 'vitest';
import { THEIS_TABLE_MAX_ERROR, THEIS_TABLE_MAX_U, THEIS_TABLE_STEP, theisWellFunctionTabulated } from '../../../shared/field';
import { theisWellFunction } from '../../../shared/wells';
import reference from './reference/field-reference.json';
import { expectClose } from './field-test-helpers';

describe('theisWellFunctionTabulated', () => {
  it('theisWellFunctionTabulated stays within THEIS_TABLE_MAX_ERROR of theisWellFunction on a dense sweep of (0, 2]', () => {
    // Cubic Hermite error bound h⁴/384·max|Ein⁗| with |Ein⁗| ≤ 1/4 (theis-table.ts): h⁴/1536.
    expect(THEIS_TABLE_STEP ** 4 / 1536).toBeLessThan(THEIS_TABLE_MAX_ERROR);
    let worst = 0;
    // Off-node points (irrational stride) plus log-spaced small u.
    for (let k = 1; k <= 200_000; k++) {
      const u = (k * Math.SQRT2 * 1e-5) % THEIS_TABLE_MAX_U || 1e-7;
      worst = Math.max(worst, Math.abs(theisWellFunctionTabulated(u) - theisWellFunction(u)));
    }
    for (let e = -14; e <= Math.log10(THEIS_TABLE_MAX_U); e += 0.01) {
      const u = 10 ** e;
      worst = Math.max(worst, Math.abs(theisWellFunctionTabulated(u) - theisWellFunction(u)));
    }
    expect(worst).toBeLessThanOrEqual(THEIS_TABLE_MAX_ERROR);
  });

  it('theisWellFunctionTabulated hands u above the table to theisWellFunction unchanged', () => {
    for (const u of [2.0001, 5, 30]) expect(theisWellFunctionTabulated(u)).toBe(theisWellFunction(u));
  });

  // Source: mpmath Theis values (reference script); W = s·4πT/Q.
  it.each(reference.theis.cases)('theisWellFunctionTabulated reproduces the mpmath W(u) at r = $r_m m', ({ r_m, drawdown_m }) => {
    const { rate_m3_s: Q, transmissivity_m2_s: T, storativity: S, time_s: t } = reference.theis;
    const u = (r_m * r_m * S) / (4 * T * t);
    expectClose(theisWellFunctionTabulated(u), (drawdown_m * 4 * Math.PI * T) / Q, { abs: THEIS_TABLE_MAX_ERROR, rel: 1e-13 });
  });
});
