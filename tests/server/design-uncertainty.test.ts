/**
 * The uncertainty options through the service (issue 11 items 1–3): `POST /api/v1/design` with a
 * Monte Carlo run split over the compute pool's threads (the same answer as in process), and the
 * design jobs (`/api/v1/design/jobs`): progress, the result, cancel, and messages naming the field.
 */
import type { FastifyInstance } from 'fastify';
import { Value } from '@sinclair/typebox/value';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildApp } from '../../server/app';
import { DesignResultSchema, runDesign } from '../../shared/design';
import { thiemRingScenario } from '../shared/design/uncertainty-fixtures';
import { postJson, type ErrorBody } from './helpers/inject-json';

let app: FastifyInstance;
beforeAll(async () => {
  app = await buildApp({ dataDir: ':memory:', clientDir: false, compute: { threads: 2 } });
});
afterAll(async () => {
  await app.close();
});

const options = { sensitivity: { factors: [0.5, 1, 2] }, monteCarlo: { runs: 40, seed: 5, kSpread: 1.5 }, robust: { oneWellOut: true } };

async function getJob(id: string) {
  const r = await app.inject({ method: 'GET', url: `/api/v1/design/jobs/${id}` });
  return { status: r.statusCode, json: JSON.parse(r.body) as { state: string; stage: string; fraction: number; result?: Record<string, unknown>; error?: ErrorBody } };
}

describe('POST /api/v1/design with the uncertainty options', () => {
  it('answers the sensitivity table, the robust design and the Monte Carlo block on worker threads, equal to the run in process', async () => {
    const scenario = thiemRingScenario();
    const r = await postJson(app, '/api/v1/design', { scenario, options });
    expect(r.status).toBe(200);
    const json = r.json();
    expect(Value.Check(DesignResultSchema, json)).toBe(true);
    const direct = await runDesign({ scenario, options });
    const u = json.uncertainty as NonNullable<typeof direct.uncertainty>;
    expect(u.workers).toBe(2);
    expect(u.totalRate_m3_s).toEqual(direct.uncertainty!.totalRate_m3_s);
    expect(u.probabilityMet).toBe(direct.uncertainty!.probabilityMet);
    expect(json.sensitivity).toEqual(direct.sensitivity);
    expect((json.robust as unknown[]).length).toBe(1);
  }, 180_000);

  it('names the field of a bad option with its JSON pointer', async () => {
    const r = await postJson(app, '/api/v1/design', { scenario: thiemRingScenario(), options: { monteCarlo: { runs: 100_000_000 } } });
    expect(r.status).toBe(400);
    expect((r.json().error as ErrorBody).issues?.[0]?.path).toBe('/options/monteCarlo/runs');
    const s = await postJson(app, '/api/v1/design', { scenario: { ...thiemRingScenario(), designOptions: { robust: { conductivityFactor: 0.5 } } } });
    expect(s.status).toBe(400);
    expect((s.json().error as ErrorBody).issues?.[0]?.path).toBe('/scenario/designOptions/robust/conductivityFactor');
  });
});

describe('design jobs', () => {
  it('starts a job, reports progress in realisations and answers the result when done', async () => {
    // Enough realisations that the Monte Carlo stage lasts many polls (the poll samples the
    // latest stage only; with 60 a fast solve could finish between two polls).
    const started = await postJson(app, '/api/v1/design/jobs', { scenario: thiemRingScenario(), options: { monteCarlo: { runs: 300, seed: 3, kSpread: 1.5 } } });
    expect(started.status).toBe(202);
    const { id, state } = started.json() as { id: string; state: string };
    expect(state).toBe('running');
    const stages = new Set<string>();
    let job = await getJob(id);
    while (job.json.state === 'running') {
      stages.add(job.json.stage);
      await new Promise((resolve) => setTimeout(resolve, 20));
      job = await getJob(id);
    }
    expect(job.json.state).toBe('done');
    expect(job.json.fraction).toBe(1);
    expect(Value.Check(DesignResultSchema, job.json.result)).toBe(true);
    expect((job.json.result!.uncertainty as { runs: number }).runs).toBe(300);
    expect([...stages].some((st) => /^monte carlo \d+\/300$/.test(st))).toBe(true);
  }, 180_000);

  it('cancels a running job', async () => {
    const started = await postJson(app, '/api/v1/design/jobs', { scenario: thiemRingScenario(), options: { monteCarlo: { runs: 5000 } } });
    const { id } = started.json() as { id: string };
    const del = await app.inject({ method: 'DELETE', url: `/api/v1/design/jobs/${id}` });
    expect(del.statusCode).toBe(200);
    expect((JSON.parse(del.body) as { state: string }).state).toBe('cancelled');
    await new Promise((resolve) => setTimeout(resolve, 300));
    expect((await getJob(id)).json.state).toBe('cancelled');
    // The pool is free again: nothing of the cancelled job waits or runs.
    await expect.poll(() => app.compute.stats().running + app.compute.stats().queued, { timeout: 30_000 }).toBe(0);
  }, 120_000);

  it('answers 404 naming the id for an unknown job, and 400 naming the field for a bad body', async () => {
    const r = await getJob('no-such-job');
    expect(r.status).toBe(404);
    expect((r.json as unknown as { error: ErrorBody }).error.issues?.[0]?.path).toBe('/id');
    const bad = await postJson(app, '/api/v1/design/jobs', { scenario: thiemRingScenario(), options: { monteCarlo: { runs: 10, seed: -1 } } });
    expect(bad.status).toBe(400);
    expect((bad.json().error as ErrorBody).issues?.[0]?.path).toBe('/options/monteCarlo/seed');
  });
});
