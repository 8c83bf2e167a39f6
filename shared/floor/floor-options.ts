/**
 * Factors of the pit-floor checks, with their sources.
 *
 * - Uplift (UPL), EN 1997-1:2004 §2.4.7.4 eq. (2.8), V_dst;d ≤ G_stb;d + R_d, with the partial
 *   factors of Table A.15: γG;dst = 1.0 on the destabilising water pressure, γG;stb = 0.9 on the
 *   stabilising weight. These are the *recommended* values; national annexes differ.
 *   Side friction R_d is not counted (conservative). Required factor of safety = γG;dst / γG;stb.
 * - Heave (HYD), EN 1997-1 eq. (2.9), u_dst;d ≤ σ_stb;d, checked here in the gradient form used
 *   in practice: critical gradient i_c = γ′/γw over the mean upward gradient, required ≥ 1.5
 *   (common practice; design.md §8).
 */

/** Unit weight of water used by the floor checks, kN/m³ (fresh water, 9.81 = 1000 kg/m³ × 9.81 m/s²). */
export const WATER_UNIT_WEIGHT_kN_m3 = 9.81;

export interface FloorCheckOptions {
  /** γG;dst on the water pressure (−). */
  destabilisingFactor: number;
  /** γG;stb on the plug's weight (−). */
  stabilisingFactor: number;
  /** Required i_c / i in a granular floor (−). */
  heaveFactor: number;
}

/** EN 1997-1 Table A.15 recommended values and the common-practice heave factor. */
export const FLOOR_CHECK_DEFAULTS: FloorCheckOptions = { destabilisingFactor: 1.0, stabilisingFactor: 0.9, heaveFactor: 1.5 };

/** The stored/requested floor options (design.md §8 names) with defaults applied. */
export function resolveFloorOptions(input: { partialFactors?: { destabilising?: number; stabilising?: number }; heaveFactor?: number } | undefined): FloorCheckOptions {
  const d = FLOOR_CHECK_DEFAULTS;
  return {
    destabilisingFactor: input?.partialFactors?.destabilising ?? d.destabilisingFactor,
    stabilisingFactor: input?.partialFactors?.stabilising ?? d.stabilisingFactor,
    heaveFactor: input?.heaveFactor ?? d.heaveFactor,
  };
}

/** Required uplift factor of safety G/U = γG;dst / γG;stb (1.111 with the recommended values). */
export function requiredUpliftFactor(options: FloorCheckOptions): number {
  return options.destabilisingFactor / options.stabilisingFactor;
}
