/**
 * The map between d3-contour's pixel coordinates and site metres for a `GridSpec`.
 *
 * d3-contour treats value k of an nx × ny array as the pixel [i, i+1] × [j, j+1], so node (i, j)
 * sits at pixel coordinate (i + 0.5, j + 0.5), and rings close half a pixel outside the outer
 * nodes. We clamp to the node extent so nothing is drawn where nothing was computed.
 */
import type { GridSpec } from '../field/types';

/** A plan position in site metres. */
export type XY = [number, number];

/** Converts pixel coordinates of a d3 ring to site metres (clamped to the node extent). */
export function pixelToSite(grid: GridSpec, px: number, py: number): XY {
  const [nx, ny] = grid.counts;
  const cx = Math.min(Math.max(px, 0.5), nx - 0.5);
  const cy = Math.min(Math.max(py, 0.5), ny - 0.5);
  return [grid.origin[0] + (cx - 0.5) * grid.spacing_m[0], grid.origin[1] + (cy - 0.5) * grid.spacing_m[1]];
}

/** Which side of the node extent a pixel point lies on (bit mask: 1 W, 2 E, 4 S, 8 N; 0 inside). */
export function frameSides(grid: GridSpec, px: number, py: number): number {
  const [nx, ny] = grid.counts;
  const eps = 1e-9;
  return (px <= 0.5 + eps ? 1 : 0) | (px >= nx - 0.5 - eps ? 2 : 0) | (py <= 0.5 + eps ? 4 : 0) | (py >= ny - 0.5 - eps ? 8 : 0);
}

/** Signed shoelace area of a ring, m² (positive counter-clockwise). */
export function ringSignedArea(ring: ReadonlyArray<readonly [number, number]>): number {
  let twice = 0;
  for (let i = 0, n = ring.length; i < n; i++) {
    const a = ring[i]!;
    const b = ring[(i + 1) % n]!;
    twice += a[0] * b[1] - b[0] * a[1];
  }
  return twice / 2;
}

/** Checks a grid spec is usable for contouring; returns a message naming the fault, or null. */
export function checkGrid(grid: GridSpec, valueCount: number): string | null {
  const [nx, ny] = grid.counts;
  if (!Number.isInteger(nx) || !Number.isInteger(ny) || nx < 2 || ny < 2) return `grid counts must be integers ≥ 2, got ${nx} × ${ny}`;
  if (!(grid.spacing_m[0] > 0) || !(grid.spacing_m[1] > 0)) return 'grid spacing must be positive';
  if (valueCount !== nx * ny) return `expected ${nx * ny} values for a ${nx} × ${ny} grid, got ${valueCount}`;
  return null;
}
