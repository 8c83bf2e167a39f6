import { describe, expect, it } from 'vitest';
import { evaluatePoints, theisDrawdown } from '../../../shared/field';
import { theisWellFunction } from '../../../shared/wells';
import { DrydigError } from '../../../shared/schema';
import reference from './reference/field-reference.json';
import { confinedAquifer, expectClose, leakyAquifer, scenarioWith, unconfinedAquifer, well } from './field-test-helpers';

const at = (r: number): [number, number] => [r, 0];

describe('evaluatePoints for one well', () => {
  const ref = reference.theis;
  // T = K·b = 2.5e-4 · 20 = 5e-3 m²/s as in the reference; S = 2e-4.
  const scenario = scenarioWith({ aquifer: confinedAquifer(), wells: [well('W1', 0, 0, { rate_m3_s: ref.rate_m3_s })], time_s: ref.time_s });

  // Source: mpmath Theis values, tests/shared/field/reference/field_reference.py.
  it.each(ref.cases.filter((c) => c.r_m >= 0.1))('evaluatePoints (Theis) at r = $r_m m matches the mpmath value', ({ r_m, drawdown_m }) => {
    const { points, model } = evaluatePoints({ scenario, points: [at(r_m)] });
    expectClose(points[0]!.drawdown_m, drawdown_m, { rel: 1e-12 });
    expectClose(points[0]!.level_m, 8 - drawdown_m, { rel: 1e-12 });
    expect(model.method).toBe('theis');
    expectClose(model.transmissivity_m2_s, 5e-3, { rel: 1e-15 });
  });

  // Thiem (1906) closed form with R from the scenario.
  it.each([0.5, 7, 120, 499])('evaluatePoints (steady confined) at r = %s m equals Q/(2πT)·ln(R/r)', (r) => {
    const s = scenarioWith({ aquifer: confinedAquifer({ influenceRadius_m: 500 }), wells: [well('W1', 0, 0, { rate_m3_s: 0.01 })], time_s: null });
    const { points, model } = evaluatePoints({ scenario: s, points: [at(r)] });
    expectClose(points[0]!.drawdown_m, (0.01 / (2 * Math.PI * 5e-3)) * Math.log(500 / r), { rel: 1e-13 });
    expect(model).toMatchObject({ method: 'thiem', influenceRadius_m: 500, influenceRadiusSource: 'scenario' });
  });

  // Dupuit–Thiem: H² − h² = Q/(πK)·ln(R/r); H = 20 m, K = 3e-4 m/s.
  it.each([0.5, 7, 120, 299])('evaluatePoints (steady unconfined) at r = %s m satisfies H² − h² = Q/(πK)·ln(R/r)', (r) => {
    const s = scenarioWith({ aquifer: unconfinedAquifer({ influenceRadius_m: 300 }), wells: [well('W1', 0, 0, { rate_m3_s: 0.01 })], time_s: null });
    const p = evaluatePoints({ scenario: s, points: [at(r)] }).points[0]!;
    const h = p.level_m - -10;
    // 400 − h² loses digits to cancellation: compare in m² at 1e-10 (H² = 400 m²).
    expectClose(400 - h * h, (0.01 / (Math.PI * 3e-4)) * Math.log(300 / r), { rel: 1e-12, abs: 1e-10 });
  });

  it('evaluatePoints uses the design time when time_s is undefined and steady state when null', () => {
    const s = scenarioWith({ aquifer: confinedAquifer({ influenceRadius_m: 500 }), wells: [well('W1', 0, 0, { rate_m3_s: 0.01 })], time_s: 86400 });
    expect(evaluatePoints({ scenario: s, points: [at(10)] }).points[0]!.time_s).toBe(86400);
    expect(evaluatePoints({ scenario: s, points: [at(10)], time_s: null }).points[0]!.time_s).toBeNull();
    expect(evaluatePoints({ scenario: s, points: [at(10)], time_s: null }).model.method).toBe('thiem');
  });

  it.each([0, -100])('evaluatePoints at t = %s s reports the static level (no source has started)', (t) => {
    const p = evaluatePoints({ scenario, points: [at(10)], time_s: t }).points[0]!;
    expect(p.drawdown_m).toBe(0);
    expect(p.level_m).toBe(8);
  });
});

describe('evaluatePoints for a ring of equal wells (exact superposition identity)', () => {
  // N wells on a circle of radius a: at the centre every well is at distance a, so
  // s = N·Q/(2πT)·ln(R/a) (Thiem) and H² − h² = N·Q/(πK)·ln(R/a) (Dupuit) exactly.
  const ring = (n: number, a: number, q: number) =>
    Array.from({ length: n }, (_, k) => well(`R${k}`, a * Math.cos((2 * Math.PI * k) / n), a * Math.sin((2 * Math.PI * k) / n), { rate_m3_s: q }));

  it.each([
    [4, 15],
    [12, 25],
    [30, 40],
  ])('evaluatePoints at the centre of %s confined wells on a %s m circle gives N·Q/(2πT)·ln(R/a)', (n, a) => {
    const s = scenarioWith({ aquifer: confinedAquifer({ influenceRadius_m: 600 }), wells: ring(n, a, 0.002), time_s: null });
    const p = evaluatePoints({ scenario: s, points: [[0, 0]] }).points[0]!;
    expectClose(p.drawdown_m, ((n * 0.002) / (2 * Math.PI * 5e-3)) * Math.log(600 / a), { rel: 1e-12 });
  });

  it.each([
    [8, 20],
    [24, 35],
  ])('evaluatePoints at the centre of %s unconfined wells on a %s m circle gives H² − h² = N·Q/(πK)·ln(R/a)', (n, a) => {
    const s = scenarioWith({ aquifer: unconfinedAquifer({ influenceRadius_m: 400 }), wells: ring(n, a, 0.0008), time_s: null });
    const p = evaluatePoints({ scenario: s, points: [[0, 0]] }).points[0]!;
    const h = p.level_m + 10;
    expectClose(400 - h * h, ((n * 0.0008) / (Math.PI * 3e-4)) * Math.log(400 / a), { rel: 1e-12 });
  });
});

describe('evaluatePoints in time (schedules)', () => {
  const T = 5e-3;
  const S = 2e-4;
  const Q = 0.01;
  const stop = 2 * 86400;
  const pumpedThenStopped = scenarioWith({
    aquifer: confinedAquifer(),
    wells: [well('W1', 0, 0, { schedule: [{ from_s: 0, rate_m3_s: Q }, { from_s: stop, rate_m3_s: 0 }] })],
  });
  const superposedInjection = scenarioWith({
    aquifer: confinedAquifer(),
    wells: [well('W1', 0, 0, { rate_m3_s: Q }), well('W1-recovery', 0, 0, { schedule: [{ from_s: 0, rate_m3_s: 0 }, { from_s: stop, rate_m3_s: -Q }] })],
  });

  it.each([0.5 * 86400, stop, stop + 60, 3 * 86400, 20 * 86400])('evaluatePoints after a stop equals the running well plus an injection well started at the stop (t = %s s)', (t) => {
    const points: Array<[number, number]> = [[5, 0], [40, 30], [300, -200]];
    const a = evaluatePoints({ scenario: pumpedThenStopped, points, time_s: t }).points;
    const b = evaluatePoints({ scenario: superposedInjection, points, time_s: t }).points;
    a.forEach((p, i) => expectClose(p.drawdown_m, b[i]!.drawdown_m, { abs: 1e-14, rel: 1e-13 }));
  });

  // Theis (1935) recovery: s' = Q/(4πT)·[W(r²S/(4Tt)) − W(r²S/(4T(t − t_stop)))].
  it.each([stop + 1, stop + 3600, 5 * 86400])('evaluatePoints during recovery follows the Theis recovery formula (t = %s s)', (t) => {
    const r = 25;
    const expected = (Q / (4 * Math.PI * T)) * (theisWellFunction((r * r * S) / (4 * T * t)) - theisWellFunction((r * r * S) / (4 * T * (t - stop))));
    expectClose(evaluatePoints({ scenario: pumpedThenStopped, points: [[r, 0]], time_s: t }).points[0]!.drawdown_m, expected, { rel: 1e-12, abs: 1e-15 });
  });

  it('evaluatePoints adds nothing for a step that starts after the evaluation time', () => {
    const later = scenarioWith({ aquifer: confinedAquifer(), wells: [well('W1', 0, 0, { schedule: [{ from_s: 1000, rate_m3_s: Q }] })] });
    expect(evaluatePoints({ scenario: later, points: [[10, 0]], time_s: 999 }).points[0]!.drawdown_m).toBe(0);
    const s = theisDrawdown({ rate_m3_s: Q, transmissivity_m2_s: T, storativity: S, distance_m: 10, time_s: 500 });
    expectClose(evaluatePoints({ scenario: later, points: [[10, 0]], time_s: 1500 }).points[0]!.drawdown_m, s, { rel: 1e-13 });
  });

  it('evaluatePoints leaves out wells with active: false and steady runs use the final scheduled rate', () => {
    const s = scenarioWith({
      aquifer: confinedAquifer({ influenceRadius_m: 500 }),
      wells: [well('A', 0, 0, { rate_m3_s: Q, active: false }), well('B', 0, 0, { schedule: [{ from_s: 0, rate_m3_s: 0.05 }, { from_s: 100, rate_m3_s: 0.004 }] })],
      time_s: null,
    });
    expectClose(evaluatePoints({ scenario: s, points: [[10, 0]] }).points[0]!.drawdown_m, (0.004 / (2 * Math.PI * T)) * Math.log(50), { rel: 1e-13 });
  });
});

describe('evaluatePoints for an unconfined aquifer (transient)', () => {
  // Exact identity: the engine's s satisfies Jacob's (1944) s − s²/(2H) = Theis with T = K·H, S = Sy.
  it.each([0.3, 4, 30, 250])('evaluatePoints at r = %s m satisfies s − s²/(2H) = Theis(T = K·H, S = Sy)', (r) => {
    const s = scenarioWith({ aquifer: unconfinedAquifer(), wells: [well('W1', 0, 0, { rate_m3_s: 0.006, radius_m: 0.2 })], time_s: 3 * 86400 });
    const p = evaluatePoints({ scenario: s, points: [at(r)] });
    const sd = p.points[0]!.drawdown_m;
    const sc = theisDrawdown({ rate_m3_s: 0.006, transmissivity_m2_s: 3e-4 * 20, storativity: 0.1, distance_m: r, time_s: 3 * 86400 });
    expectClose(sd - (sd * sd) / 40, sc, { rel: 1e-12 });
    expect(p.model.method).toBe('theis-unconfined');
    expect(sd).toBeGreaterThan(sc); // the unconfined drawdown is larger than its confined equivalent
  });
});

describe('evaluatePoints for a leaky aquifer', () => {
  const h = reference.hantush;
  const leaky = (time_s: number | null) => scenarioWith({ aquifer: leakyAquifer(), wells: [well('W1', 0, 0, { rate_m3_s: h.rate_m3_s })], time_s });

  // Source: mpmath Hantush integral (reference script); same T, S, B as the reference.
  it.each(h.cases)('evaluatePoints (Hantush–Jacob) at r = $r_m m, t = $time_s s matches mpmath', ({ r_m, time_s, drawdown_m }) => {
    expectClose(evaluatePoints({ scenario: leaky(time_s), points: [at(r_m)] }).points[0]!.drawdown_m, drawdown_m, { rel: 1e-8, abs: 1e-12 });
  });

  // de Glee (1930) is the t → ∞ limit of Hantush–Jacob: W(u → 0, β) = 2·K0(β) (Hantush 1956).
  it.each(reference.deGlee.cases)('evaluatePoints (de Glee, steady) at r = $r_m m matches mpmath and Hantush–Jacob at very long time', ({ r_m, drawdown_m }) => {
    const steady = evaluatePoints({ scenario: leaky(null), points: [at(r_m)] });
    expect(steady.model.method).toBe('de-glee');
    expectClose(steady.points[0]!.drawdown_m, drawdown_m, { rel: 1e-12, abs: 1e-15 });
    const late = evaluatePoints({ scenario: leaky(1e13), points: [at(r_m)] }).points[0]!.drawdown_m;
    expectClose(late, drawdown_m, { rel: 1e-7, abs: 1e-12 });
  });
});

describe('evaluatePoints flags', () => {
  it('evaluatePoints flags a dewatered unconfined point and reports it at the base, never NaN', () => {
    const s = scenarioWith({ aquifer: unconfinedAquifer(), wells: [well('W1', 0, 0, { rate_m3_s: 0.2 })] });
    const p = evaluatePoints({ scenario: s, points: [[1, 0]] }).points[0]!;
    expect(p.flags).toEqual(['dewatered', 'large-drawdown']);
    expect(p.level_m).toBe(-10);
    expect(p.drawdown_m).toBe(20);
  });

  it('evaluatePoints flags large-drawdown where the unconfined drawdown exceeds a quarter of H', () => {
    const s = scenarioWith({ aquifer: unconfinedAquifer(), wells: [well('W1', 0, 0, { rate_m3_s: 0.05 })] });
    const [near, far] = evaluatePoints({ scenario: s, points: [[1, 0], [800, 0]] }).points;
    expect(near!.drawdown_m).toBeGreaterThan(5);
    expect(near!.flags).toEqual(['large-drawdown']);
    expect(far!.flags).toEqual([]);
  });

  it('evaluatePoints flags beyond-influence-radius beyond R from every source in a steady run', () => {
    const s = scenarioWith({ aquifer: confinedAquifer({ influenceRadius_m: 100 }), wells: [well('A', 0, 0, { rate_m3_s: 0.001 }), well('B', 50, 0, { rate_m3_s: 0.001 })], time_s: null });
    const [inside, outside] = evaluatePoints({ scenario: s, points: [[120, 0], [-120, 0]] }).points;
    expect(inside!.flags).toEqual([]);
    expect(outside!.flags).toEqual(['beyond-influence-radius']);
    expect(outside!.drawdown_m).toBe(0);
  });

  it('evaluatePoints flags confined-to-unconfined where the head falls below the aquifer top', () => {
    const s = scenarioWith({ aquifer: confinedAquifer(), wells: [well('W1', 0, 0, { rate_m3_s: 0.05 })] });
    const [near, far] = evaluatePoints({ scenario: s, points: [[1, 0], [2000, 0]] }).points;
    expect(near!.level_m).toBeLessThan(0);
    expect(near!.flags).toEqual(['confined-to-unconfined']);
    expect(far!.flags).toEqual([]);
  });

  it('evaluatePoints evaluates a point inside the well radius at r_w and flags it', () => {
    const s = scenarioWith({ aquifer: confinedAquifer(), wells: [well('W1', 0, 0, { rate_m3_s: 0.01, radius_m: 0.15 })] });
    const [inside, face] = evaluatePoints({ scenario: s, points: [[0.05, 0], [0.15, 0]] }).points;
    expect(inside!.flags).toEqual(['within-well-radius']);
    expect(face!.flags).toEqual([]);
    expect(inside!.drawdown_m).toBe(face!.drawdown_m);
    expect(Number.isFinite(evaluatePoints({ scenario: s, points: [[0, 0]] }).points[0]!.drawdown_m)).toBe(true);
  });
});

describe('evaluatePoints input errors', () => {
  const s = scenarioWith({ aquifer: confinedAquifer(), wells: [well('W1', 0, 0, { rate_m3_s: 0.01 })] });

  it('evaluatePoints names a non-finite point by its index', () => {
    try {
      evaluatePoints({ scenario: s, points: [[0, 0], [Number.NaN, 1]] });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(DrydigError);
      expect((e as DrydigError).code).toBe('DRYDIG_ERR_INVALID_REQUEST');
      expect((e as DrydigError).issues[0]!.path).toBe('/points/1');
    }
  });

  it('evaluatePoints names a non-finite time', () => {
    expect(() => evaluatePoints({ scenario: s, points: [[1, 0]], time_s: Number.POSITIVE_INFINITY })).toThrow(/\/time_s/);
  });

  it('evaluatePoints asks for a radius of influence when a steady run has neither R nor an excavation below the static level', () => {
    try {
      evaluatePoints({ scenario: s, points: [[1, 0]], time_s: null });
      expect.unreachable();
    } catch (e) {
      expect((e as DrydigError).code).toBe('DRYDIG_ERR_INVALID_SCENARIO');
      expect((e as DrydigError).issues[0]!.path).toBe('/aquifer/influenceRadius_m');
    }
  });

  it('evaluatePoints refuses a radius of influence no larger than a well radius, naming /aquifer/influenceRadius_m', () => {
    const tiny = scenarioWith({ aquifer: confinedAquifer({ influenceRadius_m: 0.1 }), wells: [well('W1', 0, 0, { rate_m3_s: 0.01, radius_m: 0.15 })], time_s: null });
    try {
      evaluatePoints({ scenario: tiny, points: [[1, 0]] });
      expect.unreachable();
    } catch (e) {
      expect((e as DrydigError).code).toBe('DRYDIG_ERR_INVALID_SCENARIO');
      expect((e as DrydigError).issues[0]!.path).toBe('/aquifer/influenceRadius_m');
    }
  });

  it('evaluatePoints takes Sichardt’s R = 3000·s·√K from the design drawdown when R is absent', () => {
    const withPit = scenarioWith({
      aquifer: confinedAquifer(),
      wells: [well('W1', 0, 0, { rate_m3_s: 0.01 })],
      excavations: [{ id: 'pit', outline: [[-5, -5], [5, -5], [5, 5], [-5, 5]], formationLevel_m: 4, margin_m: 0.5 }],
      time_s: null,
    });
    const { model } = evaluatePoints({ scenario: withPit, points: [[1, 0]] });
    // s = 8 − (4 − 0.5) = 4.5 m; R = 3000·4.5·√2.5e-4 = 213.45 m (arithmetic).
    expect(model.influenceRadiusSource).toBe('sichardt');
    expectClose(model.influenceRadius_m!, 3000 * 4.5 * Math.sqrt(2.5e-4), { rel: 1e-15 });
    expectClose(model.influenceRadius_m!, 213.45, { abs: 0.01 });
  });
});
