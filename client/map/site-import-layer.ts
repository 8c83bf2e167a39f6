/**
 * What the import panel shows on the plan before (and after) anything enters the scenario: the
 * DXF layers chosen as a vector backdrop (thin grey lines on a canvas, non-interactive, drawn
 * under the design), the outlines and marks a layer would give (dashed, in the selection colour,
 * as a preview), and the AGS boreholes at their coordinates (a borehole symbol with its id).
 * Coordinates are site metres, as everywhere on the plan (latlng = [y, x]).
 */
import L from 'leaflet';
import type { Borehole, DxfMark, DxfText } from '../../shared/import';
import type { PackedLines } from '../worker/packed-lines';
import { INK, SELECTION_COLOUR } from './colour-scale';
import { escapeHtml } from './leaflet-map-controller';

/** Grey of the vector backdrop: under the design, never mistaken for it. */
const BACKDROP_COLOUR = '#8a8f98';
/** Most texts drawn as labels; a drawing's thousands of annotations would hide the plan. */
const MAX_LABELS = 200;

export interface SiteImportView {
  /** Backdrop lines (already simplified for display) and which of them to draw. */
  backdrop: PackedLines | null;
  backdropLines: readonly number[];
  backdropTexts: readonly DxfText[];
  /** Outlines that would become excavations. */
  previewOutlines: ReadonlyArray<ReadonlyArray<readonly [number, number]>>;
  /** Points that would become wells or piezometers. */
  previewMarks: readonly DxfMark[];
  boreholes: readonly Borehole[];
  /** Borehole picked in the panel. */
  boreholeId: string | null;
}

const EMPTY: SiteImportView = { backdrop: null, backdropLines: [], backdropTexts: [], previewOutlines: [], previewMarks: [], boreholes: [], boreholeId: null };

export class SiteImportLayer extends L.Layer {
  private readonly renderer = L.canvas({ padding: 0.3 });
  private readonly backdrop = L.layerGroup();
  private readonly preview = L.layerGroup();
  private readonly holes = L.layerGroup();
  private view: SiteImportView = EMPTY;
  private onPick: ((id: string) => void) | null = null;

  /** Called when the designer clicks a borehole on the map. */
  setPickHandler(handler: ((id: string) => void) | null): void {
    this.onPick = handler;
  }

  setView(view: Partial<SiteImportView>): void {
    this.view = { ...this.view, ...view };
    this.redraw();
  }

  /** Plan points of everything shown, to fit the view on an import. */
  extent(): Array<[number, number]> {
    const v = this.view;
    const p = v.backdrop;
    const drawn: Array<[number, number]> = [];
    if (p) {
      // Corners of the drawn lines' box are enough to fit the view.
      let [x0, y0, x1, y1] = [Infinity, Infinity, -Infinity, -Infinity];
      for (const k of v.backdropLines)
        for (let i = p.offsets[k]!; i < p.offsets[k + 1]!; i++) {
          const x = p.coords[2 * i]!;
          const y = p.coords[2 * i + 1]!;
          if (x < x0) x0 = x;
          if (x > x1) x1 = x;
          if (y < y0) y0 = y;
          if (y > y1) y1 = y;
        }
      if (x0 <= x1) drawn.push([x0, y0], [x1, y1]);
    }
    return [
      ...drawn,
      ...v.previewOutlines.flatMap((o) => o.map(([x, y]) => [x, y] as [number, number])),
      ...v.boreholes.map((b) => [b.x, b.y] as [number, number]),
    ];
  }

  override onAdd(map: L.Map): this {
    if (!map.getPane('dd-import-backdrop')) {
      // Above the underlay image (250), below the field and the design.
      const pane = map.createPane('dd-import-backdrop');
      pane.style.zIndex = '260';
      pane.style.pointerEvents = 'none';
    }
    this.backdrop.addTo(map);
    this.preview.addTo(map);
    this.holes.addTo(map);
    this.redraw();
    return this;
  }

  override onRemove(map: L.Map): this {
    for (const g of [this.backdrop, this.preview, this.holes]) map.removeLayer(g);
    return this;
  }

  private redraw(): void {
    if (!this._map) return;
    this.drawBackdrop();
    this.drawPreview();
    this.drawBoreholes();
  }

  private drawBackdrop(): void {
    this.backdrop.clearLayers();
    const v = this.view;
    const options = { pane: 'dd-import-backdrop', renderer: this.renderer, color: BACKDROP_COLOUR, weight: 1, interactive: false, className: 'dd-import-backdrop' };
    // One multi-polyline per DXF layer: 10⁵ entities become a handful of Leaflet layers.
    const byLayer = new Map<number, L.LatLngTuple[][]>();
    const p = v.backdrop;
    if (p)
      for (const k of v.backdropLines) {
        const ll: L.LatLngTuple[] = [];
        for (let i = p.offsets[k]!; i < p.offsets[k + 1]!; i++) ll.push([p.coords[2 * i + 1]!, p.coords[2 * i]!]);
        if (p.closed[k] === 1 && ll.length > 2) ll.push(ll[0]!);
        const parts = byLayer.get(p.layerOf[k]!) ?? [];
        parts.push(ll);
        byLayer.set(p.layerOf[k]!, parts);
      }
    for (const parts of byLayer.values()) L.polyline(parts, options).addTo(this.backdrop);
    for (const t of v.backdropTexts.slice(0, MAX_LABELS)) {
      L.marker([t.y, t.x], {
        pane: 'dd-import-backdrop',
        interactive: false,
        keyboard: false,
        icon: L.divIcon({ className: 'dd-import-label', html: escapeHtml(t.text), iconSize: undefined as unknown as L.PointExpression }),
      }).addTo(this.backdrop);
    }
  }

  private drawPreview(): void {
    this.preview.clearLayers();
    const v = this.view;
    for (const outline of v.previewOutlines) {
      L.polygon(outline.map(([x, y]) => [y, x] as L.LatLngTuple), { color: SELECTION_COLOUR, weight: 2, dashArray: '6 4', fill: false, interactive: false, className: 'dd-import-preview' }).addTo(this.preview);
    }
    for (const m of v.previewMarks) {
      L.circleMarker([m.y, m.x], { radius: 5, color: SELECTION_COLOUR, weight: 2, dashArray: '2 2', fill: false, interactive: false, className: 'dd-import-preview-mark' }).addTo(this.preview);
    }
  }

  private drawBoreholes(): void {
    this.holes.clearLayers();
    for (const b of this.view.boreholes) {
      const picked = b.id === this.view.boreholeId;
      // Borehole symbol: a circle with a cross (site-investigation practice), the id beside it.
      const marker = L.marker([b.y, b.x], {
        keyboard: false,
        icon: L.divIcon({
          className: `dd-borehole${picked ? ' dd-selected' : ''}`,
          html: `<svg viewBox="-8 -8 16 16" width="16" height="16" aria-hidden="true"><circle r="6" fill="#fff" stroke="${picked ? SELECTION_COLOUR : INK}" stroke-width="2"/><path d="M-4 0H4M0 -4V4" stroke="${picked ? SELECTION_COLOUR : INK}" stroke-width="1.5"/></svg><span>${escapeHtml(b.id)}</span>`,
          iconSize: [16, 16],
          iconAnchor: [8, 8],
        }),
      });
      marker.bindTooltip(`${escapeHtml(b.id)} · ground ${b.groundLevel_m} m · ${b.strata.length} strata · ${b.waterStrikes.length} water strike(s)`, { className: 'dd-tip' });
      marker.on('click', (e: L.LeafletMouseEvent) => {
        L.DomEvent.stop(e);
        this.onPick?.(b.id);
      });
      marker.addTo(this.holes);
    }
  }
}
