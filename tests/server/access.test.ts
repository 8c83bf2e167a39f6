/**
 * Issue 14 item 1 (accounts) and issue 16 items 5 and 7: every storage route needs a session,
 * viewers cannot write, writes need the CSRF token, the setup link works once, hashes are argon2,
 * sign-in is rate-limited and logged, the audit trail names who and when, lists are paged, and a
 * view link never shows the edit link's id.
 */
import { afterEach, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import Database from 'better-sqlite3';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { buildApp } from '../../server/app';
import { issueSetupToken } from '../../server/auth';
import { DATABASE_FILE } from '../../server/storage';
import { createLink, createStored, demoScenario, memoryApp, signedInMemoryApp } from './scenarios-helpers';
import { addAccount, sessionCookieOf, sessionHeaders, signIn, signInApp, TEST_PASSWORD } from '../helpers/sign-in';

let apps: FastifyInstance[] = [];
afterEach(async () => {
  for (const app of apps) await app.close();
  apps = [];
});
async function track(app: Promise<FastifyInstance>): Promise<FastifyInstance> {
  const a = await app;
  apps.push(a);
  return a;
}

/** Every storage operation in the OpenAPI description, with path parameters filled in. */
async function storageOperations(app: FastifyInstance, id: string): Promise<Array<{ method: string; url: string }>> {
  const spec = (await app.inject({ method: 'GET', url: '/api/v1/openapi.json' })).json() as { paths: Record<string, Record<string, unknown>> };
  const ops: Array<{ method: string; url: string }> = [];
  for (const [path, methods] of Object.entries(spec.paths)) {
    if (!path.startsWith('/api/v1/scenarios') && !path.startsWith('/api/v1/audit')) continue;
    const url = path.replace('{id}', id).replace('{revision}', '1').replace('{format}', 'setout-csv').replace('{linkId}', 'AAAAAAAAAAAA');
    for (const method of Object.keys(methods)) ops.push({ method: method.toUpperCase(), url });
  }
  return ops;
}

const WRITE_BODIES: Record<string, unknown> = {};
function bodyFor(method: string, url: string): unknown {
  if (method === 'GET' || method === 'DELETE') return undefined;
  if (url.endsWith('/links')) return { mode: 'view' };
  if (url.endsWith('/readings')) return { piezometerId: 'P1', level_m: 1, time_s: 60 };
  if (url.endsWith('/restore')) return { revision: 1, baseRevision: 1 };
  if (url.endsWith('/issued')) return { revision: 1 };
  if (method === 'PUT') return { scenario: demoScenario('confined'), baseRevision: 1 };
  return { scenario: demoScenario('confined') };
  void WRITE_BODIES;
}

describe('storage routes without a session', () => {
  it('answer 401 DRYDIG_ERR_SIGN_IN_REQUIRED on every one, and store nothing', async () => {
    const app = await track(memoryApp());
    await signInApp(app);
    const id = await createStored(app, demoScenario('confined'));
    const ops = await storageOperations(app, id);
    expect(ops.length).toBeGreaterThanOrEqual(15);
    const anonymous = { cookie: '', 'x-drydig-csrf': '' };
    for (const op of ops) {
      const res = await app.inject({ method: op.method as 'GET', url: op.url, headers: anonymous, payload: bodyFor(op.method, op.url) as object });
      expect(res.statusCode, `${op.method} ${op.url}`).toBe(401);
      expect(res.json().error.code).toBe('DRYDIG_ERR_SIGN_IN_REQUIRED');
    }
    const history = (await app.inject({ method: 'GET', url: `/api/v1/scenarios/${id}/revisions` })).json();
    expect(history.revisions).toHaveLength(1);
  });

  it('answer 401 to a forged session cookie', async () => {
    const app = await track(memoryApp());
    const res = await app.inject({ method: 'GET', url: '/api/v1/scenarios', headers: { cookie: 'drydig_session=forged.value' } });
    expect(res.statusCode).toBe(401);
  });

  it('leave the compute routes open (evaluate, design, section, pumping-test need no account)', async () => {
    const app = await track(memoryApp());
    const res = await app.inject({ method: 'POST', url: '/api/v1/evaluate', payload: { scenario: demoScenario('confined'), points: [[20, 10]] } });
    expect(res.statusCode, res.body).toBe(200);
  });
});

describe('roles', () => {
  it('a viewer reads but every write answers 403 DRYDIG_ERR_ROLE_FORBIDDEN', async () => {
    const app = await track(memoryApp());
    const designer = await signInApp(app, 'designer');
    const id = await createStored(app, demoScenario('confined'));
    await addAccount(app, 'vera', 'viewer');
    const viewer = await signIn(app, 'vera');
    const ops = await storageOperations(app, id);
    for (const op of ops) {
      const res = await app.inject({ method: op.method as 'GET', url: op.url, headers: sessionHeaders(viewer), payload: bodyFor(op.method, op.url) as object });
      if (op.method === 'GET') expect(res.statusCode, `${op.method} ${op.url}`).not.toBe(401);
      else {
        expect(res.statusCode, `${op.method} ${op.url}`).toBe(403);
        expect(res.json().error.code).toBe('DRYDIG_ERR_ROLE_FORBIDDEN');
      }
    }
    const history = (await app.inject({ method: 'GET', url: `/api/v1/scenarios/${id}/revisions`, headers: sessionHeaders(designer) })).json();
    expect(history.revisions).toHaveLength(1);
  });

  it('a disabled account is signed out at once', async () => {
    const app = await track(memoryApp());
    const session = await signInApp(app, 'designer', 'dora');
    expect((await app.inject({ method: 'GET', url: '/api/v1/scenarios' })).statusCode).toBe(200);
    app.scenarioStore.accounts.setDisabled('dora', true);
    expect((await app.inject({ method: 'GET', url: '/api/v1/scenarios', headers: sessionHeaders(session) })).statusCode).toBe(401);
    const again = await app.inject({ method: 'POST', url: '/api/v1/auth/login', payload: { username: 'dora', password: TEST_PASSWORD } });
    expect(again.statusCode).toBe(401);
  });
});

describe('CSRF', () => {
  it('refuses a write with the session cookie but without, or with a wrong, x-drydig-csrf token', async () => {
    const app = await track(memoryApp());
    const session = await signInApp(app);
    const missing = await app.inject({ method: 'POST', url: '/api/v1/scenarios', headers: { cookie: session.cookie, 'x-drydig-csrf': '' }, payload: { scenario: demoScenario('confined') } });
    expect(missing.statusCode).toBe(403);
    expect(missing.json().error.code).toBe('DRYDIG_ERR_CSRF');
    const wrong = await app.inject({ method: 'POST', url: '/api/v1/scenarios', headers: { cookie: session.cookie, 'x-drydig-csrf': 'x'.repeat(43) }, payload: { scenario: demoScenario('confined') } });
    expect(wrong.statusCode).toBe(403);
    expect((await app.inject({ method: 'GET', url: '/api/v1/scenarios' })).json().scenarios).toEqual([]);
  });
});

describe('sessions and sign-in', () => {
  it('sets an HttpOnly, SameSite=Strict session cookie and keeps sessions in the store', async () => {
    const app = await track(memoryApp());
    await addAccount(app, 'sam', 'designer');
    const res = await app.inject({ method: 'POST', url: '/api/v1/auth/login', payload: { username: 'sam', password: TEST_PASSWORD } });
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Strict/i);
    const who = await app.inject({ method: 'GET', url: '/api/v1/auth/session', headers: { cookie: sessionCookieOf(res.headers['set-cookie']) } });
    expect(who.json().user).toEqual({ username: 'sam', role: 'designer' });
  });

  it('stores argon2id hashes, never the password', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'drydig-access-'));
    try {
      const app = await buildApp({ dataDir: dir, clientDir: false });
      await addAccount(app, 'hana', 'admin');
      await app.close();
      const db = new Database(join(dir, DATABASE_FILE), { readonly: true });
      const row = db.prepare('SELECT password_hash FROM users WHERE username = ?').get('hana') as { password_hash: string };
      db.close();
      expect(row.password_hash).toMatch(/^\$argon2id\$v=19\$m=\d+,t=\d+,p=\d+\$/);
      expect(row.password_hash).not.toContain(TEST_PASSWORD);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('rate-limits sign-in attempts per client and logs each one without the password', async () => {
    const lines: string[] = [];
    const app = await track(buildApp({ dataDir: ':memory:', clientDir: false, logger: { level: 'info', stream: { write: (s: string) => void lines.push(s) } } }));
    await addAccount(app, 'lee', 'designer');
    const statuses: number[] = [];
    for (let i = 0; i < 12; i++) statuses.push((await app.inject({ method: 'POST', url: '/api/v1/auth/login', payload: { username: 'lee', password: `wrong-password-${i}` } })).statusCode);
    expect(statuses.slice(0, 10).every((s) => s === 401)).toBe(true);
    expect(statuses.slice(10)).toEqual([429, 429]);
    const log = lines.join('');
    expect(log.match(/sign-in refused/g)?.length).toBe(10);
    expect(log).not.toContain('wrong-password-');
  });
});

describe('first start', () => {
  it('the one-time setup link makes the first admin once, then never again', async () => {
    const app = await track(memoryApp());
    const before = await app.inject({ method: 'GET', url: '/api/v1/auth/session' });
    expect(before.json().setupOpen).toBe(true);
    const token = issueSetupToken(app.scenarioStore)!;
    expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);
    const first = await app.inject({ method: 'POST', url: '/api/v1/auth/setup', payload: { token, username: 'ada', password: 'a-long-first-password' } });
    expect(first.statusCode, first.body).toBe(201);
    expect(first.json().user).toEqual({ username: 'ada', role: 'admin' });
    const second = await app.inject({ method: 'POST', url: '/api/v1/auth/setup', payload: { token, username: 'eve', password: 'another-long-password' } });
    expect(second.statusCode).toBe(410);
    expect(second.json().error.code).toBe('DRYDIG_ERR_SETUP_LINK_INVALID');
    expect(issueSetupToken(app.scenarioStore)).toBeUndefined();
    expect(app.scenarioStore.accounts.listUsers().map((u) => u.username)).toEqual(['ada']);
    expect((await signIn(app, 'ada', 'a-long-first-password')).role).toBe('admin');
  });

  it('refuses a guessed setup token', async () => {
    const app = await track(memoryApp());
    issueSetupToken(app.scenarioStore);
    const res = await app.inject({ method: 'POST', url: '/api/v1/auth/setup', payload: { token: 'A'.repeat(43), username: 'eve', password: 'another-long-password' } });
    expect(res.statusCode).toBe(410);
    expect(app.scenarioStore.accounts.countUsers()).toBe(0);
  });
});

describe('audit trail', () => {
  it('records who and when for each revision, link, revoke and issued-for-construction', async () => {
    const app = await track(signedInMemoryApp());
    const id = await createStored(app, demoScenario('confined'));
    const saved = await app.inject({ method: 'PUT', url: `/api/v1/scenarios/${id}`, payload: { scenario: { ...demoScenario('confined'), name: 'v2' }, baseRevision: 1 } });
    expect(saved.statusCode).toBe(201);
    const link = (await app.inject({ method: 'POST', url: `/api/v1/scenarios/${id}/links`, payload: { mode: 'view', revision: 2 } })).json();
    expect((await app.inject({ method: 'DELETE', url: `/api/v1/scenarios/${id}/links/${link.linkId}` })).statusCode).toBe(204);
    const issued = await app.inject({ method: 'POST', url: `/api/v1/scenarios/${id}/issued`, payload: { revision: 2, note: 'for tender' } });
    expect(issued.statusCode, issued.body).toBe(201);
    const audit = (await app.inject({ method: 'GET', url: `/api/v1/scenarios/${id}/audit` })).json();
    expect(audit.entries.map((e: { action: string }) => e.action)).toEqual(['issued-for-construction', 'revoke', 'link', 'revision', 'revision']);
    for (const e of audit.entries) {
      expect(e.actor).toBe('test-designer');
      expect(Date.parse(e.at)).toBeGreaterThan(0);
    }
    expect(audit.entries[0].revision).toBe(2);
    expect(audit.entries[0].detail).toContain('for tender');
  });
});

describe('paged lists (issue 16 item 5)', () => {
  it('GET /api/v1/scenarios answers a page, newest first, and the cursor walks every scenario once', async () => {
    const app = await track(signedInMemoryApp());
    const ids: string[] = [];
    for (let i = 0; i < 5; i++) ids.push(await createStored(app, { ...demoScenario('confined'), name: `s${i}` }));
    const seen: string[] = [];
    let cursor: string | null = null;
    let pages = 0;
    do {
      const res = await app.inject({ method: 'GET', url: `/api/v1/scenarios?limit=2${cursor ? `&cursor=${cursor}` : ''}` });
      expect(res.statusCode, res.body).toBe(200);
      const body = res.json() as { scenarios: Array<{ scenarioId: string }>; nextCursor: string | null };
      expect(body.scenarios.length).toBeLessThanOrEqual(2);
      seen.push(...body.scenarios.map((s) => s.scenarioId));
      cursor = body.nextCursor;
      pages++;
    } while (cursor && pages < 10);
    expect(pages).toBe(3);
    expect(seen).toEqual([...ids].reverse());
    const tooBig = await app.inject({ method: 'GET', url: '/api/v1/scenarios?limit=500' });
    expect(tooBig.statusCode).toBe(400);
    const badCursor = await app.inject({ method: 'GET', url: '/api/v1/scenarios?cursor=bm90LWEtY3Vyc29y' });
    expect(badCursor.statusCode).toBe(400);
  });

  it('histories are paged newest first too', async () => {
    const app = await track(signedInMemoryApp());
    const id = await createStored(app, demoScenario('confined'));
    for (let base = 1; base <= 4; base++)
      expect((await app.inject({ method: 'PUT', url: `/api/v1/scenarios/${id}`, payload: { scenario: { ...demoScenario('confined'), name: `r${base + 1}` }, baseRevision: base } })).statusCode).toBe(201);
    const first = (await app.inject({ method: 'GET', url: `/api/v1/scenarios/${id}/revisions?limit=3` })).json();
    expect(first.revisions.map((r: { revision: number }) => r.revision)).toEqual([5, 4, 3]);
    const second = (await app.inject({ method: 'GET', url: `/api/v1/scenarios/${id}/revisions?limit=3&cursor=${first.nextCursor}` })).json();
    expect(second.revisions.map((r: { revision: number }) => r.revision)).toEqual([2, 1]);
    expect(second.nextCursor).toBeNull();
  });
});

describe('small leaks (issue 16 item 7)', () => {
  it('readings seen through a view link never show the edit link id', async () => {
    const app = await track(signedInMemoryApp());
    const scenario = demoScenario('confined') as ReturnType<typeof demoScenario> & { monitoring?: unknown };
    const id = await createStored(app, scenario);
    const plan = (await app.inject({ method: 'GET', url: `/api/v1/scenarios/${id}` })).json().scenario as { monitoring?: { piezometers: Array<{ id: string }> } };
    const piezometer = plan.monitoring?.piezometers[0]?.id;
    expect(piezometer, 'the demo has a monitoring piezometer').toBeDefined();
    const edit = (await app.inject({ method: 'POST', url: `/api/v1/scenarios/${id}/links`, payload: { mode: 'edit' } })).json() as { token: string; linkId: string };
    const view = await createLink(app, id, 'view');
    const entered = await app.inject({ method: 'POST', url: `/api/v1/links/${edit.token}/readings`, payload: { piezometerId: piezometer, level_m: 5, time_s: 3600, enteredBy: 'gauger' } });
    expect(entered.statusCode, entered.body).toBe(201);
    for (const path of ['readings', 'monitoring', 'export/monitoring-csv', '']) {
      const res = await app.inject({ method: 'GET', url: `/api/v1/links/${view}${path ? `/${path}` : ''}` });
      expect(res.statusCode, path).toBe(200);
      expect(res.body, path).not.toContain(edit.linkId);
    }
  });

  it('a wrong-shaped token answers the documented 404', async () => {
    const app = await track(memoryApp());
    for (const token of ['short', `${'A'.repeat(42)}!`, 'A'.repeat(44)]) {
      const res = await app.inject({ method: 'GET', url: `/api/v1/links/${token}` });
      expect(res.statusCode, token).toBe(404);
      expect(res.json().error.code).toBe('DRYDIG_ERR_NOT_FOUND');
    }
  });

  it('a view token never writes', async () => {
    const app = await track(signedInMemoryApp());
    const id = await createStored(app, demoScenario('confined'));
    const view = await createLink(app, id, 'view');
    const anon = { cookie: '', 'x-drydig-csrf': '' };
    const save = await app.inject({ method: 'PUT', url: `/api/v1/links/${view}/scenario`, headers: anon, payload: { scenario: demoScenario('confined'), baseRevision: 1 } });
    expect(save.statusCode).toBe(403);
    const reading = await app.inject({ method: 'POST', url: `/api/v1/links/${view}/readings`, headers: anon, payload: { piezometerId: 'P1', level_m: 1, time_s: 1 } });
    expect(reading.statusCode).toBe(403);
    expect((await app.inject({ method: 'GET', url: `/api/v1/scenarios/${id}/revisions` })).json().revisions).toHaveLength(1);
    expect((await app.inject({ method: 'GET', url: `/api/v1/scenarios/${id}/readings` })).json().readings).toEqual([]);
  });
});
