/**
 * JSON Schemas (TypeBox) of the bodies, parameters and query strings of the scenario and link
 * routes. The scenario inside a body is checked by the shared scenario validator (which names the
 * field), not here, so its messages match the evaluate route's.
 */
import { Type } from '@sinclair/typebox';
import { TOKEN_PATTERN } from '../tokens';

/** Body limit of the routes that take a few fields only (readings, links, restore), bytes. */
export const SMALL_BODY_LIMIT_BYTES = 16 * 1024;

/** Scenario ids: 16 random bytes, base64url. */
export const SCENARIO_ID_PATTERN = '^[A-Za-z0-9_-]{22}$';
/** Link ids: 9 random bytes, base64url. */
export const LINK_ID_PATTERN = '^[A-Za-z0-9_-]{12}$';
/** A revision number in a path or query (params are strings; no type coercion). */
export const REVISION_TEXT_PATTERN = '^[1-9][0-9]{0,8}$';

const SavedBy = Type.String({ maxLength: 200, description: 'Name the saver gives (shown in history).' });
const Note = Type.String({ maxLength: 2000, description: 'Note on the save.' });
const Revision = Type.Integer({ minimum: 1, maximum: 999_999_999 });

export const NewScenarioBodySchema = Type.Object(
  { scenario: Type.Unknown({ description: 'Scenario document, format v1.' }), savedBy: Type.Optional(SavedBy), note: Type.Optional(Note) },
  { additionalProperties: false },
);

export const SaveBodySchema = Type.Object(
  {
    scenario: Type.Unknown({ description: 'Scenario document, format v1.' }),
    baseRevision: Type.Integer({ minimum: 1, maximum: 999_999_999, description: 'The revision this edit started from.' }),
    savedBy: Type.Optional(SavedBy),
    note: Type.Optional(Note),
  },
  { additionalProperties: false },
);

export const RestoreBodySchema = Type.Object(
  {
    revision: Revision,
    baseRevision: Type.Integer({ minimum: 1, maximum: 999_999_999, description: 'The latest revision the restorer saw.' }),
    savedBy: Type.Optional(SavedBy),
    note: Type.Optional(Note),
  },
  { additionalProperties: false },
);

export const LinkCreateBodySchema = Type.Object(
  {
    mode: Type.Union([Type.Literal('view'), Type.Literal('edit')], { description: 'view: read-only; edit: may save and enter readings.' }),
    revision: Type.Optional(Type.Union([Revision, Type.Null()], { description: 'Pin to this revision; null or absent follows the latest.' })),
    label: Type.Optional(Type.String({ maxLength: 200 })),
  },
  { additionalProperties: false },
);

export const ReadingBodySchema = Type.Object(
  {
    piezometerId: Type.String({ minLength: 1, maxLength: 64 }),
    level_m: Type.Number({ minimum: -20_000, maximum: 20_000, description: 'Measured level, m above site datum.' }),
    measuredAt: Type.Optional(Type.String({ maxLength: 40, description: 'When it was read, ISO 8601 with zone. Default: now.' })),
    time_s: Type.Optional(Type.Number({ minimum: 0, maximum: 3.2e9, description: 'Time since pumping started, s (when the scenario has no pumping start).' })),
    enteredBy: Type.Optional(Type.String({ maxLength: 200 })),
    note: Type.Optional(Type.String({ maxLength: 2000 })),
  },
  { additionalProperties: false },
);

export const ScenarioIdParamsSchema = Type.Object({ id: Type.String({ pattern: SCENARIO_ID_PATTERN }) });
export const RevisionParamSchema = Type.Object({ id: Type.String({ pattern: SCENARIO_ID_PATTERN }), revision: Type.String({ pattern: REVISION_TEXT_PATTERN }) });
export const LinkIdParamsSchema = Type.Object({ id: Type.String({ pattern: SCENARIO_ID_PATTERN }), linkId: Type.String({ pattern: LINK_ID_PATTERN }) });
/**
 * The token's shape is checked by the route (isTokenShaped), not here: any wrong-shaped token gets
 * the same 404 as an unknown one, as documented, so tokens cannot be probed by their answers.
 */
export const TokenParamsSchema = Type.Object({ token: Type.String({ maxLength: 200, description: `A share token (${TOKEN_PATTERN}).` }) });

export const EXPORT_FORMATS = ['scenario-json', 'setout-csv', 'geojson', 'dxf', 'report-html', 'monitoring-csv'] as const;
export type ExportFormat = (typeof EXPORT_FORMATS)[number];
export const ExportFormatSchema = Type.Union(EXPORT_FORMATS.map((f) => Type.Literal(f)));
export const ExportQuerySchema = Type.Object(
  { revision: Type.Optional(Type.String({ pattern: REVISION_TEXT_PATTERN, description: 'Revision number; default latest.' })) },
  { additionalProperties: false },
);
