/**
 * The four 500s found with hostile requests (issue 14 item 3), each now a 4xx or a design result
 * with a reason.
 */
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../../server/app';
import { solveLinearProgram } from '../../shared/design';
import { loadFixture } from './helpers/demo-fixtures';
import { heavyEvaluateBody } from './helpers/heavy-requests';
import { classifyError } from '../../server/error-handling';
import { busyError } from '../../server/compute/compute-pool';
import { DrydigError } from '../../shared/schema';

let app: FastifyInstance;
beforeAll(async () => {
  app = await buildApp({ dataDir: ':memory:', clientDir: false, compute: { threads: 2 } });
});
afterAll(() => app.close());

const post = (url: string, payload: unknown) => app.inject({ method: 'POST', url, payload: payload as object });

describe('no 500 from the inputs that gave one', () => {
  it('design options that drive the Theis argument u to 0 (a pumping duration of 1e308 s) answer 400 naming the field', async () => {
    const base = loadFixture('confined');
    const scenario = { ...base, aquifer: { ...base.aquifer, conductivity_m_s: 0.5 } };
    const r = await post('/api/v1/design', { scenario, options: { duration_s: 1e308 } });
    expect(r.statusCode).toBe(400);
    expect(r.json().error.issues[0].path).toBe('/options/duration_s');
    expect(r.json().error.message).toMatch(/at most 10000000000 s/);
  });

  it('a design whose quick check has no finite estimate (a design time of 1e-9 s) answers 200 with a null estimate and its reason', async () => {
    const scenario = { ...loadFixture('unconfined'), design: { time_s: 1e-9 } };
    const r = await post('/api/v1/design', { scenario });
    expect(r.statusCode).toBe(200);
    const check = r.json().quickCheck[0];
    expect(check.equivalentWellInflow_m3_s).toBeNull();
    expect(check.note).toMatch(/not a finite number/);
  });

  it('deeply nested JSON answers 400 instead of overflowing the stack, on every route that takes a body', async () => {
    const deep = '['.repeat(100_000) + ']'.repeat(100_000);
    for (const url of ['/api/v1/evaluate', '/api/v1/design', '/api/v1/scenarios', '/api/v1/section', '/api/v1/pumping-test']) {
      const r = await app.inject({ method: 'POST', url, payload: `{"scenario":{"extra":${deep}}}`, headers: { 'content-type': 'application/json' } });
      expect([url, r.statusCode, r.json().error.code]).toEqual([url, 400, 'DRYDIG_ERR_INVALID_REQUEST']);
      expect(r.json().error.message).toMatch(/deeper than 64 levels/);
    }
  });

  it('a problem HiGHS refuses (passModel status -1) comes back as status error with the solver’s words, not a throw', async () => {
    const problem = { cost: [1, 1], lower: [0, 0], upper: [1, 1], rows: [{ columns: [0, 1], coefficients: [1e300, 1], lower: 1, upper: Infinity }] };
    const solution = await solveLinearProgram(problem);
    expect(solution.status).toBe('error');
    expect(solution.detail).toMatch(/passModel failed with HiGHS status -1/);
    // The runtime still solves the next problem.
    const next = await solveLinearProgram({ ...problem, rows: [{ columns: [0, 1], coefficients: [1, 1], lower: 1, upper: Infinity }] });
    expect(next.status).toBe('optimal');
  });

  it('a design request never depends on a shared LP worker: designs solve inside the pool threads', async () => {
    const answers = await Promise.all([0, 1, 2].map(() => post('/api/v1/design', { scenario: loadFixture('confined'), mode: 'optimal' })));
    expect(answers.map((r) => r.statusCode)).toEqual([200, 200, 200]);
  });
});

/** Found by the route fuzz (tests/server/fuzz-*.test.ts). */
describe('no 5xx from the inputs the route fuzz found', () => {
  it('a section 60 m wide over a layer 10 km deep is refused before the solve (400 naming /mesh), not stopped at its time budget with 503', async () => {
    const doc = JSON.parse(readFileSync(new URL('../../fixtures/sections/sheet-pile-cofferdam.json', import.meta.url), 'utf8')) as { layers: Array<{ bottom_m: number }> };
    doc.layers[doc.layers.length - 1]!.bottom_m = -10_000;
    const r = await post('/api/v1/section', { section: doc, flowNet: false });
    expect(r.statusCode).toBe(400);
    expect(r.json().error.code).toBe('DRYDIG_ERR_SECTION_TOO_LARGE');
    expect(r.json().error.issues[0].path).toBe('/mesh');
    expect(r.json().error.message).toMatch(/^\/mesh: the mesh would be \d+ × \d+ cells, \d+ cells deep/);
  });

  it('a request stopped at its time budget says so (503 with the budget), not "an unexpected error"', async () => {
    const a = await buildApp({ dataDir: ':memory:', clientDir: false, compute: { threads: 2, timeout_ms: 50 } });
    try {
      const r = await a.inject({ method: 'POST', url: '/api/v1/evaluate', payload: heavyEvaluateBody(1500, 200) });
      expect(r.statusCode).toBe(503);
      expect(r.json().error.code).toBe('DRYDIG_ERR_COMPUTE_TIMEOUT');
      expect(r.json().error.message).toMatch(/did not finish within its 0\.05 s budget/);
    } finally {
      await a.close();
    }
  });

  it('the service’s own 503 refusals keep their words; a 500 keeps only the generic ones', () => {
    const busy = classifyError(busyError('the service is busy: 32 computations are already waiting; try again in 5 s', 5));
    expect([busy.status, busy.internal, busy.body.error.message]).toEqual([503, false, 'the service is busy: 32 computations are already waiting; try again in 5 s']);
    const internal = classifyError(new DrydigError('DRYDIG_ERR_INTERNAL', 'SQLITE_CORRUPT at page 7 of /secret/path'));
    expect(internal.status).toBe(500);
    expect(internal.body.error.message).not.toMatch(/secret/);
  });
});
