/**
 * Units of the design CSV's table columns, stated in each header cell: `rate (m3/s)`. The unit
 * comes from the column name's unit suffix (the project's naming rule: `rate_m3_s`, `x_m`,
 * `start_s`), so a new column named that way gets its unit with no other change; dimensionless
 * columns are listed here; anything else (ids, words, yes/no) keeps its bare name.
 */

/** Name suffix → unit as written in the CSV (ASCII, as the summary block's unit column). Longest first. */
const SUFFIX_UNITS: ReadonlyArray<readonly [string, string]> = [
  ['_m3_s', 'm3/s'],
  ['_m2_s', 'm2/s'],
  ['_kW', 'kW'],
  ['_m', 'm'],
  ['_s', 's'],
];

/** Columns that are ratios or factors (−). */
const DIMENSIONLESS = new Set(['utilisation', 'ratio', 'safetyFactor', 'upliftFS', 'heaveFS', 'requiredUpliftFS', 'fs']);

/** A header cell with its unit: `rate_m3_s` → `rate (m3/s)`, `critical_x_m` → `critical_x (m)`, `utilisation` → `utilisation (-)`. */
export function headerWithUnit(name: string): string {
  for (const [suffix, unit] of SUFFIX_UNITS) if (name.endsWith(suffix) && name.length > suffix.length) return `${name.slice(0, -suffix.length)} (${unit})`;
  return DIMENSIONLESS.has(name) ? `${name} (-)` : name;
}

/** A whole header line (plain names, no commas or quotes) with units in each cell. */
export function headerLineWithUnits(line: string): string {
  return line.split(',').map(headerWithUnit).join(',');
}
