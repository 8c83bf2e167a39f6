/**
 * The section result as a printable HTML report: the section and its source, flow and split
 * (with flow × perimeter beside the plan design's total when built from a scenario), the checks
 * with their methods, the toe sweep and options compared, the floor profile, assumptions, flags
 * and the cautions. Pure: a string out.
 */
import { escapeHtml } from './escape-html';
import type { SectionJobAnswer } from '../section';

const f = (v: number | null | undefined, digits = 3) => (v === null || v === undefined || !Number.isFinite(v) ? '—' : String(Number(v.toPrecision(digits))));
const row = (cells: Array<string | number>) => `<tr>${cells.map((c) => `<td>${escapeHtml(String(c))}</td>`).join('')}</tr>`;
const head = (cells: string[]) => `<tr>${cells.map((c) => `<th>${escapeHtml(c)}</th>`).join('')}</tr>`;

/** HTML report of one section answer (from `runSectionJob`). */
export function writeSectionReportHtml(answer: SectionJobAnswer, options: { title?: string; generatedAt?: string } = {}): string {
  const unit = answer.geometry === 'plane' ? 'L/s per m' : 'L/s';
  const q = (answer.flow_m3_s_per_m ?? answer.flow_m3_s ?? 0) * 1000;
  const from = answer.fromScenario;
  const checks = [
    head(['check', 'value', 'FS', 'method']),
    row(['exit gradient (max)', `${f(answer.exitGradient.max)} at x = ${f(answer.exitGradient.x_m)} m; i_c = ${f(answer.exitGradient.criticalGradient)}`, f(answer.exitGradient.fs), answer.exitGradient.method]),
    row(['heave', answer.heave ? `d = ${f(answer.heave.depth_m)} m, h_a = ${f(answer.heave.excessHead_m)} m` : '—', f(answer.heave?.fs), answer.heave?.method ?? 'Terzaghi prism (no wall toe below the floor)']),
    row(['slab uplift', answer.uplift ? `${f(answer.uplift.force)} kN${answer.geometry === 'plane' ? ' per m' : ''}` : '—', f(answer.uplift?.fs), answer.uplift?.method ?? 'no slab']),
    row(['plug uplift', answer.plug ? `base ${f(answer.plug.base_m)} m, at x = ${f(answer.plug.x_m)} m` : '—', f(answer.plug?.fs), answer.plug?.method ?? 'no plug layer under the floor']),
  ].join('');
  const c = answer.comparison;
  const compare = c
    ? `<h2>Options compared</h2><table>${head(['option', `flow, ${unit}`, 'exit FS', 'heave FS', 'plug FS'])}${c.rows.map((r) => row([r.label, f(r.flow * 1000), f(r.exitFS), f(r.heaveFS), f(r.plugFS)])).join('')}</table>
       <h2>Wall toe sweep</h2><table>${head(['toe, m', `flow, ${unit}`, 'exit FS', 'heave FS'])}${c.sweep.map((r) => row([f(r.toe_m), f(r.flow * 1000), f(r.exitFS), f(r.heaveFS)])).join('')}</table>`
    : '';
  const floor = answer.floor.filter((_p, n) => n % Math.max(1, Math.ceil(answer.floor.length / 40)) === 0);
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(options.title ?? 'Section seepage')}</title>
<style>body{font:13px system-ui,sans-serif;margin:24px;color:#1d2730}table{border-collapse:collapse;margin:6px 0 14px}td,th{border:1px solid #dcd8ce;padding:3px 6px;text-align:left}.caution{background:#fff7e6;border:1px solid #e0b060;padding:8px}</style></head><body>
<h1>${escapeHtml(options.title ?? 'Section seepage')}</h1>
<p>${escapeHtml(answer.method)}; ${escapeHtml(answer.solver.method)} (${answer.mesh.unknowns} unknowns, relative residual ${answer.solver.relativeResidual.toExponential(1)}). Generated ${escapeHtml(options.generatedAt ?? new Date().toISOString())}.</p>
<div class="caution"><strong>Caution.</strong> ${escapeHtml(answer.cautions.join(' '))}</div>
<h2>Flow</h2><table>${row(['total', `${f(q)} ${unit}`])}${from ? row([`× perimeter ${f(from.perimeter_m)} m`, `${f(from.flowTimesPerimeter_m3_s * 1000)} L/s`]) + row(['plan design total', from.planTotalRate_m3_s === null ? '—' : `${f(from.planTotalRate_m3_s * 1000)} L/s`]) : ''}
${row(['to the floor', `${f(answer.split.floor * 1000)} ${unit}`])}${answer.split.wells.map((w) => row([`to the well at x = ${w.x_m} m`, `${f(w.flow * 1000)} ${unit}`])).join('')}${answer.split.drains.map((d) => row([`to the drain at x = ${d.x_m} m`, `${f(d.flow * 1000)} ${unit}`])).join('')}${answer.split.underWalls.map((w) => row([`under the wall at x = ${w.x_m} m (toe ${w.toe_m} m)`, `${f(Math.abs(w.flow) * 1000)} ${unit}`])).join('')}</table>
<h2>Checks</h2><table>${checks}</table>
${compare}
<h2>Floor profile</h2><table>${head(['x, m', 'level, m', 'head, m', 'pressure, kPa', 'exit gradient', 'FS'])}${floor.map((p) => row([f(p.x_m), f(p.level_m), f(p.head_m, 4), f(p.pressure_kPa), f(p.gradient), f(p.fs)])).join('')}</table>
${from || answer.flags.length ? `<h2>Assumptions and flags</h2><ul>${[...(from?.assumptions ?? []), ...answer.flags].map((a) => `<li>${escapeHtml(a)}</li>`).join('')}</ul>` : ''}
</body></html>
`;
}
