/**
 * Edits of a ground profile (design.md §8) that keep its layers contiguous from the top down:
 * where the profile lives (site or one excavation), a first profile from the aquifer levels,
 * moving a layer boundary, splitting a layer, removing one. Pure: profiles in, new profiles out.
 */
import type { GroundLayer, GroundProfile, Scenario } from '../../shared/schema';

/** Whose profile is edited: the site's, or one excavation's own (by id). */
export type ProfileOwner = { kind: 'site' } | { kind: 'excavation'; id: string };

/** Levels closer than this are one boundary, m. */
const SAME_LEVEL_M = 1e-6;

/** Common-practice starting unit weights, kN/m³ (firm clay / medium dense sand); the user checks them. */
const START_WEIGHTS = {
  plug: { unitWeightSat_kN_m3: 19.5, unitWeight_kN_m3: 18.5 },
  granular: { unitWeightSat_kN_m3: 20, unitWeight_kN_m3: 18 },
} as const;

/** The profile an owner holds (null: none of its own), and the JSON pointer of it. */
export function getOwnedProfile(s: Scenario, owner: ProfileOwner): { profile: GroundProfile | null; pointer: string } {
  if (owner.kind === 'site') return { profile: s.ground ?? null, pointer: '/ground' };
  const i = s.excavations.findIndex((e) => e.id === owner.id);
  return { profile: i >= 0 ? s.excavations[i]!.ground ?? null : null, pointer: `/excavations/${i}/ground` };
}

/** Sets (or with null removes) an owner's profile on a draft scenario. */
export function setOwnedProfile(draft: Scenario, owner: ProfileOwner, profile: GroundProfile | null): void {
  if (owner.kind === 'site') {
    if (profile) draft.ground = profile;
    else delete draft.ground;
    return;
  }
  const e = draft.excavations.find((x) => x.id === owner.id);
  if (!e) return;
  if (profile) e.ground = profile;
  else delete e.ground;
}

/**
 * A first profile from the scenario's levels: for a confined or leaky aquifer, the cover from
 * ground level to the aquifer top as a plug over the aquifer as a granular layer; for an
 * unconfined one, one granular layer from ground level to the base.
 */
export function profileFromAquifer(s: Scenario): GroundProfile {
  const a = s.aquifer;
  const g = s.groundLevel_m;
  const aquifer: GroundLayer = { id: 'aquifer', top_m: g, bottom_m: a.base_m, kind: 'granular', ...START_WEIGHTS.granular, conductivity_m_s: a.conductivity_m_s };
  if (a.kind !== 'unconfined' && a.top_m !== undefined && a.top_m < g - SAME_LEVEL_M && a.top_m > a.base_m) {
    return { layers: [{ id: 'cover', top_m: g, bottom_m: a.top_m, kind: 'plug', ...START_WEIGHTS.plug }, { ...aquifer, top_m: a.top_m }] };
  }
  return { layers: [aquifer] };
}

/** A layer id not yet used in the profile, from `base` ("sand", "sand-2", …). */
export function uniqueLayerId(profile: GroundProfile, base: string): string {
  const taken = new Set(profile.layers.map((l) => l.id));
  const stem = base.replace(/-\d+$/, '') || 'layer';
  for (let n = 2; ; n++) if (!taken.has(`${stem}-${n}`)) return `${stem}-${n}`;
}

/**
 * Moves one edge of layer `index`; the neighbour sharing that boundary moves with it, so the
 * layers stay touching. Crossing levels are left for validation to report, not silently fixed.
 */
export function moveLayerEdge(profile: GroundProfile, index: number, edge: 'top_m' | 'bottom_m', level_m: number): GroundProfile {
  const layers = profile.layers.map((l) => ({ ...l }));
  const layer = layers[index];
  if (!layer) return profile;
  const neighbour = edge === 'bottom_m' ? layers[index + 1] : layers[index - 1];
  const shared = edge === 'bottom_m' ? 'top_m' : 'bottom_m';
  if (neighbour && Math.abs(neighbour[shared] - layer[edge]) <= SAME_LEVEL_M) neighbour[shared] = level_m;
  layer[edge] = level_m;
  return { layers };
}

/** Splits layer `index` at mid-depth: the lower half becomes a new layer of the same ground. */
export function splitLayer(profile: GroundProfile, index: number): GroundProfile {
  const layer = profile.layers[index];
  if (!layer) return profile;
  const mid_m = Math.round(((layer.top_m + layer.bottom_m) / 2) * 1000) / 1000;
  const lower: GroundLayer = { ...layer, id: uniqueLayerId(profile, layer.id), top_m: mid_m };
  delete lower.description; // the log's words describe the layer as it was logged, not its lower half
  const layers = profile.layers.map((l) => ({ ...l }));
  layers[index]!.bottom_m = mid_m;
  layers.splice(index + 1, 0, lower);
  return { layers };
}

/**
 * Removes layer `index`; the layer above grows down to its bottom (the top layer's neighbour
 * below grows up to its top), so the profile keeps its extent. Null when no layer is left.
 */
export function removeLayer(profile: GroundProfile, index: number): GroundProfile | null {
  const removed = profile.layers[index];
  if (!removed) return profile;
  const layers = profile.layers.map((l) => ({ ...l }));
  layers.splice(index, 1);
  if (layers.length === 0) return null;
  const above = layers[index - 1];
  const below = layers[index];
  if (above) above.bottom_m = removed.bottom_m;
  else if (below) below.top_m = removed.top_m;
  return { layers };
}
