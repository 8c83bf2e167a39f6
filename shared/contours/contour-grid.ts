/**
 * Contour lines and filled areas of a gridded field (drawdown or level) in site metres, by
 * marching squares with linear interpolation along cell edges (d3-contour).
 *
 * Output is GeoJSON-like (plain arrays, RFC 7946 ring orientation: exterior counter-clockwise,
 * holes clockwise) but in site coordinates; `contourSetToGeoJSON` wraps it as features and can
 * transform to longitude/latitude.
 */
import { contours as d3Contours } from 'd3-contour';
import type { GridSpec } from '../field/types';
import { checkGrid, frameSides, pixelToSite, ringSignedArea, type XY } from './grid-frame';

/** Where to write a contour's label, and at what angle so it reads along the line. */
export interface ContourLabel {
  x: number;
  y: number;
  /** Direction of the line there, radians counter-clockwise from +x, folded into (−π/2, π/2]. */
  angle_rad: number;
}

/** All pieces of one contour level. */
export interface ContourLine {
  /** The contoured value (same unit as the input values). */
  level: number;
  /** Polylines (MultiLineString coordinates) in site metres; closed loops repeat their first point. */
  coordinates: XY[][];
  labels: ContourLabel[];
}

/** The region where the field is at or above `level` (a MultiPolygon in site metres). */
export interface ContourArea {
  level: number;
  /** MultiPolygon coordinates: polygons of rings; first ring exterior (CCW), the rest holes (CW). */
  coordinates: XY[][][];
  /** Area of the region, m². */
  area_m2: number;
}

/** Result of `contourGrid`. */
export interface ContourSet {
  lines: ContourLine[];
  areas: ContourArea[];
}

/** Options for `contourGrid`. */
export interface ContourGridOptions {
  /** Node values, row-major (index = j·nx + i, j along y) — `GridResult.drawdown_m` or `.level_m`. */
  values: ArrayLike<number>;
  grid: GridSpec;
  /** Levels to contour, any order (same unit as `values`). */
  levels: readonly number[];
  /** Distance between repeated labels along a line, m (default: a quarter of the grid's larger side). */
  labelSpacing_m?: number;
  /** Lines shorter than this get no label, m (default: three grid spacings). */
  minLabelledLength_m?: number;
  /**
   * Nodes with no value (non-zero = hole), e.g. ground beyond a boundary line. Holes count as
   * below every level for the areas, and line pieces in cells touching a hole are cut away, so
   * the edge of the modelled ground is not drawn as a pile of contours. Default: none.
   */
  holes?: ArrayLike<number>;
}

/**
 * Contours a grid. Non-finite values are treated as holes (below every level), so a NaN never
 * draws a line through it; the engine should not send NaN, and callers should flag any it does.
 */
export function contourGrid(options: ContourGridOptions): ContourSet {
  const { grid, values } = options;
  const fault = checkGrid(grid, values.length);
  if (fault) throw new RangeError(fault);
  const [nx, ny] = grid.counts;
  const generator = d3Contours().size([nx, ny]);
  const holes = options.holes;
  if (holes && holes.length !== values.length) throw new RangeError(`expected ${values.length} hole flags, got ${holes.length}`);
  const input = Array.from(values, (v, k) => (Number.isFinite(v) && !(holes && holes[k]) ? v : Number.NaN));
  const sideX = (grid.counts[0] - 1) * grid.spacing_m[0];
  const sideY = (grid.counts[1] - 1) * grid.spacing_m[1];
  const labelSpacing = options.labelSpacing_m ?? Math.max(sideX, sideY) / 4;
  const minLabelled = options.minLabelledLength_m ?? 3 * Math.max(grid.spacing_m[0], grid.spacing_m[1]);

  const lines: ContourLine[] = [];
  const areas: ContourArea[] = [];
  for (const level of [...options.levels].filter(Number.isFinite).sort((a, b) => a - b)) {
    const mp = generator.contour(input, level);
    const polygons: XY[][][] = [];
    const polylines: XY[][] = [];
    let area = 0;
    for (const polygon of mp.coordinates) {
      const rings: XY[][] = [];
      polygon.forEach((pixelRing, k) => {
        polylines.push(...splitAtFrame(grid, pixelRing as Array<[number, number]>, input));
        const ring = dedupe(pixelRing.map((p) => pixelToSite(grid, p[0]!, p[1]!)));
        if (ring.length < 4) return;
        const signed = ringSignedArea(ring);
        // RFC 7946 §3.1.6: exterior rings counter-clockwise, holes clockwise.
        if ((k === 0 && signed < 0) || (k > 0 && signed > 0)) ring.reverse();
        area += k === 0 ? Math.abs(signed) : -Math.abs(signed);
        rings.push(ring);
      });
      if (rings.length > 0) polygons.push(rings);
    }
    areas.push({ level, coordinates: polygons, area_m2: area });
    if (polylines.length > 0) lines.push({ level, coordinates: polylines, labels: placeLabels(polylines, labelSpacing, minLabelled) });
  }
  return { lines, areas };
}

/**
 * Cuts a closed d3 ring where it runs along the edge of the computed extent, so what remains is
 * the true isoline (the frame is where the ring was closed, not where the field equals the level).
 */
function splitAtFrame(grid: GridSpec, pixelRing: ReadonlyArray<readonly [number, number]>, values: readonly number[]): XY[][] {
  const n = pixelRing.length - 1; // d3 rings repeat the first point at the end
  if (n < 2) return [];
  const [nx, ny] = grid.counts;
  const sides = pixelRing.map(([px, py]) => frameSides(grid, px, py));
  // A segment with a NaN node within one node spacing of its midpoint was closed against missing
  // data, not traced along a true isoline (d3 smooths such edges right onto the last valid node,
  // so the cell test must reach one node further). Lines therefore stop a cell short of a hole.
  const touchesHole = (i: number) => {
    const a = pixelRing[i]!;
    const b = pixelRing[(i + 1) % n]!;
    const mx = (a[0] + b[0]) / 2;
    const my = (a[1] + b[1]) / 2;
    for (let jj = Math.max(0, Math.ceil(my - 1.5)); jj <= Math.min(ny - 1, Math.floor(my + 0.5)); jj++) {
      for (let ii = Math.max(0, Math.ceil(mx - 1.5)); ii <= Math.min(nx - 1, Math.floor(mx + 0.5)); ii++) {
        if (Number.isNaN(values[jj * nx + ii]!)) return true;
      }
    }
    return false;
  };
  const onFrame = (i: number) => (sides[i]! & sides[(i + 1) % n]!) !== 0 || touchesHole(i);
  let start = -1;
  for (let i = 0; i < n; i++) if (onFrame(i)) { start = i; break; }
  const toSite = (i: number) => {
    const p = pixelRing[i % n]!;
    return pixelToSite(grid, p[0], p[1]);
  };
  if (start < 0) {
    const loop = dedupe(Array.from({ length: n + 1 }, (_, i) => toSite(i)));
    return loop.length >= 3 ? [loop] : [];
  }
  const out: XY[][] = [];
  let current: XY[] = [];
  for (let step = 1; step <= n; step++) {
    const i = (start + step) % n;
    if (onFrame(i)) {
      if (current.length > 0) current.push(toSite(i));
      if (current.length >= 2) out.push(dedupe(current));
      current = [];
    } else {
      if (current.length === 0) current.push(toSite(i));
      current.push(toSite(i + 1));
    }
  }
  if (current.length >= 2) out.push(dedupe(current));
  return out.filter((l) => l.length >= 2);
}

function dedupe(points: XY[]): XY[] {
  const out: XY[] = [];
  for (const p of points) {
    const last = out[out.length - 1];
    if (!last || Math.abs(last[0] - p[0]) > 1e-9 || Math.abs(last[1] - p[1]) > 1e-9) out.push(p);
  }
  return out;
}

function placeLabels(polylines: XY[][], spacing_m: number, minLength_m: number): ContourLabel[] {
  const labels: ContourLabel[] = [];
  for (const line of polylines) {
    const cumulative = [0];
    for (let i = 1; i < line.length; i++) {
      const a = line[i - 1]!;
      const b = line[i]!;
      cumulative.push(cumulative[i - 1]! + Math.hypot(b[0] - a[0], b[1] - a[1]));
    }
    const length = cumulative[cumulative.length - 1]!;
    if (length < minLength_m) continue;
    const count = Math.max(1, Math.floor(length / Math.max(spacing_m, 1e-9)));
    for (let k = 0; k < count; k++) {
      const target = ((k + 0.5) * length) / count;
      let i = 1;
      while (i < line.length - 1 && cumulative[i]! < target) i++;
      const a = line[i - 1]!;
      const b = line[i]!;
      const segment = cumulative[i]! - cumulative[i - 1]!;
      const f = segment > 0 ? (target - cumulative[i - 1]!) / segment : 0;
      let angle = Math.atan2(b[1] - a[1], b[0] - a[0]);
      if (angle > Math.PI / 2) angle -= Math.PI;
      else if (angle <= -Math.PI / 2) angle += Math.PI;
      labels.push({ x: a[0] + f * (b[0] - a[0]), y: a[1] + f * (b[1] - a[1]), angle_rad: angle });
    }
  }
  return labels;
}
