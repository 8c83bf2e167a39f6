/**
 * <ground-panel>: the ground model — ground level, aquifer kind and parameters (K, levels, S or
 * Sy, leakage factor, radius of influence) in display units — and the straight boundaries.
 * Only the parameters the chosen kind uses are shown; each field states its unit and meaning.
 * Below them, the ground under the floor (`<ground-profile-editor>`, with the borehole column).
 */
import { html, nothing } from 'lit';
import { LightElement } from './light-element';
import type { Aquifer, AquiferKind, Boundary, Scenario } from '../../shared/schema';
import { formatQuantity, type DisplayUnits, type UnitId } from '../../shared/units';
import type { ScenarioStore } from '../state';
import { displayValue, parseDisplayNumber } from './unit-context';
import type { SectionResult } from '../worker/engine-protocol';
import './ground-profile-editor';
import type { DesignFloors } from './ground-profile-editor';

type AquiferNumberKey = Exclude<keyof Aquifer, 'kind'>;

interface FieldDef {
  key: AquiferNumberKey;
  label: string;
  unit: 'length' | 'velocity' | null;
  kinds: AquiferKind[];
  optional?: boolean;
  help: string;
}

const FIELDS: FieldDef[] = [
  { key: 'conductivity_m_s', label: 'Hydraulic conductivity K', unit: 'velocity', kinds: ['confined', 'unconfined', 'leaky'], help: 'From pumping tests or grading; K varies by orders of magnitude — test a range.' },
  { key: 'staticLevel_m', label: 'Static groundwater level', unit: 'length', kinds: ['confined', 'unconfined', 'leaky'], help: 'Undisturbed water table or piezometric level (elevation).' },
  { key: 'top_m', label: 'Aquifer top', unit: 'length', kinds: ['confined', 'leaky'], help: 'Elevation of the confining layer base; b = top − base.' },
  { key: 'base_m', label: 'Aquifer base', unit: 'length', kinds: ['confined', 'unconfined', 'leaky'], help: 'Elevation of the impermeable base.' },
  { key: 'storativity', label: 'Storativity S', unit: null, kinds: ['confined', 'leaky'], help: 'Dimensionless; confined aquifers typically 10⁻⁵–10⁻³.' },
  { key: 'specificYield', label: 'Specific yield Sy', unit: null, kinds: ['unconfined'], help: 'Dimensionless; sands typically 0.1–0.3.' },
  { key: 'leakageFactor_m', label: 'Leakage factor B', unit: 'length', kinds: ['leaky'], help: 'B = √(T·c), c the aquitard resistance.' },
  { key: 'influenceRadius_m', label: 'Radius of influence R', unit: 'length', kinds: ['confined', 'unconfined'], optional: true, help: 'Steady runs only. Empty: Sichardt estimate R = 3000·s·√K.' },
];

export class GroundPanel extends LightElement {
  static override properties = {
    store: { attribute: false }, scenario: { attribute: false }, units: { attribute: false }, error: { state: true },
    excavationId: { attribute: false }, floors: { attribute: false }, section: { attribute: false },
  };
  /** The excavation selected in the app, the last design's floor checks and the section line's result, for the profile. */
  declare excavationId: string | null;
  declare floors: DesignFloors | null;
  declare section: SectionResult | null;
  declare store: ScenarioStore | undefined;
  declare scenario: Scenario | undefined;
  declare units: DisplayUnits;
  declare error: string;

  constructor() {
    super();
    this.error = '';
    this.excavationId = null;
    this.floors = null;
    this.section = null;
  }

  private setAquifer(def: FieldDef, text: string): void {
    const pointer = `/aquifer/${def.key}`;
    const unit: UnitId | null = def.unit ? this.units[def.unit] : null;
    if (def.optional && text.trim() === '') {
      this.store?.apply(`clear ${def.label}`, (d) => void delete d.aquifer[def.key]);
      this.error = '';
      return;
    }
    const parsed = parseDisplayNumber(text, unit, pointer, def.label);
    if (!parsed.ok) return void (this.error = parsed.message);
    const v = parsed.value_si;
    if (['conductivity_m_s', 'storativity', 'specificYield', 'leakageFactor_m', 'influenceRadius_m'].includes(def.key) && !(v > 0)) {
      return void (this.error = `${pointer}: ${def.label} must be greater than 0`);
    }
    if ((def.key === 'storativity' || def.key === 'specificYield') && v >= 1) return void (this.error = `${pointer}: ${def.label} is a fraction below 1`);
    if (def.key === 'conductivity_m_s' && v > 1) return void (this.error = `${pointer}: K above 1 m/s is not a soil; check the unit`);
    this.error = '';
    this.store?.apply(`set ${def.label}`, (d) => void (d.aquifer[def.key] = v));
  }

  private setKind(kind: AquiferKind): void {
    this.store?.apply(`aquifer ${kind}`, (d) => {
      const a = d.aquifer;
      a.kind = kind;
      // Fill what the new kind needs with neutral starting values the user must then check.
      if (kind !== 'unconfined') {
        a.top_m ??= Math.min(a.staticLevel_m, (a.staticLevel_m + a.base_m) / 2);
        a.storativity ??= 2e-4;
      }
      if (kind === 'unconfined') a.specificYield ??= 0.15;
      if (kind === 'leaky') a.leakageFactor_m ??= 500;
    });
  }

  override render() {
    const s = this.scenario;
    if (!s) return nothing;
    const a = s.aquifer;
    const u = this.units;
    const thickness = a.kind === 'unconfined' ? a.staticLevel_m - a.base_m : (a.top_m ?? a.staticLevel_m) - a.base_m;
    const T = a.conductivity_m_s * thickness;
    return html`<div class="dd-form dd-ground">
      <label class="dd-field"><span>Ground level</span><span class="dd-input-unit"><input type="text" name="groundLevel_m" inputmode="decimal" .value=${displayValue(s.groundLevel_m, u.length)}
        @change=${(e: Event) => {
          const parsed = parseDisplayNumber((e.target as HTMLInputElement).value, u.length, '/groundLevel_m', 'ground level');
          if (!parsed.ok) return void (this.error = parsed.message);
          this.error = '';
          this.store?.apply('set ground level', (d) => void (d.groundLevel_m = parsed.value_si));
        }} /><em>${u.length}</em></span></label>
      <label class="dd-field"><span>Aquifer</span><select name="aquifer-kind" @change=${(e: Event) => this.setKind((e.target as HTMLSelectElement).value as AquiferKind)}>
        <option value="unconfined" ?selected=${a.kind === 'unconfined'}>Unconfined (water table)</option>
        <option value="confined" ?selected=${a.kind === 'confined'}>Confined (artesian / piezometric)</option>
        <option value="leaky" ?selected=${a.kind === 'leaky'}>Leaky (semi-confined)</option></select></label>
      ${FIELDS.filter((f) => f.kinds.includes(a.kind)).map((f) => {
        const unit = f.unit ? u[f.unit] : null;
        return html`<label class="dd-field" title=${f.help}><span>${f.label}</span><span class="dd-input-unit">
          <input type="text" inputmode="decimal" name=${f.key} .value=${displayValue(a[f.key] as number | undefined, unit)} placeholder=${f.optional ? 'Sichardt estimate' : ''}
            @change=${(e: Event) => this.setAquifer(f, (e.target as HTMLInputElement).value)} />${unit ? html`<em>${unit}</em>` : html`<em>—</em>`}</span>
          <small>${f.help}</small></label>`;
      })}
      <p class="dd-facts">Transmissivity T = K·${a.kind === 'unconfined' ? 'H' : 'b'} = ${formatQuantity(T, u.transmissivity)}
        (${a.kind === 'unconfined' ? 'saturated' : 'aquifer'} thickness ${formatQuantity(thickness, u.length, { decimals: 2 })}).</p>
      ${this.error ? html`<p class="dd-error" role="alert">${this.error}</p>` : nothing}
      <ground-profile-editor .store=${this.store} .scenario=${s} .units=${u} .excavationId=${this.excavationId} .floors=${this.floors} .section=${this.section}></ground-profile-editor>
      <h3>Boundaries</h3>
      <p class="dd-hint">Straight lines treated by image wells (Ferris et al. 1962): a river or lake in good contact is constant-head; a cut-off wall or rock valley side is no-flow. Draw with the Boundary tool.</p>
      <ul class="dd-list dd-boundaries">${(s.boundaries ?? []).map((b, i) => this.renderBoundary(b, i))}</ul>
      <div class="dd-actions"><button type="button" name="draw-boundary" @click=${() => this.emit('choose-tool', 'boundary')}>Draw boundary</button></div>
    </div>`;
  }

  private renderBoundary(b: Boundary, i: number) {
    const u = this.units;
    const len = Math.hypot(b.to[0] - b.from[0], b.to[1] - b.from[1]);
    return html`<li class="dd-boundary-row">
      <select aria-label="Boundary ${i + 1} kind" @change=${(e: Event) => this.store?.apply('boundary kind', (d) => void (d.boundaries![i]!.kind = (e.target as HTMLSelectElement).value as Boundary['kind']))}>
        <option value="constant-head" ?selected=${b.kind === 'constant-head'}>Constant head</option>
        <option value="no-flow" ?selected=${b.kind === 'no-flow'}>No flow</option></select>
      <input type="text" aria-label="Boundary ${i + 1} label" placeholder="label" .value=${b.label ?? ''} maxlength="200"
        @change=${(e: Event) => this.store?.apply('boundary label', (d) => {
          const v = (e.target as HTMLInputElement).value.trim();
          if (v) d.boundaries![i]!.label = v;
          else delete d.boundaries![i]!.label;
        })} />
      <small>through ${formatQuantity(len, u.length, { significant: 3 })} drawn</small>
      <button type="button" class="dd-icon" title="Delete boundary" @click=${() => this.store?.apply('delete boundary', (d) => void d.boundaries!.splice(i, 1))}>×</button>
    </li>`;
  }
}
if (!customElements.get('ground-panel')) customElements.define('ground-panel', GroundPanel);
