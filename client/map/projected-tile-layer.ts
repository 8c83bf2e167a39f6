/**
 * Web-map tiles (a {z}/{x}/{y} URL template in Web Mercator, EPSG:3857) drawn under a
 * georeferenced scenario's site grid. Each tile's corners go through the site projection, so
 * grid convergence is honoured tile by tile. Online only; offline the plan grid stays.
 */
import L from 'leaflet';
import type { SiteProjection } from '../crs';
import { placeImage } from './affine-image';
import { lonLatToTile, tileToLonLat } from './web-mercator-tiles';

export { lonLatToTile, tileToLonLat };

const MAX_TILES = 48;

/** How the tiles of the current source are loading: a blocked origin shows up as failures only. */
export interface TileStatus {
  loaded: number;
  failed: number;
  /** Origin of the template (scheme and host), for the message. */
  origin: string;
}

export class ProjectedTileLayer extends L.Layer {
  private box: HTMLDivElement | null = null;
  private template: string | null = null;
  private projection: SiteProjection | null = null;
  private readonly pool = new Map<string, HTMLImageElement>();
  private status: TileStatus = { loaded: 0, failed: 0, origin: '' };
  /** Told when a tile of the current source loads or fails (a page cannot tell why one fails). */
  onStatus: ((status: TileStatus) => void) | null = null;

  setSource(template: string | null, projection: SiteProjection | null): void {
    const next = template && /\{z\}/.test(template) && /\{x\}/.test(template) && /\{y\}/.test(template) ? template : null;
    this.projection = projection;
    // The same source again (every edit re-syncs the map): keep the tiles and their count.
    if (next === this.template) return void this.update();
    this.template = next;
    for (const img of this.pool.values()) img.remove();
    this.pool.clear();
    let origin = '';
    try {
      origin = this.template ? new URL(this.template.replace(/\{[a-z]\}/g, '0')).origin : '';
    } catch {
      origin = '';
    }
    this.status = { loaded: 0, failed: 0, origin };
    this.onStatus?.({ ...this.status });
    this.update();
  }

  override onAdd(map: L.Map): this {
    if (!map.getPane('dd-tiles')) {
      const pane = map.createPane('dd-tiles');
      pane.style.zIndex = '220';
      pane.style.pointerEvents = 'none';
    }
    this.box = L.DomUtil.create('div', 'dd-tiles', map.getPane('dd-tiles')) as HTMLDivElement;
    this.update();
    return this;
  }

  override onRemove(): this {
    this.box?.remove();
    this.box = null;
    this.pool.clear();
    return this;
  }

  override getEvents() {
    return { moveend: this.update, zoomend: this.update, viewreset: this.update };
  }

  private count(source: string | null, what: 'loaded' | 'failed'): void {
    if (source !== this.template) return;
    this.status[what]++;
    this.onStatus?.({ ...this.status });
  }

  private update = (): void => {
    const map = this._map as L.Map | undefined;
    const box = this.box;
    if (!map || !box) return;
    const proj = this.projection;
    const template = this.template;
    if (!proj || !template) {
      box.style.display = 'none';
      return;
    }
    box.style.display = 'block';
    const size = map.getSize();
    const sw = map.containerPointToLatLng([0, size.y]);
    const ne = map.containerPointToLatLng([size.x, 0]);
    const [lon0, lat0] = proj.toLonLat(sw.lng, sw.lat);
    const [lon1, lat1] = proj.toLonLat(ne.lng, ne.lat);
    const mpp = (ne.lng - sw.lng) / Math.max(1, size.x);
    const latMid = ((lat0 + lat1) / 2) * (Math.PI / 180);
    // Ground resolution of zoom z: 2πa·cos φ / (256·2^z) m/px, a = 6 378 137 m (Web Mercator).
    const z = Math.max(0, Math.min(19, Math.round(Math.log2((40075016.686 * Math.cos(latMid)) / (256 * Math.max(mpp, 1e-3))))));
    const [tx0, ty1] = lonLatToTile(Math.min(lon0, lon1), Math.min(lat0, lat1), z).map(Math.floor) as [number, number];
    const [tx1, ty0] = lonLatToTile(Math.max(lon0, lon1), Math.max(lat0, lat1), z).map(Math.floor) as [number, number];
    const wanted = new Set<string>();
    for (let ty = ty0 - 1; ty <= ty1 + 1; ty++) {
      for (let tx = tx0 - 1; tx <= tx1 + 1; tx++) {
        if (wanted.size >= MAX_TILES) break;
        const key = `${z}/${tx}/${ty}`;
        wanted.add(key);
        let img = this.pool.get(key);
        if (!img) {
          img = L.DomUtil.create('img', 'dd-tile', box) as HTMLImageElement;
          img.alt = '';
          img.draggable = false;
          img.referrerPolicy = 'no-referrer';
          const source = this.template;
          img.onload = () => this.count(source, 'loaded');
          img.onerror = () => this.count(source, 'failed');
          img.src = template.replace('{z}', String(z)).replace('{x}', String(tx)).replace('{y}', String(ty)).replace('{s}', 'a');
          this.pool.set(key, img);
        }
        const lp = (x: number, y: number) => {
          const [lon, lat] = tileToLonLat(x, y, z);
          const [sx, sy] = proj.fromLonLat(lon, lat);
          return map.latLngToLayerPoint([sy, sx]);
        };
        placeImage(img, 256, 256, lp(tx, ty), lp(tx + 1, ty), lp(tx, ty + 1));
      }
    }
    for (const [key, img] of this.pool) {
      if (!wanted.has(key)) {
        img.remove();
        this.pool.delete(key);
      }
    }
  };
}
