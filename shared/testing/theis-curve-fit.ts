/**
 * Theis curve fit: T and S by nonlinear least squares in log T and log S over the drawdowns of
 * one or more observation wells at once, s = Q/(4πT)·W(u), u = r²S/(4Tt) (Theis 1935; Kruseman &
 * de Ridder 1994, §3.2.1). The start comes from a coarse grid over the plausible box, so no
 * type-curve match by eye is needed.
 */
import { theisWellFunction } from '../wells';
import type { PumpingTestFit } from './fit-result';
import { fittedCurves, intervalFactor, logInterval, residualRows, rootMeanSquare, CONFIDENCE } from './fit-support';
import { fitLeastSquares } from './levenberg-marquardt';
import type { TestReading } from './test-readings';
import { detectDepartures } from './detect-departures';

/** Plausible bounds of the start grid: T 1e-7 … 1 m²/s, S 1e-7 … 0.5. */
const LOG_T_RANGE = [Math.log(1e-7), Math.log(1)] as const;
const LOG_S_RANGE = [Math.log(1e-7), Math.log(0.5)] as const;

/** Theis drawdown, m, for rate Q (m³/s). */
export function theisDrawdown(rate_m3_s: number, transmissivity_m2_s: number, storativity: number, distance_m: number, time_s: number): number {
  const u = (distance_m * distance_m * storativity) / (4 * transmissivity_m2_s * time_s);
  return (rate_m3_s / (4 * Math.PI * transmissivity_m2_s)) * theisWellFunction(u);
}

/** Residuals and analytic Jacobian of the Theis model in (ln T, ln S). */
function theisModel(readings: readonly TestReading[]) {
  const n = readings.length;
  return {
    residuals(p: readonly number[]) {
      const T = Math.exp(p[0]!);
      const S = Math.exp(p[1]!);
      const r = new Float64Array(n);
      for (let i = 0; i < n; i++) {
        const x = readings[i]!;
        r[i] = x.drawdown_m - theisDrawdown(x.rate_m3_s, T, S, x.distance_m, x.time_s);
      }
      return r;
    },
    // s = A·W(u), A = Q/(4πT), W'(u) = −e^(−u)/u, ∂u/∂lnT = −u, ∂u/∂lnS = u:
    // ∂s/∂lnT = A·(e^(−u) − W), ∂s/∂lnS = −A·e^(−u).
    jacobian(p: readonly number[]) {
      const T = Math.exp(p[0]!);
      const S = Math.exp(p[1]!);
      const J = new Float64Array(n * 2);
      for (let i = 0; i < n; i++) {
        const x = readings[i]!;
        const u = (x.distance_m * x.distance_m * S) / (4 * T * x.time_s);
        const A = x.rate_m3_s / (4 * Math.PI * T);
        const e = Math.exp(-u);
        J[i * 2] = A * (e - theisWellFunction(u));
        J[i * 2 + 1] = -A * e;
      }
      return J;
    },
  };
}

/** Best (ln T, ln S) on a coarse grid: the start of the fit. */
export function gridStart(readings: readonly TestReading[], steps = 36): [number, number] {
  const model = theisModel(readings);
  let best: [number, number] = [LOG_T_RANGE[0], LOG_S_RANGE[0]];
  let bestSsr = Infinity;
  for (let a = 0; a <= steps; a++)
    for (let b = 0; b <= steps; b++) {
      const p: [number, number] = [LOG_T_RANGE[0] + ((LOG_T_RANGE[1] - LOG_T_RANGE[0]) * a) / steps, LOG_S_RANGE[0] + ((LOG_S_RANGE[1] - LOG_S_RANGE[0]) * b) / steps];
      const r = model.residuals(p);
      let s = 0;
      for (const v of r) s += v * v;
      if (s < bestSsr) {
        bestSsr = s;
        best = p;
      }
    }
  return best;
}

/** Fits T and S to the pumping-phase readings given (one well, or several at once). */
export function fitTheisCurve(readings: readonly TestReading[], well: string | null): PumpingTestFit {
  if (readings.length < 3) throw new RangeError('the Theis fit needs at least 3 readings');
  const model = theisModel(readings);
  const fit = fitLeastSquares(model, gridStart(readings));
  const [lnT, lnS] = fit.parameters as [number, number];
  const T = Math.exp(lnT);
  const S = Math.exp(lnS);
  const residuals = model.residuals(fit.parameters);
  const factor = intervalFactor(readings.length, 2);
  const tInterval = fit.covariance ? logInterval(lnT, fit.covariance[0]!, factor) : null;
  const sInterval = fit.covariance ? logInterval(lnS, fit.covariance[3]!, factor) : null;
  const notes: string[] = [];
  if (!fit.converged) notes.push('The least-squares search stopped before converging: treat the parameters as rough.');
  if (S > 0.05) notes.push(`S = ${S.toPrecision(2)} is in the range of a specific yield: the aquifer may be unconfined (apply as Sy, and check delayed yield).`);
  const q = readings[0]!.rate_m3_s;
  return {
    method: 'theis',
    well,
    transmissivity_m2_s: T,
    storativity: S,
    rmse_m: rootMeanSquare(residuals),
    interval: {
      confidence: CONFIDENCE,
      ...(tInterval ? { transmissivity_m2_s: tInterval } : {}),
      ...(sInterval ? { storativity: sInterval } : {}),
    },
    validity: { readings: readings.length, fractionSmallU: null, uMax: null, notes },
    departures: detectDepartures(readings, residuals),
    curve: fittedCurves(readings, (t, r) => theisDrawdown(q, T, S, r, t)),
    residuals: residualRows(readings, residuals),
  };
}
