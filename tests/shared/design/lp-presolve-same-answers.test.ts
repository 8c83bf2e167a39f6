/**
 * Presolve off for the dense design LPs (shared/design/linear-program.ts) gives the same designs
 * as before, when HiGHS presolved every LP: on every demo and the 300-well bench case, the same
 * feasibility and total rate within 1e-6 relative (HiGHS's default optimality tolerance is 1e-7 on
 * scaled rows). Per-well rates may differ where the optimum is not unique (a symmetric ring of
 * deep wells can trade rate between mirror-image wells at the same total): each design is then
 * checked on its own — every excavation's worst shortfall within the design tolerance.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runDesign } from '../../../shared/design';
import type { Scenario } from '../../../shared/schema';
import { makeDesignBenchScenario, withPresolveOn as presolveOn } from '../../../bench/design';

const demo = (file: string) => JSON.parse(readFileSync(new URL(`../../../fixtures/${file}`, import.meta.url), 'utf8')) as Scenario;

describe('design LPs without presolve', () => {
  it.each([
    'demo-wellpoints-unconfined.json', 'demo-deepwells-confined.json', 'demo-clay-plug-confined.json', 'demo-neighbours-confined.json',
  ])('give the same optimal design as with presolve: %s', async (file) => {
    const scenario = demo(file);
    const before = await presolveOn(() => runDesign({ scenario, mode: 'optimal' }));
    const after = await runDesign({ scenario, mode: 'optimal' });
    expect(after.feasible).toBe(before.feasible);
    expect(Math.abs(after.totalRate_m3_s - before.totalRate_m3_s)).toBeLessThanOrEqual(1e-6 * Math.abs(before.totalRate_m3_s) + 1e-12);
    after.excavations.forEach((x, k) => {
      expect(x.met, x.id).toBe(before.excavations[k]!.met);
      if (x.met) expect(x.worstShortfall_m, x.id).toBeLessThanOrEqual(0);
    });
  }, 120_000);

  it('gives the same total on the 300-well bench case', async () => {
    const scenario = makeDesignBenchScenario(300);
    const options = { controlSpacing_m: 5.4 };
    const before = await presolveOn(() => runDesign({ scenario, mode: 'optimal', options }));
    const after = await runDesign({ scenario, mode: 'optimal', options });
    expect(after.feasible).toBe(before.feasible);
    expect(Math.abs(after.totalRate_m3_s - before.totalRate_m3_s)).toBeLessThanOrEqual(1e-6 * before.totalRate_m3_s);
  }, 120_000);
});
