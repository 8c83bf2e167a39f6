/**
 * <piezometer-chart>: what the site team will be given for one piezometer — the level the design
 * expects there against time since pumping started (linear, in days, as the readings are taken),
 * the alert line (expected + alert offset) and the action level from the time it applies.
 */
import { html, svg, nothing } from 'lit';
import { LightElement } from './light-element';
import type { PiezometerPlan } from '../../shared/exports';
import { formatNumber, formatQuantity, fromSi, type DisplayUnits } from '../../shared/units';
import { linearScale, niceTicks } from './chart-axes';

const DAY_S = 86_400;

export class PiezometerChart extends LightElement {
  static override properties = {
    plan: { attribute: false }, units: { attribute: false }, staticLevel_m: { type: Number },
  };
  declare plan: PiezometerPlan | null;
  declare units: DisplayUnits;
  declare staticLevel_m: number;

  constructor() {
    super();
    this.plan = null;
    this.staticLevel_m = 0;
  }

  override render() {
    const p = this.plan;
    if (!p) return nothing;
    const u = this.units.length;
    const rows = p.series.filter((r) => r.time_s !== null && Number.isFinite(r.expectedLevel_m));
    if (rows.length < 2) {
      const r = p.series[0];
      return r ? html`<p class="dd-hint" data-pz-steady>Steady-state design: expected ${formatQuantity(r.expectedLevel_m, u, { decimals: 2 })},
        alert above ${formatQuantity(r.alertLevel_m, u, { decimals: 2 })}${r.actionLevel_m !== null ? html`, action above ${formatQuantity(r.actionLevel_m, u, { decimals: 2 })}` : nothing}.</p>` : nothing;
    }
    const W = 420, H = 210, L = 46, R = 10, T = 12, B = 30;
    const tMax = Math.max(...rows.map((r) => r.time_s ?? 0));
    const values = rows.flatMap((r) => [r.expectedLevel_m, r.alertLevel_m]).concat([this.staticLevel_m], p.actionLevel_m !== null ? [p.actionLevel_m] : []);
    const lo = Math.min(...values);
    const hi = Math.max(...values);
    const pad = Math.max((hi - lo) * 0.08, 0.05);
    const x = linearScale(0, tMax / DAY_S, L, W - R);
    const y = linearScale(fromSi(lo - pad, u), fromSi(hi + pad, u), H - B, T);
    const line = (pts: Array<[number, number]>) => pts.map(([t, v], i) => `${i ? 'L' : 'M'}${x(t / DAY_S).toFixed(1)},${y(fromSi(v, u)).toFixed(1)}`).join('');
    const expected = line(rows.map((r) => [r.time_s ?? 0, r.expectedLevel_m]));
    const alert = line(rows.map((r) => [r.time_s ?? 0, r.alertLevel_m]));
    const actionFrom = Math.min(p.actionFrom_s, tMax);
    const yTicks = niceTicks(fromSi(lo - pad, u), fromSi(hi + pad, u), 5);
    const dayTicks = niceTicks(0, tMax / DAY_S, 7);
    const yStatic = y(fromSi(this.staticLevel_m, u));
    // The action level applies from the design time on; before then it is drawn faint, so the
    // designer still sees where it stands when the design time is the end of the table.
    const yAction = p.actionLevel_m === null ? 0 : y(fromSi(p.actionLevel_m, u));
    return html`<svg class="dd-chart dd-pz-chart" viewBox="0 0 ${W} ${H}" role="img" aria-label="Expected, alert and action levels at ${p.id} against time">
      ${yTicks.map((v) => svg`<line class="dd-grid" x1=${L} x2=${W - R} y1=${y(v)} y2=${y(v)}></line><text class="dd-tick" x=${L - 4} y=${y(v) + 3} text-anchor="end">${formatNumber(v, { significant: 4 })}</text>`)}
      ${dayTicks.map((d) => svg`<line class="dd-grid" x1=${x(d)} x2=${x(d)} y1=${T} y2=${H - B}></line><text class="dd-tick" x=${x(d)} y=${H - B + 13} text-anchor="middle">${formatNumber(d, { significant: 3 })}</text>`)}
      <line class="dd-static" x1=${L} x2=${W - R} y1=${yStatic} y2=${yStatic}></line>
      ${p.actionLevel_m !== null ? svg`<line class="dd-pz-action dd-pz-action-before" x1=${L} x2=${x(actionFrom / DAY_S)} y1=${yAction} y2=${yAction}></line>
        <line class="dd-pz-action" x1=${Math.min(x(actionFrom / DAY_S), W - R - 24)} x2=${W - R} y1=${yAction} y2=${yAction}></line>
        <text class="dd-tick dd-pz-action-label" x=${W - R} y=${yAction + 11} text-anchor="end">action</text>` : nothing}
      <path class="dd-pz-alert" d=${alert}></path>
      <path class="dd-curve dd-pz-expected" d=${expected}></path>
      ${p.actionFrom_s > 0 && p.actionFrom_s <= tMax ? svg`<line class="dd-now" x1=${x(p.actionFrom_s / DAY_S)} x2=${x(p.actionFrom_s / DAY_S)} y1=${T} y2=${H - B}></line>` : nothing}
      <text class="dd-axis" x=${12} y=${T + (H - B - T) / 2} transform="rotate(-90 12 ${T + (H - B - T) / 2})" text-anchor="middle">level (${u})</text>
      <text class="dd-axis" x=${L + (W - R - L) / 2} y=${H - 3} text-anchor="middle">days since pumping started</text>
    </svg>
    <ul class="dd-pz-key">
      <li><span class="dd-pz-key-expected"></span>expected</li>
      <li><span class="dd-pz-key-alert"></span>alert: expected + ${formatQuantity(p.alertOffset_m, u, { decimals: 2 })}</li>
      ${p.actionLevel_m !== null ? html`<li><span class="dd-pz-key-action"></span>action ${formatQuantity(p.actionLevel_m, u, { decimals: 2 })}${p.actionFrom_s > 0 ? ` from day ${formatNumber(p.actionFrom_s / DAY_S, { significant: 3 })} (design time)` : ''}</li>` : nothing}
    </ul>`;
  }
}
if (!customElements.get('piezometer-chart')) customElements.define('piezometer-chart', PiezometerChart);
