import { requirePositive } from './check-argument';
import { EULER_GAMMA } from './theis-well-function';

/**
 * Modified Bessel function of the second kind, order 0, K0(x).
 *
 * Small x: the ascending series A&S 9.6.13, K0(x) = −(ln(x/2) + γ)·I0(x) + Σ (x²/4)^k/(k!)²·H_k.
 * Larger x: the integral representation A&S 9.6.24, K0(x) = ∫_0^∞ exp(−x cosh t) dt, by the
 * trapezoidal rule, which converges geometrically for this analytic, even integrand.
 *
 * @param x argument, must be > 0 (`+Infinity` gives 0)
 * @returns K0(x); exactly 0 where it underflows (x ≳ 705)
 * @throws RangeError when x ≤ 0 or x is NaN
 */
export function besselK0(x: number): number {
  if (!(x > 0)) requirePositive('besselK0', 'x', x);
  if (x <= 2) {
    const y = 0.25 * x * x;
    let term = 1;
    let harmonic = 0;
    let i0 = 1;
    let sum = 0;
    for (let k = 1; k < 40; k++) {
      term *= y / (k * k);
      harmonic += 1 / k;
      i0 += term;
      const add = term * harmonic;
      sum += add;
      if (add < 1e-17 * sum && term < 1e-17 * i0) break;
    }
    return -(Math.log(0.5 * x) + EULER_GAMMA) * i0 + sum;
  }
  if (x > 746) return 0;
  // The peak of exp(−x(cosh t − 1)) narrows like 1/√x; keep ~8 steps across it.
  const h = Math.min(0.05, 0.35 / Math.sqrt(x));
  let sum = 0.5;
  for (let k = 1; k < 2000; k++) {
    const f = Math.exp(-x * (Math.cosh(k * h) - 1));
    sum += f;
    if (f < 1e-18 * sum) break;
  }
  return h * sum * Math.exp(-x);
}
