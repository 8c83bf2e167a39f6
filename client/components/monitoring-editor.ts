/**
 * <monitoring-editor>: the monitoring plan the site team will be handed — piezometers (id,
 * position, alert offset, action level, label), the pumping start, and for the selected
 * piezometer the level the design expects there over time with its alert and action lines.
 * Lengths in display units, stored SI; every edit is one undo step, and a value that does not
 * parse or that `validateMonitoring` refuses is not kept, with a message naming its field, and
 * the input goes back to the stored value, so what is shown is what the scenario holds.
 */
import { html, nothing } from 'lit';
import { LightElement } from './light-element';
import { DEFAULT_ALERT_OFFSET_M, isIsoDateTime, type Piezometer, type Scenario } from '../../shared/schema';
import { formatNumber, formatQuantity, type DisplayUnits } from '../../shared/units';
import type { PiezometerPlan } from '../../shared/exports';
import { ensureMonitoring, getMonitoringSection, getPiezometers, monitoringIssues, type ScenarioStore } from '../state';
import type { EngineClient, MonitoringResult } from '../worker';
import { displayValue, parseDisplayNumber } from './unit-context';
import './piezometer-chart';

/** Wait after the last change before the expected levels are recomputed, ms. */
const PLAN_DELAY_MS = 200;

type NumberField = 'x' | 'y' | 'alertOffset_m' | 'actionLevel_m' | 'lowAlertOffset_m' | 'lowActionLevel_m';

export class MonitoringEditor extends LightElement {
  static override properties = {
    store: { attribute: false }, scenario: { attribute: false }, units: { attribute: false }, piezometerId: { attribute: false },
    engine: { attribute: false }, paused: { type: Boolean },
    error: { state: true }, plan: { state: true }, planError: { state: true },
  };
  declare store: ScenarioStore | undefined;
  declare scenario: Scenario | undefined;
  declare units: DisplayUnits;
  declare piezometerId: string | null;
  declare engine: EngineClient | null;
  /** True while the scenario has issues: the engine is not asked. */
  declare paused: boolean;
  declare error: string;
  declare plan: MonitoringResult | null;
  declare planError: string;

  private planTimer = 0;
  private planSeq = 0;
  /** What the current plan was asked for: the store's snapshots are immutable, so identity will do. */
  private planFor: { scenario: Scenario | undefined; id: string | null; paused: boolean } = { scenario: undefined, id: null, paused: false };

  constructor() {
    super();
    this.piezometerId = null;
    this.engine = null;
    this.paused = false;
    this.error = '';
    this.plan = null;
    this.planError = '';
  }

  override disconnectedCallback(): void {
    super.disconnectedCallback();
    clearTimeout(this.planTimer);
  }

  override updated(): void {
    // Recompute only when what the plan depends on changed: the scenario or the selection.
    const f = this.planFor;
    if (f.scenario === this.scenario && f.id === this.piezometerId && f.paused === this.paused) return;
    this.planFor = { scenario: this.scenario, id: this.piezometerId, paused: this.paused };
    clearTimeout(this.planTimer);
    if (!this.scenario || !this.piezometerId || this.paused) {
      this.planSeq++;
      if (this.plan !== null) this.plan = null;
      return;
    }
    this.planTimer = window.setTimeout(() => void this.computePlan(), PLAN_DELAY_MS);
  }

  private async computePlan(): Promise<void> {
    const engine = this.engine;
    const scenario = this.scenario;
    const id = this.piezometerId;
    if (!engine || !scenario || !id) return;
    const seq = ++this.planSeq;
    try {
      const res = await engine.monitoring({ scenario, piezometerId: id });
      if (seq !== this.planSeq) return;
      this.plan = res;
      this.planError = '';
    } catch (error) {
      if (seq !== this.planSeq) return;
      this.plan = null;
      this.planError = (error as Error).message;
    }
  }

  /** Shows why an input was not kept and puts the stored value back in it. */
  private refuse(message: string, input: HTMLInputElement, stored: string): void {
    this.error = message;
    input.value = stored;
  }

  private get index(): number {
    return this.scenario ? getPiezometers(this.scenario).findIndex((p) => p.id === this.piezometerId) : -1;
  }

  /** One undo step; refused (nothing recorded) when `change` names a problem or validation fails. */
  private edit(label: string, change: (draft: Scenario) => string | void): boolean {
    if (!this.store) return false;
    let problem: string | undefined;
    this.store.apply(label, (draft) => {
      problem = change(draft) || undefined;
      if (!problem) {
        const issue = monitoringIssues(draft)[0];
        if (issue) problem = `${issue.path}: ${issue.message}`;
      }
      if (problem) return this.store!.scenario; // unchanged: nothing recorded
    });
    this.error = problem ?? '';
    return !problem;
  }

  private editPiezometer(label: string, change: (p: Piezometer) => string | void): boolean {
    const i = this.index;
    if (i < 0) return false;
    return this.edit(label, (draft) => change(ensureMonitoring(draft).piezometers[i]!));
  }

  private numberField(label: string, field: NumberField, p: Piezometer, opts: { optional?: boolean; placeholder?: string; hint?: unknown } = {}) {
    const unit = this.units.length;
    const pointer = `/monitoring/piezometers/${this.index}/${field}`;
    return html`<label class="dd-field"><span>${label}</span>
      <span class="dd-input-unit"><input type="text" inputmode="decimal" name=${`pz-${field}`} aria-label=${label} .value=${displayValue(p[field], unit)}
        placeholder=${opts.placeholder ?? ''}
        @change=${(e: Event) => {
          const input = e.target as HTMLInputElement;
          if (opts.optional && input.value.trim() === '') {
            this.editPiezometer(`clear ${label.toLowerCase()} of ${p.id}`, (d) => void delete d[field]);
            return;
          }
          const parsed = parseDisplayNumber(input.value, unit, pointer, label.toLowerCase());
          const stored = displayValue(p[field], unit);
          if (!parsed.ok) return this.refuse(parsed.message, input, stored);
          const v = parsed.value_si;
          if (field === 'alertOffset_m' && (v < 0 || v > 20)) return this.refuse(`${pointer}: alert offset must lie between 0 and ${formatQuantity(20, unit, { decimals: 1 })}`, input, stored);
          if (field === 'lowAlertOffset_m' && (v < 0 || v > 20)) return this.refuse(`${pointer}: low alert offset must lie between 0 and ${formatQuantity(20, unit, { decimals: 1 })}`, input, stored);
          if (!this.editPiezometer(`set ${label.toLowerCase()} of ${p.id}`, (d) => void (d[field] = v))) input.value = stored;
        }} /><em>${unit}</em></span>${opts.hint ? html`<small>${opts.hint}</small>` : nothing}</label>`;
  }

  override render() {
    const s = this.scenario;
    if (!s) return nothing;
    const u = this.units;
    const monitoring = getMonitoringSection(s);
    const list = monitoring?.piezometers ?? [];
    const i = this.index;
    const p = i >= 0 ? list[i] : undefined;
    return html`<div class="dd-monitoring">
      <div class="dd-new-well"><span>Piezometers the site team reads.</span>
        <button type="button" class="dd-small" name="place-piezometer" @click=${() => this.emit('choose-tool', 'add-piezometer')}>Place…</button></div>
      <ul class="dd-list dd-well-list dd-pz-list" aria-label="Piezometers">${list.map((k) => html`<li>
        <button type="button" class=${k.id === this.piezometerId ? 'dd-on' : ''} data-piezometer=${k.id} @click=${() => this.emit('select-piezometer', k.id)}>
          <strong>${k.id}</strong><span>${k.label ?? ''}</span><span>+${formatQuantity(k.alertOffset_m ?? DEFAULT_ALERT_OFFSET_M, u.length, { decimals: 2 })}</span></button></li>`)}
        ${list.length === 0 ? html`<li class="dd-hint">None yet: choose Place… (or the Piezometer tool, P) and click the plan.</li>` : nothing}</ul>
      <label class="dd-field"><span>Pumping start (t = 0), ISO 8601 with zone</span>
        <input type="text" name="pumping-start" placeholder="e.g. 2027-03-01T07:00:00Z" .value=${monitoring?.pumpingStart ?? ''}
          @change=${(e: Event) => {
            const input = e.target as HTMLInputElement;
            const text = input.value.trim();
            if (text !== '' && !isIsoDateTime(text)) return this.refuse(`/monitoring/pumpingStart: "${text.slice(0, 40)}" must be an ISO 8601 date-time with a zone, e.g. 2027-03-01T07:00:00Z`, input, monitoring?.pumpingStart ?? '');
            this.edit(text ? 'set pumping start' : 'clear pumping start', (d) => {
              const m = ensureMonitoring(d);
              if (text) m.pumpingStart = text;
              else delete m.pumpingStart;
            });
          }} /><small>Optional: lets the site team read the expected levels by date.</small></label>
      ${p ? this.renderPiezometer(p) : list.length ? html`<p class="dd-hint">Select a piezometer on the plan or in the list to edit it.</p>` : nothing}
      ${this.error ? html`<p class="dd-error dd-pz-input-error" role="alert">${this.error}</p>` : nothing}
    </div>`;
  }

  /**
   * Levels that would make the plan cry wolf or stay silent: an expected level above the action
   * level (a reading that matches the design already calls for action — the design falls short
   * here, or the action level suits a pit, not this spot), or an alert above the action level
   * (no alert before action).
   */
  private renderClash(plan: PiezometerPlan) {
    const u = this.units.length;
    const expected = plan.series.find((r) => r.actionLevel_m !== null && r.expectedLevel_m > r.actionLevel_m);
    const alert = plan.series.find((r) => r.actionLevel_m !== null && r.alertLevel_m > r.actionLevel_m);
    const at = (t: number | null) => (t === null ? 'steady state' : `day ${formatNumber(t / 86_400, { significant: 3 })}`);
    if (expected) {
      return html`<p class="dd-error dd-pz-clash" role="alert">At ${at(expected.time_s)} the design expects ${formatQuantity(expected.expectedLevel_m, u, { decimals: 2 })} here, above the action level
        ${formatQuantity(expected.actionLevel_m!, u, { decimals: 2 })}: a reading that matches the design would already call for action. Either the design does not reach the
        target here, or this piezometer needs its own action level.</p>`;
    }
    if (alert) {
      return html`<p class="dd-error dd-pz-clash" role="alert">At ${at(alert.time_s)} the alert level ${formatQuantity(alert.alertLevel_m, u, { decimals: 2 })} stands above the action level
        ${formatQuantity(alert.actionLevel_m!, u, { decimals: 2 })}: the site team would get no alert before action. Reduce the alert offset or raise the action level.</p>`;
    }
    return nothing;
  }

  private renderPiezometer(p: Piezometer) {
    const u = this.units;
    const i = this.index;
    const plan = this.plan?.piezometer?.id === p.id ? this.plan.piezometer : null;
    const actionHint = plan?.actionSource === 'excavation-target'
      ? `Blank: the target level (formation − margin) of ${plan.excavationId}, the excavation containing it — ${formatQuantity(plan.actionLevel_m ?? 0, u.length, { decimals: 2 })}.`
      : plan?.actionSource === 'none' ? 'Blank: no action level (the scenario has no excavation).'
      : plan?.actionSource === 'outside' ? 'Blank: none — outside every excavation the designed level stands above the pit’s target, so set one for this place if it needs one.'
      : 'Blank: the target level (formation − margin) of the excavation containing it; none outside every excavation.';
    return html`<form class="dd-form dd-pz-editor" aria-label="Piezometer ${p.id}" @submit=${(e: Event) => e.preventDefault()}>
      <div class="dd-form-row">
        <label class="dd-field"><span>Id</span><input type="text" name="pz-id" maxlength="64" .value=${p.id}
          @change=${(e: Event) => {
            const input = e.target as HTMLInputElement;
            const id = input.value.trim();
            if (!id) return this.refuse(`/monitoring/piezometers/${i}/id: an id is required`, input, p.id);
            if (id === p.id) return;
            if (this.edit(`rename ${p.id}`, (d) => void (ensureMonitoring(d).piezometers[i]!.id = id))) this.emit('select-piezometer', id);
            else input.value = p.id;
          }} /></label>
        <label class="dd-field"><span>Label</span><input type="text" name="pz-label" maxlength="200" .value=${p.label ?? ''} placeholder="where it is, for the site team"
          @change=${(e: Event) => {
            const label = (e.target as HTMLInputElement).value.trim();
            this.editPiezometer(`label ${p.id}`, (d) => {
              if (label) d.label = label;
              else delete d.label;
            });
          }} /></label>
      </div>
      <div class="dd-form-row">
        ${this.numberField('Easting', 'x', p)}
        ${this.numberField('Northing', 'y', p)}
      </div>
      <div class="dd-form-row">
        ${this.numberField('Alert offset', 'alertOffset_m', p, {
          optional: true, placeholder: displayValue(DEFAULT_ALERT_OFFSET_M, u.length),
          hint: `Alert when a reading stands this far above the expected level. Blank: ${formatQuantity(DEFAULT_ALERT_OFFSET_M, u.length, { decimals: 2 })} (common practice, no single source).`,
        })}
        ${this.numberField('Action level', 'actionLevel_m', p, { optional: true, placeholder: plan?.actionLevel_m != null && plan.actionSource !== 'designer' ? displayValue(plan.actionLevel_m, u.length) : '', hint: actionHint })}
      </div>
      <div class="dd-form-row">
        ${this.numberField('Low alert offset', 'lowAlertOffset_m', p, {
          optional: true, placeholder: displayValue(DEFAULT_ALERT_OFFSET_M, u.length),
          hint: `Alert when a reading stands this far below the expected level (more drawdown than designed). Blank: ${formatQuantity(DEFAULT_ALERT_OFFSET_M, u.length, { decimals: 2 })} (common practice).`,
        })}
        ${this.numberField('Low action level', 'lowActionLevel_m', p, { optional: true, hint: 'Act (reduce pumping, recharge) when a reading stands below this level — too much drawdown for a neighbour. Blank: none.' })}
      </div>
      <div class="dd-actions">
        <button type="button" class="dd-danger" name="delete-piezometer" @click=${() => this.emit('delete-piezometer', p.id)}>Delete piezometer</button>
      </div>
    </form>
    <div class="dd-pz-expected" aria-live="polite">
      <h4>Expected at ${p.id} — what the site team will be given</h4>
      ${this.paused ? html`<p class="dd-hint">Paused until the scenario is fixed.</p>`
        : this.planError ? html`<p class="dd-error" role="alert">Not computed: ${this.planError}</p>`
        : plan ? html`<piezometer-chart .plan=${plan} .units=${u} .staticLevel_m=${this.plan!.staticLevel_m}></piezometer-chart>
          ${this.renderClash(plan)}
          <p class="dd-chart-note">${this.plan!.pumpingStart ? `Day 0 = ${this.plan!.pumpingStart}. ` : 'Set a pumping start to give the table dates. '}Expected levels from the idealised model — the site team compares readings with them; defer to site investigation, local codes and a licensed engineer.</p>`
        : html`<p class="dd-hint">Computing the expected levels…</p>`}
    </div>`;
  }
}
if (!customElements.get('monitoring-editor')) customElements.define('monitoring-editor', MonitoringEditor);
