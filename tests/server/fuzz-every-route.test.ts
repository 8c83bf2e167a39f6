/**
 * The route fuzz covers every route (issue 14 item 3): each operation of the OpenAPI document
 * (`GET /api/v1/openapi.json`) has a fuzz case in helpers/fuzz-routes.ts, and none is stale. The
 * compute routes are fuzzed in fuzz-compute-routes.test.ts, the storage and share-link routes in
 * fuzz-storage-routes.test.ts; the sign-in routes and the service's own routes here.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fuzzRoute, startFuzzApp, type FuzzApp } from './helpers/fuzz-harness';
import { ROUTE_CASES } from './helpers/fuzz-routes';

let fuzz: FuzzApp;
beforeAll(async () => {
  fuzz = await startFuzzApp();
}, 60_000);
afterAll(() => fuzz.close());

/** `/api/v1/scenarios/:id` → `/api/v1/scenarios/{id}`, as the OpenAPI document writes paths. */
const openApiPath = (route: string) => route.replace(/:([A-Za-z]+)/g, '{$1}');

describe('the route fuzz', () => {
  it('has a case for every operation of the OpenAPI document, and no case for a route that is gone', async () => {
    const r = await fuzz.app.inject({ method: 'GET', url: '/api/v1/openapi.json' });
    expect(r.statusCode).toBe(200);
    const paths = (r.json() as { paths: Record<string, Record<string, unknown>> }).paths;
    const documented = Object.entries(paths).flatMap(([p, ops]) => Object.keys(ops).map((m) => `${m.toUpperCase()} ${p}`)).sort();
    const fuzzed = ROUTE_CASES.map((c) => `${c.method} ${openApiPath(c.route)}`).sort();
    expect(fuzzed).toEqual(documented);
    expect(documented.length).toBeGreaterThanOrEqual(37);
  });
});

describe('hostile requests to the sign-in routes and the service routes', () => {
  for (const c of ROUTE_CASES.filter((r) => r.group === 'auth' || r.group === 'meta')) {
    it(`${c.method} ${c.route} never answers 5xx and refuses with a coded JSON error (${c.numRuns} requests)`, async () => {
      await fuzzRoute(fuzz, `${c.method} ${c.route}`, c.requests(fuzz.world), c.numRuns);
    }, 120_000);
  }
});
