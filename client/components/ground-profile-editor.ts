/**
 * <ground-profile-editor>: the ground under the floor (design.md §8) for the site or one
 * excavation — layers from the top down with their levels in display units, kind (plug or
 * granular), unit weights and an optional K; add a layer below, remove one, or start from the
 * aquifer levels. Every edit is one undo step through the scenario store. A typed value that
 * cannot be a soil is refused with a message naming the layer and the field; a profile whose
 * layers do not fit together is kept (so it can be mended step by step) and its problems are
 * listed in plain words. Beside it, the borehole column and the section chart. Inputs always
 * show what the scenario holds (`live`): a refused value leaves the field at the kept one, and
 * the message repeats what was typed.
 */
import { html, nothing } from 'lit';
import { live } from 'lit/directives/live.js';
import { LightElement } from './light-element';
import type { GroundLayer, GroundProfile, Scenario } from '../../shared/schema';
import { CONDUCTIVITY_RANGE_M_S, LEVEL_LIMIT_M, UNIT_WEIGHT_RANGE_kN_m3, groundProfileIssues } from '../../shared/schema';
import type { DesignFloorResult } from '../../shared/design/design-result';
import {
  BOREHOLE_LABELS, GROUND_EDITOR_TEXT, GROUND_LAYER_FIELD_LABELS, GROUND_LAYER_KIND_LABELS,
  groundFieldName, groundProfileIssueText, outOfRangeText, type GroundLayerField,
} from '../../shared/floor/floor-wording';
import { formatQuantity, fromSi, type DisplayUnits, type UnitId } from '../../shared/units';
import type { SectionResult } from '../worker/engine-protocol';
import {
  getOwnedProfile, moveLayerEdge, profileFromAquifer, removeLayer, setOwnedProfile, splitLayer,
  type ProfileOwner, type ScenarioStore,
} from '../state';
import { displayValue, parseDisplayNumber } from './unit-context';
import './borehole-column';
import './section-chart';

/** The last design's floor blocks, by excavation id, and whether the scenario changed since. */
export interface DesignFloors {
  byExcavation: ReadonlyMap<string, DesignFloorResult>;
  stale: boolean;
}

type NumberField = Exclude<GroundLayerField, 'id' | 'kind'>;

const SITE = '';

export class GroundProfileEditor extends LightElement {
  static override properties = {
    store: { attribute: false }, scenario: { attribute: false }, units: { attribute: false },
    excavationId: { attribute: false }, floors: { attribute: false }, section: { attribute: false },
    ownerChoice: { state: true }, error: { state: true },
  };
  declare store: ScenarioStore | undefined;
  declare scenario: Scenario | undefined;
  declare units: DisplayUnits;
  /** The excavation selected in the app (its formation is drawn on the site column). */
  declare excavationId: string | null;
  declare floors: DesignFloors | null;
  declare section: SectionResult | null;
  /** Chosen owner: SITE or an excavation id; null until the user chooses. */
  declare ownerChoice: string | null;
  declare error: string;

  constructor() {
    super();
    this.excavationId = null;
    this.floors = null;
    this.section = null;
    this.ownerChoice = null;
    this.error = '';
  }

  /** Whose profile is edited: the user's choice, else the selected excavation's own, else the site's. */
  private get owner(): ProfileOwner {
    const s = this.scenario!;
    const choice = this.ownerChoice ?? (s.excavations.find((e) => e.id === this.excavationId)?.ground ? this.excavationId : SITE);
    if (choice && s.excavations.some((e) => e.id === choice)) return { kind: 'excavation', id: choice };
    return { kind: 'site' };
  }

  /** The excavation whose formation the column shows. */
  private shownExcavation(owner: ProfileOwner) {
    const ex = this.scenario!.excavations;
    if (owner.kind === 'excavation') return ex.find((e) => e.id === owner.id) ?? null;
    const selected = ex.find((e) => e.id === this.excavationId && !e.ground);
    return selected ?? ex.find((e) => !e.ground) ?? null;
  }

  private change(label: string, owner: ProfileOwner, profile: GroundProfile | null): void {
    this.error = '';
    this.store?.apply(label, (d) => setOwnedProfile(d, owner, profile));
  }

  private unitOf(field: NumberField): UnitId | null {
    if (field === 'top_m' || field === 'bottom_m') return this.units.length;
    if (field === 'conductivity_m_s') return this.units.velocity;
    return null;
  }

  /** A typed number for a layer field: the new profile, or a message naming the field. */
  private editNumber(profile: GroundProfile, i: number, field: NumberField, text: string): { profile: GroundProfile } | { message: string } {
    const layer = profile.layers[i]!;
    const name = groundFieldName(i, layer.id, field);
    const optional = field === 'unitWeight_kN_m3' || field === 'conductivity_m_s';
    if (optional && text.trim() === '') {
      const layers = profile.layers.map((l, k) => {
        if (k !== i) return l;
        const copy = { ...l };
        delete copy[field];
        return copy;
      });
      return { profile: { layers } };
    }
    const unit = this.unitOf(field);
    const parsed = parseDisplayNumber(text, unit, GROUND_EDITOR_TEXT.layerTitle(i + 1, layer.id), GROUND_LAYER_FIELD_LABELS[field]);
    if (!parsed.ok) return { message: parsed.message };
    const v = parsed.value_si;
    const typed = `${text.trim()}${unit ? ` ${unit}` : ' kN/m³'}`;
    if (field === 'top_m' || field === 'bottom_m') {
      if (Math.abs(v) > LEVEL_LIMIT_M) return { message: outOfRangeText(name, typed, `±${formatQuantity(LEVEL_LIMIT_M, this.units.length, { significant: 3 })} of the site datum`) };
      return { profile: moveLayerEdge(profile, i, field, v) };
    }
    if (field === 'conductivity_m_s') {
      const [lo, hi] = CONDUCTIVITY_RANGE_M_S;
      if (!(v >= lo && v <= hi)) return { message: outOfRangeText(name, typed, `${formatQuantity(lo, this.units.velocity, { significant: 1 })} to ${formatQuantity(hi, this.units.velocity, { significant: 2 })}`) };
    } else {
      const { minimum, maximum } = UNIT_WEIGHT_RANGE_kN_m3;
      if (!(v >= minimum && v <= maximum)) return { message: outOfRangeText(name, typed, `${minimum}–${maximum} kN/m³ (plausible soils)`) };
    }
    return { profile: { layers: profile.layers.map((l, k) => (k === i ? { ...l, [field]: v } : l)) } };
  }

  private onNumber(owner: ProfileOwner, profile: GroundProfile, i: number, field: NumberField, text: string): void {
    const out = this.editNumber(profile, i, field, text);
    if ('message' in out) return void (this.error = out.message);
    this.change(`set ${GROUND_LAYER_FIELD_LABELS[field]} of layer ${profile.layers[i]!.id}`, owner, out.profile);
  }

  private onName(owner: ProfileOwner, profile: GroundProfile, i: number, text: string): void {
    const id = text.trim();
    const name = groundFieldName(i, profile.layers[i]!.id, 'id');
    if (id === '') return void (this.error = `${name} is empty — give the layer a name (for example “clay”).`);
    if (id.length > 64) return void (this.error = `${name}: at most 64 characters.`);
    if (profile.layers.some((l, k) => k !== i && l.id === id)) return void (this.error = `${name}: another layer is already called “${id}”; give each layer its own name.`);
    this.change(`rename layer ${profile.layers[i]!.id}`, owner, { layers: profile.layers.map((l, k) => (k === i ? { ...l, id } : l)) });
  }

  private numberField(owner: ProfileOwner, profile: GroundProfile, i: number, field: NumberField) {
    const l = profile.layers[i]!;
    const unit = this.unitOf(field);
    const placeholder = field === 'unitWeight_kN_m3' ? GROUND_EDITOR_TEXT.moistEmpty : field === 'conductivity_m_s' ? GROUND_EDITOR_TEXT.kOptional : '';
    return html`<label class="dd-field"><span>${GROUND_LAYER_FIELD_LABELS[field]}</span><span class="dd-input-unit">
      <input type="text" inputmode="decimal" name=${`layer-${i}-${field}`} .value=${live(displayValue(l[field], unit))} placeholder=${placeholder}
        @change=${(e: Event) => this.onNumber(owner, profile, i, field, (e.target as HTMLInputElement).value)} /><em>${unit ?? 'kN/m³'}</em></span></label>`;
  }

  private layerForm(owner: ProfileOwner, profile: GroundProfile, l: GroundLayer, i: number) {
    const last = profile.layers.length === 1;
    return html`<fieldset class="dd-layer" data-layer=${l.id} data-kind=${l.kind}>
      <legend>${GROUND_EDITOR_TEXT.layerTitle(i + 1, l.id)}</legend>
      <div class="dd-layer-grid">
        <div class="dd-layer-head"><label class="dd-field"><span>${GROUND_LAYER_FIELD_LABELS.id}</span><input type="text" name=${`layer-${i}-id`} maxlength="64" .value=${live(l.id)}
          @change=${(e: Event) => this.onName(owner, profile, i, (e.target as HTMLInputElement).value)} /></label>
        <label class="dd-field"><span>${GROUND_LAYER_FIELD_LABELS.kind}</span><select name=${`layer-${i}-kind`}
          @change=${(e: Event) => this.change(`kind of layer ${l.id}`, owner, { layers: profile.layers.map((x, k) => (k === i ? { ...x, kind: (e.target as HTMLSelectElement).value as GroundLayer['kind'] } : x)) })}>
          ${(['plug', 'granular'] as const).map((k) => html`<option value=${k} ?selected=${l.kind === k}>${GROUND_LAYER_KIND_LABELS[k].long}</option>`)}</select></label></div>
        ${this.numberField(owner, profile, i, 'top_m')}
        ${this.numberField(owner, profile, i, 'bottom_m')}
        ${this.numberField(owner, profile, i, 'unitWeightSat_kN_m3')}
        ${this.numberField(owner, profile, i, 'unitWeight_kN_m3')}
        ${this.numberField(owner, profile, i, 'conductivity_m_s')}
      </div>
      ${l.description ? html`<p class="dd-hint">${l.description}</p>` : nothing}
      <div class="dd-actions">
        <button type="button" class="dd-small" name=${`layer-${i}-add-below`} title=${GROUND_EDITOR_TEXT.addBelowHint}
          @click=${() => this.change(`add a layer below ${l.id}`, owner, splitLayer(profile, i))}>${GROUND_EDITOR_TEXT.addBelow}</button>
        <button type="button" class="dd-small dd-danger" name=${`layer-${i}-remove`}
          @click=${() => this.change(last ? 'remove the ground profile' : `remove layer ${l.id}`, owner, removeLayer(profile, i))}>${last ? GROUND_EDITOR_TEXT.removeLast : GROUND_EDITOR_TEXT.remove}</button>
      </div>
    </fieldset>`;
  }

  private issues(profile: GroundProfile): string[] {
    const s = this.scenario!;
    const u = this.units.length;
    return groundProfileIssues(profile, '', s.aquifer, s.groundLevel_m).map((issue) =>
      groundProfileIssueText(issue.path, issue.message, {
        layers: profile.layers, groundLevel_m: s.groundLevel_m, aquifer: s.aquifer,
        formatLevel: (v) => formatQuantity(v, u, { decimals: fromSi(1, u) === 1 ? 2 : 1 }),
      }),
    );
  }

  private column(owner: ProfileOwner, profile: GroundProfile | null) {
    const s = this.scenario!;
    const ex = this.shownExcavation(owner);
    const floor = ex ? this.floors?.byExcavation.get(ex.id) : undefined;
    const design = floor ? { head_m: floor.critical.level_m, allowable_m: floor.allowableLevel_m, stale: this.floors!.stale } : null;
    return html`<div class="dd-ground-figures">
      <borehole-column .layers=${profile?.layers ?? null} .units=${this.units} .groundLevel_m=${s.groundLevel_m} .staticLevel_m=${s.aquifer.staticLevel_m}
        .formation=${ex ? { id: ex.id, level_m: ex.formationLevel_m } : null} .design=${design}
        .caption=${owner.kind === 'site' ? 'site' : `excavation ${owner.id}`}></borehole-column>
      ${this.section ? html`<div class="dd-ground-section"><section-chart .section=${this.section} .scenario=${s} .units=${this.units}></section-chart></div>` : html`<p class="dd-hint">${BOREHOLE_LABELS.noSection}</p>`}
    </div>`;
  }

  override render() {
    const s = this.scenario;
    if (!s) return nothing;
    const owner = this.owner;
    const { profile } = getOwnedProfile(s, owner);
    const ownerKey = owner.kind === 'site' ? SITE : owner.id;
    const issues = profile ? this.issues(profile) : [];
    return html`<section class="dd-ground-profile" aria-label=${GROUND_EDITOR_TEXT.heading}>
      <h3>${GROUND_EDITOR_TEXT.heading}</h3>
      <label class="dd-field"><span>${GROUND_EDITOR_TEXT.profileOf}</span><select name="profile-owner" @change=${(e: Event) => {
        this.ownerChoice = (e.target as HTMLSelectElement).value;
        this.error = '';
      }}>
        <option value=${SITE} ?selected=${ownerKey === SITE}>${GROUND_EDITOR_TEXT.site}</option>
        ${s.excavations.map((e) => html`<option value=${e.id} ?selected=${ownerKey === e.id}>${e.ground ? GROUND_EDITOR_TEXT.excavationOwn(e.id) : GROUND_EDITOR_TEXT.excavationUsesSite(e.id)}</option>`)}
      </select></label>
      ${profile ? this.column(owner, profile) : nothing}
      ${!profile && owner.kind === 'excavation' ? html`<p class="dd-hint">${GROUND_EDITOR_TEXT.usesSite(owner.id)}</p>` : nothing}
      ${!profile && (owner.kind === 'site' || !s.ground) ? html`<p class="dd-warn">${GROUND_EDITOR_TEXT.none}</p>` : nothing}
      ${this.error ? html`<p class="dd-error" role="alert" data-field-error>${this.error}</p>` : nothing}
      ${issues.length > 0 ? html`<div class="dd-error" role="alert" data-profile-issues><strong>${GROUND_EDITOR_TEXT.issuesHeading}</strong><ul>${issues.map((t) => html`<li>${t}</li>`)}</ul></div>` : nothing}
      ${profile ? html`<p class="dd-hint">${GROUND_EDITOR_TEXT.hint}</p>${profile.layers.map((l, i) => this.layerForm(owner, profile, l, i))}` : nothing}
      <div class="dd-actions">
        ${owner.kind === 'excavation' && !profile && s.ground
          ? html`<button type="button" name="profile-copy-site" @click=${() => this.change(`own ground profile for ${owner.id}`, owner, structuredClone(s.ground!))}>${GROUND_EDITOR_TEXT.copySite}</button>` : nothing}
        ${owner.kind === 'excavation' && profile
          ? html`<button type="button" name="profile-drop-own" class="dd-danger" @click=${() => this.change(`remove the own ground profile of ${owner.id}`, owner, null)}>${GROUND_EDITOR_TEXT.dropOwn}</button>` : nothing}
        <button type="button" name="profile-from-aquifer" title=${GROUND_EDITOR_TEXT.startHint}
          @click=${() => this.change(profile ? 'ground profile from the aquifer levels (replacing it)' : 'ground profile from the aquifer levels', owner, profileFromAquifer(s))}>${GROUND_EDITOR_TEXT.startFromAquifer}</button>
      </div>
    </section>`;
  }
}
if (!customElements.get('ground-profile-editor')) customElements.define('ground-profile-editor', GroundProfileEditor);
