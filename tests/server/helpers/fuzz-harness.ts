/**
 * The app the route fuzz tests hit, and the checks every answer must pass: a service on a temporary
 * data folder (so the database can be read from outside), one stored scenario with two revisions,
 * a reading and share links, a designer's and a viewer's session; `snapshotStore()` digests every
 * table, so a refused request can be shown to have left no trace; `checkAnswer` holds the rules
 * (no 5xx; every 4xx a JSON error with a known code and a message).
 *
 * Seeds are fixed (FUZZ_SEED overrides the base seed) and printed with any failure.
 */
import { createHash } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Database from 'better-sqlite3';
import fc from 'fast-check';
import type { FastifyInstance, LightMyRequestResponse } from 'fastify';
import { buildApp } from '../../../server/app';
import { DATABASE_FILE } from '../../../server/storage';
import { ERROR_TABLE } from '../../../shared/schema';
import { addAccount, signIn, sessionHeaders, type TestSession } from '../../helpers/sign-in';
import { loadFixture } from './demo-fixtures';
import { hostileJsonText } from './fuzz-values';

/** Base seed of every fuzz property; set FUZZ_SEED to replay another. */
export const FUZZ_SEED = Number(process.env.FUZZ_SEED ?? 20_261_202);

/** Who sends a request: a designer's session, none, a session with a wrong CSRF token, a viewer's session. */
export type FuzzAuth = 'session' | 'none' | 'bad-csrf' | 'viewer';

export interface FuzzRequest {
  method: 'GET' | 'POST' | 'PUT' | 'DELETE';
  url: string;
  /** A JSON value (sent as JSON text, raw infinities written as 1e999) or raw body text. */
  body?: { json: unknown } | { text: string };
  contentType?: string;
  auth: FuzzAuth;
}

/** What the seeded store holds (ids, revisions, tokens) for the request generators. */
export interface FuzzWorld {
  scenarioId: string;
  /** Link ids the DELETE fuzz may revoke (kept apart from the links the link routes use). */
  revocableLinkIds: string[];
  viewToken: string;
  editToken: string;
  pinnedToken: string;
  revokedToken: string;
  /** A design job started at seeding (POST /api/v1/design/jobs). */
  designJobId: string;
}

export interface FuzzApp {
  app: FastifyInstance;
  world: FuzzWorld;
  send(request: FuzzRequest): Promise<LightMyRequestResponse>;
  /** A digest of every table (sessions by id only: a session's expiry moves on each request). */
  snapshotStore(): { digest: string; tables: Record<string, string> };
  close(): Promise<void>;
}

/** The confined demo with its monitoring plan: the scenario the fuzz saves and edits. */
export function fuzzScenario() {
  return loadFixture('confined');
}

async function seed(app: FastifyInstance, designer: TestSession): Promise<FuzzWorld> {
  const headers = { ...sessionHeaders(designer), 'content-type': 'application/json' };
  const post = async (url: string, payload: unknown, method: 'POST' | 'PUT' = 'POST') => {
    const r = await app.inject({ method, url, headers, payload: JSON.stringify(payload) });
    if (r.statusCode !== 201) throw new Error(`seeding ${url}: ${r.statusCode} ${r.body}`);
    return r.json() as Record<string, unknown>;
  };
  const saved = await post('/api/v1/scenarios', { scenario: fuzzScenario(), savedBy: 'fuzz seed', note: 'first' });
  const scenarioId = String(saved.scenarioId);
  await post(`/api/v1/scenarios/${scenarioId}`, { scenario: { ...fuzzScenario(), name: 'second' }, baseRevision: 1 }, 'PUT');
  await post(`/api/v1/scenarios/${scenarioId}/readings`, { piezometerId: 'PZ1', level_m: 11.2, time_s: 86_400 });
  const link = async (body: object) => post(`/api/v1/scenarios/${scenarioId}/links`, body);
  const view = await link({ mode: 'view' });
  const edit = await link({ mode: 'edit', label: 'site team' });
  const pinned = await link({ mode: 'edit', revision: 1 });
  const revoked = await link({ mode: 'view' });
  const del = await app.inject({ method: 'DELETE', url: `/api/v1/scenarios/${scenarioId}/links/${String(revoked.linkId)}`, headers: sessionHeaders(designer) });
  if (del.statusCode >= 300) throw new Error(`seeding a revoked link: ${del.statusCode} ${del.body}`);
  const revocable = await Promise.all([0, 1, 2].map(() => link({ mode: 'view' })));
  const job = await app.inject({ method: 'POST', url: '/api/v1/design/jobs', headers: { 'content-type': 'application/json' }, payload: JSON.stringify({ scenario: fuzzScenario() }) });
  if (job.statusCode !== 202) throw new Error(`seeding a design job: ${job.statusCode} ${job.body}`);
  return {
    scenarioId,
    revocableLinkIds: revocable.map((l) => String(l.linkId)),
    viewToken: String(view.token),
    editToken: String(edit.token),
    pinnedToken: String(pinned.token),
    revokedToken: String(revoked.token),
    designJobId: String((job.json() as { id: string }).id),
  };
}

function digestTables(db: Database.Database): { digest: string; tables: Record<string, string> } {
  const names = (db.prepare("SELECT name FROM sqlite_master WHERE type = 'table' ORDER BY name").all() as Array<{ name: string }>).map((r) => r.name);
  const tables: Record<string, string> = {};
  for (const name of names) {
    const sql = name === 'sessions' ? 'SELECT sid FROM sessions' : `SELECT * FROM "${name}"`;
    // Some tables have no rowid: rows are put in order by their text.
    const rows = db.prepare(sql).raw().all().map((row) => JSON.stringify(row, (_k, v: unknown) => (Buffer.isBuffer(v) ? v.toString('base64') : v))).sort();
    tables[name] = createHash('sha256').update(rows.join('\n')).digest('hex');
  }
  return { digest: createHash('sha256').update(JSON.stringify(tables)).digest('hex'), tables };
}

/** Starts the fuzz app: pool threads as in service, rate limits out of the way, a seeded store. */
export async function startFuzzApp(): Promise<FuzzApp> {
  const dataDir = mkdtempSync(join(tmpdir(), 'drydig-fuzz-'));
  const app = await buildApp({
    dataDir,
    clientDir: false,
    compute: { threads: 2, maxQueuedPerClient: 64 },
    security: { writeMax: 1_000_000, computeMax: 1_000_000 },
  });
  await addAccount(app, 'fuzz-designer', 'designer');
  await addAccount(app, 'fuzz-viewer', 'viewer');
  const designer = await signIn(app, 'fuzz-designer');
  const viewer = await signIn(app, 'fuzz-viewer');
  const world = await seed(app, designer);
  const reader = new Database(join(dataDir, DATABASE_FILE), { readonly: true, fileMustExist: true });
  const headersFor = (auth: FuzzAuth): Record<string, string> => {
    if (auth === 'session') return sessionHeaders(designer);
    if (auth === 'viewer') return sessionHeaders(viewer);
    if (auth === 'bad-csrf') return { cookie: designer.cookie, 'x-drydig-csrf': `${designer.csrf.slice(1)}x` };
    return {};
  };
  return {
    app,
    world,
    send: async (request) => {
      const headers: Record<string, string> = { ...headersFor(request.auth) };
      let payload: string | undefined;
      if (request.body) {
        const latest = (await app.scenarioStore.getLatest(world.scenarioId))?.revision;
        payload = 'json' in request.body ? hostileJsonText(request.body.json, latest) : request.body.text;
        headers['content-type'] = request.contentType ?? 'application/json';
      }
      // Each auth kind from its own address, so the sign-in limit of one never refuses the others.
      const remoteAddress = { session: '10.9.0.1', none: '10.9.0.2', 'bad-csrf': '10.9.0.3', viewer: '10.9.0.4' }[request.auth];
      return app.inject({ method: request.method, url: request.url, headers, remoteAddress, ...(payload !== undefined ? { payload } : {}) });
    },
    snapshotStore: () => digestTables(reader),
    close: async () => {
      reader.close();
      await app.close();
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}

/** Whether a route reads or writes stored data (needs a session). */
export function isStorageRoute(url: string): boolean {
  return /^\/api\/v1\/(scenarios|audit)(\/|$|\?)/.test(url);
}

/** The rules every answer keeps; returns what is wrong, or null. */
export function answerProblem(request: FuzzRequest, response: LightMyRequestResponse, changed: string[]): string | null {
  const status = response.statusCode;
  if (status >= 500) return `answered ${status}: ${response.body.slice(0, 500)}`;
  if (status >= 400) {
    if (!String(response.headers['content-type'] ?? '').startsWith('application/json')) return `answered ${status} with content-type ${String(response.headers['content-type'])}`;
    let body: { error?: { code?: unknown; message?: unknown } };
    try {
      body = JSON.parse(response.body) as typeof body;
    } catch {
      return `answered ${status} with a body that is not JSON: ${response.body.slice(0, 200)}`;
    }
    const code = body.error?.code;
    const message = body.error?.message;
    if (typeof code !== 'string' || !(code in ERROR_TABLE)) return `answered ${status} without a known error code: ${response.body.slice(0, 300)}`;
    if (typeof message !== 'string' || message.trim() === '') return `answered ${status} ${code} without a message`;
    if (changed.length > 0) return `refused with ${status} ${code} but changed the stored ${changed.join(', ')}`;
  }
  if (status < 400 && isStorageRoute(request.url)) {
    if (request.auth === 'none' || (request.auth === 'bad-csrf' && request.method !== 'GET')) return `answered ${status} to a request without a (valid) session`;
    if (request.auth === 'viewer' && request.method !== 'GET') return `answered ${status} to a viewer's write`;
  }
  return null;
}

/** Sends one request and throws when an answer breaks the rules (the request is in the message); returns the answer. */
export async function checkRequest(fuzz: FuzzApp, request: FuzzRequest): Promise<LightMyRequestResponse> {
  const before = fuzz.snapshotStore();
  const response = await fuzz.send(request);
  const after = response.statusCode >= 400 ? fuzz.snapshotStore() : before;
  const changed = Object.keys(after.tables).filter((t) => after.tables[t] !== before.tables[t]);
  const problem = answerProblem(request, response, changed);
  if (problem) {
    const body = request.body ? ('json' in request.body ? hostileJsonText(request.body.json) : request.body.text) : '';
    throw new Error(`${request.method} ${request.url} (${request.auth}) ${problem}\nbody: ${body.slice(0, 1500)}`);
  }
  return response;
}

/** A stable seed per property: the base seed and the property's name. */
export function seedFor(name: string): number {
  let h = FUZZ_SEED | 0;
  for (const ch of name) h = (Math.imul(h, 31) + ch.charCodeAt(0)) | 0;
  return h;
}

/**
 * Runs a request property with its fixed seed; a failure names the seed and how to replay it.
 * Answers how many requests got each status (first runs only, not the shrinking), so a test can
 * show the fuzz got past the schema as well as being refused.
 */
export async function fuzzRoute(
  fuzz: FuzzApp,
  name: string,
  requests: fc.Arbitrary<FuzzRequest>,
  numRuns: number,
  /** Runs after each request (e.g. cancels a job the request started). */
  after?: (fuzz: FuzzApp, response: LightMyRequestResponse) => Promise<void>,
): Promise<Map<number, number>> {
  const seedValue = seedFor(name);
  const statuses = new Map<number, number>();
  let runs = 0;
  try {
    await fc.assert(
      fc.asyncProperty(requests, async (request) => {
        const response = await checkRequest(fuzz, request);
        await after?.(fuzz, response);
        const status = response.statusCode;
        if (runs++ < numRuns) statuses.set(status, (statuses.get(status) ?? 0) + 1);
      }),
      { seed: seedValue, numRuns },
    );
    if (process.env.FUZZ_VERBOSE) console.log(name, [...statuses].sort((a, b) => a[0] - b[0]).map(([s, n]) => `${s}×${n}`).join(' '));
    return statuses;
  } catch (error) {
    throw new Error(`fuzz of ${name} failed with seed ${seedValue} (base FUZZ_SEED=${FUZZ_SEED}; rerun with the same FUZZ_SEED to replay)\n${(error as Error).message}\n${String((error as Error).cause ?? '')}`);
  }
}
