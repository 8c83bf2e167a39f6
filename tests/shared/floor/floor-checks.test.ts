/**
 * Pit-floor checks against hand calculations.
 * Uplift: the textbook form FS = Σγᵢtᵢ / (γw·h_p) (base uplift of an excavation; the book
 * references for this form are from memory: Craig's Soil Mechanics; Powers et al., Construction
 * Dewatering and Groundwater Control), with the partial factors of EN 1997-1:2004 Table A.15 (UPL)
 * — recommended values, national annexes differ. Critical gradient i_c = γ′/γw (Terzaghi 1943).
 * The expected figures are hand calculations of these formulas, written beside each check.
 */
import { describe, expect, it } from 'vitest';
import {
  allowableUpliftLevel,
  analyseFloorGround,
  excavationFloor,
  FLOOR_CHECK_DEFAULTS,
  floorTarget,
  heaveFactorOfSafety,
  requiredUpliftFactor,
  upliftFactorOfSafety,
} from '../../../shared/floor';
import { findScenarioWarnings, validateScenario, type GroundProfile, type Scenario } from '../../../shared/schema';
import { expectClose } from '../design/design-test-helpers';
import clayPlugDemo from '../../../fixtures/demo-clay-plug-confined.json';
import deepwellDemo from '../../../fixtures/demo-deepwells-confined.json';

const aquifer = { base_m: -10, top_m: 4, staticLevel_m: 12 };
const clayOverSand: GroundProfile = {
  layers: [
    { id: 'fill', top_m: 15, bottom_m: 13, kind: 'granular', unitWeightSat_kN_m3: 19, unitWeight_kN_m3: 17 },
    { id: 'clay', top_m: 13, bottom_m: 4, kind: 'plug', unitWeightSat_kN_m3: 20 },
    { id: 'sand', top_m: 4, bottom_m: -10, kind: 'granular', unitWeightSat_kN_m3: 20.5 },
  ],
};

describe('uplift of a clay plug (EN 1997-1 UPL, eq. 2.8)', () => {
  it('gives FS = Σγt / (γw·h_p) for the plug left under formation', () => {
    // Formation 7 m: 3 m of clay (γsat 20) over the sand top at 4 m; head 12 m → h_p = 8 m.
    // Hand: FS = 20·3 / (9.81·8) = 60 / 78.48 = 0.7645.
    const ground = analyseFloorGround(clayOverSand, aquifer, 7);
    expect(ground.plug).not.toBeNull();
    expectClose(ground.plug!.weight_kPa, 60, { abs: 1e-12 });
    expectClose(upliftFactorOfSafety(ground.plug!, 12)!, 60 / (9.81 * 8), { rel: 1e-12 });
    // No pressure above the base: no uplift, no factor.
    expect(upliftFactorOfSafety(ground.plug!, 3)).toBeNull();
  });

  it('requires γG;dst / γG;stb = 1.0 / 0.9 = 1.111 with the recommended values of EN 1997-1 Table A.15', () => {
    expect(FLOOR_CHECK_DEFAULTS.destabilisingFactor).toBe(1.0);
    expect(FLOOR_CHECK_DEFAULTS.stabilisingFactor).toBe(0.9);
    expectClose(requiredUpliftFactor(FLOOR_CHECK_DEFAULTS), 1.1111111111, { abs: 1e-9 });
  });

  it('gives the allowable piezometric level that just meets the required factor', () => {
    // h_allow = z_b + W / (γw·FS_req) = 4 + 60 / (9.81 · 1.1111) = 4 + 5.5046 = 9.5046 m (hand).
    const ground = analyseFloorGround(clayOverSand, aquifer, 7);
    const level = allowableUpliftLevel(ground.plug!, FLOOR_CHECK_DEFAULTS);
    expectClose(level, 4 + 60 / (9.81 * (1 / 0.9)), { rel: 1e-12 });
    expectClose(upliftFactorOfSafety(ground.plug!, level)!, 1 / 0.9, { rel: 1e-12 });
  });

  it('counts every layer between formation and the plug base, with its saturated weight', () => {
    // Formation 14 m in the fill: 1 m fill (19) + 9 m clay (20) = 199 kPa over the base at 4 m.
    const ground = analyseFloorGround(clayOverSand, aquifer, 14);
    expectClose(ground.plug!.weight_kPa, 19 + 180, { abs: 1e-12 });
    expect(ground.floorKind).toBe('granular');
  });
});

describe('heave of a granular floor (EN 1997-1 HYD, eq. 2.9, gradient form)', () => {
  it('compares the mean upward gradient with i_c = γ′/γw', () => {
    // Formation 2 m in the sand: 12 m of sand (γsat 20.5) below; i_c = (20.5 − 9.81)/9.81 = 1.08970.
    // Head 5 m: i = 3 / 12 = 0.25 → FS = 4.3588 (hand).
    const ground = analyseFloorGround(clayOverSand, aquifer, 2);
    expect(ground.plug).toBeNull();
    expectClose(ground.granular!.criticalGradient, (20.5 - 9.81) / 9.81, { rel: 1e-12 });
    expectClose(heaveFactorOfSafety(ground.granular!, 2, 5)!, (20.5 - 9.81) / 9.81 / 0.25, { rel: 1e-12 });
    expect(heaveFactorOfSafety(ground.granular!, 2, 1.5)).toBeNull();
  });
});

describe('the target follows the governing check', () => {
  it('over a clay plug the uplift level governs and may stand above formation', () => {
    const ground = analyseFloorGround(clayOverSand, aquifer, 7);
    const target = floorTarget(ground, 7, 0.5, FLOOR_CHECK_DEFAULTS);
    expect(target.governing).toBe('uplift');
    expect(target.targetLevel_m).toBeGreaterThan(7);
    expect(target.dryLevel_m).toBeNull();
  });

  it('keeps the margin below the allowable uplift level as reserve, and never a negative one', () => {
    const ground = analyseFloorGround(clayOverSand, aquifer, 7);
    const bare = floorTarget(ground, 7, 0, FLOOR_CHECK_DEFAULTS);
    const kept = floorTarget(ground, 7, 0.5, FLOOR_CHECK_DEFAULTS);
    const negative = floorTarget(ground, 7, -0.5, FLOOR_CHECK_DEFAULTS);
    expect(bare.targetLevel_m).toBe(bare.upliftLevel_m);
    expectClose(kept.targetLevel_m, kept.upliftLevel_m! - 0.5, { abs: 1e-12 });
    expect(kept.safeLevel_m).toBe(kept.upliftLevel_m);
    // A negative margin would lower FS below the required value: the target stays at the allowable level.
    expect(negative.targetLevel_m).toBe(negative.upliftLevel_m);
  });

  it('in a granular floor open to the aquifer the dry target governs (formation − margin)', () => {
    const ground = analyseFloorGround(clayOverSand, aquifer, 2);
    const target = floorTarget(ground, 2, 0.5, FLOOR_CHECK_DEFAULTS);
    expect(target.governing).toBe('dry');
    expect(target.targetLevel_m).toBe(1.5);
    expect(target.heaveLevel_m).toBeGreaterThan(2);
  });

  it('without a ground profile the dry target stands as before', () => {
    const target = floorTarget(null, 7, 0.5, FLOOR_CHECK_DEFAULTS);
    expect(target).toMatchObject({ governing: 'dry', targetLevel_m: 6.5, allowableLevel_m: null });
  });

  it('the clay-plug demo governs by uplift; the deep-well demo (no profile) stays dry', () => {
    const plug = clayPlugDemo as unknown as Scenario;
    const floor = excavationFloor(plug, plug.excavations[0]!, FLOOR_CHECK_DEFAULTS);
    expect(floor.target.governing).toBe('uplift');
    // 2 m of clay (γsat 19.5) left over the sand top at 5 m: h_allow = 5 + 39 / (9.81 / 0.9) = 8.578 m (hand).
    expectClose(floor.target.allowableLevel_m!, 5 + 39 / (9.81 / 0.9), { rel: 1e-12 });
    expectClose(floor.target.safeLevel_m, 5 + 39 / (9.81 / 0.9), { rel: 1e-12 });
    // The pit's 0.5 m margin is kept below the allowable level as reserve: target 8.078 m.
    expectClose(floor.target.targetLevel_m, 5 + 39 / (9.81 / 0.9) - plug.excavations[0]!.margin_m, { rel: 1e-12 });
    const deep = deepwellDemo as unknown as Scenario;
    expect(excavationFloor(deep, deep.excavations[0]!, FLOOR_CHECK_DEFAULTS).target.governing).toBe('dry');
  });
});

describe('ground profile validation names the field', () => {
  const base = clayPlugDemo as unknown as Scenario;
  const withGround = (ground: unknown) => ({ ...base, ground });
  it('accepts the demo profile', () => expect(validateScenario(base).ok).toBe(true));
  it.each([
    ['gap between layers', { layers: [clayOverSand.layers[0], { ...clayOverSand.layers[1], top_m: 12.5 }, clayOverSand.layers[2]] }, '/ground/layers/1/top_m'],
    ['bottom above top', { layers: [{ ...clayOverSand.layers[0], bottom_m: 16 }] }, '/ground/layers/0/bottom_m'],
    ['unit weight out of range', { layers: [{ ...clayOverSand.layers[0], unitWeightSat_kN_m3: 45 }] }, '/ground/layers/0/unitWeightSat_kN_m3'],
    ['no pumped aquifer among the layers', { layers: [{ ...clayOverSand.layers[1], top_m: 15, bottom_m: -15 }] }, '/ground/layers'],
    ['unknown kind', { layers: [{ ...clayOverSand.layers[0], kind: 'rock' }] }, '/ground/layers/0/kind'],
    ['a level beyond ±20 km of datum', { layers: [{ ...clayOverSand.layers[0], bottom_m: -1e308 }] }, '/ground/layers/0/bottom_m'],
  ])('refuses %s', (_name, ground, path) => {
    const result = validateScenario(withGround(ground));
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.issues.map((i) => i.path)).toContain(path);
  });
  it('refuses a negative margin over a granular floor and accepts it over a plug', () => {
    const granular = { ...base, ground: undefined, excavations: [{ ...base.excavations[0]!, margin_m: -0.5 }] };
    const refused = validateScenario(granular);
    expect(refused.ok).toBe(false);
    if (!refused.ok) expect(refused.issues[0]!.path).toBe('/excavations/0/margin_m');
    expect(validateScenario({ ...base, excavations: [{ ...base.excavations[0]!, margin_m: -0.5 }] }).ok).toBe(true);
    const warnings = findScenarioWarnings({ ...base, excavations: [{ ...base.excavations[0]!, margin_m: -0.5 }] });
    expect(warnings.map((w) => [w.code, w.path])).toContainEqual(['negative-margin-not-applied', '/excavations/0/margin_m']);
  });
});
