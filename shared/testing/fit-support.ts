/** Pieces every fit shares: intervals from the covariance of log parameters, curves, residuals, RMSE. */
import type { PumpingTestFit } from './fit-result';
import { studentTQuantile } from './student-t-quantile';
import type { TestReading } from './test-readings';

/** Confidence level of every reported interval. */
export const CONFIDENCE = 0.95;

/** Student-t factor for the two-sided CONFIDENCE interval with n − m degrees of freedom. */
export function intervalFactor(n: number, m: number): number {
  return studentTQuantile(0.5 + CONFIDENCE / 2, Math.max(1, n - m));
}

/** [e^(p − t·σ), e^(p + t·σ)] for a parameter fitted as its logarithm; null when not finite. */
export function logInterval(logValue: number, variance: number, factor: number): [number, number] | null {
  if (!(variance >= 0) || !Number.isFinite(variance)) return null;
  const half = factor * Math.sqrt(variance);
  const lo = Math.exp(logValue - half);
  const hi = Math.exp(logValue + half);
  return Number.isFinite(lo) && Number.isFinite(hi) && lo > 0 ? [lo, hi] : null;
}

/** Root mean square of residuals. */
export function rootMeanSquare(residuals: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < residuals.length; i++) s += residuals[i]! ** 2;
  return residuals.length > 0 ? Math.sqrt(s / residuals.length) : 0;
}

/** Log-spaced times over [from, to] (count ≥ 2). */
export function logSpaced(from_s: number, to_s: number, count = 60): number[] {
  const a = Math.log(from_s);
  const b = Math.log(Math.max(to_s, from_s * 1.0001));
  return Array.from({ length: count }, (_, k) => Math.exp(a + ((b - a) * k) / (count - 1)));
}

/** The fitted curve per well over the span of its readings. */
export function fittedCurves(readings: readonly TestReading[], model: (time_s: number, distance_m: number) => number): PumpingTestFit['curve'] {
  const byWell = new Map<string, TestReading[]>();
  for (const r of readings) byWell.set(r.well, [...(byWell.get(r.well) ?? []), r]);
  return [...byWell].map(([well, list]) => {
    const times = list.map((r) => r.time_s);
    const distance_m = list[0]!.distance_m;
    return {
      well,
      distance_m,
      points: logSpaced(Math.min(...times), Math.max(...times)).map((time_s) => ({ time_s, drawdown_m: model(time_s, distance_m) })),
    };
  });
}

/** Residual rows (observed − fitted) for the plots. */
export function residualRows(readings: readonly TestReading[], residuals: ArrayLike<number>): PumpingTestFit['residuals'] {
  return readings.map((r, i) => ({ well: r.well, time_s: r.time_s, residual_m: residuals[i]! }));
}
