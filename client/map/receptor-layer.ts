/**
 * Receptors (neighbours) on the plan, drawn with the shared plan symbols (`receptorPointSymbolSvg`
 * and friends in shared/exports/plan-symbols.ts, the set the site view and report use too): a
 * point receptor is a diamond, a polyline receptor a dashed line with a small square at each of
 * its points; the colour says the last design's verdict (within limits, over a limit, not yet designed). Points and vertices drag
 * with the Select tool like wells; the owner hears `select` and `drag` and edits the scenario.
 */
import L from 'leaflet';
import type { Receptor } from '../../shared/schema';
import { PLAN_COLOURS, RECEPTOR_SYMBOL, receptorColour, receptorPointSymbolSvg, receptorVertexSymbolSvg, type ReceptorVerdict } from '../../shared/exports/plan-symbols';

export type { ReceptorVerdict } from '../../shared/exports/plan-symbols';

/** Colour of a receptor with no design verdict yet. */
export const RECEPTOR_COLOUR = PLAN_COLOURS.receptor;

/** What the layer needs from the map controller (its pointer plumbing and tool). */
export interface ReceptorLayerHooks {
  /** Calls `start` on a Select-tool pointerdown on the layer's element. */
  onPointerDown(layer: L.Path | L.Marker, start: (ev: PointerEvent) => void): void;
  /** A drag from `start`: move, then end or cancel. */
  dragGesture(start: PointerEvent, report: (ll: L.LatLng, phase: 'move' | 'end' | 'cancel') => void): void;
  /** A click on a symbol while a placement tool is on: treat it as a click on the map. */
  passClick(e: L.LeafletMouseEvent): boolean;
  select(id: string): void;
  /** `vertex` −1 for a point receptor (the whole receptor moves). */
  drag(id: string, vertex: number, x: number, y: number, phase: 'move' | 'end' | 'cancel'): void;
}

const round3 = (v: number) => Math.round(v * 1000) / 1000;

function handleIcon(className: string, colour: string, label: string): L.DivIcon {
  const shape = className === 'dd-receptor-point'
    ? `<svg viewBox="0 0 18 18" width="18" height="18" aria-hidden="true">${receptorPointSymbolSvg(9, 9, colour)}</svg>`
    : `<svg viewBox="0 0 12 12" width="12" height="12" aria-hidden="true">${receptorVertexSymbolSvg(6, 6, colour)}</svg>`;
  return L.divIcon({ className, html: `${shape}${label ? `<span class="dd-receptor-label">${label.replace(/[&<>"]/g, '')}</span>` : ''}`, iconSize: className === 'dd-receptor-point' ? [18, 18] : [12, 12] });
}

export class ReceptorLayer extends L.LayerGroup {
  private selectedId: string | null = null;
  private last: { receptors: readonly Receptor[]; verdicts: ReadonlyMap<string, ReceptorVerdict> } | null = null;

  constructor(private readonly hooks: ReceptorLayerHooks) {
    super();
  }

  /** Redraws the receptors (few, so the whole layer is rebuilt when they change). */
  sync(receptors: readonly Receptor[], verdicts: ReadonlyMap<string, ReceptorVerdict>): void {
    if (this.last && this.last.receptors === receptors && this.last.verdicts === verdicts) return;
    this.last = { receptors, verdicts };
    this.clearLayers();
    for (const r of receptors) this.draw(r, verdicts.get(r.id) ?? null);
  }

  setSelected(id: string | null): void {
    this.selectedId = id;
    this.eachLayer((l) => {
      const el = (l as L.Marker).getElement?.();
      if (el?.dataset.receptorId) el.classList.toggle('dd-selected', el.dataset.receptorId === id);
    });
  }

  private draw(r: Receptor, verdict: ReceptorVerdict): void {
    const colour = receptorColour(verdict);
    const title = `${r.id} · ${r.kind}${r.label ? ` — ${r.label}` : ''}`;
    if (r.geometry.type === 'LineString') {
      const line = L.polyline(r.geometry.coordinates.map(([x, y]) => [y, x] as L.LatLngTuple), { color: colour, weight: RECEPTOR_SYMBOL.lineWidth_px, dashArray: RECEPTOR_SYMBOL.lineDash_px, opacity: 0.9, interactive: false });
      line.addTo(this);
      r.geometry.coordinates.forEach(([x, y], k) => this.marker(r, k, x, y, handleIcon('dd-receptor-vertex', colour, k === 0 ? r.id : ''), title));
    } else {
      const [x, y] = r.geometry.coordinates;
      this.marker(r, -1, x, y, handleIcon('dd-receptor-point', colour, r.id), title);
    }
  }

  private marker(r: Receptor, vertex: number, x: number, y: number, icon: L.DivIcon, title: string): void {
    const m = L.marker([y, x], { icon, keyboard: false, bubblingMouseEvents: false });
    const id = r.id;
    this.hooks.onPointerDown(m, (ev) => {
      this.hooks.select(id);
      this.hooks.dragGesture(ev, (ll, phase) => this.hooks.drag(id, vertex, round3(ll.lng), round3(ll.lat), phase));
    });
    m.on('click', (e: L.LeafletMouseEvent) => {
      L.DomEvent.stop(e);
      if (!this.hooks.passClick(e)) this.hooks.select(id);
    });
    m.on('add', () => {
      const el = m.getElement();
      if (!el) return;
      el.dataset.receptorId = id;
      el.dataset.vertex = String(vertex);
      el.title = title;
      el.classList.toggle('dd-selected', this.selectedId === id);
    });
    m.addTo(this);
  }
}
