/**
 * The ground profile the designer confirmed from the boreholes, into the scenario: the site's
 * `ground.layers`, its ground level, and the aquifer levels — the static level from the water
 * strikes, the aquifer top at the top of the pumped granular layer (confined and leaky
 * aquifers), and, only when asked, the aquifer base at the bottom of the log (the hole may have
 * ended in the aquifer, so its true base can lie deeper).
 */
import { findPumpedLayer, type GroundLayer, type Scenario, type SiteImportRecord } from '../../shared/schema';
import type { GroundLayerSuggestion } from '../../shared/import';

export interface ApplyGroundOptions {
  layers: readonly GroundLayerSuggestion[];
  groundLevel_m: number;
  /** From the strikes; null leaves the static level as it is. */
  staticLevel_m: number | null;
  /** Also move the aquifer base to the bottom of the log. */
  baseAtLogEnd: boolean;
}

/** Levels rounded to the millimetre: interpolated levels carry float noise the log never had. */
const mm = (v: number) => Math.round(v * 1000) / 1000;

/** The confirmed layers as schema layers (id, levels, kind, weights, description). */
export function toGroundLayers(layers: readonly GroundLayerSuggestion[]): GroundLayer[] {
  return layers.map((l) => ({
    id: l.id,
    top_m: mm(l.top_m),
    bottom_m: mm(l.bottom_m),
    kind: l.kind,
    unitWeightSat_kN_m3: l.unitWeightSat_kN_m3,
    ...(l.unitWeight_kN_m3 !== l.unitWeightSat_kN_m3 ? { unitWeight_kN_m3: Math.min(l.unitWeight_kN_m3, l.unitWeightSat_kN_m3) } : {}),
    ...(l.description ? { description: l.description.slice(0, 500) } : {}),
  }));
}

/** Applies the profile to a draft; returns what changed, in words. */
export function applyGroundProfile(draft: Scenario, options: ApplyGroundOptions): string[] {
  const layers = toGroundLayers(options.layers);
  const changes: string[] = [`ground profile: ${layers.length} layers`];
  draft.ground = { layers };
  draft.groundLevel_m = mm(options.groundLevel_m);
  changes.push(`ground level ${draft.groundLevel_m} m`);
  const a = draft.aquifer;
  if (options.staticLevel_m !== null) {
    a.staticLevel_m = mm(options.staticLevel_m);
    changes.push(`static level ${a.staticLevel_m} m`);
  }
  // The pumped layer: the lowest granular layer under a plug, else the lowest granular layer.
  const granular = layers.map((l, i) => ({ l, i })).filter(({ l }) => l.kind === 'granular');
  const pumped = granular[granular.length - 1];
  if (pumped) {
    if (a.kind !== 'unconfined' && layers.slice(0, pumped.i).some((l) => l.kind === 'plug')) {
      a.top_m = pumped.l.top_m;
      changes.push(`aquifer top ${a.top_m} m (top of ${pumped.l.id})`);
    }
    if (options.baseAtLogEnd) {
      a.base_m = pumped.l.bottom_m;
      changes.push(`aquifer base ${a.base_m} m (end of the log)`);
    }
  }
  if (findPumpedLayer({ layers }, a) === null) changes.push('no granular layer overlaps the aquifer: check the aquifer levels');
  return changes;
}

/** Records the file a scenario's data came from (one record per kind and hash, newest last). */
export function recordImport(draft: Scenario, record: SiteImportRecord): void {
  const d = draft as Scenario & { imports?: SiteImportRecord[] };
  const kept = (d.imports ?? []).filter((r) => !(r.kind === record.kind && r.sha256 === record.sha256));
  d.imports = [...kept, record].slice(-100);
}
