/**
 * Where a scenario's site data came from (optional top-level field `imports`): one record per
 * file the designer applied — an AGS ground investigation, a DXF site plan, a logger file — with
 * its SHA-256, so the design can say which version of the file it rests on. Additive to v1.
 */
import { Type, type Static } from '@sinclair/typebox';
import { structuralIssuesOf } from './structural-issues';
import type { FieldIssue } from './error-table';

export const SiteImportRecordSchema = Type.Object(
  {
    kind: Type.Union([Type.Literal('ags'), Type.Literal('dxf'), Type.Literal('logger')], { description: 'Kind of file.' }),
    name: Type.String({ maxLength: 200, description: 'File name as opened.' }),
    sha256: Type.String({ pattern: '^[0-9a-f]{64}$', description: 'SHA-256 of the file text (UTF-8), lowercase hex.' }),
    importedAt: Type.String({ maxLength: 40, description: 'When it was applied, ISO 8601.' }),
    used: Type.String({ maxLength: 500, description: 'What was taken from it, in words (e.g. "ground profile from BH1").' }),
  },
  { additionalProperties: false },
);
export type SiteImportRecord = Static<typeof SiteImportRecordSchema>;

export const SiteImportsSchema = Type.Array(SiteImportRecordSchema, { maxItems: 100 });

/** Checks `scenario.imports` (absent is fine); issues carry JSON pointers from the scenario root. */
export function validateImportRecords(scenario: unknown): FieldIssue[] {
  if (typeof scenario !== 'object' || scenario === null) return [];
  const records = (scenario as Record<string, unknown>).imports;
  if (records === undefined) return [];
  return structuralIssuesOf(SiteImportsSchema, records, { prefix: '/imports', unknownField: 'has an unknown field (check spelling)' });
}
