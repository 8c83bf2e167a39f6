import { describe, expect, it } from 'vitest';
import { evaluatePoints, levelFromPotentialDrawdown, potentialDrawdownForLevel, unitResponseMatrix } from '../../../shared/field';
import { DrydigError, type Scenario } from '../../../shared/schema';
import { confinedAquifer, expectClose, leakyAquifer, scenarioWith, unconfinedAquifer, well } from './field-test-helpers';

const wells = [well('A', 0, 0, { rate_m3_s: 0.004 }), well('B', 25, 5, { rate_m3_s: 0.002 }), well('C', -15, 20, { rate_m3_s: 0.003 }), well('D', 5, -30, { active: false })];
const points: Array<[number, number]> = [[3, 4], [10, 10], [-40, 0], [0.05, 0], [120, -60]];

describe('unitResponseMatrix', () => {
  const cases: Array<[string, Scenario, number | null]> = [
    ['confined transient with a no-flow line', scenarioWith({ aquifer: confinedAquifer(), wells, boundaries: [{ kind: 'no-flow', from: [60, -100], to: [60, 100] }] }), 86400],
    ['unconfined steady', scenarioWith({ aquifer: unconfinedAquifer({ influenceRadius_m: 150 }), wells }), null],
    ['unconfined transient between parallel lines', scenarioWith({ aquifer: unconfinedAquifer(), wells, boundaries: [{ kind: 'constant-head', from: [-100, -50], to: [100, -50] }, { kind: 'no-flow', from: [-100, 40], to: [100, 40] }] }), 86400],
    ['leaky steady', scenarioWith({ aquifer: leakyAquifer(), wells }), null],
  ];

  // Linearity in the rates (the basis of superposition): Σ_j values(i, j)·Q_j reproduces the full evaluation exactly.
  it.each(cases)('unitResponseMatrix times the rates reproduces evaluatePoints: %s', (_name, scenario, time_s) => {
    const m = unitResponseMatrix({ scenario, points, time_s });
    expect(m.wellIds).toEqual(['A', 'B', 'C', 'D']);
    const rates = [0.004, 0.002, 0.003, 0];
    const direct = evaluatePoints({ scenario, points, time_s });
    // Parallel lines: the two evaluations may cut the image series at different N; each cut is
    // within its stated bound (the matrix's per 1 m³/s), doubled for the unconfined back-transform.
    const cut = 2 * ((direct.model.truncationBound_m ?? 0) + (m.model.truncationBound_m ?? 0) * 0.009);
    direct.points.forEach((p, i) => {
      if (p.flags.includes('beyond-boundary')) return;
      let sum = m.background[i]!;
      rates.forEach((q, j) => (sum += m.values[i * 4 + j]! * q));
      expectClose(m.toLevel(sum, i), p.level_m, { abs: 1e-11 + cut });
      expectClose(m.toDrawdown(sum, i), p.drawdown_m, { abs: 1e-11 + cut });
    });
    expect(m.variable).toBe(scenario.aquifer.kind === 'unconfined' ? 'discharge-potential' : 'drawdown');
  });

  it('unitResponseMatrix keeps the wells not listed as a background at their own rates', () => {
    const [, scenario, time_s] = cases[0]!;
    const m = unitResponseMatrix({ scenario, points, time_s, wellIds: ['C', 'A'] });
    const direct = evaluatePoints({ scenario, points, time_s }).points;
    direct.forEach((p, i) => {
      const sum = m.background[i]! + m.values[i * 2]! * 0.003 + m.values[i * 2 + 1]! * 0.004;
      expectClose(m.toLevel(sum, i), p.level_m, { abs: 1e-11 });
    });
  });

  it('unitResponseMatrix entries are the unit responses of constant pumping from t = 0, whatever the schedule', () => {
    const scheduled = scenarioWith({ aquifer: confinedAquifer(), wells: [well('S', 0, 0, { schedule: [{ from_s: 0, rate_m3_s: 0.01 }, { from_s: 100, rate_m3_s: 0 }] })] });
    // 0.1 m³/s keeps the head above the aquifer base (below it the engine holds the head at the base).
    const constant = scenarioWith({ aquifer: confinedAquifer(), wells: [well('S', 0, 0, { rate_m3_s: 0.1 })] });
    const m = unitResponseMatrix({ scenario: scheduled, points: [[10, 0]] });
    expectClose(m.values[0]! * 0.1, evaluatePoints({ scenario: constant, points: [[10, 0]] }).points[0]!.drawdown_m, { rel: 1e-13 });
  });

  it('unitResponseMatrix names an unknown or repeated well id', () => {
    const [, scenario] = cases[0]!;
    for (const [ids, path] of [[['A', 'Z'], '/wellIds/1'], [['A', 'B', 'A'], '/wellIds/2']] as const) {
      try {
        unitResponseMatrix({ scenario, points, wellIds: ids });
        expect.unreachable();
      } catch (e) {
        expect((e as DrydigError).issues[0]!.path).toBe(path);
      }
    }
  });
});

describe('potential conversions', () => {
  const unconfined = unconfinedAquifer(); // H = 20 m, base −10 m
  // s_c = (H² − h²)/(2H) (Jacob 1944 correction, Kruseman & de Ridder 1994 ch. 3), written out.
  it.each([10, 5, 0, -9.99, -10])('potentialDrawdownForLevel at %s m equals (H² − h²)/(2H) and inverts levelFromPotentialDrawdown', (level) => {
    const h = level + 10;
    const sc = potentialDrawdownForLevel({ aquifer: unconfined, level_m: level });
    expectClose(sc, (400 - h * h) / 40, { rel: 1e-15, abs: 1e-15 });
    // Near the base h = sqrt(…) is ill-conditioned: 1e-11 m there.
    expectClose(levelFromPotentialDrawdown({ aquifer: unconfined, potentialDrawdown_m: sc }), level, { abs: 1e-11 });
  });

  it('potentialDrawdownForLevel is static − level for confined and leaky aquifers', () => {
    expect(potentialDrawdownForLevel({ aquifer: confinedAquifer(), level_m: 2.5 })).toBe(5.5);
    expect(levelFromPotentialDrawdown({ aquifer: leakyAquifer(), potentialDrawdown_m: 5.5 })).toBe(2.5);
  });

  it('potentialDrawdownForLevel refuses an unconfined level below the base, naming /level_m', () => {
    expect(() => potentialDrawdownForLevel({ aquifer: unconfined, level_m: -11 })).toThrow(DrydigError);
    expect(() => potentialDrawdownForLevel({ aquifer: unconfined, level_m: -11 })).toThrow(/\/level_m/);
  });
});
