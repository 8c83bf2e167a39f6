import { requirePositive } from './check-argument';
import {
  e1Scaled1To2,
  e1Scaled2To4,
  e1Scaled4To8,
  e1Scaled8To16,
  e1ScaledTail,
  e1Small,
} from './well-function-coefficients';

/** Euler–Mascheroni constant γ (Abramowitz & Stegun 1964, 6.1.3). */
export const EULER_GAMMA = 0.5772156649015329;

/**
 * Beyond this u, E1(u) < e^(−u)/u is below the smallest subnormal double (≈ 4.9e−324), so the
 * exact answer rounds to 0.
 */
export const E1_UNDERFLOW_U = 740;

/**
 * Theis well function W(u) = E1(u) = ∫_u^∞ e^(−y)/y dy, the exponential integral.
 *
 * Theis (1935) Trans. AGU 16; E1 as defined in Abramowitz & Stegun (1964) 5.1.1.
 * 0 < u ≤ 1: E1(u) = −γ − ln u + u·P(u), the series A&S 5.1.11 with P fitted as a polynomial;
 * u > 1: E1(u) = e^(−u)/u · G(u), with G(u) = u·e^u·E1(u) (the auxiliary function A&S tabulates)
 * fitted piecewise on [1, 2], [2, 4], [4, 8], [8, 16] and in 16/u beyond. The pieces are
 * Chebyshev interpolants made by `scripts/reference/fit-well-function-coefficients.py`;
 * the tests check the result against mpmath to the accuracy in `WELL_FUNCTION_ACCURACY`.
 *
 * @param u dimensionless Theis argument r²S/(4Tt); must be > 0 (`+Infinity` gives 0)
 * @returns E1(u) > 0; exactly 0 once it underflows (u > ≈ 740). Subnormal results between
 *   u ≈ 701 and 740 keep only the precision that subnormals allow.
 * @throws RangeError when u ≤ 0 or u is NaN
 */
export function theisWellFunction(u: number): number {
  // Written as !(u > 1) so that NaN takes this branch and reaches the guard.
  if (!(u > 1)) {
    if (!(u > 0)) requirePositive('theisWellFunction', 'u', u);
    return -EULER_GAMMA - Math.log(u) + u * e1Small(2 * u - 1);
  }
  if (u <= 4) {
    const g = u <= 2 ? e1Scaled1To2(2 * u - 3) : e1Scaled2To4(u - 3);
    return (Math.exp(-u) / u) * g;
  }
  if (u <= 16) {
    const g = u <= 8 ? e1Scaled4To8(0.5 * u - 3) : e1Scaled8To16(0.25 * u - 3);
    return (Math.exp(-u) / u) * g;
  }
  if (u > E1_UNDERFLOW_U) return 0; // also +Infinity
  const g = e1ScaledTail(32 / u - 1);
  if (u < 708) return (Math.exp(-u) / u) * g;
  // e^(−u) alone would be subnormal here: scale by e^64 first so that only the final product
  // rounds into the subnormal range.
  return ((Math.exp(64 - u) / u) * g) * EXP_MINUS_64;
}

/** e^(−64), to finish a product whose true value is subnormal. */
export const EXP_MINUS_64 = 1.603810890548638e-28;

/** Alias of {@link theisWellFunction}: the exponential integral E1(u), u > 0. */
export const expIntegralE1 = theisWellFunction;
