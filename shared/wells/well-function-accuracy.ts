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
    maxRelativeError: 1e-15,
    requiredRelativeError: 1e-10,
    outside: 'u > 740: exactly 0 (underflow); 700 < u ≤ 740: subnormal results to within 2 subnormal steps',
  },
  besselK0: {
    domain: '1e-8 ≤ x ≤ 700 (400 log-spaced points and the piece ends)',
    maxRelativeError: 1e-15,
    requiredRelativeError: 1e-10,
    outside: 'x > 745: exactly 0 (underflow); x < 1e-8: the same formula, relative error ~1e-16',
  },
  hantushWellFunction: {
    domain: '1e-8 ≤ u ≤ 20, 1e-4 ≤ r/B ≤ 10 (21 × 21 log grid)',
    maxRelativeError: 1e-13,
    requiredRelativeError: 1e-6,
    outside:
      'r/B = 0: E1(u); u up to 300 and r/B from 1e-8 to 200 checked to 1e-12; r/B > 746 or u > 740: 0 (underflow)',
  },
} as const satisfies Record<string, WellFunctionAccuracyEntry>;
