/**
 * <results-panel>: what the contours show (drawdown or groundwater level), the interval, the time
 * control (log-spaced times up to the design time, or steady state), the excavation badges, the
 * engine's validity flags and model notes, and the caution.
 */
import { html, nothing } from 'lit';
import { LightElement } from './light-element';
import type { FieldResult, FieldQuantity } from '../worker/engine-protocol';
import { formatQuantity, type DisplayUnits } from '../../shared/units';
import { formatDuration } from './time-format';
import { FLAG_LABELS } from './flag-labels';
import { displayValue, parseDisplayNumber } from './unit-context';
import './shortfall-badges';
import './caution-note';

export class ResultsPanel extends LightElement {
  static override properties = {
    result: { attribute: false }, units: { attribute: false }, times: { attribute: false }, timeIndex: { type: Number },
    quantity: { type: String }, step_m: { attribute: false }, error: { type: String }, paused: { type: Boolean },
  };
  declare result: FieldResult | null;
  declare units: DisplayUnits;
  declare times: Array<number | null>;
  declare timeIndex: number;
  declare quantity: FieldQuantity;
  declare step_m: number | undefined;
  declare error: string;
  /** Results paused by an invalid field (the badges say "not computed"). */
  declare paused: boolean;

  constructor() {
    super();
    this.result = null;
    this.times = [null];
    this.timeIndex = 0;
    this.quantity = 'drawdown';
    this.step_m = undefined;
    this.error = '';
    this.paused = false;
  }

  override render() {
    const r = this.result;
    const u = this.units;
    const t = this.times[this.timeIndex] ?? null;
    const steadyOnly = this.times.length === 1 && this.times[0] === null;
    return html`<div class="dd-results">
      <fieldset class="dd-segmented" aria-label="Contours show">
        <legend>Contours show</legend>
        <label><input type="radio" name="quantity" value="drawdown" ?checked=${this.quantity === 'drawdown'} @change=${() => this.emit('quantity-change', 'drawdown')} /> Drawdown</label>
        <label><input type="radio" name="quantity" value="level" ?checked=${this.quantity === 'level'} @change=${() => this.emit('quantity-change', 'level')} /> ${r?.model.method.startsWith('theis-unconfined') || r?.model.method === 'dupuit-thiem' ? 'Water table' : 'Groundwater level'}</label>
      </fieldset>
      <label class="dd-field"><span>Contour interval</span><span class="dd-input-unit">
        <input type="text" name="contour-step" inputmode="decimal" placeholder="auto" .value=${displayValue(this.step_m, u.length)}
          @change=${(e: Event) => {
            const text = (e.target as HTMLInputElement).value;
            if (text.trim() === '') return this.emit('step-change', undefined);
            const p = parseDisplayNumber(text, u.length, 'view/contour/step_m', 'contour interval');
            if (!p.ok || p.value_si <= 0) return this.emit('notify', p.ok ? 'The contour interval must be greater than 0.' : p.message);
            this.emit('step-change', p.value_si);
          }} /><em>${u.length}</em></span></label>
      <div class="dd-time">
        <label for="dd-time-slider">Time since pumping started: <output name="time-label">${formatDuration(t)}</output>${t !== null && this.timeIndex === this.times.length - 1 ? html` <span class="dd-tag">design time</span>` : nothing}</label>
        ${steadyOnly
          ? html`<p class="dd-hint">The scenario is steady state (design time null): one picture, no time control.</p>`
          : html`<input id="dd-time-slider" type="range" name="time" min="0" max=${this.times.length - 1} step="1" .value=${String(this.timeIndex)}
              aria-valuetext=${formatDuration(t)} @input=${(e: Event) => this.emit('time-change', Number((e.target as HTMLInputElement).value))} />
            <div class="dd-time-ends"><span>${formatDuration(this.times[0] ?? null)}</span><span>log scale</span><span>${formatDuration(this.times[this.times.length - 1] ?? null)}</span></div>`}
      </div>
      ${this.error ? html`<p class="dd-error" role="alert">${this.error}</p>` : nothing}
      ${r ? html`
        <h3>Excavations at the time shown (${formatDuration(r.time_s)})</h3>
        <shortfall-badges .shortfall=${r.shortfall} .units=${u} ?paused=${this.paused} .designTime_s=${this.times[this.times.length - 1] ?? null}></shortfall-badges>
        <h3>Range on the map</h3>
        <p class="dd-facts">${this.quantity === 'drawdown' ? 'Drawdown' : 'Level'} ${formatQuantity(r.range.min, u.length, { decimals: 2 })} to ${formatQuantity(r.range.max, u.length, { decimals: 2 })};
          ${r.levels.length} contours at ${r.levels.length > 1 ? formatQuantity(r.levels[1]! - r.levels[0]!, u.length, { significant: 2 }) : '—'}.
          Method: ${methodName(r.model.method)}${r.model.influenceRadius_m ? `, R = ${formatQuantity(r.model.influenceRadius_m, u.length, { significant: 3 })} (${r.model.influenceRadiusSource})` : ''};
          T = ${formatQuantity(r.model.transmissivity_m2_s, u.transmissivity)}.</p>
        ${r.levelsWanted ? html`<p class="dd-warn" data-note="levels-capped" role="status">That contour interval would need ${r.levelsWanted} contours over this range; they are drawn every
          ${formatQuantity(r.levels.length > 1 ? Math.abs(r.levels[1]! - r.levels[0]!) : 0, u.length, { significant: 3 })} instead (at most 60). Choose a larger interval, or leave it blank for automatic.</p>` : nothing}
        ${this.renderFlags(r)}
        <caution-note .notes=${r.model.notes}></caution-note>` : html`<caution-note></caution-note>`}
    </div>`;
  }

  private renderFlags(r: FieldResult) {
    const present = Object.entries(r.flagCounts).filter(([f, n]) => n > 0 && f !== 'within-well-radius');
    if (present.length === 0) return html`<p class="dd-ok">No validity flags on the map grid.</p>`;
    return html`<ul class="dd-flags" aria-label="Validity flags">${present.map(([f, n]) => html`<li class="dd-flag dd-flag-${f}">
      <span class="dd-flag-swatch" aria-hidden="true"></span><strong>${FLAG_LABELS[f]?.title ?? f}</strong> — ${FLAG_LABELS[f]?.meaning ?? ''} <small>(${n} grid nodes)</small></li>`)}</ul>`;
  }
}

/** Published name of the engine's method. */
export function methodName(method: string): string {
  return ({
    theis: 'Theis (1935)', thiem: 'Thiem (1906)', 'theis-unconfined': 'Theis with Jacob’s correction (unconfined)',
    'dupuit-thiem': 'Dupuit–Thiem', 'hantush-jacob': 'Hantush–Jacob (1955)', 'de-glee': 'de Glee (1930)',
  } as Record<string, string>)[method] ?? method;
}
if (!customElements.get('results-panel')) customElements.define('results-panel', ResultsPanel);
