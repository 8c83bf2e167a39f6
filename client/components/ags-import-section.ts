/**
 * <ags-import-section>: an AGS4 ground investigation into the scenario. The boreholes appear on
 * the plan at their coordinates; for the picked hole the strata (depths, levels, descriptions)
 * and the water strikes are listed. One action builds the ground profile and the aquifer levels
 * from one hole, or interpolated between several at the first excavation's centre — but only
 * after the designer has confirmed each layer's kind and unit weights. The file's SHA-256 is kept
 * with the scenario.
 */
import { html, nothing } from 'lit';
import { LightElement } from './light-element';
import { UNIT_WEIGHT_RANGE_kN_m3, type Scenario } from '../../shared/schema';
import { buildGroundFromBoreholes, type Borehole, type GroundFromBoreholes, type GroundLayerSuggestion } from '../../shared/import';
import { getPolygonCentroid } from '../../shared/geometry';
import { formatQuantity, type DisplayUnits } from '../../shared/units';
import type { ScenarioStore } from '../state';
import { ImportFailed, type AgsImportResult, type ImportClient } from '../worker';
import type { SiteImportLayer } from '../map';
import { applyGroundProfile, recordImport } from '../import';
import { IMPORT_WORDS } from './site-import-words';

/** Largest AGS file opened, bytes (the engine reads up to 32 MB of text). */
const MAX_AGS_BYTES = 32 * 1024 * 1024;

const level = (v: number, u: DisplayUnits) => formatQuantity(v, u.length, { decimals: 2 });

export class AgsImportSection extends LightElement {
  static override properties = {
    store: { attribute: false }, scenario: { attribute: false }, units: { attribute: false }, client: { attribute: false }, layer: { attribute: false },
    fileName: { state: true }, result: { state: true }, holeId: { state: true }, chosen: { state: true }, suggestion: { state: true },
    confirmed: { state: true }, baseAtLogEnd: { state: true }, error: { state: true }, message: { state: true },
  };
  declare store: ScenarioStore | undefined;
  declare scenario: Scenario | undefined;
  declare units: DisplayUnits;
  declare client: ImportClient | undefined;
  declare layer: SiteImportLayer | undefined;
  declare fileName: string;
  declare result: AgsImportResult | null;
  /** Borehole whose log is shown. */
  declare holeId: string | null;
  /** Holes the profile is built from. */
  declare chosen: readonly string[];
  declare suggestion: GroundFromBoreholes | null;
  declare confirmed: readonly boolean[];
  declare baseAtLogEnd: boolean;
  declare error: string;
  declare message: string;

  constructor() {
    super();
    this.fileName = '';
    this.result = null;
    this.holeId = null;
    this.chosen = [];
    this.suggestion = null;
    this.confirmed = [];
    this.baseAtLogEnd = false;
    this.error = '';
    this.message = '';
  }

  /** Picks a hole (from the list or the map). */
  pickHole(id: string): void {
    this.holeId = id;
    this.layer?.setView({ boreholeId: id });
  }

  private async open(input: HTMLInputElement): Promise<void> {
    const file = input.files?.[0];
    if (!file || !this.client) return;
    if (file.size > MAX_AGS_BYTES) return void (this.error = `AGS file: ${file.name} is larger than 32 MB; export only the groups LOCA, GEOL, WSTG and WSTD.`);
    this.error = '';
    this.message = '';
    this.suggestion = null;
    try {
      const result = await this.client.ags(await file.text());
      if (result.boreholes.length === 0) throw new ImportFailed('AGS file: it has no boreholes (no LOCA rows)');
      this.result = result;
      this.fileName = file.name;
      this.holeId = result.boreholes[0]!.id;
      this.chosen = [result.boreholes[0]!.id];
      this.layer?.setView({ boreholes: result.boreholes, boreholeId: this.holeId });
      this.emit('import-fit', this.layer?.extent() ?? []);
    } catch (error) {
      this.result = null;
      this.layer?.setView({ boreholes: [], boreholeId: null });
      this.error = error instanceof ImportFailed ? error.message : `AGS file: ${(error as Error).message}`;
    }
  }

  private toggleChosen(id: string, on: boolean): void {
    this.chosen = on ? [...new Set([...this.chosen, id])] : this.chosen.filter((c) => c !== id);
    this.suggestion = null;
  }

  private build(): void {
    const r = this.result;
    if (!r) return;
    const pit = this.scenario?.excavations[0];
    try {
      const at = this.chosen.length > 1 && pit ? getPolygonCentroid(pit.outline) : undefined;
      if (this.chosen.length > 1 && !at) throw new Error('interpolating between holes needs an excavation: its centre is where the profile is interpolated');
      this.suggestion = buildGroundFromBoreholes({ boreholes: r.boreholes, ids: this.chosen, ...(at ? { at } : {}) });
      this.confirmed = this.suggestion.layers.map(() => false);
      this.error = '';
      this.message = '';
    } catch (error) {
      this.suggestion = null;
      this.error = `Ground profile: ${(error as Error).message}.`;
    }
  }

  private editLayer(i: number, patch: Partial<GroundLayerSuggestion>): void {
    const s = this.suggestion;
    if (!s) return;
    this.suggestion = { ...s, layers: s.layers.map((l, k) => (k === i ? { ...l, ...patch } : l)) };
    // A changed layer is confirmed again by the designer.
    this.confirmed = this.confirmed.map((c, k) => (k === i ? false : c));
  }

  private setWeight(i: number, key: 'unitWeightSat_kN_m3' | 'unitWeight_kN_m3', text: string, label: string): void {
    const v = Number(text.replace(',', '.'));
    const { minimum, maximum } = UNIT_WEIGHT_RANGE_kN_m3;
    if (!(v >= minimum && v <= maximum)) {
      this.error = `Layer ${i + 1} ${label}: "${text}" must be a unit weight between ${minimum} and ${maximum} kN/m³.`;
      this.requestUpdate();
      return;
    }
    this.error = '';
    this.editLayer(i, { [key]: v });
  }

  private apply(): void {
    const s = this.suggestion;
    const r = this.result;
    if (!s || !r || !this.store) return;
    const bad = s.layers.findIndex((l) => l.unitWeight_kN_m3 > l.unitWeightSat_kN_m3);
    if (bad >= 0) return void (this.error = `Layer ${bad + 1}: the moist unit weight must not exceed the saturated unit weight.`);
    let changes: string[] = [];
    this.store.apply(`ground profile from ${this.chosen.join(', ')}`, (d) => {
      changes = applyGroundProfile(d, { layers: s.layers, groundLevel_m: s.groundLevel_m, staticLevel_m: s.staticLevel_m, baseAtLogEnd: this.baseAtLogEnd });
      recordImport(d, {
        kind: 'ags', name: this.fileName.slice(0, 200), sha256: r.sha256, importedAt: new Date().toISOString(),
        used: `ground profile from ${this.chosen.length > 1 ? `${this.chosen.join(', ')} (interpolated)` : this.chosen[0]}`.slice(0, 500),
      });
    });
    this.message = `Applied: ${changes.join('; ')}. The file is kept by its SHA-256 (${r.sha256.slice(0, 12)}…). Undo brings the previous ground back.`;
    this.error = '';
  }

  override render() {
    const r = this.result;
    const u = this.units;
    const hole = r?.boreholes.find((b) => b.id === this.holeId) ?? null;
    return html`<section class="dd-import-block" data-import="ags">
      <h3>Ground investigation (AGS)</h3>
      <p class="dd-hint">${IMPORT_WORDS.agsHint}</p>
      <label>AGS file <input type="file" name="import-ags" accept=".ags,.txt,text/plain" @change=${(e: Event) => this.open(e.target as HTMLInputElement)} /></label>
      ${this.error ? html`<p class="dd-error" role="alert" data-test="ags-error">${this.error}</p>` : nothing}
      ${r ? html`<p class="dd-facts" data-test="ags-summary">${this.fileName}: ${r.boreholes.length} borehole(s); groups ${r.groups.join(', ')}. SHA-256 ${r.sha256.slice(0, 12)}…</p>
        <table class="dd-import-table" data-test="ags-boreholes">
          <thead><tr><th>Use</th><th>Borehole</th><th>Easting</th><th>Northing</th><th>Ground</th><th>Strata</th><th>Strikes</th></tr></thead>
          <tbody>${r.boreholes.map((b) => html`<tr data-borehole=${b.id} class=${b.id === this.holeId ? 'dd-on' : ''}>
            <td><input type="checkbox" name="ags-use" aria-label="Build from ${b.id}" .checked=${this.chosen.includes(b.id)} @change=${(e: Event) => this.toggleChosen(b.id, (e.target as HTMLInputElement).checked)} /></td>
            <td><button type="button" class="dd-link" name="ags-show" @click=${() => this.pickHole(b.id)}>${b.id}</button></td>
            <td>${b.x.toFixed(2)}</td><td>${b.y.toFixed(2)}</td><td>${level(b.groundLevel_m, u)}</td><td>${b.strata.length}</td><td>${b.waterStrikes.length}</td></tr>`)}</tbody>
        </table>
        ${hole ? this.renderLog(hole) : nothing}
        <div class="dd-actions"><button type="button" name="ags-build" ?disabled=${this.chosen.length === 0} @click=${() => this.build()}>
          Build the ground profile from ${this.chosen.length > 1 ? `${this.chosen.length} holes (interpolated at the pit centre)` : (this.chosen[0] ?? 'a hole')}</button></div>
        ${this.suggestion ? this.renderSuggestion(this.suggestion) : nothing}` : nothing}
      ${this.message ? html`<p class="dd-ok" role="status" data-test="ags-applied">${this.message}</p>` : nothing}
    </section>`;
  }

  private renderLog(b: Borehole) {
    const u = this.units;
    return html`<div class="dd-import-log" data-test="ags-log" data-borehole=${b.id}>
      <h4>${b.id} — ground ${level(b.groundLevel_m, u)}</h4>
      <table class="dd-import-table"><thead><tr><th>Depth</th><th>Level</th><th>Stratum</th></tr></thead>
        <tbody>${b.strata.map((s) => html`<tr><td>${s.topDepth_m.toFixed(2)}–${s.baseDepth_m.toFixed(2)}</td><td>${s.topLevel_m.toFixed(2)} to ${s.baseLevel_m.toFixed(2)}</td><td>${s.description}${s.code ? html` <small>(${s.code})</small>` : nothing}</td></tr>`)}</tbody></table>
      ${b.waterStrikes.length > 0 ? html`<ul class="dd-import-strikes" data-test="ags-strikes">${b.waterStrikes.map((w) => html`<li>Water struck at ${w.depth_m.toFixed(2)} m depth (level ${level(w.level_m, u)})${
        w.restDepth_m !== null ? html`, rose to ${w.restDepth_m.toFixed(2)} m depth (level ${level(w.restLevel_m!, u)})${w.minutes !== null ? ` after ${w.minutes} min` : ''}` : nothing}</li>`)}</ul>
        <p class="dd-hint">${IMPORT_WORDS.strikesCaution}</p>` : html`<p class="dd-hint">No water strike logged in ${b.id}.</p>`}
    </div>`;
  }

  private renderSuggestion(s: GroundFromBoreholes) {
    const u = this.units;
    const all = this.confirmed.length > 0 && this.confirmed.every(Boolean);
    return html`<div class="dd-import-preview" data-test="ags-profile">
      <p>Preview: ground level ${level(s.groundLevel_m, u)}; static level ${s.staticLevel_m === null ? 'not logged (kept as it is)' : level(s.staticLevel_m, u)}.</p>
      <table class="dd-import-table">
        <thead><tr><th>Layer</th><th>Levels</th><th>Kind</th><th title="Saturated unit weight, kN/m³">γsat</th><th title="Moist unit weight above the water, kN/m³">γ</th><th>Confirmed</th></tr></thead>
        <tbody>${s.layers.map((l, i) => html`<tr class="dd-import-desc"><td colspan="6" title=${l.basis}><small>${l.description}</small></td></tr><tr data-layer=${l.id}>
          <td title=${l.basis}><strong>${l.id}</strong></td>
          <td>${l.top_m.toFixed(2)} to ${l.bottom_m.toFixed(2)}</td>
          <td><select name="ags-kind" aria-label="Kind of ${l.id}" @change=${(e: Event) => this.editLayer(i, { kind: (e.target as HTMLSelectElement).value as 'plug' | 'granular' })}>
            <option value="plug" ?selected=${l.kind === 'plug'}>plug</option><option value="granular" ?selected=${l.kind === 'granular'}>granular</option></select></td>
          <td><input name="ags-gamma-sat" class="dd-narrow" inputmode="decimal" aria-label="Saturated unit weight of ${l.id}" .value=${String(l.unitWeightSat_kN_m3)} @change=${(e: Event) => this.setWeight(i, 'unitWeightSat_kN_m3', (e.target as HTMLInputElement).value, 'saturated unit weight')} /></td>
          <td><input name="ags-gamma" class="dd-narrow" inputmode="decimal" aria-label="Moist unit weight of ${l.id}" .value=${String(l.unitWeight_kN_m3)} @change=${(e: Event) => this.setWeight(i, 'unitWeight_kN_m3', (e.target as HTMLInputElement).value, 'moist unit weight')} /></td>
          <td><input type="checkbox" name="ags-confirm" aria-label="Confirm ${l.id}" .checked=${this.confirmed[i] === true} @change=${(e: Event) => (this.confirmed = this.confirmed.map((c, k) => (k === i ? (e.target as HTMLInputElement).checked : c)))} /></td>
        </tr>`)}</tbody>
      </table>
      <p class="dd-hint">${IMPORT_WORDS.confirmLayer}</p>
      <ul class="dd-hint">${s.notes.map((n) => html`<li>${n}</li>`)}</ul>
      <label class="dd-check"><input type="checkbox" name="ags-base" .checked=${this.baseAtLogEnd} @change=${(e: Event) => (this.baseAtLogEnd = (e.target as HTMLInputElement).checked)} /> Also put the aquifer base at the end of the log (the holes may have stopped inside the aquifer)</label>
      <div class="dd-actions"><button type="button" name="ags-apply" ?disabled=${!all} @click=${() => this.apply()}>${all ? 'Apply the ground profile and levels' : `Confirm every layer to apply (${this.confirmed.filter(Boolean).length} of ${s.layers.length})`}</button></div>
    </div>`;
  }
}
if (!customElements.get('ags-import-section')) customElements.define('ags-import-section', AgsImportSection);
