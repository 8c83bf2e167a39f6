/**
 * Theis recovery (Theis 1935; Kruseman & de Ridder 1994, §3.2.3): after the pump stops at t_p,
 * the residual drawdown s' = (2.303·Q/(4πT))·log₁₀(t/t'), t since pumping started, t' = t − t_p
 * since the stop, for small u' = r²S'/(4Tt'). T = 2.303·Q/(4π·Δs') from the slope per log cycle
 * of t/t'; S is not given (the intercept at t/t' = 1 is ≈ 0 when S' = S).
 * Window: the late recovery (small t/t') where u' < uMax with S from the pumping phase when given,
 * else the half of the readings nearest t/t' = 1.
 */
import type { PumpingTestFit } from './fit-result';
import { intervalFactor, residualRows, CONFIDENCE, logSpaced } from './fit-support';
import { fitStraightLine } from './linear-regression';
import type { TestReading } from './test-readings';
import { COOPER_JACOB_U_MAX } from './cooper-jacob-fit';

export interface RecoveryFitOptions {
  /** Time the pump stopped, s. */
  stop_s: number;
  /** Storativity from the pumping phase (sets the u′ window); absent: the later half. */
  storativity?: number;
  transmissivity_m2_s?: number;
  uMax?: number;
}

/** Fits T to residual drawdowns after the stop. */
export function fitTheisRecovery(readings: readonly TestReading[], well: string | null, { stop_s, storativity, transmissivity_m2_s, uMax = COOPER_JACOB_U_MAX }: RecoveryFitOptions): PumpingTestFit {
  const after = readings.filter((x) => x.time_s > stop_s);
  if (after.length < 3) throw new RangeError('the recovery method needs at least 3 readings after the pump stopped');
  const q = after[0]!.rate_m3_s;
  const ratio = after.map((x) => x.time_s / (x.time_s - stop_s));
  const order = ratio.map((_, i) => i).sort((a, b) => ratio[a]! - ratio[b]!);
  let window: number[];
  let small: number | null = null;
  if (storativity !== undefined && transmissivity_m2_s !== undefined) {
    const uPrime = (i: number) => (after[i]!.distance_m ** 2 * storativity) / (4 * transmissivity_m2_s * (after[i]!.time_s - stop_s));
    window = order.filter((i) => uPrime(i) < uMax);
    small = window.length / after.length;
    if (window.length < 3) window = order.slice(0, Math.max(3, Math.ceil(order.length / 2)));
  } else window = order.slice(0, Math.max(3, Math.ceil(order.length / 2)));
  const x = window.map((i) => Math.log10(ratio[i]!));
  const y = window.map((i) => after[i]!.drawdown_m);
  const line = fitStraightLine(x, y);
  if (!(line.slope > 0)) throw new RangeError('the residual drawdown does not fall as t/t′ falls: the recovery method does not apply');
  const T = (2.303 * q) / (4 * Math.PI * line.slope);
  const factor = intervalFactor(window.length, 2);
  const lo = line.slope - factor * line.slopeSe;
  const hi = line.slope + factor * line.slopeSe;
  const notes: string[] = [];
  const scale = Math.max(...y.map(Math.abs), 1e-9);
  if (Math.abs(line.intercept) > 0.1 * scale)
    notes.push(`The line meets t/t′ = 1 at ${line.intercept.toFixed(3)} m, not 0: S during recovery differs from S during pumping, or the recovery is affected by a boundary or recharge.`);
  const residuals = window.map((i, k) => after[i]!.drawdown_m - (line.intercept + line.slope * x[k]!));
  const used = window.map((i) => after[i]!);
  const ratios = window.map((i) => ratio[i]!);
  const rMin = Math.min(...ratios);
  const rMax = Math.max(...ratios);
  return {
    method: 'recovery',
    well,
    transmissivity_m2_s: T,
    storativity: null,
    rmse_m: line.rmse,
    interval: { confidence: CONFIDENCE, ...(lo > 0 ? { transmissivity_m2_s: [(2.303 * q) / (4 * Math.PI * hi), (2.303 * q) / (4 * Math.PI * lo)] as [number, number] } : {}) },
    line: {
      slope_m_per_log_cycle: line.slope,
      intercept_m: line.intercept,
      abscissa: "t/t'",
      zeroDrawdownAbscissa: null,
      windowFrom_s: Math.min(...used.map((r) => r.time_s)),
      windowTo_s: Math.max(...used.map((r) => r.time_s)),
      points: used.length,
    },
    validity: { readings: after.length, fractionSmallU: small, uMax: small === null ? null : uMax, notes },
    departures: [],
    // The curve is the fitted line against t/t′, reported as times after the stop with the same ratio.
    curve: [
      {
        well: used[0]!.well,
        distance_m: used[0]!.distance_m,
        points: logSpaced(rMin, rMax, 20).map((rt) => ({ time_s: (rt * stop_s) / (rt - 1 || 1e-12), drawdown_m: line.intercept + line.slope * Math.log10(rt) })),
      },
    ],
    residuals: residualRows(used, residuals),
  };
}
