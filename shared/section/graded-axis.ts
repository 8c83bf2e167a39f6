/**
 * One axis of the section mesh: grid lines through every key coordinate (layer interfaces, wall
 * positions and toes, segment ends, screens, drains), spaced by a size function that is small at
 * refinement points and grows geometrically away from them up to a largest size.
 */

/** A place the mesh must be fine at. */
export interface RefinePoint {
  /** Coordinate, m. */
  at_m: number;
  /** Cell size wanted there, m. */
  size_m: number;
}

export interface GradedAxisOptions {
  /** Coordinates that must be grid lines, m (the first and last are the axis ends). */
  keys_m: readonly number[];
  /** Places to refine at. */
  refine: readonly RefinePoint[];
  /** Largest cell size, m. */
  maxSize_m: number;
  /** Ratio of neighbouring sizes away from a refinement point (> 1). */
  growth: number;
  /** Split every interval into this many equal parts afterwards (nested meshes). Default 1. */
  subdivide?: number;
}

/** The wanted size at s: min over refinement points of size + (growth − 1)·distance, capped. */
function sizeAt(s: number, options: GradedAxisOptions): number {
  let h = options.maxSize_m;
  for (const p of options.refine) h = Math.min(h, p.size_m + (options.growth - 1) * Math.abs(s - p.at_m));
  return h;
}

/** Lines between a and b following the size function (a and b included as the ends). */
function fillInterval(a: number, b: number, options: GradedAxisOptions, out: number[]): void {
  const samples = 256;
  const cumulative = new Float64Array(samples + 1);
  for (let k = 0; k < samples; k++) {
    const s0 = a + ((b - a) * k) / samples;
    const s1 = a + ((b - a) * (k + 1)) / samples;
    // Midpoint rule on 1/h: the number of cells the interval wants.
    cumulative[k + 1] = cumulative[k]! + (s1 - s0) / sizeAt(0.5 * (s0 + s1), options);
  }
  const n = Math.max(1, Math.ceil(cumulative[samples]! - 1e-9));
  let k = 0;
  for (let c = 1; c < n; c++) {
    const target = (cumulative[samples]! * c) / n;
    while (cumulative[k + 1]! < target) k++;
    const f = (target - cumulative[k]!) / (cumulative[k + 1]! - cumulative[k]!);
    out.push(a + ((b - a) * (k + f)) / samples);
  }
  out.push(b);
}

/** Grid lines of a graded axis, ascending, each key coordinate among them. */
export function buildGradedAxis(options: GradedAxisOptions): Float64Array {
  const keys = [...new Set(options.keys_m)].sort((p, q) => p - q);
  const merged: number[] = [];
  const span = (keys[keys.length - 1] ?? 0) - (keys[0] ?? 0);
  // Keys closer than a tiny fraction of the span are one line (avoids sliver cells from round-off).
  for (const k of keys) if (merged.length === 0 || k - merged[merged.length - 1]! > span * 1e-9) merged.push(k);
  const coarse: number[] = [merged[0]!];
  for (let i = 0; i + 1 < merged.length; i++) fillInterval(merged[i]!, merged[i + 1]!, options, coarse);
  const m = Math.max(1, Math.round(options.subdivide ?? 1));
  if (m === 1) return Float64Array.from(coarse);
  const fine: number[] = [coarse[0]!];
  for (let i = 0; i + 1 < coarse.length; i++) {
    const a = coarse[i]!;
    const b = coarse[i + 1]!;
    for (let c = 1; c <= m; c++) fine.push(c === m ? b : a + ((b - a) * c) / m);
  }
  return Float64Array.from(fine);
}

/** Index of the grid line equal to value (within a tolerance), or −1. */
export function findLine(lines: Float64Array, value: number): number {
  let lo = 0;
  let hi = lines.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (lines[mid]! <= value) lo = mid;
    else hi = mid;
  }
  const tol = 1e-7 * Math.max(1, Math.abs(lines[lines.length - 1]! - lines[0]!));
  if (Math.abs(lines[lo]! - value) <= tol) return lo;
  if (Math.abs(lines[hi]! - value) <= tol) return hi;
  return -1;
}
