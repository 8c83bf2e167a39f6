/**
 * A grid split into bands of rows (threads on the server and in the CLI) gives the same answer
 * as the whole-grid evaluation, byte for byte: bands keep the whole grid's node coordinates and
 * kernel chunks (shared/field/evaluate-grid.ts `evaluateGridBand`). Exact identity, no tolerance.
 */
import { describe, expect, it } from 'vitest';
import { evaluateGridBandForRequest, joinGridBands, runEvaluation, runEvaluationInBands, splitRows, type RunEvaluationOptions } from '../../../server/evaluation';
import { buildApp } from '../../../server/app';
import type { GridSpec } from '../../../shared/field';
import type { Scenario } from '../../../shared/schema';
import { loadFixture } from '../helpers/demo-fixtures';

const inProcess = (bands: number) => ({
  bands,
  runPoints: async (o: RunEvaluationOptions) => runEvaluation(o),
  runBand: async (b: Parameters<typeof evaluateGridBandForRequest>[0]) => evaluateGridBandForRequest(b),
});

function gridAround(s: Scenario, n: number): GridSpec {
  const xs = s.wells.map((w) => w.x);
  const ys = s.wells.map((w) => w.y);
  const x0 = Math.min(...xs) - 40.3;
  const y0 = Math.min(...ys) - 35.7;
  return { origin: [x0, y0], spacing_m: [(Math.max(...xs) - x0 + 40) / (n - 1), (Math.max(...ys) - y0 + 40) / (n - 2)], counts: [n, n - 1] };
}

describe('splitRows', () => {
  it('covers every row once, in order, in nearly equal bands', () => {
    for (const [ny, parts] of [[1, 4], [7, 3], [250, 2], [250, 7]] as const) {
      const bands = splitRows(ny, parts);
      expect(bands[0]![0]).toBe(0);
      expect(bands[bands.length - 1]![1]).toBe(ny);
      for (let b = 1; b < bands.length; b++) expect(bands[b]![0]).toBe(bands[b - 1]![1]);
      const sizes = bands.map(([a, c]) => c - a);
      expect(Math.max(...sizes) - Math.min(...sizes)).toBeLessThanOrEqual(1);
      expect(Math.min(...sizes)).toBeGreaterThan(0);
    }
  });
});

describe('runEvaluationInBands', () => {
  it.each([
    ['unconfined well points (Dupuit/Theis on the potential)', 'unconfined'],
    ['confined deep wells with a boundary', 'confined'],
  ] as const)('equals runEvaluation byte for byte: %s, points and several times, 2, 3 and 5 bands', async (_name, fixture) => {
    const scenario = loadFixture(fixture);
    const grid = gridAround(scenario, 41);
    const options: RunEvaluationOptions = { scenario, grid, points: [[scenario.wells[0]!.x + 3, scenario.wells[0]!.y]], times_s: [3600, 86400, scenario.design.time_s] };
    const whole = JSON.stringify(runEvaluation(options));
    for (const bands of [2, 3, 5]) expect(JSON.stringify(await runEvaluationInBands(options, inProcess(bands))), `${bands} bands`).toBe(whole);
  });

  it('equals the whole grid without points, and bands joined equal evaluateGrid exactly', async () => {
    const scenario = loadFixture('confined');
    const grid = gridAround(scenario, 37);
    const options: RunEvaluationOptions = { scenario, grid };
    expect(JSON.stringify(await runEvaluationInBands(options, inProcess(4)))).toBe(JSON.stringify(runEvaluation(options)));
    const whole = evaluateGridBandForRequest({ scenario, grid, time_s: scenario.design.time_s, rows: [0, grid.counts[1]] });
    const joined = joinGridBands(grid, splitRows(grid.counts[1], 3).map((rows) => evaluateGridBandForRequest({ scenario, grid, time_s: scenario.design.time_s, rows })));
    expect(Array.from(joined.level_m)).toEqual(Array.from(whole.level_m));
    expect(Array.from(joined.flags)).toEqual(Array.from(whole.flags));
    expect(joined.flagCounts).toEqual(whole.flagCounts);
  });

  it('places a band’s scenario error in the caller’s document', () => {
    const scenario = loadFixture('confined');
    const broken = { ...scenario, aquifer: { ...scenario.aquifer, storativity: undefined } } as unknown as Scenario;
    let caught: unknown;
    try {
      evaluateGridBandForRequest({ scenario: broken, grid: gridAround(scenario, 9), time_s: 3600, rows: [0, 4], scenarioPath: '/scenario' });
    } catch (error) {
      caught = error;
    }
    expect((caught as { code?: string }).code).toMatch(/^DRYDIG_ERR_/);
    expect(JSON.stringify((caught as { issues?: unknown }).issues ?? [])).toContain('/scenario');
  });
});

describe('POST /api/v1/evaluate on a pool of threads', () => {
  it('splits a large grid over the threads a client may hold and answers as the in-process evaluation does', async () => {
    const scenario = loadFixture('unconfined');
    const grid = gridAround(scenario, 260); // wells × nodes over the split threshold
    const app = await buildApp({ dataDir: ':memory:', clientDir: false, compute: { threads: 3 } });
    try {
      const res = await app.inject({ method: 'POST', url: '/api/v1/evaluate', payload: { scenario, grid } });
      expect(res.statusCode).toBe(200);
      // The route's serializer orders keys by its schema; the values are the same to the last digit.
      expect(res.json()).toEqual(JSON.parse(JSON.stringify(runEvaluation({ scenario, grid, scenarioPath: '/scenario' }))));
    } finally {
      await app.close();
    }
  }, 120_000);
});
