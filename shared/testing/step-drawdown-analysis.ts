/**
 * Step-drawdown analysis (Jacob 1947; Kruseman & de Ridder 1994, ch. 14): the drawdown in the
 * pumped well is s_w = B·Q + C·Q², aquifer loss plus well loss, so s_w/Q = B + C·Q is a straight
 * line in Q. Each step's drawdown is the reading at its end; with steps of equal length this is
 * Bierschenk's (1963) form. Well efficiency at rate Q = B·Q / (B·Q + C·Q²).
 * Steps are the runs of equal rate in time order (a `rate` column, or given steps).
 */
import type { PumpingTestFit } from './fit-result';
import { intervalFactor, residualRows, CONFIDENCE } from './fit-support';
import { fitStraightLine } from './linear-regression';
import type { TestReading } from './test-readings';

/** The end-of-step readings of a step test, in time order. */
export function findStepEnds(readings: readonly TestReading[]): TestReading[] {
  const sorted = readings.filter((r) => r.phase === 'pumping').sort((a, b) => a.time_s - b.time_s);
  const ends: TestReading[] = [];
  sorted.forEach((r, i) => {
    const next = sorted[i + 1];
    if (next === undefined || Math.abs(next.rate_m3_s - r.rate_m3_s) > 1e-12 * Math.max(1, Math.abs(r.rate_m3_s))) ends.push(r);
  });
  return ends.filter((r) => r.rate_m3_s > 0);
}

/** B, C and the efficiency of each step. */
export function analyseStepDrawdown(readings: readonly TestReading[], well: string | null): PumpingTestFit {
  const ends = findStepEnds(readings);
  if (ends.length < 2) throw new RangeError(`a step test needs at least 2 steps of different rate (found ${ends.length}); give the rate of each reading in a rate column`);
  const Q = ends.map((r) => r.rate_m3_s);
  const sq = ends.map((r) => r.drawdown_m / r.rate_m3_s);
  const line = fitStraightLine(Q, sq);
  const B = line.intercept;
  const C = line.slope;
  const notes: string[] = [];
  if (ends.length < 3) notes.push('Two steps determine the line exactly: no check of the model and no confidence interval; use three or more steps.');
  if (C < 0) notes.push('The well-loss coefficient comes out negative: the steps do not follow s_w = B·Q + C·Q² (unequal step lengths, too short steps or development during the test); do not use C.');
  if (B <= 0) notes.push('The aquifer-loss term B comes out ≤ 0: the data do not support the model.');
  const factor = ends.length > 2 ? intervalFactor(ends.length, 2) : Infinity;
  const steps = ends.map((r) => {
    const aquifer = B * r.rate_m3_s;
    const total = aquifer + C * r.rate_m3_s ** 2;
    return { rate_m3_s: r.rate_m3_s, drawdown_m: r.drawdown_m, specificDrawdown_s_m2: r.drawdown_m / r.rate_m3_s, efficiency: total > 0 ? aquifer / total : 0 };
  });
  const residuals = ends.map((r) => r.drawdown_m - (B * r.rate_m3_s + C * r.rate_m3_s ** 2));
  return {
    method: 'step',
    well,
    transmissivity_m2_s: null,
    storativity: null,
    linearLoss_s_m2: B,
    wellLoss_s2_m5: C,
    steps,
    rmse_m: Math.sqrt(residuals.reduce((s, v) => s + v * v, 0) / residuals.length),
    interval: {
      confidence: CONFIDENCE,
      ...(Number.isFinite(factor * line.slopeSe) ? { wellLoss_s2_m5: [C - factor * line.slopeSe, C + factor * line.slopeSe] as [number, number] } : {}),
    },
    validity: { readings: ends.length, fractionSmallU: null, uMax: null, notes },
    departures: [],
    curve: [
      {
        well: ends[0]!.well,
        distance_m: ends[0]!.distance_m,
        // s_w against Q, carried in the time field as the rate (m³/s) for the step chart.
        points: Array.from({ length: 21 }, (_, k) => {
          const q = (Math.max(...Q) * 1.2 * k) / 20;
          return { time_s: q, drawdown_m: B * q + C * q * q };
        }),
      },
    ],
    residuals: residualRows(ends, residuals),
  };
}
