/**
 * The floor of one excavation: its ground profile (its own, else the site's), the target the
 * wells must meet under it, and the deepest formation level that is safe at a given head — the
 * safe-dig level of the excavation sequence.
 */
import type { Excavation, GroundProfile, Scenario } from '../schema';
import { analyseFloorGround, floorGroundAnalyser, type FloorGround } from './floor-profile';
import { floorTarget, type FloorTarget } from './floor-checks';
import type { FloorCheckOptions } from './floor-options';

/** Levels nearer than this count as met when scanning for the safe-dig level, m. */
const LEVEL_TOLERANCE_M = 1e-6;
/** Step of the safe-dig scan before it is refined by bisection, m. */
const SCAN_STEP_M = 0.05;

export interface ExcavationFloor {
  /** Where the profile came from; null: no ground profile (only the dry check). */
  profileSource: 'excavation' | 'site' | null;
  profile: GroundProfile | null;
  ground: FloorGround | null;
  target: FloorTarget;
}

/** The profile that applies to an excavation: its own, else the site's, else none. */
export function groundProfileOf(scenario: Scenario, excavation: Excavation): { profile: GroundProfile | null; source: ExcavationFloor['profileSource'] } {
  if (excavation.ground) return { profile: excavation.ground, source: 'excavation' };
  if (scenario.ground) return { profile: scenario.ground, source: 'site' };
  return { profile: null, source: null };
}

/** The floor of an excavation dug to `formationLevel_m` (default its formation level). */
export function excavationFloor(scenario: Scenario, excavation: Excavation, options: FloorCheckOptions, formationLevel_m = excavation.formationLevel_m): ExcavationFloor {
  const { profile, source } = groundProfileOf(scenario, excavation);
  const ground = profile ? analyseFloorGround(profile, scenario.aquifer, formationLevel_m) : null;
  return { profileSource: source, profile, ground, target: floorTarget(ground, formationLevel_m, excavation.margin_m, options) };
}

/**
 * Deepest formation level, not below the excavation's own, to which it may be dug while the
 * aquifer's head under it is `head_m`: every level from the top of the ground down to it meets
 * the target that governs there (dry in granular ground, uplift over a plug, no heave).
 * Scanned top down in 5 cm steps and refined by bisection to 1 mm. Returns the top of the
 * ground when even a shallow dig is unsafe (artesian head). For many heads use `safeLevelFinder`.
 */
export function safeFormationLevel(scenario: Scenario, excavation: Excavation, options: FloorCheckOptions, head_m: number): number {
  return safeLevelFinder(scenario, excavation, options)(head_m);
}

/**
 * `safeFormationLevel` for many heads of one excavation: the ground profile is analysed once and
 * the safe level at each scan level is computed once (it does not depend on the head).
 */
export function safeLevelFinder(scenario: Scenario, excavation: Excavation, options: FloorCheckOptions): (head_m: number) => number {
  const bottom = excavation.formationLevel_m;
  const { profile } = groundProfileOf(scenario, excavation);
  const analyse = profile ? floorGroundAnalyser(profile, scenario.aquifer) : null;
  const top = Math.max(scenario.groundLevel_m, profile?.layers[0]?.top_m ?? -Infinity);
  const targetAt = (z: number) => floorTarget(analyse ? analyse(z) : null, z, excavation.margin_m, options).safeLevel_m;
  const scan: Array<{ z: number; target_m: number }> = [];
  for (let z = top; z > bottom; z -= SCAN_STEP_M) scan.push({ z, target_m: targetAt(z) });
  const bottomTarget_m = targetAt(bottom);
  return (head_m) => {
    const safeAt = (z: number) => head_m <= targetAt(z) + LEVEL_TOLERANCE_M;
    const meets = (target_m: number) => head_m <= target_m + LEVEL_TOLERANCE_M;
    if (scan.length === 0) return meets(bottomTarget_m) ? bottom : top;
    if (!meets(scan[0]!.target_m)) return top;
    for (let k = 1; k < scan.length; k++) if (!meets(scan[k]!.target_m)) return refine(safeAt, scan[k - 1]!.z, scan[k]!.z);
    return meets(bottomTarget_m) ? bottom : refine(safeAt, scan[scan.length - 1]!.z, bottom);
  };
}

/** Bisection between a safe level above and an unsafe one below, to 1 mm. */
function refine(safeAt: (z: number) => boolean, safe: number, unsafe: number): number {
  let a = safe;
  let b = unsafe;
  while (a - b > 1e-3) {
    const m = (a + b) / 2;
    if (safeAt(m)) a = m;
    else b = m;
  }
  return a;
}
