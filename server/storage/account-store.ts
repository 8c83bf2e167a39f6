/**
 * Accounts, sessions, the first-start setup token and the audit trail, in the same SQLite file as
 * the scenarios (schema 3). Passwords arrive here already hashed (argon2, server/auth); setup
 * tokens only as SHA-256 hashes. Audit rows are append-only.
 */
import type Database from 'better-sqlite3';
import { randomBytes } from 'node:crypto';

export const ROLES = ['admin', 'designer', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

export interface UserRecord {
  userId: number;
  username: string;
  role: Role;
  createdAt: string;
  disabledAt: string | null;
}

export interface AuditRecord {
  auditId: number;
  /** When, ISO 8601 UTC. */
  at: string;
  /** Who (user name), or "link <id>" for a share link. */
  actor: string;
  /** revision, restore, link, revoke, issued-for-construction, sign-in, … */
  action: string;
  scenarioId: string | null;
  revision: number | null;
  detail: string;
}

export interface AccountStore {
  countUsers(): number;
  addUser(input: { username: string; role: Role; passwordHash: string }): UserRecord;
  listUsers(): UserRecord[];
  /** The user and its password hash, or undefined. */
  findUser(username: string): (UserRecord & { passwordHash: string }) | undefined;
  getUser(userId: number): UserRecord | undefined;
  setDisabled(username: string, disabled: boolean): boolean;
  setPasswordHash(username: string, passwordHash: string): boolean;
  getSession(sid: string): string | undefined;
  setSession(sid: string, data: string, expiresAt_ms: number): void;
  destroySession(sid: string): void;
  destroySessionsOf(userId: number): void;
  /** Replaces any unused setup token with this one (hash). */
  putSetupToken(tokenHash: string): void;
  /** Marks the setup token used; true only the first time, and only while no user exists. */
  consumeSetupToken(tokenHash: string): boolean;
  /** The session-signing secret, made on first use and kept in the database. */
  sessionSecret(): string;
  appendAudit(input: Omit<AuditRecord, 'auditId' | 'at'>): AuditRecord;
  /** Newest first. */
  listAudit(options: { scenarioId?: string; limit: number; beforeId?: number }): AuditRecord[];
}

/** Schema 3, accounts part (the store runs it in its migration transaction). */
export const ACCOUNTS_MIGRATION = `
CREATE TABLE users (
  user_id INTEGER PRIMARY KEY AUTOINCREMENT,
  username TEXT NOT NULL UNIQUE,
  role TEXT NOT NULL CHECK (role IN ('admin', 'designer', 'viewer')),
  password_hash TEXT NOT NULL,
  created_at TEXT NOT NULL,
  disabled_at TEXT
);
CREATE TABLE sessions (
  sid TEXT PRIMARY KEY,
  data TEXT NOT NULL,
  expires_at INTEGER NOT NULL
) WITHOUT ROWID;
CREATE TABLE setup_tokens (
  token_hash TEXT PRIMARY KEY,
  created_at TEXT NOT NULL,
  used_at TEXT
) WITHOUT ROWID;
CREATE TABLE settings (
  key TEXT PRIMARY KEY,
  value TEXT NOT NULL
) WITHOUT ROWID;
CREATE TABLE audit (
  audit_id INTEGER PRIMARY KEY AUTOINCREMENT,
  at TEXT NOT NULL,
  actor TEXT NOT NULL,
  action TEXT NOT NULL,
  scenario_id TEXT,
  revision INTEGER,
  detail TEXT NOT NULL
);
CREATE INDEX audit_by_scenario ON audit(scenario_id, audit_id);
CREATE TRIGGER audit_no_update BEFORE UPDATE ON audit BEGIN SELECT RAISE(ABORT, 'the audit trail is append-only'); END;
CREATE TRIGGER audit_no_delete BEFORE DELETE ON audit BEGIN SELECT RAISE(ABORT, 'the audit trail is append-only'); END;
`;

interface UserRow { user_id: number; username: string; role: Role; password_hash: string; created_at: string; disabled_at: string | null }
interface AuditRow { audit_id: number; at: string; actor: string; action: string; scenario_id: string | null; revision: number | null; detail: string }

const toUser = (r: UserRow): UserRecord => ({ userId: r.user_id, username: r.username, role: r.role, createdAt: r.created_at, disabledAt: r.disabled_at });
const toAudit = (r: AuditRow): AuditRecord => ({ auditId: r.audit_id, at: r.at, actor: r.actor, action: r.action, scenarioId: r.scenario_id, revision: r.revision, detail: r.detail });

export function openAccountStore(db: Database.Database): AccountStore {
  const now = () => new Date().toISOString();
  const q = {
    count: db.prepare('SELECT COUNT(*) AS n FROM users'),
    insertUser: db.prepare('INSERT INTO users (username, role, password_hash, created_at) VALUES (?, ?, ?, ?)'),
    users: db.prepare('SELECT * FROM users ORDER BY username'),
    userByName: db.prepare('SELECT * FROM users WHERE username = ?'),
    userById: db.prepare('SELECT * FROM users WHERE user_id = ?'),
    disable: db.prepare('UPDATE users SET disabled_at = ? WHERE username = ?'),
    password: db.prepare('UPDATE users SET password_hash = ? WHERE username = ?'),
    session: db.prepare('SELECT data, expires_at FROM sessions WHERE sid = ?'),
    putSession: db.prepare('INSERT INTO sessions (sid, data, expires_at) VALUES (?, ?, ?) ON CONFLICT(sid) DO UPDATE SET data = excluded.data, expires_at = excluded.expires_at'),
    dropSession: db.prepare('DELETE FROM sessions WHERE sid = ?'),
    dropExpired: db.prepare('DELETE FROM sessions WHERE expires_at < ?'),
    sessionsAll: db.prepare('SELECT sid, data FROM sessions'),
    dropUnusedSetup: db.prepare('DELETE FROM setup_tokens WHERE used_at IS NULL'),
    putSetup: db.prepare('INSERT INTO setup_tokens (token_hash, created_at) VALUES (?, ?)'),
    useSetup: db.prepare('UPDATE setup_tokens SET used_at = ? WHERE token_hash = ? AND used_at IS NULL'),
    setting: db.prepare('SELECT value FROM settings WHERE key = ?'),
    putSetting: db.prepare('INSERT OR IGNORE INTO settings (key, value) VALUES (?, ?)'),
    insertAudit: db.prepare('INSERT INTO audit (at, actor, action, scenario_id, revision, detail) VALUES (@at, @actor, @action, @scenario_id, @revision, @detail)'),
    auditById: db.prepare('SELECT * FROM audit WHERE audit_id = ?'),
    auditAll: db.prepare('SELECT * FROM audit WHERE audit_id < ? ORDER BY audit_id DESC LIMIT ?'),
    auditOf: db.prepare('SELECT * FROM audit WHERE scenario_id = ? AND audit_id < ? ORDER BY audit_id DESC LIMIT ?'),
  };
  const consume = db.transaction((tokenHash: string): boolean => {
    if ((q.count.get() as { n: number }).n > 0) return false;
    return q.useSetup.run(now(), tokenHash).changes === 1;
  });
  return {
    countUsers: () => (q.count.get() as { n: number }).n,
    addUser(input) {
      const info = q.insertUser.run(input.username, input.role, input.passwordHash, now());
      return toUser(q.userById.get(info.lastInsertRowid) as UserRow);
    },
    listUsers: () => (q.users.all() as UserRow[]).map(toUser),
    findUser(username) {
      const row = q.userByName.get(username) as UserRow | undefined;
      return row ? { ...toUser(row), passwordHash: row.password_hash } : undefined;
    },
    getUser(userId) {
      const row = q.userById.get(userId) as UserRow | undefined;
      return row ? toUser(row) : undefined;
    },
    setDisabled(username, disabled) {
      const done = q.disable.run(disabled ? now() : null, username).changes === 1;
      const user = q.userByName.get(username) as UserRow | undefined;
      if (done && disabled && user) this.destroySessionsOf(user.user_id);
      return done;
    },
    setPasswordHash(username, passwordHash) {
      const done = q.password.run(passwordHash, username).changes === 1;
      const user = q.userByName.get(username) as UserRow | undefined;
      if (done && user) this.destroySessionsOf(user.user_id);
      return done;
    },
    getSession(sid) {
      const row = q.session.get(sid) as { data: string; expires_at: number } | undefined;
      if (!row) return undefined;
      if (row.expires_at < Date.now()) {
        q.dropSession.run(sid);
        return undefined;
      }
      return row.data;
    },
    setSession(sid, data, expiresAt_ms) {
      q.putSession.run(sid, data, Math.round(expiresAt_ms));
      q.dropExpired.run(Date.now());
    },
    destroySession(sid) {
      q.dropSession.run(sid);
    },
    destroySessionsOf(userId) {
      for (const row of q.sessionsAll.all() as Array<{ sid: string; data: string }>) {
        try {
          if ((JSON.parse(row.data) as { userId?: number }).userId === userId) q.dropSession.run(row.sid);
        } catch {
          q.dropSession.run(row.sid);
        }
      }
    },
    putSetupToken(tokenHash) {
      db.transaction(() => {
        q.dropUnusedSetup.run();
        q.putSetup.run(tokenHash, now());
      })();
    },
    consumeSetupToken: (tokenHash) => consume.immediate(tokenHash),
    sessionSecret() {
      q.putSetting.run('session-secret', randomBytes(48).toString('base64url'));
      return (q.setting.get('session-secret') as { value: string }).value;
    },
    appendAudit(input) {
      const info = q.insertAudit.run({ at: now(), actor: input.actor, action: input.action, scenario_id: input.scenarioId, revision: input.revision, detail: input.detail });
      return toAudit(q.auditById.get(info.lastInsertRowid) as AuditRow);
    },
    listAudit(options) {
      const before = options.beforeId ?? Number.MAX_SAFE_INTEGER;
      const rows = options.scenarioId ? q.auditOf.all(options.scenarioId, before, options.limit) : q.auditAll.all(before, options.limit);
      return (rows as AuditRow[]).map(toAudit);
    },
  };
}
