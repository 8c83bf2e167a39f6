/**
 * The design meets the governing floor check: over a clay plug the uplift level (which stands above
 * formation) is met with the field engine's own evaluation, for less pumping than a dry floor needs.
 * Uplift FS = Σγt / (γw·h_p) with EN 1997-1 Table A.15 recommended factors (required 1.0 / 0.9).
 */
import { describe, expect, it } from 'vitest';
import { Value } from '@sinclair/typebox/value';
import { applyDesignRates, DesignResultSchema, runDesign, type DesignResult } from '../../../shared/design';
import { evaluatePoints } from '../../../shared/field';
import type { Scenario } from '../../../shared/schema';
import clayPlugDemo from '../../../fixtures/demo-clay-plug-confined.json';

const plug = clayPlugDemo as unknown as Scenario;
const withoutGround: Scenario = { ...plug, ground: undefined };

const rates = (s: Scenario, r: DesignResult) => Float64Array.from(s.wells.map((w) => r.wells.find((x) => x.id === w.id)?.rate_m3_s ?? 0));

describe('design over a clay plug', () => {
  it.each(['uniform', 'optimal'] as const)('%s: meets the uplift target above formation, checked by evaluation', async (mode) => {
    const result = await runDesign({ scenario: plug, mode });
    expect(Value.Check(DesignResultSchema, result)).toBe(true);
    const e = result.excavations[0]!;
    expect(result.feasible).toBe(true);
    expect(e.floor?.governing).toBe('uplift');
    expect(e.targetLevel_m).toBeGreaterThan(e.formationLevel_m);
    expect(e.floor!.upliftFS!).toBeGreaterThanOrEqual(e.floor!.requiredUpliftFS! * (1 - 1e-6));

    // Field engine, independently of the design's own verification: the head at every point of a
    // 1 m grid over the pit meets FS ≥ 1.111 (39 kPa of clay over the sand top at 5 m).
    const designed = applyDesignRates(plug, plug.wells.map((w, i) => ({ id: w.id, scenarioIndex: i, start_s: 0 })) as never, rates(plug, result));
    const [x0, y0] = plug.excavations[0]!.outline[0]!;
    const pts: Array<[number, number]> = [];
    for (let i = 0; i <= 30; i++) for (let j = 0; j <= 30; j++) pts.push([x0 + i, y0 + j]);
    const heads = evaluatePoints({ scenario: designed, points: pts, time_s: plug.design.time_s }).points.map((p) => p.level_m);
    const worstFS = Math.min(...heads.map((h) => 39 / (9.81 * (h - 5))));
    expect(worstFS).toBeGreaterThanOrEqual((1 / 0.9) * (1 - 1e-3));
  });

  it('needs less pumping than the same pit taken as a dry floor', async () => {
    const uplift = await runDesign({ scenario: plug, mode: 'optimal' });
    const dry = await runDesign({ scenario: withoutGround, mode: 'optimal' });
    expect(dry.excavations[0]!.floor?.governing).toBe('dry');
    expect(dry.excavations[0]!.targetLevel_m).toBe(6.5);
    expect(uplift.totalRate_m3_s).toBeLessThan(0.8 * dry.totalRate_m3_s);
  });

  it('gives a safe-dig sequence that deepens to formation by the design time, and a time to unsafe', async () => {
    const result = await runDesign({ scenario: plug, mode: 'optimal' });
    const floor = result.excavations[0]!.floor!;
    expect(floor.safeDig.length).toBeGreaterThan(5);
    expect(floor.safeDig.at(-1)!.safeFormationLevel_m).toBeCloseTo(7, 3);
    expect(floor.safeDig[0]!.safeFormationLevel_m).toBeGreaterThan(7);
    expect(floor.timeToUnsafe_s).not.toBeNull();
  });
});
