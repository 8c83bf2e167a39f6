/**
 * Share links: view and edit tokens (256 bits, CSPRNG, stored only as SHA-256), pinned or following
 * the latest revision, revocation, and the rule that a view token can never write.
 */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../../server/app';
import { DATABASE_FILE, hashShareToken } from '../../server/storage';
import type { Scenario } from '../../shared/schema';
import { signInApp } from '../helpers/sign-in';
import { createLink, createStored, demoScenario, signedInMemoryApp } from './scenarios-helpers';

let app: FastifyInstance;
beforeEach(async () => {
  app = await signedInMemoryApp();
});
afterEach(async () => {
  await app.close();
});

function withMonitoring(s: Scenario): Scenario {
  const first = s.wells[0]!;
  return { ...s, monitoring: { pumpingStart: '2027-03-01T07:00:00Z', piezometers: [{ id: 'PZ1', x: first.x + 20, y: first.y + 5 }] } } as Scenario;
}

describe('POST /api/v1/scenarios/:id/links', () => {
  it('returns a 43-character base64url token (256 bits) that differs every time', async () => {
    const id = await createStored(app, demoScenario('confined'));
    const tokens = new Set<string>();
    for (let i = 0; i < 40; i++) {
      const token = await createLink(app, id, i % 2 ? 'view' : 'edit');
      expect(token).toMatch(/^[A-Za-z0-9_-]{43}$/);
      expect(Buffer.from(token, 'base64url')).toHaveLength(32);
      tokens.add(token);
    }
    expect(tokens.size).toBe(40);
  });

  it('lists links without their tokens, and refuses a pin to a revision that does not exist', async () => {
    const id = await createStored(app, demoScenario('confined'));
    const token = await createLink(app, id, 'view');
    const list = await app.inject({ method: 'GET', url: `/api/v1/scenarios/${id}/links` });
    expect(list.json().links).toHaveLength(1);
    expect(list.body).not.toContain(token);
    const bad = await app.inject({ method: 'POST', url: `/api/v1/scenarios/${id}/links`, payload: { mode: 'view', revision: 5 } });
    expect(bad.statusCode).toBe(404);
    expect(bad.json().error.issues[0].path).toBe('/revision');
    const badMode = await app.inject({ method: 'POST', url: `/api/v1/scenarios/${id}/links`, payload: { mode: 'admin' } });
    expect(badMode.statusCode).toBe(400);
    expect(badMode.json().error.issues[0].path).toBe('/mode');
  });

  it('stores only a SHA-256 hash of the token on disk', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'drydig-links-'));
    try {
      const disk = await buildApp({ dataDir: dir, clientDir: false });
      await signInApp(disk);
      const id = await createStored(disk, demoScenario('confined'));
      const token = await createLink(disk, id, 'edit');
      await disk.close();
      const bytes = readFileSync(join(dir, DATABASE_FILE)).toString('latin1') + readFileSync(join(dir, `${DATABASE_FILE}-wal`), { flag: 'a+' }).toString('latin1');
      expect(bytes).not.toContain(token);
      expect(bytes).toContain(hashShareToken(token));
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

describe('GET /api/v1/links/:token', () => {
  it('opens the site view data: scenario, set-out with lat/lon, cautions, and never the scenario id', async () => {
    const id = await createStored(app, demoScenario('confined'));
    const token = await createLink(app, id, 'view');
    const res = await app.inject({ method: 'GET', url: `/api/v1/links/${token}` });
    expect(res.statusCode).toBe(200);
    const body = res.json();
    expect(body.canEdit).toBe(false);
    expect(body.georeferenced).toBe(true);
    expect(body.setout).toHaveLength(6);
    expect(body.setout[0]).toMatchObject({ number: 1, id: 'DW1', easting_m: 389194, northing_m: 5819394 });
    expect(body.setout[0].latitude_deg).toBeGreaterThan(52);
    expect(body.cautions.length).toBeGreaterThan(0);
    expect(body.contours.lines.length).toBeGreaterThan(0);
    expect(typeof body.design.feasible).toBe('boolean');
    expect(body.computedBy).toMatch(/^drydig \d+\.\d+\.\d+/);
    expect(body.design.wells).toHaveLength(6);
    expect(res.body).not.toContain(id);
    expect(res.headers['cache-control']).toBe('no-store');
  });

  it('shows the pinned revision after later saves, and the latest for a following link', async () => {
    const first = demoScenario('confined');
    const id = await createStored(app, first);
    const pinned = await createLink(app, id, 'view', 1);
    const following = await createLink(app, id, 'view');
    const second = demoScenario('confined');
    second.name = 'after the review';
    await app.inject({ method: 'PUT', url: `/api/v1/scenarios/${id}`, payload: { scenario: second, baseRevision: 1 } });
    const p = (await app.inject({ method: 'GET', url: `/api/v1/links/${pinned}` })).json();
    const f = (await app.inject({ method: 'GET', url: `/api/v1/links/${following}` })).json();
    expect(p.revision.revision).toBe(1);
    expect(p.scenario).toEqual(first);
    expect(f.revision.revision).toBe(2);
    expect(f.scenario).toEqual(second);
  });

  it('serves a pinned revision’s computed results frozen when the link was made, not recomputed', async () => {
    const scenario = demoScenario('confined');
    const id = await createStored(app, scenario);
    const record = (await app.inject({ method: 'GET', url: `/api/v1/scenarios/${id}` })).json();
    // Stand-in for results from an older engine: whatever was frozen first is what the link shows.
    await app.scenarioStore.putSnapshot({
      sha256: record.sha256,
      computedBy: 'drydig 0.0.9',
      body: JSON.stringify({ resultsError: 'frozen with the agreed plan', design: null, designError: 'frozen design marker' }),
    });
    const pinned = await createLink(app, id, 'view', 1);
    const following = await createLink(app, id, 'view');
    const p = (await app.inject({ method: 'GET', url: `/api/v1/links/${pinned}` })).json();
    expect(p).toMatchObject({ computedBy: 'drydig 0.0.9', computeError: 'frozen with the agreed plan', designError: 'frozen design marker', contours: null });
    expect(p.frozenAt).toMatch(/^\d{4}-\d{2}-\d{2}T/);
    const report = await app.inject({ method: 'GET', url: `/api/v1/links/${pinned}/export/report-html` });
    expect(report.body).toContain('drydig 0.0.9 (frozen');
    // The following link is the same revision today, so it shows the same frozen snapshot.
    expect((await app.inject({ method: 'GET', url: `/api/v1/links/${following}` })).json().computedBy).toBe('drydig 0.0.9');
  });

  it('freezes the computed results when a pinned link is made', async () => {
    const id = await createStored(app, demoScenario('confined'));
    const sha = (await app.inject({ method: 'GET', url: `/api/v1/scenarios/${id}` })).json().sha256;
    expect(await app.scenarioStore.getSnapshot(sha)).toBeUndefined();
    await createLink(app, id, 'view');
    expect(await app.scenarioStore.getSnapshot(sha)).toBeUndefined();
    const token = await createLink(app, id, 'view', 1);
    const snapshot = await app.scenarioStore.getSnapshot(sha);
    expect(snapshot?.computedBy).toMatch(/^drydig /);
    const frozen = JSON.parse(snapshot!.body);
    const view = (await app.inject({ method: 'GET', url: `/api/v1/links/${token}` })).json();
    expect(view.design.totalRate_m3_s).toBe(frozen.design.totalRate_m3_s);
    expect(view.contours.lines.length).toBe(frozen.results.contours.lines.length);
  });

  it.each([
    ['a well-formed token nobody issued', 'A'.repeat(43), 404],
    // Issue 16 item 7: a wrong-shaped token answers the same documented 404 as an unknown one.
    ['a token with a character outside base64url', `${'A'.repeat(42)}!`, 404],
    ['a token one character short', 'A'.repeat(42), 404],
    ['a traversal attempt', '..%2F..%2Fscenarios', 404],
  ])('refuses %s with a 404 and a clear message', async (_label, token, status) => {
    const res = await app.inject({ method: 'GET', url: `/api/v1/links/${token}` });
    expect(res.statusCode).toBe(status);
    expect(res.json().error.message.length).toBeGreaterThan(5);
  });
});

describe('a scenario the engine cannot compute', () => {
  it('still opens through a link and exports, saying why levels are missing', async () => {
    const s = demoScenario('confined');
    const w = s.wells[0]!;
    // Two boundaries at 60°: neither perpendicular nor parallel, which image wells cannot represent.
    s.boundaries = [
      { kind: 'no-flow', from: [w.x - 200, w.y - 200], to: [w.x - 200, w.y + 200] },
      { kind: 'constant-head', from: [w.x - 200, w.y + 300], to: [w.x - 200 + 400 * Math.cos(Math.PI / 3), w.y + 300 + 400 * Math.sin(Math.PI / 3)] },
    ];
    const id = await createStored(app, s);
    const token = await createLink(app, id, 'view');
    const res = await app.inject({ method: 'GET', url: `/api/v1/links/${token}` });
    expect(res.statusCode).toBe(200);
    expect(res.json().computeError).toMatch(/boundar/i);
    expect(res.json().contours).toBeNull();
    for (const format of ['setout-csv', 'geojson', 'dxf', 'report-html', 'monitoring-csv', 'scenario-json']) {
      const file = await app.inject({ method: 'GET', url: `/api/v1/links/${token}/export/${format}` });
      expect(file.statusCode, format).toBe(200);
    }
    const report = await app.inject({ method: 'GET', url: `/api/v1/links/${token}/export/report-html` });
    expect(report.body).toMatch(/Levels could not be computed: [^<]*boundar/i);
  });
});

describe('a view token', () => {
  it('can never write: saves and readings are refused with 403 and nothing changes', async () => {
    const id = await createStored(app, withMonitoring(demoScenario('confined')));
    const token = await createLink(app, id, 'view');
    const save = await app.inject({ method: 'PUT', url: `/api/v1/links/${token}/scenario`, payload: { scenario: demoScenario('confined'), baseRevision: 1 } });
    expect(save.statusCode).toBe(403);
    expect(save.json().error.code).toBe('DRYDIG_ERR_LINK_READ_ONLY');
    const reading = await app.inject({ method: 'POST', url: `/api/v1/links/${token}/readings`, payload: { piezometerId: 'PZ1', level_m: 3.2 } });
    expect(reading.statusCode).toBe(403);
    for (const method of ['DELETE', 'PATCH', 'POST'] as const) {
      const res = await app.inject({ method, url: `/api/v1/links/${token}`, payload: {} });
      expect(res.statusCode).toBeGreaterThanOrEqual(400);
      expect(res.statusCode).toBeLessThan(500);
    }
    const history = await app.inject({ method: 'GET', url: `/api/v1/scenarios/${id}/revisions` });
    expect(history.json().revisions).toHaveLength(1);
    const readings = await app.inject({ method: 'GET', url: `/api/v1/scenarios/${id}/readings` });
    expect(readings.json().readings).toEqual([]);
  });
});

describe('an edit token', () => {
  it('saves against a base revision, with 409 for a stale one, and never reveals the scenario id', async () => {
    const id = await createStored(app, demoScenario('confined'));
    const token = await createLink(app, id, 'edit');
    const edited = demoScenario('confined');
    edited.name = 'site change';
    const ok = await app.inject({ method: 'PUT', url: `/api/v1/links/${token}/scenario`, payload: { scenario: edited, baseRevision: 1, savedBy: 'site engineer' } });
    expect(ok.statusCode).toBe(201);
    expect(ok.json().revision).toBe(2);
    expect(ok.body).not.toContain(id);
    const stale = await app.inject({ method: 'PUT', url: `/api/v1/links/${token}/scenario`, payload: { scenario: demoScenario('confined'), baseRevision: 1 } });
    expect(stale.statusCode).toBe(409);
    expect(stale.json().latest.revision).toBe(2);
    expect(stale.body).not.toContain(id);
  });

  it('appends readings (dated from the pumping start) but a pinned edit link cannot save a revision', async () => {
    const id = await createStored(app, withMonitoring(demoScenario('confined')));
    const token = await createLink(app, id, 'edit', 1);
    const reading = await app.inject({
      method: 'POST', url: `/api/v1/links/${token}/readings`,
      payload: { piezometerId: 'PZ1', level_m: 3.25, measuredAt: '2027-03-03T07:00:00Z', enteredBy: 'gauger' },
    });
    expect(reading.statusCode).toBe(201);
    expect(reading.json()).toMatchObject({ piezometerId: 'PZ1', level_m: 3.25, time_s: 2 * 86400 });
    expect(reading.json().enteredBy).toBe('gauger via share link');
    const again = await app.inject({ method: 'POST', url: `/api/v1/links/${token}/readings`, payload: { piezometerId: 'PZ1', level_m: 3.1, measuredAt: '2027-03-03T07:00:00Z' } });
    expect(again.statusCode).toBe(201);
    const list = await app.inject({ method: 'GET', url: `/api/v1/links/${token}/readings` });
    expect(list.json().readings.map((r: { level_m: number }) => r.level_m)).toEqual([3.25, 3.1]);
    const save = await app.inject({ method: 'PUT', url: `/api/v1/links/${token}/scenario`, payload: { scenario: demoScenario('confined'), baseRevision: 1 } });
    expect(save.statusCode).toBe(403);
    expect(save.json().error.message).toContain('pinned to revision 1');
  });

  it.each([
    [{ piezometerId: 'PZ9', level_m: 3 }, '/piezometerId'],
    [{ piezometerId: 'PZ1', level_m: 'high' }, '/level_m'],
    [{ piezometerId: 'PZ1', level_m: 3, measuredAt: 'yesterday' }, '/measuredAt'],
    [{ piezometerId: 'PZ1', level_m: 3, measuredAt: '2027-02-01T00:00:00Z' }, '/measuredAt'],
    [{ piezometerId: 'PZ1', level_m: 1e300 }, '/level_m'],
  ])('refuses the reading %j naming %s', async (payload, path) => {
    const id = await createStored(app, withMonitoring(demoScenario('confined')));
    const token = await createLink(app, id, 'edit');
    const res = await app.inject({ method: 'POST', url: `/api/v1/links/${token}/readings`, payload });
    expect(res.statusCode).toBe(400);
    expect(res.json().error.issues[0].path).toBe(path);
  });
});

describe('DELETE /api/v1/scenarios/:id/links/:linkId', () => {
  it('revokes one link (410 from then on) and leaves the others working', async () => {
    const id = await createStored(app, demoScenario('confined'));
    const made = await app.inject({ method: 'POST', url: `/api/v1/scenarios/${id}/links`, payload: { mode: 'view', label: 'phase 1' } });
    const { token, linkId } = made.json();
    const other = await createLink(app, id, 'view');
    const del = await app.inject({ method: 'DELETE', url: `/api/v1/scenarios/${id}/links/${linkId}` });
    expect(del.statusCode).toBe(204);
    const gone = await app.inject({ method: 'GET', url: `/api/v1/links/${token}` });
    expect(gone.statusCode).toBe(410);
    expect(gone.json().error.code).toBe('DRYDIG_ERR_LINK_REVOKED');
    const exportGone = await app.inject({ method: 'GET', url: `/api/v1/links/${token}/export/setout-csv` });
    expect(exportGone.statusCode).toBe(410);
    expect((await app.inject({ method: 'GET', url: `/api/v1/links/${other}` })).statusCode).toBe(200);
    const twice = await app.inject({ method: 'DELETE', url: `/api/v1/scenarios/${id}/links/${linkId}` });
    expect(twice.statusCode).toBe(404);
  });
});

describe('logging', () => {
  it('never writes a share token into the log', async () => {
    const lines: string[] = [];
    const logged = await buildApp({ dataDir: ':memory:', clientDir: false, logger: { level: 'info', stream: { write: (s: string) => void lines.push(s) } } });
    await signInApp(logged);
    const id = await createStored(logged, demoScenario('confined'));
    const token = await createLink(logged, id, 'view');
    await logged.inject({ method: 'GET', url: `/api/v1/links/${token}` });
    await logged.inject({ method: 'GET', url: `/api/v1/links/${token}/export/setout-csv` });
    await logged.inject({ method: 'POST', url: `/api/v1/links/${token}/readings`, payload: { piezometerId: 'x', level_m: 1 } });
    await logged.inject({ method: 'GET', url: `/site/${token}` });
    await logged.close();
    const text = lines.join('');
    expect(text).toContain('/api/v1/links/[token]');
    expect(text).not.toContain(token);
  });
});
