import { besselK0 } from './bessel-k0';
import { requireNonNegative, requirePositive } from './check-argument';
import { theisWellFunction } from './theis-well-function';

/**
 * Hantush–Jacob leaky well function W(u, β) = ∫_u^∞ exp(−y − β²/(4y)) / y dy, β = r/B.
 *
 * Hantush & Jacob (1955) Trans. AGU 36; Hantush (1956).
 * For u ≥ β/2: expanding exp(−β²/(4y)) in powers gives the convergent series
 * W(u, β) = Σ_n (−β²/(4u))^n / n! · E_{n+1}(u) (cf. Veling & Maas 2010), with the generalised
 * exponential integrals E_n from the recurrence A&S 5.1.14.
 * For u < β/2: Hantush's symmetry W(u, β) = 2·K0(β) − W(β²/(4u), β) moves the argument past
 * the peak of the integrand, where the series converges quickly.
 *
 * @param u dimensionless time argument r²S/(4Tt), must be > 0
 * @param rOverB β = r/B, distance over leakage factor, must be ≥ 0 (0 gives E1(u))
 * @throws RangeError when u ≤ 0, β < 0 or either is NaN
 */
export function hantushWellFunction(u: number, rOverB: number): number {
  if (!(u > 0)) requirePositive('hantushWellFunction', 'u', u);
  if (!(rOverB >= 0)) requireNonNegative('hantushWellFunction', 'rOverB', rOverB);
  if (rOverB === 0) return theisWellFunction(u);
  const beta = rOverB;
  const c = 0.25 * beta * beta;
  if (u < 0.5 * beta) {
    const k0 = besselK0(beta);
    if (k0 === 0) return 0;
    return 2 * k0 - hantushTail(c / u, c);
  }
  return hantushTail(u, c);
}

/** The series for u ≥ β/2, c = β²/4. */
function hantushTail(u: number, c: number): number {
  const e1 = theisWellFunction(u);
  if (e1 === 0) return 0;
  const expMinusU = Math.exp(-u);
  const ratio = c / u;
  let en = e1; // E_{n+1}(u)
  let coef = 1; // (−c/u)^n / n!
  let sum = e1;
  for (let n = 1; n < 200; n++) {
    en = (expMinusU - u * en) / n;
    coef *= -ratio / n;
    const term = coef * en;
    sum += term;
    if (Math.abs(term) < 1e-17 * Math.abs(sum)) break;
  }
  return sum;
}
