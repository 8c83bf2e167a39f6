/**
 * Contour segments of a field given at the nodes of a rectilinear grid (marching squares with
 * linear interpolation along cell edges; an ambiguous saddle is resolved by the cell-centre mean).
 * Cells the mask leaves out, and cells with a non-finite corner, are skipped.
 */

export interface RectilinearContourOptions {
  /** Vertical grid lines, nx + 1. */
  x: Float64Array;
  /** Horizontal grid lines, nz + 1. */
  z: Float64Array;
  /** Node values, index j·(nx + 1) + i. */
  values: Float64Array;
  /** 1 where cell j·nx + i takes part. */
  mask: Uint8Array;
  /** Contour levels. */
  levels: readonly number[];
}

/** Line segments of one level: [x0, z0, x1, z1, x0, z0, …], metres. */
export type ContourSegments = number[];

// Edges of a cell by corner pair: 0 bottom (a–b), 1 right (b–c), 2 top (d–c), 3 left (a–d).
const CASES: ReadonlyArray<ReadonlyArray<readonly [number, number]>> = [
  [], [[3, 0]], [[0, 1]], [[3, 1]], [[1, 2]], [[3, 0], [1, 2]], [[0, 2]], [[3, 2]],
  [[3, 2]], [[0, 2]], [[0, 1], [2, 3]], [[1, 2]], [[3, 1]], [[0, 1]], [[3, 0]], [],
];

/** Contour segments per level (each cell visited once; only the levels within its range are traced). */
export function contourRectilinear(options: RectilinearContourOptions): ContourSegments[] {
  const { x, z, values, mask, levels } = options;
  const nx = x.length - 1;
  const nz = z.length - 1;
  const stride = nx + 1;
  const order = levels.map((_l, n) => n).sort((p, q) => levels[p]! - levels[q]!);
  const sorted = order.map((n) => levels[n]!);
  const out: number[][] = levels.map(() => []);
  for (let j = 0; j < nz; j++) {
    for (let i = 0; i < nx; i++) {
      if (!mask[j * nx + i]) continue;
      const a = values[j * stride + i]!;
      const b = values[j * stride + i + 1]!;
      const c = values[(j + 1) * stride + i + 1]!;
      const d = values[(j + 1) * stride + i]!;
      if (!(Number.isFinite(a) && Number.isFinite(b) && Number.isFinite(c) && Number.isFinite(d))) continue;
      const lo = Math.min(a, b, c, d);
      const hi = Math.max(a, b, c, d);
      // First level ≥ lo by bisection.
      let m0 = 0;
      let m1 = sorted.length;
      while (m0 < m1) {
        const mid = (m0 + m1) >> 1;
        if (sorted[mid]! < lo) m0 = mid + 1;
        else m1 = mid;
      }
      for (let m = m0; m < sorted.length && sorted[m]! < hi; m++) traceCell(sorted[m]!, out[order[m]!]!, x[i]!, x[i + 1]!, z[j]!, z[j + 1]!, a, b, c, d);
    }
  }
  return out;
}

/** Segments of one level through one cell with corner values a (x0,z0), b (x1,z0), c (x1,z1), d (x0,z1). */
function traceCell(level: number, out: number[], x0: number, x1: number, z0: number, z1: number, a: number, b: number, c: number, d: number): void {
  let index = (a > level ? 1 : 0) | (b > level ? 2 : 0) | (c > level ? 4 : 0) | (d > level ? 8 : 0);
  if (index === 0 || index === 15) return;
  // Saddles: join the other way when the centre lies on the other side.
  const centreAbove = (a + b + c + d) / 4 > level;
  if (index === 5 && centreAbove) index = 10;
  else if (index === 10 && centreAbove) index = 5;
  const t = (p: number, q: number) => (p === q ? 0.5 : (level - p) / (q - p));
  const point = (edge: number): [number, number] => {
    if (edge === 0) return [x0 + (x1 - x0) * t(a, b), z0];
    if (edge === 1) return [x1, z0 + (z1 - z0) * t(b, c)];
    if (edge === 2) return [x0 + (x1 - x0) * t(d, c), z1];
    return [x0, z0 + (z1 - z0) * t(a, d)];
  };
  for (const [e0, e1] of CASES[index]!) {
    const p = point(e0);
    const q = point(e1);
    out.push(p[0], p[1], q[0], q[1]);
  }
}
