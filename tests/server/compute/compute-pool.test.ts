/**
 * The compute pool on real worker threads: answers, time budgets, refusals, cancellation,
 * progress, and fairness between clients (sleep tasks stand in for long solves; no timing is
 * asserted, only which job finished first).
 */
import { afterAll, describe, expect, it } from 'vitest';
import { createComputePool } from '../../../server/compute';
import { DrydigError } from '../../../shared/schema';

const pool = createComputePool({ threads: 2, timeout_ms: 20_000, maxQueued: 3, maxQueuedPerClient: 2 });
afterAll(() => pool.close());

async function codeOf(promise: Promise<unknown>): Promise<string> {
  try {
    await promise;
    return 'resolved';
  } catch (error) {
    return error instanceof DrydigError ? error.code : `raw: ${String(error)}`;
  }
}

describe('compute pool', () => {
  it('runs a task on a thread and keeps a DrydigError’s code across the thread boundary', async () => {
    expect(await pool.run('sleep', { ms: 1 })).toEqual({ slept_ms: 1 });
    const bad = pool.run('pumpingTest', { readings: [], path: '' });
    expect(await codeOf(bad)).toBe('DRYDIG_ERR_INVALID_READINGS');
  });

  it('stops a job past its time budget with DRYDIG_ERR_COMPUTE_TIMEOUT, and the next job runs', async () => {
    expect(await codeOf(pool.run('sleep', { ms: 60_000 }, { timeout_ms: 300 }))).toBe('DRYDIG_ERR_COMPUTE_TIMEOUT');
    expect(await pool.run('sleep', { ms: 1 })).toEqual({ slept_ms: 1 });
  });

  it('cancels a running job when its signal aborts', async () => {
    const controller = new AbortController();
    const job = pool.run('sleep', { ms: 60_000 }, { signal: controller.signal });
    setTimeout(() => controller.abort(), 200);
    expect(await codeOf(job)).toBe('DRYDIG_ERR_CANCELLED');
  });

  it('a small job of one client finishes while another client’s long jobs hold their thread', async () => {
    const order: string[] = [];
    const long1 = pool.run('sleep', { ms: 4000 }, { client: 'A', lane: 'long' }).then(() => order.push('A long 1'));
    const long2 = pool.run('sleep', { ms: 4000 }, { client: 'A', lane: 'long' }).then(() => order.push('A long 2'));
    const small = pool.run('sleep', { ms: 5 }, { client: 'B' }).then(() => order.push('B small'));
    await Promise.all([long1, long2, small]);
    expect(order[0]).toBe('B small');
  });

  it('refuses with DRYDIG_ERR_BUSY (and a Retry-After) when its queue is full', async () => {
    const jobs = [0, 1, 2, 3, 4, 5].map((k) => pool.run('sleep', { ms: 1500 }, { client: `C${k}` }));
    const refused = pool.run('sleep', { ms: 1 }, { client: 'D' });
    const error = await refused.catch((e: unknown) => e);
    expect(error).toBeInstanceOf(DrydigError);
    expect((error as DrydigError).code).toBe('DRYDIG_ERR_BUSY');
    expect((error as { retryAfter_s?: number }).retryAfter_s).toBeGreaterThan(0);
    await Promise.allSettled(jobs);
  });

  it('passes progress from the thread to the caller', async () => {
    const stages: string[] = [];
    const { readFileSync } = await import('node:fs');
    const scenario = JSON.parse(readFileSync('fixtures/demo-deepwells-confined.json', 'utf8'));
    const result = await pool.run('design', { scenario, mode: 'uniform' }, { onProgress: (stage) => stages.push(stage) });
    expect(result.mode).toBe('uniform');
    expect(stages).toContain('control points');
  });
});
