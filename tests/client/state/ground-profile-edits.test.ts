import { describe, expect, it } from 'vitest';
import {
  designInputsKey, getOwnedProfile, moveLayerEdge, profileFromAquifer, removeLayer, setOwnedProfile, splitLayer, uniqueLayerId,
} from '../../../client/state';
import clayPlug from '../../../fixtures/demo-clay-plug-confined.json';
import wellpoints from '../../../fixtures/demo-wellpoints-unconfined.json';
import { groundProfileIssues, validateScenario, type GroundProfile, type Scenario } from '../../../shared/schema';
import { groundProfileIssueText } from '../../../shared/floor';

const mill = clayPlug as unknown as Scenario;
const profile = mill.ground!;
const levels = (p: GroundProfile | null) => p?.layers.map((l) => [l.id, l.top_m, l.bottom_m]);
const issuesOf = (p: GroundProfile, s: Scenario = mill) => groundProfileIssues(p, '', s.aquifer, s.groundLevel_m);

describe('ground-profile edits keep the layers contiguous from the top down', () => {
  it('moveLayerEdge() moves the shared boundary of both layers', () => {
    expect(levels(moveLayerEdge(profile, 1, 'bottom_m', 4))).toEqual([['made-ground', 15, 12.5], ['clay', 12.5, 4], ['sand', 4, -15]]);
    expect(levels(moveLayerEdge(profile, 1, 'top_m', 12))).toEqual([['made-ground', 15, 12], ['clay', 12, 5], ['sand', 5, -15]]);
    // The ground surface and the profile base have no neighbour to move.
    expect(levels(moveLayerEdge(profile, 0, 'top_m', 14.8))![0]).toEqual(['made-ground', 14.8, 12.5]);
    expect(issuesOf(moveLayerEdge(profile, 1, 'bottom_m', 4))).toEqual([]);
  });

  it('moveLayerEdge() leaves crossing levels for validation to report, not silently fixed', () => {
    const crossed = moveLayerEdge(profile, 1, 'bottom_m', 13);
    expect(issuesOf(crossed).map((i) => i.path)).toEqual(['/layers/1/bottom_m']);
    expect(profile.layers[1]!.bottom_m).toBe(5); // the input is not changed
  });

  it('splitLayer() halves a layer at mid-depth into a new uniquely named layer of the same ground', () => {
    const split = splitLayer(profile, 2);
    expect(levels(split)).toEqual([['made-ground', 15, 12.5], ['clay', 12.5, 5], ['sand', 5, -5], ['sand-2', -5, -15]]);
    expect(split.layers[3]!.kind).toBe('granular');
    expect(split.layers[3]!.description).toBeUndefined();
    expect(uniqueLayerId(split, 'sand')).toBe('sand-3');
    expect(issuesOf(split)).toEqual([]);
  });

  it('removeLayer() gives the removed depth to the layer above (the top layer’s to the one below), null for the last', () => {
    expect(levels(removeLayer(profile, 1))).toEqual([['made-ground', 15, 5], ['sand', 5, -15]]);
    expect(levels(removeLayer(profile, 0))).toEqual([['clay', 15, 5], ['sand', 5, -15]]);
    expect(removeLayer({ layers: [profile.layers[2]!] }, 0)).toBeNull();
  });

  it('profileFromAquifer() starts a confined site with a cover plug over the aquifer, an unconfined one with one granular layer', () => {
    const confined = profileFromAquifer(mill);
    expect(levels(confined)).toEqual([['cover', 15, 5], ['aquifer', 5, -15]]);
    expect(confined.layers.map((l) => l.kind)).toEqual(['plug', 'granular']);
    expect(issuesOf(confined)).toEqual([]);
    const wp = wellpoints as unknown as Scenario;
    const open = profileFromAquifer(wp);
    expect(levels(open)).toEqual([['aquifer', wp.groundLevel_m, wp.aquifer.base_m]]);
    expect(issuesOf(open, wp)).toEqual([]);
  });

  it('setOwnedProfile() writes the site profile or an excavation’s own, and null removes it', () => {
    const draft = structuredClone(mill);
    setOwnedProfile(draft, { kind: 'excavation', id: 'basement' }, splitLayer(profile, 1));
    expect(getOwnedProfile(draft, { kind: 'excavation', id: 'basement' }).pointer).toBe('/excavations/0/ground');
    expect(draft.excavations[0]!.ground!.layers).toHaveLength(4);
    expect(validateScenario(draft).ok).toBe(true);
    setOwnedProfile(draft, { kind: 'excavation', id: 'basement' }, null);
    setOwnedProfile(draft, { kind: 'site' }, null);
    expect(draft.excavations[0]!.ground).toBeUndefined();
    expect(draft.ground).toBeUndefined();
  });
});

describe('groundProfileIssueText() words an issue with the layer and the field, levels in display units', () => {
  const ft = (v: number) => `${(v / 0.3048).toFixed(2)} ft`;
  const ctx = { formatLevel: ft, groundLevel_m: mill.groundLevel_m, aquifer: mill.aquifer };
  it.each([
    ['/layers/1/bottom_m', moveLayerEdge(profile, 1, 'bottom_m', 13), /^Layer 2 “clay”, bottom level: 42\.65 ft must lie below the layer's top level \(41\.01 ft\)\.$/],
    ['/layers/2/top_m', { layers: profile.layers.map((l, i) => (i === 2 ? { ...l, top_m: 4 } : l)) }, /^Layer 3 “sand”, top level: 13\.12 ft must equal the bottom level of layer 2 “clay” \(16\.40 ft\)/],
    ['/layers/1/unitWeight_kN_m3', { layers: profile.layers.map((l, i) => (i === 1 ? { ...l, unitWeight_kN_m3: 21 } : l)) }, /^Layer 2 “clay”, moist unit weight γ: 21 kN\/m³ must not exceed/],
    ['/layers', { layers: profile.layers.map((l) => ({ ...l, kind: 'plug' as const })) }, /^Layers: no granular layer overlaps the aquifer the wells pump \(-49\.21 ft to 16\.40 ft\)/],
  ])('%s', (path, p, expected) => {
    const issue = issuesOf(p).find((i) => i.path === path);
    expect(issue).toBeDefined();
    expect(groundProfileIssueText(issue!.path, issue!.message, { ...ctx, layers: p.layers })).toMatch(expected);
  });
});

describe('designInputsKey() tells whether a design still describes the scenario', () => {
  it('ignores well rates and view settings, not the ground', () => {
    const rates = structuredClone(mill);
    rates.wells[0]!.rate_m3_s = 0.001;
    expect(designInputsKey(rates)).toBe(designInputsKey(mill));
    const heavier = structuredClone(mill);
    heavier.ground!.layers[1]!.unitWeightSat_kN_m3 = 20.5;
    expect(designInputsKey(heavier)).not.toBe(designInputsKey(mill));
  });
});
