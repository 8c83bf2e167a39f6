/**
 * The neutral background: a plan grid in site metres whose interval adapts to the zoom
 * (1, 2, 5 × 10ᵏ m), with coordinates written along the map's left and bottom edges.
 * Works offline and says honestly that nothing but the site grid is known.
 */
import L from 'leaflet';
import { CanvasOverlay } from './canvas-overlay';

export class PlanGridLayer extends CanvasOverlay {
  /** Coordinate label text for a value in metres (display units decided by the app). */
  formatCoordinate: (value_m: number) => string = (v) => `${v}`;
  /** Metres per display unit: grid lines fall on round numbers of it (1 m, or 0.3048 for feet). */
  unit_m = 1;

  constructor() {
    super('tilePane', 'dd-plan-grid');
  }

  protected draw(ctx: CanvasRenderingContext2D, map: L.Map): void {
    const size = map.getSize();
    const sw = map.containerPointToLatLng([0, size.y]);
    const ne = map.containerPointToLatLng([size.x, 0]);
    const widthM = ne.lng - sw.lng;
    const metresPerPx = widthM / Math.max(1, size.x);
    const step = niceGridStep((metresPerPx * 90) / this.unit_m) * this.unit_m;
    ctx.fillStyle = '#f6f5f1';
    ctx.fillRect(0, 0, size.x, size.y);
    const drawLines = (interval: number, colour: string, width: number) => {
      ctx.strokeStyle = colour;
      ctx.lineWidth = width;
      ctx.beginPath();
      for (let x = Math.ceil(sw.lng / interval) * interval; x <= ne.lng; x += interval) {
        const px = Math.round(map.latLngToContainerPoint([sw.lat, x]).x) + 0.5;
        ctx.moveTo(px, 0);
        ctx.lineTo(px, size.y);
      }
      for (let y = Math.ceil(sw.lat / interval) * interval; y <= ne.lat; y += interval) {
        const py = Math.round(map.latLngToContainerPoint([y, sw.lng]).y) + 0.5;
        ctx.moveTo(0, py);
        ctx.lineTo(size.x, py);
      }
      ctx.stroke();
    };
    drawLines(step / 5, '#ebe9e2', 1);
    drawLines(step, '#d9d6cc', 1);
    ctx.fillStyle = '#7b766a';
    ctx.font = '10px system-ui, sans-serif';
    ctx.textBaseline = 'top';
    for (let x = Math.ceil(sw.lng / step) * step; x <= ne.lng; x += step) {
      const px = map.latLngToContainerPoint([sw.lat, x]).x;
      ctx.fillText(this.formatCoordinate(x), px + 3, 4);
    }
    for (let y = Math.ceil(sw.lat / step) * step; y <= ne.lat; y += step) {
      const py = map.latLngToContainerPoint([y, sw.lng]).y;
      ctx.fillText(this.formatCoordinate(y), 4, py + 3);
    }
  }
}

/** 1, 2 or 5 × 10ᵏ at or above `approx`. */
export function niceGridStep(approx: number): number {
  if (!(approx > 0) || !Number.isFinite(approx)) return 10;
  const p = 10 ** Math.floor(Math.log10(approx));
  return [1, 2, 5, 10].map((f) => f * p).find((s) => s >= approx) ?? 10 * p;
}
