/** Nodes (on [−1, 1]) and weights of an n-point Gauss–Legendre rule. */
export interface GaussLegendreRule {
  /** Abscissae x_i in (−1, 1), ascending. */
  readonly nodes: Float64Array;
  /** Weights w_i, summing to 2. */
  readonly weights: Float64Array;
}

/**
 * Computes the n-point Gauss–Legendre rule by Newton's method on P_n, started from the
 * Chebyshev-like guess cos(π(i − 1/4)/(n + 1/2)) (A&S 25.4.29 for the rule; A&S 22.7.10 for the
 * Legendre recurrence). Computing the rule once at load time avoids transcribing 16-digit tables.
 * @param n number of points, ≥ 1
 */
export function getGaussLegendreRule(n: number): GaussLegendreRule {
  const nodes = new Float64Array(n);
  const weights = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let x = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    let derivative = 1;
    for (let iter = 0; iter < 100; iter++) {
      let p0 = 1;
      let p1 = x;
      for (let k = 2; k <= n; k++) {
        const p2 = ((2 * k - 1) * x * p1 - (k - 1) * p0) / k;
        p0 = p1;
        p1 = p2;
      }
      const pn = n === 1 ? x : p1;
      const pnm1 = n === 1 ? 1 : p0;
      derivative = (n * (x * pn - pnm1)) / (x * x - 1);
      const step = pn / derivative;
      x -= step;
      if (Math.abs(step) < 1e-17) break;
    }
    nodes[n - 1 - i] = x;
    weights[n - 1 - i] = 2 / ((1 - x * x) * derivative * derivative);
  }
  return { nodes, weights };
}
