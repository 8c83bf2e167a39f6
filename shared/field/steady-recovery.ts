/**
 * Recovery of a steady cone after every pump stops: the steady field at the stop, and from then
 * on an injection of the same rates (superposition in time, Theis 1935). The superposed variable
 * (drawdown s, or the discharge-potential drawdown s_c when unconfined) at a time t′ after the stop:
 *
 *   s′(r, t′) = s_steady(r) − Σ_i Q_i/(4πT)·W(u_i(t′)),   u_i = r_i²S/(4Tt′)
 *
 * with every image well of the boundaries in both terms (Hantush–Jacob W(u, r/B) when leaky, the
 * partial-penetration correction in both). Where the steady state is the late limit of the
 * transient model (constant-head boundaries, leakage) this is exact superposition. Where the steady
 * cone has a radius of influence R (Thiem, Dupuit–Thiem, Sichardt's R), the injection term is not
 * limited by R: by Cooper–Jacob s′ = Q/(4πT)·ln(t_p/t′) with t_p = R²S/(2.25T), faster than the
 * recovery after pumping t_p from rest, Q/(4πT)·ln((t_p + t′)/t′) — the earlier figure, on the
 * safe side for standby power. Late (t′ near t_p) levels may rise above the static level: that
 * part of the curve means nothing.
 */
import type { Scenario, Well } from '../schema';
import { checkPoints, evaluatePreparedPoint } from './evaluate-points';
import { flagsFromBits, interpretSum } from './interpret-sum';
import { prepareField, type PreparedField } from './prepare-field';
import { getWellRateAt } from './rate-steps';
import { FLAG_BITS, type PointResult } from './types';

/** Levels at plan points a time after the stop, from the steady state. */
export type SteadyRecovery = (points: ReadonlyArray<readonly [number, number]>, sinceStop_s: number) => PointResult[];

/** The scenario with every well at its steady (final) rate from t = 0: the injection that the stop adds. */
function steadyRatesFromZero(scenario: Scenario): Scenario {
  return {
    ...scenario,
    wells: scenario.wells.map((w): Well => {
      const { schedule: _s, rate_m3_s: _r, ...rest } = w;
      return { ...rest, rate_m3_s: getWellRateAt(w, null) };
    }),
  };
}

/**
 * Prepares the recovery from the steady state of `scenario` (rates as in a steady evaluation).
 * `sinceStop_s` ≤ 0 gives the steady levels themselves.
 *
 * @throws DrydigError naming the field when the aquifer lacks what a transient run needs
 *   (storativity, specific yield) — checked here, not on the first call
 */
export function steadyRecovery(scenario: Scenario): SteadyRecovery {
  const steady = prepareField({ scenario, time_s: null });
  const injection = steadyRatesFromZero(scenario);
  // Fails now, naming /aquifer/storativity or /aquifer/specificYield, if storage is missing.
  prepareField({ scenario: injection, time_s: 1 });
  return (points, sinceStop_s) => {
    checkPoints(points);
    const later: PreparedField | null = sinceStop_s > 0 ? prepareField({ scenario: injection, time_s: sinceStop_s }) : null;
    return points.map(([x, y]) => {
      const a = evaluatePreparedPoint(steady, x, y);
      if (later === null || a.flags.includes('beyond-boundary')) {
        const { sum: _sum, ...steadyResult } = a;
        return { ...steadyResult, time_s: sinceStop_s };
      }
      const b = evaluatePreparedPoint(later, x, y);
      const out = interpretSum(steady.model, a.sum - b.sum, { level_m: 0, drawdown_m: 0, flagBits: 0 });
      let bits = out.flagBits;
      if (a.flags.includes('within-well-radius')) bits |= FLAG_BITS['within-well-radius'];
      return { x, y, time_s: sinceStop_s, level_m: out.level_m, drawdown_m: out.drawdown_m, flags: flagsFromBits(bits) };
    });
  };
}
