import { describe, expect, it } from 'vitest';
import { getExcavationShortfall, runFieldJob, runSectionJob, evaluateGridInStrips, JobCancelled } from '../../../client/worker/field-job';
import { evaluateGrid } from '../../../shared/field';
import type { Scenario } from '../../../shared/schema';

/** One well at the origin in a confined aquifer, steady state with R given: Thiem (1906) applies exactly. */
function thiemScenario(excavationHalfSide_m: number, formation_m: number): Scenario {
  return {
    format: 'drydig.scenario', version: 1, name: 'Thiem check', groundLevel_m: 20,
    aquifer: { kind: 'confined', conductivity_m_s: 1e-4, base_m: -10, top_m: 5, staticLevel_m: 15, storativity: 1e-4, influenceRadius_m: 500 },
    boundaries: [],
    excavations: [{ id: 'pit', outline: [[-excavationHalfSide_m, -excavationHalfSide_m], [excavationHalfSide_m, -excavationHalfSide_m], [excavationHalfSide_m, excavationHalfSide_m], [-excavationHalfSide_m, excavationHalfSide_m]], formationLevel_m: formation_m, margin_m: 0.5 }],
    wells: [{ id: 'W', x: 0, y: 0, radius_m: 0.2, kind: 'deep', rate_m3_s: 0.01 }],
    design: { time_s: null },
  };
}

// Thiem (1906): s = Q/(2πT)·ln(R/r), T = K·b = 1e-4 × 15 = 1.5e-3 m²/s, Q = 0.01 m³/s, R = 500 m.
const thiem = (r: number) => (0.01 / (2 * Math.PI * 1.5e-3)) * Math.log(500 / r);

describe('getExcavationShortfall(scenario, excavation) reports the highest level inside a pit', () => {
  it('finds the worst point at a corner of a square pit round one well, at the Thiem level there', () => {
    const half = 10;
    const s = thiemScenario(half, 14);
    const r = getExcavationShortfall(s, s.excavations[0]!);
    const cornerLevel = 15 - thiem(half * Math.SQRT2);
    expect(Math.abs(Math.abs(r.worst.x) - half)).toBeLessThan(1e-9);
    expect(Math.abs(Math.abs(r.worst.y) - half)).toBeLessThan(1e-9);
    expect(Math.abs(r.worst.level_m - cornerLevel)).toBeLessThan(1e-9);
    expect(Math.abs(r.worstShortfall_m - (cornerLevel - 13.5))).toBeLessThan(1e-9);
    expect(r.met).toBe(r.worstShortfall_m <= 0);
    expect(r.time_s).toBeNull();
  });

  it('shades the part of the pit outside the circle where the Thiem drawdown reaches the target', () => {
    // Target 11 − 0.5 = 10.5 m → needs s = 4.5 m → r0 = R·exp(−2πT·s/Q) ≈ 7.2 m; above target beyond r0.
    const half = 12;
    const s = thiemScenario(half, 11);
    const r0 = 500 * Math.exp((-2 * Math.PI * 1.5e-3 * 4.5) / 0.01);
    expect(r0).toBeLessThan(half); // the circle lies inside the square
    const r = getExcavationShortfall(s, s.excavations[0]!);
    const expectedArea = (2 * half) ** 2 - Math.PI * r0 * r0;
    // Exact geometry; marching squares on a 41-node pit grid: within 2 %.
    expect(Math.abs(r.area_m2 - expectedArea) / expectedArea).toBeLessThan(0.02);
    expect(r.met).toBe(false);
    expect(Math.abs(r.areaFraction - expectedArea / (2 * half) ** 2)).toBeLessThan(0.02);
  });

  it('reports met with the margin to spare when the whole pit is below target', () => {
    const s = thiemScenario(3, 17);
    const r = getExcavationShortfall(s, s.excavations[0]!);
    expect(r.met).toBe(true);
    expect(r.coordinates).toHaveLength(0);
    expect(r.area_m2).toBe(0);
    expect(r.worstShortfall_m).toBeLessThan(0);
  });
});

describe('runFieldJob(request) contours the engine grid', () => {
  const s = thiemScenario(10, 14);
  const grid = { origin: [-100, -100] as [number, number], spacing_m: [5, 5] as [number, number], counts: [41, 41] as [number, number] };
  it('drawdown contours are circles round the well at the Thiem radius (to grid resolution)', async () => {
    const res = await runFieldJob({ kind: 'field', id: 7, scenario: s, grid, time_s: null, quantity: 'drawdown', step_m: 0.5 });
    expect(res.id).toBe(7);
    const level = res.contours.lines.find((l) => l.level === 1.5)!;
    // s = 1.5 m at r = R·exp(−2πT·1.5/Q).
    const r15 = 500 * Math.exp((-2 * Math.PI * 1.5e-3 * 1.5) / 0.01);
    for (const part of level.coordinates) for (const [x, y] of part) expect(Math.abs(Math.hypot(x, y) - r15)).toBeLessThan(0.5);
    expect(res.shortfall).toHaveLength(1);
    expect(res.model.method).toBe('thiem');
  });
  it('level contours are the same circles, at static level minus drawdown', async () => {
    const res = await runFieldJob({ kind: 'field', id: 8, scenario: s, grid, time_s: null, quantity: 'level', step_m: 0.5 });
    expect(res.contours.lines.some((l) => l.level === 13.5)).toBe(true);
    expect(res.range.max).toBeLessThanOrEqual(15);
  });
  it('computing in strips gives the same grid as one call', async () => {
    const one = evaluateGrid({ scenario: s, grid, time_s: null });
    const strips = await evaluateGridInStrips(s, grid, null, 5);
    expect(Array.from(strips.level_m)).toEqual(Array.from(one.level_m));
    expect(Array.from(strips.flags)).toEqual(Array.from(one.flags));
  });
  it('stops between strips when cancelled', async () => {
    await expect(evaluateGridInStrips(s, grid, null, 4, { isCancelled: () => true })).rejects.toBeInstanceOf(JobCancelled);
  });
});

describe('runSectionJob(request) samples the level along a line', () => {
  it('is symmetric about the well for a line through it, at the Thiem level', () => {
    const s = thiemScenario(10, 14);
    const r = runSectionJob({ kind: 'section', id: 1, scenario: s, from: [-50, 0], to: [50, 0], samples: 11, time_s: null });
    expect(r.points).toHaveLength(11);
    expect(r.points[10]!.distance_m).toBe(100);
    expect(Math.abs(r.points[0]!.level_m - r.points[10]!.level_m)).toBeLessThan(1e-12);
    expect(Math.abs(r.points[0]!.level_m - (15 - thiem(50)))).toBeLessThan(1e-9);
  });
});
