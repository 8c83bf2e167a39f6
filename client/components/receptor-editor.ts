/**
 * <receptor-editor>: the neighbours the design must look after — for the selected receptor its
 * id, kind, the compressible layer beneath it (thickness, m_v) and its limits (allowable
 * settlement, drawdown limit). Lengths in display units, stored SI; every edit is one undo step,
 * and a value `validateScenario` refuses is not kept, with a message naming its JSON pointer.
 */
import { html, nothing } from 'lit';
import { LightElement } from './light-element';
import { describeIssuePlainly, getReceptors, validateScenario, type Receptor, type ReceptorKind, type Scenario } from '../../shared/schema';
import type { DisplayUnits } from '../../shared/units';
import { ensureReceptors, extendReceptor, type ScenarioStore } from '../state';
import { displayValue, parseDisplayNumber } from './unit-context';

const KINDS: ReceptorKind[] = ['building', 'wall', 'service', 'well', 'pond', 'other'];
type LayerField = 'thickness_m' | 'mv_m2_kN';
type LimitField = 'allowableSettlement_m' | 'maxDrawdown_m';

export class ReceptorEditor extends LightElement {
  static override properties = {
    store: { attribute: false }, scenario: { attribute: false }, units: { attribute: false }, receptorId: { attribute: false }, error: { state: true },
  };
  declare store: ScenarioStore | undefined;
  declare scenario: Scenario | undefined;
  declare units: DisplayUnits;
  declare receptorId: string | null;
  declare error: string;

  constructor() {
    super();
    this.receptorId = null;
    this.error = '';
  }

  /** Layer values given before the layer is complete (thickness without m_v, or m_v without thickness). */
  private pendingLayer: { id: string; thickness_m?: number; mv_m2_kN?: number } | null = null;

  private get index(): number {
    return this.scenario ? getReceptors(this.scenario).findIndex((r) => r.id === this.receptorId) : -1;
  }

  /** One undo step; nothing recorded when the change makes the scenario invalid. */
  private edit(label: string, change: (r: Receptor) => void): void {
    const i = this.index;
    if (!this.store || i < 0) return;
    let problem = '';
    this.store.apply(label, (draft) => {
      change(ensureReceptors(draft)[i]!);
      const v = validateScenario(draft);
      if (!v.ok) {
        problem = describeIssuePlainly(v.issues[0]!);
        return this.store!.scenario;
      }
    });
    this.error = problem;
  }

  private numberInput(label: string, name: string, value: number | undefined, unit: DisplayUnits['length'] | null, pointer: string, set: (r: Receptor, v: number | undefined) => void) {
    return html`<label class="dd-field"><span>${label}</span><span class="dd-input-unit">
      <input type="text" inputmode="decimal" name=${name} aria-label=${label} .value=${displayValue(value, unit)}
        @change=${(e: Event) => {
          const input = e.target as HTMLInputElement;
          if (input.value.trim() === '') return this.edit(`clear ${label.toLowerCase()}`, (r) => set(r, undefined));
          const parsed = parseDisplayNumber(input.value, unit, pointer, label.toLowerCase());
          if (!parsed.ok) {
            this.error = parsed.message;
            input.value = displayValue(value, unit);
            return;
          }
          this.edit(`set ${label.toLowerCase()}`, (r) => set(r, parsed.value_si));
          if (this.error) input.value = displayValue(value, unit);
        }} /><em>${unit ?? 'm²/kN'}</em></span></label>`;
  }

  override render() {
    const s = this.scenario;
    if (!s) return nothing;
    const list = getReceptors(s);
    const i = this.index;
    const r = i >= 0 ? list[i]! : null;
    const u = this.units.length;
    const at = `/receptors/${i}`;
    // A layer needs both its thickness and m_v: the first one given waits here for the other.
    const pending = this.pendingLayer?.id === r?.id ? this.pendingLayer : null;
    const setLayer = (field: LayerField) => (rec: Receptor, v: number | undefined) => {
      const { id: _id, ...waiting } = pending ?? { id: '' };
      const layer: { thickness_m?: number; mv_m2_kN?: number; oedometerModulus_kPa?: number; headChange?: 'uniform' | 'linear' } = { ...waiting, ...rec.compressibleLayer };
      if (v === undefined) delete layer[field];
      else layer[field] = v;
      if (field === 'mv_m2_kN') delete layer.oedometerModulus_kPa;
      if (layer.thickness_m === undefined || (layer.mv_m2_kN === undefined && layer.oedometerModulus_kPa === undefined)) {
        this.pendingLayer = { id: rec.id, ...(layer.thickness_m !== undefined ? { thickness_m: layer.thickness_m } : {}), ...(layer.mv_m2_kN !== undefined ? { mv_m2_kN: layer.mv_m2_kN } : {}) };
        delete rec.compressibleLayer;
        this.requestUpdate();
        return;
      }
      this.pendingLayer = null;
      rec.compressibleLayer = layer as Receptor['compressibleLayer'];
    };
    const setLimit = (field: LimitField) => (rec: Receptor, v: number | undefined) => {
      if (v === undefined) delete rec[field];
      else rec[field] = v;
    };
    return html`<ul class="dd-list dd-receptor-list" aria-label="Receptors">${list.map((k) => html`<li><button type="button" class=${k.id === this.receptorId ? 'dd-on' : ''} data-receptor=${k.id}
        @click=${() => this.dispatchEvent(new CustomEvent('select-receptor', { detail: k.id, bubbles: true, composed: true }))}><strong>${k.id}</strong><span>${k.kind}</span><span>${k.geometry.type === 'Point' ? 'point' : `${k.geometry.coordinates.length} points`}</span></button></li>`)}</ul>
      ${list.length === 0 ? html`<p class="dd-hint">No receptors. Use the Neighbour tool (N) to place buildings, walls, services, wells or ponds the drawdown may harm.</p>` : nothing}
      ${r ? html`<form class="dd-form dd-receptor-editor" aria-label="Receptor ${r.id}" @submit=${(e: Event) => e.preventDefault()}>
        <div class="dd-form-row">
          <label class="dd-field"><span>Kind</span><select name="receptor-kind" @change=${(e: Event) => this.edit('receptor kind', (rec) => void (rec.kind = (e.target as HTMLSelectElement).value as ReceptorKind))}>
            ${KINDS.map((k) => html`<option value=${k} ?selected=${r.kind === k}>${k}</option>`)}</select></label>
          <label class="dd-field"><span>Label</span><input type="text" name="receptor-label" maxlength="200" .value=${r.label ?? ''}
            @change=${(e: Event) => this.edit('receptor label', (rec) => {
              const v = (e.target as HTMLInputElement).value.trim();
              if (v) rec.label = v;
              else delete rec.label;
            })} /></label>
        </div>
        <div class="dd-form-row">
          ${this.numberInput('Layer thickness', 'receptor-thickness_m', r.compressibleLayer?.thickness_m ?? pending?.thickness_m, u, `${at}/compressibleLayer/thickness_m`, setLayer('thickness_m'))}
          ${this.numberInput('m_v', 'receptor-mv_m2_kN', r.compressibleLayer?.mv_m2_kN ?? pending?.mv_m2_kN, null, `${at}/compressibleLayer/mv_m2_kN`, setLayer('mv_m2_kN'))}
        </div>
        <div class="dd-form-row">
          ${this.numberInput('Allowable settlement', 'receptor-allowableSettlement_m', r.allowableSettlement_m, u, `${at}/allowableSettlement_m`, setLimit('allowableSettlement_m'))}
          ${this.numberInput('Drawdown limit', 'receptor-maxDrawdown_m', r.maxDrawdown_m, u, `${at}/maxDrawdown_m`, setLimit('maxDrawdown_m'))}
        </div>
        ${pending ? html`<p class="dd-hint" role="status">Give both the layer thickness and m_v: the layer is kept once both are in.</p>` : nothing}
        <small class="dd-hint">m_v: coefficient of volume compressibility (1/E_oed), from an oedometer test. Blank drawdown limit: the design is not held to one. Angular distortion is checked against 1/500 (Bjerrum 1963) unless the scenario sets another.</small>
        <div class="dd-actions">
          <button type="button" class="dd-small" name="extend-receptor" @click=${() => this.store?.apply(`extend ${r.id}`, (d) => extendReceptor(d, r.id))}>Add a point</button>
          <button type="button" class="dd-danger" name="delete-receptor" @click=${() => this.dispatchEvent(new CustomEvent('delete-receptor', { detail: r.id, bubbles: true, composed: true }))}>Delete receptor</button>
        </div>
        ${this.error ? html`<p class="dd-error dd-receptor-input-error" role="alert">${this.error}</p>` : nothing}
      </form>` : nothing}`;
  }
}
if (!customElements.get('receptor-editor')) customElements.define('receptor-editor', ReceptorEditor);
