/**
 * The sensitivity table (issue 11 item 1): the chosen design re-evaluated at its rates and
 * re-solved with K or S scaled.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { runDesign } from '../../../shared/design';
import { expectClose } from './design-test-helpers';
import { thiemRingScenario } from './uncertainty-fixtures';

describe('sensitivity table', () => {
  it('steady Thiem: K only, the flow ∝ K, the design’s rates meet the target for K ≤ its own', async () => {
    const r = await runDesign({ scenario: thiemRingScenario(), options: { sensitivity: {} } });
    const t = r.sensitivity!;
    expect(t.factors).toEqual([1 / 3, 1 / 2, 1, 2, 3]);
    expect(t.rows.map((row) => row.parameter)).toEqual(new Array(5).fill('conductivity')); // steady: S does not matter
    for (const row of t.rows) {
      // Confined steady flow with a fixed radius of influence: Q ∝ T = K·b (Thiem 1906).
      expectClose(row.totalRate_m3_s!, row.factor * r.totalRate_m3_s, { rel: 1e-3 }, `Q at K × ${row.factor}`);
      expect(row.feasible).toBe(true);
      expect(row.met).toBe(row.factor <= 1);
      expect(row.upliftFS).toBeNull();
    }
    // Drawdown ∝ 1/T at fixed rates: at K ÷ 2 the drawdown doubles, so the level falls 3.5 m below target.
    const half = t.rows.find((row) => row.factor === 0.5)!;
    expectClose(half.worstShortfall_m!, -3.5, { abs: 0.02 });
  }, 120_000);

  it('transient clay-plug demo: K and S rows, the uplift FS where the floor check exists, the factor-1 rows the design itself', async () => {
    const scenario = JSON.parse(readFileSync('fixtures/demo-clay-plug-confined.json', 'utf8')) as unknown;
    const r = await runDesign({ scenario, options: { sensitivity: { factors: [0.5, 1, 2] } } });
    const rows = r.sensitivity!.rows;
    expect(rows.map((row) => `${row.parameter} ${row.factor}`)).toEqual(['conductivity 0.5', 'conductivity 1', 'conductivity 2', 'storage 0.5', 'storage 1', 'storage 2']);
    for (const row of rows.filter((x) => x.factor === 1)) {
      expect(row.met).toBe(true);
      expectClose(row.totalRate_m3_s!, r.totalRate_m3_s, { rel: 1e-6 });
      expectClose(row.upliftFS!, r.excavations[0]!.floor!.upliftFS!, { rel: 1e-6 });
    }
    // Higher K spreads the same rates' drawdown thinner under the pit: less lowering, a lower uplift FS.
    const k2 = rows.find((x) => x.parameter === 'conductivity' && x.factor === 2)!;
    expect(k2.met).toBe(false);
    expect(k2.upliftFS!).toBeLessThan(r.excavations[0]!.floor!.upliftFS!);
  }, 120_000);
});
