/**
 * Cooper–Jacob straight line (Cooper & Jacob 1946; Kruseman & de Ridder 1994, §3.2.2): for small
 * u, s = (2.303·Q/(4πT))·log₁₀(2.25·T·t/(r²·S)), a straight line in log₁₀(t/r²) — so several
 * observation wells plot on one line (the time–distance composite). T = 2.303·Q/(4π·Δs), with Δs
 * the drawdown per log cycle; S = 2.25·T·(t/r²)₀ where the line crosses zero drawdown.
 *
 * The late-time window is found automatically: start from the later half of the readings, fit,
 * keep the readings with u = r²S/(4Tt) < uMax (0.05 by default, commonly used — Kruseman &
 * de Ridder give u < 0.01 for a strict fit), refit, until the set stops changing.
 */
import type { PumpingTestFit } from './fit-result';
import { fittedCurves, intervalFactor, residualRows, CONFIDENCE } from './fit-support';
import { fitStraightLine } from './linear-regression';
import type { TestReading } from './test-readings';
import { detectDepartures } from './detect-departures';
import { theisDrawdown } from './theis-curve-fit';

/** Default upper limit of u for the straight line (common practice; stricter 0.01). */
export const COOPER_JACOB_U_MAX = 0.05;

/** Fits the straight line to the pumping-phase readings given. */
export function fitCooperJacob(readings: readonly TestReading[], well: string | null, uMax = COOPER_JACOB_U_MAX): PumpingTestFit {
  if (readings.length < 3) throw new RangeError('the Cooper–Jacob line needs at least 3 readings');
  const q = readings[0]!.rate_m3_s;
  const abscissa = readings.map((x) => x.time_s / (x.distance_m * x.distance_m));
  const order = abscissa.map((_, i) => i).sort((a, b) => abscissa[a]! - abscissa[b]!);
  let window = order.slice(Math.floor(order.length / 2));
  let T = NaN;
  let S = NaN;
  let line = fitStraightLine(
    window.map((i) => Math.log10(abscissa[i]!)),
    window.map((i) => readings[i]!.drawdown_m),
  );
  for (let round = 0; round < 12; round++) {
    T = (2.303 * q) / (4 * Math.PI * line.slope);
    S = 2.25 * T * 10 ** (-line.intercept / line.slope);
    if (!(T > 0) || !(S > 0)) break;
    const next = order.filter((i) => (readings[i]!.distance_m ** 2 * S) / (4 * T * readings[i]!.time_s) < uMax);
    if (next.length < 3 || (next.length === window.length && next.every((v, k) => v === window[k]))) break;
    window = next;
    line = fitStraightLine(
      window.map((i) => Math.log10(abscissa[i]!)),
      window.map((i) => readings[i]!.drawdown_m),
    );
  }
  if (!(line.slope > 0)) throw new RangeError('the drawdown does not grow with time on the straight-line window: the Cooper–Jacob method does not apply');
  T = (2.303 * q) / (4 * Math.PI * line.slope);
  const x0 = 10 ** (-line.intercept / line.slope);
  S = 2.25 * T * x0;
  const small = readings.filter((x) => (x.distance_m ** 2 * S) / (4 * T * x.time_s) < uMax).length;
  const factor = intervalFactor(window.length, 2);
  const slopeLo = line.slope - factor * line.slopeSe;
  const slopeHi = line.slope + factor * line.slopeSe;
  // S = 2.25·T·10^(−a/b): its log-variance by the delta method over (a, b) and T.
  const ln10 = Math.LN10;
  const dA = -ln10 / line.slope;
  const dB = (ln10 * line.intercept) / (line.slope * line.slope) - 1 / line.slope;
  const varLnS = dA * dA * line.interceptSe ** 2 + dB * dB * line.slopeSe ** 2 + 2 * dA * dB * line.covariance;
  const notes: string[] = [];
  if (window.length < 5) notes.push(`Only ${window.length} readings have u < ${uMax}: the straight line rests on few points.`);
  if (small / readings.length < 0.3) notes.push(`Only ${Math.round((100 * small) / readings.length)} % of the readings have u < ${uMax}: most of the test is too early for the straight line; prefer the Theis fit.`);
  const used = window.map((i) => readings[i]!);
  const residuals = used.map((x, k) => x.drawdown_m - (line.intercept + line.slope * Math.log10(abscissa[window[k]!]!)));
  const tInterval: [number, number] | null = slopeLo > 0 ? [(2.303 * q) / (4 * Math.PI * slopeHi), (2.303 * q) / (4 * Math.PI * slopeLo)] : null;
  const sHalf = factor * Math.sqrt(Math.max(0, varLnS));
  return {
    method: 'cooper-jacob',
    well,
    transmissivity_m2_s: T,
    storativity: S,
    rmse_m: line.rmse,
    interval: {
      confidence: CONFIDENCE,
      ...(tInterval ? { transmissivity_m2_s: tInterval } : {}),
      ...(Number.isFinite(sHalf) ? { storativity: [S * Math.exp(-sHalf), S * Math.exp(sHalf)] as [number, number] } : {}),
    },
    line: {
      slope_m_per_log_cycle: line.slope,
      intercept_m: line.intercept,
      abscissa: 'time/r² (s/m²)',
      zeroDrawdownAbscissa: x0,
      windowFrom_s: Math.min(...used.map((x) => x.time_s)),
      windowTo_s: Math.max(...used.map((x) => x.time_s)),
      points: used.length,
    },
    validity: { readings: readings.length, fractionSmallU: small / readings.length, uMax, notes },
    departures: detectDepartures(used, residuals),
    // Plotted: the line itself over the window, and (for the log–log view) Theis with the line's T, S.
    curve: fittedCurves(readings, (t, r) => theisDrawdown(q, T, S, r, t)),
    residuals: residualRows(used, residuals),
  };
}
