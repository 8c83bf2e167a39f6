/** The site-plan image under the wells, placed by two reference points (kept in `view.underlay`). */
import L from 'leaflet';
import type { UnderlaySettings } from '../state/view-settings';
import { applySimilarity, placeImage, similarityFromRefs } from './affine-image';

export class UnderlayLayer extends L.Layer {
  private img: HTMLImageElement | null = null;
  private settings: UnderlaySettings | null = null;

  setSettings(settings: UnderlaySettings | null): void {
    this.settings = settings;
    if (this.img && settings && this.img.src !== settings.imageDataUrl) this.img.src = settings.imageDataUrl;
    this.update();
  }

  override onAdd(map: L.Map): this {
    if (!map.getPane('dd-underlay')) {
      const pane = map.createPane('dd-underlay');
      pane.style.zIndex = '250';
      pane.style.pointerEvents = 'none';
    }
    this.img = L.DomUtil.create('img', 'dd-underlay', map.getPane('dd-underlay')) as HTMLImageElement;
    this.img.alt = 'site plan underlay';
    this.img.draggable = false;
    if (this.settings) this.img.src = this.settings.imageDataUrl;
    this.update();
    return this;
  }

  override onRemove(): this {
    this.img?.remove();
    this.img = null;
    return this;
  }

  override getEvents() {
    return { zoomend: this.update, viewreset: this.update, moveend: this.update };
  }

  private update = (): void => {
    const map = this._map as L.Map | undefined;
    const img = this.img;
    const s = this.settings;
    if (!map || !img) return;
    const t = s ? similarityFromRefs(s.refs[0].pixel, s.refs[0].site, s.refs[1].pixel, s.refs[1].site) : null;
    if (!s || !t) {
      img.style.display = 'none';
      return;
    }
    img.style.display = 'block';
    img.style.opacity = String(s.opacity ?? 0.6);
    const lp = (u: number, v: number) => {
      const [x, y] = applySimilarity(t, u, v);
      return map.latLngToLayerPoint([y, x]);
    };
    placeImage(img, s.width_px, s.height_px, lp(0, 0), lp(s.width_px, 0), lp(0, s.height_px));
  };
}
