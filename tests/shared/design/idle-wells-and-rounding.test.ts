import { describe, expect, it } from 'vitest';
import { evaluatePoints } from '../../../shared/field';
import { runDesign } from '../../../shared/design';
import { loadFixture } from '../../server/helpers/demo-fixtures';

describe('optimal mode: idle wells, minimum rate and rounding', () => {
  it('marks each well left at zero "idle — may be omitted" and prices exactly the wells it counts', async () => {
    // Invented well-point demo: the LP leaves some wells at zero (2 of 66 when this test was written).
    const result = await runDesign({ scenario: loadFixture('unconfined'), mode: 'optimal' });
    const idle = result.wells.filter((w) => w.rate_m3_s === 0);
    expect(idle.length).toBeGreaterThan(0);
    for (const w of idle) expect([w.idle, w.installed, w.note]).toEqual([true, false, 'idle — may be omitted']);
    const installed = result.wells.filter((w) => w.installed);
    expect(result.summary.quantities.wells).toBe(installed.length);
    expect(result.summary.idleWellIds).toEqual(idle.map((w) => w.id));
    expect(result.summary.wellCost).toBe(installed.length * 5000);
  }, 60_000);

  it('raises rates below the minimum, rounds up to 0.05 L/s and re-checks the design with the field engine', async () => {
    const scenario = loadFixture('unconfined');
    const step = 5e-5;
    const minimum = 2e-4;
    const result = await runDesign({ scenario, mode: 'optimal', options: { rateStep_m3_s: step, minimumRate_m3_s: minimum } });
    for (const w of result.wells) {
      if (w.rate_m3_s === 0) continue;
      expect(w.rate_m3_s).toBeGreaterThanOrEqual(minimum);
      expect(Math.abs(w.rate_m3_s / step - Math.round(w.rate_m3_s / step))).toBeLessThan(1e-6);
    }
    const r = result.rateRounding!;
    expect(r.totalAfter_m3_s).toBeGreaterThanOrEqual(r.totalBefore_m3_s);
    expect(result.totalRate_m3_s).toBeCloseTo(r.totalAfter_m3_s, 12);
    expect(result.cautions.some((c) => c.startsWith('Practical rates:'))).toBe(true);
    // Independent re-check: the rounded rates put into the scenario, evaluated by the field engine at the critical point.
    const byId = new Map(result.wells.map((w) => [w.id, w.rate_m3_s]));
    const solved = { ...scenario, wells: scenario.wells.map((w) => ({ ...w, rate_m3_s: byId.get(w.id) ?? 0, active: byId.has(w.id) && byId.get(w.id)! > 0 })) };
    const e = result.excavations[0]!;
    const level = evaluatePoints({ scenario: solved, points: [[e.critical.x, e.critical.y]], time_s: scenario.design.time_s }).points[0]!.level_m;
    expect(level).toBeCloseTo(e.critical.level_m, 6);
    // The demo's LP puts wells at their Sichardt capacity; rounding those up breaks it, and the re-check says so.
    const over = result.wells.filter((w) => w.rate_m3_s > w.capacity_m3_s * (1 + 1e-6));
    expect(over.length).toBeGreaterThan(0);
    expect(result.feasible).toBe(false);
    for (const w of over) expect(result.reasons.some((x) => x.message.includes(`well ${w.id} pumps`) && x.message.includes('Sichardt capacity'))).toBe(true);
  }, 60_000);
});

describe('per-kind efficiency and cost', () => {
  it('prices each kind at its own cost, runs ejectors at their own (low) efficiency and labels the currency', async () => {
    const base = loadFixture('confined');
    // The invented deep-well demo with two of its wells recast as ejectors.
    const scenario = { ...base, wells: base.wells.map((w, i) => (i < 2 ? { ...w, kind: 'ejector' as const, radius_m: 0.1 } : w)) };
    const options = { wellCostByKind: { deep: 9000, ejector: 2500 }, currency: 'EUR' };
    const result = await runDesign({ scenario, mode: 'uniform', options });
    const s = result.summary;
    expect(s.currency).toBe('EUR');
    expect(s.quantities.wellsByKind.ejector).toBe(2);
    expect(s.wellCostByKind).toEqual({ wellpoint: 0, deep: 9000 * s.quantities.wellsByKind.deep, ejector: 5000 });
    expect(s.wellCost).toBe(9000 * s.quantities.wellsByKind.deep + 5000);
    // Default ejector efficiency 0.2 (from memory, 10–30 % published; see the option's description) against 0.6 for pumps.
    expect(s.efficiencyByKind).toEqual({ wellpoint: 0.6, deep: 0.6, ejector: 0.2 });
    const hydraulicByKind = (kind: string) => result.wells.filter((w) => w.kind === kind && w.rate_m3_s > 0).reduce((sum, w) => sum + 1000 * 9.80665 * w.rate_m3_s * w.head_m!, 0);
    // Input power = Σ ρ·g·Q·H / η per kind (P = ρgQH, any fluid mechanics text).
    expect(s.inputPower_kW).toBeCloseTo((hydraulicByKind('deep') / 0.6 + hydraulicByKind('ejector') / 0.2) / 1000, 9);
  }, 60_000);
});
