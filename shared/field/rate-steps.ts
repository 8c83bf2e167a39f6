/**
 * Pumping history of a well as superposition sources in time: each rate change is a new source
 * of the rate increment ΔQ starting then (principle of superposition in time; recovery after a
 * stop is the drawdown of the running well plus that of an injection well of equal rate started
 * at the stop — Theis 1935).
 */
import type { Well } from '../schema';

/** One superposition source in time: a constant rate increment from `from_s` on. */
export interface RateStep {
  /** Time the increment starts, s after the start of pumping. */
  from_s: number;
  /** Rate increment ΔQ, m³/s (+ abstraction). */
  deltaRate_m3_s: number;
}

/**
 * The rate increments of a well, in time order, without zero increments.
 * A well with `active: false`, or with neither `rate_m3_s` nor `schedule`, has none.
 */
export function getWellRateSteps(well: Well): RateStep[] {
  if (well.active === false) return [];
  if (well.schedule && well.schedule.length > 0) {
    const steps: RateStep[] = [];
    let previous = 0;
    for (const s of well.schedule) {
      const delta = s.rate_m3_s - previous;
      if (delta !== 0) steps.push({ from_s: s.from_s, deltaRate_m3_s: delta });
      previous = s.rate_m3_s;
    }
    return steps;
  }
  if (well.rate_m3_s !== undefined && well.rate_m3_s !== 0) return [{ from_s: 0, deltaRate_m3_s: well.rate_m3_s }];
  return [];
}

/**
 * The rate a well pumps at a time, m³/s: the last schedule step starting at or before `time_s`
 * (rate_m3_s from t = 0 for a constant-rate well). `time_s` null: the final rate (steady runs).
 * Before the first step, and for an inactive well, 0.
 */
export function getWellRateAt(well: Well, time_s: number | null): number {
  if (well.active === false) return 0;
  if (well.schedule && well.schedule.length > 0) {
    if (time_s === null) return well.schedule[well.schedule.length - 1]!.rate_m3_s;
    let rate = 0;
    for (const s of well.schedule) {
      if (s.from_s <= time_s) rate = s.rate_m3_s;
      else break;
    }
    return rate;
  }
  if (well.rate_m3_s === undefined) return 0;
  if (time_s === null) return well.rate_m3_s;
  return time_s >= 0 ? well.rate_m3_s : 0;
}
