/**
 * The design's answers to the unknowns: the sensitivity table with its chart (re-solved total
 * flow against the factor on K or S, log scale; hollow marks where the chosen rates no longer meet
 * the targets), the Monte Carlo summary with a histogram of the re-solved total flow and the
 * P50/P90 marks, and the robust design options with the extra flow each costs.
 */
import { html, nothing, svg } from 'lit';
import { LightElement } from './light-element';
import type { DesignResult } from '../../shared/design/design-result';
import type { SensitivityRow } from '../../shared/design/uncertainty-result';
import { linearScale, niceTicks } from './chart-axes';

const W = 420;
const H = 190;
const PAD = { left: 50, right: 10, top: 12, bottom: 32 };

const PARAMETER_TEXT: Record<SensitivityRow['parameter'], string> = { conductivity: 'K', storage: 'S' };
const ROBUST_TEXT = { 'one-well-out': 'Any one well out (N − 1)', 'conductivity-range': 'K within a factor' } as const;

/** A factor as people say it: ÷3, ×1, ×2. */
export function factorText(f: number): string {
  if (f >= 1) return `×${Number(f.toPrecision(3))}`;
  return `÷${Number((1 / f).toPrecision(3))}`;
}

const pct = (v: number) => `${(v * 100).toFixed(1)} %`;

export class UncertaintyView extends LightElement {
  static override properties = { result: { attribute: false }, formatFlow: { attribute: false }, formatShortfall: { attribute: false } };
  declare result: DesignResult | null;
  /** A flow in the display unit. */
  declare formatFlow: (q_m3_s: number) => string;
  /** A level difference in the display unit, signed. */
  declare formatShortfall: (value_m: number) => string;

  constructor() {
    super();
    this.result = null;
    this.formatFlow = (q) => `${(q * 1000).toFixed(2)} L/s`;
    this.formatShortfall = (v) => `${v > 0 ? '+' : ''}${(v * 100).toFixed(1)} cm`;
  }

  override render() {
    const r = this.result;
    if (!r || (!r.sensitivity && !r.uncertainty && !r.robust)) return nothing;
    return html`${r.sensitivity ? this.renderSensitivity(r) : nothing}${r.uncertainty ? this.renderMonteCarlo(r) : nothing}${r.robust ? this.renderRobust(r) : nothing}`;
  }

  private renderSensitivity(r: DesignResult) {
    const t = r.sensitivity!;
    return html`<h3>Sensitivity <small>the design’s rates with K or S scaled; flow re-solved</small></h3>
      <table class="dd-design-table dd-sensitivity" data-sensitivity>
        <thead><tr><th>scaled</th><th>factor</th><th>flow needed</th><th>rates still meet target</th><th>worst shortfall</th><th>uplift FS</th></tr></thead>
        <tbody>${t.rows.map(
          (row) => html`<tr data-parameter=${row.parameter} data-factor=${String(row.factor)}>
            <td>${PARAMETER_TEXT[row.parameter]}</td><td>${factorText(row.factor)}</td>
            <td>${row.totalRate_m3_s === null ? html`<span class="dd-bad">none within the well limits</span>` : this.formatFlow(row.totalRate_m3_s)}</td>
            <td class=${row.met ? 'dd-good' : 'dd-bad'}>${row.met ? 'yes' : 'no'}</td>
            <td>${row.worstShortfall_m === null ? '—' : this.formatShortfall(row.worstShortfall_m)}</td>
            <td>${row.upliftFS === null ? '—' : row.upliftFS.toFixed(3)}</td></tr>`,
        )}</tbody></table>
      ${this.sensitivityChart(t.rows, r.totalRate_m3_s)}
      <p class="dd-hint">${t.note}</p>`;
  }

  private sensitivityChart(rows: SensitivityRow[], design_m3_s: number) {
    const solved = rows.filter((row) => row.totalRate_m3_s !== null);
    if (solved.length < 2) return nothing;
    const f0 = Math.log10(Math.min(...rows.map((row) => row.factor)));
    const f1 = Math.log10(Math.max(...rows.map((row) => row.factor)));
    const flows = [...solved.map((row) => row.totalRate_m3_s! * 1000), design_m3_s * 1000];
    const hi = Math.max(...flows) * 1.1;
    const x = linearScale(f0, f1 === f0 ? f0 + 1 : f1, PAD.left, W - PAD.right);
    const y = linearScale(0, hi, H - PAD.bottom, PAD.top);
    const series = (['conductivity', 'storage'] as const).map((p) => ({ p, pts: rows.filter((row) => row.parameter === p) })).filter((s) => s.pts.length > 0);
    return html`<svg class="dd-chart dd-sensitivity-chart" viewBox="0 0 ${W} ${H}" role="img" aria-label="Sensitivity chart: total flow needed against the factor on K and on S">
      ${niceTicks(0, hi, 5).map((v) => svg`<line class="dd-grid" x1=${PAD.left} x2=${W - PAD.right} y1=${y(v)} y2=${y(v)}></line><text class="dd-tick" x=${PAD.left - 4} y=${y(v) + 3} text-anchor="end">${Number(v.toPrecision(3))}</text>`)}
      ${rows.filter((row) => row.parameter === series[0]!.p).map((row) => svg`<line class="dd-grid" x1=${x(Math.log10(row.factor))} x2=${x(Math.log10(row.factor))} y1=${PAD.top} y2=${H - PAD.bottom}></line><text class="dd-tick" x=${x(Math.log10(row.factor))} y=${H - PAD.bottom + 13} text-anchor="middle">${factorText(row.factor)}</text>`)}
      <line class="dd-target" x1=${PAD.left} x2=${W - PAD.right} y1=${y(design_m3_s * 1000)} y2=${y(design_m3_s * 1000)}></line>
      ${series.map(({ p, pts }) => {
        const path = pts.filter((row) => row.totalRate_m3_s !== null).map((row, i) => `${i ? 'L' : 'M'}${x(Math.log10(row.factor)).toFixed(1)},${y(row.totalRate_m3_s! * 1000).toFixed(1)}`).join('');
        return svg`<path class=${`dd-sens-${p}`} d=${path}></path>
          ${pts.filter((row) => row.totalRate_m3_s !== null).map((row) => svg`<circle class=${`dd-sens-${p} ${row.met ? 'dd-sens-met' : 'dd-sens-short'}`} cx=${x(Math.log10(row.factor))} cy=${y(row.totalRate_m3_s! * 1000)} r="3.5"><title>${PARAMETER_TEXT[p]} ${factorText(row.factor)}: ${this.formatFlow(row.totalRate_m3_s!)}; the design’s rates ${row.met ? 'still meet' : 'miss'} the target</title></circle>`)}
          ${pts.filter((row) => row.totalRate_m3_s === null).map((row) => svg`<text class="dd-sens-none" x=${x(Math.log10(row.factor))} y=${PAD.top + 10} text-anchor="middle">✗</text>`)}`;
      })}
      <text class="dd-axis" x=${12} y=${PAD.top + (H - PAD.bottom - PAD.top) / 2} transform="rotate(-90 12 ${PAD.top + (H - PAD.bottom - PAD.top) / 2})" text-anchor="middle">flow needed (L/s)</text>
      <text class="dd-axis" x=${PAD.left + (W - PAD.right - PAD.left) / 2} y=${H - 3} text-anchor="middle">factor on the parameter (log)</text>
    </svg>
    <ul class="dd-section-key">
      <li><span class="dd-k dd-k-sens-conductivity"></span>K scaled</li>
      ${series.length > 1 ? html`<li><span class="dd-k dd-k-sens-storage"></span>S scaled</li>` : nothing}
      <li><span class="dd-k dd-k-target"></span>the design’s total</li>
      <li>hollow mark: the design’s rates miss the target; ✗: no rates within the well limits</li>
    </ul>`;
  }

  private renderMonteCarlo(r: DesignResult) {
    const u = r.uncertainty!;
    const p = u.totalRate_m3_s;
    return html`<h3>Monte Carlo <small>${u.runs} realisations, seed ${u.seed}</small></h3>
      <dl class="dd-design-kv" data-monte-carlo>
        <dt>Chosen rates meet every target</dt><dd data-probability-met class=${u.probabilityMet >= 0.9 ? 'dd-good' : 'dd-bad'}>${pct(u.probabilityMet)} of realisations</dd>
        <dt>Flow needed, P50 / P90</dt><dd data-p50-p90>${p.p50 === null ? '—' : this.formatFlow(p.p50)} / ${p.p90 === null ? 'more than 10 % have no feasible design' : this.formatFlow(p.p90)}</dd>
        <dt>Feasible within the well limits</dt><dd>${pct(u.feasibleShare)}</dd>
        <dt>K spread (geometric sd)</dt><dd>${u.kSpread.toPrecision(3)} (${u.kSpreadSource === 'pumping-test' ? 'from the pumping test' : u.kSpreadSource === 'default' ? 'placeholder' : 'given'})${u.sSpread > 1 ? `; S ${u.sSpread.toPrecision(3)}` : ''}</dd>
        ${u.bidAtP90 ? html`<dt>Bid at P90 (${u.bidAtP90.currency})</dt><dd data-bid-p90>${Math.round(u.bidAtP90.totalCost).toLocaleString('en-GB')} ${u.bidAtP90.currency}</dd>` : nothing}
        <dt>Run time</dt><dd>${(u.elapsed_ms / 1000).toFixed(1)} s on ${u.workers === 0 ? 'the server thread' : `${u.workers} worker threads`}</dd>
      </dl>
      ${this.histogram(r)}
      <p class="dd-hint">${u.note}</p>`;
  }

  private histogram(r: DesignResult) {
    const u = r.uncertainty!;
    const bins = u.histogram;
    if (bins.length === 0) return nothing;
    const lo = bins[0]!.from_m3_s * 1000;
    const hiFlow = bins.at(-1)!.to_m3_s * 1000;
    const top = Math.max(...bins.map((b) => b.count));
    const x = linearScale(lo, hiFlow === lo ? lo + 1 : hiFlow, PAD.left, W - PAD.right);
    const y = linearScale(0, top * 1.1, H - PAD.bottom, PAD.top);
    const marks = [
      { v: u.totalRate_m3_s.p50, label: 'P50' },
      { v: u.totalRate_m3_s.p90, label: 'P90' },
      { v: r.totalRate_m3_s, label: 'design' },
    ].filter((m): m is { v: number; label: string } => m.v !== null && m.v * 1000 >= lo && m.v * 1000 <= hiFlow);
    return html`<svg class="dd-chart dd-histogram" viewBox="0 0 ${W} ${H}" role="img" aria-label="Histogram of the re-solved total flow over the realisations">
      ${niceTicks(0, top * 1.1, 4).map((v) => svg`<line class="dd-grid" x1=${PAD.left} x2=${W - PAD.right} y1=${y(v)} y2=${y(v)}></line><text class="dd-tick" x=${PAD.left - 4} y=${y(v) + 3} text-anchor="end">${v}</text>`)}
      ${bins.map((b) => svg`<rect class="dd-hist-bar" x=${x(b.from_m3_s * 1000) + 0.5} width=${Math.max(0.5, x(b.to_m3_s * 1000) - x(b.from_m3_s * 1000) - 1)} y=${y(b.count)} height=${y(0) - y(b.count)}><title>${this.formatFlow(b.from_m3_s)} – ${this.formatFlow(b.to_m3_s)}: ${b.count}</title></rect>`)}
      ${niceTicks(lo, hiFlow, 5).map((v) => svg`<text class="dd-tick" x=${x(v)} y=${H - PAD.bottom + 13} text-anchor="middle">${Number(v.toPrecision(3))}</text>`)}
      ${marks.map((m, k) => svg`<line class=${`dd-hist-mark dd-hist-${m.label}`} x1=${x(m.v * 1000)} x2=${x(m.v * 1000)} y1=${PAD.top} y2=${H - PAD.bottom}></line><text class="dd-tick" x=${x(m.v * 1000) + 2} y=${PAD.top + 9 + 11 * k}>${m.label}</text>`)}
      <text class="dd-axis" x=${12} y=${PAD.top + (H - PAD.bottom - PAD.top) / 2} transform="rotate(-90 12 ${PAD.top + (H - PAD.bottom - PAD.top) / 2})" text-anchor="middle">realisations</text>
      <text class="dd-axis" x=${PAD.left + (W - PAD.right - PAD.left) / 2} y=${H - 3} text-anchor="middle">total flow needed (L/s)</text>
    </svg>`;
  }

  private renderRobust(r: DesignResult) {
    return html`<h3>Robust designs <small>beside the ordinary design (${this.formatFlow(r.totalRate_m3_s)})</small></h3>
      <table class="dd-design-table" data-robust>
        <thead><tr><th>meets the target with</th><th>total flow</th><th>extra flow</th><th>governing case</th></tr></thead>
        <tbody>${r.robust!.map(
          (d) => html`<tr data-kind=${d.kind}><td>${ROBUST_TEXT[d.kind]}${d.conductivityFactor !== undefined ? ` (÷/× ${Number(d.conductivityFactor.toPrecision(3))})` : ''}</td>
            <td>${d.totalRate_m3_s === null ? html`<span class="dd-bad">not feasible</span>` : this.formatFlow(d.totalRate_m3_s)}</td>
            <td>${d.extraRate_m3_s === null ? '—' : `+${this.formatFlow(d.extraRate_m3_s)} (${pct(d.extraShare ?? 0)})`}</td>
            <td title=${d.note}>${d.worstCase}</td></tr>`,
        )}</tbody></table>`;
  }
}
if (!customElements.get('uncertainty-view')) customElements.define('uncertainty-view', UncertaintyView);
