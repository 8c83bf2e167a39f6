/**
 * CSV export of a design (RFC 4180: comma-separated, CRLF line ends, fields with commas, quotes or
 * line breaks quoted). Three blocks separated by a blank line: the summary (quantity, value,
 * unit), the wells, the excavations; then the cautions. Values stay SI so the numbers can be
 * checked against the JSON; the summary's unit column and each table header (`rate (m3/s)`) say what they are.
 */
import { headerLineWithUnits } from './csv-column-units';
import type { DesignResult } from './design-result';

function field(value: unknown): string {
  const text = value === null || value === undefined ? '' : typeof value === 'number' ? (Number.isFinite(value) ? String(Number(value.toPrecision(10))) : '') : String(value);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

const line = (values: unknown[]) => values.map(field).join(',');

/** The design as CSV text (see the file comment for the layout). */
export function designResultToCsv(result: DesignResult): string {
  const s = result.summary;
  const rows: string[] = [];
  /** Indices of the table header lines (their cells get units at the end). */
  const headerRows: number[] = [];
  rows.push(line(['quantity', 'value', 'unit']));
  const kv = (name: string, value: unknown, unit = '') => rows.push(line([name, value, unit]));
  kv('mode', result.mode);
  kv('feasible', result.feasible ? 'yes' : 'no');
  kv('design time', result.designTime_s ?? 'steady', result.designTime_s === null ? '' : 's');
  kv('total rate', s.totalRate_m3_s, 'm3/s');
  kv('safety factor', s.safetyFactor, '-');
  kv('design flow (with safety factor)', s.designFlow_m3_s, 'm3/s');
  if (s.initialRate_m3_s !== null) kv('initial rate (steady design, first period)', s.initialRate_m3_s, 'm3/s');
  kv('header system head', s.headerSystemHead_m, 'm');
  kv('largest deep-well head', s.maxWellHead_m, 'm');
  kv('hydraulic power', s.hydraulicPower_kW, 'kW');
  kv('input power', s.inputPower_kW, 'kW');
  kv('installed power (with safety factor)', s.installedPower_kW, 'kW');
  kv('pump capacity', s.pumpCapacity_m3_s, 'm3/s');
  kv('duty pumps', s.dutyPumps, 'count');
  kv('standby pumps', s.standbyPumps, 'count');
  kv('duration', s.duration_s, 's');
  kv('energy', s.energy_kWh, 'kWh');
  kv('discharge volume', s.dischargeVolume_m3, 'm3');
  kv('energy cost', s.energyCost, s.currency);
  kv('pumped volume cost', s.pumpedVolumeCost, s.currency);
  kv('well cost', s.wellCost, s.currency);
  kv('total cost', s.totalCost, s.currency);
  kv('currency', s.currency);
  kv('idle wells (may be omitted)', s.idleWellIds.length, 'count');
  kv('wells', s.quantities.wells, 'count');
  kv('well points', s.quantities.wellsByKind.wellpoint, 'count');
  kv('deep wells', s.quantities.wellsByKind.deep, 'count');
  kv('ejectors', s.quantities.wellsByKind.ejector, 'count');
  kv('screen length', s.quantities.screen_m, 'm');
  kv('header length', s.quantities.header_m, 'm');
  if (result.outOfService) {
    kv('one well out of service', result.outOfService.wellId);
    kv('target met with it out', result.outOfService.met ? 'yes' : 'no');
    kv('worst shortfall with it out', result.outOfService.worstShortfall_m, 'm');
  }
  for (const q of result.quickCheck) {
    kv(`equivalent-well inflow ${q.excavationId}`, q.equivalentWellInflow_m3_s, 'm3/s');
    kv(`superposition / equivalent well ${q.excavationId}`, q.ratio, '-');
  }
  rows.push('');
  headerRows.push(rows.length);
  rows.push(line(['well', 'kind', 'x_m', 'y_m', 'installed', 'start_s', 'rate_m3_s', 'capacity_m3_s', 'utilisation', 'pumpingLevel_m', 'minimumPumpingLevel_m', 'limit', 'head_m', 'flags']));
  for (const w of result.wells)
    rows.push(
      line([w.id, w.kind, w.x, w.y, w.installed ? 'yes' : 'no', w.start_s, w.rate_m3_s, w.capacity_m3_s, w.utilisation, w.pumpingLevel_m, w.minimumPumpingLevel_m, w.limit ?? '', w.head_m, w.flags.join(' ')]),
    );
  rows.push('');
  headerRows.push(rows.length);
  rows.push(line(['excavation', 'targetLevel_m', 'met', 'worstShortfall_m', 'critical_x_m', 'critical_y_m', 'critical_level_m', 'timeToTarget_s', 'recoveryToFormation_s', 'recoveryNote', 'governingCheck', 'allowableLevel_m', 'upliftFS', 'requiredUpliftFS', 'heaveFS', 'requiredHeaveFS', 'timeToUnsafe_s']));
  for (const e of result.excavations) {
    const f = e.floor;
    rows.push(
      line([e.id, e.targetLevel_m, e.met ? 'yes' : 'no', e.worstShortfall_m, e.critical.x, e.critical.y, e.critical.level_m, e.timeToTarget_s, e.recoveryToFormation_s, e.recoveryToFormation_s === null ? e.recoveryNote : 'at the critical point',
        f?.governing ?? '', f?.allowableLevel_m ?? null, f?.upliftFS ?? null, f?.requiredUpliftFS ?? null, f?.heaveFS ?? null, f?.requiredHeaveFS ?? null, f?.timeToUnsafe_s ?? null]),
    );
  }
  const digs = result.excavations.filter((e) => (e.floor?.safeDig.length ?? 0) > 0);
  if (digs.length > 0) {
    rows.push('');
    headerRows.push(rows.length);
    rows.push(line(['safe-dig excavation', 'time_s', 'safeFormationLevel_m']));
    for (const e of digs) for (const step of e.floor!.safeDig) rows.push(line([e.id, step.time_s ?? 'steady', step.safeFormationLevel_m]));
  }
  rows.push('');
  rows.push(line(['reasons and cautions']));
  for (const r of result.reasons) rows.push(line([r.message]));
  for (const c of result.cautions) rows.push(line([c]));
  // Each table header states its columns' units (`rate (m3/s)`), from the names' unit suffixes.
  for (const i of headerRows) rows[i] = headerLineWithUnits(rows[i]!);
  return rows.join('\r\n') + '\r\n';
}
