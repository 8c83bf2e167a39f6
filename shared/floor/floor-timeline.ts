/**
 * The floor over time with a given pumping schedule: the safe-dig sequence (deepest safe
 * formation level at each time) and the time after the pumps stop until the head under the
 * floor rises above its allowable level. Heads come from the field engine (superposition in
 * time, Theis 1935), so a stop is the same rate injected from the stop on.
 */
import { evaluatePoints, firstPassageTime } from '../field';
import type { Excavation, Scenario } from '../schema';
import { safeLevelFinder } from './excavation-floor';
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
  /** Times since pumping started, s; null: the steady state. */
  times_s: Array<number | null>;
}

/**
 * Deepest safe formation level at each time (see `safeFormationLevel`), rounded to the millimetre;
 * a time of null is the steady state (one step for a steady design).
 */
export function safeDigSequence({ scenario, excavation, options, points, times_s }: SafeDigOptions): Array<{ time_s: number | null; safeFormationLevel_m: number }> {
  const safeLevel = safeLevelFinder(scenario, excavation, options);
  return times_s.map((time_s) => ({ time_s, safeFormationLevel_m: Math.round(safeLevel(highestHead(scenario, points, time_s)) * 1000) / 1000 }));
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
 * stands above at the stop; null if not within the span (heads rise monotonically after a stop).
 */
export function timeUntilHeadAbove({ stopped, points, stop_s, level_m, span_s }: TimeAboveOptions): number | null {
  return timeUntilLevelAbove({ levelsAt: (pts, dt) => evaluatePoints({ scenario: stopped, points: pts, time_s: stop_s + dt }).points.map((r) => r.level_m), points, level_m, span_s });
}

export interface TimeUntilLevelAboveOptions {
  /** Levels at points a time after the stop, m (0: the state at the stop) — e.g. a design's recovery model. */
  levelsAt: (points: Points, sinceStop_s: number) => number[];
  points: Points;
  level_m: number;
  /** Longest time after the stop that is checked, s. */
  span_s: number;
}

/** As `timeUntilHeadAbove`, for any recovery model (a steady design recovers from its steady state). */
export function timeUntilLevelAbove({ levelsAt, points, level_m, span_s }: TimeUntilLevelAboveOptions): number | null {
  return firstPassageTime({ reached: (dt) => Math.max(...levelsAt(points, dt)) > level_m, start_s: 1, end_s: span_s, samples: RECOVERY_SAMPLES, bisections: BISECTION_STEPS });
}
