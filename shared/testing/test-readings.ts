/**
 * Pumping-test readings as the analysis uses them: SI, one row per reading, each with the
 * observation well it was read in and that well's distance from the pumped well.
 */

/** Whether a reading was taken while pumping or after the pump stopped. */
export type TestPhase = 'pumping' | 'recovery';

/** One reading. */
export interface TestReading {
  /** Elapsed time since pumping started, s (> 0). */
  time_s: number;
  /** Drawdown below the static level, m (positive downward). */
  drawdown_m: number;
  /** Observation well (or the pumped well) the reading was taken in. */
  well: string;
  /** Distance of that well from the pumped well's axis, m (the well radius for the pumped well). */
  distance_m: number;
  phase: TestPhase;
  /** Pumping rate at that time, m³/s (step tests; otherwise the test's rate). */
  rate_m3_s: number;
  /** Line in the source file (1-based, the header is line 1), for messages. */
  line: number;
}

/** A pumping test: its readings, the rate and when the pump stopped. */
export interface PumpingTestData {
  readings: TestReading[];
  /** Constant pumping rate, m³/s (step tests: the last step's rate). */
  rate_m3_s: number;
  /** Time the pump stopped, s (null: no recovery readings). */
  stop_s: number | null;
}

/** Readings grouped by well, in time order. */
export function groupReadingsByWell(readings: readonly TestReading[]): Map<string, TestReading[]> {
  const groups = new Map<string, TestReading[]>();
  for (const r of readings) groups.set(r.well, [...(groups.get(r.well) ?? []), r]);
  for (const list of groups.values()) list.sort((a, b) => a.time_s - b.time_s);
  return groups;
}
