/**
 * `drydig backup DIR` and `drydig restore FILE`. A backup uses SQLite's online backup API on the
 * live database, so it may run while the service serves and it holds every acknowledged write,
 * also those still in the write-ahead log (copying drydig.sqlite alone would miss them). The copy
 * is written under a temporary name and renamed when complete and checked, so a backup killed
 * half-way never leaves a file that looks like a backup.
 */
import { copyFileSync, existsSync, mkdirSync, renameSync, rmSync } from 'node:fs';
import path from 'node:path';
import Database from 'better-sqlite3';
import { DrydigError } from '../../shared/schema';
import { DATABASE_FILE, openScenarioStore, quickCheck } from '../storage';
import type { CliCommand, CliIo } from './cli-io';
import { resolveDataDir } from './data-dir-option';
import { parseOptions, usageError } from './parse-options';

const stamp = () => new Date().toISOString().replace(/[-:]/g, '').replace(/\.\d+Z$/, 'Z');

/** Checks a database file; the SQLite verdict, 'ok' when sound. */
function checkFile(file: string): string {
  try {
    const db = new Database(file, { readonly: true, fileMustExist: true });
    try {
      return quickCheck(db);
    } finally {
      db.close();
    }
  } catch (error) {
    return (error as Error).message;
  }
}

/** The one path argument and `--data` of backup/restore; 'help' when the usage was printed. */
function parsePathAndData(
  args: string[],
  io: CliIo,
  command: string,
  words: { help: string; missing: string },
): 'help' | { target: string; values: Record<string, string | undefined> } {
  const { positionals, values } = parseOptions(args, { data: 'value', help: 'flag' }, command);
  if (values.help === 'true') {
    io.stdout(`${words.help}\n`);
    return 'help';
  }
  if (positionals.length !== 1) throw usageError(words.missing);
  return { target: path.resolve(io.cwd, positionals[0]!), values };
}

export const runBackupCommand: CliCommand = async (args, io) => {
  const parsed = parsePathAndData(args, io, 'backup', {
    help: 'drydig backup DIR [--data DATA]   a consistent copy of the store into DIR (while serving, write-ahead log included)',
    missing: 'backup: give the folder for the backup, e.g. drydig backup /mnt/backups/drydig',
  });
  if (parsed === 'help') return 0;
  const { target, values } = parsed;
  mkdirSync(target, { recursive: true });
  const dataDir = resolveDataDir(values.data, io.cwd);
  if (!existsSync(path.join(dataDir, DATABASE_FILE))) throw new DrydigError('DRYDIG_ERR_FILE', `no database in ${dataDir} (give --data)`);
  const final = path.join(target, `drydig-${stamp()}.sqlite`);
  const partial = `${final}.partial`;
  const store = openScenarioStore(dataDir);
  try {
    await store.backupTo(partial);
  } finally {
    await store.close();
  }
  const verdict = checkFile(partial);
  if (verdict !== 'ok') {
    rmSync(partial, { force: true });
    throw new DrydigError('DRYDIG_ERR_FILE', `the backup copy failed its check (${verdict}); nothing was kept`);
  }
  renameSync(partial, final);
  io.stdout(`backup written: ${final}\n`);
  return 0;
};

export const runRestoreCommand: CliCommand = async (args, io) => {
  const parsed = parsePathAndData(args, io, 'restore', {
    help: 'drydig restore BACKUP_FILE [--data DATA]   replaces the store with a backup (stop the service first); the old file is kept beside it',
    missing: 'restore: give the backup file, e.g. drydig restore /mnt/backups/drydig/drydig-20270101T000000Z.sqlite',
  });
  if (parsed === 'help') return 0;
  const { target: source, values } = parsed;
  const verdict = checkFile(source);
  if (verdict !== 'ok') throw new DrydigError('DRYDIG_ERR_FILE', `${source} is not a sound drydig backup (${verdict}); choose another backup`);
  const dataDir = resolveDataDir(values.data, io.cwd);
  mkdirSync(dataDir, { recursive: true });
  const live = path.join(dataDir, DATABASE_FILE);
  const incoming = `${live}.restoring`;
  copyFileSync(source, incoming);
  let keptAs = '';
  if (existsSync(live)) {
    keptAs = `${live}.before-restore-${stamp()}`;
    renameSync(live, keptAs);
    for (const suffix of ['-wal', '-shm']) if (existsSync(live + suffix)) renameSync(live + suffix, keptAs + suffix);
  }
  renameSync(incoming, live);
  // Opening once checks and migrates the restored copy (a backup from an older drydig).
  await openScenarioStore(dataDir).close();
  io.stdout(`restored ${source} into ${live}${keptAs ? `; the file it replaced is kept as ${keptAs}` : ''}\n`);
  return 0;
};
