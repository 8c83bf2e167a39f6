/**
 * Ground under the floor (design.md §8): an optional layer profile for the site and, overriding
 * it, per excavation. Levels are elevations, layers listed from the top down and contiguous.
 * Additive to scenario v1: a scenario without it means what it meant before.
 */
import { Type, type Static } from '@sinclair/typebox';
import type { FieldIssue } from './error-table';
import { CONDUCTIVITY_RANGE_M_S, Level } from './physical-ranges';

/** Plausible unit weights of soils, kN/m³ (common practice: organic clays ≈ 13, dense gravels ≈ 23). */
export const UNIT_WEIGHT_RANGE_kN_m3 = { minimum: 10, maximum: 26 } as const;

export const GroundLayerKindSchema = Type.Union([Type.Literal('plug'), Type.Literal('granular')], {
  description: 'plug: low-permeability ground (clay, silt, rock) that holds water pressure under it; granular: sand, gravel — water flows through it.',
});
export type GroundLayerKind = Static<typeof GroundLayerKindSchema>;

export const GroundLayerSchema = Type.Object(
  {
    id: Type.String({ minLength: 1, maxLength: 64 }),
    top_m: Level({ description: 'Layer top elevation, m.' }),
    bottom_m: Level({ description: 'Layer bottom elevation, m.' }),
    kind: GroundLayerKindSchema,
    unitWeightSat_kN_m3: Type.Number({ ...UNIT_WEIGHT_RANGE_kN_m3, description: 'Saturated unit weight γsat, kN/m³.' }),
    unitWeight_kN_m3: Type.Optional(Type.Number({ ...UNIT_WEIGHT_RANGE_kN_m3, description: 'Moist unit weight γ above the water table, kN/m³ (default γsat).' })),
    conductivity_m_s: Type.Optional(Type.Number({ minimum: CONDUCTIVITY_RANGE_M_S[0], maximum: CONDUCTIVITY_RANGE_M_S[1], description: 'Hydraulic conductivity K, m/s (information; the plan model uses the aquifer’s).' })),
    description: Type.Optional(Type.String({ maxLength: 500 })),
  },
  { additionalProperties: false },
);
export type GroundLayer = Static<typeof GroundLayerSchema>;

export const GroundProfileSchema = Type.Object(
  { layers: Type.Array(GroundLayerSchema, { minItems: 1, maxItems: 50 }) },
  { additionalProperties: false, description: 'Layers from the top down, contiguous.' },
);
export type GroundProfile = Static<typeof GroundProfileSchema>;

/** Levels closer than this are the same level (contiguity of layers), m. */
const LEVEL_TOLERANCE_M = 1e-6;

interface AquiferLevels {
  base_m: number;
  top_m?: number;
  staticLevel_m: number;
}

/** The granular layer the wells pump: the one overlapping the aquifer most; null when none does. */
export function findPumpedLayer(profile: GroundProfile, aquifer: AquiferLevels): number | null {
  const top = aquifer.top_m ?? aquifer.staticLevel_m;
  let best: number | null = null;
  let bestOverlap = 0;
  profile.layers.forEach((l, i) => {
    if (l.kind !== 'granular') return;
    const overlap = Math.min(l.top_m, top) - Math.max(l.bottom_m, aquifer.base_m);
    if (overlap > bestOverlap + LEVEL_TOLERANCE_M) {
      best = i;
      bestOverlap = overlap;
    }
  });
  return best;
}

/** Meaning of one profile: levels in order and contiguous, weights consistent, the pumped aquifer among the layers. */
export function groundProfileIssues(profile: GroundProfile, path: string, aquifer: AquiferLevels, groundLevel_m: number): FieldIssue[] {
  const issues: FieldIssue[] = [];
  const add = (p: string, message: string) => issues.push({ path: `${path}${p}`, message });
  const ids = new Set<string>();
  profile.layers.forEach((l, i) => {
    if (ids.has(l.id)) add(`/layers/${i}/id`, `duplicate layer id "${l.id}"`);
    ids.add(l.id);
    if (!(l.top_m > l.bottom_m)) add(`/layers/${i}/bottom_m`, `layer bottom (${l.bottom_m} m) must lie below its top (${l.top_m} m)`);
    const above = profile.layers[i - 1];
    if (above && Math.abs(above.bottom_m - l.top_m) > LEVEL_TOLERANCE_M)
      add(`/layers/${i}/top_m`, `layers must be listed from the top down and touch: this top (${l.top_m} m) must equal the bottom of layer "${above.id}" (${above.bottom_m} m)`);
    if (l.unitWeight_kN_m3 !== undefined && l.unitWeight_kN_m3 > l.unitWeightSat_kN_m3 + 1e-9)
      add(`/layers/${i}/unitWeight_kN_m3`, `moist unit weight (${l.unitWeight_kN_m3} kN/m³) must not exceed the saturated unit weight (${l.unitWeightSat_kN_m3} kN/m³)`);
  });
  const first = profile.layers[0];
  if (first && first.top_m < groundLevel_m - 0.5)
    add('/layers/0/top_m', `the profile starts at ${first.top_m} m, more than 0.5 m below ground level (${groundLevel_m} m); start it at ground level`);
  if (findPumpedLayer(profile, aquifer) === null)
    add('/layers', `no granular layer overlaps the pumped aquifer (${aquifer.base_m} m to ${aquifer.top_m ?? aquifer.staticLevel_m} m): the aquifer the wells pump must be one of the layers`);
  return issues;
}
