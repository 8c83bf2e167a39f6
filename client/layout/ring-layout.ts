/**
 * Plan geometry of a ring of wells around an excavation: an offset of its perimeter and evenly
 * spaced positions along it. Geometry only — the hydraulics are the engine's.
 */
import { getPolygonSignedArea, openRing } from '../../shared/geometry';

/** Options for `layoutWellRing`. */
export interface LayoutWellRingOptions {
  /** Excavation outline, site metres (either orientation). */
  outline: ReadonlyArray<readonly [number, number]>;
  /** Distance of the ring outside the outline, m (negative: inside). Default 1.5 m. */
  offset_m?: number;
  /** Target distance between neighbouring wells along the ring, m (> 0). */
  spacing_m: number;
  /** Largest number of wells (default 2000; the scenario caps wells at 5000). */
  maxCount?: number;
}

/** The ring path and the well positions on it (first well at the first corner, then in order). */
export interface WellRingLayout {
  path: Array<[number, number]>;
  positions: Array<[number, number]>;
  /** Actual spacing after rounding the count so the ring closes evenly, m. */
  spacing_m: number;
  perimeter_m: number;
}

/**
 * Offsets each edge along its outward normal and joins neighbours at their intersection (a mitre),
 * bevelling corners sharper than about 40° so the ring does not spike away from the pit.
 */
export function offsetRing(outline: ReadonlyArray<readonly [number, number]>, offset_m: number): Array<[number, number]> {
  let pts = openRing(outline).map((p) => [p[0], p[1]] as [number, number]);
  if (getPolygonSignedArea(pts) < 0) pts = pts.reverse();
  const n = pts.length;
  if (n < 3 || offset_m === 0) return pts;
  const normal = (i: number): [number, number] => {
    const a = pts[i]!;
    const b = pts[(i + 1) % n]!;
    const len = Math.hypot(b[0] - a[0], b[1] - a[1]) || 1;
    // Counter-clockwise ring: outward normal is the edge direction turned clockwise.
    return [(b[1] - a[1]) / len, -(b[0] - a[0]) / len];
  };
  const out: Array<[number, number]> = [];
  for (let i = 0; i < n; i++) {
    const n0 = normal((i - 1 + n) % n);
    const n1 = normal(i);
    const p = pts[i]!;
    const bis: [number, number] = [n0[0] + n1[0], n0[1] + n1[1]];
    const cos = (n0[0] * n1[0] + n0[1] * n1[1]);
    const blen = Math.hypot(bis[0], bis[1]);
    const miter = blen > 1e-9 ? 1 / Math.sqrt((1 + cos) / 2) : Infinity;
    if (miter > 2.6 || !Number.isFinite(miter)) {
      out.push([p[0] + n0[0] * offset_m, p[1] + n0[1] * offset_m], [p[0] + n1[0] * offset_m, p[1] + n1[1] * offset_m]);
    } else {
      const scale = (offset_m * miter) / blen;
      out.push([p[0] + bis[0] * scale, p[1] + bis[1] * scale]);
    }
  }
  return out;
}

/** Lays out a ring: the count is rounded so the spacing is even and the ring closes. */
export function layoutWellRing(options: LayoutWellRingOptions): WellRingLayout {
  if (!(options.spacing_m > 0)) throw new RangeError('spacing_m must be greater than 0');
  const path = offsetRing(options.outline, options.offset_m ?? 1.5);
  const n = path.length;
  const lengths: number[] = [];
  let perimeter = 0;
  for (let i = 0; i < n; i++) {
    const a = path[i]!;
    const b = path[(i + 1) % n]!;
    const l = Math.hypot(b[0] - a[0], b[1] - a[1]);
    lengths.push(l);
    perimeter += l;
  }
  const count = Math.min(options.maxCount ?? 2000, Math.max(3, Math.round(perimeter / options.spacing_m)));
  const step = perimeter / count;
  const positions: Array<[number, number]> = [];
  let edge = 0;
  let along = 0; // distance from the start of `edge`
  for (let k = 0; k < count; k++) {
    const target = k * step;
    while (edge < n - 1 && along + lengths[edge]! < target - 1e-9) {
      along += lengths[edge]!;
      edge++;
    }
    const a = path[edge]!;
    const b = path[(edge + 1) % n]!;
    const l = lengths[edge]!;
    const f = l > 0 ? (target - along) / l : 0;
    positions.push([round3(a[0] + f * (b[0] - a[0])), round3(a[1] + f * (b[1] - a[1]))]);
  }
  return { path, positions, spacing_m: step, perimeter_m: perimeter };
}

/** Next free ids `prefix01, prefix02 …` not used by existing wells, zero-padded to the count. */
export function nextWellIds(prefix: string, count: number, taken: ReadonlySet<string>): string[] {
  const ids: string[] = [];
  const width = Math.max(2, String(count + taken.size).length);
  for (let k = 1; ids.length < count; k++) {
    const id = `${prefix}${String(k).padStart(width, '0')}`;
    if (!taken.has(id)) ids.push(id);
  }
  return ids;
}

function round3(v: number): number {
  return Math.round(v * 1000) / 1000;
}
