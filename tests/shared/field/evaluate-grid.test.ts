import { describe, expect, it } from 'vitest';
import { evaluateGrid, evaluatePoints, FLAG_BITS, MAX_GRID_NODES, THEIS_TABLE_MAX_ERROR, type GridSpec } from '../../../shared/field';
import { DrydigError, type Scenario } from '../../../shared/schema';
import { confinedAquifer, expectClose, leakyAquifer, scenarioWith, unconfinedAquifer, well } from './field-test-helpers';

const grid: GridSpec = { origin: [-60.5, -40.25], spacing_m: [2.5, 3], counts: [49, 31] };
const nodes = (g: GridSpec): Array<[number, number]> => {
  const out: Array<[number, number]> = [];
  for (let j = 0; j < g.counts[1]; j++) for (let i = 0; i < g.counts[0]; i++) out.push([g.origin[0] + i * g.spacing_m[0], g.origin[1] + j * g.spacing_m[1]]);
  return out;
};
const wells = [well('A', 0, 0, { rate_m3_s: 0.01 }), well('B', 20.5, -10, { schedule: [{ from_s: 0, rate_m3_s: 0.004 }, { from_s: 40000, rate_m3_s: 0 }] }), well('C', -30, 15.25, { rate_m3_s: 0.006 })];

describe('evaluateGrid', () => {
  // The grid kernel visits only nodes within each source’s cutoff; it must agree with the point kernel everywhere.
  const cases: Array<[string, Scenario, number | null]> = [
    ['Theis with a no-flow line', scenarioWith({ aquifer: confinedAquifer(), wells, boundaries: [{ kind: 'no-flow', from: [45, -100], to: [45, 100] }] }), 86400],
    ['Thiem with R = 60 m and a constant-head line', scenarioWith({ aquifer: confinedAquifer({ influenceRadius_m: 60 }), wells, boundaries: [{ kind: 'constant-head', from: [-100, 30], to: [100, 30] }] }), null],
    ['unconfined transient', scenarioWith({ aquifer: unconfinedAquifer(), wells }), 3 * 86400],
    ['leaky transient', scenarioWith({ aquifer: leakyAquifer(), wells }), 86400],
    ['leaky steady', scenarioWith({ aquifer: leakyAquifer(), wells }), null],
  ];
  it.each(cases)('evaluateGrid matches evaluatePoints node by node: %s', (_name, scenario, time_s) => {
    const g = evaluateGrid({ scenario, grid, time_s });
    const p = evaluatePoints({ scenario, points: nodes(grid), time_s });
    expect(g.model).toEqual(p.model);
    // The grid's Theis path interpolates W to THEIS_TABLE_MAX_ERROR; Σ|ΔQ|/(4πT) here is below 1, so 1e-12 m covers it.
    const abs = 1e-13 + THEIS_TABLE_MAX_ERROR * 2;
    p.points.forEach((pt, k) => {
      expectClose(g.drawdown_m[k]!, pt.drawdown_m, { rel: 1e-12, abs }, `node ${k}`);
      expectClose(g.level_m[k]!, pt.level_m, { rel: 1e-12, abs }, `node ${k}`);
      const bits = pt.flags.reduce((m, f) => m | FLAG_BITS[f], 0);
      expect(g.flags[k], `flags of node ${k}`).toBe(bits);
    });
  });

  it('evaluateGrid counts each flag and never returns NaN', () => {
    const scenario = scenarioWith({ aquifer: confinedAquifer({ influenceRadius_m: 60 }), wells, boundaries: [{ kind: 'constant-head', from: [-100, 30], to: [100, 30] }] });
    const g = evaluateGrid({ scenario, grid, time_s: null });
    expect(g.flagCounts['beyond-boundary']).toBeGreaterThan(0);
    expect(g.flagCounts['beyond-influence-radius']).toBeGreaterThan(0);
    const counted = Array.from(g.flags).filter((b) => b & FLAG_BITS['beyond-boundary']).length;
    expect(g.flagCounts['beyond-boundary']).toBe(counted);
    expect(Array.from(g.drawdown_m).every(Number.isFinite)).toBe(true);
  });

  it('evaluateGrid flags dewatered nodes and reports them at the base', () => {
    const scenario = scenarioWith({ aquifer: unconfinedAquifer(), wells: [well('W', 0, 0, { rate_m3_s: 0.3 })] });
    const g = evaluateGrid({ scenario, grid: { origin: [-10, -10], spacing_m: [1, 1], counts: [21, 21] } });
    expect(g.flagCounts.dewatered).toBeGreaterThan(0);
    const k = 10 * 21 + 10;
    expect(g.flags[k]! & FLAG_BITS.dewatered).toBeTruthy();
    expect(g.level_m[k]).toBe(-10);
    expect(Array.from(g.level_m).every(Number.isFinite)).toBe(true);
  });

  it.each<[string, GridSpec, string, string]>([
    ['zero spacing', { origin: [0, 0], spacing_m: [0, 1], counts: [3, 3] }, '/grid/spacing_m/0', 'DRYDIG_ERR_INVALID_REQUEST'],
    ['fractional count', { origin: [0, 0], spacing_m: [1, 1], counts: [3, 2.5] }, '/grid/counts/1', 'DRYDIG_ERR_INVALID_REQUEST'],
    ['NaN origin', { origin: [Number.NaN, 0], spacing_m: [1, 1], counts: [3, 3] }, '/grid/origin/0', 'DRYDIG_ERR_INVALID_REQUEST'],
    ['too many nodes', { origin: [0, 0], spacing_m: [1, 1], counts: [MAX_GRID_NODES, 2] }, '/grid/counts', 'DRYDIG_ERR_GRID_TOO_LARGE'],
  ])('evaluateGrid rejects a grid with %s naming %s', (_name, g, path, code) => {
    const scenario = scenarioWith({ aquifer: confinedAquifer(), wells });
    try {
      evaluateGrid({ scenario, grid: g });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(DrydigError);
      expect((e as DrydigError).code).toBe(code);
      expect((e as DrydigError).issues[0]!.path).toBe(path);
    }
  });
});
