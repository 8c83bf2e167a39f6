/**
 * Robust design options (issue 11 item 3): a design that meets the target with any one well out
 * (N − 1), checked by taking each well out in turn and evaluating with the field engine on a grid
 * twice as dense as the design's check grid; and one for K within a factor, checked at both ends.
 */
import { describe, expect, it } from 'vitest';
import { runDesign } from '../../../shared/design';
import { expectClose } from './design-test-helpers';
import { pitLevels, thiemRingScenario } from './uncertainty-fixtures';

/** Between check points the level may stand a little above the check grid's worst: 1 cm (the design's acceptance). */
const BETWEEN_POINTS_M = 0.01;

describe('robust designs', () => {
  it('N − 1: every target is met with any one well out, each outage evaluated by the field engine', async () => {
    const scenario = thiemRingScenario();
    const r = await runDesign({ scenario, options: { robust: { oneWellOut: true } } });
    expect(r.outOfService!.met).toBe(false); // the ordinary design does not survive a well out
    const d = r.robust!.find((x) => x.kind === 'one-well-out')!;
    expect(d.feasible).toBe(true);
    expect(d.extraRate_m3_s!).toBeGreaterThan(0);
    expectClose(d.extraRate_m3_s!, d.totalRate_m3_s! - r.totalRate_m3_s, { rel: 1e-12 });
    const rates = new Map(d.wells.map((w) => [w.id, w.rate_m3_s] as const));
    for (const w of scenario.wells) {
      const out = pitLevels(scenario, rates, w.id);
      expect(out.worstAbove_m, `well ${w.id} out`).toBeLessThanOrEqual(BETWEEN_POINTS_M);
    }
    // Five of six wells carry the lowering: more than the ordinary total, far less than twice it.
    expect(d.totalRate_m3_s!).toBeLessThan(2 * r.totalRate_m3_s);
    // With all wells on the robust rates meet the target too.
    expect(pitLevels(scenario, rates).worstAbove_m).toBeLessThanOrEqual(BETWEEN_POINTS_M);
  }, 120_000);

  it('K within a factor: met at K ÷ f and K × f; in confined steady flow K × f governs and costs (f − 1) × the ordinary flow', async () => {
    const scenario = thiemRingScenario();
    const f = 2;
    const r = await runDesign({ scenario, options: { robust: { conductivityFactor: f } } });
    const d = r.robust!.find((x) => x.kind === 'conductivity-range')!;
    expect(d.feasible).toBe(true);
    const rates = new Map(d.wells.map((w) => [w.id, w.rate_m3_s] as const));
    expect(pitLevels(scenario, rates, null, 1 / f).worstAbove_m).toBeLessThanOrEqual(BETWEEN_POINTS_M);
    expect(pitLevels(scenario, rates, null, f).worstAbove_m).toBeLessThanOrEqual(BETWEEN_POINTS_M);
    // Thiem with a fixed radius of influence: the least flow is ∝ T, so K × f needs f × Q(K) and governs.
    expectClose(d.totalRate_m3_s!, f * r.totalRate_m3_s, { rel: 0.01 }, 'robust total vs f × ordinary');
    expectClose(d.extraShare!, f - 1, { abs: 0.01 });
    expect(d.worstCase).toMatch(/K × 2/);
    // The ordinary rates fail at K × f.
    const ordinary = new Map(r.wells.map((w) => [w.id, w.rate_m3_s] as const));
    expect(pitLevels(scenario, ordinary, null, f).worstAbove_m).toBeGreaterThan(0.1);
  }, 120_000);

  it('says when no rates within the well limits survive, with the best achievable rates', async () => {
    const scenario = thiemRingScenario();
    // K × 100 needs 100 × the flow; Sichardt capacity grows only with √K.
    const r = await runDesign({ scenario, options: { robust: { conductivityFactor: 100 } } });
    const d = r.robust![0]!;
    expect(d).toMatchObject({ feasible: false, totalRate_m3_s: null, extraRate_m3_s: null });
    expect(d.worstShortfall_m).toBeGreaterThan(0);
    expect(d.note).toMatch(/best achievable/);
  }, 120_000);
});

describe('robust designs outside the physical range', () => {
  it('reports a K range whose scaled K leaves the physical range as not computed, not an error', async () => {
    const scenario = thiemRingScenario();
    const fast = { ...scenario, aquifer: { ...scenario.aquifer, conductivity_m_s: 0.05 } };
    const r = await runDesign({ scenario: fast, options: { robust: { conductivityFactor: 50 } } });
    expect(r.robust![0]).toMatchObject({ kind: 'conductivity-range', feasible: false, totalRate_m3_s: null, worstCase: 'not computed' });
    expect(r.robust![0]!.note).toMatch(/conductivity_m_s/);
  }, 60_000);
});
