/**
 * The body of one export of a stored revision, from plain data: the pure writers, plus the
 * monitoring plan they need. Runs on a compute-pool thread (a report of a large site computes
 * a monitoring plan of every piezometer against every well).
 */
import {
  createSiteProjection,
  writeDxf,
  writeGeoJson,
  writeMonitoringCsv,
  writeReportHtml,
  writeScenarioJson,
  writeSetoutCsv,
} from '../../shared/exports';
import type { ExportFormat } from '../storage/http';
import type { ReadingRecord, RevisionRecord } from '../storage';
import { computeMonitoringPlan } from './plan-compute';
import type { ComputedView } from './computed-view';

export interface ExportBodyInput {
  format: ExportFormat;
  record: RevisionRecord;
  readings: readonly ReadingRecord[];
  /** The plan and design to show; present for the formats that show them (see `exportNeedsComputedView`). */
  computed?: ComputedView;
  /** Who recorded the revision as issued for construction, and when (null: only saved). */
  issued?: { by: string; at: string } | null;
}

/** Formats that show the computed plan or design. */
export function exportNeedsComputedView(format: ExportFormat): boolean {
  return format === 'geojson' || format === 'dxf' || format === 'report-html';
}

export function renderExportBody(input: ExportBodyInput): string {
  const { record, format, computed } = input;
  const scenario = record.scenario;
  const projection = createSiteProjection(scenario);
  switch (format) {
    case 'scenario-json':
      return writeScenarioJson(scenario);
    case 'setout-csv':
      return writeSetoutCsv({ scenario, projection });
    case 'geojson':
      return writeGeoJson({ scenario, projection, revision: record.revision, results: computed?.results });
    case 'dxf':
      return writeDxf({ scenario, results: computed?.results });
    case 'monitoring-csv':
      return writeMonitoringCsv(computeMonitoringPlan(scenario, input.readings));
    case 'report-html':
      return writeReportHtml({
        scenario,
        projection,
        revision: { ...record, issued: input.issued ?? null },
        results: computed?.results,
        resultsError: computed?.resultsError ?? null,
        computedBy: computed?.frozenAt ? `${computed.computedBy} (frozen ${computed.frozenAt}, when a link fixed this revision)` : (computed?.computedBy ?? ''),
        design: computed?.design ?? null,
        designError: computed?.designError ?? null,
        monitoring: computeMonitoringPlan(scenario, input.readings),
      });
  }
}
