/**
 * Heavy work never stalls the service (issue 14 item 2): engine work runs on the compute pool,
 * so health and a small evaluate answer while heavy evaluates are in flight; past its time
 * budget a request is stopped with 503 DRYDIG_ERR_COMPUTE_TIMEOUT; a full queue answers 503 with
 * Retry-After; a request over wells × points × times is refused before any work starts.
 * Functional checks only: which answer came first, never how long it took.
 */
import { afterAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../../../server/app';
import { heavyEvaluateBody, smallEvaluateBody } from '../helpers/heavy-requests';

const apps: FastifyInstance[] = [];
async function app(options: Parameters<typeof buildApp>[0] = {}) {
  const a = await buildApp({ dataDir: ':memory:', clientDir: false, ...options });
  apps.push(a);
  return a;
}
afterAll(async () => {
  for (const a of apps) await a.close();
});

const evaluate = (a: FastifyInstance, body: unknown, remoteAddress: string) =>
  a.inject({ method: 'POST', url: '/api/v1/evaluate', payload: body as object, remoteAddress });

describe('heavy work on the compute pool', () => {
  it('answers health and a small evaluate of another client while four heavy evaluates are in flight', async () => {
    const a = await app({ compute: { threads: 2 } });
    // Warm the threads so the heavy requests are computing, not starting up, when health is asked.
    expect((await evaluate(a, smallEvaluateBody(), '10.0.0.9')).statusCode).toBe(200);
    const heavy = heavyEvaluateBody(1500, 200);
    let finished = 0;
    const inFlight = [0, 1, 2, 3].map(() => evaluate(a, heavy, '10.0.0.1').then((r) => { finished++; return r; }));
    const health = await a.inject({ method: 'GET', url: '/api/v1/health' });
    expect(health.statusCode).toBe(200);
    const small = await evaluate(a, smallEvaluateBody(), '10.0.0.2');
    expect(small.statusCode).toBe(200);
    expect(finished).toBe(0);
    const answers = await Promise.all(inFlight);
    expect(answers.map((r) => r.statusCode)).toEqual([200, 200, 200, 200]);
  });

  it('stops a request past its time budget with 503 DRYDIG_ERR_COMPUTE_TIMEOUT and keeps serving', async () => {
    const a = await app({ compute: { threads: 2, timeout_ms: 50 } });
    const r = await evaluate(a, heavyEvaluateBody(1500, 200), '10.0.0.1');
    expect(r.statusCode).toBe(503);
    expect(r.json().error.code).toBe('DRYDIG_ERR_COMPUTE_TIMEOUT');
    expect((await a.inject({ method: 'GET', url: '/api/v1/health' })).statusCode).toBe(200);
  });

  it('answers 503 DRYDIG_ERR_BUSY with Retry-After when the client’s queue is full', async () => {
    const a = await app({ compute: { threads: 2, maxQueuedPerClient: 1 } });
    const heavy = heavyEvaluateBody(1500, 200);
    // One runs, one waits, the third is refused.
    const answers = await Promise.all([0, 1, 2].map(() => evaluate(a, heavy, '10.0.0.1')));
    const refused = answers.filter((r) => r.statusCode === 503);
    expect(answers.map((r) => r.statusCode).sort()).toEqual([200, 200, 503]);
    expect(refused[0]!.json().error.code).toBe('DRYDIG_ERR_BUSY');
    expect(Number(refused[0]!.headers['retry-after'])).toBeGreaterThan(0);
  });

  it('refuses wells × points × times over the limit with 413 before any work starts', async () => {
    const a = await app();
    const r = await evaluate(a, heavyEvaluateBody(5000, 500), '10.0.0.1');
    expect(r.statusCode).toBe(413);
    expect(r.json().error.code).toBe('DRYDIG_ERR_WORK_TOO_LARGE');
    expect(r.json().error.message).toMatch(/^\/grid\/counts: 5000 wells × 250000 points × 1 times/);
  });
});
