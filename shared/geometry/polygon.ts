/**
 * Plane polygon helpers in site metres. A polygon is a ring of [x, y] points, closed implicitly
 * (the last point joins the first; a repeated closing point is tolerated).
 */
export type Ring = ReadonlyArray<readonly [number, number]>;

/** Drops a repeated closing point so the ring lists each vertex once. */
export function openRing(ring: Ring): Array<readonly [number, number]> {
  const n = ring.length;
  if (n > 1) {
    const a = ring[0]!;
    const b = ring[n - 1]!;
    if (a[0] === b[0] && a[1] === b[1]) return ring.slice(0, n - 1);
  }
  return ring.slice();
}

/** Signed area, m² (positive counter-clockwise). Shoelace formula. */
export function getPolygonSignedArea(ring: Ring): number {
  const pts = openRing(ring);
  let twice = 0;
  for (let i = 0, n = pts.length; i < n; i++) {
    const [x1, y1] = pts[i]!;
    const [x2, y2] = pts[(i + 1) % n]!;
    twice += x1 * y2 - x2 * y1;
  }
  return twice / 2;
}

/** Area, m². */
export function getPolygonArea(ring: Ring): number {
  return Math.abs(getPolygonSignedArea(ring));
}

/** Perimeter, m. */
export function getPolygonPerimeter(ring: Ring): number {
  const pts = openRing(ring);
  let sum = 0;
  for (let i = 0, n = pts.length; i < n; i++) {
    const [x1, y1] = pts[i]!;
    const [x2, y2] = pts[(i + 1) % n]!;
    sum += Math.hypot(x2 - x1, y2 - y1);
  }
  return sum;
}

/** Centroid of the polygon's area (falls back to the vertex mean for a degenerate ring). */
export function getPolygonCentroid(ring: Ring): [number, number] {
  const pts = openRing(ring);
  let a = 0;
  let cx = 0;
  let cy = 0;
  for (let i = 0, n = pts.length; i < n; i++) {
    const [x1, y1] = pts[i]!;
    const [x2, y2] = pts[(i + 1) % n]!;
    const cross = x1 * y2 - x2 * y1;
    a += cross;
    cx += (x1 + x2) * cross;
    cy += (y1 + y2) * cross;
  }
  if (Math.abs(a) < 1e-12) {
    const mx = pts.reduce((s, p) => s + p[0], 0) / pts.length;
    const my = pts.reduce((s, p) => s + p[1], 0) / pts.length;
    return [mx, my];
  }
  return [cx / (3 * a), cy / (3 * a)];
}

/** True when (x, y) lies inside the ring (even-odd rule; points on an edge may go either way). */
export function isPointInPolygon(x: number, y: number, ring: Ring): boolean {
  const pts = openRing(ring);
  let inside = false;
  for (let i = 0, j = pts.length - 1; i < pts.length; j = i++) {
    const [xi, yi] = pts[i]!;
    const [xj, yj] = pts[j]!;
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}

function segmentsCross(
  a: readonly [number, number], b: readonly [number, number],
  c: readonly [number, number], d: readonly [number, number],
): boolean {
  const orient = (p: readonly [number, number], q: readonly [number, number], r: readonly [number, number]) =>
    Math.sign((q[0] - p[0]) * (r[1] - p[1]) - (q[1] - p[1]) * (r[0] - p[0]));
  const o1 = orient(a, b, c);
  const o2 = orient(a, b, d);
  const o3 = orient(c, d, a);
  const o4 = orient(c, d, b);
  return o1 * o2 < 0 && o3 * o4 < 0;
}

/** Index pair of the first two non-adjacent edges that cross, or null when the ring is simple. */
export function findSelfIntersection(ring: Ring): [number, number] | null {
  const pts = openRing(ring);
  const n = pts.length;
  if (n > 2000) return null; // O(n²); outlines this large come from surveys and are trusted
  for (let i = 0; i < n; i++) {
    for (let j = i + 2; j < n; j++) {
      if (i === 0 && j === n - 1) continue;
      if (segmentsCross(pts[i]!, pts[(i + 1) % n]!, pts[j]!, pts[(j + 1) % n]!)) return [i, j];
    }
  }
  return null;
}
