import { requirePositive } from './check-argument';
import { EULER_GAMMA, EXP_MINUS_64 } from './theis-well-function';
import { k0Scaled2To4, k0Scaled4To8, k0ScaledTail, k0SmallI0, k0SmallQ } from './well-function-coefficients';

/** Beyond this x, K0(x) < e^(−x)·√(π/(2x)) is below the smallest subnormal double. */
export const K0_UNDERFLOW_X = 745;

/**
 * Modified Bessel function of the second kind, order 0, K0(x) (Abramowitz & Stegun 1964, 9.6).
 *
 * 0 < x ≤ 2: K0(x) = −(ln(x/2) + γ)·I0(x) + y·Q(y), y = x²/4, the ascending series A&S 9.6.13
 * (with I0 from 9.6.12), both I0 and Q fitted as polynomials in y;
 * x > 2: K0(x) = e^(−x)/√x · H(x), H(x) = e^x·√x·K0(x) → √(π/2) (A&S 9.7.2), fitted piecewise
 * on [2, 4], [4, 8] and in 8/x beyond. Fits by `scripts/reference/fit-well-function-coefficients.py`.
 *
 * @param x argument (in drydig r/B, dimensionless); must be > 0 (`+Infinity` gives 0)
 * @returns K0(x) > 0; exactly 0 once it underflows (x > ≈ 745)
 * @throws RangeError when x ≤ 0 or x is NaN
 */
export function besselK0(x: number): number {
  // Written as !(x > 2) so that NaN takes this branch and reaches the guard.
  if (!(x > 2)) {
    if (!(x > 0)) requirePositive('besselK0', 'x', x);
    const y = 0.25 * x * x;
    const z = 2 * y - 1;
    return y * k0SmallQ(z) - (Math.log(0.5 * x) + EULER_GAMMA) * k0SmallI0(z);
  }
  let h: number;
  if (x <= 4) h = k0Scaled2To4(x - 3);
  else if (x <= 8) h = k0Scaled4To8(0.5 * x - 3);
  else if (x > K0_UNDERFLOW_X) return 0; // also +Infinity
  else h = k0ScaledTail(16 / x - 1);
  if (x < 708) return (Math.exp(-x) / Math.sqrt(x)) * h;
  return ((Math.exp(64 - x) / Math.sqrt(x)) * h) * EXP_MINUS_64; // see theisWellFunction

}
