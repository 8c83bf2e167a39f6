/**
 * Preconditioned conjugate gradients for the symmetric positive-definite five-point systems of
 * the section solve. The matrix is stored by its diagonals (structured sparse storage):
 * A[k][k] = diag[k], A[k][k+1] = A[k+1][k] = −east[k], A[k][k+nx] = A[k+nx][k] = −north[k].
 *
 * Preconditioner: modified incomplete Cholesky, MIC(0) with relaxation ω (Gustafsson 1978;
 * ω = 0 is plain IC(0); default ω = 0.99), in the D-ILU form M = (D − L) D⁻¹ (D − Lᵀ) for the natural ordering.
 * Stopping rule: ‖b − A x‖₂ ≤ tolerance · ‖b‖₂ on the recursively updated residual, checked on the
 * true residual at the end (Saad, Iterative Methods for Sparse Linear Systems, 2003, alg. 9.1).
 */

export interface FivePointSystem {
  /** Cells per row (the stride of the north coupling). */
  nx: number;
  diag: Float64Array;
  /** Coupling of k and k + 1 (positive transmissibility; the matrix entry is −east[k]). */
  east: Float64Array;
  /** Coupling of k and k + nx. */
  north: Float64Array;
  rhs: Float64Array;
}

export interface PcgOptions {
  /** Relative residual at which to stop. Default 1e-10. */
  tolerance?: number;
  /** Iteration limit. Default 20 000. */
  maxIterations?: number;
  /** MIC relaxation ω in [0, 1]. Default 0.99. */
  relaxation?: number;
}

export interface PcgResult {
  x: Float64Array;
  iterations: number;
  /** ‖b − A x‖₂ / ‖b‖₂ of the returned x (0 when b = 0). */
  relativeResidual: number;
  converged: boolean;
}

/** y = A x for the five-point matrix. */
export function multiplyFivePoint(s: FivePointSystem, x: Float64Array, y: Float64Array): void {
  const { nx, diag, east, north } = s;
  const n = diag.length;
  for (let k = 0; k < n; k++) {
    let v = diag[k]! * x[k]!;
    if (k + 1 < n) v -= east[k]! * x[k + 1]!;
    if (k >= 1) v -= east[k - 1]! * x[k - 1]!;
    if (k + nx < n) v -= north[k]! * x[k + nx]!;
    if (k >= nx) v -= north[k - nx]! * x[k - nx]!;
    y[k] = v;
  }
}

/**
 * The system copied into arrays padded with nx zeros at both ends, so the inner loops run
 * without bounds tests (index p = k + nx).
 */
interface Padded {
  nx: number;
  n: number;
  diag: Float64Array;
  east: Float64Array;
  north: Float64Array;
}

function pad(s: FivePointSystem): Padded {
  const n = s.diag.length;
  const nx = s.nx;
  const make = (a: Float64Array) => {
    const out = new Float64Array(n + 2 * nx);
    out.set(a, nx);
    return out;
  };
  const diag = make(s.diag);
  for (let p = 0; p < nx; p++) { diag[p] = 1; diag[n + nx + p] = 1; }
  return { nx, n, diag, east: make(s.east), north: make(s.north) };
}

function multiplyPadded(a: Padded, x: Float64Array, y: Float64Array): void {
  const { nx, n, diag, east, north } = a;
  for (let p = nx; p < n + nx; p++) {
    y[p] = diag[p]! * x[p]! - east[p]! * x[p + 1]! - east[p - 1]! * x[p - 1]! - north[p]! * x[p + nx]! - north[p - nx]! * x[p - nx]!;
  }
}

/** Pivots D of the MIC(0) factorisation (padded indexing). */
function factorise(a: Padded, omega: number): Float64Array {
  const { nx, n, diag, east, north } = a;
  const d = new Float64Array(n + 2 * nx).fill(1);
  for (let p = nx; p < n + nx; p++) {
    const w = east[p - 1]!;
    const s_ = north[p - nx]!;
    const dw = d[p - 1]!;
    const ds = d[p - nx]!;
    // Plain IC(0) terms, and the fill-in MIC drops put back on the diagonal (row sums kept).
    const v = diag[p]! - (w * w + omega * w * north[p - 1]!) / dw - (s_ * s_ + omega * s_ * east[p - nx]!) / ds;
    // Guard against breakdown on strongly graded meshes: fall back to the plain diagonal.
    d[p] = v > 1e-3 * diag[p]! ? v : diag[p]!;
  }
  return d;
}

/** z = M⁻¹ r with M = (D − L) D⁻¹ (D − Lᵀ) (padded indexing; z's padding stays 0). */
function precondition(a: Padded, d: Float64Array, r: Float64Array, z: Float64Array): void {
  const { nx, n, east, north } = a;
  for (let p = nx; p < n + nx; p++) z[p] = (r[p]! + east[p - 1]! * z[p - 1]! + north[p - nx]! * z[p - nx]!) / d[p]!;
  for (let p = n + nx - 1; p >= nx; p--) z[p] = z[p]! + (east[p]! * z[p + 1]! + north[p]! * z[p + nx]!) / d[p]!;
}

function dot(a: Float64Array, b: Float64Array): number {
  let s = 0;
  for (let k = 0; k < a.length; k++) s += a[k]! * b[k]!;
  return s;
}

/** Solves A x = b by MIC(0)-preconditioned conjugate gradients from x = 0. */
export function solveFivePointPcg(s: FivePointSystem, options: PcgOptions = {}): PcgResult {
  const tolerance = options.tolerance ?? 1e-10;
  const maxIterations = options.maxIterations ?? 20_000;
  const n = s.diag.length;
  const nx = s.nx;
  const a = pad(s);
  const size = n + 2 * nx;
  const x = new Float64Array(size);
  const r = new Float64Array(size);
  r.set(s.rhs, nx);
  const bNorm = Math.sqrt(dot(r, r));
  if (bNorm === 0) return { x: new Float64Array(n), iterations: 0, relativeResidual: 0, converged: true };
  const d = factorise(a, options.relaxation ?? 0.99);
  const z = new Float64Array(size);
  const q = new Float64Array(size);
  precondition(a, d, r, z);
  const p = Float64Array.from(z);
  let rz = dot(r, z);
  let iterations = 0;
  let rNorm = bNorm;
  while (iterations < maxIterations && rNorm > tolerance * bNorm) {
    multiplyPadded(a, p, q);
    const alpha = rz / dot(p, q);
    let rr = 0;
    for (let k = nx; k < n + nx; k++) {
      x[k] = x[k]! + alpha * p[k]!;
      const rk = r[k]! - alpha * q[k]!;
      r[k] = rk;
      rr += rk * rk;
    }
    rNorm = Math.sqrt(rr);
    iterations++;
    if (rNorm <= tolerance * bNorm) break;
    precondition(a, d, r, z);
    const rzNext = dot(r, z);
    const beta = rzNext / rz;
    rz = rzNext;
    for (let k = nx; k < n + nx; k++) p[k] = z[k]! + beta * p[k]!;
  }
  // The recursive residual drifts from the true one; report the true one.
  multiplyPadded(a, x, q);
  let tr = 0;
  for (let k = 0; k < n; k++) tr += (s.rhs[k]! - q[k + nx]!) ** 2;
  const relativeResidual = Math.sqrt(tr) / bNorm;
  return { x: x.slice(nx, n + nx), iterations, relativeResidual, converged: relativeResidual <= Math.max(tolerance * 10, 1e-14) };
}
