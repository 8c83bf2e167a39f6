/**
 * The obvious departures of test data from a fitted model, read per well in time order by
 * comparing the slope of drawdown against ln t in the readings with the slope of the fitted
 * curve over the same readings — the signatures Kruseman & de Ridder (1994, ch. 1 and 6) show on
 * log–log and semi-log plots:
 * - late readings flattening (data slope well below the model's): a recharge boundary or leakage
 *   through an aquitard (try the Hantush–Jacob fit);
 * - late readings steepening: a barrier boundary or an aquifer of limited extent;
 * - mid readings flat and late readings steep again (an S-shape): delayed yield of an unconfined aquifer;
 * - early readings above the curve close to the pumped well: well-bore storage or skin.
 * A departure is named when the slopes differ by more than half the model's and by more than
 * twice the standard error of the data slope, so noise alone rarely triggers it; the words are a
 * hint to look, not a diagnosis.
 */
import { fitStraightLine } from './linear-regression';
import type { TestReading } from './test-readings';

interface Sample {
  t: number;
  observed: number;
  fitted: number;
  d: number;
}

/** 'flatter' | 'steeper' | null: how the data's slope over `part` compares with the model's. */
function compareSlopes(part: Sample[]): 'flatter' | 'steeper' | null {
  if (part.length < 3) return null;
  const x = part.map((p) => Math.log(p.t));
  try {
    const data = fitStraightLine(x, part.map((p) => p.observed));
    const model = fitStraightLine(x, part.map((p) => p.fitted));
    if (!(model.slope > 0)) return null;
    const gap = data.slope - model.slope;
    const se = Number.isFinite(data.slopeSe) ? data.slopeSe : 0;
    if (Math.abs(gap) <= 0.5 * model.slope || Math.abs(gap) <= 2 * se) return null;
    return gap < 0 ? 'flatter' : 'steeper';
  } catch {
    return null;
  }
}

/** Departure notes (empty when the readings follow the fitted curve). */
export function detectDepartures(readings: readonly TestReading[], residuals: ArrayLike<number>): string[] {
  const notes = new Set<string>();
  const byWell = new Map<string, Sample[]>();
  readings.forEach((x, i) => byWell.set(x.well, [...(byWell.get(x.well) ?? []), { t: x.time_s, observed: x.drawdown_m, fitted: x.drawdown_m - residuals[i]!, d: x.distance_m }]));
  for (const [well, list] of byWell) {
    if (list.length < 8) continue;
    list.sort((a, b) => a.t - b.t);
    const n = list.length;
    const late = compareSlopes(list.slice(n - Math.max(4, Math.floor(n / 4))));
    const mid = compareSlopes(list.slice(Math.floor(n * 0.35), Math.floor(n * 0.7)));
    if (mid === 'flatter' && late === 'steeper')
      notes.add(`Well ${well}: the drawdown flattens at mid time and steepens again late (an S-shape): delayed yield of an unconfined aquifer; fit the late readings for Sy.`);
    else if (late === 'flatter')
      notes.add(`Well ${well}: late readings flatten below the fitted curve: a recharge boundary or leakage through an aquitard — try the Hantush–Jacob fit and check for rivers or lakes nearby.`);
    else if (late === 'steeper')
      notes.add(`Well ${well}: late readings steepen above the fitted curve: a barrier boundary or an aquifer of limited extent — a design with these parameters alone may understate the drawdown needed.`);
    const early = list.slice(0, Math.max(3, Math.floor(n * 0.15)));
    const scale = Math.max(...list.map((p) => Math.abs(p.observed)), 1e-6);
    if (list[0]!.d < 2 && early.every((p) => p.observed - p.fitted > 0.02 * scale))
      notes.add(`Well ${well}: early readings stand above the curve close to the pumped well: well-bore storage or skin — leave the early readings out of the fit.`);
  }
  return [...notes];
}
