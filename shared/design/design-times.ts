/**
 * Times for the chosen rates: when each control point and each whole excavation first reaches
 * its target; and, if every pump stops in the design state (power failure), how long until the
 * groundwater at the excavation's critical point is back at formation level — the figure that
 * sets standby pumps and generators.
 *
 * The stop happens in the design state: at the design time for a transient design, at the steady
 * state for a steady one (`design-recovery.ts`). First-passage times come from the one helper
 * `firstPassageTime` (log-spaced samples, bisection in log t; levels are monotone in time).
 * Where the figure does not apply (infeasible design, target not met, head held above formation)
 * the excavation carries no figure and a note that says why.
 */
import { evaluatePoints, evaluateSeries, firstPassageTime, logSpacedTimes } from '../field';
import type { ControlPoint } from './control-points';
import type { DesignExcavationResult, DesignTimeSeries } from './design-result';
import { applyDesignRates, pointXY, type DesignContext } from './design-context';
import { designRecovery } from './design-recovery';
import { RECOVERY_NOTES } from './design-wording';

const PUMPING_SAMPLES = 16;
const RECOVERY_SAMPLES = 24;
const BISECTION_STEPS = 30;

export interface DesignTimes {
  excavations: Map<string, Pick<DesignExcavationResult, 'timeToTarget_s' | 'recoveryToFormation_s' | 'recoveryNote'>>;
  pointTimes: Map<ControlPoint, number | null>;
  series: DesignTimeSeries | null;
  /** Time the pumps stop in the recovery check, s; null: a steady design (they stop at the steady state). */
  stop_s: number | null;
}

export interface ComputeTimesOptions {
  ctx: DesignContext;
  rates: Float64Array;
  designPoints: ControlPoint[];
  excavations: DesignExcavationResult[];
  /** The verified design is feasible (a power-failure figure is given only then). */
  feasible: boolean;
}

/** Longest time after a stop that the recovery checks look at, s. */
export function recoverySpan(stop_s: number | null): number {
  return Math.max(100 * (stop_s ?? 0), 1e7);
}

/** Times to target, recovery times and the level–time chart at the most critical point. */
export function computeTimes({ ctx, rates, designPoints, excavations, feasible }: ComputeTimesOptions): DesignTimes {
  const { scenario, wells, designTime_s, options } = ctx;
  const out: DesignTimes = { excavations: new Map(), pointTimes: new Map(), series: null, stop_s: designTime_s };
  const pumping = rates.some((q) => q > 0);
  if (!pumping || scenario.excavations.length === 0) return out;
  const solved = applyDesignRates(scenario, wells, rates);
  const byExcavation = new Map<string, ControlPoint[]>();
  for (const p of designPoints) if (p.excavationId !== null) byExcavation.set(p.excavationId, [...(byExcavation.get(p.excavationId) ?? []), p]);

  const levelsAt = (pts: ControlPoint[], t: number) => evaluatePoints({ scenario: solved, points: pts.map(pointXY), time_s: t }).points;

  // Time to target (transient designs only: a steady design has no time).
  if (designTime_s !== null) {
    const times = logSpacedTimes({ end_s: designTime_s, count: PUMPING_SAMPLES, start_s: designTime_s / 1e4 });
    const samples = times.map((t) => levelsAt(designPoints, t));
    // The excavation's first passage samples the same times: read them from here.
    const sampled = new Map(times.map((t, k) => [t, samples[k]!] as const));
    const indexOf = new Map(designPoints.map((p, i) => [p, i] as const));
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
      const timeToTarget_s =
        pts.length > 0 && own.every((t) => t !== null)
          ? firstPassageTime({
              reached: (t) => {
                const known = sampled.get(t);
                if (known) return pts.every((p) => known[indexOf.get(p)!]!.level_m <= p.targetLevel_m);
                return t > 0 && levelsAt(pts, t).every((r, i) => r.level_m <= pts[i]!.targetLevel_m);
              },
              start_s: times[0]!,
              end_s: designTime_s,
              samples: PUMPING_SAMPLES,
              bisections: 12,
            })
          : null;
      out.excavations.set(e.id, { timeToTarget_s, recoveryToFormation_s: null, recoveryNote: null });
    }
  }

  // Power failure: every pump stops in the design state; one figure per excavation, at its critical point.
  const recoveryModel = designRecovery(ctx, rates);
  const recovery = recoveryModel.ok ? recoveryModel.recovery : null;
  const span_s = recoverySpan(out.stop_s);
  for (const e of scenario.excavations) {
    const entry = out.excavations.get(e.id) ?? { timeToTarget_s: null, recoveryToFormation_s: null, recoveryNote: null };
    const result = excavations.find((r) => r.id === e.id)!;
    const note = !result.met
      ? RECOVERY_NOTES.notMet
      : !feasible
        ? RECOVERY_NOTES.infeasible
        : result.critical.level_m >= e.formationLevel_m
          ? RECOVERY_NOTES.aboveFormation
          : !recoveryModel.ok
            ? RECOVERY_NOTES.noStorage(recoveryModel.reason)
            : null;
    if (note === null && recovery) {
      const point = [pointXY(result.critical)];
      const t = firstPassageTime({ reached: (dt) => recovery.levelsAt(point, dt)[0]! >= e.formationLevel_m, start_s: 1, end_s: span_s, samples: RECOVERY_SAMPLES, bisections: BISECTION_STEPS });
      entry.recoveryToFormation_s = t;
      entry.recoveryNote = t === null ? RECOVERY_NOTES.beyondSpan(span_s) : null;
    } else {
      entry.recoveryToFormation_s = null;
      entry.recoveryNote = note;
    }
    out.excavations.set(e.id, entry);
  }

  // Chart at the critical point of the excavation with the largest shortfall (the least margin).
  const worst = [...excavations].sort((p, q) => q.worstShortfall_m - p.worstShortfall_m)[0];
  if (worst) {
    const point = [worst.critical.x, worst.critical.y] as const;
    const end = Math.max(out.stop_s ?? 0, ctx.limitTime_s ?? options.duration_s);
    const pumpingSeries = evaluateSeries({ scenario: solved, point, times_s: logSpacedTimes({ end_s: end, count: 48, start_s: 60 }) });
    // Steady designs: three times the recovery (at least 10 min); the superposed cone means little later on.
    const recoveryEnd = Math.max(out.stop_s === null ? 600 : 10 * out.stop_s, (out.excavations.get(worst.id)?.recoveryToFormation_s ?? 0) * 3);
    const formation = scenario.excavations.find((e) => e.id === worst.id)!.formationLevel_m;
    const offset = out.stop_s ?? 0;
    out.series = {
      x: point[0],
      y: point[1],
      excavationId: worst.id,
      targetLevel_m: worst.targetLevel_m,
      formationLevel_m: formation,
      pumping: pumpingSeries.samples.map((s) => ({ time_s: s.time_s, level_m: s.level_m })),
      recovery: recovery
        ? [0, ...logSpacedTimes({ end_s: recoveryEnd, count: 40, start_s: 1 })].map((dt) => ({ time_s: offset + dt, level_m: recovery.levelsAt([point], dt)[0]! }))
        : [],
      stop_s: out.stop_s,
    };
  }
  return out;
}
