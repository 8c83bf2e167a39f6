/**
 * The power-failure model of a design: every pump stops in the design state — at the design time
 * for a transient design, at the steady state for a steady one — and the levels recover from
 * there (superposition in time, Theis 1935: the stop is an injection of the same rates).
 *
 * A steady design used to stop its pumps after the whole pumping duration of the transient model,
 * where levels stand far below the steady design state; its recovery then took hours instead of
 * minutes. Both kinds now start from the levels the design produces.
 */
import { evaluatePoints, steadyRecovery } from '../field';
import { DrydigError } from '../schema';
import { applyDesignRates, type DesignContext } from './design-context';

type Points = ReadonlyArray<readonly [number, number]>;

/** Levels after the stop, from the design state. */
export interface DesignRecovery {
  /** Time the pumps stop, s since pumping started; null: a steady design (they stop at the steady state). */
  stop_s: number | null;
  /** Levels at the points a time after the stop, m (0: the design state). */
  levelsAt: (points: Points, sinceStop_s: number) => number[];
}

/** The recovery model, or a reason (in words) why there is none. */
export type DesignRecoveryModel = { ok: true; recovery: DesignRecovery } | { ok: false; reason: string };

/** The power-failure model for the chosen rates. */
export function designRecovery(ctx: DesignContext, rates: Float64Array): DesignRecoveryModel {
  const { scenario, wells, designTime_s } = ctx;
  if (designTime_s !== null) {
    const stopped = applyDesignRates(scenario, wells, rates, designTime_s);
    return {
      ok: true,
      recovery: { stop_s: designTime_s, levelsAt: (points, dt) => evaluatePoints({ scenario: stopped, points, time_s: designTime_s + dt }).points.map((p) => p.level_m) },
    };
  }
  try {
    const recover = steadyRecovery(applyDesignRates(scenario, wells, rates));
    return { ok: true, recovery: { stop_s: null, levelsAt: (points, dt) => recover(points, dt).map((p) => p.level_m) } };
  } catch (e) {
    // A steady design needs no storage; its recovery does. Say which field is missing.
    if (e instanceof DrydigError) return { ok: false, reason: e.message };
    throw e;
  }
}
