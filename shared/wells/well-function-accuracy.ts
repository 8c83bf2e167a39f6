/** Accuracy of one well function, as measured by the tests against mpmath. */
export interface WellFunctionAccuracyEntry {
  /** The argument range over which the figures hold. */
  readonly domain: string;
  /**
   * Largest relative error measured against the committed mpmath reference
   * (fixtures/reference/well-functions.json) over `domain`, rounded up; the tests fail if the
   * code ever does worse.
   */
  readonly maxRelativeError: number;
  /** The accuracy the engine requires and the tests enforce point by point. */
  readonly requiredRelativeError: number;
  /** What happens outside `domain`. */
  readonly outside: string;
}

/**
 * Documented accuracy of the well functions, for docs and reports to quote. Measured by
 * tests/shared/wells against mpmath 1.3.0 (scripts/reference/well-functions.py).
 */
export const WELL_FUNCTION_ACCURACY = {
  theisWellFunction: {
    domain: '1e-12 ≤ u ≤ 700 (400 log-spaced points and the piece ends)',
    // Measured 6.2e-16 (worst near u = 1, where −γ − ln u and u·P(u) partly cancel).
    maxRelativeError: 1e-15,
    requiredRelativeError: 1e-10,
    outside: 'u > 740: exactly 0 (underflow); 700 < u ≤ 740: subnormal results to within 2 subnormal steps',
  },
  besselK0: {
    domain: '1e-8 ≤ x ≤ 700 (400 log-spaced points and the piece ends)',
    // Measured 2.4e-15 (worst just below x = 2, where the two terms of A&S 9.6.13 cancel).
    maxRelativeError: 5e-15,
    requiredRelativeError: 1e-10,
    outside: 'x > 745: exactly 0 (underflow); x < 1e-8: the same formula, relative error ~1e-16',
  },
  hantushWellFunction: {
    domain: '1e-8 ≤ u ≤ 20, 1e-4 ≤ r/B ≤ 10 (21 × 21 log grid)',
    // Measured 2.2e-15 (series branch, r/B ≤ 4) and 1.5e-15 (quadrature branch, r/B > 4).
    maxRelativeError: 5e-15,
    requiredRelativeError: 1e-6,
    outside:
      'r/B = 0: E1(u); 90 pairs with u from 1e-12 to 300 and r/B from 1e-8 to 200 measured within 2e-14 ' +
      '(tested to 1e-12); r/B > 746 or u > 740: 0 (underflow); never NaN',
  },
} as const satisfies Record<string, WellFunctionAccuracyEntry>;
