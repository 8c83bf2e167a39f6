/**
 * One fuzz case per route of the service (method + Fastify path, as the OpenAPI document lists
 * them): a generator of hostile requests built from a valid request of that route, with every
 * kind of sender (designer's session, none, wrong CSRF token, viewer). `fuzz-every-route.test.ts`
 * checks that no route of the OpenAPI document is left without a case.
 */
import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { EXPORT_FORMATS } from '../../../server/storage/http';
import type { LightMyRequestResponse } from 'fastify';
import type { FuzzApp, FuzzAuth, FuzzRequest, FuzzWorld } from './fuzz-harness';
import { fuzzScenario } from './fuzz-harness';
import { loadFixture } from './demo-fixtures';
import { hostileJsonText, hostileQuery, hostileSegment, hostileValue, LATEST_REVISION, mutatedBody } from './fuzz-values';

export type RouteGroup = 'compute' | 'storage' | 'links' | 'auth' | 'meta';

export interface RouteCase {
  method: FuzzRequest['method'];
  /** Fastify path, e.g. `/api/v1/scenarios/:id`. */
  route: string;
  group: RouteGroup;
  /** Runs of this route's property (compute routes cost more per request than reads). */
  numRuns: number;
  requests(world: FuzzWorld): fc.Arbitrary<FuzzRequest>;
  /** Runs after each request of this route. */
  after?: (fuzz: FuzzApp, response: LightMyRequestResponse) => Promise<void>;
}

const FIXTURES = new URL('../../../fixtures/', import.meta.url);
const sectionFixture = () => JSON.parse(readFileSync(new URL('sections/sheet-pile-cofferdam.json', FIXTURES), 'utf8')) as unknown;
const pumpingCsv = readFileSync(new URL('pumping-tests/demo-constant-rate.csv', FIXTURES), 'utf8');

const anyAuth: fc.Arbitrary<FuzzAuth> = fc.constantFrom('session', 'session', 'session', 'none', 'bad-csrf', 'viewer');

/** A body as JSON (mostly), or broken text, an empty body, or the wrong content type. */
function bodyOf(valid: () => unknown): fc.Arbitrary<Pick<FuzzRequest, 'body' | 'contentType'>> {
  return fc.oneof(
    { weight: 14, arbitrary: mutatedBody(valid).map((json) => ({ body: { json } })) },
    { weight: 1, arbitrary: fc.tuple(mutatedBody(valid), fc.nat()).map(([json, cut]) => { const text = hostileJsonText(json); return { body: { text: text.slice(0, cut % (text.length + 1)) } }; }) },
    { weight: 1, arbitrary: fc.constantFrom<Pick<FuzzRequest, 'body' | 'contentType'>>({ body: { text: '' } }, {}, { body: { text: 'null' } }, { body: { text: '[]' } }, { body: { text: '{"a":1,"a":2}' } }) },
    { weight: 1, arbitrary: fc.tuple(mutatedBody(valid), fc.constantFrom('text/plain', 'application/x-www-form-urlencoded', 'application/json; charset=utf-16', 'multipart/form-data; boundary=x', '')).map(([json, contentType]) => ({ body: { json }, contentType })) },
  );
}

/** A URL: as the route expects it, and hostile (segments of the wrong shape, unknown ids, oddities). */
interface Url {
  valid: fc.Arbitrary<string>;
  hostile: fc.Arbitrary<string>;
}

/** Which part of a request is hostile: one part at a time gets further into the service than all at once. */
type Focus = 'all' | 'path' | 'body' | 'auth';
const focus: fc.Arbitrary<Focus> = fc.constantFrom<Focus>('all', 'all', 'path', 'path', 'body', 'body', 'body', 'body', 'auth', 'auth');

/** A request with a body: the focused part (or all) hostile, the rest as the route expects. */
function withBody(method: FuzzRequest['method'], url: Url, valid: () => unknown): fc.Arbitrary<FuzzRequest> {
  return fc.tuple(focus, url.valid, url.hostile, bodyOf(valid), anyAuth).map(([f, good, bad, b, auth]) => ({
    method,
    url: f === 'all' || f === 'path' ? bad : good,
    auth: f === 'all' || f === 'auth' ? auth : 'session',
    ...(f === 'all' || f === 'body' ? b : { body: { json: valid() } }),
  }));
}

/** A request without a body: the focused part (or all) hostile, a query string and now and then a stray body. */
function withoutBody(method: FuzzRequest['method'], url: Url): fc.Arbitrary<FuzzRequest> {
  const stray = fc.oneof({ weight: 7, arbitrary: fc.constant(null) }, { weight: 1, arbitrary: hostileValue });
  return fc.tuple(focus, url.valid, url.hostile, hostileQuery, anyAuth, stray).map(([f, good, bad, q, auth, body]) => ({
    method,
    url: f === 'all' || f === 'path' ? `${bad}${bad.includes('?') ? '' : q}` : good,
    auth: f === 'all' || f === 'auth' ? auth : 'session',
    ...(body === null || !(f === 'all' || f === 'body') ? {} : { body: { json: body } }),
  }));
}

const API = '/api/v1';
/** A scenario id of the right shape that is not stored. */
const UNKNOWN_ID = 'AAAAAAAAAAAAAAAAAAAAAA';

/** A path segment: the values that fit the route. */
interface Segment {
  fit: readonly string[];
}
const scenarioId = (w: FuzzWorld): Segment => ({ fit: [w.scenarioId, w.scenarioId, UNKNOWN_ID] });
const revision: Segment = { fit: ['1', '2', '3', '999999999'] };
const token = (w: FuzzWorld): Segment => ({ fit: [w.viewToken, w.editToken, w.pinnedToken, w.revokedToken, 'x'.repeat(43)] });
const format: Segment = { fit: [...EXPORT_FORMATS] };

/** A URL from fixed parts and segments (fitting values, or hostile ones). */
function path(...parts: Array<string | Segment>): Url {
  const build = (pick: (s: Segment) => fc.Arbitrary<string>) => fc.tuple(...parts.map((p) => (typeof p === 'string' ? fc.constant(p) : pick(p)))).map((ps) => ps.join('/'));
  return { valid: build((s) => fc.constantFrom(...s.fit)), hostile: build((s) => hostileSegment(s.fit)) };
}

/** Small valid bodies of the compute routes (invented demo sites). */
function evaluateBody() {
  const scenario = fuzzScenario();
  const [w] = scenario.wells;
  return { scenario, points: [[w!.x + 5, w!.y], [w!.x + 40, w!.y + 10]], times_s: [3600, null, 604_800], grid: { origin: [w!.x - 50, w!.y - 50], spacing_m: [10, 10], counts: [10, 10] } };
}
function unconfinedEvaluateBody() {
  const scenario = loadFixture('unconfined');
  const [w] = scenario.wells;
  return { scenario, points: [[w!.x + 3, w!.y]] };
}
const designBodies = [
  () => ({ scenario: fuzzScenario() }),
  // The unconfined demo with every fourth well point: a design of all of them takes seconds on a busy machine.
  () => { const s = loadFixture('unconfined'); return { scenario: { ...s, wells: s.wells.filter((_w, i) => i % 4 === 0) }, mode: 'uniform' }; },
  () => ({ scenario: fuzzScenario(), mode: 'optimal', options: { pumpEfficiency: 0.6 } }),
];
const saveBody = () => ({ scenario: fuzzScenario(), savedBy: 'fuzz', note: 'a note' });

/** Picks one of a few valid bodies for each request. */
function oneOf(bodies: Array<() => unknown>, method: FuzzRequest['method'], url: Url): fc.Arbitrary<FuzzRequest> {
  return fc.oneof(...bodies.map((b) => withBody(method, url, b)));
}

export const ROUTE_CASES: RouteCase[] = [
  // compute (no account needed)
  { method: 'POST', route: `${API}/evaluate`, group: 'compute', numRuns: 30, requests: () => oneOf([evaluateBody, unconfinedEvaluateBody], 'POST', path(`${API}/evaluate`)) },
  { method: 'POST', route: `${API}/design`, group: 'compute', numRuns: 20, requests: () => oneOf(designBodies, 'POST', path(`${API}/design`)) },
  { method: 'POST', route: `${API}/validate`, group: 'compute', numRuns: 40, requests: () => oneOf([() => ({ scenario: fuzzScenario() }), () => ({ scenario: loadFixture('unconfined') })], 'POST', path(`${API}/validate`)) },
  {
    method: 'POST', route: `${API}/section`, group: 'compute', numRuns: 10,
    requests: () => oneOf([() => ({ section: { ...(sectionFixture() as object), mesh: { maxSize_m: 3, minSize_m: 0.3 } }, flowNet: false }), () => ({ scenario: fuzzScenario(), fromScenario: { outsideHead_m: 12 }, compare: { toeLevels_m: [1] }, flowNet: false })], 'POST', path(`${API}/section`)),
  },
  // Design jobs run on after their answer, at most 2 per client (more answer 503 busy): each one started is cancelled.
  {
    method: 'POST', route: `${API}/design/jobs`, group: 'compute', numRuns: 12, requests: () => oneOf(designBodies, 'POST', path(`${API}/design/jobs`)),
    after: async (fuzz, response) => {
      if (response.statusCode === 202) await fuzz.app.inject({ method: 'DELETE', url: `${API}/design/jobs/${(response.json() as { id: string }).id}` });
    },
  },
  { method: 'GET', route: `${API}/design/jobs/:id`, group: 'compute', numRuns: 15, requests: (w) => withoutBody('GET', path(`${API}/design/jobs`, { fit: [w.designJobId, 'no-such-job'] })) },
  { method: 'DELETE', route: `${API}/design/jobs/:id`, group: 'compute', numRuns: 10, requests: (w) => withoutBody('DELETE', path(`${API}/design/jobs`, { fit: [w.designJobId, 'no-such-job'] })) },
  {
    method: 'POST', route: `${API}/pumping-test`, group: 'compute', numRuns: 30,
    requests: () => oneOf([
      () => ({ csv: pumpingCsv, rate_m3_s: 0.012, methods: ['theis', 'cooper-jacob'] }),
      () => ({ readings: [{ time_s: 60, drawdown_m: 0.3 }, { time_s: 600, drawdown_m: 0.8 }, { time_s: 6000, drawdown_m: 1.3 }], rate_m3_s: 0.01, distance_m: 20 }),
    ], 'POST', path(`${API}/pumping-test`)),
  },
  // storage (a session needed)
  { method: 'GET', route: `${API}/scenarios`, group: 'storage', numRuns: 28, requests: () => withoutBody('GET', path(`${API}/scenarios`)) },
  { method: 'POST', route: `${API}/scenarios`, group: 'storage', numRuns: 42, requests: () => withBody('POST', path(`${API}/scenarios`), saveBody) },
  { method: 'GET', route: `${API}/scenarios/:id`, group: 'storage', numRuns: 21, requests: (w) => withoutBody('GET', path(`${API}/scenarios`, scenarioId(w))) },
  { method: 'PUT', route: `${API}/scenarios/:id`, group: 'storage', numRuns: 35, requests: (w) => withBody('PUT', path(`${API}/scenarios`, scenarioId(w)), () => ({ ...saveBody(), baseRevision: LATEST_REVISION })) },
  { method: 'GET', route: `${API}/scenarios/:id/revisions`, group: 'storage', numRuns: 21, requests: (w) => withoutBody('GET', path(`${API}/scenarios`, scenarioId(w), 'revisions')) },
  { method: 'GET', route: `${API}/scenarios/:id/revisions/:revision`, group: 'storage', numRuns: 21, requests: (w) => withoutBody('GET', path(`${API}/scenarios`, scenarioId(w), 'revisions', revision)) },
  { method: 'POST', route: `${API}/scenarios/:id/restore`, group: 'storage', numRuns: 28, requests: (w) => withBody('POST', path(`${API}/scenarios`, scenarioId(w), 'restore'), () => ({ revision: 1, baseRevision: LATEST_REVISION, note: 'back' })) },
  { method: 'GET', route: `${API}/scenarios/:id/export/:format`, group: 'storage', numRuns: 21, requests: (w) => withoutBody('GET', path(`${API}/scenarios`, scenarioId(w), 'export', format)) },
  { method: 'GET', route: `${API}/scenarios/:id/monitoring`, group: 'storage', numRuns: 14, requests: (w) => withoutBody('GET', path(`${API}/scenarios`, scenarioId(w), 'monitoring')) },
  { method: 'GET', route: `${API}/scenarios/:id/readings`, group: 'storage', numRuns: 14, requests: (w) => withoutBody('GET', path(`${API}/scenarios`, scenarioId(w), 'readings')) },
  {
    method: 'POST', route: `${API}/scenarios/:id/readings`, group: 'storage', numRuns: 35,
    requests: (w) => oneOf([
      () => ({ piezometerId: 'PZ1', level_m: 11.5, time_s: 86_400, note: 'dip meter' }),
      () => ({ piezometerId: 'PZ2', level_m: 12.1, measuredAt: '2027-03-02T07:00:00Z', enteredBy: 'site' }),
    ], 'POST', path(`${API}/scenarios`, scenarioId(w), 'readings')),
  },
  { method: 'POST', route: `${API}/scenarios/:id/links`, group: 'storage', numRuns: 28, requests: (w) => oneOf([() => ({ mode: 'view', revision: 1, label: 'pinned' }), () => ({ mode: 'edit' })], 'POST', path(`${API}/scenarios`, scenarioId(w), 'links')) },
  { method: 'GET', route: `${API}/scenarios/:id/links`, group: 'storage', numRuns: 14, requests: (w) => withoutBody('GET', path(`${API}/scenarios`, scenarioId(w), 'links')) },
  { method: 'DELETE', route: `${API}/scenarios/:id/links/:linkId`, group: 'storage', numRuns: 21, requests: (w) => withoutBody('DELETE', path(`${API}/scenarios`, scenarioId(w), 'links', { fit: [...w.revocableLinkIds, 'AAAAAAAAAAAA'] })) },
  { method: 'GET', route: `${API}/audit`, group: 'storage', numRuns: 21, requests: () => withoutBody('GET', path(`${API}/audit`)) },
  { method: 'GET', route: `${API}/scenarios/:id/audit`, group: 'storage', numRuns: 14, requests: (w) => withoutBody('GET', path(`${API}/scenarios`, scenarioId(w), 'audit')) },
  { method: 'POST', route: `${API}/scenarios/:id/issued`, group: 'storage', numRuns: 21, requests: (w) => withBody('POST', path(`${API}/scenarios`, scenarioId(w), 'issued'), () => ({ revision: 2, note: 'for construction' })) },
  // share links (a token instead of a session)
  { method: 'GET', route: `${API}/links/:token`, group: 'links', numRuns: 21, requests: (w) => withoutBody('GET', path(`${API}/links`, token(w))) },
  { method: 'GET', route: `${API}/links/:token/export/:format`, group: 'links', numRuns: 21, requests: (w) => withoutBody('GET', path(`${API}/links`, token(w), 'export', format)) },
  { method: 'GET', route: `${API}/links/:token/monitoring`, group: 'links', numRuns: 14, requests: (w) => withoutBody('GET', path(`${API}/links`, token(w), 'monitoring')) },
  { method: 'GET', route: `${API}/links/:token/readings`, group: 'links', numRuns: 14, requests: (w) => withoutBody('GET', path(`${API}/links`, token(w), 'readings')) },
  { method: 'POST', route: `${API}/links/:token/readings`, group: 'links', numRuns: 28, requests: (w) => withBody('POST', path(`${API}/links`, token(w), 'readings'), () => ({ piezometerId: 'PZ1', level_m: 11.4, time_s: 7200 })) },
  { method: 'PUT', route: `${API}/links/:token/scenario`, group: 'links', numRuns: 28, requests: (w) => withBody('PUT', path(`${API}/links`, { fit: [w.editToken, w.editToken, w.editToken, w.pinnedToken, w.viewToken] }, 'scenario'), () => ({ scenario: fuzzScenario(), baseRevision: LATEST_REVISION, savedBy: 'site' })) },
  // accounts
  { method: 'POST', route: `${API}/auth/login`, group: 'auth', numRuns: 15, requests: () => withBody('POST', path(`${API}/auth/login`), () => ({ username: 'fuzz-designer', password: 'not the password' })) },
  { method: 'POST', route: `${API}/auth/logout`, group: 'auth', numRuns: 15, requests: () => withoutBody('POST', path(`${API}/auth/logout`)).map((r) => ({ ...r, auth: r.auth === 'session' || r.auth === 'viewer' ? 'bad-csrf' : r.auth })) },
  { method: 'GET', route: `${API}/auth/session`, group: 'auth', numRuns: 15, requests: () => withoutBody('GET', path(`${API}/auth/session`)) },
  { method: 'POST', route: `${API}/auth/setup`, group: 'auth', numRuns: 15, requests: () => withBody('POST', path(`${API}/auth/setup`), () => ({ token: 'x'.repeat(43), username: 'first', password: 'a long enough password' })) },
  // service
  { method: 'GET', route: `${API}/health`, group: 'meta', numRuns: 15, requests: () => withoutBody('GET', path(`${API}/health`)) },
  { method: 'GET', route: `${API}/openapi.json`, group: 'meta', numRuns: 3, requests: () => withoutBody('GET', path(`${API}/openapi.json`)) },
];
