/**
 * The two-sided Student-t quantile for confidence intervals of fitted parameters.
 *
 * Normal quantile: Acklam's rational approximation (relative error < 1.2e-9); Student t from it
 * by the Cornish–Fisher expansion in 1/ν (Abramowitz & Stegun 26.7.5), accurate to better than
 * 1e-3 for ν ≥ 3 — far inside what an approximate confidence interval of a field test needs.
 */

/** z with Φ(z) = p, 0 < p < 1. */
export function normalQuantile(p: number): number {
  if (!(p > 0 && p < 1)) throw new RangeError(`normalQuantile: p must be in (0, 1), got ${p}`);
  const a = [-3.969683028665376e1, 2.209460984245205e2, -2.759285104469687e2, 1.38357751867269e2, -3.066479806614716e1, 2.506628277459239];
  const b = [-5.447609879822406e1, 1.615858368580409e2, -1.556989798598866e2, 6.680131188771972e1, -1.328068155288572e1];
  const c = [-7.784894002430293e-3, -3.223964580411365e-1, -2.400758277161838, -2.549732539343734, 4.374664141464968, 2.938163982698783];
  const d = [7.784695709041462e-3, 3.224671290700398e-1, 2.445134137142996, 3.754408661907416];
  const low = 0.02425;
  if (p < low) {
    const q = Math.sqrt(-2 * Math.log(p));
    return (((((c[0]! * q + c[1]!) * q + c[2]!) * q + c[3]!) * q + c[4]!) * q + c[5]!) / ((((d[0]! * q + d[1]!) * q + d[2]!) * q + d[3]!) * q + 1);
  }
  if (p > 1 - low) return -normalQuantile(1 - p);
  const q = p - 0.5;
  const r = q * q;
  return ((((((a[0]! * r + a[1]!) * r + a[2]!) * r + a[3]!) * r + a[4]!) * r + a[5]!) * q) / (((((b[0]! * r + b[1]!) * r + b[2]!) * r + b[3]!) * r + b[4]!) * r + 1);
}

/** t with P(T ≤ t) = p for ν degrees of freedom (ν ≥ 1). */
export function studentTQuantile(p: number, degreesOfFreedom: number): number {
  const z = normalQuantile(p);
  const v = degreesOfFreedom;
  if (!(v >= 1)) throw new RangeError(`studentTQuantile: degrees of freedom must be ≥ 1, got ${v}`);
  const z3 = z ** 3;
  const z5 = z ** 5;
  const z7 = z ** 7;
  const z9 = z ** 9;
  return (
    z +
    (z3 + z) / (4 * v) +
    (5 * z5 + 16 * z3 + 3 * z) / (96 * v * v) +
    (3 * z7 + 19 * z5 + 17 * z3 - 15 * z) / (384 * v ** 3) +
    (79 * z9 + 776 * z7 + 1482 * z5 - 1920 * z3 - 945 * z) / (92160 * v ** 4)
  );
}
