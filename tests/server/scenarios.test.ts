/**
 * The scenario routes: immutable revisions, history with change summaries, restore, 409 on a
 * stale save, validation naming the field. Demo scenarios are invented (fixtures/README.md).
 */
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import type { Scenario } from '../../shared/schema';
import { createStored, demoScenario, signedInMemoryApp } from './scenarios-helpers';

let app: FastifyInstance;
beforeEach(async () => {
  app = await signedInMemoryApp();
});
afterEach(async () => {
  await app.close();
});

describe('POST /api/v1/scenarios', () => {
  it('stores revision 1 and GET returns the document unchanged', async () => {
    const scenario = demoScenario('confined');
    const res = await app.inject({ method: 'POST', url: '/api/v1/scenarios', payload: { scenario, savedBy: 'R. Designer', note: 'bid issue' } });
    expect(res.statusCode).toBe(201);
    const meta = res.json();
    expect(meta).toMatchObject({ revision: 1, savedBy: 'R. Designer', note: 'bid issue', name: scenario.name, restoredFrom: null });
    expect(meta.scenarioId).toMatch(/^[A-Za-z0-9_-]{22}$/);
    expect(meta.sha256).toMatch(/^[0-9a-f]{64}$/);
    const got = await app.inject({ method: 'GET', url: `/api/v1/scenarios/${meta.scenarioId}` });
    expect(got.statusCode).toBe(200);
    expect(got.json().scenario).toEqual(scenario);
  });

  it('gives scenario ids that do not repeat or follow a sequence', async () => {
    const ids = new Set<string>();
    for (let i = 0; i < 20; i++) ids.add(await createStored(app, demoScenario('confined')));
    expect(ids.size).toBe(20);
  });

  type Spoil = (s: Scenario & { monitoring?: unknown }) => void;
  const spoilers: Array<[string, Spoil, string, string]> = [
    ['a wrong type inside the scenario', (s) => { s.wells[3]!.rate_m3_s = 'lots' as unknown as number; }, '/scenario/wells/3/rate_m3_s', 'DRYDIG_ERR_INVALID_SCENARIO'],
    ['a missing aquifer field', (s) => { delete (s.aquifer as Partial<Scenario['aquifer']>).conductivity_m_s; }, '/scenario/aquifer/conductivity_m_s', 'DRYDIG_ERR_INVALID_SCENARIO'],
    ['a bad monitoring piezometer', (s) => { s.monitoring = { piezometers: [{ id: 'P1', x: 'east', y: 0 }] }; }, '/scenario/monitoring/piezometers/0/x', 'DRYDIG_ERR_INVALID_SCENARIO'],
    ['a duplicate piezometer id', (s) => { s.monitoring = { piezometers: [{ id: 'P1', x: 0, y: 0 }, { id: 'P1', x: 1, y: 1 }] }; }, '/scenario/monitoring/piezometers/1/id', 'DRYDIG_ERR_INVALID_SCENARIO'],
    ['a pumping start that is not a date', (s) => { s.monitoring = { piezometers: [], pumpingStart: 'next Monday' }; }, '/scenario/monitoring/pumpingStart', 'DRYDIG_ERR_INVALID_SCENARIO'],
  ];
  it.each(spoilers)('refuses %s with 400 naming the field', async (_label, spoil, path, code) => {
    const scenario = demoScenario('confined');
    spoil(scenario);
    const res = await app.inject({ method: 'POST', url: '/api/v1/scenarios', payload: { scenario } });
    expect(res.statusCode).toBe(400);
    expect(res.json().error.code).toBe(code);
    expect(res.json().error.message).toContain(path);
    expect(res.json().error.issues[0].path).toBe(path);
    const list = await app.inject({ method: 'GET', url: '/api/v1/scenarios' });
    expect(list.json().scenarios).toEqual([]);
  });

  it('refuses an unknown body field and a savedBy that is not text, naming them', async () => {
    const a = await app.inject({ method: 'POST', url: '/api/v1/scenarios', payload: { scenario: demoScenario('confined'), author: 'x' } });
    expect(a.statusCode).toBe(400);
    expect(a.json().error.issues[0].path).toBe('/author');
    const b = await app.inject({ method: 'POST', url: '/api/v1/scenarios', payload: { scenario: demoScenario('confined'), savedBy: 7 } });
    expect(b.statusCode).toBe(400);
    expect(b.json().error.issues[0].path).toBe('/savedBy');
  });
});

describe('PUT /api/v1/scenarios/:id', () => {
  it('stores each save as a new revision and leaves earlier revisions as they were', async () => {
    const first = demoScenario('confined');
    const id = await createStored(app, first);
    const second = demoScenario('confined');
    second.wells[0]!.rate_m3_s = 0.015;
    const put = await app.inject({ method: 'PUT', url: `/api/v1/scenarios/${id}`, payload: { scenario: second, baseRevision: 1, savedBy: 'B' } });
    expect(put.statusCode).toBe(201);
    expect(put.json().revision).toBe(2);
    const r1 = await app.inject({ method: 'GET', url: `/api/v1/scenarios/${id}/revisions/1` });
    const r2 = await app.inject({ method: 'GET', url: `/api/v1/scenarios/${id}/revisions/2` });
    expect(r1.json().scenario).toEqual(first);
    expect(r2.json().scenario).toEqual(second);
    const latest = await app.inject({ method: 'GET', url: `/api/v1/scenarios/${id}` });
    expect(latest.json().revision).toBe(2);
  });

  it('refuses a save based on an older revision with 409 and sends the newer revision', async () => {
    const id = await createStored(app, demoScenario('confined'));
    const tabA = demoScenario('confined');
    tabA.name = 'tab A edit';
    const tabB = demoScenario('confined');
    tabB.name = 'tab B edit';
    const a = await app.inject({ method: 'PUT', url: `/api/v1/scenarios/${id}`, payload: { scenario: tabA, baseRevision: 1, savedBy: 'tab A' } });
    expect(a.statusCode).toBe(201);
    const b = await app.inject({ method: 'PUT', url: `/api/v1/scenarios/${id}`, payload: { scenario: tabB, baseRevision: 1, savedBy: 'tab B' } });
    expect(b.statusCode).toBe(409);
    const body = b.json();
    expect(body.error.code).toBe('DRYDIG_ERR_REVISION_CONFLICT');
    expect(body.error.message).toContain('revision 2');
    expect(body.error.message).toContain('tab A');
    expect(body.latest.revision).toBe(2);
    expect(body.latest.scenario).toEqual(tabA);
    const history = await app.inject({ method: 'GET', url: `/api/v1/scenarios/${id}/revisions` });
    expect(history.json().revisions.map((r: { revision: number }) => r.revision)).toEqual([2, 1]);
  });

  it('names /baseRevision when it is missing or not a whole number', async () => {
    const id = await createStored(app, demoScenario('confined'));
    for (const baseRevision of [undefined, 1.5, '1', 0]) {
      const res = await app.inject({ method: 'PUT', url: `/api/v1/scenarios/${id}`, payload: { scenario: demoScenario('confined'), baseRevision } });
      expect(res.statusCode).toBe(400);
      expect(res.json().error.issues[0].path).toBe('/baseRevision');
    }
  });

  it('answers 404 for a well-formed id that does not exist and 400 for a malformed one', async () => {
    const missing = await app.inject({ method: 'PUT', url: '/api/v1/scenarios/AAAAAAAAAAAAAAAAAAAAAA', payload: { scenario: demoScenario('confined'), baseRevision: 1 } });
    expect(missing.statusCode).toBe(404);
    expect(missing.json().error.code).toBe('DRYDIG_ERR_NOT_FOUND');
    const malformed = await app.inject({ method: 'GET', url: '/api/v1/scenarios/..%2F..%2Fetc' });
    expect(malformed.statusCode).toBe(400);
    expect(malformed.json().error.issues[0].path).toBe('/id');
  });
});

describe('GET /api/v1/scenarios/:id/revisions', () => {
  it('lists revisions newest first with when, who and a summary of what changed', async () => {
    const base = demoScenario('confined');
    const id = await createStored(app, base, 'first saver');
    const edited = demoScenario('confined');
    edited.wells.push({ ...edited.wells[0]!, id: 'DW7', x: edited.wells[0]!.x + 10 });
    edited.wells[1]!.rate_m3_s = 0.02;
    edited.design.time_s = 14 * 86400;
    await app.inject({ method: 'PUT', url: `/api/v1/scenarios/${id}`, payload: { scenario: edited, baseRevision: 1, savedBy: 'second saver', note: 'extra well for the lift pit' } });
    const res = await app.inject({ method: 'GET', url: `/api/v1/scenarios/${id}/revisions` });
    const [r2, r1] = res.json().revisions;
    expect(r1).toMatchObject({ revision: 1, savedBy: 'first saver' });
    expect(r1.summary).toContain('first save: 6 wells, 1 excavation');
    expect(r2).toMatchObject({ revision: 2, savedBy: 'second saver', note: 'extra well for the lift pit' });
    expect(r2.summary).toContain('1 well added (DW7)');
    expect(r2.summary).toContain(`${edited.wells[1]!.id} 12 L/s → 20 L/s`);
    expect(r2.summary).toContain('design time 7 d → 14 d');
    expect(Date.parse(r2.savedAt)).toBeGreaterThanOrEqual(Date.parse(r1.savedAt));
    expect(r2).not.toHaveProperty('scenario');
  });

  it('lists stored scenarios with their latest revision', async () => {
    const a = await createStored(app, demoScenario('confined'));
    const b = await createStored(app, demoScenario('unconfined'));
    await app.inject({ method: 'PUT', url: `/api/v1/scenarios/${a}`, payload: { scenario: demoScenario('confined'), baseRevision: 1 } });
    const list = (await app.inject({ method: 'GET', url: '/api/v1/scenarios' })).json().scenarios as Array<{ scenarioId: string; latestRevision: number }>;
    expect(list.find((s) => s.scenarioId === a)?.latestRevision).toBe(2);
    expect(list.find((s) => s.scenarioId === b)?.latestRevision).toBe(1);
  });
});

describe('POST /api/v1/scenarios/:id/restore', () => {
  it('restores an old revision as a new revision, keeping the history', async () => {
    const original = demoScenario('confined');
    const id = await createStored(app, original);
    const changed = demoScenario('confined');
    changed.aquifer.conductivity_m_s = 5e-4;
    await app.inject({ method: 'PUT', url: `/api/v1/scenarios/${id}`, payload: { scenario: changed, baseRevision: 1 } });
    const res = await app.inject({ method: 'POST', url: `/api/v1/scenarios/${id}/restore`, payload: { revision: 1, baseRevision: 2, savedBy: 'reviewer' } });
    expect(res.statusCode).toBe(201);
    expect(res.json()).toMatchObject({ revision: 3, restoredFrom: 1 });
    expect(res.json().summary).toContain('restored revision 1');
    expect(res.json().summary).toContain('aquifer conductivity_m_s 0.0005 → 0.0003');
    const latest = await app.inject({ method: 'GET', url: `/api/v1/scenarios/${id}` });
    expect(latest.json().scenario).toEqual(original);
    const stale = await app.inject({ method: 'POST', url: `/api/v1/scenarios/${id}/restore`, payload: { revision: 2, baseRevision: 2 } });
    expect(stale.statusCode).toBe(409);
    const missing = await app.inject({ method: 'POST', url: `/api/v1/scenarios/${id}/restore`, payload: { revision: 9, baseRevision: 3 } });
    expect(missing.statusCode).toBe(404);
    expect(missing.json().error.issues[0].path).toBe('/revision');
  });
});

describe('GET /api/v1/scenarios/:id/export/scenario-json', () => {
  it('exports a file that imports back as the same scenario', async () => {
    const scenario = demoScenario('unconfined');
    const id = await createStored(app, scenario);
    const file = await app.inject({ method: 'GET', url: `/api/v1/scenarios/${id}/export/scenario-json` });
    expect(file.statusCode).toBe(200);
    expect(file.headers['content-disposition']).toMatch(/attachment; filename=".*-rev1\.drydig\.json"/);
    const parsed = JSON.parse(file.body);
    expect(parsed).toMatchObject({ format: 'drydig.scenario', version: 1 });
    const reimport = await app.inject({ method: 'POST', url: '/api/v1/scenarios', payload: { scenario: parsed } });
    const again = await app.inject({ method: 'GET', url: `/api/v1/scenarios/${reimport.json().scenarioId}` });
    expect(again.json().scenario).toEqual(scenario);
    expect(again.json().sha256).toBe(reimport.json().sha256);
  });

  it('exports a named revision with ?revision= and refuses an unknown format', async () => {
    const first = demoScenario('confined');
    const id = await createStored(app, first);
    const second = demoScenario('confined');
    second.name = 'changed';
    await app.inject({ method: 'PUT', url: `/api/v1/scenarios/${id}`, payload: { scenario: second, baseRevision: 1 } });
    const old = await app.inject({ method: 'GET', url: `/api/v1/scenarios/${id}/export/scenario-json?revision=1` });
    expect(JSON.parse(old.body)).toEqual(first);
    const bad = await app.inject({ method: 'GET', url: `/api/v1/scenarios/${id}/export/xlsx` });
    expect(bad.statusCode).toBe(400);
    expect(bad.json().error.issues[0].path).toBe('/format');
  });
});
