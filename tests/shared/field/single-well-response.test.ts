import { describe, expect, it } from 'vitest';
import {
  cooperJacobDrawdown,
  deGleeDrawdown,
  dupuitThiemDrawdown,
  hantushJacobDrawdown,
  jacobCorrectedDrawdown,
  theisDrawdown,
  thiemDrawdown,
  unconfinedDrawdownFromPotential,
  unconfinedTheisDrawdown,
} from '../../../shared/field';
import reference from './reference/field-reference.json';
import { expectClose } from './field-test-helpers';

describe('theisDrawdown', () => {
  const ref = reference.theis;
  // Source: mpmath 1.3.0 e1 at 30 digits, tests/shared/field/reference/field_reference.py (Theis 1935).
  it.each(ref.cases)('theisDrawdown at r = $r_m m matches the mpmath Theis value', ({ r_m, drawdown_m }) => {
    const s = theisDrawdown({ rate_m3_s: ref.rate_m3_s, transmissivity_m2_s: ref.transmissivity_m2_s, storativity: ref.storativity, distance_m: r_m, time_s: ref.time_s });
    expectClose(s, drawdown_m, { rel: 1e-12 });
  });

  it('theisDrawdown is 0 at and before t = 0', () => {
    for (const time_s of [0, -10]) expect(theisDrawdown({ rate_m3_s: 0.01, transmissivity_m2_s: 1e-3, storativity: 1e-4, distance_m: 5, time_s })).toBe(0);
  });

  // Cooper & Jacob (1946) write −γ − ln u as ln(2.25/(4u)), rounding 4·e^(−γ) = 2.2458… to 2.25 (γ from
  // A&S 6.1.3). With W(u) = −γ − ln u + u − u²/4 + … (A&S 5.1.11, alternating, terms decreasing for u < 1):
  // W(u) − ln(2.25/(4u)) = u − u²/4 + O(u³) − c, c = ln(2.25·e^γ/4) ≈ 0.001855 — the known error of the straight line.
  it.each([1e-2, 3e-3, 1e-3, 1e-5, 1e-8])('theisDrawdown − cooperJacobDrawdown equals Q/(4πT)·(u − u²/4 − ln(2.25e^γ/4)) for u = %s', (u) => {
    const T = 2e-3;
    const S = 1e-4;
    const r = 10;
    const t = (r * r * S) / (4 * T * u);
    const o = { rate_m3_s: 0.01, transmissivity_m2_s: T, storativity: S, distance_m: r, time_s: t };
    const diff = theisDrawdown(o) - cooperJacobDrawdown(o);
    const scale = 0.01 / (4 * Math.PI * T);
    const c = Math.log((2.25 * Math.exp(0.5772156649015329)) / 4);
    expectClose(diff, scale * (u - (u * u) / 4 - c), { abs: scale * u ** 3 + 1e-12 });
    // In practice: within 1 % of the Theis drawdown for u < 0.01.
    expect(Math.abs(diff) / theisDrawdown(o)).toBeLessThan(0.01);
  });
});

describe('thiemDrawdown and dupuitThiemDrawdown', () => {
  // Thiem (1906) closed form s = Q/(2πT)·ln(R/r), written out.
  it.each([
    [0.1, 0.005, 0.004, 1000],
    [10, 0.005, 0.004, 1000],
    [999, 0.005, 0.004, 1000],
  ])('thiemDrawdown at r = %s m equals Q/(2πT)·ln(R/r)', (r, Q, T, R) => {
    expectClose(thiemDrawdown({ rate_m3_s: Q, transmissivity_m2_s: T, distance_m: r, influenceRadius_m: R }), (Q / (2 * Math.PI * T)) * Math.log(R / r), { rel: 1e-14 });
  });

  it('thiemDrawdown is 0 at and beyond R', () => {
    expect(thiemDrawdown({ rate_m3_s: 0.01, transmissivity_m2_s: 1e-3, distance_m: 300, influenceRadius_m: 300 })).toBe(0);
    expect(thiemDrawdown({ rate_m3_s: 0.01, transmissivity_m2_s: 1e-3, distance_m: 400, influenceRadius_m: 300 })).toBe(0);
  });

  // Dupuit (1863) – Thiem: H² − h² = Q/(πK)·ln(R/r), h solved directly.
  it.each([0.2, 3, 40, 150])('dupuitThiemDrawdown at r = %s m satisfies H² − h² = Q/(πK)·ln(R/r)', (r) => {
    const [Q, K, H, R] = [0.004, 3e-4, 15, 200];
    const h = Math.sqrt(H * H - (Q / (Math.PI * K)) * Math.log(R / r));
    const res = dupuitThiemDrawdown({ rate_m3_s: Q, conductivity_m_s: K, saturatedThickness_m: H, distance_m: r, influenceRadius_m: R });
    expectClose(res.drawdown_m, H - h, { rel: 1e-12, abs: 1e-14 });
  });
});

describe('unconfined back-transform', () => {
  // Jacob (1944): s_c = s − s²/(2H); the engine's s = H − sqrt(H² − 2H·s_c) is its exact inverse.
  it.each([0.01, 1, 4.9, 9.99])('jacobCorrectedDrawdown undoes unconfinedDrawdownFromPotential for s_c = %s m', (sc) => {
    const H = 20;
    const { drawdown_m, flags } = unconfinedDrawdownFromPotential({ saturatedThickness_m: H, potentialDrawdown_m: sc });
    expectClose(jacobCorrectedDrawdown({ saturatedThickness_m: H, drawdown_m }), sc, { rel: 1e-12 });
    expect(flags.includes('dewatered')).toBe(false);
  });

  it('unconfinedDrawdownFromPotential reports a dewatered aquifer, not NaN, when 2H·s_c ≥ H²', () => {
    const res = unconfinedDrawdownFromPotential({ saturatedThickness_m: 20, potentialDrawdown_m: 10 });
    expect(res).toEqual({ drawdown_m: 20, flags: ['dewatered', 'large-drawdown'] });
  });

  it('unconfinedTheisDrawdown applied Jacob’s correction equals Theis with T = K·H, S = Sy', () => {
    const o = { rate_m3_s: 0.003, conductivity_m_s: 2e-4, saturatedThickness_m: 12, specificYield: 0.15, distance_m: 4, time_s: 2e5 };
    const s = unconfinedTheisDrawdown(o).drawdown_m;
    const sc = theisDrawdown({ rate_m3_s: o.rate_m3_s, transmissivity_m2_s: 2e-4 * 12, storativity: 0.15, distance_m: 4, time_s: 2e5 });
    expectClose(s - (s * s) / 24, sc, { rel: 1e-12 });
  });
});

describe('leaky responses', () => {
  const h = reference.hantush;
  // Source: mpmath quad of the Hantush integral, tests/shared/field/reference/field_reference.py (Hantush & Jacob 1955).
  it.each(h.cases)('hantushJacobDrawdown at r = $r_m m, t = $time_s s matches the mpmath integral', ({ r_m, time_s, drawdown_m }) => {
    const s = hantushJacobDrawdown({ rate_m3_s: h.rate_m3_s, transmissivity_m2_s: h.transmissivity_m2_s, storativity: h.storativity, leakageFactor_m: h.leakageFactor_m, distance_m: r_m, time_s });
    expectClose(s, drawdown_m, { rel: 1e-8, abs: 1e-12 });
  });

  const g = reference.deGlee;
  // Source: mpmath besselk(0, r/B), same script (de Glee 1930).
  it.each(g.cases)('deGleeDrawdown at r = $r_m m matches Q/(2πT)·K0(r/B) from mpmath', ({ r_m, drawdown_m }) => {
    const s = deGleeDrawdown({ rate_m3_s: g.rate_m3_s, transmissivity_m2_s: g.transmissivity_m2_s, leakageFactor_m: g.leakageFactor_m, distance_m: r_m });
    expectClose(s, drawdown_m, { rel: 1e-12, abs: 1e-15 });
  });
});

describe('argument checks', () => {
  it('theisDrawdown names the bad argument instead of returning NaN', () => {
    expect(() => theisDrawdown({ rate_m3_s: 0.01, transmissivity_m2_s: 0, storativity: 1e-4, distance_m: 5, time_s: 10 })).toThrow(/transmissivity_m2_s/);
    expect(() => theisDrawdown({ rate_m3_s: 0.01, transmissivity_m2_s: 1e-3, storativity: 1e-4, distance_m: Number.NaN, time_s: 10 })).toThrow(/distance_m/);
  });
});
