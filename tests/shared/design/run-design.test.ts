import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { Value } from '@sinclair/typebox/value';
import { runDesign, applyDesignRates, DesignResultSchema, type DesignResult } from '../../../shared/design';
import { evaluatePoints } from '../../../shared/field';
import { isPointInPolygon } from '../../../shared/geometry';
import type { Scenario } from '../../../shared/schema';
import { expectClose, pointsInside, ringScenario, singleWellScenario } from './design-test-helpers';

const reference = JSON.parse(readFileSync(new URL('./reference/design-reference.json', import.meta.url), 'utf8'));
const fixture = (name: string): Scenario => JSON.parse(readFileSync(new URL(`../../../fixtures/${name}.json`, import.meta.url), 'utf8'));

/** The well-point demo with the header in a 1.5 m trench, so suction lift does not bind. */
function wellpointDemoInTrench(): Scenario {
  const s = fixture('demo-wellpoints-unconfined');
  return { ...s, designOptions: { headerLevel_m: 10.5 } } as Scenario;
}

/**
 * The acceptance check, independent of the solver's own control points: evaluate the solved rates
 * with the field engine on a fine grid inside each excavation; every level must be at or below
 * target + 1 cm, and the highest must lie within 1 cm of the target (the target binds).
 */
function checkReachesTargets(scenario: Scenario, result: DesignResult) {
  const wells = scenario.wells
    .map((w, scenarioIndex) => ({ w, scenarioIndex }))
    .filter(({ w }) => result.wells.some((r) => r.id === w.id))
    .map(({ w, scenarioIndex }) => ({ id: w.id, scenarioIndex, start_s: result.wells.find((r) => r.id === w.id)!.start_s }));
  const rates = Float64Array.from(wells, (w) => result.wells.find((r) => r.id === w.id)!.rate_m3_s);
  const solved = applyDesignRates(scenario, wells as never, rates);
  for (const e of scenario.excavations) {
    const pts = pointsInside(e.outline, 40, (x, y) => isPointInPolygon(x, y, e.outline));
    const levels = evaluatePoints({ scenario: solved, points: pts, time_s: scenario.design.time_s }).points.map((p) => p.level_m);
    const target = e.formationLevel_m - e.margin_m;
    const highest = Math.max(...levels);
    expect(highest, `highest level in ${e.id}`).toBeLessThanOrEqual(target + 0.01);
    expect(highest, `highest level in ${e.id} (binding)`).toBeGreaterThanOrEqual(target - 0.01);
    const ex = result.excavations.find((r) => r.id === e.id)!;
    expect(ex.met).toBe(true);
    expect(ex.worstShortfall_m).toBeLessThanOrEqual(0);
    expectClose(ex.critical.level_m, target, { abs: 0.01 }, 'critical level');
  }
}

describe('runDesign on a symmetric ring (closed form by the ring product identity)', () => {
  // Expected totals: tests/shared/design/reference/design-reference.py (mpmath), Thiem (1906) and
  // Dupuit–Thiem superposition with prod_k |z − a·w^k| = |z^N − a^N|.
  const cases = [
    { kind: 'confined' as const, expected: reference.ringConfinedSteady.total_m3_s },
    { kind: 'unconfined' as const, expected: reference.ringUnconfinedSteady.total_m3_s },
  ];
  it.each(cases)('per-well optimum of a $kind ring equals the closed-form least total rate', async ({ kind, expected }) => {
    const scenario = ringScenario({ kind, n: 8, ringRadius_m: 20, pitRadius_m: 12 });
    const result = await runDesign({ scenario, mode: 'optimal' });
    expect(result.feasible).toBe(true);
    expectClose(result.totalRate_m3_s, expected, { rel: 1e-6 }, 'total rate');
    checkReachesTargets(scenario, result);
  });
  it.each(cases)('uniform rate of a $kind ring equals the closed form, at a vertex between wells', async ({ kind, expected }) => {
    const scenario = ringScenario({ kind, n: 8, ringRadius_m: 20, pitRadius_m: 12 });
    const result = await runDesign({ scenario, mode: 'uniform' });
    expect(result.feasible).toBe(true);
    for (const w of result.wells) expectClose(w.rate_m3_s, expected / 8, { rel: 1e-9 }, w.id);
    expect(result.excavations[0]!.critical.kind).toBe('vertex');
    expectClose(Math.hypot(result.excavations[0]!.critical.x, result.excavations[0]!.critical.y), 12, { abs: 1e-9 });
  });
});

describe('runDesign on one well pumping a confined aquifer (Theis)', () => {
  const ref = reference.singleWellTheis;
  it('sets the rate that brings the farthest vertex to the target at the design time', async () => {
    // Reference: q = 4πT·s / E1(r²S/(4Tt)), mpmath (design-reference.py).
    const result = await runDesign({ scenario: singleWellScenario(), mode: 'uniform' });
    expect(result.feasible).toBe(true);
    expectClose(result.totalRate_m3_s, ref.rate_m3_s, { rel: 1e-6 });
    expect(result.excavations[0]!.critical).toMatchObject({ x: 11, kind: 'vertex' });
  });
  it('gives the same rate in optimal and layout modes (one well: nothing to choose)', async () => {
    for (const mode of ['optimal', 'layout'] as const) {
      const result = await runDesign({ scenario: singleWellScenario(), mode });
      expectClose(result.totalRate_m3_s, ref.rate_m3_s, { rel: 1e-6 }, mode);
    }
  });
  it('reports the time each point first reaches its target', async () => {
    // Theis: the same drawdown at the same u, so t_i = t·(r_i/r)²; reference values from mpmath.
    const result = await runDesign({ scenario: singleWellScenario(), mode: 'uniform' });
    const ex = result.excavations[0]!;
    expectClose(ex.timeToTarget_s!, ref.farVertexTimeToTarget_s, { rel: 1e-3 }, 'whole excavation');
    const near = result.controlPoints.find((p) => p.x === 9 && p.y === 1)!;
    // Per-point times interpolate linearly in log t between 16 samples: within 2 %.
    expectClose(near.timeToTarget_s!, ref.nearVertexTimeToTarget_s, { rel: 0.02 }, 'near vertex');
  });
  it('reports the recovery to formation level when every pump stops at the design time', async () => {
    // Theis recovery by superposition; reference root found with mpmath (design-reference.py).
    const result = await runDesign({ scenario: singleWellScenario(), mode: 'uniform' });
    // One figure, at the critical point (the farthest vertex from the well).
    expectClose(result.excavations[0]!.recoveryToFormation_s!, ref.recoveryToFormation_s, { rel: 2e-3 });
    expect(result.excavations[0]!.recoveryNote).toBeNull();
    const series = result.timeSeries!;
    expect(series.recovery[0]!.time_s).toBe(86400);
    expect(series.recovery.at(-1)!.level_m).toBeGreaterThan(series.formationLevel_m);
  });
});

describe('runDesign on the demo sites', () => {
  const cases = [
    { name: 'confined deep wells', scenario: () => fixture('demo-deepwells-confined') },
    { name: 'unconfined well points (header in a trench)', scenario: wellpointDemoInTrench },
  ];
  for (const mode of ['uniform', 'optimal', 'layout'] as const) {
    it.each(cases)(`${mode}: the engine's evaluation of the solved rates reaches every target within 1 cm, binding ($name)`, { timeout: 120_000 }, async ({ scenario }) => {
      const s = scenario();
      const result = await runDesign({ scenario: s, mode });
      expect(result.feasible, JSON.stringify(result.reasons)).toBe(true);
      expect(Value.Check(DesignResultSchema, result)).toBe(true);
      checkReachesTargets(s, result);
      for (const w of result.wells) {
        if (w.rate_m3_s === 0) continue;
        expect(w.pumpingLevel_m).toBeGreaterThanOrEqual(w.minimumPumpingLevel_m);
        expect(w.rate_m3_s).toBeLessThanOrEqual(w.capacity_m3_s * (1 + 1e-9));
      }
    });
  }

  it('flags unconfined points drawn down more than about 25 % of the saturated thickness', async () => {
    // Ring pit drawn from 10 m to a target of −1.5 m over a 30 m saturated thickness: 11.5 m, 38 %.
    const s = ringScenario({ kind: 'unconfined', n: 8, ringRadius_m: 20, pitRadius_m: 12 });
    s.excavations = [{ ...s.excavations[0]!, formationLevel_m: -1, margin_m: 0.5 }];
    const result = await runDesign({ scenario: s, mode: 'uniform' });
    expect(result.cautions.some((c) => /more than about 25 % of the saturated thickness/.test(c))).toBe(true);
    expect(result.controlPoints.some((p) => p.flags.includes('large-drawdown'))).toBe(true);
  });

  it('per-well optimum pumps no more in total than the uniform rate', async () => {
    for (const make of [() => fixture('demo-deepwells-confined'), wellpointDemoInTrench]) {
      const uniform = await runDesign({ scenario: make(), mode: 'uniform' });
      const optimal = await runDesign({ scenario: make(), mode: 'optimal' });
      expect(optimal.totalRate_m3_s).toBeLessThanOrEqual(uniform.totalRate_m3_s * (1 + 1e-6));
    }
  });

  it('one well out of service: the shortfall matches the engine with that well switched off', async () => {
    const s = fixture('demo-deepwells-confined');
    const result = await runDesign({ scenario: s, mode: 'optimal', options: { outOfServiceWell: 'DW1' } });
    const oos = result.outOfService!;
    expect(oos).toMatchObject({ wellId: 'DW1', chosenBy: 'option' });
    const rates = Float64Array.from(result.wells, (w) => (w.id === 'DW1' ? 0 : w.rate_m3_s));
    const wells = result.wells.map((w) => ({ id: w.id, scenarioIndex: s.wells.findIndex((x) => x.id === w.id), start_s: 0 }));
    const e = s.excavations[0]!;
    const pts = pointsInside(e.outline, 30, (x, y) => isPointInPolygon(x, y, e.outline));
    const levels = evaluatePoints({ scenario: applyDesignRates(s, wells as never, rates), points: pts }).points.map((p) => p.level_m);
    const worst = Math.max(...levels) - (e.formationLevel_m - e.margin_m);
    expectClose(oos.worstShortfall_m, worst, { abs: 0.01 });
    expect(oos.met).toBe(worst <= 0);
  });
});

describe('runDesign with a staged start and other aquifer kinds', () => {
  it('honours wells switched on later: the staged schedule reaches every target at the design time', async () => {
    const s = fixture('demo-deepwells-confined');
    const result = await runDesign({ scenario: s, mode: 'optimal', options: { stages: [{ wellIds: ['DW5', 'DW6'], start_s: 2 * 86400 }] } });
    expect(result.feasible, JSON.stringify(result.reasons)).toBe(true);
    expect(result.wells.find((w) => w.id === 'DW5')!.start_s).toBe(2 * 86400);
    checkReachesTargets(s, result);
  });

  it('designs a leaky aquifer (Hantush–Jacob) that the engine then confirms', async () => {
    const s = singleWellScenario();
    s.aquifer = { ...s.aquifer, kind: 'leaky', leakageFactor_m: 300 };
    const result = await runDesign({ scenario: s, mode: 'optimal' });
    expect(result.feasible).toBe(true);
    checkReachesTargets(s, result);
  });

  it('designs a steady unconfined ring and reports no time to target but a recovery time', async () => {
    const s = ringScenario({ kind: 'unconfined', n: 8, ringRadius_m: 20, pitRadius_m: 12 });
    const result = await runDesign({ scenario: s, mode: 'optimal' });
    expect(result.excavations[0]!.timeToTarget_s).toBeNull();
    expect(result.excavations[0]!.recoveryToFormation_s).toBeGreaterThan(0);
    expect(result.summary.initialRate_m3_s).toBeCloseTo(result.totalRate_m3_s * 1.3, 12);
    expect(result.cautions.some((c) => /UFC 3-220-05/.test(c))).toBe(true);
  });
});
