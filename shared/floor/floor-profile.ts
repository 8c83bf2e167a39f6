/**
 * What lies under a formation level: the low-permeability plug left over the pumped aquifer (its
 * base and weight per unit area) and the granular ground at the floor (its thickness and critical
 * gradient). One-dimensional vertical equilibrium: no side friction, no slab, no wall.
 */
import { findPumpedLayer, type GroundLayer, type GroundProfile } from '../schema/ground-schema';
import { WATER_UNIT_WEIGHT_kN_m3 } from './floor-options';

export interface PlugUnderFloor {
  /** Base of the lowest plug layer between formation and the pumped aquifer, m: where the aquifer's pressure acts. */
  base_m: number;
  /** Σ γsat,i · t_i of the ground between formation and that base, kPa (kN/m² of floor). */
  weight_kPa: number;
  /** Thickness left under formation, m. */
  thickness_m: number;
}

export interface GranularFloor {
  /** Thickness of the granular ground from formation down to the first plug or the profile's base, m. */
  thickness_m: number;
  /** Critical gradient i_c = γ′/γw = (γsat − γw)/γw, thickness-weighted γsat (Terzaghi). */
  criticalGradient: number;
}

export interface FloorGround {
  formationLevel_m: number;
  /** Kind of the ground at formation; null: formation below the profile. */
  floorKind: GroundLayer['kind'] | null;
  plug: PlugUnderFloor | null;
  granular: GranularFloor | null;
}

interface AquiferLevels {
  base_m: number;
  top_m?: number;
  staticLevel_m: number;
}

/** Index of the layer the formation sits in (top ≥ z > bottom); formation on a boundary sits in the layer below. */
function layerAt(layers: GroundLayer[], level_m: number): number {
  if (layers.length > 0 && level_m > layers[0]!.top_m) return 0;
  return layers.findIndex((l) => l.top_m >= level_m && l.bottom_m < level_m);
}

/** Thickness of layer `l` between `from` (above) and `to` (below), m. */
const clipped = (l: GroundLayer, from: number, to: number) => Math.max(0, Math.min(l.top_m, from) - Math.max(l.bottom_m, to));

/** The ground under a formation level in a profile, for the aquifer the wells pump. */
export function analyseFloorGround(profile: GroundProfile, aquifer: AquiferLevels, formationLevel_m: number): FloorGround {
  return floorGroundAnalyser(profile, aquifer)(formationLevel_m);
}

/**
 * The analysis of one profile for many formation levels (the safe-dig scan): the pumped layer is
 * found once, and each call only walks the layers under the given level.
 */
export function floorGroundAnalyser(profile: GroundProfile, aquifer: AquiferLevels): (formationLevel_m: number) => FloorGround {
  const layers = profile.layers;
  const pumped = findPumpedLayer(profile, aquifer);
  return (formationLevel_m) => {
    const f = layerAt(layers, formationLevel_m);
    const out: FloorGround = { formationLevel_m, floorKind: f < 0 ? null : layers[f]!.kind, plug: null, granular: null };
    if (f < 0) return out;
    if (pumped !== null && pumped > f) out.plug = plugUnder(layers, f, pumped, formationLevel_m);
    if (layers[f]!.kind === 'granular') out.granular = granularFrom(layers, f, formationLevel_m);
    return out;
  };
}

/** The lowest plug between the formation's layer `f` and the pumped layer, and the weight over its base; null: none. */
function plugUnder(layers: GroundLayer[], f: number, pumped: number, formationLevel_m: number): PlugUnderFloor | null {
  let lowestPlug = -1;
  for (let i = f; i < pumped; i++) if (layers[i]!.kind === 'plug') lowestPlug = i;
  if (lowestPlug < 0) return null;
  const base_m = layers[lowestPlug]!.bottom_m;
  let weight = 0;
  for (let i = f; i <= lowestPlug; i++) weight += layers[i]!.unitWeightSat_kN_m3 * clipped(layers[i]!, formationLevel_m, base_m);
  return { base_m, weight_kPa: weight, thickness_m: formationLevel_m - base_m };
}

/** The granular ground from formation down to the first plug; null: none. */
function granularFrom(layers: GroundLayer[], f: number, formationLevel_m: number): GranularFloor | null {
  let thickness = 0;
  let weight = 0;
  for (let i = f; i < layers.length && layers[i]!.kind === 'granular'; i++) {
    const t = clipped(layers[i]!, formationLevel_m, -Infinity);
    thickness += t;
    weight += layers[i]!.unitWeightSat_kN_m3 * t;
  }
  if (!(thickness > 0)) return null;
  const gammaSat = weight / thickness;
  return { thickness_m: thickness, criticalGradient: (gammaSat - WATER_UNIT_WEIGHT_kN_m3) / WATER_UNIT_WEIGHT_kN_m3 };
}
