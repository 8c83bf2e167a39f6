/**
 * What the site view fetches: the link's view (`GET /api/v1/links/:token`), its monitoring plan,
 * and, for edit links, reading entry. Shapes mirror the server's answers; SI units throughout.
 */
import type { Scenario } from '../../shared/schema';
import type { MonitoringPlan, SetoutRow } from '../../shared/exports';
import type { DesignResult } from '../../shared/design';
import { describeErrorPlainly } from '../../shared/schema/plain-error';

export interface LinkView {
  link: { linkId: string; mode: 'view' | 'edit'; pinnedRevision: number | null; label: string; createdAt: string };
  revision: { revision: number; savedAt: string; savedBy: string; note: string; summary: string; name: string; sha256: string };
  /** Who recorded this revision as issued for construction, and when; null: only saved. */
  issued: { by: string; at: string } | null;
  canEdit: boolean;
  canSave: boolean;
  scenario: Scenario;
  georeferenced: boolean;
  crs: string | null;
  setout: SetoutRow[];
  contours: { time_s: number | null; lines: Array<{ level_m: number; coordinates: Array<Array<[number, number]>> }> } | null;
  excavationChecks: Array<{ id: string; targetLevel_m: number; highestLevel_m: number | null; shortfall_m: number | null; wetArea_m2: number }>;
  flagCounts: Record<string, number> | null;
  method: string | null;
  modelNotes: string[];
  computeError: string | null;
  /** Program and version that computed levels and design. */
  computedBy: string;
  /** When the results were frozen for this pinned revision (null: computed live). */
  frozenAt: string | null;
  design: DesignResult | null;
  designError: string | null;
  cautions: string[];
}

export interface ApiError {
  error: { code: string; message: string; fix: string; issues?: Array<{ path: string; message: string }> };
}

/** The token in the page address: `/site/<token>` (or `#<token>` when opened from a file). */
export function tokenFromLocation(location: Pick<Location, 'pathname' | 'hash'>): string | null {
  const fromPath = /\/site\/([A-Za-z0-9_-]{43})\/?$/.exec(location.pathname)?.[1];
  if (fromPath) return fromPath;
  const fromHash = /^#([A-Za-z0-9_-]{43})$/.exec(location.hash)?.[1];
  return fromHash ?? null;
}

/** The reading form's labels, by the JSON pointer of each field in the request. */
export const READING_FIELD_LABELS: Readonly<Record<string, string>> = {
  '/piezometerId': 'Piezometer', '/level_m': 'Level', '/measuredAt': 'Read at', '/time_s': 'Read at', '/enteredBy': 'Your name', '/note': 'Note',
};

/** The answer's body, or an Error in plain words naming the field by its label. */
async function readJson<T>(response: Response, labels: Readonly<Record<string, string>> = {}): Promise<T> {
  const body = (await response.json().catch(() => null)) as T | ApiError | null;
  if (!response.ok) {
    const err = body as ApiError | null;
    throw new Error(err?.error ? describeErrorPlainly(err.error, labels) : `The server answered ${response.status}.`);
  }
  return body as T;
}

/** Client for one share link. */
export class SiteApi {
  constructor(readonly token: string, readonly base = '/api/v1') {}

  get linkPath(): string {
    return `${this.base}/links/${this.token}`;
  }

  view(): Promise<LinkView> {
    return fetch(this.linkPath, { cache: 'no-store' }).then((r) => readJson<LinkView>(r));
  }

  monitoring(): Promise<MonitoringPlan & { error?: string }> {
    return fetch(`${this.linkPath}/monitoring`, { cache: 'no-store' }).then((r) => readJson<MonitoringPlan & { error?: string }>(r));
  }

  addReading(reading: { piezometerId: string; level_m: number; measuredAt: string; enteredBy?: string; note?: string }): Promise<unknown> {
    return fetch(`${this.linkPath}/readings`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify(reading),
    }).then((r) => readJson<unknown>(r, READING_FIELD_LABELS));
  }

  exportUrl(format: string): string {
    return `${this.linkPath}/export/${format}`;
  }
}
