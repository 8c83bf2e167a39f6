/**
 * The words of the pit-floor checks, in one place: the map key, the site view, the report, the
 * design CSV and the cautions all read them from here.
 */
import type { GoverningFloorCheck } from './floor-checks';

/** Short label of the check that sets the target. */
export const GOVERNING_CHECK_LABELS: Record<GoverningFloorCheck, string> = {
  dry: 'dry floor (groundwater below formation − margin)',
  uplift: 'uplift of the plug (EN 1997-1 UPL)',
  heave: 'heave / boiling of the floor (EN 1997-1 HYD)',
};

/** Shortfall words on the map and in the key: what is wrong where a target is not met. */
export const FLOOR_SHORTFALL_LABELS = {
  water: 'water above target',
  floor: 'floor unsafe (uplift or heave)',
} as const;

/** The assumptions every floor result carries. */
export const FLOOR_ASSUMPTIONS =
  'Pit-floor checks: one-dimensional vertical equilibrium of the ground under the floor against the piezometric head of the plan model, no side friction, no slab or cut-off wall; partial factors are the EN 1997-1 recommended values unless set (national annexes differ). Confirm the ground profile and heads by site investigation and piezometers, and have the base stability checked by a licensed engineer.';

/** Formats a duration for the cautions: seconds, minutes, hours or days. */
export function formatFloorDuration(t_s: number): string {
  if (t_s < 120) return `${Math.round(t_s)} s`;
  if (t_s < 7200) return `${Math.round(t_s / 60)} min`;
  if (t_s < 172800) return `${(t_s / 3600).toFixed(1)} h`;
  return `${(t_s / 86400).toFixed(1)} days`;
}

interface FloorCautionInput {
  excavationId: string;
  governing: GoverningFloorCheck;
  profileSource: 'excavation' | 'site' | null;
  allowableLevel_m: number | null;
  requiredUpliftFS: number | null;
  timeToUnsafe_s: number | null;
}

/** Cautions for the floors of a design: missing profiles, the governing check, standby time. */
export function floorCautions(floors: FloorCautionInput[]): string[] {
  const out: string[] = [];
  const unprofiled = floors.filter((f) => f.profileSource === null).map((f) => f.excavationId);
  if (unprofiled.length > 0)
    out.push(`No ground profile for ${unprofiled.join(', ')}: only the dry check was made — uplift of a low-permeability plug and heave of the floor are not checked. Give the ground under the floor.`);
  if (floors.some((f) => f.profileSource !== null)) out.push(FLOOR_ASSUMPTIONS);
  for (const f of floors) {
    if (f.governing === 'uplift' && f.allowableLevel_m !== null)
      out.push(
        `Excavation "${f.excavationId}": uplift of the plug governs — the aquifer head must stay at or below ${f.allowableLevel_m.toFixed(2)} m (FS ≥ ${f.requiredUpliftFS?.toFixed(3)}). This is pressure relief, not dewatering: the design holds the head at the required factor with no further reserve, ${
          f.timeToUnsafe_s !== null ? `and after a power failure the floor becomes unsafe in about ${formatFloorDuration(f.timeToUnsafe_s)}` : 'and a power failure makes the floor unsafe'
        } — standby power must start within that time, or dig the last metre only once more relief is in place.`,
      );
  }
  return out;
}
