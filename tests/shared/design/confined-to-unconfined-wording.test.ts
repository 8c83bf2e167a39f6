import { describe, expect, it } from 'vitest';
import { runDesign } from '../../../shared/design';
import { CONFINED_TO_UNCONFINED_EFFECT, evaluatePoints } from '../../../shared/field';
import type { Scenario } from '../../../shared/schema';
import { ringScenario } from './design-test-helpers';

/**
 * Steady single well in a confined aquifer whose head falls below the top near the well: the
 * combined confined–unconfined discharge potential (Girinskii 1946; Bear 1972 §8.2, closed form)
 * Φ(h) = K·(b·h − b²/2) for h ≥ b, K·h²/2 below (h above the base), Q = 2π·(Φ(H) − Φ(h_w))/ln(R/r).
 */
function girinskiiLevelAboveBase(options: { Q: number; K: number; b: number; H: number; R: number; r: number }): number {
  const { Q, K, b, H, R, r } = options;
  const phiH = K * (b * H - (b * b) / 2);
  const phi = phiH - (Q * Math.log(R / r)) / (2 * Math.PI);
  return phi >= (K * b * b) / 2 ? phi / (K * b) + b / 2 : Math.sqrt((2 * phi) / K);
}

describe('confined → unconfined wording', () => {
  it('the confined solution understates the steady drawdown where the head falls below the top (closed form, Girinskii 1946)', () => {
    // Invented: K = 1e-4 m/s, b = 10 m, static head 14 m above the base, R = 300 m, Q = 0.006 m³/s, r = 0.3 m.
    const o = { Q: 0.006, K: 1e-4, b: 10, H: 14, R: 300, r: 0.3 };
    const confinedDrawdown = (o.Q * Math.log(o.R / o.r)) / (2 * Math.PI * o.K * o.b);
    const realDrawdown = o.H - girinskiiLevelAboveBase(o);
    expect(o.H - confinedDrawdown).toBeLessThan(o.b); // the head is below the top: the case in question
    expect(realDrawdown).toBeGreaterThan(confinedDrawdown);
    expect(CONFINED_TO_UNCONFINED_EFFECT).toMatch(/at steady state it understates the drawdown/);
  });

  it('design caution and model note make the same statement (no "overstates the drawdown" at steady state)', async () => {
    const base = ringScenario({ kind: 'confined', n: 8, ringRadius_m: 30, pitRadius_m: 15 });
    // Target −1.5 m below the aquifer top at 0 m: the check points turn unconfined.
    const scenario: Scenario = { ...base, excavations: [{ ...base.excavations[0]!, formationLevel_m: -1, margin_m: 0.5 }] };
    const result = await runDesign({ scenario, mode: 'uniform' });
    const caution = result.cautions.find((c) => c.includes('below the aquifer top'));
    expect(caution, result.cautions.join('\n')).toBeDefined();
    expect(caution).toContain(CONFINED_TO_UNCONFINED_EFFECT);
    expect(caution).not.toMatch(/confined solution overstates the drawdown/);
    const note = evaluatePoints({ scenario, points: [], time_s: null }).model.notes.find((n) => n.includes('confined-to-unconfined'));
    expect(note).toContain(CONFINED_TO_UNCONFINED_EFFECT);
  });
});
