/**
 * Logger files: readings CSV with a time column — ISO 8601 date-times or elapsed time in a unit —
 * and a level, drawdown or pressure column, mapped by the designer (a preview shows the first
 * rows). Pressure from a submerged transducer becomes a level: level = sensor level + p/γw, with
 * γw stated (default 9.81 kN/m³, fresh water at about 10 °C; common practice). Every bad row is
 * named by its line. The result feeds the pumping-test analysis and the site's monitoring readings.
 */
import { DrydigError, isIsoDateTime } from '../schema';
import { splitCsv } from '../testing';

/** Unit weight of water used for pressure → head unless given, kN/m³ (common practice). */
export const DEFAULT_WATER_UNIT_WEIGHT_kN_m3 = 9.81;

export interface LoggerColumnMapping {
  /** Header of the time column. */
  time: string;
  /** 'iso': ISO 8601 date-times with a zone; or an elapsed unit. */
  timeFormat: 'iso' | 's' | 'min' | 'h' | 'd';
  /** ISO time pumping started (t = 0); default: the first reading's time (iso) — elapsed times need none. */
  start?: string;
  /** Header of the value column. */
  value: string;
  valueKind: 'level' | 'drawdown' | 'pressure';
  /** Pressure unit (valueKind 'pressure'). Default kPa. */
  pressureUnit?: 'kPa' | 'Pa' | 'bar' | 'mH2O';
  /** Sensor elevation, m (pressure). */
  sensorLevel_m?: number;
  /** γw for pressure → head, kN/m³. Default 9.81. */
  waterUnitWeight_kN_m3?: number;
  /** Static level, m, to turn levels into drawdowns. */
  staticLevel_m?: number;
}

export interface LoggerReading {
  line: number;
  /** Elapsed since the start, s. */
  time_s: number;
  /** ISO time when the file gave one. */
  at: string | null;
  /** Water level, m (null when only drawdowns were given). */
  level_m: number | null;
  /** Drawdown below the static level, m (null without a static level). */
  drawdown_m: number | null;
}

const PRESSURE_PA: Record<NonNullable<LoggerColumnMapping['pressureUnit']>, number> = { Pa: 1, kPa: 1000, bar: 1e5, mH2O: 0 };
const ELAPSED_S = { s: 1, min: 60, h: 3600, d: 86400 } as const;

/** The header and the first rows, for the column-mapping preview. */
export function previewLoggerFile(text: string, rows = 8): { headers: string[]; sample: string[][] } {
  const all = splitCsv(text);
  return { headers: all[0]?.fields.map((h) => h.trim()) ?? [], sample: all.slice(1, rows + 1).map((r) => r.fields) };
}

function fail(message: string, issues?: Array<{ path: string; message: string }>): never {
  throw new DrydigError('DRYDIG_ERR_INVALID_IMPORT', `logger file: ${message}`, issues);
}

/** Reads the logger file with the mapping; throws naming every bad line. */
export function parseLoggerReadings(text: string, mapping: LoggerColumnMapping): LoggerReading[] {
  const rows = splitCsv(text);
  if (rows.length < 2) fail('needs a header row and at least one reading');
  const headers = rows[0]!.fields.map((h) => h.trim());
  const ti = headers.indexOf(mapping.time);
  const vi = headers.indexOf(mapping.value);
  if (ti < 0) fail(`no column "${mapping.time}" (columns: ${headers.join(', ')})`);
  if (vi < 0) fail(`no column "${mapping.value}" (columns: ${headers.join(', ')})`);
  const gammaW = mapping.waterUnitWeight_kN_m3 ?? DEFAULT_WATER_UNIT_WEIGHT_kN_m3;
  if (!(gammaW >= 9 && gammaW <= 12)) fail(`γw ${gammaW} kN/m³ is outside 9–12 (fresh to saline water)`);
  if (mapping.valueKind === 'pressure' && mapping.sensorLevel_m === undefined) fail('a pressure column needs the sensor level (elevation of the transducer)');
  if (mapping.start !== undefined && !isIsoDateTime(mapping.start)) fail(`start "${mapping.start}" is not an ISO 8601 date-time with a zone`);
  let start_ms = mapping.start !== undefined ? Date.parse(mapping.start) : null;
  const out: LoggerReading[] = [];
  const bad: Array<{ line: number; message: string }> = [];
  for (const { line, fields } of rows.slice(1)) {
    const tText = (fields[ti] ?? '').trim();
    const vText = (fields[vi] ?? '').trim();
    let time_s: number;
    let at: string | null = null;
    if (mapping.timeFormat === 'iso') {
      if (!isIsoDateTime(tText)) {
        bad.push({ line, message: `time "${tText.slice(0, 30)}" is not an ISO 8601 date-time with a zone (e.g. 2027-03-01T07:00:00Z)` });
        continue;
      }
      const ms = Date.parse(tText);
      start_ms ??= ms;
      time_s = (ms - start_ms) / 1000;
      at = tText;
    } else {
      time_s = Number(tText) * ELAPSED_S[mapping.timeFormat];
      if (tText === '' || !Number.isFinite(time_s)) {
        bad.push({ line, message: `time "${tText.slice(0, 30)}" is not a number` });
        continue;
      }
    }
    const v = Number(vText.replace(',', '.'));
    if (vText === '' || !Number.isFinite(v)) {
      bad.push({ line, message: `${mapping.value} "${vText.slice(0, 30)}" is not a number` });
      continue;
    }
    let level_m: number | null = null;
    let drawdown_m: number | null = null;
    if (mapping.valueKind === 'level') level_m = v;
    else if (mapping.valueKind === 'drawdown') drawdown_m = v;
    else {
      const unit = mapping.pressureUnit ?? 'kPa';
      const head_m = unit === 'mH2O' ? v : (v * PRESSURE_PA[unit]) / (gammaW * 1000);
      level_m = mapping.sensorLevel_m! + head_m;
    }
    if (level_m !== null && mapping.staticLevel_m !== undefined) drawdown_m = mapping.staticLevel_m - level_m;
    out.push({ line, time_s, at, level_m, drawdown_m });
  }
  if (bad.length > 0)
    fail(
      `${bad.length} bad row(s): ${bad
        .slice(0, 10)
        .map((b) => `line ${b.line}: ${b.message}`)
        .join('; ')}${bad.length > 10 ? `; and ${bad.length - 10} more` : ''}`,
      bad.map((b) => ({ path: `logger/line/${b.line}`, message: b.message })),
    );
  return out;
}
