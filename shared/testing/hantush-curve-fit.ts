/**
 * Hantush–Jacob leaky-aquifer fit: T, S and the leakage factor B by nonlinear least squares in
 * log T, log S, log B, s = Q/(4πT)·W(u, r/B) (Hantush & Jacob 1955; Kruseman & de Ridder 1994,
 * §4.2.1). Started from the Theis fit and the best of a few B on a grid.
 */
import { hantushWellFunction } from '../wells';
import type { PumpingTestFit } from './fit-result';
import { fittedCurves, intervalFactor, logInterval, residualRows, rootMeanSquare, CONFIDENCE } from './fit-support';
import { fitLeastSquares } from './levenberg-marquardt';
import { gridStart } from './theis-curve-fit';
import type { TestReading } from './test-readings';
import { detectDepartures } from './detect-departures';

/** Hantush–Jacob drawdown, m. */
export function hantushDrawdown(rate_m3_s: number, transmissivity_m2_s: number, storativity: number, leakageFactor_m: number, distance_m: number, time_s: number): number {
  const u = (distance_m * distance_m * storativity) / (4 * transmissivity_m2_s * time_s);
  return (rate_m3_s / (4 * Math.PI * transmissivity_m2_s)) * hantushWellFunction(u, distance_m / leakageFactor_m);
}

/** Largest B the fit reports, m: beyond it the well function is Theis's to many digits at test distances. */
export const MAX_FITTED_LEAKAGE_FACTOR_M = 1e6;

function hantushModel(readings: readonly TestReading[]) {
  return {
    residuals(p: readonly number[]) {
      const [T, S] = p.map(Math.exp) as [number, number];
      const B = Math.min(Math.exp(p[2]!), MAX_FITTED_LEAKAGE_FACTOR_M);
      const r = new Float64Array(readings.length);
      readings.forEach((x, i) => (r[i] = x.drawdown_m - hantushDrawdown(x.rate_m3_s, T, S, B, x.distance_m, x.time_s)));
      return r;
    },
  };
}

/** Fits T, S and B to the pumping-phase readings given. */
export function fitHantushCurve(readings: readonly TestReading[], well: string | null): PumpingTestFit {
  if (readings.length < 4) throw new RangeError('the Hantush–Jacob fit needs at least 4 readings');
  const model = hantushModel(readings);
  const [lnT0, lnS0] = gridStart(readings);
  const rMax = Math.max(...readings.map((x) => x.distance_m));
  let start = [lnT0, lnS0, Math.log(rMax * 1000)];
  let bestSsr = Infinity;
  for (const factor of [0.3, 1, 3, 10, 30, 100, 1000]) {
    const p = [lnT0, lnS0, Math.log(rMax * factor)];
    const ssr = model.residuals(p).reduce((s, v) => s + v * v, 0);
    if (ssr < bestSsr) {
      bestSsr = ssr;
      start = p;
    }
  }
  const fit = fitLeastSquares(model, start);
  const [lnT, lnS, lnB] = fit.parameters as [number, number, number];
  const atBound = Math.exp(lnB) >= MAX_FITTED_LEAKAGE_FACTOR_M;
  const [T, S, B] = [Math.exp(lnT), Math.exp(lnS), Math.min(Math.exp(lnB), MAX_FITTED_LEAKAGE_FACTOR_M)];
  const residuals = model.residuals(fit.parameters);
  const factor = intervalFactor(readings.length, 3);
  const cov = fit.covariance;
  const tI = cov ? logInterval(lnT, cov[0]!, factor) : null;
  const sI = cov ? logInterval(lnS, cov[4]!, factor) : null;
  const bI = cov && !atBound ? logInterval(lnB, cov[8]!, factor) : null;
  const notes: string[] = [];
  if (!fit.converged) notes.push('The least-squares search stopped before converging: treat the parameters as rough.');
  if (atBound) notes.push(`B reached the search bound of ${MAX_FITTED_LEAKAGE_FACTOR_M} m: the data show no leakage; use the Theis fit.`);
  else if (B > 50 * rMax || bI === null || bI[1] / bI[0] > 100)
    notes.push(`The data barely resolve B (${B.toPrecision(3)} m against observation distances up to ${rMax.toPrecision(3)} m): no clear leakage signal; the Theis fit may serve as well.`);
  const q = readings[0]!.rate_m3_s;
  return {
    method: 'hantush',
    well,
    transmissivity_m2_s: T,
    storativity: S,
    leakageFactor_m: B,
    rmse_m: rootMeanSquare(residuals),
    interval: { confidence: CONFIDENCE, ...(tI ? { transmissivity_m2_s: tI } : {}), ...(sI ? { storativity: sI } : {}), ...(bI ? { leakageFactor_m: bI } : {}) },
    validity: { readings: readings.length, fractionSmallU: null, uMax: null, notes },
    departures: detectDepartures(readings, residuals),
    curve: fittedCurves(readings, (t, r) => hantushDrawdown(q, T, S, B, r, t)),
    residuals: residualRows(readings, residuals),
  };
}
