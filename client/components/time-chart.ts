/**
 * <time-chart>: groundwater level against time (log axis) at an inspected point, with the static
 * level and, inside an excavation, its target level — where the curve crosses the target is when
 * the pit can be dug to formation.
 */
import { html, svg, nothing } from 'lit';
import { LightElement } from './light-element';
import type { SeriesSample } from '../../shared/field';
import { fromSi, formatNumber, type DisplayUnits } from '../../shared/units';
import { linearScale, niceTicks } from './chart-axes';
import { formatDuration } from './time-format';

export class TimeChart extends LightElement {
  static override properties = {
    series: { attribute: false }, units: { attribute: false }, staticLevel_m: { type: Number },
    target_m: { attribute: false }, current_s: { attribute: false },
  };
  declare series: SeriesSample[];
  declare units: DisplayUnits;
  declare staticLevel_m: number;
  declare target_m: number | null;
  declare current_s: number | null;

  constructor() {
    super();
    this.series = [];
    this.staticLevel_m = 0;
    this.target_m = null;
    this.current_s = null;
  }

  override render() {
    const pts = this.series.filter((p) => p.time_s > 0);
    if (pts.length < 2) return html`<p class="dd-hint">Steady state: no time curve.</p>`;
    const W = 420, H = 200, L = 46, R = 10, T = 12, B = 30;
    const u = this.units.length;
    const t0 = Math.log10(pts[0]!.time_s);
    const t1 = Math.log10(pts[pts.length - 1]!.time_s);
    const values = pts.map((p) => p.level_m).concat([this.staticLevel_m], this.target_m !== null ? [this.target_m] : []);
    const lo = Math.min(...values);
    const hi = Math.max(...values);
    const pad = Math.max((hi - lo) * 0.08, 0.05);
    const x = linearScale(t0, t1, L, W - R);
    const y = linearScale(fromSi(lo - pad, u), fromSi(hi + pad, u), H - B, T);
    const path = pts.map((p, i) => `${i ? 'L' : 'M'}${x(Math.log10(p.time_s)).toFixed(1)},${y(fromSi(p.level_m, u)).toFixed(1)}`).join('');
    const decades: number[] = [];
    for (let d = Math.ceil(t0); d <= Math.floor(t1); d++) decades.push(d);
    const yTicks = niceTicks(fromSi(lo - pad, u), fromSi(hi + pad, u), 5);
    const cur = this.current_s && this.current_s > 0 ? Math.log10(this.current_s) : null;
    return html`<svg class="dd-chart" viewBox="0 0 ${W} ${H}" role="img" aria-label="Level against time">
      ${yTicks.map((v) => svg`<line class="dd-grid" x1=${L} x2=${W - R} y1=${y(v)} y2=${y(v)}></line><text class="dd-tick" x=${L - 4} y=${y(v) + 3} text-anchor="end">${formatNumber(v, { significant: 4 })}</text>`)}
      ${decades.map((d) => svg`<line class="dd-grid" x1=${x(d)} x2=${x(d)} y1=${T} y2=${H - B}></line><text class="dd-tick" x=${x(d)} y=${H - B + 13} text-anchor="middle">${formatDuration(10 ** d)}</text>`)}
      <line class="dd-static" x1=${L} x2=${W - R} y1=${y(fromSi(this.staticLevel_m, u))} y2=${y(fromSi(this.staticLevel_m, u))}></line>
      ${this.target_m !== null ? svg`<line class="dd-target" x1=${L} x2=${W - R} y1=${y(fromSi(this.target_m, u))} y2=${y(fromSi(this.target_m, u))}></line>
        <text class="dd-tick dd-target-label" x=${W - R} y=${y(fromSi(this.target_m, u)) - 3} text-anchor="end">target</text>` : nothing}
      <path class="dd-curve" d=${path}></path>
      ${cur !== null && cur >= t0 && cur <= t1 ? svg`<line class="dd-now" x1=${x(cur)} x2=${x(cur)} y1=${T} y2=${H - B}></line>` : nothing}
      <text class="dd-axis" x=${12} y=${T + (H - B - T) / 2} transform="rotate(-90 12 ${T + (H - B - T) / 2})" text-anchor="middle">level (${u})</text>
      <text class="dd-axis" x=${L + (W - R - L) / 2} y=${H - 3} text-anchor="middle">time since pumping started (log)</text>
    </svg>`;
  }
}
if (!customElements.get('time-chart')) customElements.define('time-chart', TimeChart);
