import { besselK0 } from './bessel-k0';

/**
 * Terms stop once the Bessel argument exceeds this: K0(40) ≈ 8e-19, and every later term is
 * smaller still (K0 decreasing, the other factors bounded).
 */
const LAST_BETA = 40;

/** Most terms one evaluation may sum (reached only for r far below D/10⁴). */
const MAX_TERMS = 200_000;

/** Options of {@link partialPenetrationCorrection}. Depths are measured down from the aquifer top. */
export interface PartialPenetrationCorrectionOptions {
  /** Horizontal distance from the pumped well r, m (> 0; at the pumped well itself: r_w). */
  distance_m: number;
  /** Aquifer thickness D (unconfined: saturated thickness), m. */
  thickness_m: number;
  /** Depth of the pumped well's screen top below the aquifer top d, m (0 ≤ d < l ≤ D). */
  screenTopDepth_m: number;
  /** Depth of the pumped well's screen bottom below the aquifer top l (Kruseman & de Ridder's b), m. */
  screenBottomDepth_m: number;
  /** Depth of the observation screen's top below the aquifer top d', m. */
  observationTopDepth_m: number;
  /**
   * Depth of the observation screen's bottom l', m. Equal to `observationTopDepth_m`: a
   * piezometer open at that one depth. Default: the same as the top (a piezometer).
   */
  observationBottomDepth_m?: number;
  /** Kh/Kv (−). Default 1 (isotropic). */
  anisotropyKhKv?: number;
  /** Leaky aquifer: leakage factor B, m (Hantush 1964 form); absent for confined / unconfined. */
  leakageFactor_m?: number;
}

/**
 * Hantush's (1961) correction f_s for a partially penetrating well, in the form given by
 * Kruseman & de Ridder (1994, ch. 10): the drawdown is s = Q/(4πT)·(W + f_s), W the fully
 * penetrating well function (Theis W(u) at late time, 2·ln(R/r) for Thiem, 2·K0(r/B) for de Glee),
 *
 *   piezometer at depth a:       f_s = 4D/(π(l − d)) · Σ 1/n · K0(β_n) · cos(nπa/D) · [sin(nπl/D) − sin(nπd/D)]
 *   observation screen d'…l':    f_s = 4D²/(π²(l − d)(l' − d')) · Σ 1/n² · K0(β_n) · [sin(nπl/D) − sin(nπd/D)] · [sin(nπl'/D) − sin(nπd'/D)]
 *
 * with β_n = nπ·r·√(Kv/Kh)/D (anisotropy by the usual scaling of r), and for a leaky aquifer
 * β_n = √((r/B)² + (nπ·r·√(Kv/Kh)/D)²) (Hantush 1964). The screen form is the piezometer form
 * averaged over the observation screen; for the pumped well itself take r = r_w and its own
 * screen. A fully penetrating screen (d = 0, l = D) gives f_s = 0 exactly.
 *
 * In a transient run the correction holds once t > D·S/(2·Kv) (Kruseman & de Ridder, from
 * memory); it is negligible beyond r ≈ 1.5·D·√(Kh/Kv) (K0(1.5π) ≈ 0.005). Checked against
 * `scripts/reference/partial-penetration.py` (mpmath).
 *
 * @returns f_s (−); positive where the partial screen draws the head lower than a full one
 */
export function partialPenetrationCorrection(options: PartialPenetrationCorrectionOptions): number {
  // f_s depends on the geometry alone (and B where leaky), not on K or S: re-solves with scaled
  // K (sensitivity, Monte Carlo) ask for the same pairs again, so answers are kept (bounded),
  // looked up by their inputs as numbers (no string keys: formatting doubles costs more than a lookup).
  const key = [
    options.thickness_m,
    options.screenTopDepth_m,
    options.screenBottomDepth_m,
    options.observationTopDepth_m,
    options.observationBottomDepth_m ?? options.observationTopDepth_m,
    options.anisotropyKhKv ?? 1,
    options.leakageFactor_m ?? -1,
  ];
  let level: Map<number, unknown> = KEPT_CORRECTIONS;
  for (const part of key) {
    let next = level.get(part) as Map<number, unknown> | undefined;
    if (!next) level.set(part, (next = new Map()));
    level = next;
  }
  const byDistance = level as Map<number, number>;
  const kept = byDistance.get(options.distance_m);
  if (kept !== undefined) return kept;
  const value = seriesCorrection(options);
  if (++keptCount > MAX_KEPT_CORRECTIONS) {
    KEPT_CORRECTIONS.clear();
    keptCount = 0;
  }
  byDistance.set(options.distance_m, value);
  return value;
}

/** Corrections already summed, by their inputs (a pure function's answers), geometry first, distance last. */
const KEPT_CORRECTIONS = new Map<number, unknown>();
let keptCount = 0;
/** Most answers kept before the store starts afresh (a few MB). */
const MAX_KEPT_CORRECTIONS = 50_000;

function seriesCorrection(options: PartialPenetrationCorrectionOptions): number {
  const { distance_m: r, thickness_m: D, screenTopDepth_m: d, screenBottomDepth_m: l, observationTopDepth_m: d2 } = options;
  const l2 = options.observationBottomDepth_m ?? d2;
  const ratio = options.anisotropyKhKv ?? 1;
  if (!(r > 0) || !(D > 0) || !(l > d) || !(ratio > 0)) return 0;
  // A full screen has no correction (every sine difference vanishes); skip the series.
  if (d <= 0 && l >= D) return 0;
  const scaled = (Math.PI * r) / (D * Math.sqrt(ratio));
  const leak = options.leakageFactor_m !== undefined ? r / options.leakageFactor_m : 0;
  const k = Math.PI / D;
  const screen = l2 > d2;
  let sum = 0;
  for (let n = 1; n <= MAX_TERMS; n++) {
    const a = n * scaled;
    const beta = leak > 0 ? Math.sqrt(leak * leak + a * a) : a;
    if (beta > LAST_BETA) break;
    const pumped = Math.sin(n * k * l) - Math.sin(n * k * d);
    const observed = screen ? (Math.sin(n * k * l2) - Math.sin(n * k * d2)) / (n * k * (l2 - d2)) : Math.cos(n * k * d2);
    sum += (besselK0(beta) * pumped * observed) / n;
  }
  return ((4 * D) / (Math.PI * (l - d))) * sum;
}
