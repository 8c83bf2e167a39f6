/**
 * A ground profile (design.md §8 `ground.layers`) from one borehole, or interpolated between
 * several at a point: layer boundaries by inverse-distance weighting (power 2) of the matching
 * strata's levels, strata matched in order by their geology code (or, without codes, by the soil
 * the description names). The static level comes from the water strikes (the level the water
 * rose to where logged, else the strike). Each layer's kind and weights are suggestions the
 * designer confirms.
 */
import { DrydigError } from '../schema';
import type { Borehole } from './ags-boreholes';
import { classifyStratum } from './classify-stratum';

export interface GroundLayerSuggestion {
  id: string;
  top_m: number;
  bottom_m: number;
  kind: 'plug' | 'granular';
  unitWeightSat_kN_m3: number;
  unitWeight_kN_m3: number;
  description: string;
  /** Why the kind and weights were suggested. */
  basis: string;
}

export interface GroundFromBoreholes {
  layers: GroundLayerSuggestion[];
  groundLevel_m: number;
  /** Groundwater level from the strikes, m (null when none is logged). */
  staticLevel_m: number | null;
  notes: string[];
}

export interface BuildGroundOptions {
  boreholes: readonly Borehole[];
  /** Holes to use (one: that hole's log; several: interpolated at `at`). */
  ids: readonly string[];
  /** Plan point to interpolate at, [x, y] m (several holes). */
  at?: readonly [number, number];
}

const keyOf = (code: string, description: string) => (code !== '' ? code.toUpperCase() : classifyStratum(description).soil);

/** Inverse-distance weights (power 2) of the holes at a point; a hole at the point takes it all. */
function weightsAt(holes: readonly Borehole[], at: readonly [number, number]): number[] {
  const d2 = holes.map((h) => (h.x - at[0]) ** 2 + (h.y - at[1]) ** 2);
  const exact = d2.findIndex((d) => d < 1e-6);
  if (exact >= 0) return holes.map((_, i) => (i === exact ? 1 : 0));
  const w = d2.map((d) => 1 / d);
  const sum = w.reduce((a, b) => a + b, 0);
  return w.map((v) => v / sum);
}

const levelOfWater = (h: Borehole): number | null => {
  const levels = h.waterStrikes.map((s) => s.restLevel_m ?? s.level_m);
  return levels.length > 0 ? Math.max(...levels) : null;
};

/** Builds the suggested profile; throws DrydigError naming the holes when they cannot be matched. */
export function buildGroundFromBoreholes({ boreholes, ids, at }: BuildGroundOptions): GroundFromBoreholes {
  const holes = ids.map((id) => {
    const h = boreholes.find((b) => b.id === id);
    if (!h) throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', `borehole "${id}" is not in the file`);
    if (h.strata.length === 0) throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', `borehole "${id}" has no logged strata (GEOL)`);
    return h;
  });
  if (holes.length === 0) throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', 'choose at least one borehole');
  const notes: string[] = [];
  const sequence = (h: Borehole) => h.strata.map((s) => keyOf(s.code, s.description));
  const first = sequence(holes[0]!);
  for (const h of holes.slice(1)) {
    const seq = sequence(h);
    if (seq.length !== first.length || seq.some((k, i) => k !== first[i]))
      throw new DrydigError(
        'DRYDIG_ERR_INVALID_REQUEST',
        `boreholes ${holes[0]!.id} and ${h.id} log different strata (${first.join(' / ')} against ${seq.join(' / ')}): interpolate only between holes with the same sequence, or take one hole`,
      );
  }
  const point = at ?? [holes[0]!.x, holes[0]!.y];
  const w = holes.length === 1 ? [1] : weightsAt(holes, point);
  const blend = (f: (h: Borehole) => number) => holes.reduce((sum, h, i) => sum + w[i]! * f(h), 0);
  const groundLevel_m = blend((h) => h.groundLevel_m);
  const layers: GroundLayerSuggestion[] = holes[0]!.strata.map((s, k) => {
    const guess = classifyStratum(s.description);
    return {
      id: `${first[k]!.toLowerCase().replace(/[^a-z0-9]+/g, '-').slice(0, 40) || 'layer'}-${k + 1}`,
      top_m: blend((h) => h.strata[k]!.topLevel_m),
      bottom_m: blend((h) => h.strata[k]!.baseLevel_m),
      kind: guess.kind,
      unitWeightSat_kN_m3: guess.unitWeightSat_kN_m3,
      unitWeight_kN_m3: guess.unitWeight_kN_m3,
      description: s.description,
      basis: guess.basis,
    };
  });
  const waters = holes.map(levelOfWater);
  const known = waters.map((v, i) => ({ v, w: w[i]! })).filter((x): x is { v: number; w: number } => x.v !== null);
  const wsum = known.reduce((a, b) => a + b.w, 0);
  const staticLevel_m = known.length > 0 && wsum > 0 ? known.reduce((a, b) => a + b.v * b.w, 0) / wsum : null;
  if (staticLevel_m === null) notes.push('No water strike is logged in the chosen holes: give the static level from monitoring.');
  else notes.push('Static level from water strikes: a strike rises while the hole stands; confirm with standpipe or piezometer readings over time.');
  if (holes.length > 1) notes.push(`Interpolated between ${holes.map((h) => h.id).join(', ')} by inverse-distance weighting at (${point[0].toFixed(1)}, ${point[1].toFixed(1)}).`);
  notes.push('Kinds and unit weights are suggestions from the descriptions; confirm each layer.');
  return { layers, groundLevel_m, staticLevel_m, notes };
}
