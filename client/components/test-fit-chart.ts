/**
 * <test-fit-chart>: a pumping-test plot — the readings as marks per well and the fitted curve —
 * on log–log axes (drawdown against time: the type-curve view), semi-log axes (drawdown against
 * log time: the straight-line view) or as residuals against log time.
 */
import { html, svg, nothing } from 'lit';
import { LightElement } from './light-element';
import type { PumpingTestFit } from '../../shared/testing';
import { fromSi, formatNumber, type DisplayUnits } from '../../shared/units';
import { linearScale, niceTicks } from './chart-axes';
import { formatDuration } from './time-format';

/** Which view of the test. */
export type TestChartView = 'log-log' | 'semi-log' | 'residuals';

/** A reading to plot. */
export interface PlottedReading {
  well: string;
  time_s: number;
  drawdown_m: number;
  /** Absent: pumping. */
  phase?: 'pumping' | 'recovery';
}

const MARKS = ['circle', 'square', 'triangle', 'diamond'] as const;

function mark(kind: (typeof MARKS)[number], cx: number, cy: number) {
  const r = 3.2;
  switch (kind) {
    case 'square':
      return svg`<rect x=${cx - r} y=${cy - r} width=${2 * r} height=${2 * r} class="dd-test-mark"></rect>`;
    case 'triangle':
      return svg`<path d=${`M${cx},${cy - r * 1.2}L${cx + r * 1.1},${cy + r}L${cx - r * 1.1},${cy + r}Z`} class="dd-test-mark"></path>`;
    case 'diamond':
      return svg`<path d=${`M${cx},${cy - r * 1.3}L${cx + r},${cy}L${cx},${cy + r * 1.3}L${cx - r},${cy}Z`} class="dd-test-mark"></path>`;
    default:
      return svg`<circle cx=${cx} cy=${cy} r=${r} class="dd-test-mark"></circle>`;
  }
}

function legend(wells: string[], x0: number, y0: number) {
  return wells.map((w, i) => svg`<g transform=${`translate(${x0} ${y0 + i * 14})`}>${mark(MARKS[i % MARKS.length]!, 0, -3)}<text class="dd-tick" x="8" y="0">${w}</text></g>`);
}

export class TestFitChart extends LightElement {
  static override properties = { readings: { attribute: false }, fit: { attribute: false }, view: { type: String }, units: { attribute: false }, stop_s: { attribute: false } };
  declare readings: PlottedReading[];
  /** Pump stop time, s (the recovery view plots against t/t′). */
  declare stop_s: number | null;
  declare fit: PumpingTestFit | null;
  declare view: TestChartView;
  declare units: DisplayUnits;

  constructor() {
    super();
    this.readings = [];
    this.fit = null;
    this.view = 'log-log';
    this.stop_s = null;
  }

  override render() {
    if (this.fit?.method === 'recovery' && this.view === 'semi-log' && this.stop_s !== null) return this.renderRecovery(this.stop_s);
    const W = 440, H = 220, L = 52, R = 10, T = 12, B = 32;
    const u = this.units.length;
    const fit = this.fit;
    const residualView = this.view === 'residuals';
    const data = residualView
      ? (fit?.residuals ?? []).map((r) => ({ well: r.well, time_s: r.time_s, value: r.residual_m }))
      : this.readings.filter((r) => r.time_s > 0 && r.phase !== 'recovery' && (this.view === 'semi-log' || r.drawdown_m > 0)).map((r) => ({ well: r.well, time_s: r.time_s, value: r.drawdown_m }));
    if (data.length < 2) return html`<p class="dd-hint">No readings to plot.</p>`;
    const curves = residualView || !fit || fit.method === 'step' || fit.method === 'recovery' ? [] : fit.curve;
    const times = data.map((d) => d.time_s).concat(curves.flatMap((c) => c.points.map((p) => p.time_s)));
    const t0 = Math.log10(Math.min(...times));
    const t1 = Math.log10(Math.max(...times));
    const logY = this.view === 'log-log';
    const values = data.map((d) => fromSi(d.value, u)).concat(curves.flatMap((c) => c.points.map((p) => fromSi(p.drawdown_m, u)))).filter((v) => !logY || v > 0);
    let lo = Math.min(...values, residualView ? 0 : Infinity);
    let hi = Math.max(...values, residualView ? 0 : -Infinity);
    if (logY) {
      lo = Math.log10(lo);
      hi = Math.log10(hi);
    }
    const pad = Math.max((hi - lo) * 0.08, logY ? 0.05 : 0.005);
    const x = linearScale(t0, t1 + 1e-9, L, W - R);
    const y = linearScale(lo - pad, hi + pad, H - B, T);
    const yOf = (v_si: number) => {
      const v = fromSi(v_si, u);
      return y(logY ? Math.log10(Math.max(v, 1e-12)) : v);
    };
    const wells = [...new Set(data.map((d) => d.well))];
    const decades: number[] = [];
    for (let d = Math.ceil(t0); d <= Math.floor(t1); d++) decades.push(d);
    const yTicks = logY ? Array.from({ length: Math.floor(hi + pad) - Math.ceil(lo - pad) + 1 }, (_, k) => Math.ceil(lo - pad) + k) : niceTicks(lo - pad, hi + pad, 5);
    const line = fit?.line && this.view === 'semi-log' && fit.method === 'cooper-jacob' && fit.line.zeroDrawdownAbscissa !== null ? fit.line : null;
    // Cooper–Jacob line for one well at distance r: s = a + b·log10(t/r²).
    const r2 = fit?.curve[0]?.distance_m ? fit.curve[0].distance_m ** 2 : 1;
    const linePath = line
      ? [t0, t1].map((lt, i) => `${i ? 'L' : 'M'}${x(lt).toFixed(1)},${yOf(line.intercept_m + line.slope_m_per_log_cycle * (lt - Math.log10(r2))).toFixed(1)}`).join('')
      : '';
    const label = residualView ? `Residual (${u})` : `Drawdown (${u})`;
    return html`<svg class="dd-chart dd-test-chart" viewBox="0 0 ${W} ${H}" role="img" aria-label=${`Pumping test, ${this.view}`} data-view=${this.view}>
      ${decades.map((d) => svg`<line class="dd-grid" x1=${x(d)} x2=${x(d)} y1=${T} y2=${H - B}></line><text class="dd-tick" x=${x(d)} y=${H - B + 14} text-anchor="middle">${formatDuration(10 ** d)}</text>`)}
      ${yTicks.map((v) => svg`<line class="dd-grid" x1=${L} x2=${W - R} y1=${y(v)} y2=${y(v)}></line><text class="dd-tick" x=${L - 4} y=${y(v) + 3} text-anchor="end">${logY ? formatNumber(10 ** v, { significant: 2 }) : formatNumber(v, { significant: 3 })}</text>`)}
      ${residualView ? svg`<line class="dd-axis" x1=${L} x2=${W - R} y1=${y(0)} y2=${y(0)}></line>` : nothing}
      ${curves.map((c) => svg`<path class="dd-test-curve" d=${c.points.map((p, i) => `${i ? 'L' : 'M'}${x(Math.log10(p.time_s)).toFixed(1)},${yOf(p.drawdown_m).toFixed(1)}`).join('')}></path>`)}
      ${line ? svg`<path class="dd-test-line" d=${linePath}></path>` : nothing}
      ${data.map((d) => mark(MARKS[wells.indexOf(d.well) % MARKS.length]!, x(Math.log10(d.time_s)), yOf(d.value)))}
      <text class="dd-axis-label" x=${L} y=${H - 4}>time since pumping started (log)</text>
      <text class="dd-axis-label" transform=${`translate(12 ${(T + H - B) / 2}) rotate(-90)`} text-anchor="middle">${label}</text>
      ${legend(wells, W - R - 70, H - B - 8 - 14 * wells.length)}
    </svg>`;
  }

  /** Residual drawdown s′ against log₁₀(t/t′) with the fitted recovery line (Theis 1935). */
  private renderRecovery(stop_s: number) {
    const W = 440, H = 220, L = 52, R = 10, T = 12, B = 32;
    const u = this.units.length;
    const line = this.fit!.line!;
    const data = this.readings.filter((r) => r.time_s > stop_s).map((r) => ({ well: r.well, x: Math.log10(r.time_s / (r.time_s - stop_s)), value: fromSi(r.drawdown_m, u) }));
    if (data.length < 2) return html`<p class="dd-hint">No recovery readings to plot.</p>`;
    const x1 = Math.max(...data.map((d) => d.x));
    const hi = Math.max(...data.map((d) => d.value), fromSi(line.intercept_m + line.slope_m_per_log_cycle * x1, u));
    const lo = Math.min(0, ...data.map((d) => d.value));
    const x = linearScale(0, x1 * 1.05, L, W - R);
    const y = linearScale(lo, hi * 1.08, H - B, T);
    const wells = [...new Set(data.map((d) => d.well))];
    const xTicks = niceTicks(0, x1 * 1.05, 5).filter((v) => v >= 0);
    return html`<svg class="dd-chart dd-test-chart" viewBox="0 0 ${W} ${H}" role="img" aria-label="Recovery: residual drawdown against t/t′" data-view="recovery">
      ${xTicks.map((v) => svg`<line class="dd-grid" x1=${x(v)} x2=${x(v)} y1=${T} y2=${H - B}></line><text class="dd-tick" x=${x(v)} y=${H - B + 14} text-anchor="middle">${formatNumber(10 ** v, { significant: 2 })}</text>`)}
      ${niceTicks(lo, hi * 1.08, 5).map((v) => svg`<line class="dd-grid" x1=${L} x2=${W - R} y1=${y(v)} y2=${y(v)}></line><text class="dd-tick" x=${L - 4} y=${y(v) + 3} text-anchor="end">${formatNumber(v, { significant: 3 })}</text>`)}
      <path class="dd-test-line" d=${`M${x(0)},${y(fromSi(line.intercept_m, u))}L${x(x1)},${y(fromSi(line.intercept_m + line.slope_m_per_log_cycle * x1, u))}`}></path>
      ${data.map((d) => mark(MARKS[wells.indexOf(d.well) % MARKS.length]!, x(d.x), y(d.value)))}
      <text class="dd-axis-label" x=${L} y=${H - 4}>t/t′ (log): time since start / time since stop</text>
      <text class="dd-axis-label" transform=${`translate(12 ${(T + H - B) / 2}) rotate(-90)`} text-anchor="middle">Residual drawdown (${u})</text>
      ${legend(wells, L + 8, T + 8)}
    </svg>`;
  }
}

if (!customElements.get('test-fit-chart')) customElements.define('test-fit-chart', TestFitChart);
