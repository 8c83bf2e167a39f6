/** Serves one export of a stored revision with its content type and a download file name. */
import type { FastifyReply } from 'fastify';
import type { ExportFormat } from '../storage/http';
import type { ReadingRecord, RevisionRecord } from '../storage';
import { currentCompute } from '../compute/compute-context';
import { exportNeedsComputedView, renderExportBody } from './render-export-body';
import type { ComputedView } from './computed-view';

/** What an export is made from. */
export interface ExportSource {
  record: RevisionRecord;
  readings: readonly ReadingRecord[];
  /** True when a specific revision was asked for (file name says so either way). */
  pinned: boolean;
  /** The computed plan and design to show (frozen snapshot or live); called only by formats that need it. */
  computed: () => Promise<ComputedView>;
  /** Who recorded the revision as issued for construction, and when (null: only saved). */
  issued?: { by: string; at: string } | null;
}

/** A file-name-safe slug of the scenario name (ASCII letters, digits, dashes). */
export function fileSlug(name: string): string {
  const slug = name.normalize('NFKD').replace(/[^A-Za-z0-9]+/g, '-').replace(/^-+|-+$/g, '').toLowerCase().slice(0, 60);
  return slug || 'scenario';
}

const TYPES: Record<ExportFormat, { type: string; ext: string; inline: boolean }> = {
  'scenario-json': { type: 'application/json; charset=utf-8', ext: 'drydig.json', inline: false },
  'setout-csv': { type: 'text/csv; charset=utf-8', ext: 'setout.csv', inline: false },
  geojson: { type: 'application/geo+json; charset=utf-8', ext: 'geojson', inline: false },
  dxf: { type: 'application/dxf', ext: 'dxf', inline: false },
  'report-html': { type: 'text/html; charset=utf-8', ext: 'report.html', inline: true },
  'monitoring-csv': { type: 'text/csv; charset=utf-8', ext: 'monitoring.csv', inline: false },
};

/** Renders the export body on the request's compute pool (exported for tests and the CLI). */
export async function renderExport(format: ExportFormat, source: ExportSource): Promise<string> {
  const computed = exportNeedsComputedView(format) ? await source.computed() : undefined;
  const input = { format, record: source.record, readings: source.readings, issued: source.issued ?? null, ...(computed ? { computed } : {}) };
  // Small writers need no thread; a scenario file or set-out table costs less than the hand-over.
  if (format === 'scenario-json' || format === 'setout-csv') return renderExportBody(input);
  return currentCompute().run('exportBody', input);
}

/** Sends the export with Content-Type and Content-Disposition. */
export async function sendExport(reply: FastifyReply, format: ExportFormat, source: ExportSource): Promise<FastifyReply> {
  const spec = TYPES[format];
  const body = await renderExport(format, source);
  const filename = `${fileSlug(source.record.scenario.name)}-rev${source.record.revision}.${spec.ext}`;
  return reply
    .header('content-type', spec.type)
    .header('content-disposition', `${spec.inline ? 'inline' : 'attachment'}; filename="${filename}"`)
    .header('x-drydig-revision', String(source.record.revision))
    .send(body);
}
