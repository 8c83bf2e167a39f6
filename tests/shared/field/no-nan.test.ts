import { describe, expect, it } from 'vitest';
import { evaluateGrid, evaluatePoints, unitResponseMatrix, wellLevels } from '../../../shared/field';
import { DrydigError, validateScenario, type Aquifer, type Boundary, type Scenario } from '../../../shared/schema';
import { confinedAquifer, leakyAquifer, scenarioWith, unconfinedAquifer, well } from './field-test-helpers';

/** Small deterministic generator (xorshift32) so the cases are the same on every run. */
function rng(seed: number): () => number {
  let s = seed >>> 0 || 1;
  return () => {
    s ^= s << 13;
    s >>>= 0;
    s ^= s >>> 17;
    s ^= s << 5;
    s >>>= 0;
    return s / 4294967296;
  };
}

function randomScenario(r: () => number): Scenario {
  const pick = <T>(xs: T[]): T => xs[Math.floor(r() * xs.length)]!;
  const K = 10 ** (-6 + 4 * r());
  const aquifer: Aquifer = pick([confinedAquifer, unconfinedAquifer, leakyAquifer])({ conductivity_m_s: K, ...(r() < 0.5 ? { influenceRadius_m: 5 + 800 * r() } : {}) });
  const wells = Array.from({ length: 1 + Math.floor(r() * 12) }, (_, k) =>
    well(`W${k}`, 60 * (r() - 0.5), 60 * (r() - 0.5), r() < 0.3 ? { schedule: [{ from_s: 0, rate_m3_s: 0.05 * r() }, { from_s: 1e5 * r() + 1, rate_m3_s: 0.05 * (r() - 0.2) }] } : { rate_m3_s: 0.08 * r() - 0.01 }),
  );
  const boundaries: Boundary[] = [];
  const shape = r();
  if (shape < 0.25) boundaries.push({ kind: pick(['constant-head', 'no-flow'] as const), from: [-200, 45], to: [200, 45] });
  else if (shape < 0.5) boundaries.push({ kind: pick(['constant-head', 'no-flow'] as const), from: [-200, 45], to: [200, 45] }, { kind: pick(['constant-head', 'no-flow'] as const), from: [45, -200], to: [45, 200] });
  else if (shape < 0.7) boundaries.push({ kind: pick(['constant-head', 'no-flow'] as const), from: [-200, 45], to: [200, 45] }, { kind: pick(['constant-head', 'no-flow'] as const), from: [200, -45], to: [-200, -45] });
  return scenarioWith({
    aquifer,
    wells,
    boundaries,
    excavations: [{ id: 'pit', outline: [[-10, -10], [10, -10], [10, 10], [-10, 10]], formationLevel_m: 2 + 4 * r(), margin_m: 0.5 }],
    time_s: r() < 0.3 ? null : 10 ** (2 + 5 * r()),
  });
}

describe('the field engine on random valid scenarios', () => {
  // Bounded: 60 scenarios, fixed seed. Each either evaluates to finite numbers or refuses with a DrydigError naming a field.
  it('evaluatePoints, evaluateGrid, wellLevels and unitResponseMatrix never return NaN or throw anything but a DrydigError', () => {
    const r = rng(20261201);
    let evaluated = 0;
    for (let c = 0; c < 60; c++) {
      const scenario = randomScenario(r);
      if (!validateScenario(scenario).ok) continue;
      const points: Array<[number, number]> = Array.from({ length: 12 }, () => [120 * (r() - 0.5), 120 * (r() - 0.5)]);
      try {
        const p = evaluatePoints({ scenario, points });
        for (const pt of p.points) expect(Number.isFinite(pt.level_m) && Number.isFinite(pt.drawdown_m)).toBe(true);
        const g = evaluateGrid({ scenario, grid: { origin: [-50, -50], spacing_m: [10, 10], counts: [11, 11] } });
        expect(Array.from(g.level_m).every(Number.isFinite)).toBe(true);
        for (const w of wellLevels({ scenario })) expect(Number.isFinite(w.pumpingLevel_m)).toBe(true);
        const m = unitResponseMatrix({ scenario, points: points.slice(0, 5) });
        expect(Array.from(m.values).every(Number.isFinite)).toBe(true);
        evaluated++;
      } catch (e) {
        expect(e).toBeInstanceOf(DrydigError);
        expect((e as DrydigError).issues.length).toBeGreaterThan(0);
      }
    }
    expect(evaluated).toBeGreaterThan(25);
  });
});
