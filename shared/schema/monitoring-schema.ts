/**
 * Monitoring plan (optional top-level scenario field `monitoring`): piezometers the site team
 * reads, with the alert and action levels the designer sets. The expected level at each one over
 * time comes from the engine; readings are site data stored apart from scenario revisions.
 */
import { Type, type Static } from '@sinclair/typebox';
import { structuralIssuesOf } from './structural-issues';
import type { FieldIssue } from './error-table';
import { COORDINATE_LIMIT_M, LEVEL_LIMIT_M, TIME_LIMIT_S } from './physical-ranges';

/** Default alert offset above the expected level, m (the issue's example; common practice, no single source). */
export const DEFAULT_ALERT_OFFSET_M = 0.3;

export const PiezometerSchema = Type.Object(
  {
    id: Type.String({ minLength: 1, maxLength: 64, description: 'Piezometer id as marked on site.' }),
    x: Type.Number({ minimum: -COORDINATE_LIMIT_M, maximum: COORDINATE_LIMIT_M, description: 'Easting / plan x, m (site CRS).' }),
    y: Type.Number({ minimum: -COORDINATE_LIMIT_M, maximum: COORDINATE_LIMIT_M, description: 'Northing / plan y, m (site CRS).' }),
    alertOffset_m: Type.Optional(
      Type.Number({ minimum: 0, maximum: 20, description: 'Alert when a reading stands this far above the expected level, m. Default 0.3.' }),
    ),
    actionLevel_m: Type.Optional(
      Type.Number({
        minimum: -LEVEL_LIMIT_M,
        maximum: LEVEL_LIMIT_M,
        description:
          'Act (stop digging, add pumping) when a reading stands above this level, m. Default: the target level (formation − margin) of the excavation containing the piezometer; none outside every excavation (there the designed level stands above the pit target).',
      }),
    ),
    lowAlertOffset_m: Type.Optional(
      Type.Number({ minimum: 0, maximum: 20, description: 'Low-level alert when a reading stands this far below the expected level (more drawdown than designed), m. Default 0.3.' }),
    ),
    lowActionLevel_m: Type.Optional(
      Type.Number({
        minimum: -LEVEL_LIMIT_M,
        maximum: LEVEL_LIMIT_M,
        description: 'Act (reduce pumping, recharge) when a reading stands below this level — too much drawdown, e.g. for a neighbour, m. Default none.',
      }),
    ),
    label: Type.Optional(Type.String({ maxLength: 200 })),
  },
  { additionalProperties: false },
);
export type Piezometer = Static<typeof PiezometerSchema>;

export const MonitoringSchema = Type.Object(
  {
    piezometers: Type.Array(PiezometerSchema, { maxItems: 500 }),
    pumpingStart: Type.Optional(
      Type.String({ maxLength: 40, description: 'When pumping starts (t = 0), ISO 8601; lets readings be entered by date.' }),
    ),
    readingInterval_s: Type.Optional(
      Type.Number({ exclusiveMinimum: 0, maximum: TIME_LIMIT_S, description: 'Spacing of the expected-level table, s. Default one day.' }),
    ),
  },
  { additionalProperties: false },
);
export type Monitoring = Static<typeof MonitoringSchema>;

const ISO_DATE_TIME = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d{1,9})?)?(Z|[+-]\d{2}:\d{2})$/;

/** True for an ISO 8601 date-time with an explicit zone that parses to a real instant. */
export function isIsoDateTime(text: string): boolean {
  return ISO_DATE_TIME.test(text) && Number.isFinite(Date.parse(text));
}

/**
 * Checks `scenario.monitoring` (absent is fine). Issues carry JSON pointers from the scenario
 * root, e.g. `/monitoring/piezometers/2/x`.
 */
export function validateMonitoring(scenario: unknown): FieldIssue[] {
  if (typeof scenario !== 'object' || scenario === null) return [];
  const monitoring = (scenario as Record<string, unknown>).monitoring;
  if (monitoring === undefined) return [];
  const issues = structuralIssuesOf(MonitoringSchema, monitoring, { prefix: '/monitoring', unknownField: 'has an unknown field (check spelling and units in the name)' });
  if (issues.length) return issues;
  const m = monitoring as Monitoring;
  const ids = new Set<string>();
  m.piezometers.forEach((p, i) => {
    if (ids.has(p.id)) issues.push({ path: `/monitoring/piezometers/${i}/id`, message: `duplicate piezometer id "${p.id}"` });
    ids.add(p.id);
  });
  if (m.pumpingStart !== undefined && !isIsoDateTime(m.pumpingStart))
    issues.push({ path: '/monitoring/pumpingStart', message: 'must be an ISO 8601 date-time with a zone, e.g. 2027-03-01T07:00:00Z' });
  return issues;
}
