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

// ————— The ground-profile editor and the borehole column (Ground tab) —————

/** Labels of a ground layer's fields in the profile editor and its messages. */
export const GROUND_LAYER_FIELD_LABELS = {
  id: 'name',
  top_m: 'top level',
  bottom_m: 'bottom level',
  kind: 'kind',
  unitWeightSat_kN_m3: 'saturated unit weight γsat',
  unitWeight_kN_m3: 'moist unit weight γ',
  conductivity_m_s: 'permeability K',
} as const;
export type GroundLayerField = keyof typeof GROUND_LAYER_FIELD_LABELS;

/** Kinds of ground as the editor offers them, and short names for the column. */
export const GROUND_LAYER_KIND_LABELS = {
  plug: { long: 'Plug (clay, silt, rock)', short: 'plug' },
  granular: { long: 'Granular (sand, gravel)', short: 'granular' },
} as const;

/** The fixed words of the profile editor. */
export const GROUND_EDITOR_TEXT = {
  heading: 'Ground under the floor',
  profileOf: 'Profile of',
  site: 'Site (every excavation without its own)',
  excavationOwn: (id: string) => `Excavation ${id} — own profile`,
  excavationUsesSite: (id: string) => `Excavation ${id} — uses the site profile`,
  none: 'No ground profile: the design makes only the dry check — uplift of a low-permeability plug and heave of the floor are not checked.',
  usesSite: (id: string) => `Excavation ${id} has no profile of its own and uses the site profile. Give it its own where the ground under this pit differs.`,
  startFromAquifer: 'Start from the aquifer levels',
  startHint: 'Makes a first profile from ground level and the aquifer top and base (cover over the aquifer as a plug, the aquifer granular) with common-practice unit weights — check every value against the borehole logs.',
  copySite: 'Give it its own profile (copy of the site profile)',
  dropOwn: 'Remove its own profile (use the site profile)',
  addBelow: 'Add layer below',
  addBelowHint: 'Splits this layer at mid-depth; edit the new lower part.',
  remove: 'Remove layer',
  removeLast: 'Remove profile',
  moistEmpty: 'as γsat',
  kOptional: 'not given',
  layerTitle: (n: number, id: string) => `Layer ${n} “${id}”`,
  hint: 'Layers from the top down, each top equal to the bottom of the one above (changing a boundary moves both layers). The aquifer the wells pump must be one of the granular layers. Unit weights: common practice 16–22 kN/m³ for soils.',
  issuesHeading: 'The profile needs fixing before the design can use it:',
} as const;

/** Where a message about a layer field points: "Layer 2 “clay”, saturated unit weight γsat". */
export function groundFieldName(index: number, id: string, field: GroundLayerField): string {
  return `${GROUND_EDITOR_TEXT.layerTitle(index + 1, id)}, ${GROUND_LAYER_FIELD_LABELS[field]}`;
}

/** A typed value outside its plausible range. */
export function outOfRangeText(name: string, typed: string, range: string): string {
  return `${name}: ${typed} is outside ${range}. Check the value and its unit.`;
}

interface ProfileIssueContext {
  /** The layers the issue is about. */
  layers: ReadonlyArray<{ id: string; top_m: number; bottom_m: number; unitWeight_kN_m3?: number; unitWeightSat_kN_m3: number }>;
  /** Formats a level in the display unit ("7.00 m", "22.97 ft"). */
  formatLevel: (level_m: number) => string;
  groundLevel_m: number;
  aquifer: { base_m: number; top_m?: number; staticLevel_m: number };
}

/**
 * A ground-profile issue (from `groundProfileIssues`, JSON pointer relative to the profile, e.g.
 * "/layers/1/bottom_m") in plain words with the field's label and the levels in display units.
 */
export function groundProfileIssueText(relativePath: string, fallback: string, ctx: ProfileIssueContext): string {
  const f = ctx.formatLevel;
  const m = /^\/layers\/(\d+)\/(\w+)$/.exec(relativePath);
  if (!m) {
    if (relativePath === '/layers')
      return `Layers: no granular layer overlaps the aquifer the wells pump (${f(ctx.aquifer.base_m)} to ${f(ctx.aquifer.top_m ?? ctx.aquifer.staticLevel_m)}). Make the layer the wells are screened in granular, or check its levels.`;
    return `Profile: ${fallback}`;
  }
  const i = Number(m[1]);
  const field = m[2] as GroundLayerField;
  const l = ctx.layers[i];
  if (!l || !(field in GROUND_LAYER_FIELD_LABELS)) return `Profile: ${fallback}`;
  const name = groundFieldName(i, l.id, field);
  const above = ctx.layers[i - 1];
  switch (field) {
    case 'id':
      return `${name}: another layer already has the name “${l.id}”; give each layer its own name.`;
    case 'bottom_m':
      return `${name}: ${f(l.bottom_m)} must lie below the layer's top level (${f(l.top_m)}).`;
    case 'top_m':
      if (i === 0) return `${name}: the profile starts at ${f(l.top_m)}, more than ${f(0.5)} below ground level (${f(ctx.groundLevel_m)}); start it at ground level.`;
      return `${name}: ${f(l.top_m)} must equal the bottom level of layer ${i} “${above?.id ?? ''}” (${f(above?.bottom_m ?? Number.NaN)}) — layers touch, from the top down.`;
    case 'unitWeight_kN_m3':
      return `${name}: ${l.unitWeight_kN_m3} kN/m³ must not exceed the saturated unit weight (${l.unitWeightSat_kN_m3} kN/m³).`;
    default:
      return `${name}: ${fallback}`;
  }
}

/** Words of the borehole column drawn on the Ground tab. */
export const BOREHOLE_LABELS = {
  title: (source: string) => `Borehole column: ${source}`,
  ground: 'ground',
  static: 'static',
  formation: (id: string) => `formation ${id}`,
  head: 'head (design)',
  allowable: 'allowable (uplift)',
  levelAxis: (unit: string) => `level, ${unit}`,
  stale: 'Head and allowable level are from the last design run, made before later edits: run the design again.',
  noDesign: 'Run the design (Design tab) to draw the aquifer’s computed head and the allowable uplift level here.',
  keyPlug: 'plug: low permeability',
  keyGranular: 'granular',
  keyHead: 'computed aquifer head at the critical point',
  keyAllowable: 'allowable head for uplift (FS met)',
  noSection: 'Draw a section line with the Section tool to see the section beside the column.',
} as const;
