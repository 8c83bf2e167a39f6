/**
 * Issue 12 (design review findings) items 2, 3, 6 and 11: each case failed before its fix.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runDesign } from '../../../shared/design';
import { evaluatePoints, wellLevels } from '../../../shared/field';
import type { Scenario } from '../../../shared/schema';
import { ringScenario, singleWellScenario } from './design-test-helpers';

const codes = (r: { reasons: Array<{ code: string }> }) => r.reasons.map((x) => x.code);

describe('a confined head below the aquifer base (issue 12 item 2)', () => {
  it('is held at the base and flagged dewatered, never reported below it', () => {
    const s = singleWellScenario();
    s.wells[0]!.rate_m3_s = 0.05; // Theis puts the head near −38 m at 1 m; the base is −20 m.
    const { points } = evaluatePoints({ scenario: s, points: [[1, 0], [400, 0]] });
    expect(points[0]!.level_m).toBe(-20);
    expect(points[0]!.drawdown_m).toBe(25);
    expect(points[0]!.flags).toContain('dewatered');
    expect(points[1]!.flags).not.toContain('dewatered');
    const [face] = wellLevels({ scenario: s });
    expect(face!.aquiferLevel_m).toBe(-20);
    expect(face!.flags).toContain('dewatered');
  });

  it('gives the design a reason and no equivalent-well figure for a target below the base', async () => {
    const s: Scenario = { ...singleWellScenario(), groundLevel_m: 10 };
    s.excavations = [{ ...s.excavations[0]!, formationLevel_m: -21, margin_m: 0.5 }];
    const result = await runDesign({ scenario: s, mode: 'uniform' });
    expect(result.feasible).toBe(false);
    expect(codes(result)).toContain('target-below-aquifer-base');
    expect(result.reasons.find((r) => r.code === 'target-below-aquifer-base')!.message).toMatch(/confined aquifer would be drained/);
    expect(result.quickCheck[0]!.equivalentWellInflow_m3_s).toBeNull();
    expect(result.quickCheck[0]!.note).toMatch(/below the base/);
  });
});

describe('steady state between two parallel no-flow lines (issue 12 item 6)', () => {
  const strip = (kinds: ['no-flow' | 'constant-head', 'no-flow' | 'constant-head'], time_s: number | null): Scenario => {
    const s = singleWellScenario();
    s.boundaries = [
      { kind: kinds[0], from: [-100, -30], to: [100, -30] },
      { kind: kinds[1], from: [-100, 30], to: [100, 30] },
    ];
    s.design = { time_s };
    return s;
  };

  it('is refused with DRYDIG_ERR_NO_STEADY_STATE naming /design/time_s', async () => {
    for (const run of [() => evaluatePoints({ scenario: strip(['no-flow', 'no-flow'], null), points: [[10, 0]] }), () => runDesign({ scenario: strip(['no-flow', 'no-flow'], null), mode: 'uniform' })]) {
      let error: unknown;
      try {
        await run();
      } catch (e) {
        error = e;
      }
      expect((error as { code?: string }).code).toBe('DRYDIG_ERR_NO_STEADY_STATE');
      expect((error as { issues: Array<{ path: string }> }).issues[0]!.path).toBe('/design/time_s');
      expect((error as Error).message).toMatch(/no-flow boundaries .* give a design time, make one side constant-head/);
    }
  });

  it('is accepted with a constant-head side, a design time, or a leaky aquifer', () => {
    expect(evaluatePoints({ scenario: strip(['constant-head', 'no-flow'], null), points: [[10, 0]] }).points[0]!.drawdown_m).toBeGreaterThan(0);
    expect(evaluatePoints({ scenario: strip(['no-flow', 'no-flow'], 86400), points: [[10, 0]] }).points[0]!.drawdown_m).toBeGreaterThan(0);
    const leaky = strip(['no-flow', 'no-flow'], null);
    leaky.aquifer = { ...leaky.aquifer, kind: 'leaky', leakageFactor_m: 200 };
    expect(evaluatePoints({ scenario: leaky, points: [[10, 0]] }).points[0]!.drawdown_m).toBeGreaterThan(0);
  });
});

describe('the equivalent-well quick check (issue 12 item 3)', () => {
  const ring = () => ringScenario({ kind: 'confined', n: 8, ringRadius_m: 20, pitRadius_m: 12 });

  it('includes the image wells of a constant-head line beside the pit (ratio 2.8 before)', async () => {
    const s = ring();
    s.boundaries = [{ kind: 'constant-head', from: [-200, 35], to: [200, 35] }];
    const [q] = (await runDesign({ scenario: s, mode: 'optimal' })).quickCheck;
    expect(q!.boundaryFactor).toBeGreaterThan(1.5);
    expect(q!.ratio).toBeGreaterThan(0.5);
    expect(q!.ratio).toBeLessThan(2);
    expect(q!.note).toMatch(/boundary images included/);
    expect(q!.validity).toMatch(/image wells/);
  });

  it('includes the images of a no-flow strip (ratio 0.007 before)', async () => {
    const s = ring();
    s.design = { time_s: 30 * 86400 };
    s.boundaries = [{ kind: 'no-flow', from: [-200, 30], to: [200, 30] }, { kind: 'no-flow', from: [-200, -30], to: [200, -30] }];
    const [q] = (await runDesign({ scenario: s, mode: 'optimal' })).quickCheck;
    expect(q!.ratio).toBeGreaterThan(0.5);
    expect(q!.ratio).toBeLessThan(2);
  });

  it('flags a target out of reach instead of printing an absurd rate or a bare null', async () => {
    const tight = ring();
    tight.aquifer = { ...tight.aquifer, conductivity_m_s: 1e-9 };
    tight.design = { time_s: 86400 };
    tight.excavations = [{ ...tight.excavations[0]!, outline: tight.excavations[0]!.outline.map(([x, y]) => [x * 3, y * 3] as [number, number]) }];
    const [q1] = (await runDesign({ scenario: tight, mode: 'uniform' })).quickCheck;
    expect(q1!.flags).toContain('not-developed-by-design-time');
    expect(q1!.equivalentWellInflow_m3_s === null || q1!.equivalentWellInflow_m3_s <= 10).toBe(true);

    const leaky = ring();
    leaky.aquifer = { ...leaky.aquifer, kind: 'leaky', leakageFactor_m: 0.01 };
    const [q2] = (await runDesign({ scenario: leaky, mode: 'uniform' })).quickCheck;
    expect(q2!.equivalentWellInflow_m3_s).toBeNull();
    expect(q2!.flags).toContain('implausible-rate');
    expect(q2!.note).toMatch(/out of reach/);
  });
});

describe('capacity allowance and air entry (issue 12 item 11)', () => {
  const fixture = (name: string): Scenario => JSON.parse(readFileSync(new URL(`../../../fixtures/${name}.json`, import.meta.url), 'utf8'));
  const capacityBound = () => {
    const s = ringScenario({ kind: 'confined', n: 4, ringRadius_m: 20, pitRadius_m: 12 });
    s.wells = s.wells.map((w) => ({ ...w, radius_m: 0.05, screenTop_m: -1, screenBottom_m: -3 }));
    return s;
  };

  it('keeps every rate within the utilisation factor (0.8, common practice) of its Sichardt capacity when set', async () => {
    const allowed = await runDesign({ scenario: capacityBound(), mode: 'uniform', options: { capacityUtilisationFactor: 0.8 } });
    for (const w of allowed.wells) {
      expect(w.rate_m3_s).toBeLessThanOrEqual(0.8 * w.fullScreenCapacity_m3_s * (1 + 1e-9));
      expect(w.allowedCapacity_m3_s).toBeCloseTo(0.8 * w.capacity_m3_s, 12);
    }
    expect(codes(allowed)).toContain('well-capacity');
    expect(allowed.reasons.some((r) => r.code === 'well-capacity' && /× 0\.8/.test(r.message))).toBe(true);
    await expect(runDesign({ scenario: capacityBound(), options: { capacityUtilisationFactor: 1.5 } })).rejects.toMatchObject({ code: 'DRYDIG_ERR_INVALID_REQUEST' });
  });

  it('says so when the design uses more than 80 % of a well’s capacity without the allowance', async () => {
    const full = await runDesign({ scenario: capacityBound(), mode: 'uniform' });
    expect(full.wells[0]!.rate_m3_s).toBeGreaterThan(0.95 * full.wells[0]!.fullScreenCapacity_m3_s);
    expect(full.cautions.some((c) => /more than 80 % of their Sichardt capacity .*capacityUtilisationFactor/.test(c))).toBe(true);
  });

  it('keeps a well point’s pumping level above its screen top (air entry) as a design row with a reason', async () => {
    // The demo well points are screened 6.0–3.0 m; with partial penetration the levels in them
    // fall below 6.0 m at the rates the targets need.
    const s = fixture('demo-wellpoints-unconfined');
    const free = await runDesign({ scenario: s, mode: 'optimal' });
    expect(free.cautions.some((c) => /drawn below their screen top and would suck air/.test(c))).toBe(true);
    const result = await runDesign({ scenario: s, mode: 'optimal', options: { airEntryCheck: true } });
    for (const w of result.wells) {
      expect(w.minimumPumpingLevel_m).toBe(6);
      if (w.rate_m3_s > 0) expect(w.pumpingLevel_m).toBeGreaterThanOrEqual(6 - 1e-6);
    }
    expect(result.feasible).toBe(false);
    expect(codes(result)).toContain('air-entry');
    expect(result.wells.some((w) => w.limit === 'air-entry')).toBe(true);
  });
});
