/**
 * Monitoring CSV: per piezometer and time, the expected, alert and action levels, so the site team
 * can compare each day's reading with the design; readings so far follow in a second table.
 */
import { csvRows, roundTo } from './csv-cell';
import { cautionsText } from './design-cautions';
import type { MonitoringPlan } from './monitoring-plan';

const lvl = (v: number | null) => (v === null || !Number.isFinite(v) ? null : roundTo(v, 3));

/** CSV of the monitoring plan (levels in m above site datum, to the millimetre). */
export function writeMonitoringCsv(plan: MonitoringPlan): string {
  const rows: Array<Array<string | number | null>> = [
    ['piezometer_id', 'time_s', 'time_d', 'date_time', 'expected_level_m', 'alert_level_m', 'action_level_m', 'flags'],
  ];
  for (const p of plan.piezometers) {
    for (const r of p.series) {
      rows.push([
        p.id, r.time_s, r.time_s === null ? 'steady' : roundTo(r.time_s / 86400, 4), r.at,
        lvl(r.expectedLevel_m), lvl(r.alertLevel_m), lvl(r.actionLevel_m), r.flags.join(' '),
      ]);
    }
  }
  const readings = plan.piezometers.flatMap((p) => p.readings);
  if (readings.length > 0) {
    rows.push([]);
    rows.push(['reading_piezometer_id', 'measured_at', 'time_d', 'reading_level_m', 'expected_level_m', 'departure_m', 'status', 'entered_by', 'note']);
    for (const r of readings)
      rows.push([r.piezometerId, r.measuredAt, roundTo(r.time_s / 86400, 4), lvl(r.level_m), lvl(r.expectedLevel_m), lvl(r.departure_m), r.status, r.enteredBy, r.note]);
  }
  rows.push([]);
  rows.push(['caution', cautionsText()]);
  return csvRows(rows);
}
