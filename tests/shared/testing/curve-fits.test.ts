import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { fitCooperJacob, fitHantushCurve, fitTheisCurve, type TestReading } from '../../../shared/testing';
import { syntheticReadings } from './synthetic-readings';

const relative = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

/**
 * Reference: fixtures/reference/pumping-test-fits.json, written by scripts/reference/pumping-test-fits.py
 * (scipy.optimize.curve_fit, Levenberg–Marquardt; Student t intervals from scipy.stats; versions in the file).
 */
const reference = JSON.parse(readFileSync(new URL('../../../fixtures/reference/pumping-test-fits.json', import.meta.url), 'utf8')) as {
  versions: Record<string, string>;
  cases: Record<'theis' | 'hantush', { rate_m3_s: number; readings: Array<{ time_s: number; distance_m: number; well: string; drawdown_m: number }>; fit: Record<string, number | number[]> }>;
};
const referenceReadings = (kind: 'theis' | 'hantush'): TestReading[] =>
  reference.cases[kind].readings.map((r, i) => ({ ...r, phase: 'pumping', rate_m3_s: reference.cases[kind].rate_m3_s, line: i + 2 }));

describe('fitTheisCurve(readings)', () => {
  it('recovers T and S from noise-free Theis drawdowns to 0.1 % (two wells at once)', () => {
    const readings = syntheticReadings({ rate_m3_s: 0.01, transmissivity_m2_s: 1e-3, storativity: 1e-4, wells: [{ well: 'PZ1', distance_m: 15 }, { well: 'PZ2', distance_m: 60 }] });
    const fit = fitTheisCurve(readings, null);
    expect(relative(fit.transmissivity_m2_s!, 1e-3)).toBeLessThan(1e-3);
    expect(relative(fit.storativity!, 1e-4)).toBeLessThan(1e-3);
    expect(fit.rmse_m).toBeLessThan(1e-9);
  });

  it.each([1, 2, 3])('recovers T and S from Theis drawdowns with 5 mm noise to 2 % (seed %i)', (seed) => {
    const readings = syntheticReadings({ rate_m3_s: 0.02, transmissivity_m2_s: 5e-3, storativity: 3e-4, wells: [{ well: 'PZ1', distance_m: 20 }], noise_m: 0.005, seed });
    const fit = fitTheisCurve(readings, 'PZ1');
    expect(relative(fit.transmissivity_m2_s!, 5e-3)).toBeLessThan(0.02);
    expect(relative(fit.storativity!, 3e-4)).toBeLessThan(0.02);
    const [lo, hi] = fit.interval!.transmissivity_m2_s!;
    expect(lo).toBeLessThan(fit.transmissivity_m2_s!);
    expect(hi).toBeGreaterThan(fit.transmissivity_m2_s!);
  });

  it('matches scipy.optimize.curve_fit on the committed noisy data set: T, S, their 95 % intervals and the RMSE', () => {
    const fit = fitTheisCurve(referenceReadings('theis'), null);
    const ref = reference.cases.theis.fit;
    expect(relative(fit.transmissivity_m2_s!, ref.transmissivity_m2_s as number)).toBeLessThan(1e-6);
    expect(relative(fit.storativity!, ref.storativity as number)).toBeLessThan(1e-6);
    expect(relative(fit.rmse_m, ref.rmse_m as number)).toBeLessThan(1e-6);
    const [lo, hi] = ref.transmissivity_m2_s_interval as number[];
    // Our Student-t quantile is the Cornish–Fisher expansion (A&S 26.7.5): within 1e-4 of scipy's for 58 dof.
    expect(relative(fit.interval!.transmissivity_m2_s![0], lo!)).toBeLessThan(1e-5);
    expect(relative(fit.interval!.transmissivity_m2_s![1], hi!)).toBeLessThan(1e-5);
  });

  it('says the late readings flatten when leaky data are fitted with Theis', () => {
    const readings = syntheticReadings({ rate_m3_s: 0.01, transmissivity_m2_s: 1e-3, storativity: 1e-4, leakageFactor_m: 200, wells: [{ well: 'PZ1', distance_m: 20 }] });
    expect(fitTheisCurve(readings, 'PZ1').departures.join(' ')).toMatch(/flatten/);
  });

  it('finds no departure in Theis data with noise', () => {
    const readings = syntheticReadings({ rate_m3_s: 0.01, transmissivity_m2_s: 1e-3, storativity: 1e-4, wells: [{ well: 'PZ1', distance_m: 20 }], noise_m: 0.003, seed: 7 });
    expect(fitTheisCurve(readings, 'PZ1').departures).toEqual([]);
  });
});

describe('fitHantushCurve(readings)', () => {
  it('recovers T, S and B from noise-free leaky drawdowns to 0.1 %', () => {
    const readings = syntheticReadings({ rate_m3_s: 0.01, transmissivity_m2_s: 1e-3, storativity: 1e-4, leakageFactor_m: 200, wells: [{ well: 'PZ1', distance_m: 20 }, { well: 'PZ2', distance_m: 80 }] });
    const fit = fitHantushCurve(readings, null);
    expect(relative(fit.transmissivity_m2_s!, 1e-3)).toBeLessThan(1e-3);
    expect(relative(fit.storativity!, 1e-4)).toBeLessThan(1e-3);
    expect(relative(fit.leakageFactor_m!, 200)).toBeLessThan(1e-3);
  });

  it('matches scipy.optimize.curve_fit (Hantush W by scipy quad) on the committed noisy data set', () => {
    const fit = fitHantushCurve(referenceReadings('hantush'), 'PZ1');
    const ref = reference.cases.hantush.fit;
    expect(relative(fit.transmissivity_m2_s!, ref.transmissivity_m2_s as number)).toBeLessThan(1e-5);
    expect(relative(fit.storativity!, ref.storativity as number)).toBeLessThan(1e-5);
    expect(relative(fit.leakageFactor_m!, ref.leakageFactor_m as number)).toBeLessThan(1e-5);
    // and within 2 % of the invented truth behind the noise (T 8e-4, S 1e-4, B 150 m)
    expect(relative(fit.transmissivity_m2_s!, 8e-4)).toBeLessThan(0.02);
    expect(relative(fit.leakageFactor_m!, 150)).toBeLessThan(0.02);
  });
});

describe('fitCooperJacob(readings)', () => {
  it('gives T = 2.303·Q/(4π·Δs) and S = 2.25·T·(t/r²)₀ from its straight line (Cooper & Jacob 1946)', () => {
    const readings = syntheticReadings({ rate_m3_s: 0.01, transmissivity_m2_s: 1e-3, storativity: 1e-4, wells: [{ well: 'PZ1', distance_m: 20 }], to_s: 1e6 });
    const fit = fitCooperJacob(readings, 'PZ1', 0.01);
    const line = fit.line!;
    expect(fit.transmissivity_m2_s!).toBeCloseTo((2.303 * 0.01) / (4 * Math.PI * line.slope_m_per_log_cycle), 12);
    expect(fit.storativity!).toBeCloseTo(2.25 * fit.transmissivity_m2_s! * line.zeroDrawdownAbscissa!, 12);
    // With u < 0.01 the Jacob truncation (W ≈ −γ − ln u, error ≈ u) and 2.303 for ln 10 leave < 0.5 %.
    expect(relative(fit.transmissivity_m2_s!, 1e-3)).toBeLessThan(5e-3);
    expect(relative(fit.storativity!, 1e-4)).toBeLessThan(0.02);
    expect(fit.validity.uMax).toBe(0.01);
    expect(fit.validity.fractionSmallU!).toBeGreaterThan(0.3);
  });

  it('warns when little of the test has small u', () => {
    const readings = syntheticReadings({ rate_m3_s: 0.01, transmissivity_m2_s: 1e-4, storativity: 1e-3, wells: [{ well: 'PZ1', distance_m: 50 }], to_s: 3e4 });
    const fit = fitCooperJacob(readings, 'PZ1');
    expect(fit.validity.notes.join(' ')).toMatch(/u < 0.05/);
  });
});
