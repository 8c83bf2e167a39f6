/**
 * Receptor drawdown limits as constraints of the optimal design, with injection (recharge) wells
 * solved as such (rates ≤ 0), checked by evaluating the solved design with the field engine.
 * Invented site: four deep wells (r_w 0.3 m) on a 20 m ring around a square pit, confined, steady (Thiem with
 * R = 500 m), a house 50–60 m east, two injection wells 44 m east.
 */
import { describe, expect, it } from 'vitest';
import { runDesign, type DesignResult } from '../../../shared/design';
import { evaluatePoints } from '../../../shared/field';
import type { Receptor, Scenario } from '../../../shared/schema';
import { receptorSamplePoints } from '../../../shared/receptors';
import { ringScenario } from '../design/design-test-helpers';

const house: Receptor = {
  id: 'house',
  kind: 'building',
  geometry: { type: 'LineString', coordinates: [[50, -10], [50, 10], [60, 10]] },
  compressibleLayer: { thickness_m: 4, mv_m2_kN: 3e-4 },
  allowableSettlement_m: 0.05,
};

function site(maxDrawdown_m: number | undefined, injector: boolean): Scenario {
  const s = ringScenario({ kind: 'confined', n: 4, ringRadius_m: 20, pitRadius_m: 12 });
  s.wells = s.wells.map((w) => ({ ...w, radius_m: 0.3 }));
  // Injection wells are marked by a negative rate (the map draws them so); the design sets the rate.
  if (injector) s.wells.push({ id: 'J1', x: 44, y: -6, radius_m: 0.2, kind: 'deep', rate_m3_s: -0.001 }, { id: 'J2', x: 44, y: 6, radius_m: 0.2, kind: 'deep', rate_m3_s: -0.001 });
  return { ...s, receptors: [{ ...house, ...(maxDrawdown_m !== undefined ? { maxDrawdown_m } : {}) }] } as Scenario;
}

/** Drawdown at the receptor's sample points and the highest level in the pit, from the field engine. */
function evaluate(s: Scenario, result: DesignResult) {
  const rates = new Map(result.wells.map((w) => [w.id, w.rate_m3_s]));
  const solved: Scenario = { ...s, wells: s.wells.map((w) => ({ ...w, rate_m3_s: rates.get(w.id) ?? 0, active: (rates.get(w.id) ?? 0) !== 0 })) };
  const receptor = evaluatePoints({ scenario: solved, points: receptorSamplePoints(s.receptors![0]!), time_s: null }).points;
  const pit = evaluatePoints({ scenario: solved, points: result.controlPoints.map((p) => [p.x, p.y] as const), time_s: null }).points;
  return { receptorMax_m: Math.max(...receptor.map((p) => p.drawdown_m)), pitHighest_m: Math.max(...pit.map((p) => p.level_m)) };
}

describe('runDesign with receptor drawdown limits (optimal mode)', () => {
  it('draws the house down beyond 3.5 m when nothing limits it', async () => {
    const free = await runDesign({ scenario: site(undefined, false), mode: 'optimal' });
    expect(free.feasible).toBe(true);
    expect(free.receptors![0]!.drawdown_m).toBeGreaterThan(3.5);
  });

  it('names the receptor whose limit makes the target unreachable without injection', async () => {
    const result = await runDesign({ scenario: site(3.5, false), mode: 'optimal' });
    expect(result.feasible).toBe(false);
    const reason = result.reasons.find((r) => r.code === 'receptor-drawdown-limit');
    expect(reason?.receptorId).toBe('house');
    expect(reason?.message).toMatch(/receptor house/);
  });

  it('meets the pit target and the 3.5 m limit with injection wells, checked by the field engine', async () => {
    const s = site(3.5, true);
    const result = await runDesign({ scenario: s, mode: 'optimal' });
    expect(result.feasible, JSON.stringify(result.reasons)).toBe(true);
    const injectors = result.wells.filter((w) => w.injection);
    expect(injectors.map((w) => w.id)).toEqual(['J1', 'J2']);
    for (const w of injectors) {
      expect(w.rate_m3_s).toBeLessThan(0);
      expect(-w.rate_m3_s).toBeLessThanOrEqual(w.capacity_m3_s * (1 + 1e-9));
    }
    // The objective is Σ|Q|: the optimum injects only what the limit needs, not all the wells take.
    expect(injectors.some((w) => -w.rate_m3_s < w.capacity_m3_s * (1 - 1e-3))).toBe(true);
    expect(result.injectionRate_m3_s).toBeCloseTo(-injectors.reduce((t, w) => t + w.rate_m3_s, 0), 12);
    expect(result.totalRate_m3_s).toBeCloseTo(result.wells.reduce((t, w) => t + Math.max(0, w.rate_m3_s), 0), 12);
    const { receptorMax_m, pitHighest_m } = evaluate(s, result);
    expect(receptorMax_m).toBeLessThanOrEqual(3.5 + 1e-4);
    expect(pitHighest_m).toBeLessThanOrEqual(result.excavations[0]!.targetLevel_m + 1e-4);
    expect(result.receptors![0]).toMatchObject({ id: 'house', status: 'ok' });
  });

  it('leaves injection wells out of the uniform closed form instead of pumping them', async () => {
    const result = await runDesign({ scenario: site(undefined, true), mode: 'uniform' });
    expect(result.wells.some((w) => w.id === 'J1')).toBe(false);
  });
});
