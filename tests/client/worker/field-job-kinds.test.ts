/**
 * How the map's shortfall says what is wrong (issue 13 items 6 and 7, issue 8 item 6): at the time
 * shown, against the governing floor target (the one the design uses), with floor unsafe told apart
 * from water above target and a dewatered pit never a pass; one colour scale across times; a tiny
 * contour interval widened rather than blanking the map.
 */
import { describe, expect, it } from 'vitest';
import { getExcavationShortfall, runFieldJob } from '../../../client/worker/field-job';
import { splitByNearbyWells, screenOfKind } from '../../../client/layout';
import type { Scenario } from '../../../shared/schema';
import wellpointsDemo from '../../../fixtures/demo-wellpoints-unconfined.json';
import clayPlugDemo from '../../../fixtures/demo-clay-plug-confined.json';

const wellpoints = wellpointsDemo as unknown as Scenario;
const clayPlug = clayPlugDemo as unknown as Scenario;

describe('getExcavationShortfall(scenario, excavation, nodes, time_s) states how a pit stands', () => {
  it('uses the uplift level less the margin as the clay plug\'s target: 5 m + 2 m × 19.5 kN/m³ × 0.9 / 9.81 kN/m³ − 0.5 m', () => {
    // EN 1997-1 UPL with the recommended γG,dst = 1.0, γG,stb = 0.9 (national annexes differ);
    // γw = 9.81 kN/m³ (common practice). Plug: clay from formation 7 m down to its base 5 m.
    const r = getExcavationShortfall(clayPlug, clayPlug.excavations[0]!, 21);
    expect(r.governing).toBe('uplift');
    // The pit's margin (0.5 m) is kept below the allowable level as reserve, as in the design.
    expect(r.targetLevel_m).toBeCloseTo(5 + (2 * 19.5 * 0.9) / 9.81 - clayPlug.excavations[0]!.margin_m, 9);
    expect(r.floorFS?.required).toBeCloseTo(1 / 0.9, 12);
    // FS = σ / (γw (h − base)) at the highest head inside (definition of the check).
    expect(r.floorFS!.fs!).toBeCloseTo((2 * 19.5) / (9.81 * (r.worst.level_m - 5)), 9);
  });

  it('is "floor-unsafe" on the clay plug ten minutes in and "met" at the design time, never "above-target"', () => {
    const early = getExcavationShortfall(clayPlug, clayPlug.excavations[0]!, 21, 604.8);
    expect(early.kind).toBe('floor-unsafe');
    expect(early.met).toBe(false);
    expect(early.time_s).toBe(604.8);
    expect(early.floorFS!.fs!).toBeLessThan(early.floorFS!.required);
    const design = getExcavationShortfall(clayPlug, clayPlug.excavations[0]!, 21);
    expect(design.kind).toBe('met');
    expect(design.floorFS!.fs!).toBeGreaterThanOrEqual(design.floorFS!.required);
  });

  it('is "above-target" for the dry floor of the well-point pit two hours in, "met" at the design time', () => {
    const ex = wellpoints.excavations[0]!;
    expect(getExcavationShortfall(wellpoints, ex, 21, 7200)).toMatchObject({ kind: 'above-target', met: false, governing: 'dry', floorFS: null });
    expect(getExcavationShortfall(wellpoints, ex, 21)).toMatchObject({ kind: 'met', met: true });
  });

  it('is "dewatered", not a pass, when the pit is drawn down to the aquifer base', () => {
    const over = structuredClone(wellpoints);
    for (const w of over.wells) if (w.rate_m3_s) w.rate_m3_s *= 3;
    const r = getExcavationShortfall(over, over.excavations[0]!, 21);
    expect(r.worst.level_m).toBe(over.aquifer.base_m);
    expect(r.worstShortfall_m).toBeLessThan(0);
    expect(r).toMatchObject({ kind: 'dewatered', met: false });
  });
});

describe('runFieldJob(request) keeps the map readable', () => {
  const grid = { origin: [-60, -60] as [number, number], spacing_m: [4, 4] as [number, number], counts: [41, 36] as [number, number] };

  it('colours every time by the design time\'s drawdown range when scaleTime_s is given', async () => {
    const design = await runFieldJob({ kind: 'field', id: 1, scenario: wellpoints, grid, time_s: 1209600, quantity: 'drawdown', scaleTime_s: 1209600 });
    const early = await runFieldJob({ kind: 'field', id: 2, scenario: wellpoints, grid, time_s: 7200, quantity: 'drawdown', scaleTime_s: 1209600 });
    expect(design.colourMax_m).toBe(design.drawdownRange.max);
    expect(early.drawdownRange.max).toBeLessThan(design.drawdownRange.max);
    expect(early.colourMax_m).toBeCloseTo(design.drawdownRange.max, 12);
    expect(early.shortfall[0]!.time_s).toBe(7200);
  });

  it('widens an interval that would need more than 60 contours to a whole multiple of it, and says how many it needed', async () => {
    const r = await runFieldJob({ kind: 'field', id: 3, scenario: wellpoints, grid, time_s: 1209600, quantity: 'drawdown', step_m: 0.001 });
    const wanted = Math.floor((r.range.max - r.range.min) / 0.001);
    expect(r.levelsWanted).toBe(wanted);
    expect(r.levels.length).toBeGreaterThan(30);
    expect(r.levels.length).toBeLessThanOrEqual(61);
    const step = r.levels[1]! - r.levels[0]!;
    expect(Math.abs(step / 0.001 - Math.round(step / 0.001))).toBeLessThan(1e-6);
    const ok = await runFieldJob({ kind: 'field', id: 4, scenario: wellpoints, grid, time_s: 1209600, quantity: 'drawdown', step_m: 0.5 });
    expect(ok.levelsWanted).toBeUndefined();
  });
});

describe('new wells next to existing ones', () => {
  it('screenOfKind() gives the screen of the first well of that kind, none when there is none', () => {
    expect(screenOfKind(wellpoints, 'wellpoint')).toEqual({ screenTop_m: 6, screenBottom_m: 3 });
    expect(screenOfKind(wellpoints, 'deep')).toEqual({});
  });

  it('splitByNearbyWells() sets aside positions closer than the tolerance to an existing well', () => {
    const r = splitByNearbyWells([[0, 0], [0.8, 0], [3, 0]], [{ x: 0, y: 0.5 }], 1);
    expect(r.taken).toEqual([[0, 0], [0.8, 0]]); // 0.94 m and 0.5 m from the well
    expect(r.free).toEqual([[3, 0]]);
  });
});
