/**
 * Issue 14 item 4 and issue 16 item 8: `drydig backup` copies the live store with SQLite's online
 * backup API (acknowledged writes still in the write-ahead log included), `drydig restore` puts a
 * backup back, and a backup killed with SIGKILL leaves the store sound and no file that looks like
 * a finished backup.
 */
import { afterEach, describe, expect, it } from 'vitest';
import { spawn } from 'node:child_process';
import { copyFileSync, existsSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path, { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import Database from 'better-sqlite3';
import { runCli } from '../../server/cli';
import { DATABASE_FILE, openScenarioStore } from '../../server/storage';
import { demoScenario } from '../server/scenarios-helpers';
import { captureIo } from './capture-io';

const repo = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');
const dirs: string[] = [];
afterEach(() => {
  for (const d of dirs.splice(0)) rmSync(d, { recursive: true, force: true });
});
function tempDir(): string {
  const d = mkdtempSync(join(tmpdir(), 'drydig-backup-'));
  dirs.push(d);
  return d;
}

/** Revisions in a database file (0 when it holds no revisions table yet, e.g. all still in the WAL). */
function countRevisions(file: string): number {
  const db = new Database(file, { readonly: true });
  try {
    if (!db.prepare("SELECT 1 FROM sqlite_master WHERE name = 'revisions'").get()) return 0;
    return (db.prepare('SELECT COUNT(*) AS n FROM revisions').get() as { n: number }).n;
  } finally {
    db.close();
  }
}

describe('drydig backup and restore', () => {
  it('round trip: the backup, taken while the store is open, holds writes still in the WAL; restore brings them back', async () => {
    const dir = tempDir();
    const data = join(dir, 'data');
    const store = openScenarioStore(data);
    const ids: string[] = [];
    for (let i = 0; i < 5; i++) ids.push((await store.createScenario({ scenario: { ...demoScenario('confined'), name: `job ${i}` }, savedBy: 'ann' })).scenarioId);
    // The writes are acknowledged but still in drydig.sqlite-wal (the store stays open, no checkpoint).
    const mainOnly = join(dir, 'main-file-copy.sqlite');
    copyFileSync(join(data, DATABASE_FILE), mainOnly);
    expect(existsSync(join(data, `${DATABASE_FILE}-wal`))).toBe(true);
    expect(countRevisions(mainOnly)).toBeLessThan(5);

    const io = captureIo(dir);
    expect(await runCli(['backup', join(dir, 'backups'), '--data', data], io), io.err()).toBe(0);
    const written = /backup written: (.+)\n/.exec(io.out())?.[1];
    expect(written).toBeDefined();
    expect(countRevisions(written!)).toBe(5);

    // More work after the backup, then a restore: the store is as it was at the backup.
    await store.createScenario({ scenario: demoScenario('confined'), savedBy: 'ann' });
    await store.close();
    const restoreIo = captureIo(dir);
    expect(await runCli(['restore', written!, '--data', data], restoreIo), restoreIo.err()).toBe(0);
    expect(restoreIo.out()).toContain('is kept as');
    const back = openScenarioStore(data);
    const listed = await back.listScenarios();
    expect(listed.map((s) => s.scenarioId).sort()).toEqual([...ids].sort());
    expect((await back.getLatest(ids[0]!))?.savedBy).toBe('ann');
    await back.close();
  });

  it('restore refuses a file that is not a sound database and leaves the store alone', async () => {
    const dir = tempDir();
    const data = join(dir, 'data');
    const store = openScenarioStore(data);
    await store.createScenario({ scenario: demoScenario('confined') });
    await store.close();
    const bogus = join(dir, 'bogus.sqlite');
    copyFileSync(join(repo, 'package.json'), bogus);
    const io = captureIo(dir);
    expect(await runCli(['restore', bogus, '--data', data], io)).toBe(2);
    expect(io.err()).toMatch(/^DRYDIG_ERR_FILE: .*not a sound drydig backup/);
    expect(countRevisions(join(data, DATABASE_FILE))).toBe(1);
  });

  it('a backup killed with SIGKILL leaves the store sound and no finished-looking backup file', async () => {
    const dir = tempDir();
    const data = join(dir, 'data');
    const store = openScenarioStore(data);
    const big = { ...demoScenario('confined'), description: 'x'.repeat(200_000) };
    for (let i = 0; i < 150; i++) await store.createScenario({ scenario: { ...big, name: `job ${i}` } });
    await store.close();
    const backups = join(dir, 'backups');
    const child = spawn(process.execPath, [join(repo, 'bin', 'drydig.js'), 'backup', backups, '--data', data], { cwd: dir, stdio: ['ignore', 'pipe', 'pipe'] });
    // Kill once the copy has started (the partial file exists), or after a short while at most.
    await new Promise<void>((resolve) => {
      const started = Date.now();
      const poll = setInterval(() => {
        const partial = existsSync(backups) && readdirSync(backups).some((f) => f.endsWith('.partial'));
        if (partial || Date.now() - started > 20_000) {
          clearInterval(poll);
          child.kill('SIGKILL');
          resolve();
        }
      }, 5);
    });
    await new Promise((resolve) => child.once('exit', resolve));
    const finished = existsSync(backups) ? readdirSync(backups).filter((f) => f.endsWith('.sqlite')) : [];
    const after = openScenarioStore(data);
    expect((await after.listScenarios()).length).toBe(150);
    await after.close();
    // Whatever the timing, no half backup carries the final name; a finished one is complete.
    for (const f of finished) expect(countRevisions(join(backups, f))).toBe(150);
    const io = captureIo(dir);
    expect(await runCli(['backup', backups, '--data', data], io), io.err()).toBe(0);
  });
});
