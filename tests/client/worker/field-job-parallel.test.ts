/**
 * Full grids split by rows over strip workers (issue 15 item 2, browser part): the strips come
 * back in any order and the map is bit for bit the one computed in the engine worker alone;
 * a cancelled job drops its strips not yet started; an engine refusal keeps its code and fields.
 */
import { describe, expect, it } from 'vitest';
import { evaluateGridInStrips, JobCancelled, runFieldJob } from '../../../client/worker/field-job';
import { StripPool, stripWorkerCount, MAX_STRIP_WORKERS, type StripWorker } from '../../../client/worker/strip-pool';
import type { StripRequest, StripResponse } from '../../../client/worker/grid-strip-protocol';
import { evaluateGrid } from '../../../shared/field';
import { DrydigError, type Scenario } from '../../../shared/schema';
import wellpointsDemo from '../../../fixtures/demo-wellpoints-unconfined.json';
import deepwellsDemo from '../../../fixtures/demo-deepwells-confined.json';
import type { GridSpec } from '../../../shared/field/types';

/** A stand-in strip worker: evaluates on a later macrotask, slower for some strips, so strips finish out of order. */
class FakeStripWorker implements StripWorker {
  onmessage: ((event: MessageEvent<StripResponse>) => void) | null = null;
  started: number[] = [];
  constructor(private readonly delay_ms: number) {}
  postMessage(message: StripRequest): void {
    this.started.push(message.id);
    setTimeout(() => {
      let reply: StripResponse;
      try {
        reply = { id: message.id, result: evaluateGrid({ scenario: message.scenario, grid: message.grid, time_s: message.time_s }) };
      } catch (error) {
        reply = error instanceof DrydigError
          ? { id: message.id, error: error.message, drydig: { code: error.code, issues: error.issues } }
          : { id: message.id, error: String(error) };
      }
      this.onmessage?.({ data: reply } as MessageEvent<StripResponse>);
    }, this.delay_ms);
  }
  terminate(): void {}
}

const cases: Array<[string, Scenario]> = [
  ['well-point demo (unconfined, 66 wells)', wellpointsDemo as unknown as Scenario],
  ['deep-well demo (confined)', deepwellsDemo as unknown as Scenario],
];

function viewGrid(s: Scenario, nodes: number): GridSpec {
  const xs = s.wells.map((w) => w.x);
  const ys = s.wells.map((w) => w.y);
  const x0 = Math.min(...xs) - 60;
  const y0 = Math.min(...ys) - 60;
  const step = Math.max(Math.max(...xs) + 60 - x0, Math.max(...ys) + 60 - y0) / (nodes - 1);
  return { origin: [x0, y0], spacing_m: [step, step], counts: [nodes, nodes - 7] };
}

describe('evaluateGridInStrips with strip workers (one per core)', () => {
  it.each(cases)('gives the map bit for bit as the engine worker alone does, strips arriving out of order: %s', async (_name, s) => {
    const grid = viewGrid(s, 61);
    const pool = new StripPool([new FakeStripWorker(3), new FakeStripWorker(0)]);
    const progress: number[] = [];
    const alone = await evaluateGridInStrips(s, grid, s.design.time_s, 4);
    const split = await evaluateGridInStrips(s, grid, s.design.time_s, 4, { parallel: { evaluate: pool.evaluate, strips: 4 }, progress: (f) => progress.push(f) });
    expect(Array.from(split.level_m)).toEqual(Array.from(alone.level_m));
    expect(Array.from(split.drawdown_m)).toEqual(Array.from(alone.drawdown_m));
    expect(Array.from(split.flags)).toEqual(Array.from(alone.flags));
    expect(split.flagCounts).toEqual(alone.flagCounts);
    expect(split.model).toEqual(alone.model);
    expect(progress).toEqual([0.25, 0.5, 0.75, 1]);
    // And the strips agree with one whole-grid evaluation (node coordinates differ by rounding only).
    const whole = evaluateGrid({ scenario: s, grid, time_s: s.design.time_s });
    let worst = 0;
    for (let k = 0; k < whole.level_m.length; k++) worst = Math.max(worst, Math.abs(whole.level_m[k]! - split.level_m[k]!));
    expect(worst).toBeLessThan(1e-9);
  });

  it('drops the strips not yet started once the job is cancelled, and says so', async () => {
    const s = wellpointsDemo as unknown as Scenario;
    const workers = [new FakeStripWorker(1), new FakeStripWorker(1)];
    const pool = new StripPool(workers);
    let cancel = false;
    const job = evaluateGridInStrips(s, viewGrid(s, 41), s.design.time_s, 8, {
      parallel: { evaluate: pool.evaluate, strips: 8 },
      progress: () => (cancel = true),
      isCancelled: () => cancel,
    });
    await expect(job).rejects.toBeInstanceOf(JobCancelled);
    const started = workers[0]!.started.length + workers[1]!.started.length;
    expect(started).toBeLessThan(8);
  });

  it('runs a whole field job on strip workers with the same contours and shortfall', async () => {
    const s = wellpointsDemo as unknown as Scenario;
    const req = { kind: 'field' as const, id: 1, scenario: s, grid: viewGrid(s, 51), time_s: s.design.time_s, quantity: 'level' as const, strips: 6 };
    const pool = new StripPool([new FakeStripWorker(0), new FakeStripWorker(2)]);
    const alone = await runFieldJob(req);
    const split = await runFieldJob(req, { parallel: { evaluate: pool.evaluate, strips: 4 } });
    expect(split.contours).toEqual(alone.contours);
    expect(split.shortfall).toEqual(alone.shortfall);
  });

  it('keeps an engine refusal\'s code and fields when a strip worker refuses', async () => {
    const s = wellpointsDemo as unknown as Scenario;
    const grid: GridSpec = { ...viewGrid(s, 11), spacing_m: [-1, 5] };
    let direct: unknown;
    try {
      evaluateGrid({ scenario: s, grid, time_s: s.design.time_s });
    } catch (e) {
      direct = e;
    }
    expect(direct).toBeInstanceOf(DrydigError);
    const pool = new StripPool([new FakeStripWorker(0)]);
    const job = evaluateGridInStrips(s, grid, s.design.time_s, 2, { parallel: { evaluate: pool.evaluate, strips: 2 } });
    await expect(job).rejects.toMatchObject({ code: (direct as DrydigError).code, issues: (direct as DrydigError).issues });
  });
});

describe('stripWorkerCount(cores) starts one strip worker per core', () => {
  it.each([[undefined, 1], [1, 1], [2, 2], [6, 6], [64, MAX_STRIP_WORKERS], [Number.NaN, 1]])('%s cores → %s workers', (cores, n) => {
    expect(stripWorkerCount(cores)).toBe(n);
  });
});
