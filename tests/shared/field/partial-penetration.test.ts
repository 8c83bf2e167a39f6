import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { evaluateGrid, evaluatePoints, unitResponseMatrix, wellLevels } from '../../../shared/field';
import { validateScenario } from '../../../shared/schema';
import { besselK0, theisWellFunction } from '../../../shared/wells';
import { confinedAquifer, expectClose, leakyAquifer, scenarioWith, well } from './field-test-helpers';

interface Case { r: number; D: number; d: number; l: number; d2: number; l2?: number; ratio?: number; B?: number; fs: string }
// Source: fixtures/reference/partial-penetration.json, made by scripts/reference/partial-penetration.py
// (Hantush 1961 series in the Kruseman & de Ridder 1994 ch. 10 form, mpmath 1.3.0).
const cases = (JSON.parse(readFileSync(new URL('../../../fixtures/reference/partial-penetration.json', import.meta.url), 'utf8')) as { cases: Case[] }).cases;
const fsOf = (match: Partial<Case>) => {
  const c = cases.find((k) => Object.entries(match).every(([key, v]) => k[key as keyof Case] === v) && (match.l2 !== undefined || k.l2 === undefined) && (match.ratio !== undefined || k.ratio === undefined) && (match.B !== undefined || k.B === undefined));
  if (!c) throw new Error(`no reference case ${JSON.stringify(match)}`);
  return Number(c.fs);
};

// Confined aquifer top 0, base −20 (D = 20 m); the screen 4–10 m below the top.
const Q = 0.004;
const R = 500;
const partialWell = well('P1', 0, 0, { rate_m3_s: Q, screenTop_m: -4, screenBottom_m: -10 });
const T = 2.5e-4 * 20;
const scale = Q / (4 * Math.PI * T);

describe('partial penetration (Hantush 1961) in the field engine', () => {
  it('adds f_s over the well’s own screen to the pumping level (steady Thiem)', () => {
    const scenario = scenarioWith({ aquifer: confinedAquifer({ influenceRadius_m: R }), wells: [partialWell], time_s: null });
    const [level] = wellLevels({ scenario });
    const expected = scale * (2 * Math.log(R / 0.1) + fsOf({ r: 0.1, D: 20, d: 4, l: 10, d2: 4, l2: 10 }));
    expectClose(8 - level!.aquiferLevel_m, expected, { rel: 1e-9 }, 'pumping-level drawdown');
    expect(8 - level!.aquiferLevel_m - scale * 2 * Math.log(R / 0.1)).toBeGreaterThan(0.5);
  });

  it('adds f_s at a plan point nearer than 1.5·D, read at the aquifer top', () => {
    const scenario = scenarioWith({ aquifer: confinedAquifer({ influenceRadius_m: R }), wells: [partialWell], time_s: null });
    const { points } = evaluatePoints({ scenario, points: [[6, 0]] });
    expectClose(points[0]!.drawdown_m, scale * (2 * Math.log(R / 6) + fsOf({ r: 6, D: 20, d: 4, l: 10, d2: 0 })), { rel: 1e-9 }, 'drawdown at 6 m');
    const grid = evaluateGrid({ scenario, grid: { origin: [6, 0], spacing_m: [1, 1], counts: [1, 1] } });
    // The grid interpolates f_s in ln r (2048 nodes): within 1e-7 m of the series here.
    expectClose(grid.drawdown_m[0]!, points[0]!.drawdown_m, { abs: 1e-7 }, 'grid node');
  });

  it('scales r by √(Kv/Kh) with aquifer.anisotropyKhKv', () => {
    const scenario = scenarioWith({ aquifer: confinedAquifer({ influenceRadius_m: R, anisotropyKhKv: 10 }), wells: [partialWell], time_s: null });
    const { points } = evaluatePoints({ scenario, points: [[5, 0], [40, 0]] });
    expectClose(points[0]!.drawdown_m, scale * (2 * Math.log(R / 5) + fsOf({ r: 5, D: 20, d: 4, l: 10, d2: 0, ratio: 10 })), { rel: 1e-9 }, 'r = 5 m, Kh/Kv = 10');
    expectClose(points[1]!.drawdown_m, scale * (2 * Math.log(R / 40) + fsOf({ r: 40, D: 20, d: 4, l: 10, d2: 0, ratio: 10 })), { rel: 1e-9 }, 'r = 40 m, Kh/Kv = 10');
  });

  it('uses the leaky form (Hantush 1964) with de Glee', () => {
    const scenario = scenarioWith({ aquifer: leakyAquifer({ leakageFactor_m: 60, anisotropyKhKv: 4 }), wells: [partialWell], time_s: null });
    const { points } = evaluatePoints({ scenario, points: [[5, 0]] });
    expectClose(points[0]!.drawdown_m, scale * (2 * besselK0(5 / 60) + fsOf({ r: 5, D: 20, d: 4, l: 10, d2: 0, ratio: 4, B: 60 })), { rel: 1e-9 }, 'leaky');
  });

  it('adds the late-time correction to Theis, and the unit responses agree with the evaluation', () => {
    const t = 30 * 86400;
    const scenario = scenarioWith({ aquifer: confinedAquifer(), wells: [partialWell], time_s: t });
    const { points, model } = evaluatePoints({ scenario, points: [[6, 0]] });
    const u = (36 * 2e-4) / (4 * T * t);
    expectClose(points[0]!.drawdown_m, scale * (theisWellFunction(u) + fsOf({ r: 6, D: 20, d: 4, l: 10, d2: 0 })), { rel: 1e-9 }, 'Theis + f_s');
    expect(model.notes.some((n) => n.includes('Hantush'))).toBe(true);
    const m = unitResponseMatrix({ scenario, points: [[6, 0], [0, 0]], time_s: t });
    expectClose(m.values[0]! * Q, points[0]!.drawdown_m, { rel: 1e-12 }, 'unit response at 6 m');
    expectClose(m.values[1]! * Q, 8 - wellLevels({ scenario })[0]!.aquiferLevel_m, { rel: 1e-12 }, 'unit response inside the well');
  });

  it('validates aquifer.anisotropyKhKv by its JSON pointer', () => {
    const scenario = scenarioWith({ aquifer: confinedAquifer({ anisotropyKhKv: 0 }), wells: [partialWell] });
    const result = validateScenario(scenario);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.issues[0]!.path).toBe('/aquifer/anisotropyKhKv');
  });
});
