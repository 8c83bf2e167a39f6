/**
 * Boreholes from AGS4 groups: where each hole is (LOCA: LOCA_ID, LOCA_NATE, LOCA_NATN, LOCA_GL),
 * its strata (GEOL: GEOL_TOP, GEOL_BASE depths below ground, GEOL_DESC, GEOL_LEG, GEOL_GEOL) and
 * its groundwater strikes (WSTG: WSTG_DPTH; WSTD: WSTD_NMIN minutes after the strike, WSTD_POST
 * depth the water rose to). Depths are metres below ground (AGS UNIT "m"; "ft" is converted);
 * levels are ground level − depth. Field names as we know the AGS4 dictionary (from memory of the
 * published format; unknown fields are ignored, missing required ones named).
 */
import { DrydigError } from '../schema';
import { FOOT_M } from '../units';
import type { AgsGroup } from './parse-ags4';

export interface BoreholeStratum {
  /** Depths below ground, m. */
  topDepth_m: number;
  baseDepth_m: number;
  /** Elevations, m (ground level − depth). */
  topLevel_m: number;
  baseLevel_m: number;
  description: string;
  /** Geology or legend code when the file gives one (used to match strata between holes). */
  code: string;
  line: number;
}

export interface WaterStrike {
  depth_m: number;
  level_m: number;
  /** Depth the water rose to, and after how long (WSTD), when logged. */
  restDepth_m: number | null;
  restLevel_m: number | null;
  minutes: number | null;
}

export interface Borehole {
  id: string;
  /** Easting / northing in the file's grid, m. */
  x: number;
  y: number;
  groundLevel_m: number;
  strata: BoreholeStratum[];
  waterStrikes: WaterStrike[];
}

/** Level from ground level and a depth, rounded to a nanometre (the log's cm digits stay exact in the output). */
const levelAt = (groundLevel_m: number, depth_m: number) => Math.round((groundLevel_m - depth_m) * 1e9) / 1e9;

function fail(source: string, line: number, message: string): never {
  throw new DrydigError('DRYDIG_ERR_INVALID_IMPORT', `${source}: line ${line}: ${message}`, [{ path: `${source}/line/${line}`, message }]);
}

/** Factor from the group's unit of a heading to metres (m, or ft converted; blank = m). */
function lengthFactor(group: AgsGroup, heading: string, source: string, line: number): number {
  const k = group.headings.indexOf(heading);
  const unit = (k >= 0 ? group.units[k] : '')?.trim().toLowerCase() ?? '';
  if (unit === '' || unit === 'm') return 1;
  if (unit === 'ft') return FOOT_M;
  return fail(source, line, `${group.name} ${heading} is in "${unit}"; drydig reads m or ft`);
}

function number(row: { line: number; values: Record<string, string> }, group: AgsGroup, heading: string, source: string, required: true): number;
function number(row: { line: number; values: Record<string, string> }, group: AgsGroup, heading: string, source: string, required: false): number | null;
function number(row: { line: number; values: Record<string, string> }, group: AgsGroup, heading: string, source: string, required: boolean): number | null {
  const text = row.values[heading]?.trim() ?? '';
  if (text === '') {
    if (required) fail(source, row.line, `${group.name} ${heading} is empty`);
    return null;
  }
  const v = Number(text);
  if (!Number.isFinite(v)) fail(source, row.line, `${group.name} ${heading} "${text.slice(0, 20)}" is not a number`);
  // Positions are grid metres and WSTD_NMIN is minutes; every other field read here is a depth.
  return v * (heading.endsWith('_NATE') || heading.endsWith('_NATN') || heading === 'WSTD_NMIN' ? 1 : lengthFactor(group, heading, source, row.line));
}

/** The boreholes of an AGS file (LOCA required; GEOL, WSTG, WSTD optional). */
export function readBoreholes(groups: Map<string, AgsGroup>, source = 'ags'): Borehole[] {
  const loca = groups.get('LOCA');
  if (!loca) throw new DrydigError('DRYDIG_ERR_INVALID_IMPORT', `${source}: no LOCA group: the file locates no boreholes`);
  for (const h of ['LOCA_ID', 'LOCA_NATE', 'LOCA_NATN', 'LOCA_GL'])
    if (!loca.headings.includes(h)) throw new DrydigError('DRYDIG_ERR_INVALID_IMPORT', `${source}: LOCA has no ${h} heading (needed for the hole's position and ground level)`);
  const holes = new Map<string, Borehole>();
  for (const row of loca.rows) {
    const id = row.values.LOCA_ID!.trim();
    if (id === '') fail(source, row.line, 'LOCA_ID is empty');
    if (holes.has(id)) fail(source, row.line, `borehole ${id} is located twice`);
    holes.set(id, { id, x: number(row, loca, 'LOCA_NATE', source, true), y: number(row, loca, 'LOCA_NATN', source, true), groundLevel_m: number(row, loca, 'LOCA_GL', source, true), strata: [], waterStrikes: [] });
  }
  const holeOf = (row: { line: number; values: Record<string, string> }, group: string) => {
    const id = row.values.LOCA_ID?.trim() ?? '';
    const hole = holes.get(id);
    if (!hole) fail(source, row.line, `${group} names borehole "${id}", which LOCA does not locate`);
    return hole;
  };
  const geol = groups.get('GEOL');
  if (geol)
    for (const row of geol.rows) {
      const hole = holeOf(row, 'GEOL');
      const top = number(row, geol, 'GEOL_TOP', source, true);
      const base = number(row, geol, 'GEOL_BASE', source, true);
      if (!(base > top)) fail(source, row.line, `GEOL_BASE ${base} m must be deeper than GEOL_TOP ${top} m`);
      hole.strata.push({
        topDepth_m: top,
        baseDepth_m: base,
        topLevel_m: levelAt(hole.groundLevel_m, top),
        baseLevel_m: levelAt(hole.groundLevel_m, base),
        description: row.values.GEOL_DESC?.trim() ?? '',
        code: (row.values.GEOL_GEOL || row.values.GEOL_LEG || '').trim(),
        line: row.line,
      });
    }
  const strikes = new Map<string, WaterStrike>();
  const wstg = groups.get('WSTG');
  if (wstg)
    for (const row of wstg.rows) {
      const hole = holeOf(row, 'WSTG');
      const depth = number(row, wstg, 'WSTG_DPTH', source, true);
      const strike: WaterStrike = { depth_m: depth, level_m: levelAt(hole.groundLevel_m, depth), restDepth_m: null, restLevel_m: null, minutes: null };
      hole.waterStrikes.push(strike);
      strikes.set(`${hole.id}@${depth}`, strike);
    }
  const wstd = groups.get('WSTD');
  if (wstd)
    for (const row of wstd.rows) {
      const hole = holeOf(row, 'WSTD');
      const depth = number(row, wstd, 'WSTG_DPTH', source, true);
      const strike = strikes.get(`${hole.id}@${depth}`);
      if (!strike) fail(source, row.line, `WSTD refers to a strike at ${depth} m in ${hole.id} that WSTG does not list`);
      const minutes = number(row, wstd, 'WSTD_NMIN', source, false);
      const post = number(row, wstd, 'WSTD_POST', source, false);
      // Keep the latest reading after the strike: the level the water rose to.
      if (post !== null && (strike.minutes === null || (minutes ?? 0) >= strike.minutes)) {
        strike.restDepth_m = post;
        strike.restLevel_m = levelAt(hole.groundLevel_m, post);
        strike.minutes = minutes;
      }
    }
  for (const hole of holes.values()) {
    hole.strata.sort((a, b) => a.topDepth_m - b.topDepth_m);
    for (let i = 1; i < hole.strata.length; i++) {
      const prev = hole.strata[i - 1]!;
      const s = hole.strata[i]!;
      if (Math.abs(s.topDepth_m - prev.baseDepth_m) > 0.005)
        fail(source, s.line, `borehole ${hole.id}: stratum from ${s.topDepth_m} m does not follow on from the one above, which ends at ${prev.baseDepth_m} m`);
    }
  }
  return [...holes.values()];
}
