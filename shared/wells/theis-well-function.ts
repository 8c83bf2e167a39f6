import { requirePositive } from './check-argument';

/** Euler–Mascheroni constant γ (A&S 6.1.3). */
export const EULER_GAMMA = 0.5772156649015329;

/**
 * Theis well function W(u) = E1(u) = ∫_u^∞ e^(−y)/y dy, the exponential integral.
 *
 * Theis (1935) Trans. AGU 16; E1 as in Abramowitz & Stegun (1964) 5.1.1.
 * Small u: the convergent series A&S 5.1.11, E1(u) = −γ − ln u − Σ (−u)^k / (k·k!).
 * Larger u: the continued fraction A&S 5.1.22 evaluated by the modified Lentz method.
 *
 * @param u dimensionless Theis argument r²S/(4Tt), must be > 0 (`+Infinity` gives 0)
 * @returns E1(u); exactly 0 where e^(−u)/u underflows (u ≳ 745)
 * @throws RangeError when u ≤ 0 or u is NaN
 */
export function theisWellFunction(u: number): number {
  if (!(u > 0)) requirePositive('theisWellFunction', 'u', u);
  if (u <= 1) {
    let term = -u;
    let sum = 0;
    for (let k = 1; k < 40; k++) {
      const add = -term / k;
      sum += add;
      if (Math.abs(add) < 1e-17 * Math.abs(sum)) break;
      term *= -u / (k + 1);
    }
    return -EULER_GAMMA - Math.log(u) + sum;
  }
  if (u > 746) return 0;
  // Modified Lentz for E1(u) e^u = 1/(u+1− 1²/(u+3− 2²/(u+5− …))) (Numerical-analysis standard form).
  const tiny = 1e-300;
  let b = u + 1;
  let c = 1 / tiny;
  let d = 1 / b;
  let h = d;
  for (let i = 1; i < 1000; i++) {
    const an = -i * i;
    b += 2;
    d = 1 / (an * d + b);
    c = b + an / c;
    const del = c * d;
    h *= del;
    if (Math.abs(del - 1) < 1e-16) break;
  }
  return h * Math.exp(-u);
}

/** Alias of {@link theisWellFunction}: the exponential integral E1(u), u > 0. */
export const expIntegralE1 = theisWellFunction;
