/**
 * Monitoring plan for the site team: for each piezometer, the level the design expects over time
 * (from the field engine, at the scenario's design time and rate schedule), with the alert and
 * action levels the designer set, and each site reading compared with the expected level at the
 * moment it was taken.
 *
 * Alert level = expected + alertOffset_m (default 0.3 m, the example; common practice,
 * no single source). Action level = actionLevel_m, or by default the target level (formation −
 * margin) of the excavation containing, or else nearest to, the piezometer; it applies from the
 * design time on, when the dig reaches formation (before then the level is still being drawn down).
 */
import { DEFAULT_ALERT_OFFSET_M, type Monitoring, type Piezometer, type Scenario } from '../schema';
import type { PointFlag } from '../field/types';
import { signedDistanceToRing } from '../contours';
import type { FieldEngine } from './field-engine';

const DAY_S = 86_400;
/** Most rows in a piezometer's expected-level table (a longer horizon gets a wider interval). */
export const MAX_SERIES_ROWS = 400;

/** One row of a piezometer's expected-level table. */
export interface ExpectedLevelRow {
  /** Time since pumping started, s (null: steady state). */
  time_s: number | null;
  /** When that is, ISO 8601, if the scenario gives a pumping start. */
  at: string | null;
  expectedLevel_m: number;
  alertLevel_m: number;
  /** Null before the action level applies, or when none is set. */
  actionLevel_m: number | null;
  flags: PointFlag[];
}

/** A site reading with how it compares with the design. */
export interface AssessedReading {
  readingId: number;
  piezometerId: string;
  measuredAt: string;
  time_s: number;
  level_m: number;
  expectedLevel_m: number;
  alertLevel_m: number;
  actionLevel_m: number | null;
  /** Reading − expected, m (positive: water higher than designed). */
  departure_m: number;
  /** ok: at or below alert; alert: above the alert level; action: above the action level. */
  status: 'ok' | 'alert' | 'action';
  enteredBy: string;
  note: string;
}

/** One piezometer of the plan. */
export interface PiezometerPlan {
  id: string;
  label: string;
  x: number;
  y: number;
  alertOffset_m: number;
  /** Action level, m, or null when none is set and no excavation gives one. */
  actionLevel_m: number | null;
  /** Where the action level came from. */
  actionSource: 'designer' | 'excavation-target' | 'none';
  /** Excavation whose target gave the default action level. */
  excavationId: string | null;
  /** The action level applies from this time on, s (design time; 0 for steady runs). */
  actionFrom_s: number;
  series: ExpectedLevelRow[];
  readings: AssessedReading[];
}

export interface MonitoringPlan {
  /** True when the scenario has piezometers. */
  present: boolean;
  pumpingStart: string | null;
  /** Interval of the expected-level tables, s (null for steady state). */
  interval_s: number | null;
  staticLevel_m: number;
  piezometers: PiezometerPlan[];
  /** Plain-language notes on how the plan was made. */
  notes: string[];
}

/** A site reading as the plan needs it (the store's ReadingRecord extends it). */
export interface PlanReading {
  readingId: number;
  piezometerId: string;
  /** When the reading was taken, ISO 8601. */
  measuredAt: string;
  /** Time since pumping started, s (from measuredAt and the scenario's pumping start, or given). */
  time_s: number;
  /** Measured groundwater / piezometric level, m above site datum. */
  level_m: number;
  /** Who entered it (free text). */
  enteredBy: string;
  note: string;
}

/** Options for `buildMonitoringPlan`. */
export interface MonitoringPlanOptions {
  scenario: Scenario;
  engine: Pick<FieldEngine, 'evaluatePoints'>;
  /** Site readings to assess (any order). Default none. */
  readings?: readonly PlanReading[];
}

/** The scenario's monitoring section, if any. */
export function getMonitoring(scenario: Scenario): Monitoring | undefined {
  return (scenario as Scenario & { monitoring?: Monitoring }).monitoring;
}

/**
 * Times of the expected-level table: 0, then 1, 3, 6 and 12 h when the interval is longer, then
 * Δt, 2Δt … to the horizon; at most MAX_SERIES_ROWS (+4 early) rows.
 */
export function monitoringTimes(scenario: Scenario): { times_s: number[]; interval_s: number } | null {
  const designTime = scenario.design.time_s;
  if (designTime === null) return null;
  const lastChange = Math.max(0, ...scenario.wells.flatMap((w) => (w.schedule ?? []).map((s) => s.from_s)));
  // Past the last rate change the site still reads for a week (recovery after a stop, say).
  const horizon = Math.max(designTime, lastChange > 0 ? lastChange + 7 * DAY_S : 0);
  let interval = getMonitoring(scenario)?.readingInterval_s ?? DAY_S;
  if (horizon / interval > MAX_SERIES_ROWS - 1) interval = Math.ceil(horizon / (MAX_SERIES_ROWS - 1) / 3600) * 3600;
  const times: number[] = [0];
  // Levels fall fastest in the first hours; a few early rows make the curve and the first checks useful.
  for (const early of [3600, 3 * 3600, 6 * 3600, 12 * 3600]) if (early < interval && early < horizon) times.push(early);
  for (let t = interval; t < horizon - 1e-6; t += interval) times.push(t);
  times.push(horizon);
  return { times_s: times, interval_s: interval };
}

function defaultAction(scenario: Scenario, p: Piezometer): { level: number | null; source: PiezometerPlan['actionSource']; excavationId: string | null } {
  if (p.actionLevel_m !== undefined) return { level: p.actionLevel_m, source: 'designer', excavationId: null };
  let best: { d: number; id: string; target: number } | null = null;
  for (const e of scenario.excavations) {
    const d = signedDistanceToRing(p.x, p.y, e.outline);
    // Inside (d > 0) beats any outside one; among outside ones, the nearest.
    const score = d > 0 ? -Infinity : -d;
    if (!best || score < best.d) best = { d: score, id: e.id, target: e.formationLevel_m - e.margin_m };
  }
  return best ? { level: best.target, source: 'excavation-target', excavationId: best.id } : { level: null, source: 'none', excavationId: null };
}

function isoAt(start: string | undefined, time_s: number | null): string | null {
  if (!start || time_s === null) return null;
  return new Date(Date.parse(start) + time_s * 1000).toISOString();
}

/** Builds the monitoring plan (empty `piezometers` when the scenario has none). */
export function buildMonitoringPlan(options: MonitoringPlanOptions): MonitoringPlan {
  const { scenario, engine } = options;
  const monitoring = getMonitoring(scenario);
  const piezometers = monitoring?.piezometers ?? [];
  const schedule = monitoringTimes(scenario);
  const notes: string[] = [];
  const actionFrom_s = scenario.design.time_s ?? 0;
  if (schedule === null) notes.push('Steady-state design: one expected level per piezometer (no time history).');
  else notes.push(`Expected levels every ${schedule.interval_s / 3600} h from the start of pumping to ${(schedule.times_s.at(-1) ?? 0) / DAY_S} d.`);
  notes.push(`Alert level: expected level + the alert offset (default ${DEFAULT_ALERT_OFFSET_M} m, common practice). Action level: as set by the designer, or the target level (formation − margin) of the excavation containing or nearest the piezometer, from the design time on.`);

  const points = piezometers.map((p) => [p.x, p.y] as const);
  const levelsByTime: Array<{ time_s: number | null; levels: number[]; flags: PointFlag[][] }> = [];
  if (points.length > 0) {
    for (const t of schedule ? schedule.times_s : [null]) {
      // t = 0: nothing has been pumped yet; the level is the static level by definition.
      if (t === 0) {
        levelsByTime.push({ time_s: 0, levels: points.map(() => scenario.aquifer.staticLevel_m), flags: points.map(() => []) });
        continue;
      }
      const result = engine.evaluatePoints({ scenario, points, time_s: t });
      levelsByTime.push({ time_s: t, levels: result.points.map((r) => r.level_m), flags: result.points.map((r) => r.flags) });
    }
  }

  const readingsByPiezometer = new Map<string, PlanReading[]>();
  for (const r of options.readings ?? []) {
    const list = readingsByPiezometer.get(r.piezometerId) ?? [];
    list.push(r);
    readingsByPiezometer.set(r.piezometerId, list);
  }

  const plans = piezometers.map((p, i): PiezometerPlan => {
    const alertOffset = p.alertOffset_m ?? DEFAULT_ALERT_OFFSET_M;
    const action = defaultAction(scenario, p);
    const actionAt = (t: number | null) => (action.level === null ? null : t === null || t >= actionFrom_s ? action.level : null);
    const series = levelsByTime.map((row): ExpectedLevelRow => {
      const expected = row.levels[i] ?? Number.NaN;
      return {
        time_s: row.time_s,
        at: isoAt(monitoring?.pumpingStart, row.time_s),
        expectedLevel_m: expected,
        alertLevel_m: expected + alertOffset,
        actionLevel_m: actionAt(row.time_s),
        flags: row.flags[i] ?? [],
      };
    });
    const own = [...(readingsByPiezometer.get(p.id) ?? [])].sort((a, b) => a.time_s - b.time_s || a.readingId - b.readingId);
    let expectedAtReadings: number[] = [];
    if (own.length > 0) {
      const times = own.map((r) => (scenario.design.time_s === null ? null : r.time_s));
      expectedAtReadings = times.map((t) =>
        t === 0 ? scenario.aquifer.staticLevel_m : (engine.evaluatePoints({ scenario, points: [[p.x, p.y]], time_s: t }).points[0]?.level_m ?? Number.NaN),
      );
    }
    const readings = own.map((r, k): AssessedReading => {
      const expected = expectedAtReadings[k] ?? Number.NaN;
      const alert = expected + alertOffset;
      const actionLevel = actionAt(scenario.design.time_s === null ? null : r.time_s);
      const status = actionLevel !== null && r.level_m > actionLevel ? 'action' : r.level_m > alert ? 'alert' : 'ok';
      return {
        readingId: r.readingId, piezometerId: r.piezometerId, measuredAt: r.measuredAt, time_s: r.time_s, level_m: r.level_m,
        expectedLevel_m: expected, alertLevel_m: alert, actionLevel_m: actionLevel, departure_m: r.level_m - expected, status,
        enteredBy: r.enteredBy, note: r.note,
      };
    });
    return {
      id: p.id, label: p.label ?? '', x: p.x, y: p.y, alertOffset_m: alertOffset, actionLevel_m: action.level,
      actionSource: action.source, excavationId: action.excavationId, actionFrom_s, series, readings,
    };
  });

  return {
    present: piezometers.length > 0,
    pumpingStart: monitoring?.pumpingStart ?? null,
    interval_s: schedule?.interval_s ?? null,
    staticLevel_m: scenario.aquifer.staticLevel_m,
    piezometers: plans,
    notes,
  };
}
