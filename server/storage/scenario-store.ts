/**
 * The storage interface the routes use. One small async interface so another engine (a server
 * database, an object store) can be added later without touching the routes; SQLite is the first.
 *
 * Every save is an immutable revision: nothing here updates or deletes a stored revision.
 * Share links and site readings live beside the revisions but are not revisions themselves.
 */
import { DrydigError, type Scenario } from '../../shared/schema';
import type { PlanReading } from '../../shared/exports';
import type { AccountStore } from './account-store';

/** What the history shows about one revision (no scenario body). */
export interface RevisionMeta {
  /** Scenario id (random, URL-safe). */
  scenarioId: string;
  /** Revision number, 1 for the first save, then +1 per save. */
  revision: number;
  /** When the revision was stored, ISO 8601 UTC. */
  savedAt: string;
  /** The name the saver gave (free text, may be empty). */
  savedBy: string;
  /** The saver's own note on the save (may be empty). */
  note: string;
  /** Short machine-written summary of what changed against the revision before. */
  summary: string;
  /** Scenario name at this revision. */
  name: string;
  /** SHA-256 (hex) of the stored scenario text, checked on every read. */
  sha256: string;
  /** The revision this one was restored from, when it is a restore. */
  restoredFrom: number | null;
}

/** One revision with its scenario document. */
export interface RevisionRecord extends RevisionMeta {
  scenario: Scenario;
}

/** One line of the scenario list. */
export interface ScenarioListing {
  scenarioId: string;
  name: string;
  createdAt: string;
  latestRevision: number;
  latestSavedAt: string;
  latestSavedBy: string;
}

export interface SaveInput {
  scenario: Scenario;
  /** Name the saver gives; default ''. */
  savedBy?: string;
  /** Note on the save; default ''. */
  note?: string;
}

export interface SaveRevisionInput extends SaveInput {
  scenarioId: string;
  /** The revision the edit started from; the save is refused when a newer one exists. */
  baseRevision: number;
  /** Set when the save restores an older revision. */
  restoredFrom?: number;
}

/** Result of a save against a base revision: stored, or refused because someone saved first. */
export type SaveOutcome =
  | { ok: true; revision: RevisionRecord }
  | { ok: false; reason: 'conflict'; latest: RevisionRecord }
  | { ok: false; reason: 'not-found' };

/** Access a share link grants. `view` can never write. */
export type LinkMode = 'view' | 'edit';

export interface LinkRecord {
  /** Public, non-secret id of the link (for listing and revoking). */
  linkId: string;
  scenarioId: string;
  mode: LinkMode;
  /** Pinned revision, or null to follow the latest. */
  revision: number | null;
  /** Designer's label for the link (e.g. "site team, phase 1"). */
  label: string;
  createdAt: string;
  /** When the link was revoked, or null while it works. */
  revokedAt: string | null;
}

export interface CreateLinkInput {
  scenarioId: string;
  mode: LinkMode;
  revision: number | null;
  label?: string;
  /** SHA-256 (hex) of the token; the token itself is never stored. */
  tokenHash: string;
}

/**
 * One site reading of a piezometer: appended, never overwritten. The fields the monitoring plan
 * reads (id, piezometer, measuredAt, time_s — time since pumping started —, level_m, enteredBy,
 * note) are `PlanReading`'s; the store adds where it belongs and when it was stored.
 */
export interface ReadingRecord extends PlanReading {
  scenarioId: string;
  /** When the server stored it, ISO 8601 UTC. */
  enteredAt: string;
}

export type AppendReadingInput = Omit<ReadingRecord, 'readingId' | 'enteredAt'>;

/** Results computed for a revision and frozen when a link pinned it (JSON text, engine-defined). */
export interface SnapshotRecord {
  /** Checksum of the revision the results belong to. */
  sha256: string;
  /** Program and version that computed them, e.g. "drydig 0.1.0". */
  computedBy: string;
  computedAt: string;
  body: string;
}

/** The storage engine behind the scenario, link and reading routes. */
export interface ScenarioStore {
  /** Stores revision 1 of a new scenario. */
  createScenario(input: SaveInput): Promise<RevisionRecord>;
  /** Stores a new revision if `baseRevision` is still the latest; otherwise reports the conflict. */
  saveRevision(input: SaveRevisionInput): Promise<SaveOutcome>;
  /** Newest saved first; `after` continues a page (the last listing of the page before). */
  listScenarios(page?: { limit?: number; after?: { savedAt: string; scenarioId: string } }): Promise<ScenarioListing[]>;
  /** Latest revision, or undefined when the scenario does not exist. */
  getLatest(scenarioId: string): Promise<RevisionRecord | undefined>;
  getRevision(scenarioId: string, revision: number): Promise<RevisionRecord | undefined>;
  /** Newest first; undefined when the scenario does not exist. */
  listRevisions(scenarioId: string, page?: { limit?: number; beforeRevision?: number }): Promise<RevisionMeta[] | undefined>;
  createLink(input: CreateLinkInput): Promise<LinkRecord>;
  findLinkByTokenHash(tokenHash: string): Promise<LinkRecord | undefined>;
  listLinks(scenarioId: string): Promise<LinkRecord[]>;
  /** Marks a link revoked; false when no such live link exists. */
  revokeLink(scenarioId: string, linkId: string): Promise<boolean>;
  appendReading(input: AppendReadingInput): Promise<ReadingRecord>;
  /** Oldest first. */
  listReadings(scenarioId: string): Promise<ReadingRecord[]>;
  /** Stores computed results for a revision checksum; the first one stored stays (insert-only). */
  putSnapshot(input: Omit<SnapshotRecord, 'computedAt'>): Promise<void>;
  getSnapshot(sha256: string): Promise<SnapshotRecord | undefined>;
  /** Accounts, sessions and the audit trail (same database). */
  accounts: AccountStore;
  /** A consistent copy of the whole database to `file` while serving (WAL included). */
  backupTo(file: string): Promise<void>;
  close(): Promise<void>;
}

/**
 * A stored revision whose text no longer matches its hash (disk or copy damage). A DrydigError, so
 * the service answers DRYDIG_ERR_STORED_DATA_DAMAGED (500) instead of serving altered data.
 */
export class StoredDataDamagedError extends DrydigError {
  constructor(scenarioId: string, revision: number | null, what = 'its scenario text') {
    super(
      'DRYDIG_ERR_STORED_DATA_DAMAGED',
      revision !== null
        ? `stored revision ${revision} of scenario ${scenarioId} is damaged (${what} was altered); open another revision or restore a backup (drydig restore)`
        : `the stored ${what} of scenario ${scenarioId} is damaged (altered); restore a backup (drydig restore)`,
    );
  }
}
