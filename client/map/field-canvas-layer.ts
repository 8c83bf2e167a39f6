/**
 * The computed field on the plan: filled drawdown bands, labelled contour lines, hatched areas
 * where the engine flagged its result, and the hatched shortfall inside each excavation.
 */
import L from 'leaflet';
import type { FieldResult } from '../worker/engine-protocol';
import { CanvasOverlay, makeHatch, traceMultiPolygon } from './canvas-overlay';
import { drawdownColour, INK } from './colour-scale';
import { SHORTFALL_SYMBOLS } from './shortfall-symbols';

/** How the layer labels and colours what it draws. */
export interface FieldStyle {
  /** Contour label text for a value of the contoured quantity (SI in, display text out). */
  formatLevel: (value_m: number) => string;
  /** Static level, m: turns a groundwater level into drawdown for the colour. */
  staticLevel_m: number;
  /** Largest drawdown the colours stretch to, m. */
  maxDrawdown_m: number;
  /** Show the filled bands (default true). */
  fill?: boolean;
}

/** Hatch style per flag: dense grey for "dewatered", lighter for the softer validity limits. */
const FLAG_STYLE: Record<string, { colour: string; cross?: boolean; angle?: 1 | -1; dash: number[] }> = {
  dewatered: { colour: '#3a3a3a', cross: true, dash: [] },
  'large-drawdown': { colour: '#5b6b78', angle: -1, dash: [4, 3] },
  'confined-to-unconfined': { colour: '#2f5f8a', angle: -1, dash: [6, 3] },
  'beyond-influence-radius': { colour: '#8a8a8a', dash: [2, 4] },
  'beyond-boundary': { colour: '#9a8f7a', cross: true, dash: [2, 2] },
};

export class FieldCanvasLayer extends CanvasOverlay {
  private result: FieldResult | null = null;
  private style: FieldStyle | null = null;
  private fillCanvas: HTMLCanvasElement | null = null;
  private staleResult = false;
  /** Called after each draw with the result's id (the bench's "contours on screen" moment). */
  onDrawn: ((result: FieldResult) => void) | null = null;

  constructor() {
    super('overlayPane', 'dd-field-canvas');
  }

  setResult(result: FieldResult | null, style: FieldStyle): void {
    this.result = result;
    this.style = style;
    this.redrawNow();
  }

  get current(): FieldResult | null {
    return this.result;
  }

  /** True while the result drawn does not belong to the current inputs: drawn grey and faint. */
  get stale(): boolean {
    return this.staleResult;
  }

  setStale(stale: boolean): void {
    this.staleResult = stale;
    this.redrawNow();
  }

  protected draw(ctx: CanvasRenderingContext2D, map: L.Map): void {
    const r = this.result;
    const style = this.style;
    // Greyed by CSS (grayscale, faint), so everything drawn below reads as old at a glance.
    this.canvas?.classList.toggle('dd-field-stale', this.staleResult);
    if (!r || !style) return;
    const size = map.getSize();
    const g = r.grid;
    const corner0 = map.latLngToContainerPoint([g.origin[1], g.origin[0]]);
    const corner1 = map.latLngToContainerPoint([
      g.origin[1] + (g.counts[1] - 1) * g.spacing_m[1],
      g.origin[0] + (g.counts[0] - 1) * g.spacing_m[0],
    ]);
    const dmax = Math.max(style.maxDrawdown_m, 1e-6);
    const drawdownOf = (v: number) => (r.quantity === 'level' ? style.staticLevel_m - v : v);

    // Bands: painted opaque on a scratch canvas (each area nests in the one below), then laid
    // over the map once with one alpha, so overlaps do not darken.
    if (style.fill !== false && r.contours.areas.length > 0) {
      const scratch = (this.fillCanvas ??= document.createElement('canvas'));
      const ratio = window.devicePixelRatio || 1;
      scratch.width = Math.round(size.x * ratio);
      scratch.height = Math.round(size.y * ratio);
      const f = scratch.getContext('2d');
      if (f) {
        f.setTransform(ratio, 0, 0, ratio, 0, 0);
        const levels = r.contours.areas.map((a) => a.level);
        const bandColour = (lo: number, hi: number) => drawdownColour(Math.abs(drawdownOf((lo + hi) / 2)) / dmax);
        // Below the first level: the whole computed extent.
        f.fillStyle = bandColour(r.range.min, levels[0] ?? r.range.max);
        f.fillRect(Math.min(corner0.x, corner1.x), Math.min(corner0.y, corner1.y), Math.abs(corner1.x - corner0.x), Math.abs(corner1.y - corner0.y));
        r.contours.areas.forEach((area, i) => {
          f.beginPath();
          traceMultiPolygon(f, map, area.coordinates);
          f.fillStyle = bandColour(area.level, levels[i + 1] ?? r.range.max);
          f.fill('evenodd');
        });
        // Beyond a boundary is outside the modelled aquifer: no band colour there.
        f.globalCompositeOperation = 'destination-out';
        for (const fa of r.flagAreas) {
          if (fa.flag !== 'beyond-boundary') continue;
          f.beginPath();
          traceMultiPolygon(f, map, fa.coordinates);
          f.fill('evenodd');
        }
        f.globalCompositeOperation = 'source-over';
        ctx.globalAlpha = 0.34;
        ctx.drawImage(scratch, 0, 0, size.x, size.y);
        ctx.globalAlpha = 1;
      }
    }

    for (const fa of r.flagAreas) {
      const s = FLAG_STYLE[fa.flag] ?? { colour: '#666', dash: [3, 3] };
      ctx.beginPath();
      traceMultiPolygon(ctx, map, fa.coordinates);
      ctx.fillStyle = makeHatch(ctx, s.colour, { spacing: 7, width: 1, angle: s.angle, cross: s.cross });
      ctx.fill('evenodd');
      ctx.setLineDash(s.dash);
      ctx.strokeStyle = s.colour;
      ctx.lineWidth = 1.2;
      ctx.stroke();
      ctx.setLineDash([]);
    }

    // Contour lines, every fifth level heavier (index contours, common drafting practice).
    const step = r.levels.length > 1 ? r.levels[1]! - r.levels[0]! : 1;
    ctx.lineJoin = 'round';
    for (const line of r.contours.lines) {
      const index = Math.abs(Math.round(line.level / step)) % 5 === 0;
      ctx.strokeStyle = INK;
      ctx.globalAlpha = index ? 0.9 : 0.6;
      ctx.lineWidth = index ? 1.6 : 0.9;
      ctx.beginPath();
      for (const part of line.coordinates) {
        part.forEach(([x, y], i) => {
          const p = map.latLngToContainerPoint([y, x]);
          if (i === 0) ctx.moveTo(p.x, p.y);
          else ctx.lineTo(p.x, p.y);
        });
      }
      ctx.stroke();
    }
    ctx.globalAlpha = 1;

    // Labels along the lines, upright, with a halo; skip ones that would overlap.
    ctx.font = '600 11px system-ui, -apple-system, "Segoe UI", sans-serif';
    ctx.textAlign = 'center';
    ctx.textBaseline = 'middle';
    const placed: Array<[number, number]> = [];
    for (const line of r.contours.lines) {
      const text = style.formatLevel(line.level);
      for (const label of line.labels) {
        const p = map.latLngToContainerPoint([label.y, label.x]);
        if (p.x < 10 || p.y < 10 || p.x > size.x - 10 || p.y > size.y - 10) continue;
        if (placed.some(([qx, qy]) => Math.abs(qx - p.x) < 46 && Math.abs(qy - p.y) < 16)) continue;
        placed.push([p.x, p.y]);
        ctx.save();
        ctx.translate(p.x, p.y);
        // Screen y points down, site y up: the on-screen angle is the negated site angle.
        ctx.rotate(-label.angle_rad);
        ctx.lineWidth = 3.5;
        ctx.strokeStyle = 'rgba(255,255,255,0.92)';
        ctx.strokeText(text, 0, 0);
        ctx.fillStyle = INK;
        ctx.fillText(text, 0, 0);
        ctx.restore();
      }
    }

    // Shortfall last, on top: each kind's own hatch and edge (client/map/shortfall-symbols.ts).
    for (const s of r.shortfall) {
      const sym = SHORTFALL_SYMBOLS[s.kind];
      if (s.coordinates.length === 0 || !sym.hatch) continue;
      ctx.beginPath();
      traceMultiPolygon(ctx, map, s.coordinates);
      ctx.globalAlpha = 0.14;
      ctx.fillStyle = sym.colour;
      ctx.fill('evenodd');
      ctx.globalAlpha = 1;
      ctx.fillStyle = makeHatch(ctx, sym.colour, { spacing: sym.hatch.spacing_px, width: sym.hatch.width_px, angle: sym.hatch.angle, cross: sym.hatch.cross });
      ctx.fill('evenodd');
      ctx.setLineDash(sym.dash);
      ctx.strokeStyle = sym.colour;
      ctx.lineWidth = 2;
      ctx.stroke();
      ctx.setLineDash([]);
    }
    this.onDrawn?.(r);
  }
}
