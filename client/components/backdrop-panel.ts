/**
 * <backdrop-panel>: what lies under the plan — the coordinate system (EPSG code, or a pasted proj4
 * definition for one drydig does not ship), a site-plan image placed by two reference points, and
 * an optional web-map tile URL for georeferenced scenarios when online. Offline the neutral plan
 * grid is always there.
 */
import { html, nothing } from 'lit';
import { LightElement } from './light-element';
import type { Scenario } from '../../shared/schema';
import type { DisplayUnits } from '../../shared/units';
import { getViewSettings, setViewSettings, type ScenarioStore, type UnderlaySettings } from '../state';
import type { ProjectionProblem, SiteProjection } from '../crs';
import { similarityFromRefs } from '../map/affine-image';
import type { TileStatus } from '../map/projected-tile-layer';
import { displayValue, parseDisplayNumber } from './unit-context';

export class BackdropPanel extends LightElement {
  static override properties = {
    store: { attribute: false }, scenario: { attribute: false }, units: { attribute: false },
    projection: { attribute: false }, error: { state: true }, tileStatus: { attribute: false },
  };
  declare store: ScenarioStore | undefined;
  declare scenario: Scenario | undefined;
  declare units: DisplayUnits;
  declare projection: SiteProjection | ProjectionProblem | null;
  declare error: string;
  /** How the web-map tiles are loading (null: no tile source). */
  declare tileStatus: TileStatus | null;

  constructor() {
    super();
    this.projection = null;
    this.error = '';
    this.tileStatus = null;
  }

  private setCrs(text: string): void {
    const code = text.trim().toUpperCase();
    if (code && !/^EPSG:[0-9]{4,6}$/.test(code)) return void (this.error = '/crs: write the code as EPSG:nnnn (e.g. EPSG:32633), or leave it empty for a local grid');
    this.error = '';
    this.store?.apply(code ? `set CRS ${code}` : 'clear CRS', (d) => {
      if (code) d.crs = code;
      else delete d.crs;
    });
  }

  private setProj4(text: string): void {
    const def = text.trim();
    if (def && !def.startsWith('+proj=')) return void (this.error = '/proj4: a proj4 definition starts with +proj= (e.g. +proj=tmerc +lat_0=… +units=m)');
    this.error = '';
    this.store?.apply(def ? 'set proj4 definition' : 'clear proj4 definition', (d) => {
      if (def) d.proj4 = def;
      else delete d.proj4;
    });
  }

  private async loadImage(e: Event): Promise<void> {
    const input = e.target as HTMLInputElement;
    const file = input.files?.[0];
    input.value = '';
    if (!file) return;
    if (!/^image\/(png|jpeg|webp|gif)$/.test(file.type)) return void (this.error = `${file.name}: use a PNG, JPEG or WebP image of the site plan`);
    if (file.size > 6 * 1024 * 1024) return void (this.error = `${file.name} is over 6 MB; the image travels inside the scenario file, so export it smaller`);
    const url = await new Promise<string>((resolve, reject) => {
      const reader = new FileReader();
      reader.onload = () => resolve(String(reader.result));
      reader.onerror = () => reject(reader.error);
      reader.readAsDataURL(file);
    });
    const size = await new Promise<[number, number]>((resolve, reject) => {
      const img = new Image();
      img.onload = () => resolve([img.naturalWidth, img.naturalHeight]);
      img.onerror = () => reject(new Error('not an image'));
      img.src = url;
    }).catch(() => null);
    if (!size) return void (this.error = `${file.name} could not be read as an image`);
    // Start at 0.1 m per pixel, top-left at the first excavation's first corner: then the user sets the two references.
    const origin = this.scenario?.excavations[0]?.outline[0] ?? [0, 0];
    const underlay: UnderlaySettings = {
      imageDataUrl: url, width_px: size[0], height_px: size[1], opacity: 0.6,
      refs: [
        { pixel: [0, 0], site: [origin[0], origin[1]] },
        { pixel: [size[0], 0], site: [origin[0] + size[0] * 0.1, origin[1]] },
      ],
    };
    this.error = '';
    this.store?.apply('add site-plan underlay', (d) => setViewSettings(d, { underlay }));
  }

  private setRef(k: 0 | 1, part: 'pixel' | 'site', axis: 0 | 1, text: string): void {
    const unit = part === 'site' ? this.units.length : null;
    const p = parseDisplayNumber(text, unit, `/view/underlay/refs/${k}/${part}/${axis}`, part === 'site' ? (axis ? 'northing' : 'easting') : axis ? 'image y' : 'image x');
    if (!p.ok) return void (this.error = p.message);
    const current = getViewSettings(this.scenario!).underlay;
    if (!current) return;
    const next = structuredClone(current);
    next.refs[k][part][axis] = p.value_si;
    if (!similarityFromRefs(next.refs[0].pixel, next.refs[0].site, next.refs[1].pixel, next.refs[1].site)) {
      return void (this.error = 'The two reference points must differ both in the image and on site.');
    }
    this.error = '';
    this.store?.apply('place underlay', (d) => setViewSettings(d, { underlay: next }));
  }

  override render() {
    const s = this.scenario;
    if (!s) return nothing;
    const view = getViewSettings(s);
    const u = this.units;
    const under = view.underlay;
    const t = under ? similarityFromRefs(under.refs[0].pixel, under.refs[0].site, under.refs[1].pixel, under.refs[1].site) : null;
    const proj = this.projection;
    return html`<div class="dd-form dd-backdrop">
      <h3>Coordinate system</h3>
      <label class="dd-field"><span>Site CRS (EPSG code)</span><input type="text" name="crs" placeholder="local grid" .value=${s.crs ?? ''} @change=${(e: Event) => this.setCrs((e.target as HTMLInputElement).value)} /></label>
      <p class=${proj?.ok ? 'dd-ok' : 'dd-warn'} role="status" data-crs-status>${proj ? (proj.ok ? `Latitude/longitude by ${proj.label}.` : proj.message) : ''}</p>
      <label class="dd-field"><span>proj4 definition (for codes drydig does not ship)</span>
        <textarea name="proj4" rows="3" placeholder="+proj=tmerc +lat_0=… +lon_0=… +k=… +x_0=… +y_0=… +ellps=… +units=m" .value=${s.proj4 ?? ''} @change=${(e: Event) => this.setProj4((e.target as HTMLTextAreaElement).value)}></textarea></label>
      <h3>Site-plan image</h3>
      <label class="dd-button-like">${under ? 'Replace image…' : 'Add site-plan image…'}<input type="file" name="underlay-file" accept="image/png,image/jpeg,image/webp" hidden @change=${(e: Event) => void this.loadImage(e)} /></label>
      ${under ? html`
        <p class="dd-hint">Place the image by two points you can identify on it (grid crossings, building corners): their pixel position in the image and their site coordinates.</p>
        ${([0, 1] as const).map((k) => html`<fieldset class="dd-ref"><legend>Reference ${k + 1}</legend>
          <div class="dd-form-row">
            <label class="dd-field"><span>Image x</span><span class="dd-input-unit"><input type="text" .value=${String(under.refs[k].pixel[0])} @change=${(e: Event) => this.setRef(k, 'pixel', 0, (e.target as HTMLInputElement).value)} /><em>px</em></span></label>
            <label class="dd-field"><span>Image y</span><span class="dd-input-unit"><input type="text" .value=${String(under.refs[k].pixel[1])} @change=${(e: Event) => this.setRef(k, 'pixel', 1, (e.target as HTMLInputElement).value)} /><em>px</em></span></label>
          </div><div class="dd-form-row">
            <label class="dd-field"><span>Easting</span><span class="dd-input-unit"><input type="text" .value=${displayValue(under.refs[k].site[0], u.length, 9)} @change=${(e: Event) => this.setRef(k, 'site', 0, (e.target as HTMLInputElement).value)} /><em>${u.length}</em></span></label>
            <label class="dd-field"><span>Northing</span><span class="dd-input-unit"><input type="text" .value=${displayValue(under.refs[k].site[1], u.length, 9)} @change=${(e: Event) => this.setRef(k, 'site', 1, (e.target as HTMLInputElement).value)} /><em>${u.length}</em></span></label>
          </div>
          <button type="button" class="dd-small" @click=${() => this.emit('pick-underlay-ref', k)}>Pick site point on map</button></fieldset>`)}
        ${t ? html`<p class="dd-facts">Scale ${displayValue(t.scale_m_px, u.length)} ${u.length}/px · rotation ${(t.rotation_rad * 180 / Math.PI).toFixed(2)}°</p>` : nothing}
        <label class="dd-field"><span>Opacity</span><input type="range" min="0.1" max="1" step="0.05" .value=${String(under.opacity ?? 0.6)}
          @change=${(e: Event) => this.store?.apply('underlay opacity', (d) => setViewSettings(d, { underlay: { ...under, opacity: Number((e.target as HTMLInputElement).value) } }))} /></label>
        <button type="button" class="dd-danger" @click=${() => this.store?.apply('remove underlay', (d) => setViewSettings(d, { underlay: undefined }))}>Remove image</button>` : nothing}
      <h3>Web map (online only)</h3>
      <label class="dd-field"><span>Tile URL template</span><input type="url" name="tile-url" placeholder="https://…/{z}/{x}/{y}.png" .value=${view.tileUrl ?? ''}
        ?disabled=${!proj?.ok}
        @change=${(e: Event) => {
          const v = (e.target as HTMLInputElement).value.trim();
          if (v && !(/^https:\/\//.test(v) && /\{z\}/.test(v) && /\{x\}/.test(v) && /\{y\}/.test(v))) return void (this.error = '/view/tileUrl: use an https URL with {z}, {x} and {y}');
          this.error = '';
          this.store?.apply(v ? 'set tile URL' : 'clear tile URL', (d) => setViewSettings(d, { tileUrl: v || undefined }));
        }} /></label>
      <p class="dd-hint">${proj?.ok ? 'Web Mercator tiles are reprojected into the site grid tile by tile. Respect the tile provider’s terms and show its attribution on exports.' : 'Needs a georeferenced scenario (a known CRS or a proj4 definition).'}</p>
      ${this.renderTileStatus(view.tileUrl)}
      ${this.error ? html`<p class="dd-error" role="alert">${this.error}</p>` : nothing}
    </div>`;
  }

  /** Tiles that all fail are nearly always an origin the page may not load from: say how to allow it. */
  private renderTileStatus(tileUrl: string | undefined) {
    const st = this.tileStatus;
    if (!tileUrl || !st || st.failed === 0) return nothing;
    const origin = st.origin || 'the tile server';
    return html`<div class="dd-warn dd-tile-problem" role="alert" data-tiles-failed=${st.failed}>
      <strong>${st.loaded === 0 ? 'No map tiles could be loaded' : `${st.failed} map tiles could not be loaded`} from ${origin}.</strong>
      This page only loads images from origins its server allows. Ask whoever runs drydig to allow this one
      (<code>drydig serve --tile-origin ${origin}</code>, or the <code>DRYDIG_TILE_ORIGIN</code> setting), and check that the URL
      is right, this computer is online and the provider's terms permit the use. The plan grid works without tiles.</div>`;
  }
}
if (!customElements.get('backdrop-panel')) customElements.define('backdrop-panel', BackdropPanel);
