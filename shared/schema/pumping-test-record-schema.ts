/**
 * The pumping-test record a scenario keeps (optional top-level field `pumpingTest`): the
 * parameters applied from an analysis and their confidence intervals, so the design can say
 * where its K came from and the uncertainty analysis can sample K from the test's interval.
 */
import { Type, type Static } from '@sinclair/typebox';
import { structuralIssuesOf } from './structural-issues';
import type { FieldIssue } from './error-table';

const Positive = (description: string, maximum: number) => Type.Number({ exclusiveMinimum: 0, maximum, description });
const Range = (description: string, maximum: number) =>
  Type.Tuple([Type.Number({ exclusiveMinimum: 0, maximum }), Type.Number({ exclusiveMinimum: 0, maximum })], { description });

export const PumpingTestRecordSchema = Type.Object(
  {
    method: Type.Union([Type.Literal('theis'), Type.Literal('cooper-jacob'), Type.Literal('recovery'), Type.Literal('hantush'), Type.Literal('step')]),
    transmissivity_m2_s: Type.Optional(Positive('Fitted T, m²/s.', 100)),
    conductivity_m_s: Type.Optional(Positive('K = T / b applied to the aquifer, m/s.', 1)),
    saturatedThickness_m: Type.Optional(Positive('b used for K = T / b, m.', 20_000)),
    storativity: Type.Optional(Positive('Fitted S (or Sy) (−).', 1)),
    leakageFactor_m: Type.Optional(Positive('Fitted B, m.', 1e7)),
    wellLoss_s2_m5: Type.Optional(Type.Number({ minimum: 0, maximum: 1e9, description: 'Fitted well-loss coefficient C, s²/m⁵.' })),
    wellId: Type.Optional(Type.String({ maxLength: 64, description: 'Well the well loss was applied to.' })),
    confidence: Type.Optional(Type.Number({ exclusiveMinimum: 0, exclusiveMaximum: 1, description: 'Level of the intervals (0.95).' })),
    conductivityInterval_m_s: Type.Optional(Range('Confidence interval of K, m/s.', 1)),
    transmissivityInterval_m2_s: Type.Optional(Range('Confidence interval of T, m²/s.', 100)),
    storativityInterval: Type.Optional(Range('Confidence interval of S (−).', 1)),
    rmse_m: Type.Optional(Type.Number({ minimum: 0, maximum: 1000, description: 'Fit RMSE, m.' })),
    readings: Type.Optional(Type.Integer({ minimum: 0, maximum: 1_000_000, description: 'Readings the fit used.' })),
    source: Type.Optional(Type.String({ maxLength: 200, description: 'Readings file name or note.' })),
    appliedAt: Type.Optional(Type.String({ maxLength: 40, description: 'When the parameters were applied, ISO 8601.' })),
  },
  { additionalProperties: false },
);
export type PumpingTestRecord = Static<typeof PumpingTestRecordSchema>;

/** Checks `scenario.pumpingTest` (absent is fine); issues carry JSON pointers from the scenario root. */
export function validatePumpingTestRecord(scenario: unknown): FieldIssue[] {
  if (typeof scenario !== 'object' || scenario === null) return [];
  const record = (scenario as Record<string, unknown>).pumpingTest;
  if (record === undefined) return [];
  const issues = structuralIssuesOf(PumpingTestRecordSchema, record, { prefix: '/pumpingTest', unknownField: 'has an unknown field (check spelling and units in the name)' });
  if (issues.length > 0) return issues;
  const r = record as PumpingTestRecord;
  for (const key of ['conductivityInterval_m_s', 'transmissivityInterval_m2_s', 'storativityInterval'] as const) {
    const range = r[key];
    if (range && !(range[0] <= range[1])) issues.push({ path: `/pumpingTest/${key}`, message: 'must be [low, high] with low ≤ high' });
  }
  return issues;
}
