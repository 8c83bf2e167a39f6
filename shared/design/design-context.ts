/**
 * What the design steps share: the scenario, options, design wells, and the unit responses of
 * the design wells (staged starts honoured), plus the scenario with the design rates applied.
 */
import { levelFromPotentialDrawdown, potentialDrawdownForLevel, unitResponseMatrix } from '../field';
import type { DesignMode, Excavation, Scenario, Well } from '../schema';
import type { ExcavationFloor } from '../floor';
import type { ResolvedDesignOptions } from './design-options';
import type { DesignWell } from './well-limits';

/** Everything the later steps share. */
export interface DesignContext {
  scenario: Scenario;
  options: ResolvedDesignOptions;
  mode: DesignMode;
  wells: DesignWell[];
  /** A copy of the scenario with every well inactive: unit responses carry no background. */
  matrixScenario: Scenario;
  designTime_s: number | null;
  limitTime_s: number | null;
  variableForLevel: (level_m: number) => number;
  levelForVariable: (v: number) => number;
  /** The floor of each excavation by id: its ground and the governing target (pit-floor checks). */
  floors: Map<string, ExcavationFloor>;
  /** Target level of an excavation: the level its governing floor check sets, m. */
  targetOf: (excavation: Excavation) => number;
  /** Rates checked as they stand instead of solved (one per design well, m³/s); absent: solve. */
  fixedRates?: Float64Array;
}

/** Variable (drawdown or s_c) at points per 1 m³/s of each design well, at time_s, staged starts honoured. nP × nW. */
export function designResponse(ctx: DesignContext, points: ReadonlyArray<readonly [number, number]>, time_s: number | null): Float64Array {
  const nW = ctx.wells.length;
  const out = new Float64Array(points.length * nW);
  if (nW === 0 || points.length === 0) return out;
  const groups = new Map<number, number[]>();
  ctx.wells.forEach((w, j) => {
    const start = time_s === null ? 0 : w.start_s;
    groups.set(start, [...(groups.get(start) ?? []), j]);
  });
  for (const [start, cols] of groups) {
    const elapsed = time_s === null ? null : time_s - start;
    if (elapsed !== null && !(elapsed > 0)) continue;
    const m = unitResponseMatrix({ scenario: ctx.matrixScenario, points, time_s: elapsed, wellIds: cols.map((j) => ctx.wells[j]!.id) });
    const k = cols.length;
    for (let p = 0; p < points.length; p++) for (let c = 0; c < k; c++) out[p * nW + cols[c]!] = m.values[p * k + c]!;
  }
  return out;
}

/** The scenario with the design rates set: design wells pump from their start, others are off. */
export function applyDesignRates(scenario: Scenario, wells: DesignWell[], rates: Float64Array, stopAt_s: number | null = null): Scenario {
  const byIndex = new Map(wells.map((w, j) => [w.scenarioIndex, j] as const));
  return {
    ...scenario,
    wells: scenario.wells.map((w, i): Well => {
      const { rate_m3_s: _r, schedule: _s, ...rest } = w;
      const j = byIndex.get(i);
      const q = j === undefined ? 0 : rates[j]!;
      // Injection wells carry negative rates; only a zero (or no) rate leaves a well off.
      if (j === undefined || !(Math.abs(q) > 0)) return { ...rest, active: false };
      const start = wells[j]!.start_s;
      if (stopAt_s !== null) {
        return { ...rest, active: true, schedule: [{ from_s: start, rate_m3_s: q }, { from_s: Math.max(stopAt_s, start + 1e-6), rate_m3_s: 0 }] };
      }
      if (start > 0) return { ...rest, active: true, schedule: [{ from_s: start, rate_m3_s: q }] };
      return { ...rest, active: true, rate_m3_s: q };
    }),
  };
}

/** Level ↔ superposed variable for the scenario's aquifer (exact; unconfined below base → Infinity). */
export function variableConversions(scenario: Scenario): Pick<DesignContext, 'variableForLevel' | 'levelForVariable'> {
  const a = scenario.aquifer;
  return {
    // No rate lowers groundwater below the aquifer base (confined: the aquifer drains there).
    variableForLevel: (level_m) => (level_m < a.base_m ? Infinity : potentialDrawdownForLevel({ aquifer: a, level_m })),
    levelForVariable: (v) => levelFromPotentialDrawdown({ aquifer: a, potentialDrawdown_m: v }),
  };
}

/** Row `row` of a row-major nP × nW response matrix times the rates: the superposed variable there. */
export function responseDot(matrix: Float64Array, row: number, nW: number, rates: Float64Array): number {
  let s = 0;
  for (let j = 0; j < nW; j++) s += matrix[row * nW + j]! * rates[j]!;
  return s;
}

/** x, y of a point as a tuple (the field engine's point form). */
export const pointXY = (p: { x: number; y: number }) => [p.x, p.y] as const;
