/**
 * Share links under `/api/v1/links/:token`: what a view or edit link opens. A token is checked
 * for shape, hashed and looked up; a revoked link answers 410, an unknown one 404 (the same 404
 * for a forged token as for a random path, so tokens cannot be probed). A view token can never
 * write: every writing route here checks the mode first.
 *
 * Links never reveal the scenario id, so holding a view link gives no way to the editor routes.
 */
import type { FastifyInstance, FastifyPluginAsync } from 'fastify';
import { Type, type Static } from '@sinclair/typebox';
import { DrydigError } from '../../shared/schema';
import { createSiteProjection, DESIGN_CAUTIONS, buildSetoutRows } from '../../shared/exports';
import { hashShareToken, isTokenShaped, type LinkRecord, type ReadingRecord, type RevisionRecord, type ScenarioStore } from '../storage';
import {
  ExportFormatSchema,
  SMALL_BODY_LIMIT_BYTES,
  ReadingBodySchema,
  SaveBodySchema,
  TokenParamsSchema,
  publicRevisionMeta,
  storeReading,
  type ExportFormat,
} from '../storage/http';
import { writeRateLimit } from '../security';
import { computedViewFor, monitoringPlanFor, sendExport } from '../exports';
import { saveOn } from './scenarios';
import { findRevisionIssue } from './audit';
import { useComputeLane } from '../compute';

interface OpenedLink {
  link: LinkRecord;
  record: RevisionRecord;
}

const notFound = () => new DrydigError('DRYDIG_ERR_NOT_FOUND', 'no share link matches this address', [{ path: '/token', message: 'unknown link' }]);

/** Resolves a token to its link and the revision it shows (pinned, or the latest). */
async function openLink(store: ScenarioStore, token: string): Promise<OpenedLink> {
  if (!isTokenShaped(token)) throw notFound();
  const link = await store.findLinkByTokenHash(hashShareToken(token));
  if (!link) throw notFound();
  if (link.revokedAt !== null) throw new DrydigError('DRYDIG_ERR_LINK_REVOKED', `this link was revoked on ${link.revokedAt}`, [{ path: '/token', message: 'revoked' }]);
  const record = link.revision === null ? await store.getLatest(link.scenarioId) : await store.getRevision(link.scenarioId, link.revision);
  if (!record) throw notFound();
  return { link, record };
}

/** "via link 89ljXXXXXXXX" in readings stored before schema 3, and any link id, shown to a link holder. */
const LINK_ID_IN_TEXT = /\blink [A-Za-z0-9_-]{12}\b/g;

/**
 * Readings as a share link shows them: who entered them, but never another link's id (a view
 * link must not learn the edit link's id).
 */
async function readingsForLink(store: ScenarioStore, link: LinkRecord): Promise<ReadingRecord[]> {
  return (await store.listReadings(link.scenarioId)).map((r) => ({ ...r, enteredBy: r.enteredBy.replace(LINK_ID_IN_TEXT, 'share link') }));
}

function requireEdit(opened: OpenedLink, what: string): void {
  if (opened.link.mode !== 'edit')
    throw new DrydigError('DRYDIG_ERR_LINK_READ_ONLY', `this is a view-only link: it cannot ${what}`, [{ path: '/token', message: 'view-only link' }]);
}

/** The link's own description, without the scenario id. */
function linkInfo(link: LinkRecord) {
  return { linkId: link.linkId, mode: link.mode, pinnedRevision: link.revision, label: link.label, createdAt: link.createdAt };
}

function revisionInfo(record: RevisionRecord) {
  return publicRevisionMeta(record, false);
}

const routes = async (app: FastifyInstance) => {
  const store = app.scenarioStore;
  if (!store) throw new Error('link routes need the scenario routes registered first (scenarioStore)');

  app.get<{ Params: Static<typeof TokenParamsSchema> }>('/links/:token', { schema: { summary: 'What a share link shows (site view data)', description: 'The revision the link shows, its scenario, the set-out table (lat/lon where georeferenced), level contours, checks, the design result and the cautions. Never the scenario id.', tags: ['links'], params: TokenParamsSchema } }, async (request, reply) => {
    // The site team's view goes before any waiting computation, never behind a layout search.
    useComputeLane('view');
    const opened = await openLink(store, request.params.token);
    const { record, link } = opened;
    const projection = createSiteProjection(record.scenario);
    const computed = await computedViewFor(store, record);
    const plan = computed.results;
    reply.header('cache-control', 'no-store');
    return {
      link: linkInfo(link),
      revision: revisionInfo(record),
      issued: findRevisionIssue(store, link.scenarioId, record.revision),
      canEdit: link.mode === 'edit',
      canSave: link.mode === 'edit' && link.revision === null,
      scenario: record.scenario,
      georeferenced: projection !== null,
      crs: record.scenario.crs ?? null,
      setout: buildSetoutRows(record.scenario, projection),
      contours: plan ? { time_s: plan.time_s, lines: plan.contours.lines.map((l) => ({ level_m: l.level, coordinates: l.coordinates })) } : null,
      excavationChecks: plan?.excavations ?? [],
      flagCounts: plan?.flagCounts ?? null,
      method: plan?.model.method ?? null,
      modelNotes: plan?.model.notes ?? [],
      computeError: computed.resultsError,
      computedBy: computed.computedBy,
      frozenAt: computed.frozenAt,
      design: computed.design,
      designError: computed.designError,
      cautions: [...DESIGN_CAUTIONS, ...(computed.design?.cautions ?? [])],
    };
  });

  app.get<{ Params: Static<typeof TokenParamsSchema> & { format: ExportFormat } }>(
    '/links/:token/export/:format',
    { schema: { summary: 'Export through a share link', description: 'The same exports as the scenario route, of the revision the link shows.', tags: ['links'], params: Type.Composite([TokenParamsSchema, Type.Object({ format: ExportFormatSchema })]) } },
    async (request, reply) => {
      const { link, record } = await openLink(store, request.params.token);
      return sendExport(reply, request.params.format, {
        record, readings: await readingsForLink(store, link), pinned: link.revision !== null, computed: () => computedViewFor(store, record),
        issued: findRevisionIssue(store, link.scenarioId, record.revision),
      });
    },
  );

  app.get<{ Params: Static<typeof TokenParamsSchema> }>('/links/:token/monitoring', { schema: { summary: 'Monitoring plan through a share link', description: 'Expected, alert and action levels per piezometer, with readings assessed.', tags: ['links'], params: TokenParamsSchema } }, async (request, reply) => {
    const { link, record } = await openLink(store, request.params.token);
    reply.header('cache-control', 'no-store');
    return monitoringPlanFor(record.scenario, await readingsForLink(store, link));
  });

  app.get<{ Params: Static<typeof TokenParamsSchema> }>('/links/:token/readings', { schema: { summary: 'Site readings through a share link', description: 'Readings of the scenario, oldest first.', tags: ['links'], params: TokenParamsSchema } }, async (request) => {
    const { link } = await openLink(store, request.params.token);
    return { readings: (await readingsForLink(store, link)).map(({ scenarioId: _s, ...r }) => r) };
  });

  app.post<{ Params: Static<typeof TokenParamsSchema>; Body: Static<typeof ReadingBodySchema> }>(
    '/links/:token/readings',
    { bodyLimit: SMALL_BODY_LIMIT_BYTES, schema: { summary: 'Enter a site reading (edit links only)', description: 'A view link answers 403 DRYDIG_ERR_LINK_READ_ONLY: a view token can never write.', tags: ['links'], params: TokenParamsSchema, body: ReadingBodySchema }, config: writeRateLimit() },
    async (request, reply) => {
      const opened = await openLink(store, request.params.token);
      requireEdit(opened, 'enter readings');
      // Readings are checked against the plan the link shows (the agreed revision when pinned).
      // The reading names the link kind, not its id; the audit trail keeps which link it was.
      const reading = await storeReading(store, opened.record, request.body, 'share link');
      store.accounts.appendAudit({ actor: `link ${opened.link.linkId}`, action: 'reading', scenarioId: opened.link.scenarioId, revision: opened.record.revision, detail: `piezometer ${reading.piezometerId}` });
      return reply.code(201).send(reading);
    },
  );

  app.put<{ Params: Static<typeof TokenParamsSchema>; Body: Static<typeof SaveBodySchema> }>(
    '/links/:token/scenario',
    { schema: { summary: 'Save a revision through an edit link', description: 'Edit links that follow the latest revision only; stale saves get 409 with the newer revision. View links answer 403.', tags: ['links'], params: TokenParamsSchema, body: SaveBodySchema }, config: writeRateLimit() },
    async (request, reply) => {
      const opened = await openLink(store, request.params.token);
      requireEdit(opened, 'save the scenario');
      if (opened.link.revision !== null)
        throw new DrydigError(
          'DRYDIG_ERR_LINK_READ_ONLY',
          `this link is pinned to revision ${opened.link.revision}, the agreed plan; it can enter readings but not save a new revision`,
          [{ path: '/token', message: 'pinned link' }],
        );
      return saveOn(reply, store, opened.link.scenarioId, request.body, false, (revision) =>
        store.accounts.appendAudit({ actor: `link ${opened.link.linkId}`, action: 'revision', scenarioId: opened.link.scenarioId, revision, detail: 'saved through an edit link' }),
      );
    },
  );
};

/** Registers the link routes; needs `scenarioRoutes` registered before it. */
export const linkRoutes: FastifyPluginAsync = async (app) => {
  await app.register(routes);
};
