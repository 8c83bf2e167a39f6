/**
 * Floor-profile CSV of a section result: per floor column, the level, head, water pressure, exit
 * gradient, critical gradient and factor of safety, then the governing checks and the cautions.
 */
import { csvRows, roundTo } from './csv-cell';
import type { SectionResult } from '../section';

const n = (v: number | null | undefined, d: number) => (v === null || v === undefined || !Number.isFinite(v) ? null : roundTo(v, d));

/** CSV of the floor profile (levels and heads in m, pressure in kPa, gradients dimensionless). */
export function writeSectionFloorCsv(result: SectionResult): string {
  const rows: Array<Array<string | number | null>> = [['x_m', 'floor_level_m', 'head_m', 'pressure_kPa', 'exit_gradient', 'critical_gradient', 'fs']];
  for (const p of result.floor) rows.push([n(p.x_m, 3), n(p.level_m, 3), n(p.head_m, 4), n(p.pressure_kPa, 2), n(p.gradient, 5), n(p.criticalGradient, 4), n(p.fs, 3)]);
  rows.push([]);
  const flowLabel = result.geometry === 'plane' ? 'flow_m3_s_per_m' : 'flow_m3_s';
  rows.push([flowLabel, result.flow_m3_s_per_m ?? result.flow_m3_s ?? null]);
  rows.push(['exit_gradient_max', n(result.exitGradient.max, 5), 'at_x_m', n(result.exitGradient.x_m, 3), 'fs', n(result.exitGradient.fs, 3), 'required_fs', result.exitGradient.requiredFS]);
  if (result.heave) rows.push(['heave_fs', n(result.heave.fs, 3), 'method', result.heave.method]);
  if (result.uplift) rows.push(['slab_uplift_fs', n(result.uplift.fs, 3), 'method', result.uplift.method]);
  if (result.plug) rows.push(['plug_uplift_fs', n(result.plug.fs, 3), 'method', result.plug.method]);
  rows.push(['method', result.method]);
  for (const f of result.flags) rows.push(['flag', f]);
  rows.push(['caution', result.cautions.join(' ')]);
  return csvRows(rows);
}
