/** Cursor pagination of the scenario list and histories (newest first, a page-size limit). */
import { Type } from '@sinclair/typebox';
import { DrydigError } from '../../../shared/schema';
import type { ScenarioListing } from '../scenario-store';
import { REVISION_TEXT_PATTERN } from './request-schemas';

export const DEFAULT_PAGE_SIZE = 50;
export const MAX_PAGE_SIZE = 200;

const Limit = Type.Optional(Type.String({ pattern: '^[1-9][0-9]{0,2}$', description: `Page size, 1–${MAX_PAGE_SIZE}; default ${DEFAULT_PAGE_SIZE}.` }));

export const ListQuerySchema = Type.Object(
  { limit: Limit, cursor: Type.Optional(Type.String({ maxLength: 200, pattern: '^[A-Za-z0-9_-]+$', description: 'nextCursor of the page before.' })) },
  { additionalProperties: false },
);
export const HistoryQuerySchema = Type.Object(
  { limit: Limit, cursor: Type.Optional(Type.String({ pattern: REVISION_TEXT_PATTERN, description: 'nextCursor of the page before.' })) },
  { additionalProperties: false },
);

export function pageSizeOf(text: string | undefined): number {
  if (text === undefined) return DEFAULT_PAGE_SIZE;
  const n = Number(text);
  if (n > MAX_PAGE_SIZE) throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', `/limit: at most ${MAX_PAGE_SIZE} per page, got ${n}`, [{ path: '/limit', message: `at most ${MAX_PAGE_SIZE}` }]);
  return n;
}

export function encodeListCursor(last: ScenarioListing): string {
  return Buffer.from(JSON.stringify([last.latestSavedAt, last.scenarioId]), 'utf8').toString('base64url');
}

export function decodeListCursor(text: string): { savedAt: string; scenarioId: string } {
  try {
    const value = JSON.parse(Buffer.from(text, 'base64url').toString('utf8')) as unknown;
    if (Array.isArray(value) && value.length === 2 && typeof value[0] === 'string' && typeof value[1] === 'string') return { savedAt: value[0], scenarioId: value[1] };
  } catch {
    // falls through to the message below
  }
  throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', '/cursor: not a cursor this service gave out (use nextCursor of the page before)', [{ path: '/cursor', message: 'not a valid cursor' }]);
}
