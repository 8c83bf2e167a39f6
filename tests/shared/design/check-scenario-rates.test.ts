/**
 * runDesign({ rates: 'scenario' }): the design stages run on the scenario's own rates as they
 * stand (no solve, no rounding) — the check the site view and the report show of a stored revision.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runDesign } from '../../../shared/design';
import type { Scenario } from '../../../shared/schema';

const demo = (file: string) => JSON.parse(readFileSync(new URL(`../../../fixtures/${file}`, import.meta.url), 'utf8')) as Scenario;

describe("runDesign({ scenario, rates: 'scenario' })", () => {
  it('keeps every well at its own rate and says so', async () => {
    const scenario = demo('demo-deepwells-confined.json');
    const checked = await runDesign({ scenario, rates: 'scenario' });
    expect(checked.rateSource).toBe('scenario');
    for (const w of scenario.wells) expect(checked.wells.find((r) => r.id === w.id)!.rate_m3_s).toBe(w.rate_m3_s);
    expect(checked.totalRate_m3_s).toBeCloseTo(scenario.wells.reduce((s, w) => s + (w.rate_m3_s ?? 0), 0), 12);
    expect(checked.rateRounding).toBeUndefined();
  });

  it('says when the stored rates do not meet the targets the solver can meet', async () => {
    const scenario = demo('demo-deepwells-confined.json');
    const [solved, checked] = await Promise.all([runDesign({ scenario }), runDesign({ scenario, rates: 'scenario' })]);
    expect(solved.rateSource).toBe('solved');
    expect(solved.feasible).toBe(true);
    expect(checked.feasible).toBe(false);
    expect(checked.excavations[0]!.met).toBe(false);
    expect(checked.reasons.length).toBeGreaterThan(0);
  });

  it('checks the floor of the clay-plug demo at the stored rates (uplift governs, FS above required)', async () => {
    const checked = await runDesign({ scenario: demo('demo-clay-plug-confined.json'), rates: 'scenario' });
    const floor = checked.excavations[0]!.floor!;
    expect(floor.governing).toBe('uplift');
    expect(floor.upliftFS!).toBeGreaterThanOrEqual(floor.requiredUpliftFS!);
    expect(checked.feasible).toBe(true);
  });
});
