/**
 * The floor over time with a given pumping schedule: the safe-dig sequence (deepest safe
 * formation level at each time) and the time after the pumps stop until the head under the
 * floor rises above its allowable level. Heads come from the field engine (superposition in
 * time, Theis 1935), so a stop is the same rate injected from the stop on.
 */
import { evaluatePoints, logSpacedTimes } from '../field';
import type { Excavation, Scenario } from '../schema';
import { safeFormationLevel } from './excavation-floor';
import type { FloorCheckOptions } from './floor-options';

const RECOVERY_SAMPLES = 24;
const BISECTION_STEPS = 30;

type Points = ReadonlyArray<readonly [number, number]>;

/** Highest head among the points at a time (null: steady), m. */
export function highestHead(scenario: Scenario, points: Points, time_s: number | null): number {
  return evaluatePoints({ scenario, points, time_s }).points.reduce((m, r) => Math.max(m, r.level_m), -Infinity);
}

export interface SafeDigOptions {
  scenario: Scenario;
  excavation: Excavation;
  options: FloorCheckOptions;
  /** Points whose highest head governs (the excavation's control points). */
  points: Points;
  times_s: number[];
}

/** Deepest safe formation level at each time (see `safeFormationLevel`), rounded to the millimetre. */
export function safeDigSequence({ scenario, excavation, options, points, times_s }: SafeDigOptions): Array<{ time_s: number; safeFormationLevel_m: number }> {
  return times_s.map((time_s) => ({
    time_s,
    safeFormationLevel_m: Math.round(safeFormationLevel(scenario, excavation, options, highestHead(scenario, points, time_s)) * 1000) / 1000,
  }));
}

export interface TimeAboveOptions {
  /** The scenario with every pump stopping at `stop_s`. */
  stopped: Scenario;
  points: Points;
  stop_s: number;
  level_m: number;
  /** Longest time after the stop that is checked, s. */
  span_s: number;
}

/**
 * First time after the stop when the highest head rises above `level_m`, s; 0 if it already
 * stands above at the stop; null if not within the span. Log-spaced samples, then bisection in
 * log t (heads rise monotonically after a stop).
 */
export function timeUntilHeadAbove({ stopped, points, stop_s, level_m, span_s }: TimeAboveOptions): number | null {
  const over = (dt: number) => highestHead(stopped, points, stop_s + dt) - level_m;
  if (highestHead(stopped, points, stop_s) > level_m) return 0;
  let prev = 1e-3;
  for (const dt of logSpacedTimes({ end_s: span_s, count: RECOVERY_SAMPLES, start_s: 1 })) {
    if (over(dt) > 0) {
      let a = prev;
      let b = dt;
      for (let k = 0; k < BISECTION_STEPS; k++) {
        const m = Math.sqrt(a * b);
        if (over(m) > 0) b = m;
        else a = m;
      }
      return b;
    }
    prev = dt;
  }
  return null;
}
