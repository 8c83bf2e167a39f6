/**
 * ScenarioStore on an embedded SQLite database (better-sqlite3, WAL journal).
 *
 * Durability: WAL with `synchronous = FULL`, so a save is on disk before it is acknowledged and
 * survives a killed process or a power cut. Revisions are insert-only. The latest-revision check
 * and the insert run in one IMMEDIATE transaction, so two writers (even two processes on one
 * file) cannot both save on the same base revision.
 */
import Database from 'better-sqlite3';
import type { Scenario } from '../../shared/schema';
import {
  StoredDataDamagedError,
  type AppendReadingInput,
  type CreateLinkInput,
  type LinkMode,
  type LinkRecord,
  type ReadingRecord,
  type RevisionMeta,
  type RevisionRecord,
  type SaveInput,
  type SaveOutcome,
  type SaveRevisionInput,
  type ScenarioListing,
  type ScenarioStore,
} from './scenario-store';
import { summariseScenarioChanges } from './summarise-changes';
import { createRecordId, sha256Hex } from './tokens';
import { ACCOUNTS_MIGRATION, openAccountStore } from './account-store';

const SCHEMA_VERSION = 3;

const MIGRATION_1 = `
CREATE TABLE scenarios (
  id TEXT PRIMARY KEY,
  created_at TEXT NOT NULL
);
CREATE TABLE revisions (
  scenario_id TEXT NOT NULL REFERENCES scenarios(id),
  revision INTEGER NOT NULL,
  saved_at TEXT NOT NULL,
  saved_by TEXT NOT NULL,
  note TEXT NOT NULL,
  summary TEXT NOT NULL,
  name TEXT NOT NULL,
  restored_from INTEGER,
  sha256 TEXT NOT NULL,
  body TEXT NOT NULL,
  PRIMARY KEY (scenario_id, revision)
) WITHOUT ROWID;
CREATE TABLE links (
  link_id TEXT PRIMARY KEY,
  token_hash TEXT NOT NULL UNIQUE,
  scenario_id TEXT NOT NULL REFERENCES scenarios(id),
  mode TEXT NOT NULL CHECK (mode IN ('view', 'edit')),
  revision INTEGER,
  label TEXT NOT NULL,
  created_at TEXT NOT NULL,
  revoked_at TEXT
);
CREATE INDEX links_by_scenario ON links(scenario_id);
CREATE TABLE readings (
  reading_id INTEGER PRIMARY KEY AUTOINCREMENT,
  scenario_id TEXT NOT NULL REFERENCES scenarios(id),
  piezometer_id TEXT NOT NULL,
  measured_at TEXT NOT NULL,
  time_s REAL NOT NULL,
  level_m REAL NOT NULL,
  entered_by TEXT NOT NULL,
  note TEXT NOT NULL,
  entered_at TEXT NOT NULL
);
CREATE INDEX readings_by_scenario ON readings(scenario_id, piezometer_id);
-- Revisions and readings are append-only: refuse any change at the database level too.
CREATE TRIGGER revisions_no_update BEFORE UPDATE ON revisions BEGIN SELECT RAISE(ABORT, 'revisions are immutable'); END;
CREATE TRIGGER revisions_no_delete BEFORE DELETE ON revisions BEGIN SELECT RAISE(ABORT, 'revisions are immutable'); END;
CREATE TRIGGER readings_no_update BEFORE UPDATE ON readings BEGIN SELECT RAISE(ABORT, 'readings are append-only'); END;
CREATE TRIGGER readings_no_delete BEFORE DELETE ON readings BEGIN SELECT RAISE(ABORT, 'readings are append-only'); END;
`;

/**
 * Schema 2: results computed for a revision when a link pins it (the agreed plan), so the link
 * shows the same numbers after an engine upgrade. Keyed by the revision's checksum; insert-only.
 */
const MIGRATION_2 = `
CREATE TABLE snapshots (
  sha256 TEXT PRIMARY KEY,
  computed_by TEXT NOT NULL,
  computed_at TEXT NOT NULL,
  body TEXT NOT NULL
) WITHOUT ROWID;
CREATE TRIGGER snapshots_no_update BEFORE UPDATE ON snapshots BEGIN SELECT RAISE(ABORT, 'snapshots are immutable'); END;
CREATE TRIGGER snapshots_no_delete BEFORE DELETE ON snapshots BEGIN SELECT RAISE(ABORT, 'snapshots are immutable'); END;
`;

interface RevisionRow {
  scenario_id: string;
  revision: number;
  saved_at: string;
  saved_by: string;
  note: string;
  summary: string;
  name: string;
  restored_from: number | null;
  sha256: string;
  record_sha256?: string | null;
  body?: string;
}

interface LinkRow {
  link_id: string;
  scenario_id: string;
  mode: LinkMode;
  revision: number | null;
  label: string;
  created_at: string;
  revoked_at: string | null;
  token_hash?: string;
  record_sha256?: string | null;
}

interface ReadingRow {
  reading_id: number;
  scenario_id: string;
  piezometer_id: string;
  measured_at: string;
  time_s: number;
  level_m: number;
  entered_by: string;
  note: string;
  entered_at: string;
  record_sha256?: string | null;
}

/**
 * Checksums of whole records (schema 3): everything the history shows, not only the scenario text,
 * so a rewritten name, note or date is reported as damage too.
 */
function revisionRecordHash(row: RevisionRow): string {
  return sha256Hex(JSON.stringify(['revision', row.scenario_id, row.revision, row.saved_at, row.saved_by, row.note, row.summary, row.name, row.restored_from, row.sha256]));
}
function linkRecordHash(row: LinkRow & { token_hash: string }): string {
  return sha256Hex(JSON.stringify(['link', row.link_id, row.token_hash, row.scenario_id, row.mode, row.revision, row.label, row.created_at, row.revoked_at]));
}
function readingRecordHash(row: Omit<ReadingRow, 'reading_id'>): string {
  return sha256Hex(JSON.stringify(['reading', row.scenario_id, row.piezometer_id, row.measured_at, row.time_s, row.level_m, row.entered_by, row.note, row.entered_at]));
}

/**
 * Schema 3: accounts and audit, and record checksums over every stored field. Rows written before
 * get their record checksum from what they hold now (their scenario text stays checked as before).
 */
function migration3(db: Database.Database): void {
  db.exec(ACCOUNTS_MIGRATION);
  db.exec(`
    ALTER TABLE revisions ADD COLUMN record_sha256 TEXT;
    ALTER TABLE links ADD COLUMN record_sha256 TEXT;
    ALTER TABLE readings ADD COLUMN record_sha256 TEXT;
    DROP TRIGGER revisions_no_update;
    DROP TRIGGER readings_no_update;`);
  const setRevision = db.prepare('UPDATE revisions SET record_sha256 = ? WHERE scenario_id = ? AND revision = ?');
  for (const row of db.prepare('SELECT scenario_id, revision, saved_at, saved_by, note, summary, name, restored_from, sha256 FROM revisions').all() as RevisionRow[])
    setRevision.run(revisionRecordHash(row), row.scenario_id, row.revision);
  const setLink = db.prepare('UPDATE links SET record_sha256 = ? WHERE link_id = ?');
  for (const row of db.prepare('SELECT * FROM links').all() as Array<LinkRow & { token_hash: string }>) setLink.run(linkRecordHash(row), row.link_id);
  const setReading = db.prepare('UPDATE readings SET record_sha256 = ? WHERE reading_id = ?');
  for (const row of db.prepare('SELECT * FROM readings').all() as ReadingRow[]) setReading.run(readingRecordHash(row), row.reading_id);
  db.exec(`
    CREATE TRIGGER revisions_no_update BEFORE UPDATE ON revisions BEGIN SELECT RAISE(ABORT, 'revisions are immutable'); END;
    CREATE TRIGGER readings_no_update BEFORE UPDATE ON readings BEGIN SELECT RAISE(ABORT, 'readings are append-only'); END;`);
}

function checkRevisionRow(row: RevisionRow): void {
  if (row.record_sha256 !== undefined && row.record_sha256 !== revisionRecordHash(row)) throw new StoredDataDamagedError(row.scenario_id, row.revision, 'its history record (name, saved by, note, summary or date)');
}

function toMeta(row: RevisionRow): RevisionMeta {
  checkRevisionRow(row);
  return {
    scenarioId: row.scenario_id,
    revision: row.revision,
    savedAt: row.saved_at,
    savedBy: row.saved_by,
    note: row.note,
    summary: row.summary,
    name: row.name,
    sha256: row.sha256,
    restoredFrom: row.restored_from,
  };
}

function toRecord(row: RevisionRow): RevisionRecord {
  const body = row.body ?? '';
  if (sha256Hex(body) !== row.sha256) throw new StoredDataDamagedError(row.scenario_id, row.revision);
  let scenario: Scenario;
  try {
    scenario = JSON.parse(body) as Scenario;
  } catch {
    throw new StoredDataDamagedError(row.scenario_id, row.revision);
  }
  return { ...toMeta(row), scenario };
}

function toLink(row: LinkRow): LinkRecord {
  if (row.record_sha256 !== undefined && row.record_sha256 !== linkRecordHash(row as LinkRow & { token_hash: string }))
    throw new StoredDataDamagedError(row.scenario_id, null, `share link ${row.link_id}`);
  return {
    linkId: row.link_id,
    scenarioId: row.scenario_id,
    mode: row.mode,
    revision: row.revision,
    label: row.label,
    createdAt: row.created_at,
    revokedAt: row.revoked_at,
  };
}

function toReading(row: ReadingRow): ReadingRecord {
  if (row.record_sha256 !== undefined && row.record_sha256 !== readingRecordHash(row)) throw new StoredDataDamagedError(row.scenario_id, null, `site reading ${row.reading_id}`);
  return {
    readingId: row.reading_id,
    scenarioId: row.scenario_id,
    piezometerId: row.piezometer_id,
    measuredAt: row.measured_at,
    time_s: row.time_s,
    level_m: row.level_m,
    enteredBy: row.entered_by,
    note: row.note,
    enteredAt: row.entered_at,
  };
}

export interface SqliteScenarioStoreOptions {
  /** Database file path, or ':memory:' for a database that lives only as long as the store. */
  filename: string;
  /** How long a writer waits for another process's lock before failing, ms. Default 5000. */
  busyTimeout_ms?: number;
  /** Run SQLite's quick integrity check at open; a damaged file throws. Default false. */
  integrityCheck?: boolean;
}

/** SQLite's quick check: 'ok', or the first problems it found. */
export function quickCheck(db: Database.Database): string {
  const rows = db.pragma('quick_check(5)') as Array<{ quick_check: string }>;
  return rows.map((r) => r.quick_check).join('; ');
}

/** Opens (creating and migrating when needed) a SQLite-backed ScenarioStore. */
export function openSqliteScenarioStore(options: SqliteScenarioStoreOptions): ScenarioStore {
  const db = new Database(options.filename);
  db.pragma(`busy_timeout = ${Math.max(0, Math.round(options.busyTimeout_ms ?? 5000))}`);
  if (options.integrityCheck) {
    let verdict: string;
    try {
      verdict = quickCheck(db);
    } catch (error) {
      db.close();
      throw error;
    }
    if (verdict !== 'ok') {
      db.close();
      throw new Error(`integrity check: ${verdict}`);
    }
  }
  if (options.filename !== ':memory:') db.pragma('journal_mode = WAL');
  db.pragma('synchronous = FULL');
  db.pragma('foreign_keys = ON');

  const version = db.pragma('user_version', { simple: true }) as number;
  if (version > SCHEMA_VERSION)
    throw new Error(`the database was written by a newer drydig (schema ${version}, this one knows ${SCHEMA_VERSION})`);
  // Each step runs once, in order, inside a transaction with the version bump.
  const migrations: Array<[number, string | ((db: Database.Database) => void)]> = [[1, MIGRATION_1], [2, MIGRATION_2], [3, migration3]];
  for (const [target, step] of migrations) {
    db.transaction(() => {
      const current = db.pragma('user_version', { simple: true }) as number;
      if (current >= target) return;
      if (typeof step === 'string') db.exec(step);
      else step(db);
      db.pragma(`user_version = ${target}`);
    }).immediate();
  }

  const revisionColumns = 'scenario_id, revision, saved_at, saved_by, note, summary, name, restored_from, sha256, record_sha256';
  const linkColumns = 'link_id, token_hash, scenario_id, mode, revision, label, created_at, revoked_at, record_sha256';
  const q = {
    insertScenario: db.prepare('INSERT INTO scenarios (id, created_at) VALUES (?, ?)'),
    insertRevision: db.prepare(
      `INSERT INTO revisions (${revisionColumns}, body) VALUES (@scenario_id, @revision, @saved_at, @saved_by, @note, @summary, @name, @restored_from, @sha256, @record_sha256, @body)`,
    ),
    latest: db.prepare(`SELECT ${revisionColumns}, body FROM revisions WHERE scenario_id = ? ORDER BY revision DESC LIMIT 1`),
    byNumber: db.prepare(`SELECT ${revisionColumns}, body FROM revisions WHERE scenario_id = ? AND revision = ?`),
    history: db.prepare(`SELECT ${revisionColumns} FROM revisions WHERE scenario_id = ? AND revision < ? ORDER BY revision DESC LIMIT ?`),
    exists: db.prepare('SELECT 1 FROM scenarios WHERE id = ?'),
    list: db.prepare(
      `SELECT s.id AS scenario_id, s.created_at, r.revision, r.saved_at, r.saved_by, r.name
       FROM scenarios s JOIN revisions r ON r.scenario_id = s.id
       WHERE r.revision = (SELECT MAX(revision) FROM revisions WHERE scenario_id = s.id)
         AND (r.saved_at < @at OR (r.saved_at = @at AND s.id < @id))
       ORDER BY r.saved_at DESC, s.id DESC LIMIT @limit`,
    ),
    insertLink: db.prepare(
      'INSERT INTO links (link_id, token_hash, scenario_id, mode, revision, label, created_at, record_sha256) VALUES (?, ?, ?, ?, ?, ?, ?, ?)',
    ),
    linkByHash: db.prepare(`SELECT ${linkColumns} FROM links WHERE token_hash = ?`),
    linkById: db.prepare(`SELECT ${linkColumns} FROM links WHERE scenario_id = ? AND link_id = ?`),
    linksOf: db.prepare(`SELECT ${linkColumns} FROM links WHERE scenario_id = ? ORDER BY created_at, link_id`),
    revoke: db.prepare('UPDATE links SET revoked_at = ?, record_sha256 = ? WHERE scenario_id = ? AND link_id = ? AND revoked_at IS NULL'),
    insertReading: db.prepare(
      `INSERT INTO readings (scenario_id, piezometer_id, measured_at, time_s, level_m, entered_by, note, entered_at, record_sha256)
       VALUES (@scenario_id, @piezometer_id, @measured_at, @time_s, @level_m, @entered_by, @note, @entered_at, @record_sha256)`,
    ),
    readingById: db.prepare('SELECT * FROM readings WHERE reading_id = ?'),
    readingsOf: db.prepare('SELECT * FROM readings WHERE scenario_id = ? ORDER BY time_s, reading_id'),
    insertSnapshot: db.prepare('INSERT OR IGNORE INTO snapshots (sha256, computed_by, computed_at, body) VALUES (?, ?, ?, ?)'),
    snapshot: db.prepare('SELECT sha256, computed_by, computed_at, body FROM snapshots WHERE sha256 = ?'),
  };

  const now = () => new Date().toISOString();
  const accounts = openAccountStore(db);

  function insertRevision(scenarioId: string, revision: number, input: SaveInput, before: Scenario | undefined, restoredFrom: number | null): RevisionRecord {
    const body = JSON.stringify(input.scenario);
    const row: Required<Omit<RevisionRow, 'record_sha256'>> & { record_sha256: string } = {
      scenario_id: scenarioId,
      revision,
      saved_at: now(),
      saved_by: input.savedBy ?? '',
      note: input.note ?? '',
      summary: restoredFrom !== null ? `restored revision ${restoredFrom}: ${summariseScenarioChanges(before, input.scenario)}` : summariseScenarioChanges(before, input.scenario),
      name: input.scenario.name,
      restored_from: restoredFrom,
      sha256: sha256Hex(body),
      record_sha256: '',
      body,
    };
    row.record_sha256 = revisionRecordHash(row);
    q.insertRevision.run(row);
    // Hand back a parsed copy so callers never share objects with their input.
    return toRecord(row);
  }

  const createTx = db.transaction((input: SaveInput): RevisionRecord => {
    const id = createRecordId(16);
    q.insertScenario.run(id, now());
    return insertRevision(id, 1, input, undefined, null);
  });

  const saveTx = db.transaction((input: SaveRevisionInput): SaveOutcome => {
    const latestRow = q.latest.get(input.scenarioId) as RevisionRow | undefined;
    if (!latestRow) return { ok: false, reason: 'not-found' };
    const latest = toRecord(latestRow);
    if (latest.revision !== input.baseRevision) return { ok: false, reason: 'conflict', latest };
    return { ok: true, revision: insertRevision(input.scenarioId, latest.revision + 1, input, latest.scenario, input.restoredFrom ?? null) };
  });

  return {
    async createScenario(input) {
      return createTx.immediate(input);
    },
    async saveRevision(input) {
      return saveTx.immediate(input);
    },
    async listScenarios(page = {}): Promise<ScenarioListing[]> {
      const after = page.after ?? { savedAt: '\uffff', scenarioId: '\uffff' };
      const rows = q.list.all({ at: after.savedAt, id: after.scenarioId, limit: page.limit ?? -1 }) as Array<{ scenario_id: string; created_at: string; revision: number; saved_at: string; saved_by: string; name: string }>;
      return rows.map((r) => ({
        scenarioId: r.scenario_id,
        name: r.name,
        createdAt: r.created_at,
        latestRevision: r.revision,
        latestSavedAt: r.saved_at,
        latestSavedBy: r.saved_by,
      }));
    },
    async getLatest(scenarioId) {
      const row = q.latest.get(scenarioId) as RevisionRow | undefined;
      return row ? toRecord(row) : undefined;
    },
    async getRevision(scenarioId, revision) {
      const row = q.byNumber.get(scenarioId, revision) as RevisionRow | undefined;
      return row ? toRecord(row) : undefined;
    },
    async listRevisions(scenarioId, page = {}) {
      if (!q.exists.get(scenarioId)) return undefined;
      return (q.history.all(scenarioId, page.beforeRevision ?? Number.MAX_SAFE_INTEGER, page.limit ?? -1) as RevisionRow[]).map(toMeta);
    },
    async createLink(input: CreateLinkInput) {
      const linkId = createRecordId(9);
      const createdAt = now();
      const row = { link_id: linkId, token_hash: input.tokenHash, scenario_id: input.scenarioId, mode: input.mode, revision: input.revision, label: input.label ?? '', created_at: createdAt, revoked_at: null };
      q.insertLink.run(linkId, input.tokenHash, input.scenarioId, input.mode, input.revision, input.label ?? '', createdAt, linkRecordHash(row));
      return { linkId, scenarioId: input.scenarioId, mode: input.mode, revision: input.revision, label: input.label ?? '', createdAt, revokedAt: null };
    },
    async findLinkByTokenHash(tokenHash) {
      const row = q.linkByHash.get(tokenHash) as LinkRow | undefined;
      return row ? toLink(row) : undefined;
    },
    async listLinks(scenarioId) {
      return (q.linksOf.all(scenarioId) as LinkRow[]).map(toLink);
    },
    async revokeLink(scenarioId, linkId) {
      return db.transaction(() => {
        const row = q.linkById.get(scenarioId, linkId) as (LinkRow & { token_hash: string }) | undefined;
        if (!row || row.revoked_at !== null) return false;
        toLink(row);
        const revokedAt = now();
        return q.revoke.run(revokedAt, linkRecordHash({ ...row, revoked_at: revokedAt }), scenarioId, linkId).changes === 1;
      }).immediate();
    },
    async appendReading(input: AppendReadingInput) {
      const row = {
        scenario_id: input.scenarioId,
        piezometer_id: input.piezometerId,
        measured_at: input.measuredAt,
        time_s: input.time_s,
        level_m: input.level_m,
        entered_by: input.enteredBy,
        note: input.note,
        entered_at: now(),
      };
      const info = q.insertReading.run({ ...row, record_sha256: readingRecordHash(row) });
      return toReading(q.readingById.get(info.lastInsertRowid) as ReadingRow);
    },
    async listReadings(scenarioId) {
      return (q.readingsOf.all(scenarioId) as ReadingRow[]).map(toReading);
    },
    async putSnapshot(input) {
      q.insertSnapshot.run(input.sha256, input.computedBy, now(), input.body);
    },
    async getSnapshot(sha256) {
      const row = q.snapshot.get(sha256) as { sha256: string; computed_by: string; computed_at: string; body: string } | undefined;
      return row ? { sha256: row.sha256, computedBy: row.computed_by, computedAt: row.computed_at, body: row.body } : undefined;
    },
    accounts,
    async backupTo(file) {
      // SQLite's online backup: a consistent copy, WAL content included, while others keep writing.
      await db.backup(file);
    },
    async close() {
      if (db.open) db.close();
    },
  };
}

