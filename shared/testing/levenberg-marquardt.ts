/**
 * Levenberg–Marquardt least squares for the few parameters of a pumping-test fit, with the
 * covariance of the estimate. Written here rather than taken from a library because the fits
 * need the Jacobian at the optimum for confidence intervals (cov = σ²·(JᵀJ)⁻¹, σ² = SSR/(n − p)),
 * which the general packages do not return; with two or three parameters the normal equations
 * are solved directly.
 *
 * Levenberg (1944) Q. Appl. Math. 2; Marquardt (1963) J. SIAM 11 — damping λ·diag(JᵀJ).
 */

/** Residuals and Jacobian of a model at parameters p. */
export interface LeastSquaresModel {
  /** Residuals r_i(p) = observed_i − model_i(p). */
  residuals(p: readonly number[]): Float64Array;
  /** ∂model_i/∂p_k, row-major n × m (optional: forward differences otherwise). */
  jacobian?(p: readonly number[]): Float64Array;
}

export interface LeastSquaresResult {
  parameters: number[];
  /** Sum of squared residuals at the optimum. */
  ssr: number;
  /** Covariance of the parameters, row-major m × m (null when JᵀJ is singular or n ≤ m). */
  covariance: number[] | null;
  iterations: number;
  converged: boolean;
}

/** Solves the m × m system A x = b (Gaussian elimination with partial pivoting); null when singular. */
export function solveSmallSystem(a: number[], b: number[], m: number): number[] | null {
  const A = a.slice();
  const x = b.slice();
  for (let c = 0; c < m; c++) {
    let piv = c;
    for (let r = c + 1; r < m; r++) if (Math.abs(A[r * m + c]!) > Math.abs(A[piv * m + c]!)) piv = r;
    if (!(Math.abs(A[piv * m + c]!) > 1e-300)) return null;
    if (piv !== c) {
      for (let k = 0; k < m; k++) [A[c * m + k], A[piv * m + k]] = [A[piv * m + k]!, A[c * m + k]!];
      [x[c], x[piv]] = [x[piv]!, x[c]!];
    }
    for (let r = c + 1; r < m; r++) {
      const f = A[r * m + c]! / A[c * m + c]!;
      for (let k = c; k < m; k++) A[r * m + k] = A[r * m + k]! - f * A[c * m + k]!;
      x[r] = x[r]! - f * x[c]!;
    }
  }
  for (let c = m - 1; c >= 0; c--) {
    let s = x[c]!;
    for (let k = c + 1; k < m; k++) s -= A[c * m + k]! * x[k]!;
    x[c] = s / A[c * m + c]!;
  }
  return x.every(Number.isFinite) ? x : null;
}

function numericJacobian(model: LeastSquaresModel, p: readonly number[], r0: Float64Array): Float64Array {
  const n = r0.length;
  const m = p.length;
  const J = new Float64Array(n * m);
  for (let k = 0; k < m; k++) {
    const h = 1e-6 * Math.max(1, Math.abs(p[k]!));
    const q = p.slice();
    q[k] = q[k]! + h;
    const r1 = model.residuals(q);
    // residual = obs − model, so ∂model/∂p = −∂r/∂p.
    for (let i = 0; i < n; i++) J[i * m + k] = -(r1[i]! - r0[i]!) / h;
  }
  return J;
}

const sumSquares = (r: Float64Array) => r.reduce((s, v) => s + v * v, 0);

/** Minimises Σ r_i² from `start`. */
export function fitLeastSquares(model: LeastSquaresModel, start: readonly number[], maxIterations = 200): LeastSquaresResult {
  const m = start.length;
  let p = start.slice();
  let r = model.residuals(p);
  let ssr = sumSquares(r);
  let lambda = 1e-3;
  let iterations = 0;
  let converged = false;
  const normal = (J: Float64Array, res: Float64Array) => {
    const n = res.length;
    const JtJ = new Array<number>(m * m).fill(0);
    const Jtr = new Array<number>(m).fill(0);
    for (let i = 0; i < n; i++)
      for (let a = 0; a < m; a++) {
        const ja = J[i * m + a]!;
        Jtr[a] = Jtr[a]! + ja * res[i]!;
        for (let b = 0; b < m; b++) JtJ[a * m + b] = JtJ[a * m + b]! + ja * J[i * m + b]!;
      }
    return { JtJ, Jtr };
  };
  for (; iterations < maxIterations; iterations++) {
    const J = model.jacobian ? model.jacobian(p) : numericJacobian(model, p, r);
    const { JtJ, Jtr } = normal(J, r);
    let improved = false;
    for (let attempt = 0; attempt < 30; attempt++) {
      const A = JtJ.slice();
      for (let a = 0; a < m; a++) A[a * m + a] = A[a * m + a]! * (1 + lambda) + 1e-30;
      const step = solveSmallSystem(A, Jtr, m);
      if (step === null) {
        lambda *= 10;
        continue;
      }
      const q = p.map((v, k) => v + step[k]!);
      const rq = model.residuals(q);
      const sq = sumSquares(rq);
      if (Number.isFinite(sq) && sq < ssr) {
        const relative = (ssr - sq) / Math.max(ssr, 1e-300);
        const stepSize = Math.max(...step.map(Math.abs));
        p = q;
        r = rq;
        ssr = sq;
        lambda = Math.max(lambda / 10, 1e-12);
        improved = true;
        if (relative < 1e-12 || stepSize < 1e-10) converged = true;
        break;
      }
      lambda *= 10;
    }
    if (!improved) {
      converged = true;
      break;
    }
    if (converged) break;
  }
  const n = r.length;
  let covariance: number[] | null = null;
  if (n > m) {
    const J = model.jacobian ? model.jacobian(p) : numericJacobian(model, p, r);
    const { JtJ } = normal(J, r);
    const sigma2 = ssr / (n - m);
    const inv: number[] = new Array<number>(m * m).fill(0);
    let ok = true;
    for (let k = 0; k < m && ok; k++) {
      const e = new Array<number>(m).fill(0);
      e[k] = 1;
      const col = solveSmallSystem(JtJ, e, m);
      if (col === null) ok = false;
      else for (let a = 0; a < m; a++) inv[a * m + k] = col[a]! * sigma2;
    }
    covariance = ok ? inv : null;
  }
  return { parameters: p, ssr, covariance, iterations, converged };
}
