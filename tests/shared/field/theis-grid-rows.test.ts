/**
 * The grouped Theis grid kernel (one logarithm per node per chunk of equal-|amp| sources) against
 * the point kernel (theisWellFunction per pair, exact series/continued fraction) and against the
 * previous pairwise grid kernel. Bound: THEIS_TABLE_MAX_ERROR (5e-13) in W per source plus 4e-15
 * per chunk (the products' rounding, derived in shared/field/theis-grid-rows.ts), times
 * Σ|ΔQ|/(4πT) — the accuracy contract of the grid (design.md, the field engine's methods).
 */
import { describe, expect, it } from 'vitest';
import { evaluatePoints, prepareField, THEIS_TABLE_MAX_ERROR, type GridSpec } from '../../../shared/field';
import { superposeOnGrid } from '../../../shared/field/superpose';
import { groupTheisSources } from '../../../shared/field/theis-grid-rows';
import type { Scenario } from '../../../shared/schema';
import { confinedAquifer, scenarioWith, well } from './field-test-helpers';

const nodesOf = (g: GridSpec): Array<[number, number]> => {
  const out: Array<[number, number]> = [];
  for (let j = 0; j < g.counts[1]; j++) for (let i = 0; i < g.counts[0]; i++) out.push([g.origin[0] + i * g.spacing_m[0], g.origin[1] + j * g.spacing_m[1]]);
  return out;
};

/** 40 wells on a ring: 30 at one rate, 6 at another, 4 with their own step schedules. */
function ringScenario(boundaries: Scenario['boundaries'], radius_m = 0.15): Scenario {
  const wells = Array.from({ length: 40 }, (_, k) => {
    const a = (2 * Math.PI * k) / 40;
    const x = 30 * Math.cos(a);
    const y = 20 * Math.sin(a);
    if (k < 30) return well(`E${k}`, x, y, { rate_m3_s: 0.002, radius_m });
    if (k < 36) return well(`F${k}`, x, y, { rate_m3_s: 0.0035, radius_m });
    return well(`S${k}`, x, y, { radius_m, schedule: [{ from_s: 0, rate_m3_s: 0.001 * (k - 33) }, { from_s: 20000 + 1000 * k, rate_m3_s: 0.0005 }] });
  });
  return scenarioWith({ aquifer: confinedAquifer(), wells, boundaries });
}

describe('grouped Theis grid kernel', () => {
  const grid: GridSpec = { origin: [-70.3, -55.1], spacing_m: [2.7, 2.3], counts: [53, 49] };
  it.each([
    ['a no-flow line (images at +amp)', [{ kind: 'no-flow' as const, from: [60, -200] as [number, number], to: [60, 200] as [number, number] }]],
    ['a constant-head line (images at −amp)', [{ kind: 'constant-head' as const, from: [-200, 45] as [number, number], to: [200, 45] as [number, number] }]],
    ['no boundary', []],
  ])('agrees with evaluatePoints node by node and with the pairwise kernel, with %s', (_name, boundaries) => {
    const scenario = ringScenario(boundaries);
    const time_s = 2 * 86400;
    const field = prepareField({ scenario, time_s });
    const groups = groupTheisSources(field.sources, grid);
    // Equal rates share a group: fewer groups than sources, and real chunks.
    expect(groups.magnitude.length).toBeLessThan(field.sources.count / 4);
    expect(Math.max(...groups.chunk)).toBeGreaterThan(4);
    let sumAmp = 0;
    for (let k = 0; k < field.sources.count; k++) sumAmp += Math.abs(field.sources.amp[k]!);
    const bound = (THEIS_TABLE_MAX_ERROR + 4e-15) * sumAmp + 1e-14;
    const grouped = superposeOnGrid(field.sources, grid).value;
    const pairwise = superposeOnGrid(field.sources, grid, { kernel: 'pairwise' }).value;
    const points = evaluatePoints({ scenario, points: nodesOf(grid), time_s });
    let worst = 0;
    // Beyond a boundary line the point kernel reports static level; the raw sum there is not a level.
    points.points.forEach((p, k) => {
      if (p.flags.includes('beyond-boundary')) return;
      worst = Math.max(worst, Math.abs(grouped[k]! - p.drawdown_m));
      expect(Math.abs(grouped[k]! - pairwise[k]!), `node ${k} vs pairwise`).toBeLessThanOrEqual(2 * bound);
    });
    expect(worst).toBeLessThanOrEqual(bound);
  });

  it('sizes chunks so the products cannot overflow: a 1 mm well face seen from 20 km', () => {
    const scenario = ringScenario([{ kind: 'constant-head', from: [-200, 45], to: [200, 45] }], 0.001);
    const big: GridSpec = { origin: [-20000, -20000], spacing_m: [800, 800], counts: [51, 51] };
    const time_s = 400 * 86400;
    const field = prepareField({ scenario, time_s });
    const groups = groupTheisSources(field.sources, big);
    for (let g = 0; g < groups.chunk.length; g++) expect(groups.chunk[g]!).toBeGreaterThanOrEqual(1);
    const grouped = superposeOnGrid(field.sources, big).value;
    expect(grouped.every(Number.isFinite)).toBe(true);
    const points = evaluatePoints({ scenario, points: nodesOf(big), time_s });
    let sumAmp = 0;
    for (let k = 0; k < field.sources.count; k++) sumAmp += Math.abs(field.sources.amp[k]!);
    points.points.forEach((p, k) => p.flags.includes('beyond-boundary') || expect(Math.abs(grouped[k]! - p.drawdown_m), `node ${k}`).toBeLessThanOrEqual((THEIS_TABLE_MAX_ERROR + 4e-15) * sumAmp + 1e-14));
  });

  it('evaluates only the rows asked for (a thread’s share)', () => {
    const scenario = ringScenario([]);
    const field = prepareField({ scenario, time_s: 86400 });
    const whole = superposeOnGrid(field.sources, grid).value;
    const [nx] = grid.counts;
    const part = superposeOnGrid(field.sources, grid, { rows: [10, 20] }).value;
    for (let j = 0; j < grid.counts[1]; j++) for (let i = 0; i < nx; i++) {
      const k = j * nx + i;
      expect(part[k]).toBe(j >= 10 && j < 20 ? whole[k] : 0);
    }
  });
});
