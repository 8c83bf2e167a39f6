/**
 * One structural check for every document schema (scenario, design options, monitoring, section,
 * pumping-test record): TypeBox's errors turned into field issues, the first per JSON pointer (a
 * union failure is reported on the parent and on each branch), worded the way a designer reads
 * them — a number out of its physical range says the range and the unit.
 */
import type { TSchema } from '@sinclair/typebox';
import { Value, ValueErrorType, type ValueError } from '@sinclair/typebox/value';
import type { FieldIssue } from './error-table';

/** Most structural issues reported for one document. */
export const MAX_STRUCTURAL_ISSUES = 20;

const UNIT_SUFFIXES: ReadonlyArray<readonly [string, string]> = [
  ['_m3_s_per_m', ' m³/s per m'], ['_m3_s', ' m³/s'], ['_m2_s', ' m²/s'], ['_m_s', ' m/s'], ['_s2_m5', ' s²/m⁵'],
  ['_kN_m3', ' kN/m³'], ['_per_kWh', ' per kWh'], ['_per_m3', ' per m³'], ['_m', ' m'], ['_s', ' s'],
];

/** The unit a field's name carries (`/aquifer/base_m` → " m"), or '' for a dimensionless one. */
export function unitOfPointer(path: string): string {
  const name = path.slice(path.lastIndexOf('/') + 1);
  // Plan coordinates carry no suffix: x, y (and tuple members [x, y]) are metres.
  if (name === 'x' || name === 'y' || /\/(outline|from|to|origin)\/\d+(\/\d+)?$/.test(path)) return ' m';
  return UNIT_SUFFIXES.find(([suffix]) => name.endsWith(suffix))?.[1] ?? '';
}

/** "between −20000 m and 20000 m", "greater than 0 m/s and at most 1 m/s", … from a number schema's bounds. */
export function describeNumberRange(schema: Record<string, unknown>, unit: string): string | null {
  const low = typeof schema.minimum === 'number' ? `at least ${schema.minimum}${unit}` : typeof schema.exclusiveMinimum === 'number' ? `greater than ${schema.exclusiveMinimum}${unit}` : null;
  const high = typeof schema.maximum === 'number' ? `at most ${schema.maximum}${unit}` : typeof schema.exclusiveMaximum === 'number' ? `less than ${schema.exclusiveMaximum}${unit}` : null;
  if (low && high) return `${low} and ${high}`;
  return low ?? high;
}

/** Words a TypeBox structural error the way a designer reads it. */
export function describeStructuralError(error: ValueError): string {
  const schema = error.schema as Record<string, unknown>;
  const value = error.value;
  if (value === undefined) return 'is required';
  if (schema.const !== undefined) return `must be ${JSON.stringify(schema.const)}`;
  if (Array.isArray(schema.anyOf)) {
    const literals = (schema.anyOf as Array<Record<string, unknown>>)
      .map((s) => s.const)
      .filter((c) => c !== undefined);
    if (literals.length > 0) return `must be one of ${literals.map((l) => JSON.stringify(l)).join(', ')}`;
    // number | null (a time that may be steady state): the number's range, or null.
    const numeric = (schema.anyOf as Array<Record<string, unknown>>).find((s) => s.type === 'number');
    const nullable = (schema.anyOf as Array<Record<string, unknown>>).some((s) => s.type === 'null');
    const range = numeric && describeNumberRange(numeric, unitOfPointer(error.path));
    if (typeof value === 'number' && range) return `must be ${range}${nullable ? ' (or null)' : ''}, got ${value}`;
  }
  if (schema.type === 'number' || schema.type === 'integer') {
    if (typeof value !== 'number') return `must be a number, got ${typeof value === 'string' ? JSON.stringify(value).slice(0, 40) : typeof value}`;
    if (!Number.isFinite(value)) return 'must be a finite number';
    const range = describeNumberRange(schema, unitOfPointer(error.path));
    if (range && error.type !== ValueErrorType.Integer) return `must be ${range}, got ${value}`;
  }
  return error.message.replace(/^Expected/, 'must be').toLowerCase();
}

export interface StructuralIssueOptions {
  /** JSON pointer the value sits at in the caller's document. Default ''. */
  prefix?: string;
  /** Words for a field the schema does not know. */
  unknownField?: string;
}

/** The structural issues of `value` against `schema`, at most MAX_STRUCTURAL_ISSUES, the first per pointer. */
export function structuralIssuesOf(schema: TSchema, value: unknown, options: StructuralIssueOptions = {}): FieldIssue[] {
  const prefix = options.prefix ?? '';
  const unknownField = options.unknownField ?? 'is not a field of this object (check its spelling and the unit in its name)';
  const issues: FieldIssue[] = [];
  const seen = new Set<string>();
  for (const error of Value.Errors(schema, value)) {
    if (seen.has(error.path)) continue;
    seen.add(error.path);
    const message = error.type === ValueErrorType.ObjectAdditionalProperties ? unknownField : describeStructuralError(error);
    issues.push({ path: `${prefix}${error.path}`, message });
    if (issues.length >= MAX_STRUCTURAL_ISSUES) break;
  }
  return issues;
}
