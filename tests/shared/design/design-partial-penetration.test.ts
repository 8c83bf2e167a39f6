import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runDesign } from '../../../shared/design';
import type { Scenario } from '../../../shared/schema';

const fixture = (name: string): Scenario => JSON.parse(readFileSync(new URL(`../../../fixtures/${name}.json`, import.meta.url), 'utf8'));

describe('runDesign with partially penetrating wells', () => {
  it('lets the Hantush correction inside the well points reach the suction-lift limit', async () => {
    // The demo well points are screened 4.5–7.5 m below the water table of an 18.5 m sand.
    // Fully penetrating, the lowest pumping level is 6.19 m; a 4.76 m suction lift below the
    // 10.8 m header leaves a 0.15 m margin. The correction (about 0.6 m in each well point) uses it up.
    const s = fixture('demo-wellpoints-unconfined');
    const result = await runDesign({ scenario: s, mode: 'uniform', options: { suctionLiftLimit_m: 4.76 } });
    expect(result.feasible).toBe(false);
    expect(result.reasons.map((r) => r.code)).toContain('suction-lift');
    expect(result.modelNotes.some((n) => n.includes('Hantush'))).toBe(true);
  });

  it('reports pumping levels lower than a fully penetrating screen gives', async () => {
    const s = fixture('demo-wellpoints-unconfined');
    const partial = await runDesign({ scenario: s, mode: 'uniform' });
    const full = await runDesign({
      scenario: { ...s, wells: s.wells.map(({ screenTop_m: _t, screenBottom_m: _b, ...w }) => w) },
      mode: 'uniform',
    });
    const wp = (r: typeof partial) => r.wells.find((w) => w.id === 'WP01')!.pumpingLevel_m;
    expect(wp(full) - wp(partial)).toBeGreaterThan(0.3);
  });
});
