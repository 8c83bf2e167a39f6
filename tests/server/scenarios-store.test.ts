/**
 * The SQLite scenario store behind the routes: durable on disk (WAL), revisions append-only at the
 * database level, damage detected by checksum, one winner when two connections save on the same
 * base revision, and plain-language change summaries.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Database from 'better-sqlite3';
import { afterEach, describe, expect, it } from 'vitest';
import { DATABASE_FILE, openScenarioStore, openSqliteScenarioStore, StoredDataDamagedError, summariseScenarioChanges } from '../../server/storage';
import { buildApp } from '../../server/app';
import { signInApp } from '../helpers/sign-in';
import type { Scenario } from '../../shared/schema';
import { demoScenario } from './scenarios-helpers';

const folders: string[] = [];
function tempDir(): string {
  const dir = mkdtempSync(join(tmpdir(), 'drydig-store-'));
  folders.push(dir);
  return dir;
}
afterEach(() => {
  for (const dir of folders.splice(0)) rmSync(dir, { recursive: true, force: true });
});


/**
 * Stores the confined demo, then damages its stored text as a disk fault would (replacing
 * `from` by `to`); the no-update trigger stops ordinary updates, so it is dropped first.
 */
async function storeDamagedRevision(from: string, to: string) {
  const dir = tempDir();
  const store = openScenarioStore(dir);
  const saved = await store.createScenario({ scenario: demoScenario('confined') });
  await store.close();
  const raw = new Database(join(dir, DATABASE_FILE));
  raw.exec('DROP TRIGGER revisions_no_update');
  raw.prepare('UPDATE revisions SET body = replace(body, ?, ?) WHERE scenario_id = ?').run(from, to, saved.scenarioId);
  raw.close();
  return { dir, saved };
}

describe('openScenarioStore(dataDir)', () => {
  it('keeps revisions across close and reopen, in a WAL-journal database file', async () => {
    const dir = tempDir();
    const store = openScenarioStore(dir);
    const first = await store.createScenario({ scenario: demoScenario('confined'), savedBy: 'a' });
    const edited = demoScenario('confined');
    edited.name = 'edited';
    const second = await store.saveRevision({ scenarioId: first.scenarioId, baseRevision: 1, scenario: edited });
    expect(second.ok).toBe(true);
    await store.close();

    const raw = new Database(join(dir, DATABASE_FILE), { readonly: true });
    expect(raw.pragma('journal_mode', { simple: true })).toBe('wal');
    raw.close();

    const reopened = openScenarioStore(dir);
    const latest = await reopened.getLatest(first.scenarioId);
    expect(latest?.revision).toBe(2);
    expect(latest?.scenario).toEqual(edited);
    expect((await reopened.getRevision(first.scenarioId, 1))?.scenario).toEqual(demoScenario('confined'));
    await reopened.close();
  });

  it('migrates to the current schema once, and refuses a database from a newer drydig', async () => {
    const dir = tempDir();
    (await openScenarioStore(dir).close());
    const raw = new Database(join(dir, DATABASE_FILE));
    expect(raw.pragma('user_version', { simple: true })).toBe(3);
    expect(raw.prepare("SELECT name FROM sqlite_master WHERE type = 'table' ORDER BY name").all().map((r) => (r as { name: string }).name))
      .toEqual(expect.arrayContaining(['links', 'readings', 'revisions', 'scenarios', 'snapshots', 'users', 'sessions', 'audit']));
    raw.close();
    const again = openScenarioStore(dir);
    await again.close();
    const newer = new Database(join(dir, DATABASE_FILE));
    newer.pragma('user_version = 99');
    newer.close();
    expect(() => openScenarioStore(dir)).toThrow(/newer drydig \(schema 99/);
  });

  it('keeps the first snapshot stored for a checksum', async () => {
    const store = openScenarioStore(':memory:');
    await store.putSnapshot({ sha256: 'a'.repeat(64), computedBy: 'drydig 1', body: '{"n":1}' });
    await store.putSnapshot({ sha256: 'a'.repeat(64), computedBy: 'drydig 2', body: '{"n":2}' });
    expect(await store.getSnapshot('a'.repeat(64))).toMatchObject({ computedBy: 'drydig 1', body: '{"n":1}' });
    await store.close();
  });

  it("':memory:' keeps nothing between stores", async () => {
    const a = openScenarioStore(':memory:');
    const saved = await a.createScenario({ scenario: demoScenario('confined') });
    await a.close();
    const b = openScenarioStore(':memory:');
    expect(await b.getLatest(saved.scenarioId)).toBeUndefined();
    await b.close();
  });
});

describe('stored revisions', () => {
  it('cannot be updated or deleted, even by SQL against the file', async () => {
    const dir = tempDir();
    const store = openScenarioStore(dir);
    const saved = await store.createScenario({ scenario: demoScenario('confined') });
    await store.appendReading({ scenarioId: saved.scenarioId, piezometerId: 'P1', measuredAt: '2027-03-01T08:00:00Z', time_s: 3600, level_m: 4.2, enteredBy: '', note: '' });
    await store.close();
    const raw = new Database(join(dir, DATABASE_FILE));
    expect(() => raw.prepare("UPDATE revisions SET body = '{}' WHERE scenario_id = ?").run(saved.scenarioId)).toThrow(/immutable/);
    expect(() => raw.prepare('DELETE FROM revisions WHERE scenario_id = ?').run(saved.scenarioId)).toThrow(/immutable/);
    expect(() => raw.prepare('DELETE FROM readings').run()).toThrow(/append-only/);
    expect(() => raw.prepare('UPDATE readings SET level_m = 0').run()).toThrow(/append-only/);
    raw.close();
  });

  it('are checked against their SHA-256 on read; a damaged one is reported, not served', async () => {
    const { dir, saved } = await storeDamagedRevision('"confined"', '"unconfined"');
    const reopened = openScenarioStore(dir);
    await expect(reopened.getLatest(saved.scenarioId)).rejects.toBeInstanceOf(StoredDataDamagedError);
    await reopened.close();
  });

  it('answer a damaged revision over HTTP with a 500 that says nothing internal', async () => {
    const { dir, saved } = await storeDamagedRevision('15', '16');
    const app = await buildApp({ dataDir: dir, clientDir: false });
    await signInApp(app);
    const res = await app.inject({ method: 'GET', url: `/api/v1/scenarios/${saved.scenarioId}` });
    expect(res.statusCode).toBe(500);
    expect(res.json().error.code).toBe('DRYDIG_ERR_STORED_DATA_DAMAGED');
    expect(res.body).not.toMatch(/\n\s+at |sqlite|checksum/i);
    await app.close();
  });
});

describe('saveRevision({ baseRevision })', () => {
  it('lets exactly one of two connections to the same file save on one base revision', async () => {
    const dir = tempDir();
    const file = join(dir, DATABASE_FILE);
    const one = openSqliteScenarioStore({ filename: file });
    const two = openSqliteScenarioStore({ filename: file });
    const saved = await one.createScenario({ scenario: demoScenario('confined') });
    const a = demoScenario('confined');
    a.name = 'from connection one';
    const b = demoScenario('confined');
    b.name = 'from connection two';
    const outcomes = await Promise.all([
      one.saveRevision({ scenarioId: saved.scenarioId, baseRevision: 1, scenario: a }),
      two.saveRevision({ scenarioId: saved.scenarioId, baseRevision: 1, scenario: b }),
    ]);
    expect(outcomes.filter((o) => o.ok)).toHaveLength(1);
    const loser = outcomes.find((o) => !o.ok);
    expect(loser).toMatchObject({ ok: false, reason: 'conflict' });
    expect((await two.listRevisions(saved.scenarioId))?.length).toBe(2);
    await one.close();
    await two.close();
  });
});

describe('summariseScenarioChanges(before, after)', () => {
  const base = (): Scenario => demoScenario('confined');
  const cases: Array<[string, (s: Scenario) => void, string[]]> = [
    ['nothing', () => {}, ['no change']],
    ['a rename', (s) => { s.name = 'Basement B'; }, ['renamed "Ferry Road basement (invented demo site)" → "Basement B"']],
    ['a moved well', (s) => { s.wells[2]!.x += 1; }, [`1 well moved (${base().wells[2]!.id})`]],
    ['a removed well', (s) => { s.wells.splice(0, 1); }, [`1 well removed (${base().wells[0]!.id})`]],
    ['a schedule replacing a rate', (s) => { const w = s.wells[0]!; delete w.rate_m3_s; w.schedule = [{ from_s: 0, rate_m3_s: 0.012 }, { from_s: 86400, rate_m3_s: 0 }]; }, [`${base().wells[0]!.id} 12 L/s → schedule of 2 steps`]],
    ['a new formation level', (s) => { s.excavations[0]!.formationLevel_m -= 0.5; }, [`${base().excavations[0]!.id} formation`]],
    ['steady state', (s) => { s.design.time_s = null; }, ['design time 7 d → steady state']],
    ['a monitoring plan', (s) => { (s as Scenario & { monitoring: unknown }).monitoring = { piezometers: [] }; }, ['monitoring changed']],
  ];
  it.each(cases)('describes %s', (_label, change, expected) => {
    const after = base();
    change(after);
    const summary = summariseScenarioChanges(base(), after);
    for (const text of expected) expect(summary).toContain(text);
  });
});
