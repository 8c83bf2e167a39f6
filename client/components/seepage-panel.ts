/**
 * <seepage-panel>: the Section tab. A half-section across the chosen excavation, built by the
 * engine from the scenario (ground profile, wall, floor, outside level), solved in the engine
 * worker: the section to scale with its flow net and unsafe floor shaded, the flow and checks,
 * the toe sweep as a chart and a table, and the options compared — deeper toe, relief wells, a
 * lower inside level — with flow per metre × perimeter beside the plan design's total.
 */
import { html, nothing } from 'lit';
import type { Scenario } from '../../shared/schema';
import type { SectionJob, SectionJobAnswer } from '../../shared/section';
import { writeSectionFloorCsv, writeSectionReportHtml } from '../../shared/exports';
import { EngineError, type EngineClient } from '../worker';
import { LightElement } from './light-element';
import './seepage-drawing';
import './seepage-sweep-chart';

/** Field labels, for messages that name a field by its pointer. */
const LABELS: Record<string, string> = {
  '/fromScenario/toe_m': 'Wall toe',
  '/fromScenario/outsideHead_m': 'Outside water level',
  '/fromScenario/insideHead_m': 'Inside water level',
};

const fmt = (v: number | null | undefined, digits = 3) => (v === null || v === undefined || !Number.isFinite(v) ? '—' : Number(v.toPrecision(digits)).toString());
const perMetre = (q: number) => `${fmt(q * 1000)} L/s per m`;

export class SeepagePanel extends LightElement {
  static override properties = {
    scenario: { attribute: false },
    engine: { attribute: false },
    planTotal_m3_s: { attribute: false },
    _toe: { state: true },
    _outside: { state: true },
    _inside: { state: true },
    _answer: { state: true },
    _busy: { state: true },
    _error: { state: true },
  };
  declare scenario: Scenario | null;
  declare engine: EngineClient | null;
  /** The plan design's total flow, m³/s (shown beside flow per metre × perimeter). */
  declare planTotal_m3_s: number | null;
  declare _toe: string;
  declare _outside: string;
  declare _inside: string;
  declare _answer: SectionJobAnswer | null;
  declare _busy: boolean;
  declare _error: string;

  constructor() {
    super();
    this.scenario = null;
    this.engine = null;
    this.planTotal_m3_s = null;
    this._toe = '';
    this._outside = '';
    this._inside = '';
    this._answer = null;
    this._busy = false;
    this._error = '';
  }

  /** A level typed in a field: blank = the engine's default; otherwise a number in range, or an error naming the label. */
  private level(text: string, label: string): number | undefined {
    if (text.trim() === '') return undefined;
    const v = Number(text);
    if (!Number.isFinite(v) || Math.abs(v) > 20_000) throw new Error(`${label}: must be a level in metres between −20 000 and 20 000 (got “${text}”)`);
    return v;
  }

  private async solve(): Promise<void> {
    if (!this.scenario || !this.engine) return;
    this._error = '';
    let job: SectionJob;
    try {
      const toe_m = this.level(this._toe, 'Wall toe');
      const outsideHead_m = this.level(this._outside, 'Outside water level');
      const insideHead_m = this.level(this._inside, 'Inside water level');
      job = {
        scenario: this.scenario,
        fromScenario: { ...(toe_m !== undefined ? { toe_m } : {}), ...(outsideHead_m !== undefined ? { outsideHead_m } : {}), ...(insideHead_m !== undefined ? { insideHead_m } : {}) },
        compare: true,
        ...(this.planTotal_m3_s !== null ? { planTotalRate_m3_s: this.planTotal_m3_s } : {}),
      };
    } catch (error) {
      this._error = (error as Error).message;
      return;
    }
    this._busy = true;
    try {
      const res = await this.engine.seepage(job);
      if (res) this._answer = res.answer;
    } catch (error) {
      const message = error instanceof EngineError ? error.message : `The engine could not solve the section: ${(error as Error).message}`;
      this._error = Object.entries(LABELS).reduce((m, [pointer, label]) => m.replace(pointer, label), message);
    } finally {
      this._busy = false;
    }
  }

  /** The plan model's level at the middle of the excavation's first edge (outside the wall). */
  private async usePlanHead(): Promise<void> {
    const s = this.scenario;
    const e = s?.excavations[0];
    if (!s || !e || !this.engine) return;
    const [a, b] = [e.outline[0]!, e.outline[1]!];
    const point: [number, number] = [(a[0] + b[0]) / 2, (a[1] + b[1]) / 2];
    try {
      const res = await this.engine.inspect({ scenario: s, point, times_s: [s.design.time_s ?? 86400], time_s: s.design.time_s });
      if (res) this._outside = res.current.level_m.toFixed(2);
    } catch (error) {
      this._error = `Plan head at the edge: ${(error as Error).message}`;
    }
  }

  private download(text: string, type: string, suffix: string): void {
    const blob = new Blob([text], { type });
    const a = document.createElement('a');
    a.href = URL.createObjectURL(blob);
    a.download = `${(this.scenario?.name ?? 'section').replace(/[^\w.-]+/g, '-').slice(0, 60)}-${suffix}`;
    a.click();
    setTimeout(() => URL.revokeObjectURL(a.href), 1000);
  }

  override render() {
    const s = this.scenario;
    if (!s || s.excavations.length === 0) return html`<p class="dd-muted">Draw an excavation to take a section through it.</p>`;
    const r = this._answer;
    return html`<div class="dd-seepage">
      <p class="dd-muted">A half-section across ${s.excavations[0]!.id}: wall, floor and outside water level from the scenario; blank fields take the defaults shown in the assumptions.</p>
      <div class="dd-seepage-inputs">
        <label>Wall toe, m <input name="seepage-toe" inputmode="decimal" .value=${this._toe} placeholder="default" @change=${(e: Event) => (this._toe = (e.target as HTMLInputElement).value)}></label>
        <label>Outside water level, m <input name="seepage-outside" inputmode="decimal" .value=${this._outside} placeholder=${String(s.aquifer.staticLevel_m)} @change=${(e: Event) => (this._outside = (e.target as HTMLInputElement).value)}></label>
        <label>Inside water level, m <input name="seepage-inside" inputmode="decimal" .value=${this._inside} placeholder=${String(s.excavations[0]!.formationLevel_m)} @change=${(e: Event) => (this._inside = (e.target as HTMLInputElement).value)}></label>
      </div>
      <div class="dd-seepage-actions">
        <button type="button" name="seepage-solve" ?disabled=${this._busy} @click=${() => void this.solve()}>${this._busy ? 'Solving…' : 'Solve section'}</button>
        <button type="button" name="seepage-plan-head" @click=${() => void this.usePlanHead()} title="Take the plan model's level at the excavation edge as the outside water level">Use plan head at the edge</button>
        ${r ? html`<button type="button" name="seepage-csv" @click=${() => this.download(writeSectionFloorCsv(r), 'text/csv', 'floor-profile.csv')}>Floor profile CSV</button>
          <button type="button" name="seepage-report" @click=${() => this.download(writeSectionReportHtml(r, { title: `Section seepage — ${s.name}` }), 'text/html', 'section-report.html')}>Section report</button>` : nothing}
      </div>
      ${this._error ? html`<div class="dd-issues" role="alert">${this._error}</div>` : nothing}
      ${r ? this.renderAnswer(r) : nothing}
      <div class="dd-caution" role="note"><strong>Caution.</strong> ${(r?.cautions ?? ['Steady seepage in an idealised section; confirm with site investigation, local codes and a licensed engineer.']).join(' ')}</div>
    </div>`;
  }

  private renderAnswer(r: SectionJobAnswer) {
    const flow = r.flow_m3_s_per_m ?? 0;
    const from = r.fromScenario;
    const c = r.comparison;
    return html`<seepage-drawing .section=${r.section} .result=${r}></seepage-drawing>
      <p class="dd-seepage-key"><span class="dd-key-flow">— flow lines (${r.flowNet?.tubes ?? 0} equal-flow tubes)</span> <span class="dd-key-equi">- - equipotentials (${r.flowNet?.drops ?? 0} equal drops)</span> <span class="dd-key-unsafe">▮ floor where exit-gradient FS &lt; ${r.exitGradient.requiredFS}</span></p>
      <table class="dd-seepage-summary">
        <tr><th>Flow</th><td data-seepage="flow">${perMetre(flow)}</td></tr>
        ${from ? html`<tr><th>× perimeter ${fmt(from.perimeter_m)} m</th><td data-seepage="flow-total">${fmt(from.flowTimesPerimeter_m3_s * 1000)} L/s</td></tr>
          <tr><th>Plan design total</th><td data-seepage="plan-total">${from.planTotalRate_m3_s === null ? '— (run a design)' : `${fmt(from.planTotalRate_m3_s * 1000)} L/s`}</td></tr>` : nothing}
        <tr><th>Exit gradient (max)</th><td data-seepage="exit">${fmt(r.exitGradient.max)} at x = ${fmt(r.exitGradient.x_m)} m; i_c = γ′/γw = ${fmt(r.exitGradient.criticalGradient)}; FS ${fmt(r.exitGradient.fs)}</td></tr>
        <tr><th>Heave (${r.heave?.method ?? 'Terzaghi prism'})</th><td data-seepage="heave">${r.heave ? `FS ${fmt(r.heave.fs)} (d = ${fmt(r.heave.depth_m)} m, h_a = ${fmt(r.heave.excessHead_m)} m)` : '— (no wall toe below the floor)'}</td></tr>
        <tr><th>Plug uplift</th><td>${r.plug ? `FS ${fmt(r.plug.fs)} at x = ${fmt(r.plug.x_m)} m` : '— (no plug layer under the floor)'}</td></tr>
        <tr><th>Split</th><td>floor ${perMetre(r.split.floor)}${r.split.wells.length ? `, wells ${r.split.wells.map((w) => perMetre(w.flow)).join(', ')}` : ''}; under the wall ${r.split.underWalls.map((w) => perMetre(Math.abs(w.flow))).join(', ')}</td></tr>
        <tr><th>Mesh / solver</th><td>${r.mesh.unknowns} unknowns; ${r.solver.iterations} CG iterations to ${r.solver.relativeResidual.toExponential(0)}</td></tr>
      </table>
      ${c ? html`<h4>Wall toe sweep</h4>
        <seepage-sweep-chart .rows=${c.sweep} .requiredFS=${r.exitGradient.requiredFS}></seepage-sweep-chart>
        <table class="dd-seepage-sweep-table"><thead><tr><th>Toe, m</th><th>Flow, L/s/m</th><th>Exit FS</th><th>Heave FS</th></tr></thead>
          <tbody>${c.sweep.map((row) => html`<tr data-sweep-row><td>${fmt(row.toe_m)}</td><td>${fmt(row.flow * 1000)}</td><td>${fmt(row.exitFS)}</td><td>${fmt(row.heaveFS)}</td></tr>`)}</tbody></table>
        <h4>Options compared</h4>
        <table class="dd-seepage-compare"><thead><tr><th>Option</th><th>Flow, L/s/m</th>${from ? html`<th>× perimeter, L/s</th>` : nothing}<th>Exit FS</th><th>Heave FS</th><th>Plug FS</th></tr></thead>
          <tbody>${c.rows.map((row) => html`<tr data-compare-row><td>${row.label}</td><td>${fmt(row.flow * 1000)}</td>${from ? html`<td>${fmt(row.flow * from.perimeter_m * 1000)}</td>` : nothing}<td>${fmt(row.exitFS)}</td><td>${fmt(row.heaveFS)}</td><td>${fmt(row.plugFS)}</td></tr>`)}</tbody></table>` : nothing}
      ${r.flags.length || from?.assumptions.length ? html`<details class="dd-model-notes"><summary>Assumptions and flags (${(from?.assumptions.length ?? 0) + r.flags.length})</summary>
        <ul>${[...(from?.assumptions ?? []), ...r.flags].map((n) => html`<li>${n}</li>`)}</ul><p>${r.method}; ${r.solver.method}.</p></details>` : nothing}`;
  }
}

customElements.define('seepage-panel', SeepagePanel);
