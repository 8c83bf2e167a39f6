/**
 * <excavation-editor>: the excavations list and the selected one's formation level, margin and
 * outline facts; import of outlines from GeoJSON (longitude/latitude, transformed into the site
 * CRS) or from a CSV of easting/northing.
 */
import { html, nothing } from 'lit';
import { LightElement } from './light-element';
import type { Excavation, Scenario } from '../../shared/schema';
import { getPolygonArea, getPolygonPerimeter, findSelfIntersection } from '../../shared/geometry';
import { formatQuantity, toSi, type DisplayUnits } from '../../shared/units';
import type { ScenarioStore } from '../state';
import { parseCsvOutline, parseGeoJsonOutlines, type OutlineImport } from '../import';
import type { SiteProjection } from '../crs';
import { displayValue, parseDisplayNumber } from './unit-context';

export class ExcavationEditor extends LightElement {
  static override properties = {
    store: { attribute: false }, scenario: { attribute: false }, units: { attribute: false },
    excavationId: { attribute: false }, projection: { attribute: false },
    message: { state: true }, error: { state: true },
  };
  declare store: ScenarioStore | undefined;
  declare scenario: Scenario | undefined;
  declare units: DisplayUnits;
  declare excavationId: string | null;
  declare projection: SiteProjection | null;
  declare message: string;
  declare error: string;

  constructor() {
    super();
    this.excavationId = null;
    this.projection = null;
    this.message = '';
    this.error = '';
  }

  /** Adds imported outlines as new excavations (one undo step), levels from the last one or the ground. */
  addOutlines(result: OutlineImport, source: string): void {
    const s = this.scenario;
    if (!s || !this.store) return;
    if (!result.ok) {
      this.error = `${source}: ${result.message}`;
      this.message = '';
      return;
    }
    const bad = result.outlines.findIndex((o) => findSelfIntersection(o.outline) !== null || getPolygonArea(o.outline) <= 1e-6);
    if (bad >= 0) {
      this.error = `${source}: outline ${bad + 1} crosses itself or encloses no area; fix it in the source drawing.`;
      return;
    }
    const taken = new Set(s.excavations.map((e) => e.id));
    const template = s.excavations[s.excavations.length - 1];
    const added: Excavation[] = result.outlines.map((o, k) => {
      let id = o.name && !taken.has(o.name) ? o.name : '';
      for (let n = s.excavations.length + k + 1; !id || taken.has(id); n++) id = `pit-${n}`;
      taken.add(id);
      return {
        id,
        outline: o.outline,
        formationLevel_m: template?.formationLevel_m ?? s.groundLevel_m - 3,
        margin_m: template?.margin_m ?? 0.5,
      };
    });
    this.store.apply(`import ${added.length} outline${added.length > 1 ? 's' : ''}`, (d) => void d.excavations.push(...added));
    this.error = '';
    this.message = `Imported ${added.map((a) => a.id).join(', ')} from ${source}${result.notes.length ? ` (${result.notes.join('; ')})` : ''}. Set the formation level of each.`;
    this.emit('select-excavation', added[0]!.id);
  }

  private async onFile(e: Event, kind: 'geojson' | 'csv'): Promise<void> {
    const input = e.target as HTMLInputElement;
    const file = input.files?.[0];
    input.value = '';
    if (!file) return;
    if (file.size > 20 * 1024 * 1024) return void (this.error = `${file.name} is larger than 20 MB; simplify the outline first.`);
    const text = await file.text();
    const result = kind === 'geojson'
      ? parseGeoJsonOutlines({ text, fromLonLat: this.projection?.fromLonLat })
      : parseCsvOutline({ text, toMetres: this.units.length === 'ft' ? toSi(1, 'ft') : 1 });
    this.addOutlines(result, file.name);
  }

  private editLevel(i: number, key: 'formationLevel_m' | 'margin_m', text: string, label: string): void {
    const pointer = `/excavations/${i}/${key}`;
    const parsed = parseDisplayNumber(text, this.units.length, pointer, label);
    if (!parsed.ok) return void (this.error = parsed.message);
    if (key === 'margin_m' && (parsed.value_si < 0 || parsed.value_si > 50)) return void (this.error = `${pointer}: margin must be between 0 and 50 m`);
    this.error = '';
    this.store?.apply(`set ${label} of ${this.scenario!.excavations[i]!.id}`, (d) => void (d.excavations[i]![key] = parsed.value_si));
  }

  override render() {
    const s = this.scenario;
    if (!s) return nothing;
    const u = this.units;
    const i = s.excavations.findIndex((e) => e.id === this.excavationId);
    const ex = i >= 0 ? s.excavations[i] : undefined;
    return html`<div class="dd-excavations">
      <ul class="dd-list" aria-label="Excavations">
        ${s.excavations.map((e) => html`<li><button type="button" class=${e.id === this.excavationId ? 'dd-on' : ''} @click=${() => this.emit('select-excavation', e.id)}>
          <strong>${e.id}</strong> <span>formation ${formatQuantity(e.formationLevel_m, u.length, { decimals: 2 })}, margin ${formatQuantity(e.margin_m, u.length, { decimals: 2 })}</span></button></li>`)}
      </ul>
      ${ex ? html`<form class="dd-form" @submit=${(e: Event) => e.preventDefault()} aria-label="Excavation ${ex.id}">
        <div class="dd-form-row">
          <label class="dd-field"><span>Formation level</span><span class="dd-input-unit"><input type="text" name="formationLevel_m" inputmode="decimal" .value=${displayValue(ex.formationLevel_m, u.length)}
            @change=${(e: Event) => this.editLevel(i, 'formationLevel_m', (e.target as HTMLInputElement).value, 'formation level')} /><em>${u.length}</em></span></label>
          <label class="dd-field"><span>Margin below</span><span class="dd-input-unit"><input type="text" name="margin_m" inputmode="decimal" .value=${displayValue(ex.margin_m, u.length)}
            @change=${(e: Event) => this.editLevel(i, 'margin_m', (e.target as HTMLInputElement).value, 'margin')} /><em>${u.length}</em></span></label>
        </div>
        <p class="dd-facts">Target level ${formatQuantity(ex.formationLevel_m - ex.margin_m, u.length, { decimals: 2 })} ·
          area ${formatQuantity(getPolygonArea(ex.outline), u.area, { significant: 4 })} ·
          perimeter ${formatQuantity(getPolygonPerimeter(ex.outline), u.length, { significant: 4 })} · ${ex.outline.length} corners</p>
        <p class="dd-hint">Drag the corner handles on the map to reshape; click a mid-edge dot to add a corner.
          Trade practice is to lower groundwater 0.5–1.0 m below formation (no single source).</p>
        <div class="dd-actions"><button type="button" class="dd-danger" @click=${() => {
          this.store?.apply(`delete excavation ${ex.id}`, (d) => void d.excavations.splice(i, 1));
          this.emit('select-excavation', null);
        }}>Delete excavation</button></div>
      </form>` : html`<p class="dd-hint">Click an outline to edit it, or draw a new one with the Outline tool.</p>`}
      <div class="dd-import">
        <label class="dd-button-like">Import GeoJSON…<input type="file" name="import-geojson" accept=".geojson,.json,application/geo+json,application/json" hidden @change=${(e: Event) => void this.onFile(e, 'geojson')} /></label>
        <label class="dd-button-like">Import CSV (E, N)…<input type="file" name="import-csv" accept=".csv,.txt,text/csv" hidden @change=${(e: Event) => void this.onFile(e, 'csv')} /></label>
      </div>
      <p class="dd-hint">GeoJSON is longitude/latitude (RFC 7946) and needs the scenario CRS; CSV columns are easting, northing in ${u.length === 'ft' ? 'feet' : 'metres'}.</p>
      ${this.message ? html`<p class="dd-ok" role="status">${this.message}</p>` : nothing}
      ${this.error ? html`<p class="dd-error" role="alert">${this.error}</p>` : nothing}
    </div>`;
  }
}
if (!customElements.get('excavation-editor')) customElements.define('excavation-editor', ExcavationEditor);
