/**
 * All the Leaflet plumbing of the plan map: a metric plan CRS (L.CRS.Simple: one map unit = one
 * metre, x east, y north), the background layers, the computed field, and the editable wells,
 * excavations, boundaries and section line, with the pointer tools that edit them.
 * The controller owns no scenario state: it shows what it is given and reports gestures.
 */
import L from 'leaflet';
import type { Piezometer, Scenario, Well } from '../../shared/schema';
import type { GridSpec } from '../../shared/field/types';
import type { FieldResult } from '../worker/engine-protocol';
import type { SectionLine, UnderlaySettings } from '../state/view-settings';
import type { SiteProjection } from '../crs';
import { FieldCanvasLayer, type FieldStyle } from './field-canvas-layer';
import { PlanGridLayer } from './plan-grid-layer';
import { UnderlayLayer } from './underlay-layer';
import { ProjectedTileLayer, type TileStatus } from './projected-tile-layer';
import { CRITICAL_COLOUR, SELECTION_COLOUR } from './colour-scale';
import { SHORTFALL_SYMBOLS, type ShortfallKind } from './shortfall-symbols';
import { BOUNDARY_SYMBOLS, EXCAVATION_SYMBOL, piezometerSymbolSvg, wellSymbol } from '../../shared/exports/plan-symbols';
import { ReceptorLayer, type ReceptorVerdict } from './receptor-layer';
import { getReceptors } from '../../shared/schema/receptor-schema';

/** The pointer tool in use. */
export type MapTool = 'select' | 'add-well' | 'add-piezometer' | 'add-receptor' | 'draw-excavation' | 'section' | 'boundary' | 'pick-point';

/** What the map reports back to its owner. Positions are site metres. */
export interface MapCallbacks {
  cursor(x: number | null, y?: number): void;
  /** A click on empty map in `select` (inspect), `add-well`, `add-piezometer` or `pick-point` mode. */
  click(tool: MapTool, x: number, y: number): void;
  selectWell(id: string | null): void;
  selectExcavation(id: string | null): void;
  /** Drag of a well: `phase` 'move' repeatedly, then 'end' (or 'cancel' on Escape). */
  dragWell(id: string, x: number, y: number, phase: 'move' | 'end' | 'cancel'): void;
  dragVertex(excavationId: string, index: number, x: number, y: number, phase: 'move' | 'end' | 'cancel'): void;
  /** A click on a piezometer marker (null: the selection was cleared by a click on empty map). */
  selectPiezometer(id: string | null): void;
  /** Drag of a piezometer, as for wells. */
  dragPiezometer(id: string, x: number, y: number, phase: 'move' | 'end' | 'cancel'): void;
  /** A click on a receptor symbol (null: cleared by a click on empty map). */
  selectReceptor(id: string | null): void;
  /** Drag of a receptor point (`vertex` −1) or of one vertex of a polyline receptor. */
  dragReceptor(id: string, vertex: number, x: number, y: number, phase: 'move' | 'end' | 'cancel'): void;
  insertVertex(excavationId: string, afterIndex: number, x: number, y: number): void;
  drawnOutline(points: Array<[number, number]>): void;
  drawnLine(tool: 'section' | 'boundary', from: [number, number], to: [number, number]): void;
  viewChanged(): void;
  /** The user clicked a shortfall badge marker on the map. */
  focusExcavation(id: string): void;
}

/** What is selected, for highlighting. */
export interface MapSelection {
  wellId: string | null;
  excavationId: string | null;
}


export class LeafletMapController {
  readonly map: L.Map;
  readonly field = new FieldCanvasLayer();
  private readonly grid = new PlanGridLayer();
  private readonly underlay = new UnderlayLayer();
  private readonly tiles = new ProjectedTileLayer();
  private readonly renderer = L.svg({ padding: 0.5 });
  private readonly wells = new Map<string, L.CircleMarker>();
  private readonly wellLayer = L.layerGroup();
  private readonly piezometers = new Map<string, L.Marker>();
  private readonly piezometerLayer = L.layerGroup();
  private piezometerId: string | null = null;
  private readonly receptorLayer: ReceptorLayer;
  private receptorVerdicts: ReadonlyMap<string, ReceptorVerdict> = new Map();
  private readonly excavationLayer = L.layerGroup();
  private readonly boundaryLayer = L.layerGroup();
  private readonly handleLayer = L.layerGroup();
  private readonly markLayer = L.layerGroup();
  private readonly draftLayer = L.layerGroup();
  private readonly sectionLayer = L.layerGroup();
  private ringPreview: L.LayerGroup = L.layerGroup();
  private inspectMarker: L.CircleMarker | null = null;
  private tool: MapTool = 'select';
  private draft: Array<[number, number]> = [];
  private draftRubber: L.Polyline | null = null;
  private scenario: Scenario | null = null;
  private selection: MapSelection = { wellId: null, excavationId: null };
  private dragging = false;
  private suppressClickUntil = 0;
  private scale: L.Control.Scale | null = null;

  constructor(container: HTMLElement, private readonly cb: MapCallbacks) {
    this.map = L.map(container, {
      crs: L.CRS.Simple,
      minZoom: -8,
      maxZoom: 7,
      zoomSnap: 0.25,
      zoomDelta: 0.5,
      wheelPxPerZoomLevel: 90,
      zoomAnimation: false,
      doubleClickZoom: false,
      attributionControl: false,
      renderer: this.renderer,
      boxZoom: false,
      keyboard: false,
    });
    this.map.setView([0, 0], 2);
    this.grid.addTo(this.map);
    this.tiles.addTo(this.map);
    this.underlay.addTo(this.map);
    this.field.addTo(this.map);
    this.receptorLayer = new ReceptorLayer({
      onPointerDown: (layer, start) => this.onPointerDown(layer, start),
      dragGesture: (start, report) => this.dragGesture(start, report),
      passClick: (e) => {
        if (this.tool !== 'select') {
          this.onMapClick(e);
          return true;
        }
        return Date.now() < this.suppressClickUntil;
      },
      select: (id) => this.cb.selectReceptor(id),
      drag: (id, vertex, x, y, phase) => this.cb.dragReceptor(id, vertex, x, y, phase),
    });
    for (const layer of [this.excavationLayer, this.boundaryLayer, this.sectionLayer, this.ringPreview, this.markLayer, this.receptorLayer, this.wellLayer, this.piezometerLayer, this.handleLayer, this.draftLayer]) layer.addTo(this.map);
    this.setImperialScale(false);
    L.control.zoom({ position: 'topleft' }).addTo(this.map);
    this.map.removeControl(this.map.zoomControl);
    L.control.zoom({ position: 'topright' }).addTo(this.map);

    this.map.on('mousemove', (e: L.LeafletMouseEvent) => {
      this.cb.cursor(e.latlng.lng, e.latlng.lat);
      this.updateRubber(e.latlng);
    });
    this.map.on('mouseout', () => this.cb.cursor(null));
    this.map.on('click', (e: L.LeafletMouseEvent) => this.onMapClick(e));
    this.map.on('dblclick', () => {
      if (this.tool === 'draw-excavation') this.finishOutline();
    });
    this.map.on('moveend', () => this.cb.viewChanged());
  }

  /** Scale bar in metres or in feet (and miles). */
  setImperialScale(imperial: boolean): void {
    if (this.scale) this.map.removeControl(this.scale);
    this.scale = L.control.scale({ position: 'bottomleft', metric: !imperial, imperial, maxWidth: 160 }).addTo(this.map);
  }

  /** Plan-grid interval in a display unit (metres per unit) with its label format. */
  setGridUnit(unit_m: number, format: (value_m: number) => string): void {
    if (this.grid.unit_m === unit_m && this.grid.formatCoordinate === format) return;
    this.grid.unit_m = unit_m;
    this.grid.formatCoordinate = format;
    this.grid.redraw();
  }

  setTool(tool: MapTool): void {
    if (this.tool !== tool) this.clearDraft();
    this.tool = tool;
    const c = this.map.getContainer();
    c.dataset.tool = tool;
    c.style.cursor = tool === 'select' ? '' : 'crosshair';
  }

  get currentTool(): MapTool {
    return this.tool;
  }

  /** Shows the scenario's wells, excavations and boundaries; updates only what changed. */
  setScenario(scenario: Scenario, selection: MapSelection): void {
    const outlinesChanged = !this.scenario || this.scenario.excavations !== scenario.excavations || this.selection.excavationId !== selection.excavationId;
    const boundariesChanged = !this.scenario || this.scenario.boundaries !== scenario.boundaries;
    this.scenario = scenario;
    this.selection = selection;
    this.syncWells(scenario.wells);
    this.syncPiezometers((scenario as Scenario & { monitoring?: { piezometers?: Piezometer[] } }).monitoring?.piezometers ?? []);
    this.receptorLayer.sync(getReceptors(scenario), this.receptorVerdicts);
    if (outlinesChanged) this.drawExcavations(scenario);
    if (boundariesChanged) this.drawBoundaries(scenario);
  }

  /** Highlights one receptor, and colours each by the last design's verdict (id → status). */
  setReceptorState(selectedId: string | null, verdicts: ReadonlyMap<string, ReceptorVerdict>): void {
    this.receptorVerdicts = verdicts;
    if (this.scenario) this.receptorLayer.sync(getReceptors(this.scenario), verdicts);
    this.receptorLayer.setSelected(selectedId);
  }

  /** Highlights one piezometer (kept apart from `MapSelection`: wells and pits select on their own). */
  setSelectedPiezometer(id: string | null): void {
    this.piezometerId = id;
    for (const [pid, m] of this.piezometers) m.getElement()?.classList.toggle('dd-selected', pid === id);
  }

  setField(result: FieldResult | null, style: FieldStyle): void {
    this.field.setResult(result, style);
    this.drawShortfallMarks(result);
  }

  /** Greys the field and the pit marks: the result shown is not for the current inputs. */
  setFieldStale(stale: boolean): void {
    if (this.field.stale === stale) return;
    this.field.setStale(stale);
    this.drawShortfallMarks(this.field.current);
  }

  setSection(line: SectionLine | null): void {
    this.sectionLayer.clearLayers();
    if (!line) return;
    L.polyline([[line.from[1], line.from[0]], [line.to[1], line.to[0]]], {
      color: SELECTION_COLOUR, weight: 2.5, dashArray: '8 4', className: 'dd-section-line', interactive: false,
    }).addTo(this.sectionLayer);
    for (const [p, label] of [[line.from, 'A'], [line.to, 'B']] as const) {
      L.marker([p[1], p[0]], {
        interactive: false,
        keyboard: false,
        icon: L.divIcon({ className: 'dd-section-end', html: label, iconSize: [18, 18] }),
      }).addTo(this.sectionLayer);
    }
  }

  setInspectPoint(p: [number, number] | null): void {
    this.inspectMarker?.remove();
    this.inspectMarker = null;
    if (!p) return;
    this.inspectMarker = L.circleMarker([p[1], p[0]], {
      radius: 7, color: SELECTION_COLOUR, weight: 2.5, fill: false, interactive: false, className: 'dd-inspect-mark',
    }).addTo(this.map);
  }

  setRingPreview(points: Array<[number, number]> | null, path?: Array<[number, number]>): void {
    this.ringPreview.clearLayers();
    if (!points) return;
    if (path && path.length > 1) {
      L.polygon(path.map(([x, y]) => [y, x] as L.LatLngTuple), { color: SELECTION_COLOUR, weight: 1, dashArray: '3 4', fill: false, interactive: false }).addTo(this.ringPreview);
    }
    points.forEach(([x, y], i) => {
      L.circleMarker([y, x], { radius: 4, color: SELECTION_COLOUR, weight: 1.5, fillColor: '#fff', fillOpacity: 1, interactive: false, className: 'dd-ring-preview' })
        .bindTooltip(String(i + 1), { permanent: points.length <= 80, direction: 'top', className: 'dd-ring-number', offset: [0, -4] })
        .addTo(this.ringPreview);
    });
  }

  /** Design critical points (from <design-panel>), each a reddish-purple ring with its level. */
  setCriticalPoints(points: Array<{ x: number; y: number; label: string }>): void {
    this.markLayer.eachLayer((l) => {
      if ((l as L.Layer & { ddKind?: string }).ddKind === 'critical') this.markLayer.removeLayer(l);
    });
    for (const p of points) {
      const m = L.circleMarker([p.y, p.x], { radius: 9, color: CRITICAL_COLOUR, weight: 3, fill: false, interactive: true, className: 'dd-critical' })
        .bindTooltip(p.label, { direction: 'right', className: 'dd-tip' });
      (m as L.Layer & { ddKind?: string }).ddKind = 'critical';
      m.addTo(this.markLayer);
    }
  }

  setUnderlay(settings: UnderlaySettings | null): void {
    this.underlay.setSettings(settings);
  }

  setTiles(template: string | null, projection: SiteProjection | null): void {
    this.tiles.setSource(template, projection);
  }

  /** Listens to how the background tiles load (a blocked tile origin only shows as failures). */
  onTileStatus(listener: ((status: TileStatus) => void) | null): void {
    this.tiles.onStatus = listener;
  }

  /** Frames the excavations and wells (or the whole scenario) with a margin. */
  fitScenario(scenario: Scenario): void {
    const pts: L.LatLngTuple[] = [];
    for (const e of scenario.excavations) for (const [x, y] of e.outline) pts.push([y, x]);
    for (const w of scenario.wells) pts.push([w.y, w.x]);
    if (pts.length === 0) {
      this.map.setView([0, 0], 2);
      return;
    }
    const b = L.latLngBounds(pts);
    const pad = Math.max(b.getNorth() - b.getSouth(), b.getEast() - b.getWest(), 20) * 0.9;
    this.map.fitBounds(L.latLngBounds([b.getSouth() - pad, b.getWest() - pad], [b.getNorth() + pad, b.getEast() + pad]), { animate: false });
  }

  /** Widens the view just enough to show these site points (e.g. a freshly imported outline). */
  ensureVisible(points: ReadonlyArray<readonly [number, number]>): void {
    if (points.length === 0) return;
    const view = this.map.getBounds();
    const lls = points.map(([x, y]) => L.latLng(y, x));
    if (lls.every((ll) => view.contains(ll))) return;
    const b = L.latLngBounds(lls).extend(view);
    this.map.fitBounds(b, { animate: false, padding: [30, 30] });
  }

  /** Map-container position of a site point, px (for placing panels clear of what they describe). */
  containerPoint(x: number, y: number): { x: number; y: number } {
    const p = this.map.latLngToContainerPoint([y, x]);
    return { x: p.x, y: p.y };
  }

  panTo(x: number, y: number): void {
    this.map.setView([y, x], Math.max(this.map.getZoom(), 2), { animate: false });
  }

  /**
   * A grid covering the visible map plus a margin, with about `nodesLong` nodes on the longer
   * side: the contour resolution follows the zoom and the effort stays bounded.
   */
  viewGrid(nodesLong: number): GridSpec {
    const size = this.map.getSize();
    const sw = this.map.containerPointToLatLng([0, size.y]);
    const ne = this.map.containerPointToLatLng([size.x, 0]);
    const mx = (ne.lng - sw.lng) * 0.08;
    const my = (ne.lat - sw.lat) * 0.08;
    const x0 = sw.lng - mx;
    const y0 = sw.lat - my;
    const w = ne.lng - sw.lng + 2 * mx;
    const h = ne.lat - sw.lat + 2 * my;
    const spacing = Math.max(w, h) / Math.max(2, nodesLong - 1);
    return {
      origin: [x0, y0],
      spacing_m: [spacing, spacing],
      counts: [Math.max(2, Math.ceil(w / spacing) + 1), Math.max(2, Math.ceil(h / spacing) + 1)],
    };
  }

  /** Screen position (page pixels) of a site point: for tests and the bench only. */
  pagePoint(x: number, y: number): { x: number; y: number } {
    const p = this.map.latLngToContainerPoint([y, x]);
    const r = this.map.getContainer().getBoundingClientRect();
    return { x: r.left + p.x, y: r.top + p.y };
  }

  invalidateSize(): void {
    this.map.invalidateSize({ animate: false });
  }

  destroy(): void {
    this.map.remove();
  }

  // ————— wells —————

  private wellStyle(w: Well): L.CircleMarkerOptions {
    const selected = this.selection.wellId === w.id;
    const injecting = (w.rate_m3_s ?? w.schedule?.[0]?.rate_m3_s ?? 0) < 0;
    // The one plan symbol set (shared/exports/plan-symbols), as the site view and the report draw it.
    const sym = wellSymbol(w.kind, { active: w.active !== false, injecting });
    return {
      radius: sym.radius_px + (selected ? 2 : 0),
      color: selected ? SELECTION_COLOUR : sym.stroke,
      weight: selected ? 3 : sym.strokeWidth_px,
      dashArray: sym.dash_px ?? undefined,
      fillColor: sym.fill,
      fillOpacity: 1,
      className: `dd-well dd-well-${w.kind}${selected ? ' dd-selected' : ''}`,
      bubblingMouseEvents: false,
    };
  }

  private syncWells(wells: readonly Well[]): void {
    const seen = new Set<string>();
    for (const w of wells) {
      seen.add(w.id);
      let m = this.wells.get(w.id);
      if (!m) {
        m = L.circleMarker([w.y, w.x], this.wellStyle(w));
        m.bindTooltip('', { direction: 'top', offset: [0, -6], className: 'dd-tip' });
        this.onPointerDown(m, (ev) => this.startWellDrag(w.id, ev));
        m.on('click', (e: L.LeafletMouseEvent) => {
          L.DomEvent.stop(e);
          if (Date.now() < this.suppressClickUntil) return;
          this.cb.selectWell(w.id);
        });
        m.addTo(this.wellLayer);
        this.wells.set(w.id, m);
      } else {
        const ll = m.getLatLng();
        if (ll.lat !== w.y || ll.lng !== w.x) m.setLatLng([w.y, w.x]);
      }
      // Restyle only what changed: during a drag one marker moves and 199 stay as they are.
      const key = `${w.kind}|${w.active}|${w.rate_m3_s ?? w.schedule?.[0]?.rate_m3_s}|${this.selection.wellId === w.id}`;
      const tagged = m as L.CircleMarker & { ddKey?: string };
      if (tagged.ddKey !== key) {
        tagged.ddKey = key;
        m.setStyle(this.wellStyle(w));
        m.setRadius(wellSymbol(w.kind).radius_px + (this.selection.wellId === w.id ? 2 : 0));
        const el = m.getElement();
        // className only applies on creation; keep the selection class in step for CSS and tests.
        el?.classList.toggle('dd-selected', this.selection.wellId === w.id);
        el?.setAttribute('data-well-id', w.id);
        m.setTooltipContent(`${escapeHtml(w.id)} · ${w.kind}${w.active === false ? ' (inactive)' : ''}`);
      }
    }
    for (const [id, m] of this.wells) {
      if (!seen.has(id)) {
        m.remove();
        this.wells.delete(id);
      }
    }
  }

  // ————— piezometers —————

  /**
   * Piezometers as our own symbol, a ring with a centre dot and the id beside it (wells are
   * plain discs), in the marker pane so they stay above the wells they sit among.
   */
  private syncPiezometers(list: readonly Piezometer[]): void {
    const seen = new Set<string>();
    for (const p of list) {
      seen.add(p.id);
      let m = this.piezometers.get(p.id);
      if (!m) {
        m = L.marker([p.y, p.x], {
          icon: L.divIcon({
            className: 'dd-piezometer',
            html: `<svg viewBox="0 0 18 18" width="18" height="18" aria-hidden="true">${piezometerSymbolSvg(9, 9)}</svg><span class="dd-pz-label"></span>`,
            iconSize: [18, 18],
          }),
          keyboard: false,
          bubblingMouseEvents: false,
        });
        const id = p.id;
        this.onPointerDown(m, (ev) => {
          this.cb.selectPiezometer(id);
          this.dragGesture(ev, (ll, phase) => this.cb.dragPiezometer(id, round3(ll.lng), round3(ll.lat), phase));
        });
        m.on('click', (e: L.LeafletMouseEvent) => {
          L.DomEvent.stop(e);
          // Placement and drawing tools work on top of a piezometer, as they do inside a pit.
          if (this.tool !== 'select') return this.onMapClick(e);
          if (Date.now() < this.suppressClickUntil) return;
          this.cb.selectPiezometer(id);
        });
        m.addTo(this.piezometerLayer);
        this.piezometers.set(p.id, m);
      } else {
        const ll = m.getLatLng();
        if (ll.lat !== p.y || ll.lng !== p.x) m.setLatLng([p.y, p.x]);
      }
      const el = m.getElement();
      if (el) {
        el.setAttribute('data-piezometer-id', p.id);
        el.title = `${p.id} · piezometer${p.label ? ` — ${p.label}` : ''}`;
        el.classList.toggle('dd-selected', this.piezometerId === p.id);
        const label = el.querySelector('.dd-pz-label');
        if (label && label.textContent !== p.id) label.textContent = p.id;
      }
    }
    for (const [id, m] of this.piezometers) {
      if (!seen.has(id)) {
        m.remove();
        this.piezometers.delete(id);
      }
    }
  }

  private startWellDrag(id: string, ev: PointerEvent): void {
    this.cb.selectWell(id);
    this.dragGesture(ev, (ll, phase) => this.cb.dragWell(id, round3(ll.lng), round3(ll.lat), phase));
  }

  /**
   * Starts a drag from a pointerdown on a vector layer's element: pointer events cover mouse,
   * touch and pen alike (a finger on a phone drags a well as a mouse does).
   */
  private onPointerDown(layer: L.Path | L.Marker, start: (ev: PointerEvent) => void): void {
    const attach = () => {
      // An SVG path (wells, handles) or a div icon (piezometers): both take pointer listeners alike.
      const el = layer.getElement() as HTMLElement | undefined;
      if (!el || (el as HTMLElement & { ddDrag?: boolean }).ddDrag) return;
      (el as HTMLElement & { ddDrag?: boolean }).ddDrag = true;
      el.style.touchAction = 'none';
      el.addEventListener('pointerdown', (ev: PointerEvent) => {
        if (this.tool !== 'select' || ev.button !== 0 || !ev.isPrimary) return;
        ev.preventDefault();
        ev.stopPropagation();
        start(ev);
      });
    };
    layer.on('add', attach);
    if (layer.getElement()) attach();
  }

  /** A pointer drag on the map: `move` per pointer move, `end` on release, `cancel` on Escape. */
  private dragGesture(start: PointerEvent, report: (ll: L.LatLng, phase: 'move' | 'end' | 'cancel') => void): void {
    const map = this.map;
    map.dragging.disable();
    this.dragging = true;
    let moved = false;
    let last = map.mouseEventToLatLng(start as unknown as MouseEvent);
    const onMove = (ev: PointerEvent) => {
      if (ev.pointerId !== start.pointerId) return;
      moved = true;
      last = map.mouseEventToLatLng(ev as unknown as MouseEvent);
      report(last, 'move');
    };
    const finish = (phase: 'end' | 'cancel') => {
      document.removeEventListener('pointermove', onMove, true);
      document.removeEventListener('pointerup', onUp, true);
      document.removeEventListener('pointercancel', onCancel, true);
      document.removeEventListener('keydown', onKey, true);
      map.dragging.enable();
      this.dragging = false;
      if (moved) this.suppressClickUntil = Date.now() + 250;
      if (moved || phase === 'cancel') report(last, phase);
    };
    const onUp = (ev: PointerEvent) => {
      if (ev.pointerId === start.pointerId) finish('end');
    };
    const onCancel = (ev: PointerEvent) => {
      if (ev.pointerId === start.pointerId) finish('cancel');
    };
    const onKey = (ev: KeyboardEvent) => {
      if (ev.key === 'Escape') finish('cancel');
    };
    document.addEventListener('pointermove', onMove, true);
    document.addEventListener('pointerup', onUp, true);
    document.addEventListener('pointercancel', onCancel, true);
    document.addEventListener('keydown', onKey, true);
  }

  // ————— excavations and boundaries —————

  private drawExcavations(s: Scenario): void {
    this.excavationLayer.clearLayers();
    this.handleLayer.clearLayers();
    for (const ex of s.excavations) {
      const selected = this.selection.excavationId === ex.id;
      const poly = L.polygon(ex.outline.map(([x, y]) => [y, x] as L.LatLngTuple), {
        color: selected ? SELECTION_COLOUR : EXCAVATION_SYMBOL.stroke,
        weight: selected ? 2.5 : EXCAVATION_SYMBOL.strokeWidth_px,
        fill: true,
        fillOpacity: 0,
        className: `dd-excavation${selected ? ' dd-selected' : ''}`,
        bubblingMouseEvents: false,
      });
      poly.on('click', (e: L.LeafletMouseEvent) => {
        if (this.tool !== 'select') {
          // Let placement tools work inside a pit.
          this.onMapClick(e);
          return;
        }
        L.DomEvent.stop(e);
        if (Date.now() < this.suppressClickUntil) return;
        this.cb.selectExcavation(ex.id);
        this.cb.click('select', e.latlng.lng, e.latlng.lat);
      });
      poly.bindTooltip(`${escapeHtml(ex.id)} · formation ${ex.formationLevel_m} m`, { sticky: true, className: 'dd-tip' });
      poly.addTo(this.excavationLayer);
      if (selected) this.drawVertexHandles(ex.id, ex.outline);
    }
  }

  private drawVertexHandles(id: string, outline: ReadonlyArray<readonly [number, number]>): void {
    outline.forEach(([x, y], i) => {
      const h = L.circleMarker([y, x], { radius: 5, color: SELECTION_COLOUR, weight: 2, fillColor: '#fff', fillOpacity: 1, className: 'dd-vertex', bubblingMouseEvents: false });
      h.addTo(this.handleLayer);
      this.onPointerDown(h, (ev) => this.dragGesture(ev, (ll, phase) => {
        h.setLatLng(ll);
        this.cb.dragVertex(id, i, round3(ll.lng), round3(ll.lat), phase);
      }));
      const next = outline[(i + 1) % outline.length]!;
      const mid: [number, number] = [(x + next[0]) / 2, (y + next[1]) / 2];
      const m = L.circleMarker([mid[1], mid[0]], { radius: 3.5, color: SELECTION_COLOUR, weight: 1.5, fillColor: SELECTION_COLOUR, fillOpacity: 0.5, className: 'dd-vertex-add', bubblingMouseEvents: false });
      m.bindTooltip('Click to add a corner here', { className: 'dd-tip' });
      m.on('click', (e: L.LeafletMouseEvent) => {
        L.DomEvent.stop(e);
        this.cb.insertVertex(id, i, round3(mid[0]), round3(mid[1]));
      });
      m.addTo(this.handleLayer);
    });
  }

  private drawBoundaries(s: Scenario): void {
    this.boundaryLayer.clearLayers();
    for (const b of s.boundaries ?? []) {
      // A boundary is an infinite line: draw it long, and mark the two defining points.
      const dx = b.to[0] - b.from[0];
      const dy = b.to[1] - b.from[1];
      const len = Math.hypot(dx, dy) || 1;
      const ext = 20000;
      const a: L.LatLngTuple = [b.from[1] - (dy / len) * ext, b.from[0] - (dx / len) * ext];
      const c: L.LatLngTuple = [b.to[1] + (dy / len) * ext, b.to[0] + (dx / len) * ext];
      const constant = b.kind === 'constant-head';
      const sym = BOUNDARY_SYMBOLS[b.kind];
      L.polyline([a, c], {
        color: sym.stroke, weight: sym.strokeWidth_px, dashArray: sym.dash_px ?? undefined,
        className: `dd-boundary dd-boundary-${b.kind}`, interactive: true,
      }).bindTooltip(`${constant ? 'Constant-head' : 'No-flow'} boundary${b.label ? ` — ${escapeHtml(b.label)}` : ''}`, { sticky: true, className: 'dd-tip' })
        .addTo(this.boundaryLayer);
    }
  }

  private drawShortfallMarks(result: FieldResult | null): void {
    this.markLayer.eachLayer((l) => {
      if ((l as L.Layer & { ddKind?: string }).ddKind === 'worst') this.markLayer.removeLayer(l);
    });
    if (!result) return;
    for (const s of result.shortfall) {
      const kind: ShortfallKind = this.field.stale ? 'stale' : s.kind;
      const sym = SHORTFALL_SYMBOLS[kind];
      const m = L.marker([s.worst.y, s.worst.x], {
        icon: L.divIcon({
          className: `dd-worst dd-worst-${kind} ${sym.pass ? 'dd-worst-met' : 'dd-worst-short'}`,
          html: `<span style="border-color:${sym.colour};color:${sym.colour}">${sym.glyph}</span>`,
          iconSize: [16, 16],
        }),
        keyboard: false,
        bubblingMouseEvents: false,
      }).bindTooltip(`${escapeHtml(s.id)}: highest level in the pit — ${escapeHtml(sym.label)}`, { direction: 'right', className: 'dd-tip' });
      m.on('click', () => this.cb.focusExcavation(s.id));
      (m as L.Layer & { ddKind?: string }).ddKind = 'worst';
      m.addTo(this.markLayer);
    }
  }

  // ————— pointer tools —————

  private onMapClick(e: L.LeafletMouseEvent): void {
    if (this.dragging || Date.now() < this.suppressClickUntil) return;
    const x = round3(e.latlng.lng);
    const y = round3(e.latlng.lat);
    switch (this.tool) {
      case 'select':
        this.cb.selectWell(null);
        this.cb.selectExcavation(null);
        this.cb.selectPiezometer(null);
        this.cb.selectReceptor(null);
        this.cb.click('select', x, y);
        break;
      case 'add-well':
      case 'add-piezometer':
      case 'add-receptor':
      case 'pick-point':
        this.cb.click(this.tool, x, y);
        break;
      case 'draw-excavation': {
        const first = this.draft[0];
        if (first && this.draft.length >= 3) {
          const p0 = this.map.latLngToContainerPoint([first[1], first[0]]);
          if (p0.distanceTo(e.containerPoint) < 10) {
            this.finishOutline();
            return;
          }
        }
        const last = this.draft[this.draft.length - 1];
        if (last && last[0] === x && last[1] === y) return; // the second click of a double-click
        this.draft.push([x, y]);
        this.drawDraft();
        break;
      }
      case 'section':
      case 'boundary': {
        this.draft.push([x, y]);
        if (this.draft.length === 2) {
          const [a, b] = this.draft as [[number, number], [number, number]];
          this.clearDraft();
          if (a[0] !== b[0] || a[1] !== b[1]) this.cb.drawnLine(this.tool, a, b);
        } else this.drawDraft();
        break;
      }
    }
  }

  /** Finishes an outline being drawn (double-click, click on the first corner, or Enter). */
  finishOutline(): void {
    const pts = this.draft.slice();
    this.clearDraft();
    if (pts.length >= 3) this.cb.drawnOutline(pts);
  }

  /** Abandons a drawing in progress (Escape). */
  clearDraft(): void {
    this.draft = [];
    this.draftLayer.clearLayers();
    this.draftRubber = null;
  }

  get isDrawing(): boolean {
    return this.draft.length > 0;
  }

  private drawDraft(): void {
    this.draftLayer.clearLayers();
    const latlngs = this.draft.map(([x, y]) => [y, x] as L.LatLngTuple);
    L.polyline(latlngs, { color: SELECTION_COLOUR, weight: 2, dashArray: '5 4', interactive: false }).addTo(this.draftLayer);
    for (const ll of latlngs) L.circleMarker(ll, { radius: 4, color: SELECTION_COLOUR, weight: 2, fillColor: '#fff', fillOpacity: 1, interactive: false, className: 'dd-draft-vertex' }).addTo(this.draftLayer);
    this.draftRubber = L.polyline([], { color: SELECTION_COLOUR, weight: 1, dashArray: '2 4', interactive: false }).addTo(this.draftLayer);
  }

  private updateRubber(ll: L.LatLng): void {
    const last = this.draft[this.draft.length - 1];
    if (!this.draftRubber || !last) return;
    const pts: L.LatLngTuple[] = [[last[1], last[0]], [ll.lat, ll.lng]];
    const first = this.draft[0];
    if (this.tool === 'draw-excavation' && first && this.draft.length >= 2) pts.push([first[1], first[0]]);
    this.draftRubber.setLatLngs(pts);
  }
}

function round3(v: number): number {
  return Math.round(v * 1000) / 1000;
}

/** Tooltips take HTML; ids come from user files. */
export function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}
