/**
 * <well-editor>: properties of one well — id, kind, position, radius, constant rate or a rate
 * schedule, well-loss C, screen top and bottom, in or out of service — in display units, stored SI. A value that does
 * not parse is refused with a message naming its field (e.g. `/wells/3/rate_m3_s`).
 */
import { html, nothing } from 'lit';
import { LightElement } from './light-element';
import type { Scenario, Well, WellKind } from '../../shared/schema';
import { formatQuantity, type DisplayUnits } from '../../shared/units';
import type { ScenarioStore } from '../state';
import { displayValue, parseDisplayNumber } from './unit-context';

const KINDS: Array<[WellKind, string]> = [['wellpoint', 'Well point'], ['deep', 'Deep well'], ['ejector', 'Ejector']];

export class WellEditor extends LightElement {
  static override properties = {
    store: { attribute: false }, scenario: { attribute: false }, units: { attribute: false }, wellId: { attribute: false },
    error: { state: true },
  };
  declare store: ScenarioStore | undefined;
  declare scenario: Scenario | undefined;
  declare units: DisplayUnits;
  declare wellId: string | null;
  declare error: string;

  constructor() {
    super();
    this.wellId = null;
    this.error = '';
  }

  private get index(): number {
    return this.scenario?.wells.findIndex((w) => w.id === this.wellId) ?? -1;
  }

  private edit(label: string, change: (w: Well, all: Well[]) => string | void): void {
    const i = this.index;
    if (!this.store || i < 0) return;
    let problem: string | void = undefined;
    this.store.apply(label, (draft) => {
      const w = draft.wells[i]!;
      problem = change(w, draft.wells);
      if (problem) return this.store!.scenario; // unchanged: nothing recorded
    });
    this.error = problem ?? '';
  }

  private numberField(label: string, field: 'x' | 'y' | 'radius_m' | 'rate_m3_s' | 'wellLoss_s2_m5' | 'screenTop_m' | 'screenBottom_m', unit: DisplayUnits[keyof DisplayUnits] | null, value: number | undefined, opts: { optional?: boolean; min?: number; exclusiveMin?: boolean } = {}) {
    const pointer = `/wells/${this.index}/${field}`;
    return html`<label class="dd-field"><span>${label}</span>
      <span class="dd-input-unit"><input type="text" inputmode="decimal" name=${field} .value=${displayValue(value, unit)}
        aria-label=${label}
        @change=${(e: Event) => {
          const input = e.target as HTMLInputElement;
          if (opts.optional && input.value.trim() === '') {
            this.edit(`clear ${label}`, (w) => {
              delete (w as Record<string, unknown>)[field];
            });
            return;
          }
          const parsed = parseDisplayNumber(input.value, unit, pointer, label.toLowerCase());
          if (!parsed.ok) {
            this.error = parsed.message;
            return;
          }
          const v = parsed.value_si;
          if (opts.min !== undefined && (opts.exclusiveMin ? v <= opts.min : v < opts.min)) {
            this.error = `${pointer}: ${label.toLowerCase()} must be ${opts.exclusiveMin ? 'greater than' : 'at least'} ${opts.min}`;
            return;
          }
          this.edit(`set ${label.toLowerCase()} of ${this.wellId}`, (w) => {
            (w as Record<string, unknown>)[field] = v;
          });
        }} />${unit ? html`<em>${unit}</em>` : nothing}</span></label>`;
  }

  override render() {
    const s = this.scenario;
    const i = this.index;
    const w = i >= 0 ? s!.wells[i]! : undefined;
    if (!w) return html`<p class="dd-hint">Select a well on the map (or in the list) to edit it.</p>`;
    const u = this.units;
    const useSchedule = Array.isArray(w.schedule);
    return html`<form class="dd-form dd-well-editor" @submit=${(e: Event) => e.preventDefault()} aria-label="Well ${w.id}">
      <div class="dd-form-row">
        <label class="dd-field"><span>Id</span><input type="text" name="id" .value=${w.id} maxlength="64"
          @change=${(e: Event) => {
            const id = (e.target as HTMLInputElement).value.trim();
            if (!id) return void (this.error = `/wells/${i}/id: an id is required`);
            if (s!.wells.some((o, k) => k !== i && o.id === id)) return void (this.error = `/wells/${i}/id: "${id}" is already used by another well`);
            const old = w.id;
            this.edit(`rename ${old}`, (d) => void (d.id = id));
            this.wellId = id;
            this.emit('select-well', id);
          }} /></label>
        <label class="dd-field"><span>Kind</span><select name="kind" @change=${(e: Event) => this.edit(`set kind of ${w.id}`, (d) => void (d.kind = (e.target as HTMLSelectElement).value as WellKind))}>
          ${KINDS.map(([k, label]) => html`<option value=${k} ?selected=${w.kind === k}>${label}</option>`)}</select></label>
      </div>
      <div class="dd-form-row">
        ${this.numberField('Easting', 'x', u.coordinate, w.x)}
        ${this.numberField('Northing', 'y', u.coordinate, w.y)}
      </div>
      <div class="dd-form-row">
        ${this.numberField('Radius', 'radius_m', u.length, w.radius_m, { min: 0, exclusiveMin: true })}
        ${this.numberField('Well loss C', 'wellLoss_s2_m5', u.wellLoss, w.wellLoss_s2_m5, { optional: true, min: 0 })}
      </div>
      <div class="dd-form-row">
        ${this.numberField('Screen top', 'screenTop_m', u.length, w.screenTop_m, { optional: true })}
        ${this.numberField('Screen bottom', 'screenBottom_m', u.length, w.screenBottom_m, { optional: true })}
      </div>
      <p class="dd-hint dd-screen-hint">Screen levels are elevations; blank: ${s!.aquifer.kind === 'unconfined' ? 'static level' : 'aquifer top'} to aquifer base (full thickness).</p>
      <fieldset class="dd-rate-mode"><legend>Pumping</legend>
        <label><input type="radio" name="mode" ?checked=${!useSchedule} @change=${() => this.edit(`constant rate for ${w.id}`, (d) => {
          d.rate_m3_s = d.schedule?.[0]?.rate_m3_s ?? d.rate_m3_s ?? 0;
          delete d.schedule;
        })} /> Constant rate</label>
        <label><input type="radio" name="mode" ?checked=${useSchedule} @change=${() => this.edit(`rate schedule for ${w.id}`, (d) => {
          d.schedule = [{ from_s: 0, rate_m3_s: d.rate_m3_s ?? 0 }];
          delete d.rate_m3_s;
        })} /> Schedule</label>
        ${useSchedule ? this.renderSchedule(w, i) : this.numberField('Rate', 'rate_m3_s', u.rate, w.rate_m3_s ?? 0)}
        <label class="dd-check"><input type="checkbox" name="active" ?checked=${w.active !== false}
          @change=${(e: Event) => this.edit(`${(e.target as HTMLInputElement).checked ? 'activate' : 'deactivate'} ${w.id}`, (d) => {
            if ((e.target as HTMLInputElement).checked) delete d.active;
            else d.active = false;
          })} /> In service (pumped)</label>
      </fieldset>
      ${this.error ? html`<p class="dd-error" role="alert">${this.error}</p>` : nothing}
      <div class="dd-actions">
        <button type="button" class="dd-danger" @click=${() => this.emit('delete-well', w.id)}>Delete well</button>
      </div>
    </form>`;
  }

  private renderSchedule(w: Well, i: number) {
    const u = this.units;
    const rows = w.schedule ?? [];
    const setStep = (k: number, key: 'from_s' | 'rate_m3_s', text: string) => {
      const unit = key === 'from_s' ? u.time : u.rate;
      const pointer = `/wells/${i}/schedule/${k}/${key}`;
      const parsed = parseDisplayNumber(text, unit, pointer, key === 'from_s' ? 'start time' : 'rate');
      if (!parsed.ok) return void (this.error = parsed.message);
      if (key === 'from_s' && parsed.value_si < 0) return void (this.error = `${pointer}: start time cannot be negative`);
      this.edit(`edit schedule of ${w.id}`, (d) => {
        const step = d.schedule![k]!;
        step[key] = parsed.value_si;
        d.schedule!.sort((a, b) => a.from_s - b.from_s);
      });
    };
    return html`<table class="dd-schedule"><thead><tr><th>From (${u.time})</th><th>Rate (${u.rate})</th><th></th></tr></thead><tbody>
      ${rows.map((step, k) => html`<tr>
        <td><input type="text" inputmode="decimal" aria-label="schedule step ${k + 1} start" .value=${displayValue(step.from_s, u.time)} @change=${(e: Event) => setStep(k, 'from_s', (e.target as HTMLInputElement).value)} /></td>
        <td><input type="text" inputmode="decimal" aria-label="schedule step ${k + 1} rate" .value=${displayValue(step.rate_m3_s, u.rate)} @change=${(e: Event) => setStep(k, 'rate_m3_s', (e.target as HTMLInputElement).value)} /></td>
        <td>${rows.length > 1 ? html`<button type="button" class="dd-icon" title="Remove step" @click=${() => this.edit(`edit schedule of ${w.id}`, (d) => void d.schedule!.splice(k, 1))}>×</button>` : nothing}</td>
      </tr>`)}</tbody></table>
      <button type="button" class="dd-small" @click=${() => this.edit(`edit schedule of ${w.id}`, (d) => {
        const last = d.schedule![d.schedule!.length - 1]!;
        d.schedule!.push({ from_s: last.from_s + 86400, rate_m3_s: 0 });
      })}>Add step (stop or change)</button>
      <p class="dd-hint">A rate of 0 stops the well; recovery follows from superposition in time.
        Now: ${formatQuantity(rows[0]?.rate_m3_s ?? 0, u.rate)} from ${formatQuantity(rows[0]?.from_s ?? 0, u.time)}.</p>`;
  }
}
if (!customElements.get('well-editor')) customElements.define('well-editor', WellEditor);
