/**
 * Bad evaluate requests: each is answered 400/413/415 with a stable code from ERROR_TABLE, the
 * table's fix line, and a message naming the field by its JSON pointer — never a 500 or a stack.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../../../server/app';
import { ERROR_TABLE, type ErrorCode, type Scenario } from '../../../shared/schema';
import { loadFixture } from '../helpers/demo-fixtures';
import type { ErrorBody } from '../helpers/inject-json';

let app: FastifyInstance;
let small: FastifyInstance;
beforeAll(async () => {
  app = await buildApp({ clientDir: false, dataDir: ':memory:' });
  small = await buildApp({ clientDir: false, dataDir: ':memory:', bodyLimit_bytes: 20_000, maxGridNodes: 1000, maxPoints: 10 });
});
afterAll(async () => {
  await app.close();
  await small.close();
});

const base = () => ({ scenario: loadFixture('unconfined'), points: [[20, 10]] as unknown[] });
const withScenario = (edit: (s: Scenario & Record<string, unknown>) => void) => {
  const body = base();
  edit(body.scenario as Scenario & Record<string, unknown>);
  return body;
};
const confinedFixture = () => loadFixture('confined') as Scenario & { aquifer: Record<string, unknown> };

interface BadCase {
  name: string;
  /** Raw payload (string) or a value sent as JSON. */
  body?: unknown;
  raw?: string;
  contentType?: string;
  useSmallApp?: boolean;
  status: number;
  code: ErrorCode;
  /** The JSON pointer the first issue (and the message) must name; undefined = no issues list. */
  path?: string;
  /** Words the message must contain. */
  says?: string;
}

const cases: BadCase[] = [
  { name: 'malformed JSON', raw: '{"scenario": {', status: 400, code: 'DRYDIG_ERR_MALFORMED_JSON' },
  { name: 'an empty JSON body', raw: '', status: 400, code: 'DRYDIG_ERR_MALFORMED_JSON' },
  { name: 'a prototype-poisoning key', raw: '{"__proto__": {"x": 1}}', status: 400, code: 'DRYDIG_ERR_MALFORMED_JSON' },
  { name: 'a text/plain body', raw: 'x,y\n1,2', contentType: 'text/plain', status: 415, code: 'DRYDIG_ERR_UNSUPPORTED_MEDIA_TYPE' },
  { name: 'an XML body', raw: '<scenario/>', contentType: 'application/xml', status: 415, code: 'DRYDIG_ERR_UNSUPPORTED_MEDIA_TYPE' },
  { name: 'a body over the size limit', body: { ...base(), points: Array.from({ length: 3000 }, (_, k) => [k, k]) }, useSmallApp: true, status: 413, code: 'DRYDIG_ERR_BODY_TOO_LARGE' },
  { name: 'an array instead of an object', body: [1, 2], status: 400, code: 'DRYDIG_ERR_INVALID_REQUEST', path: '', says: 'object' },
  { name: 'no scenario', body: { points: [[1, 2]] }, status: 400, code: 'DRYDIG_ERR_INVALID_REQUEST', path: '/scenario', says: 'required' },
  { name: 'a confined aquifer without storativity', body: (() => { const s = confinedFixture(); delete s.aquifer.storativity; return { scenario: s, points: [[0, 0]] }; })(), status: 400, code: 'DRYDIG_ERR_INVALID_SCENARIO', path: '/scenario/aquifer/storativity', says: 'required for a confined aquifer' },
  { name: 'a wrong format name', body: withScenario((s) => { s.format = 'other' as 'drydig.scenario'; }), status: 400, code: 'DRYDIG_ERR_INVALID_SCENARIO', path: '/scenario/format' },
  { name: 'a rate given as text', body: withScenario((s) => { (s.wells[3] as Record<string, unknown>).rate_m3_s = '0.002'; }), status: 400, code: 'DRYDIG_ERR_INVALID_SCENARIO', path: '/scenario/wells/3/rate_m3_s', says: 'number' },
  { name: 'an aquifer base above ground', body: withScenario((s) => { s.aquifer.base_m = 20; }), status: 400, code: 'DRYDIG_ERR_INVALID_SCENARIO', path: '/scenario/aquifer/base_m' },
  { name: 'a misspelt aquifer field', body: withScenario((s) => { (s.aquifer as Record<string, unknown>).conductivity = 1e-4; }), status: 400, code: 'DRYDIG_ERR_INVALID_SCENARIO', path: '/scenario/aquifer/conductivity' },
  { name: 'three boundaries (the engine refuses them)', body: withScenario((s) => { s.boundaries = [0, 1, 2].map((k) => ({ kind: 'no-flow' as const, from: [-100 - k * 10, -500] as [number, number], to: [-100 - k * 10, 500] as [number, number] })); }), status: 400, code: 'DRYDIG_ERR_UNSUPPORTED_BOUNDARIES', path: '/scenario/boundaries/2' },
  { name: 'points that are not a list', body: { ...base(), points: '20,10' }, status: 400, code: 'DRYDIG_ERR_INVALID_REQUEST', path: '/points', says: 'array' },
  { name: 'a point with three coordinates', body: { ...base(), points: [[1, 2], [1, 2, 3]] }, status: 400, code: 'DRYDIG_ERR_INVALID_REQUEST', path: '/points/1' },
  { name: 'a coordinate given as text', body: { ...base(), points: [[1, 'a']] }, status: 400, code: 'DRYDIG_ERR_INVALID_REQUEST', path: '/points/0/1', says: 'a number' },
  { name: 'a coordinate that overflows to Infinity', raw: `{"scenario": ${JSON.stringify(loadFixture('unconfined'))}, "points": [[1e400, 0]]}`, status: 400, code: 'DRYDIG_ERR_INVALID_REQUEST', path: '/points/0/0' },
  { name: 'a zero time', body: { ...base(), times_s: [0] }, status: 400, code: 'DRYDIG_ERR_INVALID_REQUEST', path: '/times_s/0', says: '> 0 or null' },
  { name: 'a negative time', body: { ...base(), times_s: [3600, -5] }, status: 400, code: 'DRYDIG_ERR_INVALID_REQUEST', path: '/times_s/1' },
  { name: 'a time given as text', body: { ...base(), times_s: ['steady'] }, status: 400, code: 'DRYDIG_ERR_INVALID_REQUEST', path: '/times_s/0', says: 'a number or null' },
  { name: 'an infinite time', raw: `{"scenario": ${JSON.stringify(loadFixture('unconfined'))}, "points": [[1, 0]], "times_s": [1e999]}`, status: 400, code: 'DRYDIG_ERR_INVALID_REQUEST', path: '/times_s/0' },
  { name: 'an empty list of times', body: { ...base(), times_s: [] }, status: 400, code: 'DRYDIG_ERR_INVALID_REQUEST', path: '/times_s', says: 'at least 1' },
  { name: 'an unknown top-level field', body: { ...base(), time_s: 3600 }, status: 400, code: 'DRYDIG_ERR_INVALID_REQUEST', path: '/time_s', says: 'not a known field' },
  { name: 'neither points nor a grid', body: { scenario: loadFixture('unconfined') }, status: 400, code: 'DRYDIG_ERR_INVALID_REQUEST', path: '/points' },
  { name: 'a grid without an origin', body: { ...base(), grid: { spacing_m: [1, 1], counts: [2, 2] } }, status: 400, code: 'DRYDIG_ERR_INVALID_REQUEST', path: '/grid/origin' },
  { name: 'a grid with zero spacing', body: { ...base(), grid: { origin: [0, 0], spacing_m: [0, 1], counts: [2, 2] } }, status: 400, code: 'DRYDIG_ERR_INVALID_REQUEST', path: '/grid/spacing_m/0' },
  { name: 'a grid with a fractional count', body: { ...base(), grid: { origin: [0, 0], spacing_m: [1, 1], counts: [2.5, 2] } }, status: 400, code: 'DRYDIG_ERR_INVALID_REQUEST', path: '/grid/counts/0', says: 'whole number' },
  { name: 'a grid with no nodes', body: { ...base(), grid: { origin: [0, 0], spacing_m: [1, 1], counts: [0, 2] } }, status: 400, code: 'DRYDIG_ERR_INVALID_REQUEST', path: '/grid/counts/0' },
  { name: 'a grid over the node limit', body: { ...base(), grid: { origin: [0, 0], spacing_m: [1, 1], counts: [600, 500] } }, status: 400, code: 'DRYDIG_ERR_GRID_TOO_LARGE', path: '/grid/counts', says: '300000' },
  { name: 'a grid over the limit only once times are counted', body: { ...base(), grid: { origin: [0, 0], spacing_m: [1, 1], counts: [20, 30] }, times_s: [3600, 7200] }, useSmallApp: true, status: 400, code: 'DRYDIG_ERR_GRID_TOO_LARGE', path: '/grid/counts', says: '× 2 times' },
  { name: 'more points than the schema limit', body: { ...base(), points: Array.from({ length: 11 }, () => [1, 1]) }, useSmallApp: true, status: 400, code: 'DRYDIG_ERR_INVALID_REQUEST', path: '/points', says: 'at most 10' },
  { name: 'more points × times than the limit', body: { ...base(), points: Array.from({ length: 6 }, () => [1, 1]), times_s: [3600, 7200] }, useSmallApp: true, status: 400, code: 'DRYDIG_ERR_TOO_MANY_POINTS', path: '/times_s' },
];

describe('POST /api/v1/evaluate refuses bad requests', () => {
  it.each(cases)('answers $name with $status $code naming the field', async (c) => {
    const target = c.useSmallApp ? small : app;
    const payload = c.raw ?? JSON.stringify(c.body);
    const response = await target.inject({
      method: 'POST',
      url: '/api/v1/evaluate',
      headers: { 'content-type': c.contentType ?? 'application/json' },
      payload,
    });
    expect(response.statusCode).toBe(c.status);
    expect(response.headers['content-type']).toMatch(/^application\/json/);
    const { error } = JSON.parse(response.body) as { error: ErrorBody };
    expect(error.code).toBe(c.code);
    expect(ERROR_TABLE[c.code].status).toBe(c.status);
    expect(error.fix).toBe(ERROR_TABLE[c.code].fix);
    expect(response.body).not.toMatch(/\n\s+at |node_modules|\.ts:\d+/);
    if (c.path !== undefined) {
      expect(error.issues?.[0]?.path).toBe(c.path);
      if (c.path !== '') expect(error.message.startsWith(`${c.path}:`) || error.message.includes(`${c.path}:`)).toBe(true);
    }
    if (c.says) expect(error.message).toContain(c.says);
  });
});

describe('routes that do not exist', () => {
  const cases = [
    { method: 'GET' as const, url: '/api/v1/evaluate' },
    { method: 'POST' as const, url: '/api/v1/evaluations' },
    { method: 'GET' as const, url: '/api/v2/health' },
    { method: 'DELETE' as const, url: '/api/v1/health' },
  ];
  it.each(cases)('$method $url answers a JSON 404 DRYDIG_ERR_NO_ROUTE', async ({ method, url }) => {
    const response = await app.inject({ method, url });
    expect(response.statusCode).toBe(404);
    const { error } = JSON.parse(response.body) as { error: ErrorBody };
    expect(error.code).toBe('DRYDIG_ERR_NO_ROUTE');
    expect(error.message).toContain(url);
  });
});
