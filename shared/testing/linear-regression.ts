/** Ordinary least-squares straight line y = a + b·x with the standard errors of a and b (any statistics text). */

export interface StraightLineFit {
  intercept: number;
  slope: number;
  /** Standard errors (NaN-free: Infinity when n ≤ 2). */
  interceptSe: number;
  slopeSe: number;
  /** Covariance of intercept and slope. */
  covariance: number;
  rmse: number;
  n: number;
}

/** Fits the line; throws RangeError for fewer than 2 points or no spread in x. */
export function fitStraightLine(x: readonly number[], y: readonly number[]): StraightLineFit {
  const n = x.length;
  if (n < 2) throw new RangeError('a straight line needs at least 2 points');
  const mx = x.reduce((s, v) => s + v, 0) / n;
  const my = y.reduce((s, v) => s + v, 0) / n;
  let sxx = 0;
  let sxy = 0;
  for (let i = 0; i < n; i++) {
    sxx += (x[i]! - mx) ** 2;
    sxy += (x[i]! - mx) * (y[i]! - my);
  }
  if (!(sxx > 0)) throw new RangeError('the points have no spread along the abscissa');
  const slope = sxy / sxx;
  const intercept = my - slope * mx;
  let ssr = 0;
  for (let i = 0; i < n; i++) ssr += (y[i]! - intercept - slope * x[i]!) ** 2;
  const sigma2 = n > 2 ? ssr / (n - 2) : Infinity;
  const slopeVar = sigma2 / sxx;
  const interceptVar = sigma2 * (1 / n + (mx * mx) / sxx);
  return {
    intercept,
    slope,
    interceptSe: Math.sqrt(interceptVar),
    slopeSe: Math.sqrt(slopeVar),
    covariance: n > 2 ? (-mx * sigma2) / sxx : Infinity,
    rmse: Math.sqrt(ssr / n),
    n,
  };
}
