/**
 * The part of a polygon where a gridded field stands above a threshold — in drydig, the area of an
 * excavation where the computed groundwater level is above the target (formation − margin).
 *
 * Method: contour g = min(v − threshold, d) at 0, where d is the signed distance to the outline
 * (positive inside). {g ≥ 0} is exactly {v ≥ threshold} ∩ {inside}, and marching squares with
 * linear interpolation traces both edges to grid resolution, so the shaded region is clipped to
 * the outline without a polygon-clipping library.
 */
import { contours as d3Contours } from 'd3-contour';
import type { GridSpec } from '../field/types';
import { checkGrid, pixelToSite, ringSignedArea, type XY } from './grid-frame';

/** Options for `contourExcess`. */
export interface ContourExcessOptions {
  /** Node values, row-major (index = j·nx + i), e.g. `GridResult.level_m`. */
  values: ArrayLike<number>;
  grid: GridSpec;
  /** The value that must not be exceeded, same unit as `values` (e.g. target level, m). */
  threshold: number;
  /** The polygon to look inside, site metres (closed implicitly). */
  outline: ReadonlyArray<readonly [number, number]>;
}

/** Result of `contourExcess`. */
export interface ContourExcess {
  /** MultiPolygon coordinates of the exceedance region, site metres (RFC 7946 orientation). */
  coordinates: XY[][][];
  /** Its area, m². */
  area_m2: number;
  /** Grid nodes inside the outline. */
  nodesInside: number;
  /** Highest value − threshold over nodes inside the outline, and where (null when no node is inside). */
  peak: { x: number; y: number; excess: number } | null;
}

/** Signed distance from (x, y) to a ring: positive inside, negative outside, m. */
export function signedDistanceToRing(x: number, y: number, ring: ReadonlyArray<readonly [number, number]>): number {
  let best = Infinity;
  let inside = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i]!;
    const [xj, yj] = ring[j]!;
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
    const dx = xi - xj;
    const dy = yi - yj;
    const len2 = dx * dx + dy * dy;
    const t = len2 > 0 ? Math.min(1, Math.max(0, ((x - xj) * dx + (y - yj) * dy) / len2)) : 0;
    best = Math.min(best, Math.hypot(x - (xj + t * dx), y - (yj + t * dy)));
  }
  return inside ? best : -best;
}

/** Traces where `values` exceed `threshold` inside `outline`. */
export function contourExcess(options: ContourExcessOptions): ContourExcess {
  const { grid, values, threshold, outline } = options;
  const fault = checkGrid(grid, values.length);
  if (fault) throw new RangeError(fault);
  const [nx, ny] = grid.counts;
  const field = new Array<number>(nx * ny);
  let nodesInside = 0;
  let peak: ContourExcess['peak'] = null;
  for (let j = 0; j < ny; j++) {
    const y = grid.origin[1] + j * grid.spacing_m[1];
    for (let i = 0; i < nx; i++) {
      const x = grid.origin[0] + i * grid.spacing_m[0];
      const k = j * nx + i;
      const v = values[k]!;
      const d = signedDistanceToRing(x, y, outline);
      // A non-finite value is unknown, not safe: count it as exceeding so it is never hidden.
      const excess = Number.isFinite(v) ? v - threshold : Infinity;
      field[k] = Math.min(excess, d);
      if (d >= 0) {
        nodesInside++;
        if (!peak || excess > peak.excess) peak = { x, y, excess };
      }
    }
  }
  const mp = d3Contours().size([nx, ny]).contour(field, 0);
  const coordinates: XY[][][] = [];
  let area = 0;
  for (const polygon of mp.coordinates) {
    const rings: XY[][] = [];
    polygon.forEach((pixelRing, k) => {
      const ring = pixelRing.map((p) => pixelToSite(grid, p[0]!, p[1]!));
      const signed = ringSignedArea(ring);
      if (Math.abs(signed) < 1e-12) return;
      if ((k === 0 && signed < 0) || (k > 0 && signed > 0)) ring.reverse();
      area += k === 0 ? Math.abs(signed) : -Math.abs(signed);
      rings.push(ring);
    });
    if (rings.length > 0) coordinates.push(rings);
  }
  return { coordinates, area_m2: area, nodesInside, peak };
}
