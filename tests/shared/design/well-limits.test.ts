import { describe, expect, it } from 'vitest';
import {
  applyDesignRates,
  buildDesignWells,
  buildLimitRows,
  designResponse,
  narrowIntervals,
  resolveDesignOptions,
  sichardtCapacity,
  variableConversions,
  wettedScreenLength,
  type DesignContext,
} from '../../../shared/design';
import { wellLevels } from '../../../shared/field';
import type { Scenario } from '../../../shared/schema';
import { ringScenario } from './design-test-helpers';
import { seededRandom as random } from '../../helpers/seeded-random';


function context(scenario: Scenario): DesignContext {
  const options = resolveDesignOptions({ scenario });
  const wells = buildDesignWells({
    scenario,
    indices: scenario.wells.map((_, i) => i),
    startOf: new Map(),
    headerLevel_m: options.headerLevel_m,
    suctionLiftLimit_m: options.suctionLiftLimit_m,
  });
  return {
    scenario, options, mode: 'optimal', wells,
    matrixScenario: { ...scenario, wells: scenario.wells.map((w) => ({ ...w, active: false })) },
    designTime_s: scenario.design.time_s, limitTime_s: scenario.design.time_s,
    ...variableConversions(scenario),
    floors: new Map(),
    targetOf: (e) => e.formationLevel_m - e.margin_m,
  };
}

/** Largest t with rows·(t q) ≤ rhs and t q ≤ upper; the least t with t q ≥ lower; whether a row (not a plain cap) set t. */
function boundary(rows: ReturnType<typeof buildLimitRows>, q: Float64Array): { t: number; tLow: number; byRow: boolean } {
  let t = Infinity;
  for (let j = 0; j < q.length; j++) t = Math.min(t, rows.upper[j]! / q[j]!);
  let byRow = false;
  let tLow = 0;
  for (let j = 0; j < q.length; j++) tLow = Math.max(tLow, rows.lower[j]! / q[j]!);
  for (const r of rows.limits) {
    const a = r.coefficients.reduce((s, c, j) => s + c * q[j]!, 0);
    if (a > 0 && r.rhs / a < t) {
      t = r.rhs / a;
      byRow = true;
    }
    if (a < 0) tLow = Math.max(tLow, r.rhs / a);
  }
  return { t, tLow, byRow };
}

/**
 * For random directions q, scale to the largest t·q the linear rows allow, then ask the field
 * engine (exact Dupuit/Jacob levels, exact C·Q²) whether every well really is within its limits.
 */
function checkConservative(scenario: Scenario, narrowAround: boolean) {
  const ctx = context(scenario);
  const n = ctx.wells.length;
  const face = designResponse(ctx, ctx.wells.map((w) => [w.x, w.y] as const), ctx.designTime_s);
  const input = { aquifer: scenario.aquifer, wells: ctx.wells, faceResponse: face, variableForLevel: ctx.variableForLevel, levelForVariable: ctx.levelForVariable };
  let rows = buildLimitRows(input);
  const rnd = random(7);
  let checked = 0;
  let boundByLevelRow = 0;
  for (let k = 0; k < 25; k++) {
    const q = Float64Array.from({ length: n }, () => 0.2 + rnd());
    if (narrowAround) {
      // Narrow around a point inside the set (0.9 of the way to the wide rows’ boundary), as a later solve round would.
      const wide = buildLimitRows(input);
      const inner = q.map((v) => v * 0.9 * boundary(wide, q).t);
      const fv = Float64Array.from(ctx.wells, (_, j) => inner.reduce((s, r, i) => s + face[j * n + i]! * r, 0));
      rows = buildLimitRows({ ...input, intervals: narrowIntervals(wide.intervals, fv, inner) });
    }
    const { t, tLow, byRow } = boundary(rows, q);
    if (!(t > tLow)) continue;
    const rates = q.map((v) => v * t);
    const levels = wellLevels({ scenario: applyDesignRates(scenario, ctx.wells, rates), time_s: ctx.designTime_s });
    ctx.wells.forEach((w, j) => {
      const pl = levels[w.scenarioIndex]!.pumpingLevel_m;
      expect(pl, `${w.id} pumping level`).toBeGreaterThanOrEqual(w.minimumLevel_m - 1e-9);
      const cap = sichardtCapacity({ radius_m: w.radius_m, wettedLength_m: wettedScreenLength(w.screenTop_m, w.screenBottom_m, pl), conductivity_m_s: scenario.aquifer.conductivity_m_s });
      expect(rates[j]!, `${w.id} rate vs Sichardt capacity`).toBeLessThanOrEqual(cap * (1 + 1e-9));
    });
    checked++;
    if (byRow) boundByLevelRow++;
  }
  expect(checked).toBeGreaterThan(10);
  // The check means something only if the level rows (not the plain caps) set the boundary.
  expect(boundByLevelRow).toBeGreaterThan(5);
}

describe('buildLimitRows', () => {
  it('is conservative for unconfined well points: rates on the rows’ boundary keep every well within its limits', () => {
    const s = ringScenario({ kind: 'unconfined', n: 12, ringRadius_m: 15, pitRadius_m: 8 });
    // Long screens: the suction-lift floor (header 12 − 5.5 = 6.5 m) binds before the Sichardt cap.
    s.wells = s.wells.map((w) => ({ ...w, kind: 'wellpoint', radius_m: 0.1, screenTop_m: 7, screenBottom_m: -15 }));
    checkConservative(s, false);
  });

  it('stays conservative after its intervals are narrowed around a solution', () => {
    const s = ringScenario({ kind: 'unconfined', n: 12, ringRadius_m: 15, pitRadius_m: 8 });
    s.wells = s.wells.map((w) => ({ ...w, radius_m: 0.3, screenTop_m: 6, screenBottom_m: 0, wellLoss_s2_m5: 2000 }));
    checkConservative(s, true);
  });

  it('is conservative for confined deep wells with well loss', () => {
    const s = ringScenario({ kind: 'confined', n: 6, ringRadius_m: 20, pitRadius_m: 12 });
    s.aquifer = { ...s.aquifer, conductivity_m_s: 5e-5 };
    s.wells = s.wells.map((w) => ({ ...w, radius_m: 0.3, screenTop_m: -5, screenBottom_m: -25, wellLoss_s2_m5: 3000 }));
    checkConservative(s, false);
  });
});
