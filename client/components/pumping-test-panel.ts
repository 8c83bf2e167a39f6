/**
 * <pumping-test-panel>: turns a pumping test's readings into aquifer parameters. The designer
 * opens (or pastes) a readings CSV, gives the rate and, where the file has none, the distance
 * and the stop time; the analysis (POST /api/v1/pumping-test, the shared engine) fits every
 * method that applies. The table shows each fit with its interval, RMSE and validity; the plots
 * show the readings against the chosen fit; one action applies T (as K = T / b), S or Sy, B and
 * C to the scenario — undoable — and keeps the interval of K for the uncertainty analysis.
 * Hazen's grain-size estimate sits beside, so test and grading are seen together.
 */
import { html, nothing } from 'lit';
import { LightElement } from './light-element';
import type { Scenario } from '../../shared/schema';
import { applyTestParameters, hazenConductivity, METHOD_LABELS, parseReadingsCsv, saturatedThickness, type PumpingTestFit, type PumpingTestResult } from '../../shared/testing';
import { formatNumber, formatQuantity, fromSi, toSi, type DisplayUnits, type UnitId } from '../../shared/units';
import type { ScenarioStore } from '../state';
import type { PlottedReading, TestChartView } from './test-fit-chart';
import './test-fit-chart';
import './caution-note';

const RATE_UNITS: UnitId[] = ['L/s', 'm³/h', 'gpm', 'm³/s'];

const fmt = (v: number | null | undefined, significant = 3) => (v === null || v === undefined ? '—' : formatNumber(v, { significant }));
const range = (r: [number, number] | undefined, significant = 3) => (r ? `${fmt(r[0], significant)} … ${fmt(r[1], significant)}` : '—');

export class PumpingTestPanel extends LightElement {
  static override properties = {
    store: { attribute: false }, scenario: { attribute: false }, units: { attribute: false }, apiBase: { type: String }, shown: { type: Boolean },
    csv: { state: true }, fileName: { state: true }, rateText: { state: true }, rateUnit: { state: true }, distanceText: { state: true },
    stopText: { state: true }, result: { state: true }, readings: { state: true }, selected: { state: true }, view: { state: true },
    error: { state: true }, busy: { state: true }, message: { state: true }, d10Text: { state: true }, cuText: { state: true }, wellId: { state: true },
  };
  declare store: ScenarioStore | undefined;
  declare scenario: Scenario | undefined;
  declare units: DisplayUnits;
  declare apiBase: string;
  /** True while its tab is shown: the caution note exists only then (one caution per visible panel). */
  declare shown: boolean;
  declare csv: string;
  declare fileName: string;
  declare rateText: string;
  declare rateUnit: UnitId;
  declare distanceText: string;
  declare stopText: string;
  declare result: PumpingTestResult | null;
  declare readings: PlottedReading[];
  declare selected: number;
  declare view: TestChartView;
  declare error: string;
  declare busy: boolean;
  declare message: string;
  declare d10Text: string;
  declare cuText: string;
  declare wellId: string;

  constructor() {
    super();
    this.apiBase = '';
    this.shown = true;
    this.csv = '';
    this.fileName = '';
    this.rateText = '';
    this.rateUnit = 'L/s';
    this.distanceText = '';
    this.stopText = '';
    this.result = null;
    this.readings = [];
    this.selected = 0;
    this.view = 'log-log';
    this.error = '';
    this.busy = false;
    this.message = '';
    this.d10Text = '';
    this.cuText = '';
    this.wellId = '';
  }

  private async openFile(input: HTMLInputElement): Promise<void> {
    const file = input.files?.[0];
    if (!file) return;
    if (file.size > 4_000_000) {
      this.error = `The readings file ${file.name} is larger than 4 MB: split it, or thin the logger readings.`;
      return;
    }
    this.csv = await file.text();
    this.fileName = file.name;
    this.error = '';
  }

  /** The request body, or a message naming the field the user must fix. */
  private buildRequest(): { ok: true; body: Record<string, unknown> } | { ok: false; message: string } {
    if (this.csv.trim() === '') return { ok: false, message: 'Readings: open a CSV file or paste the readings first.' };
    const body: Record<string, unknown> = { csv: this.csv };
    if (this.rateText.trim() !== '') {
      const q = Number(this.rateText.replace(',', '.'));
      if (!(q > 0)) return { ok: false, message: `Pumping rate: "${this.rateText}" is not a rate above 0.` };
      body.rate_m3_s = toSi(q, this.rateUnit);
    }
    if (this.distanceText.trim() !== '') {
      const r = Number(this.distanceText.replace(',', '.'));
      if (!(r > 0)) return { ok: false, message: `Distance: "${this.distanceText}" is not a distance above 0.` };
      body.distance_m = toSi(r, this.units.length);
    }
    if (this.stopText.trim() !== '') {
      const h = Number(this.stopText.replace(',', '.'));
      if (!(h > 0)) return { ok: false, message: `Pump stopped after: "${this.stopText}" is not a number of hours above 0.` };
      body.stop_s = h * 3600;
    }
    return { ok: true, body };
  }

  private async analyse(): Promise<void> {
    const built = this.buildRequest();
    if (!built.ok) {
      this.error = built.message;
      return;
    }
    this.busy = true;
    this.error = '';
    this.message = '';
    try {
      const res = await fetch(`${this.apiBase}/api/v1/pumping-test`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(built.body) });
      const body = (await res.json()) as PumpingTestResult & { error?: { message: string } };
      if (!res.ok) {
        this.error = plainMessage(body.error?.message ?? `The analysis answered ${res.status}.`);
        this.result = null;
        return;
      }
      this.result = body;
      this.selected = 0;
      // The same parse the service ran, for the marks on the plots.
      this.readings = parseReadingsCsv(this.csv, {
        ...(built.body.rate_m3_s !== undefined ? { rate_m3_s: built.body.rate_m3_s as number } : { rate_m3_s: body.rate_m3_s }),
        ...(built.body.distance_m !== undefined ? { distance_m: built.body.distance_m as number } : {}),
        ...(built.body.stop_s !== undefined ? { stop_s: built.body.stop_s as number } : {}),
      }).map((r) => ({ well: r.well, time_s: r.time_s, drawdown_m: r.drawdown_m, phase: r.phase }));
    } catch (error) {
      this.error = `The analysis could not be reached (${(error as Error).message}).`;
    } finally {
      this.busy = false;
    }
  }

  private apply(fit: PumpingTestFit): void {
    const scenario = this.scenario;
    if (!scenario || !this.store) return;
    try {
      const { scenario: applied, changes } = applyTestParameters({
        scenario,
        fit,
        ...(fit.method === 'step' && this.wellId ? { wellId: this.wellId } : {}),
        ...(this.fileName ? { source: this.fileName } : {}),
        appliedAt: new Date().toISOString(),
      });
      this.store.apply(`apply ${METHOD_LABELS[fit.method]}`, (d) => {
        d.aquifer = applied.aquifer;
        d.wells = applied.wells;
        (d as Record<string, unknown>).pumpingTest = (applied as Record<string, unknown>).pumpingTest;
      });
      this.message = `Applied: ${changes.join('; ')}. Undo brings the previous values back.`;
    } catch (error) {
      this.error = (error as Error).message;
    }
  }

  override render() {
    const s = this.scenario;
    const fit = this.result?.fits[this.selected] ?? null;
    const b = s ? saturatedThickness(s) : null;
    return html`<div class="dd-test-panel">
      <p class="dd-hint">Readings CSV: a time column (time_s, time_min, time_h or time_d) and drawdown_m (or drawdown_ft), with distance_m and well per row when there are several observation wells. Readings after the pump stopped are recovery.</p>
      <div class="dd-form-row">
        <label>Readings file <input type="file" name="test-file" accept=".csv,.txt,text/csv" @change=${(e: Event) => this.openFile(e.target as HTMLInputElement)} /></label>
        ${this.fileName ? html`<small data-test="file-name">${this.fileName} · ${this.csv.split('\n').filter((line) => line.trim() !== '').length - 1} rows</small>` : nothing}
      </div>
      <details><summary>Or paste the readings</summary>
        <textarea name="test-csv" rows="5" .value=${this.csv} @change=${(e: Event) => ((this.csv = (e.target as HTMLTextAreaElement).value), (this.fileName = ''))}></textarea>
      </details>
      <div class="dd-form-grid">
        <label>Pumping rate <span class="dd-unit-input"><input name="test-rate" inputmode="decimal" .value=${this.rateText} @change=${(e: Event) => (this.rateText = (e.target as HTMLInputElement).value)} />
          <select name="test-rate-unit" @change=${(e: Event) => (this.rateUnit = (e.target as HTMLSelectElement).value as UnitId)}>${RATE_UNITS.map((id) => html`<option ?selected=${id === this.rateUnit}>${id}</option>`)}</select></span></label>
        <label>Distance (${this.units.length}) <small>if the file has none</small><input name="test-distance" inputmode="decimal" .value=${this.distanceText} @change=${(e: Event) => (this.distanceText = (e.target as HTMLInputElement).value)} /></label>
        <label>Pump stopped after (h) <small>for recovery</small><input name="test-stop" inputmode="decimal" .value=${this.stopText} @change=${(e: Event) => (this.stopText = (e.target as HTMLInputElement).value)} /></label>
      </div>
      <button type="button" name="test-analyse" ?disabled=${this.busy} @click=${() => this.analyse()}>${this.busy ? 'Analysing…' : 'Analyse readings'}</button>
      ${this.error ? html`<p class="dd-error" role="alert" data-test="test-error">${this.error}</p>` : nothing}
      ${this.message ? html`<p class="dd-ok" role="status" data-test="test-applied">${this.message}</p>` : nothing}
      ${this.result ? this.renderResult(this.result, fit, b) : nothing}
      ${this.renderHazen()}
      ${this.shown ? html`<caution-note .notes=${this.result?.cautions ?? []}></caution-note>` : nothing}
    </div>`;
  }

  private renderResult(result: PumpingTestResult, fit: PumpingTestFit | null, b: number | null) {
    const u = this.units;
    return html`<table class="dd-table dd-test-fits" data-test="fits">
        <thead><tr><th></th><th>Method · well</th><th>T (${u.transmissivity})</th><th>S</th><th>RMSE</th><th></th></tr></thead>
        <tbody>${result.fits.map(
          (f, i) => html`<tr class=${i === this.selected ? 'dd-on' : ''} data-method=${f.method}>
            <td><input type="radio" name="test-fit" aria-label=${`Plot ${METHOD_LABELS[f.method]}`} .checked=${i === this.selected} @change=${() => (this.selected = i)} /></td>
            <td>${METHOD_LABELS[f.method]} · ${f.well ?? 'all wells'}</td>
            <td data-test="T" data-value=${f.transmissivity_m2_s ?? ''}>${f.transmissivity_m2_s === null ? '—' : formatQuantity(f.transmissivity_m2_s, u.transmissivity, { significant: 3, withUnit: false })}</td>
            <td>${fmt(f.storativity)}</td>
            <td>${formatQuantity(f.rmse_m, u.length, { significant: 2 })}</td>
            <td><button type="button" name="test-apply" @click=${() => this.apply(f)}>Apply</button></td>
          </tr>`,
        )}</tbody>
      </table>
      ${fit ? this.renderSelected(fit, b) : nothing}
`;
  }

  private renderSelected(fit: PumpingTestFit, b: number | null) {
    const u = this.units;
    const i = fit.interval;
    return html`<dl class="dd-test-selected" data-test="selected-fit">
        <div><dt>${METHOD_LABELS[fit.method]}${fit.well ? ` · ${fit.well}` : ''}</dt><dd></dd></div>
        ${fit.transmissivity_m2_s !== null && b !== null && b > 0
          ? html`<div><dt>K = T / b</dt><dd data-test="K">${formatQuantity(fit.transmissivity_m2_s / b, u.velocity, { significant: 3 })} (b = ${formatQuantity(b, u.length, { significant: 4 })}, the scenario’s saturated thickness)</dd></div>`
          : nothing}
        ${i?.transmissivity_m2_s ? html`<div><dt>${Math.round(100 * i.confidence)} % interval of T</dt><dd>${range(i.transmissivity_m2_s.map((v) => fromSi(v, u.transmissivity)) as [number, number])} ${u.transmissivity}</dd></div>` : nothing}
        ${i?.storativity ? html`<div><dt>Interval of S</dt><dd>${range(i.storativity)}</dd></div>` : nothing}
        ${fit.leakageFactor_m !== undefined ? html`<div><dt>Leakage factor B</dt><dd>${formatQuantity(fit.leakageFactor_m, u.length, { significant: 3 })}${i?.leakageFactor_m ? ` (${range(i.leakageFactor_m.map((v) => fromSi(v, u.length)) as [number, number])} ${u.length})` : ''}</dd></div>` : nothing}
        ${fit.wellLoss_s2_m5 !== undefined ? html`<div><dt>Well loss C</dt><dd>${fmt(fit.wellLoss_s2_m5)} s²/m⁵ · aquifer loss B = ${fmt(fit.linearLoss_s_m2 ?? null)} s/m²</dd></div>` : nothing}
      </dl>
      <div class="dd-test-notes">
        ${fit.line ? html`<p data-test="line">Straight line: ${formatQuantity(fit.line.slope_m_per_log_cycle, u.length, { significant: 3 })} per log cycle over ${fit.line.points} readings${fit.validity.fractionSmallU !== null ? html`; ${Math.round(100 * fit.validity.fractionSmallU)} % of the readings have u < ${fit.validity.uMax}` : nothing}.</p>` : nothing}
        ${fit.steps ? html`<p>Well efficiency: ${fit.steps.map((st) => `${formatQuantity(st.rate_m3_s, u.rate, { significant: 3 })} → ${Math.round(100 * st.efficiency)} %`).join(', ')}.
            <label>Apply C to well <select name="test-well" @change=${(e: Event) => (this.wellId = (e.target as HTMLSelectElement).value)}><option value="">—</option>${(this.scenario?.wells ?? []).map((w) => html`<option>${w.id}</option>`)}</select></label></p>` : nothing}
        ${[...fit.validity.notes, ...fit.departures].map((n) => html`<p class="dd-warning" data-test="departure">${n}</p>`)}
      </div>
      <div class="dd-chart-tabs" role="tablist">${(['log-log', 'semi-log', 'residuals'] as TestChartView[]).map((v) => html`<button type="button" role="tab" name=${`test-view-${v}`} aria-selected=${this.view === v} class=${this.view === v ? 'dd-on' : ''} @click=${() => (this.view = v)}>${({ 'log-log': 'Log–log', 'semi-log': fit.method === 'recovery' ? "Recovery (t/t′)" : 'Semi-log', residuals: 'Residuals' })[v]}</button>`)}</div>
      <test-fit-chart .readings=${this.readings} .fit=${fit} .view=${this.view} .units=${u} .stop_s=${this.result?.stop_s ?? null}></test-fit-chart>
      ${(this.result?.cautions ?? []).slice(1).map((c) => html`<p class="dd-warning">${c}</p>`)}`;
  }

  private renderHazen() {
    const d10 = Number(this.d10Text.replace(',', '.'));
    const cu = this.cuText.trim() === '' ? undefined : Number(this.cuText.replace(',', '.'));
    let estimate: ReturnType<typeof hazenConductivity> | null = null;
    let problem = '';
    if (this.d10Text.trim() !== '') {
      try {
        estimate = hazenConductivity({ d10_mm: d10, ...(cu !== undefined && Number.isFinite(cu) ? { uniformityCoefficient: cu } : {}) });
      } catch {
        problem = 'd10: enter a grain size above 0 and at most 100 mm.';
      }
    }
    const tested = this.scenario?.aquifer.conductivity_m_s;
    return html`<details class="dd-section-block"><summary><h3>Grain-size estimate (Hazen)</h3></summary>
      <div class="dd-form-grid">
        <label>d10 (mm) <input name="hazen-d10" inputmode="decimal" .value=${this.d10Text} @input=${(e: Event) => (this.d10Text = (e.target as HTMLInputElement).value)} /></label>
        <label>Uniformity d60/d10 <input name="hazen-cu" inputmode="decimal" .value=${this.cuText} @input=${(e: Event) => (this.cuText = (e.target as HTMLInputElement).value)} /></label>
      </div>
      ${problem ? html`<p class="dd-error">${problem}</p>` : nothing}
      ${estimate
        ? html`<p data-test="hazen">Hazen K ≈ C·d10² = ${formatQuantity(estimate.conductivity_m_s, this.units.velocity, { significant: 2 })} (C = ${estimate.coefficient})${tested !== undefined ? html` beside the scenario’s K = ${formatQuantity(tested, this.units.velocity, { significant: 3 })}` : nothing}.</p>
            ${estimate.notes.map((n) => html`<p class="dd-hint">${n}</p>`)}`
        : nothing}
    </details>`;
  }
}

/** The service's message without the API's JSON pointer at the front (users see the field in words). */
function plainMessage(message: string): string {
  return message.replace(/^\/csv: /, 'Readings: ').replace(/^readings: /, 'Readings: ');
}

if (!customElements.get('pumping-test-panel')) customElements.define('pumping-test-panel', PumpingTestPanel);
