/**
 * The audit trail (who did what, when) and "issued for construction" — registered inside the
 * scenario routes, so the same account guard applies: any signed-in role reads, designers and
 * admins issue. Audit rows are append-only in the database.
 */
import type { FastifyInstance } from 'fastify';
import { Type, type Static } from '@sinclair/typebox';
import type { RevisionRecord, ScenarioStore } from '../storage';
import { ScenarioIdParamsSchema, SMALL_BODY_LIMIT_BYTES } from '../storage/http';
import { pageSizeOf } from '../storage/http/paging';
import { writeRateLimit } from '../security';
import { actorOf } from '../auth';

export const ISSUED_FOR_CONSTRUCTION = 'issued-for-construction';

/** Who recorded a revision as issued for construction, and when (ISO 8601 UTC). */
export interface RevisionIssue {
  by: string;
  at: string;
}

/**
 * The latest record of this revision as issued for construction, or null: a revision is called
 * "issued for construction" only when someone recorded it so (the audit trail says who and when).
 */
export function findRevisionIssue(store: ScenarioStore, scenarioId: string, revision: number): RevisionIssue | null {
  let beforeId: number | undefined;
  for (;;) {
    const rows = store.accounts.listAudit({ scenarioId, limit: 500, beforeId });
    const hit = rows.find((r) => r.action === ISSUED_FOR_CONSTRUCTION && r.revision === revision);
    if (hit) return { by: hit.actor, at: hit.at };
    if (rows.length < 500) return null;
    beforeId = rows[rows.length - 1]!.auditId;
  }
}

const AuditQuery = Type.Object(
  { limit: Type.Optional(Type.String({ pattern: '^[1-9][0-9]{0,2}$' })), cursor: Type.Optional(Type.String({ pattern: '^[1-9][0-9]{0,15}$' })) },
  { additionalProperties: false },
);
const IssueBody = Type.Object(
  { revision: Type.Integer({ minimum: 1, maximum: 999_999_999 }), note: Type.Optional(Type.String({ maxLength: 2000 })) },
  { additionalProperties: false },
);

interface AuditRouteOptions {
  store: ScenarioStore;
  requireLatest: (scenarioId: string) => Promise<RevisionRecord>;
  requireRevision: (scenarioId: string, revision: number) => Promise<RevisionRecord>;
}

export const auditRoutes = async (app: FastifyInstance, opts: AuditRouteOptions) => {
  const { store } = opts;
  const page = (query: Static<typeof AuditQuery>, scenarioId?: string) => {
    const limit = pageSizeOf(query.limit);
    const rows = store.accounts.listAudit({ scenarioId, limit: limit + 1, beforeId: query.cursor === undefined ? undefined : Number(query.cursor) });
    const entries = rows.slice(0, limit);
    return { entries, nextCursor: rows.length > limit ? String(entries[entries.length - 1]!.auditId) : null };
  };

  app.get<{ Querystring: Static<typeof AuditQuery> }>(
    '/audit',
    { schema: { summary: 'Audit trail of the whole store, newest first', description: 'Who saved, restored, linked, revoked or issued for construction, and when. Paged like the scenario list.', tags: ['scenarios'], querystring: AuditQuery } },
    async (request) => page(request.query),
  );

  app.get<{ Params: Static<typeof ScenarioIdParamsSchema>; Querystring: Static<typeof AuditQuery> }>(
    '/scenarios/:id/audit',
    { schema: { summary: 'Audit trail of one scenario, newest first', description: 'Who saved, restored, linked, revoked or issued for construction, and when.', tags: ['scenarios'], params: ScenarioIdParamsSchema, querystring: AuditQuery } },
    async (request) => {
      await opts.requireLatest(request.params.id);
      return page(request.query, request.params.id);
    },
  );

  app.post<{ Params: Static<typeof ScenarioIdParamsSchema>; Body: Static<typeof IssueBody> }>(
    '/scenarios/:id/issued',
    { bodyLimit: SMALL_BODY_LIMIT_BYTES, schema: { summary: 'Record a revision as issued for construction', description: 'Records who issued which revision, and when (with its checksum), in the audit trail.', tags: ['scenarios'], params: ScenarioIdParamsSchema, body: IssueBody }, config: writeRateLimit() },
    async (request, reply) => {
      const record = await opts.requireRevision(request.params.id, request.body.revision);
      const entry = store.accounts.appendAudit({
        actor: actorOf(request),
        action: ISSUED_FOR_CONSTRUCTION,
        scenarioId: request.params.id,
        revision: record.revision,
        detail: [`sha256 ${record.sha256}`, request.body.note ?? ''].filter(Boolean).join('; '),
      });
      return reply.code(201).send(entry);
    },
  );
};
