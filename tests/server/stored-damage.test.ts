/**
 * Issue 14 item 4 and issue 16 item 2: every field the history shows is under a checksum; damage
 * answers DRYDIG_ERR_STORED_DATA_DAMAGED naming the revision on every route (never INTERNAL); a
 * damaged database file stops the start with a message naming the file and how to restore.
 */
import { afterEach, describe, expect, it } from 'vitest';
import Database from 'better-sqlite3';
import { mkdtempSync, rmSync, writeFileSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { InjectOptions } from 'fastify';
import { buildApp } from '../../server/app';
import { runCli } from '../../server/cli';
import { DATABASE_FILE } from '../../server/storage';
import { createLink, createStored, demoScenario } from './scenarios-helpers';
import { signInApp } from '../helpers/sign-in';
import { captureIo } from '../cli/capture-io';

const dirs: string[] = [];
afterEach(() => {
  for (const d of dirs.splice(0)) rmSync(d, { recursive: true, force: true });
});
function tempDir(): string {
  const d = mkdtempSync(join(tmpdir(), 'drydig-damage-'));
  dirs.push(d);
  return d;
}

/** Rewrites stored rows behind drydig's back, as disk damage or a hand edit would. */
function tamper(dir: string, sql: string): void {
  const db = new Database(join(dir, DATABASE_FILE));
  db.exec('DROP TRIGGER IF EXISTS revisions_no_update; DROP TRIGGER IF EXISTS readings_no_update;');
  db.exec(sql);
  db.close();
}

async function storedWithLink(dir: string) {
  const app = await buildApp({ dataDir: dir, clientDir: false });
  await signInApp(app, 'designer', 'dana');
  const id = await createStored(app, demoScenario('confined'), 'J. Engineer');
  const token = await createLink(app, id, 'view');
  await app.close();
  return { id, token };
}

async function reopen(dir: string) {
  const app = await buildApp({ dataDir: dir, clientDir: false });
  const session = await signInApp(app, 'viewer', 'vic');
  return { app, session };
}

describe('record checksums (issue 16 item 2)', () => {
  it.each([
    ['saved_by', "UPDATE revisions SET saved_by = 'approved by engineer'"],
    ['note', "UPDATE revisions SET note = 'checked and approved'"],
    ['summary', "UPDATE revisions SET summary = 'no change'"],
    ['saved_at', "UPDATE revisions SET saved_at = '2020-01-01T00:00:00.000Z'"],
    ['name', "UPDATE revisions SET name = 'Other job'"],
  ])('a rewritten %s is reported as damage of that revision, in the history too', async (_field, sql) => {
    const dir = tempDir();
    const { id } = await storedWithLink(dir);
    tamper(dir, sql);
    const { app } = await reopen(dir);
    for (const url of [`/api/v1/scenarios/${id}/revisions`, `/api/v1/scenarios/${id}`, `/api/v1/scenarios/${id}/revisions/1`]) {
      const res = await app.inject({ method: 'GET', url });
      expect(res.statusCode, url).toBe(500);
      expect(res.json().error.code, url).toBe('DRYDIG_ERR_STORED_DATA_DAMAGED');
      expect(res.json().error.message, url).toContain(`revision 1 of scenario ${id}`);
    }
    await app.close();
  });

  it('a rewritten link label is reported as damage', async () => {
    const dir = tempDir();
    const { id } = await storedWithLink(dir);
    tamper(dir, "UPDATE links SET label = 'forged'");
    const { app } = await reopen(dir);
    const res = await app.inject({ method: 'GET', url: `/api/v1/scenarios/${id}/links` });
    expect(res.json().error.code).toBe('DRYDIG_ERR_STORED_DATA_DAMAGED');
    expect(res.json().error.message).toContain('share link');
    await app.close();
  });
});

describe('a damaged revision', () => {
  it('answers DRYDIG_ERR_STORED_DATA_DAMAGED on every route that reads it, never INTERNAL', async () => {
    const dir = tempDir();
    const { id, token } = await storedWithLink(dir);
    // Flipped bytes in the stored scenario text (still JSON, and also not JSON).
    tamper(dir, "UPDATE revisions SET body = replace(body, '\"confined\"', '\"unconfined\"')");
    const { app } = await reopen(dir);
    const designer = await signInApp(app, 'designer', 'dee');
    void designer;
    const requests = [
      { method: 'GET', url: `/api/v1/scenarios/${id}` },
      { method: 'GET', url: `/api/v1/scenarios/${id}/revisions/1` },
      { method: 'GET', url: `/api/v1/scenarios/${id}/export/setout-csv` },
      { method: 'GET', url: `/api/v1/scenarios/${id}/export/report-html` },
      { method: 'GET', url: `/api/v1/scenarios/${id}/monitoring` },
      { method: 'GET', url: `/api/v1/scenarios/${id}/readings` },
      { method: 'PUT', url: `/api/v1/scenarios/${id}`, payload: { scenario: demoScenario('confined'), baseRevision: 1 } },
      { method: 'POST', url: `/api/v1/scenarios/${id}/links`, payload: { mode: 'view', revision: 1 } },
      { method: 'GET', url: `/api/v1/links/${token}` },
      { method: 'GET', url: `/api/v1/links/${token}/monitoring` },
      { method: 'GET', url: `/api/v1/links/${token}/export/dxf` },
    ] as const;
    for (const r of requests) {
      const res = await app.inject(r as unknown as InjectOptions);
      expect(res.statusCode, `${r.method} ${r.url}`).toBe(500);
      expect(res.json().error.code, `${r.method} ${r.url}`).toBe('DRYDIG_ERR_STORED_DATA_DAMAGED');
      expect(res.body).not.toMatch(/\n\s+at /);
    }
    tamper(dir, "UPDATE revisions SET body = substr(body, 1, 40), sha256 = 'x'");
    const res = await app.inject({ method: 'GET', url: `/api/v1/scenarios/${id}` });
    expect(res.json().error.code).toBe('DRYDIG_ERR_STORED_DATA_DAMAGED');
    await app.close();
  });
});

describe('a damaged database file at start', () => {
  it.each([
    ['truncated', (file: string) => writeFileSync(file, readFileSync(file).subarray(0, 1500))],
    ['overwritten', (file: string) => writeFileSync(file, Buffer.alloc(8192, 0x5a))],
  ])('%s: drydig serve exits 1 naming the file and the restore command, no stack', async (_label, damage) => {
    const dir = tempDir();
    await storedWithLink(dir);
    const db = new Database(join(dir, DATABASE_FILE));
    db.pragma('wal_checkpoint(TRUNCATE)');
    db.close();
    damage(join(dir, DATABASE_FILE));
    const io = captureIo(dir);
    const code = await runCli(['serve', '--data', dir, '--port', '0'], io);
    expect(code).toBe(1);
    const lines = io.err().trimEnd().split('\n');
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatch(/^DRYDIG_ERR_STORED_DATA_DAMAGED: the database file .*drydig\.sqlite is damaged/);
    expect(lines[0]).toContain('drydig restore');
    expect(io.err()).not.toMatch(/\n\s+at /);
  });
});
