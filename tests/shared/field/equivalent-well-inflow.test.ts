import { describe, expect, it } from 'vitest';
import { equivalentWellInflow, sichardtRadius, theisDrawdown, transientInfluenceRadius, unconfinedTheisDrawdown } from '../../../shared/field';
import { DrydigError } from '../../../shared/schema';
import { confinedAquifer, expectClose, leakyAquifer, scenarioWith, unconfinedAquifer } from './field-test-helpers';

// A 40 m × 25 m pit, formation 2 m, margin 0.5 m → target 1.5 m.
const pit = { id: 'pit', outline: [[0, 0], [40, 0], [40, 25], [0, 25]] as Array<[number, number]>, formationLevel_m: 2, margin_m: 0.5 };
const re = Math.sqrt(1000 / Math.PI);

describe('sichardtRadius and transientInfluenceRadius', () => {
  // Sichardt (1928): R = 3000·s·√K — arithmetic on the formula.
  it.each([
    [4, 1e-4, 120],
    [2, 1e-3, 189.73665961010275],
    [0.5, 4e-6, 3],
  ])('sichardtRadius(s = %s m, K = %s m/s) = %s m', (s, K, R) => {
    expectClose(sichardtRadius({ drawdown_m: s, conductivity_m_s: K }), R, { rel: 1e-14 });
  });

  it('sichardtRadius names a drawdown that is not positive', () => {
    expect(() => sichardtRadius({ drawdown_m: 0, conductivity_m_s: 1e-4 })).toThrow(/drawdown_m/);
  });

  // Cooper & Jacob (1946) zero-drawdown radius R0 = sqrt(2.25·T·t/S): sqrt(2.25·5e-3·86400/2e-4) = sqrt(4 860 000).
  it('transientInfluenceRadius is sqrt(2.25·T·t/S) and is where Cooper–Jacob drawdown vanishes', () => {
    const R0 = transientInfluenceRadius({ transmissivity_m2_s: 5e-3, storativity: 2e-4, time_s: 86400 });
    expectClose(R0, Math.sqrt(4_860_000), { rel: 1e-15 });
    expect(transientInfluenceRadius({ transmissivity_m2_s: 5e-3, storativity: 2e-4, time_s: 0 })).toBe(0);
  });
});

describe('equivalentWellInflow', () => {
  it('equivalentWellInflow (steady confined) is Thiem’s 2πT·s/ln(R0/r_e) with R0 = r_e + R', () => {
    const scenario = scenarioWith({ aquifer: confinedAquifer({ influenceRadius_m: 250 }), wells: [], excavations: [pit], time_s: null });
    const q = equivalentWellInflow({ scenario, excavationId: 'pit' });
    expectClose(q.equivalentRadius_m, re, { rel: 1e-15 });
    expect(q.drawdown_m).toBeCloseTo(6.5, 12);
    expectClose(q.rate_m3_s, (2 * Math.PI * 5e-3 * 6.5) / Math.log((re + 250) / re), { rel: 1e-14 });
    expect(q).toMatchObject({ method: 'thiem', influenceRadiusSource: 'scenario' });
    expect(q.assumptions.join(' ')).toMatch(/licensed engineer/);
  });

  it('equivalentWellInflow (steady unconfined, Sichardt R) is Dupuit’s πK(H² − h²)/ln(R0/r_e)', () => {
    const scenario = scenarioWith({ aquifer: unconfinedAquifer(), wells: [], excavations: [pit], time_s: null });
    const q = equivalentWellInflow({ scenario, excavationId: 'pit' });
    const s = 10 - 1.5;
    const R = 3000 * s * Math.sqrt(3e-4);
    const h = 20 - s;
    expectClose(q.rate_m3_s, (Math.PI * 3e-4 * (400 - h * h)) / Math.log((re + R) / re), { rel: 1e-14 });
    expect(q.influenceRadiusSource).toBe('sichardt');
  });

  it('equivalentWellInflow (transient) reproduces the target drawdown at r_e through the Theis formula', () => {
    const confined = scenarioWith({ aquifer: confinedAquifer(), wells: [], excavations: [pit], time_s: 14 * 86400 });
    const qc = equivalentWellInflow({ scenario: confined, excavationId: 'pit' });
    expectClose(theisDrawdown({ rate_m3_s: qc.rate_m3_s, transmissivity_m2_s: 5e-3, storativity: 2e-4, distance_m: re, time_s: 14 * 86400 }), 6.5, { rel: 1e-12 });
    expect(qc.cooperJacobValid).toBe(true);

    const unconfined = scenarioWith({ aquifer: unconfinedAquifer(), wells: [], excavations: [pit], time_s: 14 * 86400 });
    const qu = equivalentWellInflow({ scenario: unconfined, excavationId: 'pit' });
    const back = unconfinedTheisDrawdown({ rate_m3_s: qu.rate_m3_s, conductivity_m_s: 3e-4, saturatedThickness_m: 20, specificYield: 0.1, distance_m: re, time_s: 14 * 86400 });
    expectClose(back.drawdown_m, 8.5, { rel: 1e-12 });
  });

  it('equivalentWellInflow (steady leaky) is de Glee’s 2πT·s/K0(r_e/B)', () => {
    const scenario = scenarioWith({ aquifer: leakyAquifer(), wells: [], excavations: [pit], time_s: null });
    const q = equivalentWellInflow({ scenario, excavationId: 'pit' });
    expect(q.method).toBe('de-glee');
    expect(q.rate_m3_s).toBeGreaterThan(0);
  });

  it('equivalentWellInflow names an unknown excavation and a target below an unconfined base', () => {
    const scenario = scenarioWith({ aquifer: unconfinedAquifer(), wells: [], excavations: [{ ...pit, formationLevel_m: -9.8 }] });
    expect(() => equivalentWellInflow({ scenario, excavationId: 'nope' })).toThrow(/\/excavationId/);
    try {
      equivalentWellInflow({ scenario, excavationId: 'pit' });
      expect.unreachable();
    } catch (e) {
      expect((e as DrydigError).issues[0]!.path).toBe('/excavations/0/formationLevel_m');
    }
  });

  it('equivalentWellInflow needs no pumping when the target is above the static level', () => {
    const scenario = scenarioWith({ aquifer: confinedAquifer(), wells: [], excavations: [{ ...pit, formationLevel_m: 11 }] });
    expect(equivalentWellInflow({ scenario, excavationId: 'pit' }).rate_m3_s).toBe(0);
  });
});
