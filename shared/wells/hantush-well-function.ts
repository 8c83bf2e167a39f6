import { besselK0 } from './bessel-k0';
import { requireNonNegative, requirePositive } from './check-argument';
import { getGaussLegendreRule } from './gauss-legendre';
import { E1_UNDERFLOW_U, theisWellFunction } from './theis-well-function';

/**
 * Largest r/B for which the series branch is used. Its rounding error grows like
 * I0(β)·e^(β/2)·2^(−53) (≈ 1e−14 at β = 4, ≈ 5e−11 at β = 10); beyond it the integral is
 * taken by quadrature.
 */
export const HANTUSH_SERIES_MAX_R_OVER_B = 4;

/** Beyond this r/B, W(u, β) ≤ 2·K0(β) is below the smallest subnormal double. */
export const HANTUSH_UNDERFLOW_R_OVER_B = 746;

const RULE = getGaussLegendreRule(10);

/**
 * Exponent levels bounding the quadrature panels: 0.5·k², k = 0 … 9, so that panels are
 * equally wide in v near a Gaussian peak and grow where the integrand decays exponentially.
 * The last level, 40.5, leaves a neglected tail below e^(−40) ≈ 4e−18 of the peak.
 */
const PANEL_LEVELS = [0, 0.5, 2, 4.5, 8, 12.5, 18, 24.5, 32, 40.5];

/**
 * Hantush–Jacob leaky well function W(u, β) = ∫_u^∞ exp(−y − β²/(4y)) / y dy, with β = r/B.
 *
 * Hantush & Jacob (1955) Trans. AGU 36; Hantush (1956). Three routes, chosen by (u, β):
 * - for u ≥ β/2, expanding exp(−β²/(4y)) in powers gives the convergent series
 *   W(u, β) = Σ_n (−β²/(4u))^n / n! · E_{n+1}(u) (cf. Veling & Maas 2010, J. Hydrology), with
 *   the generalised exponential integrals from the recurrence A&S 5.1.14;
 * - for u < β/2, Hantush's symmetry W(u, β) = 2·K0(β) − W(β²/(4u), β) moves the lower limit
 *   past the integrand's peak at y = β/2, where the series converges quickly;
 * - for β > {@link HANTUSH_SERIES_MAX_R_OVER_B}, where the alternating series would lose
 *   digits, the tail integral is taken by panelled Gauss–Legendre quadrature after the
 *   substitution y = u·e^v.
 * W(u, 0) = E1(u); W → 2·K0(β) as u → 0 (de Glee's steady state).
 *
 * @param u dimensionless time argument r²S/(4Tt); must be > 0 (`+Infinity` gives 0)
 * @param rOverB β = r/B, distance over leakage factor; must be ≥ 0 (0 gives E1(u),
 *   `+Infinity` gives 0)
 * @returns W(u, β) ≥ 0; exactly 0 where it underflows
 * @throws RangeError when u ≤ 0, β < 0 or either is NaN
 */
export function hantushWellFunction(u: number, rOverB: number): number {
  if (!(u > 0)) requirePositive('hantushWellFunction', 'u', u);
  if (!(rOverB >= 0)) requireNonNegative('hantushWellFunction', 'rOverB', rOverB);
  const c = 0.25 * rOverB * rOverB;
  // c = 0 covers β = 0 and any β so small (< 3e−162) that W differs from E1 by far less than
  // a rounding error.
  if (c === 0) return theisWellFunction(u);
  if (rOverB > HANTUSH_UNDERFLOW_R_OVER_B) return 0;
  const tail = rOverB <= HANTUSH_SERIES_MAX_R_OVER_B ? hantushTailSeries : hantushTailQuadrature;
  if (u < 0.5 * rOverB) {
    const k0 = besselK0(rOverB);
    return 2 * k0 - tail(c / u, c);
  }
  return tail(u, c);
}

/**
 * ∫_u^∞ exp(−y − c/y)/y dy for u ≥ √c by the series in E_{n+1}(u). Each term's rounding error is
 * bounded by 2^(−53)·e^(−u)·c^n/(u·(n!)²), so the sum stays accurate for moderate c.
 */
function hantushTailSeries(u: number, c: number): number {
  const e1 = theisWellFunction(u);
  if (e1 === 0) return 0;
  const expMinusU = Math.exp(-u);
  const ratio = c / u;
  let en = e1; // E_{n+1}(u), from E_{n+1} = (e^(−u) − u·E_n)/n
  let coef = 1; // (−c/u)^n / n!
  let sum = e1;
  for (let n = 1; n < 400; n++) {
    en = (expMinusU - u * en) / n;
    coef *= -ratio / n;
    const term = coef * en;
    sum += term;
    if (Math.abs(term) <= 1e-17 * sum) return sum;
  }
  // Not reached for u ≥ √c with c ≤ 4: the terms fall below (c/u)^n/n! · 1/n. Kept as a guard.
  return hantushTailQuadrature(u, c);
}

/**
 * ∫_u^∞ exp(−y − c/y)/y dy for u ≥ √c by Gauss–Legendre panels. With y = u·e^v the integral is
 * e^(−u−c/u)·∫_0^∞ exp(−E(v)) dv, E(v) = u·(e^v − 1) + (c/u)·(e^(−v) − 1) ≥ 0 and increasing;
 * panel ends are where E reaches each of {@link PANEL_LEVELS}.
 */
function hantushTailQuadrature(u: number, c: number): number {
  if (u > E1_UNDERFLOW_U) return 0;
  const p = u;
  const q = c / u;
  const scale = Math.exp(-(p + q));
  if (scale === 0) return 0;
  let sum = 0;
  let vPrev = 0;
  for (let k = 1; k < PANEL_LEVELS.length; k++) {
    // E(v) = L ⇔ p·X² − (p + q + L)·X + q = 0 with X = e^v; take the root X ≥ 1.
    const level = PANEL_LEVELS[k]!;
    const b = p + q + level;
    const disc = Math.sqrt(Math.max(0, b * b - 4 * p * q));
    const v = Math.log((b + disc) / (2 * p));
    const half = 0.5 * (v - vPrev);
    const mid = 0.5 * (v + vPrev);
    let panel = 0;
    for (let i = 0; i < RULE.nodes.length; i++) {
      const t = mid + half * RULE.nodes[i]!;
      panel += RULE.weights[i]! * Math.exp(-(p * Math.expm1(t) + q * Math.expm1(-t)));
    }
    sum += half * panel;
    vPrev = v;
  }
  return scale * sum;
}
