/**
 * Monitoring plan for the site team: for each piezometer, the level the design expects over time
 * (from the field engine, at the scenario's design time and rate schedule), with the alert and
 * action levels the designer set, and each site reading compared with the expected level at the
 * moment it was taken.
 *
 * Alert level = expected + alertOffset_m (default 0.3 m, the issue's example; common practice,
 * no single source). Action level = actionLevel_m, or by default the target level (formation −
 * margin) of the excavation containing the piezometer; it applies from the design time on, when
 * the dig reaches formation (before then the level is still being drawn down). A piezometer
 * outside every excavation gets no default action level: the design leaves the water there above
 * the pit's target, so that target would call a reading exactly as designed "action".
 *
 * Low-level triggers (too much drawdown, the neighbours' side): low alert = expected −
 * lowAlertOffset_m (default 0.3 m, common practice), low action = lowActionLevel_m (none by
 * default). Receptors get the same low-level rows at their most drawn-down point, with the low
 * action level from their drawdown limit or the drawdown that gives their allowable settlement.
 */
import { DEFAULT_ALERT_OFFSET_M, getReceptors, type Monitoring, type Piezometer, type Receptor, type Scenario } from '../schema';
import { drawdownForSettlement, receptorSamplePoints } from '../receptors';
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
  /** Expected − low alert offset, m (a reading below: more drawdown than designed). */
  lowAlertLevel_m: number;
  /** Low action level, m (null when none is set). */
  lowActionLevel_m: number | null;
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
  lowAlertLevel_m: number;
  lowActionLevel_m: number | null;
  /**
   * ok: between the low alert and the alert level; alert / action: above the alert / action
   * level (water too high for the dig); low-alert / low-action: below the low alert / low action
   * level (too much drawdown). Action outranks low-action, which outranks either alert.
   */
  status: 'ok' | 'alert' | 'action' | 'low-alert' | 'low-action';
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
  /** Where the action level came from ('outside': outside every excavation, so none by default). */
  actionSource: 'designer' | 'excavation-target' | 'outside' | 'none';
  lowAlertOffset_m: number;
  /** Low action level, m (designer's), or null. */
  lowActionLevel_m: number | null;
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
  /** Low-level rows for each receptor (empty when the scenario has none). */
  receptors: ReceptorMonitorPlan[];
  /** Plain-language notes on how the plan was made. */
  notes: string[];
}

/** The low-level triggers of one receptor, at its most drawn-down point at the design time. */
export interface ReceptorMonitorPlan {
  id: string;
  label: string;
  kind: string;
  x: number;
  y: number;
  lowAlertOffset_m: number;
  /** static − the receptor's limit drawdown, m, or null. */
  lowActionLevel_m: number | null;
  /** What set the low action level: the drawdown limit, the drawdown giving the allowable settlement (the smaller), or none. */
  lowActionSource: 'drawdown-limit' | 'allowable-settlement' | 'none';
  /** Expected level and the low-level triggers over time (receptors have no high-level trigger). */
  series: Array<Omit<ExpectedLevelRow, 'alertLevel_m' | 'actionLevel_m'>>;
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
  if (scenario.excavations.length === 0) return { level: null, source: 'none', excavationId: null };
  // Only a piezometer inside (or on the edge of) an excavation takes its target: outside, the
  // designed level stands above the target, so a reading as designed would be classed "action".
  let best: { d: number; id: string; target: number } | null = null;
  for (const e of scenario.excavations) {
    const d = signedDistanceToRing(p.x, p.y, e.outline);
    if (d >= 0 && (!best || d > best.d)) best = { d, id: e.id, target: e.formationLevel_m - e.margin_m };
  }
  return best ? { level: best.target, source: 'excavation-target', excavationId: best.id } : { level: null, source: 'outside', excavationId: null };
}

/** A reading's class (see AssessedReading.status). */
export function classifyReading(level_m: number, levels: { alert_m: number; action_m: number | null; lowAlert_m: number; lowAction_m: number | null }): AssessedReading['status'] {
  if (levels.action_m !== null && level_m > levels.action_m) return 'action';
  if (levels.lowAction_m !== null && level_m < levels.lowAction_m) return 'low-action';
  if (level_m > levels.alert_m) return 'alert';
  if (level_m < levels.lowAlert_m) return 'low-alert';
  return 'ok';
}

/** The receptor's low action level: static − the smaller of its drawdown limit and the drawdown giving its allowable settlement. */
function receptorLowAction(scenario: Scenario, r: Receptor): { level: number | null; source: ReceptorMonitorPlan['lowActionSource'] } {
  const bySettlement = r.compressibleLayer && r.allowableSettlement_m !== undefined ? drawdownForSettlement(r.allowableSettlement_m, r.compressibleLayer) : Infinity;
  const byLimit = r.maxDrawdown_m ?? Infinity;
  const limit = Math.min(bySettlement, byLimit);
  if (!Number.isFinite(limit)) return { level: null, source: 'none' };
  return { level: scenario.aquifer.staticLevel_m - limit, source: byLimit <= bySettlement ? 'drawdown-limit' : 'allowable-settlement' };
}

/** Each receptor's most drawn-down sample point at the design time. */
function receptorMonitorPoints(scenario: Scenario, engine: MonitoringPlanOptions['engine'], receptors: Receptor[]): Array<readonly [number, number]> {
  return receptors.map((r) => {
    const samples = receptorSamplePoints(r);
    const result = engine.evaluatePoints({ scenario, points: samples, time_s: scenario.design.time_s }).points;
    let best = 0;
    result.forEach((p, i) => {
      if (p.drawdown_m > result[best]!.drawdown_m) best = i;
    });
    return samples[best]!;
  });
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
  notes.push(`Alert level: expected level + the alert offset (default ${DEFAULT_ALERT_OFFSET_M} m, common practice). Action level: as set by the designer, or the target level (formation − margin) of the excavation containing the piezometer, from the design time on; outside every excavation none unless set.`);
  notes.push(`Low alert level (too much drawdown): expected level − the low alert offset (default ${DEFAULT_ALERT_OFFSET_M} m, common practice). Low action level: as set by the designer; for a receptor, static level − its drawdown limit or the drawdown that gives its allowable settlement, whichever is smaller.`);

  const receptors = getReceptors(scenario);
  const receptorPoints = receptorMonitorPoints(scenario, engine, receptors);
  const points = [...piezometers.map((p) => [p.x, p.y] as const), ...receptorPoints];
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

  const rowsAt = (i: number, offsets: { alert_m: number; lowAlert_m: number }, actionAt: (t: number | null) => number | null, lowAction: number | null) =>
    levelsByTime.map((row): ExpectedLevelRow => {
      const expected = row.levels[i] ?? Number.NaN;
      return {
        time_s: row.time_s,
        at: isoAt(monitoring?.pumpingStart, row.time_s),
        expectedLevel_m: expected,
        alertLevel_m: expected + offsets.alert_m,
        actionLevel_m: actionAt(row.time_s),
        lowAlertLevel_m: expected - offsets.lowAlert_m,
        lowActionLevel_m: lowAction,
        flags: row.flags[i] ?? [],
      };
    });

  const plans = piezometers.map((p, i): PiezometerPlan => {
    const alertOffset = p.alertOffset_m ?? DEFAULT_ALERT_OFFSET_M;
    const lowAlertOffset = p.lowAlertOffset_m ?? DEFAULT_ALERT_OFFSET_M;
    const lowAction = p.lowActionLevel_m ?? null;
    const action = defaultAction(scenario, p);
    const actionAt = (t: number | null) => (action.level === null ? null : t === null || t >= actionFrom_s ? action.level : null);
    const series = rowsAt(i, { alert_m: alertOffset, lowAlert_m: lowAlertOffset }, actionAt, lowAction);
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
      const lowAlert = expected - lowAlertOffset;
      const actionLevel = actionAt(scenario.design.time_s === null ? null : r.time_s);
      const status = classifyReading(r.level_m, { alert_m: alert, action_m: actionLevel, lowAlert_m: lowAlert, lowAction_m: lowAction });
      return {
        readingId: r.readingId, piezometerId: r.piezometerId, measuredAt: r.measuredAt, time_s: r.time_s, level_m: r.level_m,
        expectedLevel_m: expected, alertLevel_m: alert, actionLevel_m: actionLevel, lowAlertLevel_m: lowAlert, lowActionLevel_m: lowAction,
        departure_m: r.level_m - expected, status, enteredBy: r.enteredBy, note: r.note,
      };
    });
    return {
      id: p.id, label: p.label ?? '', x: p.x, y: p.y, alertOffset_m: alertOffset, actionLevel_m: action.level,
      actionSource: action.source, excavationId: action.excavationId, actionFrom_s, lowAlertOffset_m: lowAlertOffset, lowActionLevel_m: lowAction,
      series, readings,
    };
  });

  const receptorPlans = receptors.map((r, k): ReceptorMonitorPlan => {
    const lowAlertOffset = r.lowAlertOffset_m ?? DEFAULT_ALERT_OFFSET_M;
    const low = receptorLowAction(scenario, r);
    const [x, y] = receptorPoints[k]!;
    return {
      id: r.id, label: r.label ?? '', kind: r.kind, x, y, lowAlertOffset_m: lowAlertOffset, lowActionLevel_m: low.level, lowActionSource: low.source,
      // Receptors have no high-level trigger: they worry about too much drawdown, not too little.
      series: rowsAt(piezometers.length + k, { alert_m: 0, lowAlert_m: lowAlertOffset }, () => null, low.level).map(({ alertLevel_m: _a, actionLevel_m: _b, ...row }) => row),
    };
  });

  return {
    present: piezometers.length > 0,
    pumpingStart: monitoring?.pumpingStart ?? null,
    interval_s: schedule?.interval_s ?? null,
    staticLevel_m: scenario.aquifer.staticLevel_m,
    piezometers: plans,
    receptors: receptorPlans,
    notes,
  };
}
