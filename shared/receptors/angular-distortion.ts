/**
 * Differential settlement and angular distortion between neighbouring points of a receptor:
 * β = Δs / L, with Δs the difference in settlement of two neighbouring points and L their
 * distance (Skempton & MacDonald 1956; Burland & Wroth 1974 — the tilt of the whole receptor is
 * not removed, which errs on the safe side for a receptor that tilts as a rigid body).
 */

export interface SegmentDistortion {
  /** Index of the first point of the pair (the second is `from + 1`). */
  from: number;
  length_m: number;
  /** s[from + 1] − s[from], m. */
  differentialSettlement_m: number;
  /** |Δs| / L (−). */
  angularDistortion: number;
}

/** β for each pair of neighbouring points (points and settlements in the same order). */
export function angularDistortions(points: ReadonlyArray<readonly [number, number]>, settlements_m: ArrayLike<number>): SegmentDistortion[] {
  const out: SegmentDistortion[] = [];
  for (let k = 0; k + 1 < points.length; k++) {
    const [x0, y0] = points[k]!;
    const [x1, y1] = points[k + 1]!;
    const length_m = Math.hypot(x1 - x0, y1 - y0);
    const ds = settlements_m[k + 1]! - settlements_m[k]!;
    // Validation refuses repeated neighbouring points, so L > 0 here.
    out.push({ from: k, length_m, differentialSettlement_m: ds, angularDistortion: Math.abs(ds) / length_m });
  }
  return out;
}
