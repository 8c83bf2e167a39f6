import { describe, expect, it } from 'vitest';
import { analyseStepDrawdown, fitTheisRecovery, hazenConductivity, theisDrawdown, type TestReading } from '../../../shared/testing';

const relative = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
const reading = (time_s: number, drawdown_m: number, rate_m3_s: number, line: number, phase: TestReading['phase'] = 'pumping'): TestReading => ({
  time_s,
  drawdown_m,
  rate_m3_s,
  well: 'PW',
  distance_m: 0.15,
  phase,
  line,
});

describe('fitTheisRecovery(readings)', () => {
  it('gives T = 2.303·Q/(4π·Δs′) from residual drawdowns on the exact line s′ = Δs′·log₁₀(t/t′) (Theis 1935 recovery)', () => {
    // Hand calculation: Q = 0.01 m³/s, Δs′ = 0.5 m per log cycle → T = 2.303·0.01/(4π·0.5) = 3.6653e-3 m²/s.
    const stop = 86_400;
    const readings = [600, 1800, 3600, 7200, 14_400, 28_800, 57_600].map((tp, i) => reading(stop + tp, 0.5 * Math.log10((stop + tp) / tp), 0.01, i + 2, 'recovery'));
    const fit = fitTheisRecovery(readings, 'PW', { stop_s: stop });
    expect(fit.transmissivity_m2_s!).toBeCloseTo((2.303 * 0.01) / (4 * Math.PI * 0.5), 12);
    expect(fit.line!.slope_m_per_log_cycle).toBeCloseTo(0.5, 12);
    expect(fit.storativity).toBeNull();
  });

  it('recovers T to 1 % from Theis recovery (superposed injection) where u′ is small', () => {
    const [Q, T, S, r, stop] = [0.01, 1e-3, 1e-4, 20, 2e5];
    const readings = Array.from({ length: 30 }, (_, k) => {
      const tp = 60 * 10 ** ((k * 4) / 29);
      return reading(stop + tp, theisDrawdown(Q, T, S, r, stop + tp) - theisDrawdown(Q, T, S, r, tp), Q, k + 2, 'recovery');
    }).map((x) => ({ ...x, distance_m: r }));
    const fit = fitTheisRecovery(readings, 'PZ1', { stop_s: stop, storativity: S, transmissivity_m2_s: T });
    expect(relative(fit.transmissivity_m2_s!, T)).toBeLessThan(0.01);
    expect(fit.validity.fractionSmallU!).toBeGreaterThan(0.3);
  });
});

describe('analyseStepDrawdown(readings)', () => {
  it('gives B and C of s_w = B·Q + C·Q² and the efficiency B·Q/(B·Q + C·Q²) (Jacob 1947)', () => {
    // Hand calculation: B = 400 s/m², C = 2000 s²/m⁵; steps 5, 10, 15, 20 L/s →
    // s_w = 2 + 0.05, 4 + 0.2, 6 + 0.45, 8 + 0.8 = 2.05, 4.2, 6.45, 8.8 m; efficiency at 20 L/s = 8/8.8.
    const B = 400;
    const C = 2000;
    const rates = [0.005, 0.01, 0.015, 0.02];
    const readings = rates.flatMap((q, i) => [reading(3600 * i + 1800, 0.9 * (B * q + C * q * q), q, 2 * i + 2), reading(3600 * (i + 1), B * q + C * q * q, q, 2 * i + 3)]);
    const fit = analyseStepDrawdown(readings, 'PW');
    expect(fit.linearLoss_s_m2!).toBeCloseTo(B, 8);
    expect(fit.wellLoss_s2_m5!).toBeCloseTo(C, 6);
    expect(fit.steps!.map((s) => s.drawdown_m)).toEqual([2.05, 4.2, 6.45, 8.8].map((v) => expect.closeTo(v, 12)));
    expect(fit.steps![3]!.efficiency).toBeCloseTo(8 / 8.8, 12);
  });

  it('says a negative well loss does not follow the model', () => {
    const readings = [0.005, 0.01, 0.015].map((q, i) => reading(3600 * (i + 1), 500 * q - 1e4 * q * q, q, i + 2));
    expect(analyseStepDrawdown(readings, 'PW').validity.notes.join(' ')).toMatch(/negative/);
  });

  it('refuses a test with one rate', () => {
    expect(() => analyseStepDrawdown([reading(60, 1, 0.01, 2), reading(120, 1.2, 0.01, 3)], 'PW')).toThrow(/at least 2 steps/);
  });
});

describe('hazenConductivity({ d10_mm })', () => {
  it('gives K = C·d10² (Hazen; k cm/s = 100·(d10 cm)²): d10 = 0.2 mm → 4e-4 m/s', () => {
    // Hand calculation: 100 × (0.02 cm)² = 0.04 cm/s = 4e-4 m/s.
    const e = hazenConductivity({ d10_mm: 0.2 });
    expect(e.conductivity_m_s).toBeCloseTo(4e-4, 15);
    expect(e.valid).toBe(true);
  });

  it('flags d10 outside 0.1–3 mm and a uniformity coefficient of 5 or more', () => {
    expect(hazenConductivity({ d10_mm: 0.05 }).valid).toBe(false);
    expect(hazenConductivity({ d10_mm: 0.3, uniformityCoefficient: 8 }).notes.join(' ')).toMatch(/uniform/);
  });
});
