/**
 * Outlines of the grid nodes that carry a flag (e.g. the engine's `dewatered` or
 * `beyond-influence-radius` bits in `GridResult.flags`), so flagged ground can be hatched on the map.
 */
import { contours as d3Contours } from 'd3-contour';
import type { GridSpec } from '../field/types';
import { checkGrid, pixelToSite, ringSignedArea, type XY } from './grid-frame';

/** Options for `contourMask`. */
export interface ContourMaskOptions {
  /** Per-node bit masks, row-major (`GridResult.flags`). */
  flags: ArrayLike<number>;
  grid: GridSpec;
  /** The bit (or bits; any of them counts) to outline, e.g. `FLAG_BITS.dewatered`. */
  bits: number;
}

/**
 * MultiPolygon (site metres, RFC 7946 orientation) around flagged nodes; the edge runs half-way
 * between a flagged and an unflagged node (contour of the 0/1 indicator at ½).
 */
export function contourMask(options: ContourMaskOptions): { coordinates: XY[][][]; count: number } {
  const { grid, flags, bits } = options;
  const fault = checkGrid(grid, flags.length);
  if (fault) throw new RangeError(fault);
  const indicator = new Array<number>(flags.length);
  let count = 0;
  for (let k = 0; k < flags.length; k++) {
    const on = (flags[k]! & bits) !== 0;
    indicator[k] = on ? 1 : 0;
    if (on) count++;
  }
  if (count === 0) return { coordinates: [], count };
  const mp = d3Contours().size([grid.counts[0], grid.counts[1]]).contour(indicator, 0.5);
  const coordinates = mp.coordinates.map((polygon) =>
    polygon.map((pixelRing, k) => {
      const ring: XY[] = pixelRing.map((p) => pixelToSite(grid, p[0]!, p[1]!));
      const signed = ringSignedArea(ring);
      if ((k === 0 && signed < 0) || (k > 0 && signed > 0)) ring.reverse();
      return ring;
    }),
  );
  return { coordinates, count };
}
