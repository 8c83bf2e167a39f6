/**
 * The two pit-floor checks at one head, and the levels that just meet them.
 *
 * Uplift (EN 1997-1 UPL, eq. 2.8; textbook form FS = Σγᵢtᵢ / (γw·h_p), h_p the pressure head at the
 * plug's base): FS = W / (γw · (h − z_b)), required FS = γG;dst / γG;stb; allowable piezometric
 * level h_allow = z_b + W / (γw · FS_req).
 * Heave / boiling (EN 1997-1 HYD, eq. 2.9, gradient form, Terzaghi): mean upward gradient over the
 * granular floor i = (h − z_f) / t against i_c = γ′/γw; FS = i_c / i, allowable h = z_f + i_c·t / F.
 */
import { requiredUpliftFactor, WATER_UNIT_WEIGHT_kN_m3, type FloorCheckOptions } from './floor-options';
import type { FloorGround, GranularFloor, PlugUnderFloor } from './floor-profile';

/** Uplift factor of safety of the plug at piezometric head `head_m`; null where the head is at or below its base (no uplift). */
export function upliftFactorOfSafety(plug: PlugUnderFloor, head_m: number): number | null {
  const pressure_kPa = WATER_UNIT_WEIGHT_kN_m3 * (head_m - plug.base_m);
  return pressure_kPa > 0 ? plug.weight_kPa / pressure_kPa : null;
}

/** Highest piezometric head in the aquifer under the plug that meets the required uplift factor, m. */
export function allowableUpliftLevel(plug: PlugUnderFloor, options: FloorCheckOptions): number {
  return plug.base_m + plug.weight_kPa / (WATER_UNIT_WEIGHT_kN_m3 * requiredUpliftFactor(options));
}

/** Mean upward gradient through the granular floor at head `head_m` (0 where the head is at or below formation). */
export function upwardGradient(granular: GranularFloor, formationLevel_m: number, head_m: number): number {
  return Math.max(0, head_m - formationLevel_m) / granular.thickness_m;
}

/** Heave factor of safety i_c / i; null where there is no upward gradient. */
export function heaveFactorOfSafety(granular: GranularFloor, formationLevel_m: number, head_m: number): number | null {
  const i = upwardGradient(granular, formationLevel_m, head_m);
  return i > 0 ? granular.criticalGradient / i : null;
}

/** Highest head under a granular floor that keeps i_c / i at the required factor, m. */
export function allowableHeaveLevel(granular: GranularFloor, formationLevel_m: number, options: FloorCheckOptions): number {
  return formationLevel_m + (granular.criticalGradient * granular.thickness_m) / options.heaveFactor;
}

export type GoverningFloorCheck = 'dry' | 'uplift' | 'heave';

/** The level the wells must reach under one formation level, and which check sets it. */
export interface FloorTarget {
  governing: GoverningFloorCheck;
  /** The level the wells must reach: the governing level less the margin kept as reserve. */
  targetLevel_m: number;
  /** The governing level itself, without the reserve: the highest head at which the floor is still safe. */
  safeLevel_m: number;
  /** The strictest floor-safety level (uplift or heave); null where neither check applies. */
  allowableLevel_m: number | null;
  upliftLevel_m: number | null;
  heaveLevel_m: number | null;
  /** Formation − margin where the floor must be dry (granular or unknown ground); else null. */
  dryLevel_m: number | null;
}

/**
 * The target under a formation: a granular floor open to the pumped aquifer (or one with no
 * profile) must be dry (formation − margin) and must not boil; a plug left over the pumped aquifer
 * needs the aquifer's head at or below the allowable uplift level, which may stand above formation.
 * The excavation's margin is kept below whichever level applies (formation, or the allowable
 * uplift / heave level). Where several apply, the strictest governs.
 */
export function floorTarget(ground: FloorGround | null, formationLevel_m: number, margin_m: number, options: FloorCheckOptions): FloorTarget {
  const z = formationLevel_m;
  // A plug between formation and the pumped aquifer separates the two: the aquifer's head then
  // loads the plug (uplift) and is not the water level in the ground at formation, so neither the
  // dry nor the heave criterion applies to it (water perched above the plug is sump work).
  const separated = ground?.plug != null;
  const needsDry = !separated;
  const upliftLevel_m = ground?.plug ? allowableUpliftLevel(ground.plug, options) : null;
  const heaveLevel_m = ground?.granular && !separated ? allowableHeaveLevel(ground.granular, z, options) : null;
  const dryLevel_m = needsDry ? z - margin_m : null;
  // The margin is kept below a safety level too, as reserve for fluctuation and for the minutes
  // after a pump stops; a negative margin is never applied there (it would take the factor of
  // safety below the required one) — the scenario warnings say so.
  const reserve_m = Math.max(0, margin_m);
  const candidates: Array<[GoverningFloorCheck, number]> = [];
  if (dryLevel_m !== null) candidates.push(['dry', dryLevel_m]);
  if (upliftLevel_m !== null) candidates.push(['uplift', upliftLevel_m - reserve_m]);
  if (heaveLevel_m !== null) candidates.push(['heave', heaveLevel_m - reserve_m]);
  const [governing, targetLevel_m] = candidates.reduce((a, b) => (b[1] < a[1] ? b : a));
  const safety = [upliftLevel_m, heaveLevel_m].filter((v): v is number => v !== null);
  const safeLevel_m = Math.min(...safety, ...(dryLevel_m === null ? [] : [dryLevel_m]));
  return { governing, targetLevel_m, safeLevel_m, allowableLevel_m: safety.length > 0 ? Math.min(...safety) : null, upliftLevel_m, heaveLevel_m, dryLevel_m };
}
