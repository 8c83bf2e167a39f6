/**
 * Pumping-test readings from CSV (RFC 4180). A header row names the columns; a column's unit is
 * its suffix, or the option of that quantity when it has none:
 * - time: `time_s`, `time_min`, `time_h`, `time_d` (or `time` + `timeUnit`) — elapsed since pumping started;
 * - `drawdown_m` / `drawdown_ft` (or `drawdown` + `lengthUnit`), or a water level `level_m` /
 *   `level_ft` / `level` with `staticLevel_m` given (drawdown = static − level);
 * - optional `distance_m` / `distance_ft` / `distance`, `well`, `phase` (`pumping` | `recovery`),
 *   and a rate `rate_m3_s` / `rate_m3_h` / `rate_l_s` / `rate_gpm` (step tests).
 * A bare number is SI (design.md §8). Every bad row is reported with its line number; nothing is
 * dropped silently.
 */
import { DrydigError } from '../schema';
import { UNITS, type UnitId } from '../units';
import type { TestReading } from './test-readings';

/** Time, length and rate units a readings file may use. */
export type TimeUnit = 's' | 'min' | 'h' | 'd';
export type LengthUnit = 'm' | 'ft';
export type RateUnit = 'm³/s' | 'm³/h' | 'L/s' | 'gpm';

export interface ParseReadingsOptions {
  /** Unit of a bare `time` column. Default 's'. */
  timeUnit?: TimeUnit;
  /** Unit of bare `drawdown`, `level` and `distance` columns. Default 'm'. */
  lengthUnit?: LengthUnit;
  /** Unit of a bare `rate` column. Default 'm³/s'. */
  rateUnit?: RateUnit;
  /** Static level, m, when the file gives water levels instead of drawdowns. */
  staticLevel_m?: number;
  /** Distance for rows without a distance column, m. */
  distance_m?: number;
  /** Constant rate for rows without a rate column, m³/s. */
  rate_m3_s?: number;
  /** Pump stop time, s: later readings are recovery unless a phase column says otherwise. */
  stop_s?: number | null;
  /** JSON pointer or option name of the file, for messages. Default 'readings'. */
  sourceName?: string;
}

/** Largest number of rows one file may hold. */
export const MAX_READINGS = 100_000;

const SUFFIX_UNITS: Record<string, UnitId> = {
  s: 's',
  min: 'min',
  h: 'h',
  d: 'd',
  m: 'm',
  ft: 'ft',
  m3_s: 'm³/s',
  m3_h: 'm³/h',
  l_s: 'L/s',
  gpm: 'gpm',
};

/** Splits CSV text into rows of fields (quoted fields may hold commas, quotes and newlines). */
export function splitCsv(text: string): Array<{ line: number; fields: string[] }> {
  const rows: Array<{ line: number; fields: string[] }> = [];
  let fields: string[] = [];
  let field = '';
  let quoted = false;
  let line = 1;
  let rowLine = 1;
  const endRow = () => {
    fields.push(field);
    if (fields.some((f) => f.trim() !== '')) rows.push({ line: rowLine, fields });
    fields = [];
    field = '';
  };
  for (let i = 0; i < text.length; i++) {
    const c = text[i]!;
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') {
        field += '"';
        i++;
      } else if (c === '"') quoted = false;
      else {
        if (c === '\n') line++;
        field += c;
      }
    } else if (c === '"') quoted = true;
    else if (c === ',' || c === ';' || c === '\t') {
      fields.push(field);
      field = '';
    } else if (c === '\n' || c === '\r') {
      if (c === '\r' && text[i + 1] === '\n') i++;
      endRow();
      line++;
      rowLine = line;
    } else field += c;
  }
  endRow();
  return rows;
}

interface Column {
  index: number;
  unit: UnitId | null;
}

function findColumn(header: string[], base: string, allowed: readonly string[]): Column | null {
  for (let i = 0; i < header.length; i++) {
    const name = header[i]!.trim().toLowerCase().replace(/\s+/g, '_');
    if (name === base) return { index: i, unit: null };
    if (name.startsWith(`${base}_`)) {
      const suffix = name.slice(base.length + 1);
      const unit = SUFFIX_UNITS[suffix];
      if (unit !== undefined && allowed.includes(unit)) return { index: i, unit };
    }
  }
  return null;
}

function fail(source: string, message: string, issues: Array<{ path: string; message: string }> = [{ path: source, message }]): never {
  throw new DrydigError('DRYDIG_ERR_INVALID_READINGS', `${source}: ${message}`, issues);
}

/** Parses the readings; throws `DrydigError` (DRYDIG_ERR_INVALID_READINGS) listing every bad line. */
export function parseReadingsCsv(text: string, options: ParseReadingsOptions = {}): TestReading[] {
  const source = options.sourceName ?? 'readings';
  const rows = splitCsv(text);
  if (rows.length < 2) fail(source, 'needs a header row and at least one reading');
  if (rows.length - 1 > MAX_READINGS) fail(source, `has ${rows.length - 1} rows; at most ${MAX_READINGS} readings per file`);
  const header = rows[0]!.fields;
  const time = findColumn(header, 'time', ['s', 'min', 'h', 'd']);
  const drawdown = findColumn(header, 'drawdown', ['m', 'ft']);
  const level = findColumn(header, 'level', ['m', 'ft']);
  const distance = findColumn(header, 'distance', ['m', 'ft']);
  const rate = findColumn(header, 'rate', ['m³/s', 'm³/h', 'L/s', 'gpm']);
  const wellColumn = findColumn(header, 'well', []);
  const phaseColumn = findColumn(header, 'phase', []);
  if (time === null) fail(source, `line 1: no time column (time_s, time_min, time_h, time_d or time); found ${header.map((h) => `"${h.trim()}"`).join(', ')}`);
  if (drawdown === null && level === null) fail(source, 'line 1: no drawdown column (drawdown_m, drawdown_ft or drawdown) and no water-level column (level_m, level_ft or level)');
  if (drawdown === null && options.staticLevel_m === undefined) fail(source, 'the file gives water levels: give the static level (staticLevel_m / --static-level) to turn them into drawdowns');
  if (distance === null && options.distance_m === undefined) fail(source, 'no distance column (distance_m, distance_ft or distance): give the observation distance (distance_m / --distance)');
  if (rate === null && options.rate_m3_s === undefined) fail(source, 'no rate column and no pumping rate given (rate_m3_s / --rate)');

  const lengthUnit: UnitId = options.lengthUnit ?? 'm';
  const si = (text: string, column: Column, fallback: UnitId) => Number(text.trim()) * UNITS[column.unit ?? fallback].toSi;
  const readings: TestReading[] = [];
  const bad: Array<{ line: number; message: string }> = [];
  for (const { line, fields } of rows.slice(1)) {
    const cell = (c: Column | null) => (c === null ? undefined : fields[c.index]);
    const problems: string[] = [];
    const number = (c: Column | null, name: string, fallbackUnit: UnitId): number | undefined => {
      const raw = cell(c);
      if (c === null) return undefined;
      if (raw === undefined || raw.trim() === '') {
        problems.push(`${name} is empty`);
        return undefined;
      }
      const v = si(raw, c, fallbackUnit);
      if (!Number.isFinite(v)) problems.push(`${name} "${raw.trim().slice(0, 20)}" is not a number`);
      return v;
    };
    const time_s = number(time, 'time', options.timeUnit ?? 's');
    let drawdown_m = number(drawdown, 'drawdown', lengthUnit);
    if (drawdown === null) {
      const level_m = number(level, 'level', lengthUnit);
      if (level_m !== undefined) drawdown_m = options.staticLevel_m! - level_m;
    }
    const distance_m = distance !== null ? number(distance, 'distance', lengthUnit) : options.distance_m;
    const rate_m3_s = rate !== null ? number(rate, 'rate', options.rateUnit ?? 'm³/s') : options.rate_m3_s;
    const well = cell(wellColumn)?.trim() || 'obs';
    const phaseText = cell(phaseColumn)?.trim().toLowerCase();
    if (phaseText !== undefined && phaseText !== '' && phaseText !== 'pumping' && phaseText !== 'recovery') problems.push(`phase "${phaseText.slice(0, 20)}" is not pumping or recovery`);
    if (time_s !== undefined && Number.isFinite(time_s) && !(time_s > 0)) problems.push('time must be > 0 (elapsed since pumping started)');
    if (distance_m !== undefined && Number.isFinite(distance_m) && !(distance_m > 0 && distance_m <= 1e5)) problems.push('distance must be > 0 and at most 100 km');
    if (rate_m3_s !== undefined && Number.isFinite(rate_m3_s) && !(Math.abs(rate_m3_s) <= 10)) problems.push('rate must be within ±10 m³/s');
    if (drawdown_m !== undefined && Number.isFinite(drawdown_m) && Math.abs(drawdown_m) > 1000) problems.push('drawdown must be within ±1000 m');
    if (problems.length > 0 || time_s === undefined || drawdown_m === undefined || distance_m === undefined || rate_m3_s === undefined) {
      bad.push({ line, message: problems.join('; ') || 'incomplete row' });
      continue;
    }
    const stop = options.stop_s ?? null;
    const phase = phaseText === 'pumping' || phaseText === 'recovery' ? phaseText : stop !== null && time_s > stop ? 'recovery' : 'pumping';
    readings.push({ time_s, drawdown_m, well, distance_m, phase, rate_m3_s, line });
  }
  if (bad.length > 0) {
    const shown = bad.slice(0, 10).map((b) => `line ${b.line}: ${b.message}`);
    fail(
      source,
      `${bad.length} bad row(s): ${shown.join('; ')}${bad.length > 10 ? `; and ${bad.length - 10} more` : ''}`,
      bad.map((b) => ({ path: `${source}/line/${b.line}`, message: b.message })),
    );
  }
  return readings;
}
