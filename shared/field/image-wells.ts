/**
 * Image wells for straight boundaries (Ferris, Knowles, Brown & Stallman 1962, USGS Water-Supply
 * Paper 1536-E): a constant-head line is reproduced by an image of opposite sign mirrored across
 * it, a no-flow line by an image of the same sign. Supported: one line; two perpendicular lines
 * (three images); two parallel lines (an infinite series, truncated with a stated error bound).
 */
import { DrydigError, type Boundary, type FieldIssue, type Scenario } from '../schema';
import { getPolygonCentroid } from '../geometry';

/** Angle tolerance for "parallel" and "perpendicular", rad (0.1°): hand-drawn lines are never exact. */
export const BOUNDARY_ANGLE_TOLERANCE_RAD = (0.1 * Math.PI) / 180;

/** One straight boundary as a half-plane: σ(P) = nx·x + ny·y − c ≥ 0 inside the aquifer. */
export interface BoundaryLine {
  kind: Boundary['kind'];
  /** Unit normal pointing into the aquifer. */
  nx: number;
  ny: number;
  c: number;
  /** +1 for no-flow (image of the same sign), −1 for constant head (opposite sign). */
  imageSign: 1 | -1;
  /** Index in scenario.boundaries. */
  index: number;
}

/** The validated boundary geometry of a scenario. */
export interface BoundaryGeometry {
  configuration: 'none' | 'single' | 'perpendicular' | 'parallel';
  lines: BoundaryLine[];
  /** Parallel lines: distance between them, m. */
  spacing_m?: number;
  /** Deviation of the two lines from exactly perpendicular / parallel, degrees. */
  angleDeviation_deg?: number;
}

/** One image well: position and the sign its rate takes relative to the real well. */
export interface ImageWell {
  x: number;
  y: number;
  sign: 1 | -1;
}

const unsupported = (message: string, issues: FieldIssue[]): never => {
  throw new DrydigError('DRYDIG_ERR_UNSUPPORTED_BOUNDARIES', message, issues);
};

/** Signed distance of (x, y) from a line, positive on the aquifer side, m. */
export function signedDistance(line: BoundaryLine, x: number, y: number): number {
  return line.nx * x + line.ny * y - line.c;
}

/** True when (x, y) lies in the modelled aquifer (on or inside every boundary line). */
export function isInsideBoundaries(geometry: BoundaryGeometry, x: number, y: number): boolean {
  for (const line of geometry.lines) if (signedDistance(line, x, y) < 0) return false;
  return true;
}

function rawLine(b: Boundary, index: number): BoundaryLine {
  const dx = b.to[0] - b.from[0];
  const dy = b.to[1] - b.from[1];
  const len = Math.hypot(dx, dy);
  if (!(len > 0)) {
    unsupported(`/boundaries/${index}/to: a boundary needs two distinct points`, [
      { path: `/boundaries/${index}/to`, message: 'must differ from "from"' },
    ]);
  }
  const nx = -dy / len;
  const ny = dx / len;
  return { kind: b.kind, nx, ny, c: nx * b.from[0] + ny * b.from[1], imageSign: b.kind === 'no-flow' ? 1 : -1, index };
}

const flip = (l: BoundaryLine): BoundaryLine => ({ ...l, nx: -l.nx, ny: -l.ny, c: -l.c });

/**
 * Orients a line so the wells lie on its positive side; throws when a well sits on the line
 * (within its radius) or wells lie on both sides.
 */
function orientLine(line: BoundaryLine, scenario: Scenario): BoundaryLine {
  const wells = scenario.wells;
  let positive = 0;
  let negative = 0;
  wells.forEach((w, i) => {
    const d = signedDistance(line, w.x, w.y);
    if (Math.abs(d) <= w.radius_m) {
      unsupported(`/wells/${i}: well "${w.id}" lies on boundary ${line.index} (within its radius); move it into the aquifer`, [
        { path: `/wells/${i}`, message: `lies on boundary /boundaries/${line.index} (${Math.abs(d).toFixed(3)} m from the line, radius ${w.radius_m} m)` },
      ]);
    }
    if (d > 0) positive++;
    else negative++;
  });
  if (positive > 0 && negative > 0) {
    // The aquifer is taken to be the side with more wells; name the first well on the other side.
    const aquiferPositive = positive >= negative;
    const i = wells.findIndex((w) => signedDistance(line, w.x, w.y) > 0 !== aquiferPositive);
    const w = wells[i]!;
    unsupported(`/wells/${i}: well "${w.id}" is on the other side of boundary ${line.index} from the other wells`, [
      { path: `/wells/${i}`, message: `lies across boundary /boundaries/${line.index} from the other wells; all wells must be on the aquifer side` },
    ]);
  }
  if (positive > 0) return line;
  if (negative > 0) return flip(line);
  // No wells: let the first excavation decide which side is the aquifer.
  const first = scenario.excavations[0];
  if (first) {
    const [cx, cy] = getPolygonCentroid(first.outline);
    if (signedDistance(line, cx, cy) < 0) return flip(line);
  }
  return line;
}

/**
 * Validates `scenario.boundaries` for the image-well method and orients each line toward the
 * aquifer (the side holding the wells).
 *
 * @throws DrydigError DRYDIG_ERR_UNSUPPORTED_BOUNDARIES naming `/boundaries/i` or `/wells/i` for
 *   more than two lines, crossing lines that are not perpendicular, coincident lines, a well on a
 *   line, wells on both sides of a line, or wells outside the strip of two parallel lines
 */
export function resolveBoundaryGeometry(scenario: Scenario): BoundaryGeometry {
  const boundaries = scenario.boundaries ?? [];
  if (boundaries.length === 0) return { configuration: 'none', lines: [] };
  if (boundaries.length > 2) {
    unsupported(`/boundaries/2: at most two straight boundaries are supported, found ${boundaries.length}`, [
      { path: '/boundaries/2', message: `the image-well method here handles one line or two (perpendicular or parallel); found ${boundaries.length}` },
    ]);
  }
  const raw = boundaries.map((b, i) => rawLine(b, i));
  if (raw.length === 1) return { configuration: 'single', lines: [orientLine(raw[0]!, scenario)] };

  const [l1, l2] = raw as [BoundaryLine, BoundaryLine];
  // Angle between the lines from their normals: |cos| = 1 parallel, 0 perpendicular.
  const cos = Math.min(1, Math.abs(l1.nx * l2.nx + l1.ny * l2.ny));
  const angle = Math.acos(cos); // 0 = parallel, π/2 = perpendicular
  if (angle <= BOUNDARY_ANGLE_TOLERANCE_RAD) {
    // Treat as exactly parallel: use line 1's direction for both, through line 2's point.
    const sameDir = l1.nx * l2.nx + l1.ny * l2.ny > 0;
    const c2 = sameDir ? l2.c : -l2.c;
    const spacing = Math.abs(c2 - l1.c);
    const b2 = boundaries[1]!;
    const l2p: BoundaryLine = { ...l2, nx: l1.nx, ny: l1.ny, c: l1.nx * b2.from[0] + l1.ny * b2.from[1] };
    if (!(spacing > 1e-6)) {
      unsupported('/boundaries/1: the two boundaries coincide', [{ path: '/boundaries/1', message: 'lies on top of /boundaries/0; remove one' }]);
    }
    const o1 = orientLine(l1, scenario);
    // Without wells nothing says which side is inside: take the strip.
    const o2 = scenario.wells.length === 0 ? flip({ ...l2p, nx: o1.nx, ny: o1.ny, c: o1.nx * b2.from[0] + o1.ny * b2.from[1] }) : orientLine(l2p, scenario);
    if (o1.nx * o2.nx + o1.ny * o2.ny > 0) {
      // Both normals point the same way: the wells are beyond both lines, not between them.
      const i = scenario.wells.length > 0 ? 0 : -1;
      const path = i >= 0 ? `/wells/${i}` : '/boundaries/1';
      unsupported(`${path}: the wells must lie between the two parallel boundaries`, [
        { path, message: 'lies outside the strip between the two parallel boundaries; the farther line would be across the nearer one' },
      ]);
    }
    return {
      configuration: 'parallel',
      lines: [o1, o2],
      spacing_m: spacing,
      angleDeviation_deg: (angle * 180) / Math.PI,
    };
  }
  const offPerpendicular = Math.abs(Math.PI / 2 - angle);
  if (offPerpendicular <= BOUNDARY_ANGLE_TOLERANCE_RAD) {
    return {
      configuration: 'perpendicular',
      lines: [orientLine(l1, scenario), orientLine(l2, scenario)],
      angleDeviation_deg: (offPerpendicular * 180) / Math.PI,
    };
  }
  const deg = (angle * 180) / Math.PI;
  return unsupported(
    `/boundaries/1: the two boundaries cross at ${deg.toFixed(1)}°; only perpendicular (90°) or parallel lines are supported`,
    [{ path: '/boundaries/1', message: `crosses /boundaries/0 at ${deg.toFixed(1)}°; make the lines perpendicular or parallel, or drop one` }],
  );
}

/** Number of images per real well for a geometry (parallel: with `terms` as from {@link chooseParallelTerms}). */
export function countImagesPerWell(geometry: BoundaryGeometry, terms = 0): number {
  switch (geometry.configuration) {
    case 'none':
      return 0;
    case 'single':
      return 1;
    case 'perpendicular':
      return 3;
    case 'parallel':
      return 4 * terms;
  }
}

function reflect(line: BoundaryLine, x: number, y: number): [number, number] {
  const d = 2 * signedDistance(line, x, y);
  return [x - d * line.nx, y - d * line.ny];
}

/**
 * The image wells of a real well at (x, y).
 *
 * Two parallel lines (strip 0 < ξ < d, ξ the distance from line 1, well at ξ0): translations
 * ξ0 + 2nd with sign (σ1σ2)^|n| for 1 ≤ |n| ≤ N and reflections −ξ0 + 2nd with sign σ1(σ1σ2)^|n|
 * for −N < n ≤ N, σ the image sign of each line — 4N images (Ferris et al. 1962).
 *
 * @param terms parallel lines only: N, the number of terms kept on each side
 */
export function getImageWells(geometry: BoundaryGeometry, x: number, y: number, terms = 0): ImageWell[] {
  const lines = geometry.lines;
  switch (geometry.configuration) {
    case 'none':
      return [];
    case 'single': {
      const l = lines[0]!;
      const [ix, iy] = reflect(l, x, y);
      return [{ x: ix, y: iy, sign: l.imageSign }];
    }
    case 'perpendicular': {
      const [a, b] = lines as [BoundaryLine, BoundaryLine];
      const [ax, ay] = reflect(a, x, y);
      const [bx, by] = reflect(b, x, y);
      const [abx, aby] = reflect(b, ax, ay);
      return [
        { x: ax, y: ay, sign: a.imageSign },
        { x: bx, y: by, sign: b.imageSign },
        { x: abx, y: aby, sign: (a.imageSign * b.imageSign) as 1 | -1 },
      ];
    }
    case 'parallel': {
      const [a, b] = lines as [BoundaryLine, BoundaryLine];
      const d = geometry.spacing_m!;
      const s1 = a.imageSign;
      const s12 = a.imageSign * b.imageSign;
      const xi = signedDistance(a, x, y);
      // Foot of the well on line 1, then move along its inward normal.
      const fx = x - xi * a.nx;
      const fy = y - xi * a.ny;
      const out: ImageWell[] = [];
      const at = (offset: number, sign: number) => out.push({ x: fx + offset * a.nx, y: fy + offset * a.ny, sign: sign as 1 | -1 });
      for (let n = 1; n <= terms; n++) {
        const sn = s12 ** n;
        at(xi + 2 * n * d, sn);
        at(xi - 2 * n * d, sn);
      }
      for (let n = -terms + 1; n <= terms; n++) at(-xi + 2 * n * d, s1 * s12 ** Math.abs(n));
      return out;
    }
  }
}

/** Options of {@link chooseParallelTerms}. */
export interface ChooseParallelTermsOptions {
  /** Distance between the two parallel lines, m. */
  spacing_m: number;
  /**
   * Largest absolute response, per 1 m³/s, of one image at distance r (m) from a point, over the
   * run; must not increase with r (Theis W(u) at the longest elapsed time, clipped Thiem ln(R/r), K0).
   */
  maxUnitResponseAt: (distance_m: number) => number;
  /** Σ |ΔQ| over all rate steps of all wells, m³/s (the bound scales with it). */
  totalAbsRate_m3_s: number;
  /** Head error allowed from truncation, m. Default 1e-6. */
  tolerance_m?: number;
  /** Most terms N per side. Default 250 (1000 images per well). */
  maxTerms?: number;
}

/** Result of {@link chooseParallelTerms}. */
export interface ParallelTerms {
  /** N: terms kept per side (4N images per well). */
  terms: number;
  /** Bound on the absolute head (or discharge-potential) error from the images left out, m. */
  bound_m: number;
}

/** Longest series examined for the tail sum; far beyond any site-scale strip. */
const MAX_TAIL_TERMS = 2_000_000;

/**
 * Chooses the truncation N of the parallel-boundary image series and bounds its error.
 *
 * For any point in the strip, a left-out translation image (|n| > N) lies at least (2|n| − 1)·d
 * away and a left-out reflection image (n > N or n ≤ −N) at least 2(|n| − 1)·d resp. 2|n|·d away,
 * so with f the largest unit response at a distance, the error is at most
 * ΣQ·[Σ_{m>N} 2f((2m−1)d) + Σ_{m≥N} 2f(2md)] (triangle inequality; f non-increasing).
 * The tail is summed until its terms fall below 1e-30 m per m³/s (plus a 1e-24 allowance for
 * the rest), or for clipped steady responses until the images lie beyond R (then exactly 0).
 */
export function chooseParallelTerms({
  spacing_m,
  maxUnitResponseAt,
  totalAbsRate_m3_s,
  tolerance_m = 1e-6,
  maxTerms = 250,
}: ChooseParallelTermsOptions): ParallelTerms {
  if (!(totalAbsRate_m3_s > 0)) return { terms: 0, bound_m: 0 };
  const d = spacing_m;
  // a[m] = 2f((2m−1)d), b[m] = 2f(2md) for m = 1…M.
  const a: number[] = [0];
  const b: number[] = [0];
  for (let m = 1; m <= MAX_TAIL_TERMS; m++) {
    const am = 2 * maxUnitResponseAt((2 * m - 1) * d);
    const bm = 2 * maxUnitResponseAt(2 * m * d);
    a.push(am);
    b.push(bm);
    // Past 1e-30 m per m³/s the terms only shrink faster (Gaussian-like for W, geometric for
    // K0 with ratio e^(−2d/B)); what follows is covered by TAIL_REMAINDER below.
    if (am + bm < 1e-30) break;
  }
  const M = a.length - 1;
  // Allowance for the terms after the stop, per m³/s: below 1e-30·B/(2d) even for the slowest
  // (K0) decay at B/d ≤ 1e5; generous and still far below any tolerance.
  const TAIL_REMAINDER = 1e-24;
  // The loop stopped on underflow (true tail < 1e-300) or at the cap; past the cap the terms
  // cannot exceed the last one, which would make the bound infinite — count it as such.
  if (M === MAX_TAIL_TERMS && a[M]! + b[M]! >= 1e-30) {
    throw new DrydigError(
      'DRYDIG_ERR_UNSUPPORTED_BOUNDARIES',
      `/boundaries/1: the parallel boundaries are ${d} m apart, too narrow for the image series against the reach of the drawdown`,
      [{ path: '/boundaries/1', message: 'is so close to /boundaries/0 that the image series cannot be bounded; widen the strip or give a smaller influenceRadius_m' }],
    );
  }
  const tailA = new Float64Array(M + 2); // Σ_{m ≥ k} a[m]
  const tailB = new Float64Array(M + 2);
  for (let m = M; m >= 1; m--) {
    tailA[m] = tailA[m + 1]! + a[m]!;
    tailB[m] = tailB[m + 1]! + b[m]!;
  }
  const boundFor = (N: number) => {
    const ta = N + 1 <= M ? tailA[N + 1]! : 0;
    const tb = N >= 1 && N <= M ? tailB[N]! : 0;
    return totalAbsRate_m3_s * (ta + tb + (a[M]! + b[M]! > 0 ? TAIL_REMAINDER : 0));
  };
  let N = 1;
  while (N < maxTerms && boundFor(N) > tolerance_m) N++;
  return { terms: N, bound_m: boundFor(N) };
}
