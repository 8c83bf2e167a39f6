import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runDesign } from '../../../shared/design';
import type { Scenario } from '../../../shared/schema';
import { ringScenario, singleWellScenario } from './design-test-helpers';

const fixture = (name: string): Scenario => JSON.parse(readFileSync(new URL(`../../../fixtures/${name}.json`, import.meta.url), 'utf8'));
const codes = (r: { reasons: Array<{ code: string }> }) => r.reasons.map((x) => x.code);

describe('runDesign when the target cannot be reached', () => {
  it('names the suction-lift limit: well points with the header at ground cannot lift to the target', async () => {
    // Header 12 m, limit 5.5 m (common practice): pumping level ≥ 6.5 m, the same as the target,
    // so the level between the well points cannot fall to it.
    const atGround = { ...fixture('demo-wellpoints-unconfined'), designOptions: { headerLevel_m: 12.0 } } as Scenario;
    const result = await runDesign({ scenario: atGround, mode: 'optimal' });
    expect(result.feasible).toBe(false);
    expect(codes(result)).toContain('suction-lift');
    expect(result.excavations[0]!.met).toBe(false);
    expect(result.excavations[0]!.worstShortfall_m).toBeGreaterThan(0);
    expect(result.excavations[0]!.pointsAboveTarget).toBeGreaterThan(0);
    expect(result.reasons.some((r) => /check points stay above the target .*best achievable level/.test(r.message))).toBe(true);
  });

  it('names the well capacity: small wells with short screens', async () => {
    const s = ringScenario({ kind: 'confined', n: 4, ringRadius_m: 20, pitRadius_m: 12 });
    s.wells = s.wells.map((w) => ({ ...w, radius_m: 0.05, screenTop_m: -1, screenBottom_m: -3 }));
    for (const mode of ['uniform', 'optimal'] as const) {
      const result = await runDesign({ scenario: s, mode });
      expect(result.feasible, mode).toBe(false);
      expect(codes(result), mode).toContain('well-capacity');
      for (const w of result.wells) expect(w.rate_m3_s).toBeLessThanOrEqual(w.fullScreenCapacity_m3_s * (1 + 1e-9));
    }
  });

  it('names the wetted screen: unconfined wells that dewater themselves', async () => {
    // Screens only in the top 4 m of an unconfined aquifer: drawing the wells down dries the screen.
    const s = ringScenario({ kind: 'unconfined', n: 8, ringRadius_m: 20, pitRadius_m: 12 });
    s.wells = s.wells.map((w) => ({ ...w, screenTop_m: 10, screenBottom_m: 4 }));
    const result = await runDesign({ scenario: s, mode: 'optimal' });
    expect(result.feasible).toBe(false);
    expect(codes(result)).toContain('wetted-screen');
  });

  it('names a constant-head boundary too close to the excavation', async () => {
    // A river line 3 m beyond the pit edge opposite the well; one capped well cannot hold the level there.
    const s = singleWellScenario();
    s.boundaries = [{ kind: 'constant-head', from: [14, -100], to: [14, 100], label: 'river (invented)' }];
    s.wells = [{ ...s.wells[0]!, radius_m: 0.1, screenTop_m: -10 }];
    const result = await runDesign({ scenario: s, mode: 'uniform' });
    expect(result.feasible).toBe(false);
    expect(codes(result)).toContain('constant-head-boundary');
    expect(result.reasons.find((r) => r.code === 'constant-head-boundary')!.message).toMatch(/river \(invented\)/);
  });

  it('names a target below the base of an unconfined aquifer', async () => {
    const s = ringScenario({ kind: 'unconfined', n: 8, ringRadius_m: 20, pitRadius_m: 12 });
    s.groundLevel_m = 12;
    s.excavations = [{ ...s.excavations[0]!, formationLevel_m: -19.8, margin_m: 0.5 }];
    const result = await runDesign({ scenario: s, mode: 'optimal' });
    expect(result.feasible).toBe(false);
    expect(codes(result)).toContain('target-below-aquifer-base');
  });

  it('names the lack of wells', async () => {
    const s = singleWellScenario();
    s.wells = [{ ...s.wells[0]!, active: false }];
    const result = await runDesign({ scenario: s, mode: 'optimal' });
    expect(result.feasible).toBe(false);
    expect(codes(result)).toContain('no-active-wells');
    expect(result.totalRate_m3_s).toBe(0);
  });

  it('is feasible when no lowering is needed, with zero rates', async () => {
    const s = singleWellScenario();
    s.excavations = [{ ...s.excavations[0]!, formationLevel_m: 8, margin_m: 0.5 }];
    const result = await runDesign({ scenario: s, mode: 'optimal' });
    expect(result.feasible).toBe(true);
    expect(result.totalRate_m3_s).toBe(0);
    expect(result.excavations[0]!.worstShortfall_m).toBeLessThanOrEqual(0);
  });
});

describe('runDesign with bad input', () => {
  const cases: Array<{ name: string; run: () => Promise<unknown>; path: string; code: string }> = [
    { name: 'a scenario field', run: () => runDesign({ scenario: { ...singleWellScenario(), groundLevel_m: 'high' } }), path: '/groundLevel_m', code: 'DRYDIG_ERR_INVALID_SCENARIO' },
    { name: 'an unknown design option', run: () => runDesign({ scenario: singleWellScenario(), options: { pumpEfficency: 0.7 } }), path: '/options/pumpEfficency', code: 'DRYDIG_ERR_INVALID_REQUEST' },
    { name: 'an efficiency above 1', run: () => runDesign({ scenario: singleWellScenario(), options: { pumpEfficiency: 1.5 } }), path: '/options/pumpEfficiency', code: 'DRYDIG_ERR_INVALID_REQUEST' },
    {
      name: 'a stored option',
      run: () => runDesign({ scenario: { ...singleWellScenario(), designOptions: { safetyFactor: 0.5 } } }),
      path: '/designOptions/safetyFactor',
      code: 'DRYDIG_ERR_INVALID_SCENARIO',
    },
    { name: 'an unknown stage well', run: () => runDesign({ scenario: singleWellScenario(), options: { stages: [{ wellIds: ['W9'], start_s: 100 }] } }), path: '/options/stages/0/wellIds/0', code: 'DRYDIG_ERR_INVALID_REQUEST' },
    { name: 'an unknown out-of-service well', run: () => runDesign({ scenario: singleWellScenario(), options: { outOfServiceWell: 'W9' } }), path: '/options/outOfServiceWell', code: 'DRYDIG_ERR_INVALID_REQUEST' },
    {
      name: 'a user point without a target outside every excavation',
      run: () => runDesign({ scenario: singleWellScenario(), options: { controlPoints: [{ x: 50, y: 50 }] } }),
      path: '/options/controlPoints/0/targetLevel_m',
      code: 'DRYDIG_ERR_INVALID_REQUEST',
    },
    { name: 'a scenario under a path prefix', run: () => runDesign({ scenario: { nope: 1 }, scenarioPath: '/scenario' }), path: '/scenario/format', code: 'DRYDIG_ERR_INVALID_SCENARIO' },
  ];
  it.each(cases)('throws a DrydigError naming the field for $name', async ({ run, path, code }) => {
    const error = (await run().then(
      () => null,
      (e: unknown) => e,
    )) as { code: string; issues: Array<{ path: string }>; message: string } | null;
    expect(error).not.toBeNull();
    expect(error!.code).toBe(code);
    expect(error!.issues.map((i) => i.path)).toContain(path);
    expect(error!.message).toContain(path);
  });
});

describe('runDesign with nothing to design for', () => {
  it('returns zero rates and says so when the scenario has no excavation', async () => {
    const s = singleWellScenario();
    s.excavations = [];
    s.design = { time_s: 86400 };
    const result = await runDesign({ scenario: s, mode: 'optimal' });
    expect(result.totalRate_m3_s).toBe(0);
    expect(result.excavations).toEqual([]);
    expect(result.cautions.some((c) => /nothing to design for/.test(c))).toBe(true);
  });
});
