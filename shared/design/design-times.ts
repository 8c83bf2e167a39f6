/**
 * Times for the chosen rates: when each control point and each whole excavation first reaches
 * its target; and, if every pump stops at the design time (power failure), how long until the
 * groundwater is back at formation level — the figure that sets standby pumps and generators.
 *
 * Recovery is superposition in time (Theis 1935): a stop is an injection of the same rate from
 * the stop on, which the field engine evaluates from the stopped schedule. Drawdown under constant
 * pumping grows monotonically with time (every well function grows with t, and an image of
 * opposite sign is always farther than its well), so first-passage times are found by sampling
 * in log t and bisecting the bracketing interval.
 */
import { evaluatePoints, evaluateSeries, logSpacedTimes } from '../field';
import type { ControlPoint } from './control-points';
import type { DesignExcavationResult, DesignTimeSeries } from './design-result';
import { applyDesignRates, type DesignContext } from './design-context';

const PUMPING_SAMPLES = 16;
const RECOVERY_SAMPLES = 24;
const BISECTION_STEPS = 12;

export interface DesignTimes {
  excavations: Map<string, Pick<DesignExcavationResult, 'timeToTarget_s' | 'recoveryToFormation_s' | 'criticalRecoveryToFormation_s'>>;
  pointTimes: Map<ControlPoint, number | null>;
  series: DesignTimeSeries | null;
  /** Time the pumps stop in the recovery check, s. */
  stop_s: number;
}

export interface ComputeTimesOptions {
  ctx: DesignContext;
  rates: Float64Array;
  designPoints: ControlPoint[];
  excavations: DesignExcavationResult[];
}

/** First time in (lo, hi] where f ≤ 0, f(lo) > 0 ≥ f(hi), by bisection in log t. */
function bisectLog(f: (t: number) => number, lo: number, hi: number): number {
  let a = lo;
  let b = hi;
  for (let k = 0; k < BISECTION_STEPS; k++) {
    const m = Math.sqrt(a * b);
    if (f(m) <= 0) b = m;
    else a = m;
  }
  return b;
}

/** Times to target, recovery times and the level–time chart at the most critical point. */
export function computeTimes({ ctx, rates, designPoints, excavations }: ComputeTimesOptions): DesignTimes {
  const { scenario, wells, designTime_s, options } = ctx;
  const out: DesignTimes = { excavations: new Map(), pointTimes: new Map(), series: null, stop_s: designTime_s ?? options.duration_s };
  const pumping = rates.some((q) => q > 0);
  if (!pumping || scenario.excavations.length === 0) return out;
  const solved = applyDesignRates(scenario, wells, rates);
  const stop_s = out.stop_s;
  const stopped = applyDesignRates(scenario, wells, rates, stop_s);
  const byExcavation = new Map<string, ControlPoint[]>();
  for (const p of designPoints) if (p.excavationId !== null) byExcavation.set(p.excavationId, [...(byExcavation.get(p.excavationId) ?? []), p]);

  const levelsAt = (s: typeof solved, pts: ControlPoint[], t: number) => evaluatePoints({ scenario: s, points: pts.map((p) => [p.x, p.y] as const), time_s: t }).points;
  const worstOver = (pts: ControlPoint[], t: number, reference: (p: ControlPoint) => number, s = solved) =>
    levelsAt(s, pts, t).reduce((m, r, i) => Math.max(m, r.level_m - reference(pts[i]!)), -Infinity);

  // Time to target (transient designs only: a steady design has no time).
  if (designTime_s !== null) {
    const times = logSpacedTimes({ end_s: designTime_s, count: PUMPING_SAMPLES, start_s: designTime_s / 1e4 });
    const samples = times.map((t) => levelsAt(solved, designPoints, t));
    designPoints.forEach((p, i) => {
      const over = samples.map((s) => s[i]!.level_m - p.targetLevel_m);
      const k = over.findIndex((v) => v <= 0);
      if (k < 0) out.pointTimes.set(p, null);
      else if (k === 0) out.pointTimes.set(p, times[0]!);
      else {
        // Linear in log t between the bracketing samples.
        const a = Math.log(times[k - 1]!);
        const b = Math.log(times[k]!);
        const fa = over[k - 1]!;
        const fb = over[k]!;
        out.pointTimes.set(p, Math.exp(a + ((b - a) * fa) / (fa - fb)));
      }
    });
    for (const e of scenario.excavations) {
      const pts = byExcavation.get(e.id) ?? [];
      const own = pts.map((p) => out.pointTimes.get(p) ?? null);
      let timeToTarget_s: number | null = null;
      if (pts.length > 0 && own.every((t) => t !== null)) {
        const f = (t: number) => worstOver(pts, t, (p) => p.targetLevel_m);
        const k = times.findIndex((_, idx) => samples[idx]!.every((r, i) => designPoints[i]!.excavationId !== e.id || r.level_m <= designPoints[i]!.targetLevel_m));
        timeToTarget_s = k <= 0 ? times[0]! : bisectLog(f, times[k - 1]!, times[k]!);
      }
      out.excavations.set(e.id, { timeToTarget_s, recoveryToFormation_s: null, criticalRecoveryToFormation_s: null });
    }
  }

  // Power failure: every pump stops at stop_s.
  const deltas = logSpacedTimes({ end_s: Math.max(100 * stop_s, 1e7), count: RECOVERY_SAMPLES, start_s: 1 });
  const recoveryTime = (pts: ControlPoint[], formation: number): number | null => {
    const f = (dt: number) => -worstOver(pts, stop_s + dt, () => formation, stopped);
    if (f(1e-3) <= 0) return 0;
    let prev = 1e-3;
    for (const dt of deltas) {
      if (f(dt) <= 0) return bisectLog(f, prev, dt);
      prev = dt;
    }
    return null;
  };
  for (const e of scenario.excavations) {
    const pts = byExcavation.get(e.id) ?? [];
    const entry = out.excavations.get(e.id) ?? { timeToTarget_s: null, recoveryToFormation_s: null, criticalRecoveryToFormation_s: null };
    const result = excavations.find((r) => r.id === e.id)!;
    const critical: ControlPoint = { x: result.critical.x, y: result.critical.y, targetLevel_m: result.targetLevel_m, excavationId: e.id, kind: result.critical.kind };
    entry.recoveryToFormation_s = pts.length > 0 ? recoveryTime(pts, e.formationLevel_m) : null;
    entry.criticalRecoveryToFormation_s = recoveryTime([critical], e.formationLevel_m);
    out.excavations.set(e.id, entry);
  }

  // Chart at the critical point of the excavation with the largest shortfall (the least margin).
  const worst = [...excavations].sort((p, q) => q.worstShortfall_m - p.worstShortfall_m)[0];
  if (worst) {
    const point = [worst.critical.x, worst.critical.y] as const;
    const end = Math.max(stop_s, ctx.limitTime_s ?? options.duration_s);
    const pumpingSeries = evaluateSeries({ scenario: solved, point, times_s: logSpacedTimes({ end_s: end, count: 48, start_s: 60 }) });
    const recoveryEnd = Math.max(10 * stop_s, (out.excavations.get(worst.id)?.criticalRecoveryToFormation_s ?? 0) * 3);
    const recoverySeries = evaluateSeries({
      scenario: stopped,
      point,
      times_s: logSpacedTimes({ end_s: recoveryEnd, count: 40, start_s: 1 }).map((dt) => stop_s + dt),
    });
    const formation = scenario.excavations.find((e) => e.id === worst.id)!.formationLevel_m;
    out.series = {
      x: point[0],
      y: point[1],
      excavationId: worst.id,
      targetLevel_m: worst.targetLevel_m,
      formationLevel_m: formation,
      pumping: pumpingSeries.samples.map((s) => ({ time_s: s.time_s, level_m: s.level_m })),
      recovery: [
        { time_s: stop_s, level_m: evaluatePoints({ scenario: stopped, points: [point], time_s: stop_s }).points[0]!.level_m },
        ...recoverySeries.samples.map((s) => ({ time_s: s.time_s, level_m: s.level_m })),
      ],
      stop_s,
    };
  }
  return out;
}
