/**
 * <site-import-panel>: the Import tab. Hosts the three file readers (DXF site plan, AGS ground
 * investigation, logger CSV), owns the import worker and the plan layer that previews what they
 * read, and keeps both alive across tab switches so an opened file is not lost.
 */
import { html, nothing } from 'lit';
import L from 'leaflet';
import { LightElement } from './light-element';
import type { Scenario } from '../../shared/schema';
import type { DisplayUnits } from '../../shared/units';
import type { ScenarioStore } from '../state';
import { ImportClient } from '../worker';
import { SiteImportLayer } from '../map';
import { IMPORT_WORDS } from './site-import-words';
import type { AgsImportSection } from './ags-import-section';
import './dxf-import-section';
import './ags-import-section';
import './logger-import-section';
import './caution-note';
import './site-import.css';

export class SiteImportPanel extends LightElement {
  static override properties = {
    store: { attribute: false }, scenario: { attribute: false }, units: { attribute: false }, map: { attribute: false },
    storedScenarioId: { attribute: false }, shown: { type: Boolean },
  };
  declare store: ScenarioStore | undefined;
  declare scenario: Scenario | undefined;
  declare units: DisplayUnits;
  /** The plan map the previews are drawn on. */
  declare map: L.Map | null;
  declare storedScenarioId: (() => string | null) | undefined;
  /** True while the tab is shown (the caution note exists only then). */
  declare shown: boolean;

  private readonly client = new ImportClient();
  private readonly layer = new SiteImportLayer();
  private mapWithLayer: L.Map | null = null;

  constructor() {
    super();
    this.map = null;
    this.shown = false;
    this.layer.setPickHandler((id) => this.querySelector<AgsImportSection>('ags-import-section')?.pickHole(id));
  }

  override disconnectedCallback(): void {
    super.disconnectedCallback();
    this.client.dispose();
    this.mapWithLayer?.removeLayer(this.layer);
    this.mapWithLayer = null;
  }

  override updated(): void {
    if (this.map !== this.mapWithLayer) {
      this.mapWithLayer?.removeLayer(this.layer);
      this.map?.addLayer(this.layer);
      this.mapWithLayer = this.map;
    }
  }

  /** Shows what was imported, keeping the design in view too. */
  private fit(points: Array<[number, number]>): void {
    const map = this.map;
    if (!map || points.length === 0) return;
    const s = this.scenario;
    const all = [...points, ...(s?.excavations.flatMap((e) => e.outline) ?? []), ...(s?.wells.map((w) => [w.x, w.y] as [number, number]) ?? [])];
    const bounds = L.latLngBounds(all.map(([x, y]) => [y, x] as L.LatLngTuple));
    map.fitBounds(bounds, { animate: false, padding: [30, 30] });
  }

  override render() {
    const common = { store: this.store, scenario: this.scenario, units: this.units };
    return html`<div class="dd-import-panel" @import-fit=${(e: CustomEvent<Array<[number, number]>>) => this.fit(e.detail)}>
      <p class="dd-hint">${IMPORT_WORDS.intro}</p>
      <dxf-import-section .store=${common.store} .scenario=${common.scenario} .units=${common.units} .client=${this.client} .layer=${this.layer}></dxf-import-section>
      <ags-import-section .store=${common.store} .scenario=${common.scenario} .units=${common.units} .client=${this.client} .layer=${this.layer}></ags-import-section>
      <logger-import-section .scenario=${common.scenario} .units=${common.units} .storedScenarioId=${this.storedScenarioId}></logger-import-section>
      <p class="dd-hint">${IMPORT_WORDS.caution}</p>
      ${this.shown ? html`<caution-note compact></caution-note>` : nothing}
    </div>`;
  }
}
if (!customElements.get('site-import-panel')) customElements.define('site-import-panel', SiteImportPanel);
