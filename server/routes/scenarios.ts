/**
 * Saved scenarios under `/api/v1/scenarios`: immutable revisions, history, restore, exports,
 * share links and site readings. Opens the store for `dataDir` (':memory:' = in-memory) and
 * shares it with the link routes as the `scenarioStore` decoration.
 *
 * Every save names the revision it was based on; a stale save gets 409 with the newer revision,
 * so no edit is silently lost.
 */
import type { FastifyInstance, FastifyReply, FastifyRequest } from 'fastify';
import fp from 'fastify-plugin';
import { Type, type Static } from '@sinclair/typebox';
import { DrydigError } from '../../shared/schema';
import { openScenarioStore, type RevisionRecord, type ScenarioStore } from '../storage';
import {
  ExportFormatSchema,
  SMALL_BODY_LIMIT_BYTES,
  LinkCreateBodySchema,
  ReadingBodySchema,
  RevisionParamSchema,
  SaveBodySchema,
  ScenarioIdParamsSchema,
  NewScenarioBodySchema,
  RestoreBodySchema,
  ExportQuerySchema,
  LinkIdParamsSchema,
  conflictAnswer,
  parseRevisionParam,
  parseSaveScenario,
  publicRevisionMeta,
  storeReading,
  type ExportFormat,
} from '../storage/http';
import { createShareToken, hashShareToken } from '../storage';
import { writeRateLimit } from '../security';
import { buildMonitoringSeries, computedViewFor, freezeComputedView, sendExport } from '../exports';
import { actorOf, requireAccount } from '../auth';
import { auditRoutes, findRevisionIssue } from './audit';
import { decodeListCursor, encodeListCursor, HistoryQuerySchema, ListQuerySchema, pageSizeOf } from '../storage/http/paging';

declare module 'fastify' {
  interface FastifyInstance {
    /** The scenario store opened by the scenario routes. */
    scenarioStore: ScenarioStore;
  }
}

export interface ScenarioRoutesOptions {
  /** Data folder, or ':memory:' for an in-memory database. */
  dataDir: string;
  /** Prefix for the routes, e.g. '/api/v1'. */
  prefix?: string;
  /** An already-open store to use instead (tests, other engines). */
  store?: ScenarioStore;
}

async function requireLatest(store: ScenarioStore, scenarioId: string): Promise<RevisionRecord> {
  const latest = await store.getLatest(scenarioId);
  if (!latest) throw new DrydigError('DRYDIG_ERR_NOT_FOUND', `no scenario with id "${scenarioId}"`, [{ path: '/id', message: 'no such scenario' }]);
  return latest;
}

async function requireRevision(store: ScenarioStore, scenarioId: string, revision: number | undefined): Promise<RevisionRecord> {
  if (revision === undefined) return requireLatest(store, scenarioId);
  const record = await store.getRevision(scenarioId, revision);
  if (!record) {
    await requireLatest(store, scenarioId);
    throw new DrydigError('DRYDIG_ERR_NOT_FOUND', `scenario "${scenarioId}" has no revision ${revision}`, [{ path: '/revision', message: 'no such revision' }]);
  }
  return record;
}

const routes = async (app: FastifyInstance, opts: { store: ScenarioStore }) => {
  const store = opts.store;
  // Every route here reads or writes stored data: a signed-in account first (before the body is checked).
  app.addHook('preValidation', requireAccount(store));
  const audit = (request: FastifyRequest, action: string, scenarioId: string, revision: number | null, detail = '') =>
    store.accounts.appendAudit({ actor: actorOf(request), action, scenarioId, revision, detail });

  app.get<{ Querystring: Static<typeof ListQuerySchema> }>(
    '/scenarios',
    { schema: { summary: 'List stored scenarios with their latest revision, newest first, a page at a time', description: 'Stored scenarios: id, name, latest revision, when and by whom it was saved. At most `limit` (default 50, at most 200) per page; `nextCursor` (null on the last page) goes in `cursor` for the next page.', tags: ['scenarios'], querystring: ListQuerySchema } },
    async (request) => {
      const limit = pageSizeOf(request.query.limit);
      const after = request.query.cursor === undefined ? undefined : decodeListCursor(request.query.cursor);
      const page = await store.listScenarios({ limit: limit + 1, after });
      const scenarios = page.slice(0, limit);
      const last = scenarios[scenarios.length - 1];
      return { scenarios, nextCursor: page.length > limit && last ? encodeListCursor(last) : null };
    },
  );

  app.post<{ Body: Static<typeof NewScenarioBodySchema> }>(
    '/scenarios',
    { schema: { summary: 'Store a new scenario (revision 1)', description: 'Validates the scenario like the evaluate route (issues name the field, e.g. /scenario/wells/3/rate_m3_s) and stores it as revision 1. Import a scenario JSON export by posting it here.', tags: ['scenarios'], body: NewScenarioBodySchema }, config: writeRateLimit() },
    async (request, reply) => {
      const scenario = parseSaveScenario(request.body.scenario);
      const record = await store.createScenario({ scenario, savedBy: request.body.savedBy ?? actorOf(request), note: request.body.note });
      audit(request, 'revision', record.scenarioId, record.revision, 'new scenario');
      return reply.code(201).send(publicRevisionMeta(record));
    },
  );

  app.get<{ Params: Static<typeof ScenarioIdParamsSchema> }>(
    '/scenarios/:id',
    { schema: { summary: 'The latest revision of a scenario', description: 'The latest revision with its metadata and the scenario document.', tags: ['scenarios'], params: ScenarioIdParamsSchema } },
    async (request) => {
      const record = await requireLatest(store, request.params.id);
      return { ...publicRevisionMeta(record), scenario: record.scenario };
    },
  );

  app.put<{ Params: Static<typeof ScenarioIdParamsSchema>; Body: Static<typeof SaveBodySchema> }>(
    '/scenarios/:id',
    { schema: { summary: 'Save a new revision, based on a known revision', description: 'Stores a new immutable revision if baseRevision is still the latest. Otherwise 409 DRYDIG_ERR_REVISION_CONFLICT with the newer revision in `latest`, so no edit is silently lost.', tags: ['scenarios'], params: ScenarioIdParamsSchema, body: SaveBodySchema }, config: writeRateLimit() },
    async (request, reply) => saveOn(reply, store, request.params.id, { ...request.body, savedBy: request.body.savedBy ?? actorOf(request) }, true, (revision) => audit(request, 'revision', request.params.id, revision)),
  );

  app.get<{ Params: Static<typeof ScenarioIdParamsSchema>; Querystring: Static<typeof HistoryQuerySchema> }>(
    '/scenarios/:id/revisions',
    { schema: { summary: 'History of a scenario, newest first, a page at a time', description: 'Revisions newest first: when, the name the saver gave, their note and a short summary of what changed. At most `limit` (default 50, at most 200) per page; `nextCursor` (null on the last page) goes in `cursor` for the next page.', tags: ['scenarios'], params: ScenarioIdParamsSchema, querystring: HistoryQuerySchema } },
    async (request) => {
      const limit = pageSizeOf(request.query.limit);
      const beforeRevision = request.query.cursor === undefined ? undefined : parseRevisionParam(request.query.cursor, '/cursor');
      const revisions = await store.listRevisions(request.params.id, { limit: limit + 1, beforeRevision });
      if (!revisions) throw new DrydigError('DRYDIG_ERR_NOT_FOUND', `no scenario with id "${request.params.id}"`, [{ path: '/id', message: 'no such scenario' }]);
      const page = revisions.slice(0, limit);
      const last = page[page.length - 1];
      return { scenarioId: request.params.id, revisions: page.map((r) => publicRevisionMeta(r)), nextCursor: revisions.length > limit && last ? String(last.revision) : null };
    },
  );

  app.get<{ Params: Static<typeof RevisionParamSchema> }>(
    '/scenarios/:id/revisions/:revision',
    { schema: { summary: 'One revision of a scenario', description: 'A past revision exactly as it was saved (checked against its SHA-256).', tags: ['scenarios'], params: RevisionParamSchema } },
    async (request) => {
      const record = await requireRevision(store, request.params.id, parseRevisionParam(request.params.revision, '/revision'));
      return { ...publicRevisionMeta(record), scenario: record.scenario };
    },
  );

  app.post<{ Params: Static<typeof ScenarioIdParamsSchema>; Body: Static<typeof RestoreBodySchema> }>(
    '/scenarios/:id/restore',
    { bodyLimit: SMALL_BODY_LIMIT_BYTES, schema: { summary: 'Restore an old revision as a new revision', description: 'Copies revision `revision` into a new revision on top of `baseRevision` (409 when that is stale); the history keeps everything.', tags: ['scenarios'], params: ScenarioIdParamsSchema, body: RestoreBodySchema }, config: writeRateLimit() },
    async (request, reply) => {
      const old = await requireRevision(store, request.params.id, request.body.revision);
      const outcome = await store.saveRevision({
        scenarioId: request.params.id,
        baseRevision: request.body.baseRevision,
        scenario: old.scenario,
        savedBy: request.body.savedBy ?? actorOf(request),
        note: request.body.note,
        restoredFrom: old.revision,
      });
      if (outcome.ok) audit(request, 'restore', request.params.id, outcome.revision.revision, `restored revision ${old.revision}`);
      if (!outcome.ok) {
        if (outcome.reason === 'not-found') await requireLatest(store, request.params.id);
        else return conflictAnswer(reply, outcome.latest, request.body.baseRevision);
      }
      return outcome.ok ? reply.code(201).send(publicRevisionMeta(outcome.revision)) : undefined;
    },
  );

  app.get<{ Params: Static<typeof ScenarioIdParamsSchema> & { format: ExportFormat }; Querystring: Static<typeof ExportQuerySchema> }>(
    '/scenarios/:id/export/:format',
    { schema: { summary: 'Export a revision', description: 'scenario-json (imports back unchanged), setout-csv, geojson (RFC 7946 when georeferenced), dxf, report-html (print to PDF) or monitoring-csv, of the latest revision or ?revision=N.', tags: ['scenarios'], params: Type.Composite([ScenarioIdParamsSchema, Type.Object({ format: ExportFormatSchema })]), querystring: ExportQuerySchema } },
    async (request, reply) => {
      const revision = request.query.revision === undefined ? undefined : parseRevisionParam(request.query.revision, '/revision');
      const record = await requireRevision(store, request.params.id, revision);
      const readings = await store.listReadings(request.params.id);
      return sendExport(reply, request.params.format, {
        record, readings, pinned: revision !== undefined, computed: () => computedViewFor(store, record), issued: findRevisionIssue(store, record.scenarioId, record.revision),
      });
    },
  );

  app.get<{ Params: Static<typeof ScenarioIdParamsSchema>; Querystring: Static<typeof ExportQuerySchema> }>(
    '/scenarios/:id/monitoring',
    { schema: { summary: 'Monitoring plan: expected, alert and action levels, readings assessed', description: 'For each piezometer, the level the design expects over time (field engine), the alert and action levels and every site reading compared with the expected level.', tags: ['scenarios'], params: ScenarioIdParamsSchema, querystring: ExportQuerySchema } },
    async (request) => {
      const revision = request.query.revision === undefined ? undefined : parseRevisionParam(request.query.revision, '/revision');
      const record = await requireRevision(store, request.params.id, revision);
      return buildMonitoringSeries(record.scenario, await store.listReadings(request.params.id));
    },
  );

  app.get<{ Params: Static<typeof ScenarioIdParamsSchema> }>(
    '/scenarios/:id/readings',
    { schema: { summary: 'Site readings of a scenario', description: 'Piezometer readings, oldest first (append-only site data, not revisions).', tags: ['scenarios'], params: ScenarioIdParamsSchema } },
    async (request) => {
      await requireLatest(store, request.params.id);
      return { readings: (await store.listReadings(request.params.id)).map(({ scenarioId: _s, ...r }) => r) };
    },
  );

  app.post<{ Params: Static<typeof ScenarioIdParamsSchema>; Body: Static<typeof ReadingBodySchema> }>(
    '/scenarios/:id/readings',
    { bodyLimit: SMALL_BODY_LIMIT_BYTES, schema: { summary: 'Enter a site reading', description: 'Appends a piezometer reading; time since pumping started comes from measuredAt and monitoring.pumpingStart, or from time_s.', tags: ['scenarios'], params: ScenarioIdParamsSchema, body: ReadingBodySchema }, config: writeRateLimit() },
    async (request, reply) => {
      const latest = await requireLatest(store, request.params.id);
      const reading = await storeReading(store, latest, { ...request.body, enteredBy: request.body.enteredBy ?? actorOf(request) });
      return reply.code(201).send(reading);
    },
  );

  app.post<{ Params: Static<typeof ScenarioIdParamsSchema>; Body: Static<typeof LinkCreateBodySchema> }>(
    '/scenarios/:id/links',
    { bodyLimit: SMALL_BODY_LIMIT_BYTES, schema: { summary: 'Create a share link', description: 'A view-only or edit link with a 256-bit token (shown once; only its SHA-256 is stored), pinned to a revision or following the latest. sitePath opens the site view.', tags: ['scenarios'], params: ScenarioIdParamsSchema, body: LinkCreateBodySchema }, config: writeRateLimit() },
    async (request, reply) => {
      const pinned = request.body.revision ?? null;
      const record = await requireRevision(store, request.params.id, pinned ?? undefined);
      // A pinned link is the agreed plan: freeze what is computed from it, so it reads the same later.
      if (pinned !== null) await freezeComputedView(store, record);
      const token = createShareToken();
      const link = await store.createLink({
        scenarioId: request.params.id,
        mode: request.body.mode,
        revision: pinned,
        label: request.body.label,
        tokenHash: hashShareToken(token),
      });
      audit(request, 'link', request.params.id, pinned, `${link.mode} link ${link.linkId}${link.label ? ` "${link.label}"` : ''}`);
      // The token is shown once, here; only its hash is stored.
      return reply.code(201).send({ ...link, token, sitePath: `/site/${token}`, apiPath: `/api/v1/links/${token}` });
    },
  );

  app.get<{ Params: Static<typeof ScenarioIdParamsSchema> }>(
    '/scenarios/:id/links',
    { schema: { summary: 'List share links', description: 'Links of a scenario, without their tokens.', tags: ['scenarios'], params: ScenarioIdParamsSchema } },
    async (request) => {
      await requireLatest(store, request.params.id);
      return { links: await store.listLinks(request.params.id) };
    },
  );

  app.delete<{ Params: Static<typeof LinkIdParamsSchema> }>(
    '/scenarios/:id/links/:linkId',
    { schema: { summary: 'Revoke a share link', description: 'From then on the link answers 410 DRYDIG_ERR_LINK_REVOKED.', tags: ['scenarios'], params: LinkIdParamsSchema }, config: writeRateLimit() },
    async (request, reply) => {
      const revoked = await store.revokeLink(request.params.id, request.params.linkId);
      if (!revoked)
        throw new DrydigError('DRYDIG_ERR_NOT_FOUND', `no live link "${request.params.linkId}" on scenario "${request.params.id}"`, [
          { path: '/linkId', message: 'no such link, or already revoked' },
        ]);
      audit(request, 'revoke', request.params.id, null, `link ${request.params.linkId}`);
      return reply.code(204).send();
    },
  );

  await app.register(auditRoutes, { store, requireLatest: (id: string) => requireLatest(store, id), requireRevision: (id: string, revision: number) => requireRevision(store, id, revision) });
};

/**
 * Saves `body.scenario` on `scenarioId` against `body.baseRevision` (shared with edit links, which
 * pass `revealScenarioId = false` so a link never hands out the editor's id).
 */
export async function saveOn(
  reply: FastifyReply,
  store: ScenarioStore,
  scenarioId: string,
  body: Static<typeof SaveBodySchema>,
  revealScenarioId = true,
  onSaved?: (revision: number) => void,
): Promise<FastifyReply> {
  const scenario = parseSaveScenario(body.scenario);
  const outcome = await store.saveRevision({ scenarioId, baseRevision: body.baseRevision, scenario, savedBy: body.savedBy, note: body.note });
  if (outcome.ok) onSaved?.(outcome.revision.revision);
  if (outcome.ok) return reply.code(201).send(publicRevisionMeta(outcome.revision, revealScenarioId));
  if (outcome.reason === 'conflict') return conflictAnswer(reply, outcome.latest, body.baseRevision, revealScenarioId);
  throw new DrydigError('DRYDIG_ERR_NOT_FOUND', `no scenario with id "${scenarioId}"`, [{ path: '/id', message: 'no such scenario' }]);
}

/** Registers the scenario routes and decorates the app with `scenarioStore` for the link routes. */
export const scenarioRoutes = fp<ScenarioRoutesOptions>(
  async (app, opts) => {
    // The auth plugin opens the store (sessions live in it); on its own, this plugin opens one.
    const owned = !opts.store && !app.hasDecorator('scenarioStore');
    const store = opts.store ?? (app.hasDecorator('scenarioStore') ? app.scenarioStore : openScenarioStore(opts.dataDir));
    if (!app.hasDecorator('scenarioStore')) app.decorate('scenarioStore', store);
    app.addHook('onClose', async () => {
      if (owned) await store.close();
    });
    // fastify-plugin shares the decoration but drops the prefix, so routes go in a child context.
    await app.register(routes, { prefix: opts.prefix ?? '', store });
  },
  { name: 'drydig-scenarios', fastify: '5.x' },
);
