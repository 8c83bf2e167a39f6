/**
 * <site-level-chart>: one piezometer's expected level over time with its alert and action levels,
 * and the site readings plotted against them. SVG; axes in days since pumping started and metres.
 */
import { LitElement, css, svg, html, nothing } from 'lit';
import type { PiezometerPlan } from '../../shared/exports';

export class SiteLevelChart extends LitElement {
  static override properties = { piezometer: { attribute: false } };
  declare piezometer: PiezometerPlan | null;

  static override styles = css`
    :host { display: block; }
    svg { width: 100%; height: auto; }
    text { font: 12px system-ui, sans-serif; }
    .legend { display: flex; flex-wrap: wrap; gap: 0.8rem; font-size: 0.8rem; margin-top: 0.2rem; }
    .key { display: inline-block; width: 1.2rem; height: 0.2rem; vertical-align: middle; margin-right: 0.25rem; }
  `;

  constructor() {
    super();
    this.piezometer = null;
  }

  override render() {
    const p = this.piezometer;
    if (!p || p.series.length === 0) return nothing;
    const rows = p.series.filter((r) => r.time_s !== null && Number.isFinite(r.expectedLevel_m));
    if (rows.length < 2) return html`<p>Steady-state design: expected level ${p.series[0]?.expectedLevel_m.toFixed(2)} m.</p>`;
    const W = 640, H = 300, L = 52, R = 12, T = 12, B = 36;
    const tMax = Math.max(...rows.map((r) => r.time_s ?? 0), ...p.readings.map((r) => r.time_s));
    const levels = [
      ...rows.flatMap((r) => [r.expectedLevel_m, r.alertLevel_m, r.actionLevel_m ?? Number.NaN]),
      ...p.readings.map((r) => r.level_m),
    ].filter(Number.isFinite);
    let lo = Math.min(...levels), hi = Math.max(...levels);
    if (hi - lo < 0.5) { lo -= 0.25; hi += 0.25; }
    const pad = (hi - lo) * 0.08;
    lo -= pad; hi += pad;
    const X = (t: number) => L + ((W - L - R) * t) / tMax;
    const Y = (v: number) => T + ((H - T - B) * (hi - v)) / (hi - lo);
    const line = (pts: Array<[number, number]>) => pts.map(([t, v], i) => `${i ? 'L' : 'M'}${X(t).toFixed(1)},${Y(v).toFixed(1)}`).join('');
    const expected = line(rows.map((r) => [r.time_s ?? 0, r.expectedLevel_m]));
    const alert = line(rows.map((r) => [r.time_s ?? 0, r.alertLevel_m]));
    const actionRows = rows.filter((r) => r.actionLevel_m !== null);
    const action = actionRows.length > 1 ? line(actionRows.map((r) => [r.time_s ?? 0, r.actionLevel_m ?? 0])) : '';
    const dayStep = Math.max(1, Math.ceil(tMax / 86400 / 8));
    const dayTicks: number[] = [];
    for (let d = 0; d * 86400 <= tMax + 1; d += dayStep) dayTicks.push(d);
    const levelStep = [0.1, 0.2, 0.25, 0.5, 1, 2, 5].find((s) => (hi - lo) / s <= 7) ?? 10;
    const levelTicks: number[] = [];
    for (let v = Math.ceil(lo / levelStep) * levelStep; v <= hi; v += levelStep) levelTicks.push(Number(v.toFixed(3)));
    const colour = { ok: '#111', alert: '#d80', action: '#c00', 'low-alert': '#0072b2', 'low-action': '#5a2d82' } as const;
    return html`<svg viewBox="0 0 ${W} ${H}" role="img" aria-label="Expected, alert and action levels at ${p.id}, with readings">
        ${levelTicks.map((v) => svg`<line x1=${L} x2=${W - R} y1=${Y(v)} y2=${Y(v)} stroke="#e3e7eb"/><text x=${L - 6} y=${Y(v) + 4} text-anchor="end">${v}</text>`)}
        ${dayTicks.map((d) => svg`<text x=${X(d * 86400)} y=${H - B + 16} text-anchor="middle">${d}</text>`)}
        <text x=${(L + W - R) / 2} y=${H - 4} text-anchor="middle">days since pumping started</text>
        <text x="12" y=${(T + H - B) / 2} transform="rotate(-90 12 ${(T + H - B) / 2})" text-anchor="middle">level (m)</text>
        <line x1=${L} x2=${L} y1=${T} y2=${H - B} stroke="#555"/><line x1=${L} x2=${W - R} y1=${H - B} y2=${H - B} stroke="#555"/>
        <path d=${expected} fill="none" stroke="#1d5a8a" stroke-width="2.5"/>
        <path d=${alert} fill="none" stroke="#d80" stroke-width="2" stroke-dasharray="7 4"/>
        ${action ? svg`<path d=${action} fill="none" stroke="#c00" stroke-width="2" stroke-dasharray="2 3"/>` : nothing}
        ${p.readings.map((r) => svg`<circle cx=${X(r.time_s)} cy=${Y(r.level_m)} r="5" fill=${colour[r.status]} stroke="#fff" stroke-width="1.5"><title>${r.measuredAt}: ${r.level_m} m (${r.status})</title></circle>`)}
      </svg>
      <div class="legend">
        <span><span class="key" style="background:#1d5a8a"></span>expected</span>
        <span><span class="key" style="background:#d80"></span>alert (expected + ${p.alertOffset_m} m)</span>
        ${p.actionLevel_m !== null ? html`<span><span class="key" style="background:#c00"></span>action ${p.actionLevel_m.toFixed(2)} m</span>` : nothing}
        <span>● readings</span>
      </div>`;
  }
}
if (!customElements.get('site-level-chart')) customElements.define('site-level-chart', SiteLevelChart);
