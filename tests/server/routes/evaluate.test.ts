/**
 * POST /api/v1/evaluate against the field engine called directly: the route must hand on the
 * engine's numbers untouched (points) or rounded only as documented (grids, 0.1 mm).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../../../server/app';
import { decodeFlagRuns } from '../../../server/evaluation';
import { evaluateGrid, evaluatePoints, FLAG_BITS, type GridSpec, type PointResult } from '../../../shared/field';
import { loadFixture } from '../helpers/demo-fixtures';
import { postJson } from '../helpers/inject-json';

let app: FastifyInstance;
beforeAll(async () => {
  app = await buildApp({ clientDir: false, dataDir: ':memory:' });
});
afterAll(async () => {
  await app.close();
});

interface EvaluateAnswer {
  points?: PointResult[];
  grids?: Array<{
    grid: GridSpec;
    time_s: number | null;
    staticLevel_m: number;
    drawdown_m: number[];
    flags: Record<string, number>;
    flagMask: { encoding: string; runs: Array<[number, number, number]> };
  }>;
  model: { method: string; notes: string[] };
  models: Array<{ time_s: number | null; model: { method: string } }>;
  cautions: string[];
}

// Points chosen around each demo pit: inside, on the well line, outside, far field.
const POINTS = {
  unconfined: [[20, 10], [-1.5, -1.5], [0.5, -1.5], [45, 10], [120, -60], [900, 900]] as Array<[number, number]>,
  confined: [[389215, 5819415], [389194, 5819394], [389300, 5819415], [389379, 5819415], [389000, 5819000]] as Array<[number, number]>,
};

describe('POST /api/v1/evaluate with points', () => {
  const cases: Array<{ fixture: 'unconfined' | 'confined'; times_s?: Array<number | null>; engineTimes: Array<number | null | undefined> }> = [
    { fixture: 'unconfined', engineTimes: [undefined] },
    { fixture: 'unconfined', times_s: [3600, 86_400, null], engineTimes: [3600, 86_400, null] },
    { fixture: 'confined', engineTimes: [undefined] },
    { fixture: 'confined', times_s: [null, 604_800], engineTimes: [null, 604_800] },
  ];
  it.each(cases)('answers the engine\u2019s own points for the $fixture demo at times $times_s', async ({ fixture, times_s, engineTimes }) => {
    const scenario = loadFixture(fixture);
    const response = await postJson(app, '/api/v1/evaluate', { scenario, points: POINTS[fixture], ...(times_s ? { times_s } : {}) });
    expect(response.status).toBe(200);
    const answer = response.json() as unknown as EvaluateAnswer;

    const expected: PointResult[] = [];
    const models = [];
    for (const time_s of engineTimes) {
      const direct = evaluatePoints({ scenario, points: POINTS[fixture], time_s });
      expected.push(...direct.points);
      models.push({ time_s: time_s === undefined ? scenario.design.time_s : time_s, model: direct.model });
    }
    // Exact equality: JSON carries doubles losslessly, and the server adds nothing.
    expect(answer.points).toEqual(JSON.parse(JSON.stringify(expected)));
    expect(answer.models).toEqual(JSON.parse(JSON.stringify(models)));
    expect(answer.model).toEqual(answer.models[0]!.model);
    expect(answer.cautions.length).toBeGreaterThan(0);
  });

  it('lists points time by time, one entry per point per time, each with its time_s', async () => {
    const scenario = loadFixture('unconfined');
    const points: Array<[number, number]> = [[20, 10], [60, 10]];
    const answer = (await postJson(app, '/api/v1/evaluate', { scenario, points, times_s: [7200, null, 7200] })).json() as unknown as EvaluateAnswer;
    expect(answer.points!.map((p) => [p.x, p.y, p.time_s])).toEqual([
      [20, 10, 7200], [60, 10, 7200], [20, 10, null], [60, 10, null], [20, 10, 7200], [60, 10, 7200],
    ]);
    expect(answer.models.map((m) => m.model.method)).toEqual(['theis-unconfined', 'dupuit-thiem', 'theis-unconfined']);
  });

  it('uses the scenario\u2019s design time when times_s is absent and steady state when the design time is null', async () => {
    const scenario = loadFixture('confined');
    const transient = (await postJson(app, '/api/v1/evaluate', { scenario, points: [[389215, 5819415]] })).json() as unknown as EvaluateAnswer;
    expect(transient.points![0]!.time_s).toBe(604_800);
    expect(transient.model.method).toBe('theis');
    const steady = (await postJson(app, '/api/v1/evaluate', { scenario: { ...scenario, design: { time_s: null } }, points: [[389215, 5819415]] })).json() as unknown as EvaluateAnswer;
    expect(steady.points![0]!.time_s).toBeNull();
    expect(steady.model.method).toBe('thiem');
  });

  it('passes validity flags through, e.g. within-well-radius at a well and beyond-boundary across the river', async () => {
    const scenario = loadFixture('confined');
    const answer = (await postJson(app, '/api/v1/evaluate', { scenario, points: [[389194, 5819394], [389500, 5819415]] })).json() as unknown as EvaluateAnswer;
    expect(answer.points![0]!.flags).toContain('within-well-radius');
    expect(answer.points![1]!.flags).toContain('beyond-boundary');
  });
});

describe('POST /api/v1/evaluate with a grid', () => {
  const cases: Array<{ fixture: 'unconfined' | 'confined'; grid: GridSpec; time_s: number | null; rateFactor?: number }> = [
    // Nodes fall on the well line y = −1.5 (within-well-radius) and far beyond Sichardt's R (steady).
    { fixture: 'unconfined', grid: { origin: [-1.5, -1.5], spacing_m: [2, 2], counts: [40, 25] }, time_s: null, rateFactor: 1 },
    { fixture: 'unconfined', grid: { origin: [-300, -300], spacing_m: [25, 25], counts: [25, 25] }, time_s: null, rateFactor: 1 },
    { fixture: 'unconfined', grid: { origin: [-50, -50], spacing_m: [5, 4], counts: [30, 30] }, time_s: 86_400, rateFactor: 1 },
    // Straddles the constant-head river line x = 389380 (beyond-boundary on the far side).
    { fixture: 'confined', grid: { origin: [389100, 5819300], spacing_m: [10, 10], counts: [40, 25] }, time_s: 604_800, rateFactor: 1 },
    // 2.4 × the demo rates (1.2 L/s per well point): a partly dewatered pit (mixed masks) — level = base where dewatered.
    { fixture: 'unconfined', grid: { origin: [-1.5, -1.5], spacing_m: [1, 1], counts: [44, 24] }, time_s: 1_209_600, rateFactor: 2.4 },
    // Three times the demo rates: the head falls below the confined aquifer's top.
    { fixture: 'confined', grid: { origin: [389150, 5819350], spacing_m: [5, 5], counts: [25, 25] }, time_s: 604_800, rateFactor: 3 },
  ];
  const scaled = (fixture: 'unconfined' | 'confined', rateFactor = 1) => {
    const scenario = loadFixture(fixture);
    return { ...scenario, wells: scenario.wells.map((w) => ({ ...w, rate_m3_s: (w.rate_m3_s ?? 0) * rateFactor })) };
  };
  it.each(cases)('answers the engine\u2019s grid for the $fixture demo rounded to 0.1 mm, with flag runs that decode to its masks (t = $time_s, rates × $rateFactor)', async ({ fixture, grid, time_s, rateFactor }) => {
    const scenario = scaled(fixture, rateFactor);
    const response = await postJson(app, '/api/v1/evaluate', { scenario, grid, times_s: [time_s] });
    expect(response.status).toBe(200);
    const answer = response.json() as unknown as EvaluateAnswer;
    expect(answer.points).toBeUndefined();
    const g = answer.grids![0]!;
    const direct = evaluateGrid({ scenario, grid, time_s });
    const n = grid.counts[0] * grid.counts[1];

    expect(g.grid).toEqual(grid);
    expect(g.time_s).toBe(time_s);
    expect(g.drawdown_m).toHaveLength(n);
    for (let k = 0; k < n; k++) {
      const engine = direct.drawdown_m[k]!;
      // Rounding to 0.1 mm: never off by more than half a step, and on the 4-decimal lattice.
      expect(Math.abs(g.drawdown_m[k]! - engine)).toBeLessThanOrEqual(0.5e-4 + 1e-12);
      expect(Math.abs(g.drawdown_m[k]! * 1e4 - Math.round(g.drawdown_m[k]! * 1e4))).toBeLessThan(1e-6);
      // The documented identity level = staticLevel_m − drawdown_m holds for every node, dewatered ones included.
      expect(Math.abs(g.staticLevel_m - g.drawdown_m[k]! - direct.level_m[k]!)).toBeLessThanOrEqual(0.5e-4 + 1e-9);
    }
    expect(decodeFlagRuns(g.flagMask.runs, n)).toEqual(direct.flags);
    expect(g.flags).toEqual(direct.flagCounts);
  });

  it('covers flagged grids: the cases above include nodes with every flag', async () => {
    const seen = new Set<string>();
    for (const { fixture, grid, time_s, rateFactor } of cases) {
      const result = evaluateGrid({ scenario: scaled(fixture, rateFactor), grid, time_s });
      for (const [flag, count] of Object.entries(result.flagCounts)) if (count > 0) seen.add(flag);
    }
    expect([...seen].sort()).toEqual(Object.keys(FLAG_BITS).sort());
    expect(FLAG_BITS['beyond-boundary']).toBe(32);
  });

  it('answers one grid per requested time, alongside the points', async () => {
    const scenario = loadFixture('unconfined');
    const grid: GridSpec = { origin: [0, 0], spacing_m: [10, 10], counts: [5, 3] };
    const answer = (await postJson(app, '/api/v1/evaluate', { scenario, grid, points: [[20, 10]], times_s: [3600, null] })).json() as unknown as EvaluateAnswer;
    expect(answer.grids!.map((g) => g.time_s)).toEqual([3600, null]);
    expect(answer.points!.map((p) => p.time_s)).toEqual([3600, null]);
    // Node (2, 1) is the point (20, 10): the grid and the point agree to the rounding.
    for (const [t, g] of answer.grids!.entries()) {
      expect(Math.abs(g.drawdown_m[1 * 5 + 2]! - answer.points![t]!.drawdown_m)).toBeLessThanOrEqual(0.5e-4 + 1e-12);
    }
  });
});
