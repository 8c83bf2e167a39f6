/** Chooses and opens the storage engine for a data folder (the one place that knows engines). */
import { mkdirSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { DrydigError } from '../../shared/schema';
import type { ScenarioStore } from './scenario-store';
import { openSqliteScenarioStore } from './sqlite-scenario-store';

/** File name of the database inside the data folder. */
export const DATABASE_FILE = 'drydig.sqlite';

/**
 * Opens the store for `dataDir`: ':memory:' gives an in-memory database (nothing on disk, used by
 * tests); any other value is a folder, created when missing, holding `drydig.sqlite`.
 */
export function openScenarioStore(dataDir: string): ScenarioStore {
  if (dataDir === ':memory:') return openSqliteScenarioStore({ filename: ':memory:' });
  const folder = resolve(dataDir);
  mkdirSync(folder, { recursive: true });
  const file = join(folder, DATABASE_FILE);
  try {
    return openSqliteScenarioStore({ filename: file, integrityCheck: true });
  } catch (error) {
    if (error instanceof DrydigError) throw error;
    throw databaseDamaged(file, (error as Error).message);
  }
}

/** The start-up message for a damaged database file: which file, and how to restore it. */
export function databaseDamaged(file: string, detail: string): DrydigError {
  return new DrydigError(
    'DRYDIG_ERR_STORED_DATA_DAMAGED',
    `the database file ${file} is damaged (${detail.slice(0, 200)}). Stop drydig, keep a copy of the damaged file for a report, then restore the newest backup: drydig restore BACKUP_FILE --data ${dirname(file)} (see README, "Backups")`,
  );
}
