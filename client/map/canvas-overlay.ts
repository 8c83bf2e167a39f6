/**
 * Base of the map's canvas layers: one canvas the size of the map, redrawn after every pan or
 * zoom. Drawing many contours and hatches on one canvas keeps a redraw to a few milliseconds
 * while dragging, where hundreds of SVG paths would not.
 */
import L from 'leaflet';

export abstract class CanvasOverlay extends L.Layer {
  protected canvas: HTMLCanvasElement | null = null;
  private frame = 0;

  constructor(private readonly paneName: string, private readonly cssClass: string) {
    super();
  }

  override onAdd(map: L.Map): this {
    this.canvas = L.DomUtil.create('canvas', `dd-canvas ${this.cssClass}`) as HTMLCanvasElement;
    this.canvas.style.pointerEvents = 'none';
    map.getPane(this.paneName)!.appendChild(this.canvas);
    this.reset();
    return this;
  }

  override onRemove(): this {
    this.canvas?.remove();
    this.canvas = null;
    cancelAnimationFrame(this.frame);
    return this;
  }

  override getEvents(): { [name: string]: L.LeafletEventHandlerFn } {
    return { moveend: this.reset, zoomend: this.reset, resize: this.reset, viewreset: this.reset };
  }

  /** Redraw on the next frame (several changes in one frame draw once). */
  redraw(): void {
    if (!this.canvas || this.frame) return;
    this.frame = requestAnimationFrame(() => {
      this.frame = 0;
      this.reset();
    });
  }

  /** Redraw now (the bench and tests measure the moment contours are on screen). */
  redrawNow(): void {
    cancelAnimationFrame(this.frame);
    this.frame = 0;
    this.reset();
  }

  protected abstract draw(ctx: CanvasRenderingContext2D, map: L.Map): void;

  /** Site metres → canvas pixels. */
  protected toCanvas(x: number, y: number): L.Point {
    const map = this._map as L.Map;
    return map.latLngToContainerPoint([y, x]);
  }

  private reset = (): void => {
    const map = this._map as L.Map | undefined;
    const canvas = this.canvas;
    if (!map || !canvas) return;
    const size = map.getSize();
    const ratio = window.devicePixelRatio || 1;
    if (canvas.width !== Math.round(size.x * ratio) || canvas.height !== Math.round(size.y * ratio)) {
      canvas.width = Math.round(size.x * ratio);
      canvas.height = Math.round(size.y * ratio);
      canvas.style.width = `${size.x}px`;
      canvas.style.height = `${size.y}px`;
    }
    L.DomUtil.setPosition(canvas, map.containerPointToLayerPoint([0, 0]));
    const ctx = canvas.getContext('2d');
    if (!ctx) return;
    ctx.setTransform(ratio, 0, 0, ratio, 0, 0);
    ctx.clearRect(0, 0, size.x, size.y);
    this.draw(ctx, map);
  };
}

/** A small repeating diagonal hatch for fills that must not rely on colour alone. */
export function makeHatch(ctx: CanvasRenderingContext2D, colour: string, options: { spacing?: number; width?: number; angle?: 1 | -1; cross?: boolean } = {}): CanvasPattern | string {
  const s = options.spacing ?? 8;
  const tile = document.createElement('canvas');
  tile.width = s;
  tile.height = s;
  const t = tile.getContext('2d');
  if (!t) return colour;
  t.strokeStyle = colour;
  t.lineWidth = options.width ?? 1.5;
  const diag = (dir: 1 | -1) => {
    t.beginPath();
    if (dir === 1) {
      t.moveTo(0, s); t.lineTo(s, 0);
      t.moveTo(-s / 2, s / 2); t.lineTo(s / 2, -s / 2);
      t.moveTo(s / 2, s * 1.5); t.lineTo(s * 1.5, s / 2);
    } else {
      t.moveTo(0, 0); t.lineTo(s, s);
      t.moveTo(-s / 2, s / 2); t.lineTo(s / 2, s * 1.5);
      t.moveTo(s / 2, -s / 2); t.lineTo(s * 1.5, s / 2);
    }
    t.stroke();
  };
  diag(options.angle ?? 1);
  if (options.cross) diag(options.angle === -1 ? 1 : -1);
  return ctx.createPattern(tile, 'repeat') ?? colour;
}

/** Traces a MultiPolygon (site metres) as one canvas path (even-odd fill makes the holes). */
export function traceMultiPolygon(ctx: CanvasRenderingContext2D, map: L.Map, coordinates: ReadonlyArray<ReadonlyArray<ReadonlyArray<readonly [number, number]>>>): void {
  for (const polygon of coordinates) {
    for (const ring of polygon) {
      ring.forEach(([x, y], i) => {
        const p = map.latLngToContainerPoint([y, x]);
        if (i === 0) ctx.moveTo(p.x, p.y);
        else ctx.lineTo(p.x, p.y);
      });
      ctx.closePath();
    }
  }
}
