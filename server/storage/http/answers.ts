/** Helpers shared by the scenario and link routes: scenario checks, answers, readings. */
import type { FastifyReply } from 'fastify';
import {
  DrydigError,
  ERROR_TABLE,
  isIsoDateTime,
  summariseIssues,
  validateMonitoring,
  validateScenario,
  type Monitoring,
  type Scenario,
} from '../../../shared/schema';
import { validateDesignOptions } from '../../../shared/design';
import type { ReadingRecord, RevisionMeta, RevisionRecord, ScenarioStore } from '../scenario-store';
import type { Static } from '@sinclair/typebox';
import type { ReadingBodySchema } from './request-schemas';

/** Validates a scenario in a request body; issues are named from the body root (`/scenario/...`). */
export function parseSaveScenario(input: unknown): Scenario {
  const result = validateScenario(input);
  // The same checks as POST /api/v1/design makes of a scenario's designOptions: a stored scenario
  // with options the solver refuses would fail every later design.
  const issues = result.ok ? [...validateMonitoring(input), ...validateDesignOptions((input as { designOptions?: unknown }).designOptions, '/designOptions')] : result.issues;
  if (!result.ok || issues.length > 0) {
    const named = issues.map((i) => ({ ...i, path: `/scenario${i.path}` }));
    throw new DrydigError('DRYDIG_ERR_INVALID_SCENARIO', summariseIssues(named), named);
  }
  return result.scenario;
}

/**
 * Revision metadata as the API shows it (the checksum included: it lets anyone compare copies).
 * `revealScenarioId` false leaves out the id, for answers to share links.
 */
export function publicRevisionMeta(record: RevisionMeta, revealScenarioId = true): Partial<RevisionMeta> {
  const { scenarioId, revision, savedAt, savedBy, note, summary, name, sha256, restoredFrom } = record;
  const meta = { revision, savedAt, savedBy, note, summary, name, sha256, restoredFrom };
  return revealScenarioId ? { scenarioId, ...meta } : meta;
}

/** Parses a revision number from a path or query string (pattern already checked by the schema). */
export function parseRevisionParam(text: string, path: string): number {
  const value = Number(text);
  if (!Number.isSafeInteger(value) || value < 1) throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', `${path}: must be a revision number (1, 2, …)`, [{ path, message: 'must be a revision number' }]);
  return value;
}

/** 409 with the newer revision, so the client can show both and the user can merge. */
export function conflictAnswer(reply: FastifyReply, latest: RevisionRecord, baseRevision: number, revealScenarioId = true): FastifyReply {
  const row = ERROR_TABLE.DRYDIG_ERR_REVISION_CONFLICT;
  return reply.code(row.status).send({
    error: {
      code: 'DRYDIG_ERR_REVISION_CONFLICT',
      message: `/baseRevision: this edit started from revision ${baseRevision}, but revision ${latest.revision} was saved ${latest.savedAt}${latest.savedBy ? ` by ${latest.savedBy}` : ''}; nothing was saved`,
      fix: row.fix,
      issues: [{ path: '/baseRevision', message: `revision ${latest.revision} is newer` }],
    },
    latest: { ...publicRevisionMeta(latest, revealScenarioId), scenario: latest.scenario },
  });
}

function monitoringOf(scenario: Scenario): Monitoring | undefined {
  return (scenario as Scenario & { monitoring?: Monitoring }).monitoring;
}

/**
 * Checks and appends one site reading against the scenario's monitoring plan. The reading's time
 * since pumping started comes from `measuredAt − monitoring.pumpingStart`, or from `time_s`.
 */
export async function storeReading(
  store: ScenarioStore,
  latest: RevisionRecord,
  body: Static<typeof ReadingBodySchema>,
  enteredVia = '',
): Promise<Omit<ReadingRecord, 'scenarioId'>> {
  const monitoring = monitoringOf(latest.scenario);
  const bad = (path: string, message: string) => new DrydigError('DRYDIG_ERR_INVALID_REQUEST', `${path}: ${message}`, [{ path, message }]);
  if (!monitoring || monitoring.piezometers.length === 0) throw bad('/piezometerId', 'this scenario has no monitoring piezometers; the designer adds them first');
  if (!monitoring.piezometers.some((p) => p.id === body.piezometerId))
    throw bad('/piezometerId', `no piezometer "${body.piezometerId}" in the monitoring plan (known: ${monitoring.piezometers.map((p) => p.id).slice(0, 10).join(', ')})`);
  if (!Number.isFinite(body.level_m)) throw bad('/level_m', 'must be a finite number');
  // A level below the aquifer base, or far above ground, is a typing or datum mistake, not a reading.
  const lowest = latest.scenario.aquifer.base_m - 1;
  const highest = latest.scenario.groundLevel_m + 30;
  if (body.level_m < lowest || body.level_m > highest)
    throw bad('/level_m', `${body.level_m} m is outside the plausible range ${lowest} to ${highest} m; enter the level in m above site datum (not a depth below ground)`);
  const measuredAt = body.measuredAt ?? new Date().toISOString();
  if (!isIsoDateTime(measuredAt)) throw bad('/measuredAt', 'must be an ISO 8601 date-time with a zone, e.g. 2027-03-04T08:30:00Z');
  let time_s = body.time_s;
  if (time_s === undefined) {
    if (!monitoring.pumpingStart) throw bad('/time_s', 'give time_s (seconds since pumping started), or set monitoring.pumpingStart in the scenario');
    time_s = (Date.parse(measuredAt) - Date.parse(monitoring.pumpingStart)) / 1000;
    if (time_s < 0) throw bad('/measuredAt', `is before pumping started (${monitoring.pumpingStart})`);
  }
  const enteredBy = [body.enteredBy ?? '', enteredVia].filter(Boolean).join(' via ');
  const { scenarioId: _s, ...reading } = await store.appendReading({
    scenarioId: latest.scenarioId,
    piezometerId: body.piezometerId,
    measuredAt,
    time_s,
    level_m: body.level_m,
    enteredBy,
    note: body.note ?? '',
  });
  return reading;
}
