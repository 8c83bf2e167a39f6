/**
 * Receptor settlement and angular distortion against hand calculations.
 * - One-dimensional consolidation s = m_v·Δσ′·H with Δσ′ = γw·Δh (Craig's Soil Mechanics, the
 *   consolidation-settlement chapter; Powrie, Soil Mechanics: Concepts and Applications — from memory).
 * - Angular distortion β = Δs/L between neighbouring points (Skempton & MacDonald 1956; Burland &
 *   Wroth 1974 — from memory).
 * - The drawdown at a receptor from one well, steady, confined: Thiem (1906) s = Q/(2πT)·ln(R/r).
 */
import { describe, expect, it } from 'vitest';
import { angularDistortions, assessReceptors, consolidationSettlement, drawdownForSettlement, receptorSamplePoints } from '../../../shared/receptors';
import { DEFAULT_ALLOWABLE_ANGULAR_DISTORTION, type Scenario } from '../../../shared/schema';
import { expectClose } from '../design/design-test-helpers';

describe('consolidationSettlement({ drawdown_m, layer })', () => {
  // Hand calculation: m_v = 0.3 m²/MN = 3e-4 m²/kN, H = 4 m, Δh = 2 m, γw = 9.81 kN/m³:
  // Δσ′ = 9.81 × 2 = 19.62 kPa; s = 3e-4 × 19.62 × 4 = 0.023544 m.
  it.each([
    { layer: { thickness_m: 4, mv_m2_kN: 3e-4 }, drawdown_m: 2, stress_kPa: 19.62, settlement_m: 0.023544, what: 'm_v given' },
    { layer: { thickness_m: 4, oedometerModulus_kPa: 1 / 3e-4 }, drawdown_m: 2, stress_kPa: 19.62, settlement_m: 0.023544, what: 'E_oed = 1/m_v given' },
    // Linear head change over the layer: mean Δh = 1 m, Δσ′ = 9.81 kPa, s = 3e-4 × 9.81 × 4 = 0.011772 m.
    { layer: { thickness_m: 4, mv_m2_kN: 3e-4, headChange: 'linear' as const }, drawdown_m: 2, stress_kPa: 9.81, settlement_m: 0.011772, what: 'linear profile (mean Δh/2)' },
    // Soft clay: m_v = 1.5 m²/MN, H = 6 m, Δh = 3.5 m: Δσ′ = 34.335 kPa; s = 1.5e-3 × 34.335 × 6 = 0.309015 m.
    { layer: { thickness_m: 6, mv_m2_kN: 1.5e-3 }, drawdown_m: 3.5, stress_kPa: 34.335, settlement_m: 0.309015, what: 'soft clay' },
  ])('gives s = m_v·γw·Δh·H by hand ($what)', ({ layer, drawdown_m, stress_kPa, settlement_m }) => {
    const r = consolidationSettlement({ drawdown_m, layer });
    expectClose(r.effectiveStressRise_kPa, stress_kPa, { rel: 1e-12 }, 'Δσ′ = γw·Δh (hand calculation)');
    expectClose(r.settlement_m, settlement_m, { rel: 1e-12 }, 's = m_v·Δσ′·H (Craig, hand calculation)');
  });

  it('inverts to the drawdown that gives an allowable settlement', () => {
    const layer = { thickness_m: 4, mv_m2_kN: 3e-4 };
    expectClose(drawdownForSettlement(0.023544, layer), 2, { rel: 1e-12 }, 'inverse of the hand calculation');
  });
});

describe('angularDistortions(points, settlements)', () => {
  it('gives β = |Δs|/L for each neighbouring pair on a three-point case', () => {
    // Points at x = 0, 10, 30 m settling 10, 30 and 25 mm: β₁ = 0.020/10 = 1/500, β₂ = 0.005/20 = 1/4000.
    const out = angularDistortions([[0, 0], [10, 0], [30, 0]], [0.01, 0.03, 0.025]);
    expect(out).toHaveLength(2);
    expectClose(out[0]!.angularDistortion, 1 / 500, { rel: 1e-12 }, 'β between points 1 and 2 (hand)');
    expectClose(out[1]!.angularDistortion, 1 / 4000, { rel: 1e-12 }, 'β between points 2 and 3 (hand)');
    expectClose(out[1]!.differentialSettlement_m, -0.005, { rel: 1e-12 }, 'Δs between points 2 and 3 (hand)');
    expect(out[1]!.length_m).toBe(20);
  });
});

describe('assessReceptors({ scenario, designTime_s })', () => {
  // Invented site: one well, confined, steady, R = 300 m; T = K·b = 1e-4 × 20 = 2e-3 m²/s; Q = 5 L/s.
  const Q = 0.005;
  const T = 2e-3;
  const R = 300;
  const thiem = (r: number) => (Q / (2 * Math.PI * T)) * Math.log(R / r);
  const scenario = (receptors: unknown[]): Scenario =>
    ({
      format: 'drydig.scenario', version: 1, name: 'receptor test (invented)', groundLevel_m: 12,
      aquifer: { kind: 'confined', conductivity_m_s: 1e-4, base_m: -20, top_m: 0, staticLevel_m: 10, storativity: 1e-4, influenceRadius_m: R },
      boundaries: [], excavations: [], wells: [{ id: 'W1', x: 0, y: 0, radius_m: 0.2, kind: 'deep', rate_m3_s: Q }],
      design: { time_s: null }, receptors,
    }) as Scenario;

  it('settles a three-point wall by m_v·γw·s·H with Thiem drawdowns, and finds its largest β', () => {
    const layer = { thickness_m: 5, mv_m2_kN: 5e-4 };
    const pts: Array<[number, number]> = [[20, 0], [40, 0], [80, 0]];
    const [r] = assessReceptors({ scenario: scenario([{ id: 'wall', kind: 'wall', geometry: { type: 'LineString', coordinates: pts }, compressibleLayer: layer, allowableSettlement_m: 0.1 }]), designTime_s: null });
    const s = pts.map(([x]) => 5e-4 * 9.81 * thiem(x) * 5);
    r!.points.forEach((p, i) => {
      expectClose(p.drawdown_m, thiem(pts[i]![0]), { rel: 1e-9 }, `Thiem drawdown at point ${i}`);
      expectClose(p.settlement_m!, s[i]!, { rel: 1e-9 }, `settlement at point ${i} (hand: m_v·γw·s·H)`);
    });
    const beta = [Math.abs(s[1]! - s[0]!) / 20, Math.abs(s[2]! - s[1]!) / 40];
    expectClose(r!.maxAngularDistortion!, Math.max(...beta), { rel: 1e-9 }, 'largest β (hand)');
    expect(r!.criticalSegment).toBe(beta[0]! > beta[1]! ? 0 : 1);
    expect(r!.allowableAngularDistortion).toBe(DEFAULT_ALLOWABLE_ANGULAR_DISTORTION);
    const exceeds = Math.max(...beta) > 1 / 500;
    expect(r!.flags.includes('angular-distortion-exceeds')).toBe(exceeds);
    expect(r!.status).toBe(exceeds ? 'exceeds' : 'ok');
  });

  it('flags a point receptor over its drawdown limit and one without a layer', () => {
    const out = assessReceptors({
      scenario: scenario([
        { id: 'pond', kind: 'pond', geometry: { type: 'Point', coordinates: [30, 0] }, maxDrawdown_m: 0.5 },
        { id: 'old-well', kind: 'well', geometry: { type: 'Point', coordinates: [250, 0] }, maxDrawdown_m: 0.5 },
      ]),
      designTime_s: null,
    });
    expect(thiem(30)).toBeGreaterThan(0.5);
    expect(out[0]).toMatchObject({ status: 'exceeds', settlement_m: null, maxAngularDistortion: null });
    expect(out[0]!.flags).toEqual(['no-compressible-layer', 'drawdown-exceeds']);
    expect(out[1]).toMatchObject({ status: 'ok' });
  });

  it('samples a polyline at most 5 m apart between its own points', () => {
    const pts = receptorSamplePoints({ id: 'p', kind: 'service', geometry: { type: 'LineString', coordinates: [[0, 0], [12, 0]] } });
    expect(pts).toEqual([[0, 0], [12, 0], [4, 0], [8, 0]]);
  });
});
