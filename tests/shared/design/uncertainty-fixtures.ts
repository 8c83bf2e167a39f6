/** Invented sites for the uncertainty tests (issue 11 items 1–3). */
import { generateControlPoints } from '../../../shared/design';
import { evaluatePoints } from '../../../shared/field';
import type { Scenario } from '../../../shared/schema';
import { ringScenario } from './design-test-helpers';

/**
 * Six deep wells on a 14 m ring around a 10 m hexagonal pit; confined, steady (Thiem) with a fixed
 * radius of influence of 500 m, so the drawdown per unit rate is exactly ∝ 1/T and the least flow
 * meeting a target is exactly ∝ T (and ∝ K). Target 6.5 m: 3.5 m of drawdown, well inside every
 * well's Sichardt capacity even at K × 4.
 */
export function thiemRingScenario(): Scenario {
  const s = ringScenario({ kind: 'confined', n: 6, ringRadius_m: 14, pitRadius_m: 10 });
  return { ...s, excavations: s.excavations.map((e) => ({ ...e, formationLevel_m: 7 })) };
}

/**
 * Highest level above target over a grid four times as dense as the design's control points (twice
 * as dense as its check grid, so this is an independent check), evaluated by the field engine with
 * the given rates, optionally one well out and K scaled.
 */
export function pitLevels(scenario: Scenario, rates: Map<string, number>, without: string | null = null, kFactor = 1): { worstAbove_m: number; points: number } {
  const target = scenario.excavations[0]!.formationLevel_m - scenario.excavations[0]!.margin_m;
  const points = generateControlPoints({ excavations: scenario.excavations, spacing_m: null, densify: 4 });
  const solved: Scenario = {
    ...scenario,
    aquifer: { ...scenario.aquifer, conductivity_m_s: scenario.aquifer.conductivity_m_s * kFactor },
    wells: scenario.wells.map((w) => {
      const { schedule: _s, ...rest } = w;
      return { ...rest, rate_m3_s: w.id === without ? 0 : (rates.get(w.id) ?? 0), active: w.id !== without };
    }),
  };
  const levels = evaluatePoints({ scenario: solved, points: points.map((p) => [p.x, p.y] as const), time_s: scenario.design.time_s }).points;
  return { worstAbove_m: Math.max(...levels.map((p) => p.level_m - target)), points: points.length };
}
