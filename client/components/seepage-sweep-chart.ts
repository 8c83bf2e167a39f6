/**
 * <seepage-sweep-chart>: the wall-toe sweep — flow (L/s per m) and exit-gradient FS against the
 * toe level — with the required factor as a line.
 */
import { html, svg, nothing } from 'lit';
import type { SectionOptionRow } from '../../shared/section';
import { LightElement } from './light-element';

const W = 320;
const H = 170;
const M = { l: 46, r: 46, t: 12, b: 34 };

export class SeepageSweepChart extends LightElement {
  static override properties = { rows: { attribute: false }, requiredFS: { type: Number } };
  declare rows: SectionOptionRow[];
  declare requiredFS: number;

  constructor() {
    super();
    this.rows = [];
    this.requiredFS = 1.5;
  }

  override render() {
    const rows = this.rows.filter((r) => r.toe_m !== null);
    if (rows.length < 2) return nothing;
    const toes = rows.map((r) => r.toe_m!);
    const flows = rows.map((r) => r.flow * 1000);
    const fss = rows.map((r) => r.exitFS ?? 0);
    const [t0, t1] = [Math.min(...toes), Math.max(...toes)];
    const qMax = Math.max(...flows) * 1.1 || 1;
    const fMax = Math.max(this.requiredFS, ...fss) * 1.1;
    const x = (t: number) => M.l + ((t1 - t) / (t1 - t0 || 1)) * (W - M.l - M.r);
    const yq = (q: number) => H - M.b - (q / qMax) * (H - M.t - M.b);
    const yf = (f: number) => H - M.b - (f / fMax) * (H - M.t - M.b);
    const line = (ys: number[], yOf: (v: number) => number) => rows.map((r, i) => `${x(r.toe_m!).toFixed(1)},${yOf(ys[i]!).toFixed(1)}`).join(' ');
    return html`<svg class="dd-seepage-sweep" viewBox="0 0 ${W} ${H}" role="img" aria-label="Wall toe sweep: flow and exit-gradient factor of safety against toe level">
      <line x1=${M.l} x2=${W - M.r} y1=${H - M.b} y2=${H - M.b} stroke="#7a848c"></line>
      ${rows.map((r) => svg`<text x=${x(r.toe_m!)} y=${H - M.b + 14} font-size="10" text-anchor="middle">${r.toe_m}</text>`)}
      <text x=${W / 2} y=${H - 4} font-size="10" text-anchor="middle">wall toe level, m (deeper →)</text>
      <text x=${4} y=${M.t + 8} font-size="10" fill="#0072b2">${qMax.toPrecision(2)} L/s/m</text>
      <text x=${W - 4} y=${M.t + 8} font-size="10" fill="#d55e00" text-anchor="end">FS ${fMax.toFixed(1)}</text>
      <line x1=${M.l} x2=${W - M.r} y1=${yf(this.requiredFS)} y2=${yf(this.requiredFS)} stroke="#d55e00" stroke-dasharray="3 3"><title>required FS ${this.requiredFS}</title></line>
      <polyline points=${line(flows, yq)} fill="none" stroke="#0072b2" stroke-width="2"></polyline>
      <polyline points=${line(fss, yf)} fill="none" stroke="#d55e00" stroke-width="2"></polyline>
      ${rows.map((r, i) => svg`<circle cx=${x(r.toe_m!)} cy=${yq(flows[i]!)} r="3" fill="#0072b2"></circle><circle cx=${x(r.toe_m!)} cy=${yf(fss[i]!)} r="3" fill="#d55e00"></circle>`)}
    </svg>`;
  }
}

customElements.define('seepage-sweep-chart', SeepageSweepChart);
