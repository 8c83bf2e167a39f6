/**
 * <dxf-import-section>: a DXF site plan into the scenario. The file is read in the import worker;
 * the designer sees its layers with entity counts, the unit (from $INSUNITS, or chosen), and
 * picks which layer gives excavation outlines, which gives existing wells or receptors, and
 * which are drawn as a backdrop. The map previews each choice (dashed) before anything is
 * applied; applying is one undo step and records the file's SHA-256.
 */
import { html, nothing } from 'lit';
import { LightElement } from './light-element';
import type { Scenario } from '../../shared/schema';
import { DXF_UNITS, marksOnLayer, outlinesOnLayer } from '../../shared/import';
import { getPolygonArea } from '../../shared/geometry';
import { formatNumber, formatQuantity, type DisplayUnits } from '../../shared/units';
import type { ScenarioStore } from '../state';
import { ImportFailed, linesOnLayers, meanVertex, packedCount, type DxfImportResult, type ImportClient } from '../worker';
import type { SiteImportLayer } from '../map';
import { addMarksAsPiezometers, addMarksAsWells, addOutlinesAsExcavations, recordImport } from '../import';
import { displayValue, parseDisplayNumber } from './unit-context';
import { DXF_ROLE_LABELS, IMPORT_WORDS } from './site-import-words';

/** Largest DXF opened, bytes (the engine reads up to 64 MB of text). */
const MAX_DXF_BYTES = 64 * 1024 * 1024;
/** A drawing farther than this from the scenario's wells and pits is probably in another grid, m. */
const FAR_FROM_SITE_M = 20_000;

export class DxfImportSection extends LightElement {
  static override properties = {
    store: { attribute: false }, scenario: { attribute: false }, units: { attribute: false }, client: { attribute: false }, layer: { attribute: false },
    fileName: { state: true }, result: { state: true }, unitChoice: { state: true }, outlineLayer: { state: true }, marksLayer: { state: true },
    marksAs: { state: true }, backdrop: { state: true }, formationText: { state: true }, marginText: { state: true }, replace: { state: true },
    error: { state: true }, message: { state: true }, busy: { state: true },
  };
  declare store: ScenarioStore | undefined;
  declare scenario: Scenario | undefined;
  declare units: DisplayUnits;
  declare client: ImportClient | undefined;
  declare layer: SiteImportLayer | undefined;
  declare fileName: string;
  declare result: DxfImportResult | null;
  /** '' = the file's $INSUNITS; else metres per drawing unit. */
  declare unitChoice: string;
  declare outlineLayer: string;
  declare marksLayer: string;
  declare marksAs: 'wells' | 'piezometers';
  declare backdrop: ReadonlySet<string>;
  declare formationText: string;
  declare marginText: string;
  declare replace: boolean;
  declare error: string;
  declare message: string;
  declare busy: boolean;
  private text = '';

  constructor() {
    super();
    this.fileName = '';
    this.result = null;
    this.unitChoice = '';
    this.outlineLayer = '';
    this.marksLayer = '';
    this.marksAs = 'wells';
    this.backdrop = new Set();
    this.formationText = '';
    this.marginText = '';
    this.replace = false;
    this.error = '';
    this.message = '';
    this.busy = false;
  }

  private async open(input: HTMLInputElement): Promise<void> {
    const file = input.files?.[0];
    if (!file) return;
    if (file.size > MAX_DXF_BYTES) return void (this.error = `DXF file: ${file.name} is larger than 64 MB; purge unused blocks and layers, or export only the site area.`);
    this.text = await file.text();
    this.fileName = file.name;
    this.unitChoice = '';
    await this.read(true);
  }

  private async read(fresh: boolean): Promise<void> {
    if (!this.client || this.text === '') return;
    this.busy = true;
    this.error = '';
    this.message = '';
    try {
      const toMetre = this.unitChoice === '' ? undefined : Number(this.unitChoice);
      // Display tolerance: 1 cm, fine enough for a site plan at any zoom the plan offers.
      const result = await this.client.dxf(this.text, 0.01, toMetre);
      this.result = result;
      if (fresh) {
        this.outlineLayer = result.layers.find((l) => l.closedPolylines > 0)?.name ?? '';
        this.marksLayer = '';
        this.backdrop = new Set(result.layers.map((l) => l.name));
      }
      this.showOnMap(true);
    } catch (error) {
      this.result = null;
      this.error = error instanceof ImportFailed ? error.message : `DXF file: ${(error as Error).message}`;
      this.layer?.setView({ backdrop: null, backdropLines: [], backdropTexts: [], previewOutlines: [], previewMarks: [] });
    } finally {
      this.busy = false;
    }
  }

  /** Indices of the display lines on the layers chosen as backdrop (kept while the choice stands). */
  private get backdropLines(): number[] {
    const r = this.result;
    if (!r) return [];
    if (this.linesFor?.result !== r || this.linesFor.backdrop !== this.backdrop) this.linesFor = { result: r, backdrop: this.backdrop, lines: linesOnLayers(r.display, this.backdrop) };
    return this.linesFor.lines;
  }

  private linesFor: { result: DxfImportResult; backdrop: ReadonlySet<string>; lines: number[] } | null = null;

  private get outlines() {
    return this.result && this.outlineLayer ? outlinesOnLayer(this.result, this.outlineLayer) : [];
  }

  private get marks() {
    return this.result && this.marksLayer ? marksOnLayer(this.result, this.marksLayer) : [];
  }

  private showOnMap(fit = false): void {
    const r = this.result;
    if (!r || !this.layer) return;
    this.layer.setView({
      backdrop: r.display,
      backdropLines: this.backdropLines,
      backdropTexts: r.texts.filter((t) => this.backdrop.has(t.layer)),
      previewOutlines: this.outlines,
      previewMarks: this.marks,
    });
    if (fit) this.emit('import-fit', this.layer.extent());
  }

  private toggleBackdrop(name: string, on: boolean): void {
    const next = new Set(this.backdrop);
    if (on) next.add(name);
    else next.delete(name);
    this.backdrop = next;
    this.showOnMap();
  }

  private applyOutlines(): void {
    const s = this.scenario;
    const outlines = this.outlines;
    if (!s || !this.store || !this.result || outlines.length === 0) return;
    const reference = s.excavations[0];
    const formation = this.formationText.trim() === '' && reference ? { ok: true as const, value_si: reference.formationLevel_m } : parseDisplayNumber(this.formationText, this.units.length, '/excavations/-/formationLevel_m', 'Formation level');
    if (!formation.ok) return void (this.error = formation.message.replace(/^\/excavations\/-\/formationLevel_m: /, ''));
    const margin = this.marginText.trim() === '' ? { ok: true as const, value_si: reference?.margin_m ?? 0.5 } : parseDisplayNumber(this.marginText, this.units.length, '/excavations/-/margin_m', 'Margin');
    if (!margin.ok) return void (this.error = margin.message.replace(/^\/excavations\/-\/margin_m: /, ''));
    const result = this.result;
    let ids: string[] = [];
    this.store.apply(`import ${outlines.length} outline(s) from ${this.fileName}`, (d) => {
      ids = addOutlinesAsExcavations(d, { outlines, formationLevel_m: formation.value_si, margin_m: margin.value_si, replace: this.replace, prefix: this.outlineLayer });
      recordImport(d, { kind: 'dxf', name: this.fileName.slice(0, 200), sha256: result.sha256, importedAt: new Date().toISOString(), used: `outlines from layer ${this.outlineLayer}: ${ids.join(', ')}`.slice(0, 500) });
    });
    this.error = '';
    this.message = `Added excavation(s) ${ids.join(', ')} from layer ${this.outlineLayer}${this.replace ? ', replacing the previous ones' : ''}. Undo takes them out again.`;
    this.outlineLayer = '';
    this.showOnMap();
  }

  private applyMarks(): void {
    const marks = this.marks;
    if (!this.store || !this.result || marks.length === 0) return;
    const result = this.result;
    let ids: string[] = [];
    this.store.apply(`import ${marks.length} ${this.marksAs} from ${this.fileName}`, (d) => {
      ids = this.marksAs === 'wells' ? addMarksAsWells(d, marks, this.marksLayer) : addMarksAsPiezometers(d, marks);
      recordImport(d, { kind: 'dxf', name: this.fileName.slice(0, 200), sha256: result.sha256, importedAt: new Date().toISOString(), used: `${this.marksAs} from layer ${this.marksLayer}: ${ids.join(', ')}`.slice(0, 500) });
    });
    this.message = this.marksAs === 'wells'
      ? `Added existing well(s) ${ids.join(', ')}, switched off: switch them on and give their rates in the Layout tab to use them.`
      : `Added piezometer(s) ${ids.join(', ')} to the monitoring plan.`;
    this.marksLayer = '';
    this.showOnMap();
  }

  /** Says when the drawing lies far from the scenario's wells and pits (a drawing in another grid or in local coordinates). */
  private farFromSite(): string | null {
    const s = this.scenario;
    const r = this.result;
    if (!s || !r) return null;
    const site = [...s.excavations.flatMap((e) => e.outline), ...s.wells.map((w) => [w.x, w.y] as [number, number])];
    const drawn = meanVertex(r.display, Array.from({ length: packedCount(r.display) }, (_, k) => k));
    if (site.length === 0 || drawn === null) return null;
    const [ax, ay] = site.reduce((m, p) => [m[0] + p[0] / site.length, m[1] + p[1] / site.length], [0, 0]);
    const [bx, by] = drawn;
    const d = Math.hypot(ax - bx, ay - by);
    return d > FAR_FROM_SITE_M ? `The drawing lies ${formatNumber(d / 1000, { significant: 3 })} km from the scenario’s wells and pits: is it drawn in the site grid${s.crs ? ` (${s.crs})` : ''}, in the unit shown?` : null;
  }

  override render() {
    const r = this.result;
    const u = this.units;
    const outlines = this.outlines;
    const marks = this.marks;
    const far = this.farFromSite();
    const reference = this.scenario?.excavations[0];
    const backdropLines = this.backdropLines.length;
    return html`<section class="dd-import-block" data-import="dxf" data-backdrop-lines=${backdropLines}>
      <h3>Site plan (DXF)</h3>
      <p class="dd-hint">${IMPORT_WORDS.dxfHint}</p>
      <div class="dd-import-row">
        <label>DXF file <input type="file" name="import-dxf" accept=".dxf,application/dxf,image/vnd.dxf" @change=${(e: Event) => this.open(e.target as HTMLInputElement)} /></label>
        <label>Unit <select name="import-dxf-unit" @change=${(e: Event) => ((this.unitChoice = (e.target as HTMLSelectElement).value), void this.read(false))}>
          <option value="" ?selected=${this.unitChoice === ''}>From the file${r?.units.fromHeader ? ` ($INSUNITS: ${r.units.name})` : ' ($INSUNITS)'}</option>
          ${Object.values(DXF_UNITS).map((k) => html`<option value=${String(k.toMetre)} ?selected=${this.unitChoice === String(k.toMetre)}>${k.name}</option>`)}
        </select></label>
      </div>
      ${this.busy ? html`<p class="dd-hint" role="status">Reading ${this.fileName}…</p>` : nothing}
      ${this.error ? html`<p class="dd-error" role="alert" data-test="dxf-error">${this.error}</p>` : nothing}
      ${r ? html`<p class="dd-facts" data-test="dxf-summary">${this.fileName}: ${r.layers.length} layers, ${r.layers.reduce((n, l) => n + l.total, 0)} entities, unit ${r.units.name};
          ${formatNumber(r.vertices.read, { significant: 6 })} vertices drawn as ${formatNumber(r.vertices.drawn, { significant: 6 })}${Object.keys(r.skipped).length ? html`; not used: ${Object.entries(r.skipped).map(([t, n]) => `${t} ${n}`).join(', ')}` : nothing}.</p>
        ${far ? html`<p class="dd-warning" role="alert">${far}</p>` : nothing}
        <table class="dd-import-table" data-test="dxf-layers">
          <thead><tr><th>Layer</th><th>Entities</th>
            <th title="Closed polylines become excavation outlines">${DXF_ROLE_LABELS.outlines}</th><th title="Points, blocks and circle centres become existing wells or receptors">${DXF_ROLE_LABELS.marks}</th><th>${DXF_ROLE_LABELS.backdrop}</th></tr></thead>
          <tbody>${r.layers.map((l) => html`<tr data-layer=${l.name}>
            <td><strong>${l.name}</strong></td>
            <td><small>${Object.entries(l.counts).map(([t, n]) => `${t} ${n}`).join(' · ')}</small></td>
            <td><label class="dd-check"><input type="radio" name="dxf-outline-layer" aria-label="Outlines from ${l.name}" .checked=${this.outlineLayer === l.name} ?disabled=${l.closedPolylines === 0}
              @change=${() => ((this.outlineLayer = l.name), this.showOnMap())} /><small>${l.closedPolylines}</small></label></td>
            <td><label class="dd-check"><input type="radio" name="dxf-marks-layer" aria-label="Wells or receptors from ${l.name}" .checked=${this.marksLayer === l.name} ?disabled=${l.points === 0}
              @change=${() => ((this.marksLayer = l.name), this.showOnMap())} /><small>${l.points}</small></label></td>
            <td><input type="checkbox" name="dxf-backdrop" aria-label="Draw ${l.name} as backdrop" .checked=${this.backdrop.has(l.name)}
              @change=${(e: Event) => this.toggleBackdrop(l.name, (e.target as HTMLInputElement).checked)} /></td>
          </tr>`)}</tbody>
        </table>
        ${this.outlineLayer ? html`<div class="dd-import-preview" data-test="dxf-outline-preview">
          <p>Preview (dashed on the plan): layer <strong>${this.outlineLayer}</strong> gives ${outlines.length} outline(s) —
            ${outlines.slice(0, 5).map((o, i) => html`${i > 0 ? ', ' : ''}${formatQuantity(getPolygonArea(o), u.area, { significant: 3 })} with ${o.length} corners`)}${outlines.length > 5 ? ' …' : ''}.</p>
          <div class="dd-import-row">
            <label>Formation level <span class="dd-unit-input"><input name="dxf-formation" inputmode="decimal" placeholder=${reference ? displayValue(reference.formationLevel_m, u.length) : ''} .value=${this.formationText}
              @change=${(e: Event) => (this.formationText = (e.target as HTMLInputElement).value)} /><em>${u.length}</em></span></label>
            <label>Margin below formation <span class="dd-unit-input"><input name="dxf-margin" inputmode="decimal" placeholder=${displayValue(reference?.margin_m ?? 0.5, u.length)} .value=${this.marginText}
              @change=${(e: Event) => (this.marginText = (e.target as HTMLInputElement).value)} /><em>${u.length}</em></span></label>
          </div>
          <label class="dd-check"><input type="checkbox" name="dxf-replace" .checked=${this.replace} @change=${(e: Event) => (this.replace = (e.target as HTMLInputElement).checked)} /> Replace the scenario’s ${this.scenario?.excavations.length ?? 0} excavation(s)</label>
          <div class="dd-actions"><button type="button" name="dxf-apply-outlines" ?disabled=${outlines.length === 0} @click=${() => this.applyOutlines()}>Add ${outlines.length} outline(s) as excavations</button></div>
        </div>` : nothing}
        ${this.marksLayer ? html`<div class="dd-import-preview" data-test="dxf-marks-preview">
          <p>Preview: layer <strong>${this.marksLayer}</strong> gives ${marks.length} point(s): ${marks.slice(0, 6).map((m) => m.name).join(', ')}${marks.length > 6 ? ' …' : ''}.</p>
          <label>Add them as <select name="dxf-marks-as" @change=${(e: Event) => (this.marksAs = (e.target as HTMLSelectElement).value as 'wells' | 'piezometers')}>
            <option value="wells" ?selected=${this.marksAs === 'wells'}>existing wells (switched off)</option>
            <option value="piezometers" ?selected=${this.marksAs === 'piezometers'}>piezometers / receptors to watch</option></select></label>
          <div class="dd-actions"><button type="button" name="dxf-apply-marks" @click=${() => this.applyMarks()}>Add ${marks.length} point(s)</button></div>
        </div>` : nothing}
        <p class="dd-hint">Backdrop: ${backdropLines} line(s) on ${this.backdrop.size} layer(s), drawn for this session only (grey, under the design); it is not saved with the scenario.</p>` : nothing}
      ${this.message ? html`<p class="dd-ok" role="status" data-test="dxf-applied">${this.message}</p>` : nothing}
    </section>`;
  }
}
if (!customElements.get('dxf-import-section')) customElements.define('dxf-import-section', DxfImportSection);
