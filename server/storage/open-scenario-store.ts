/** Chooses and opens the storage engine for a data folder (the one place that knows engines). */
import { mkdirSync } from 'node:fs';
import { join, resolve } from 'node:path';
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
  return openSqliteScenarioStore({ filename: join(folder, DATABASE_FILE) });
}
