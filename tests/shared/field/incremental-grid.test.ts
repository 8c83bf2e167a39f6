/**
 * The incremental grid (one well's share replaced per drag frame) against a full evaluateGrid
 * after every step of random drags, rate edits, additions and deletions: levels and drawdowns to
 * 1e-9 m and the same flags on every node (issue 15's exactness contract). Seeded, so a failure
 * replays.
 */
import { describe, expect, it } from 'vitest';
import { evaluateGrid, IncrementalGrid, type GridSpec } from '../../../shared/field';
import type { Scenario, Well } from '../../../shared/schema';
import { confinedAquifer, leakyAquifer, scenarioWith, unconfinedAquifer, well } from './field-test-helpers';

/** Park–Miller, so the sequence is the same on every run. */
function seeded(seed: number): () => number {
  let s = seed;
  return () => (s = (s * 48271) % 2147483647) / 2147483647;
}

const grid: GridSpec = { origin: [-80.5, -60.25], spacing_m: [3.1, 2.9], counts: [55, 43] };

function ring(n: number, extra: Partial<Well> = {}): Well[] {
  return Array.from({ length: n }, (_, k) => {
    const a = (2 * Math.PI * k) / n;
    return well(`W${k}`, 35 * Math.cos(a), 25 * Math.sin(a), { rate_m3_s: 0.002 + 0.0002 * (k % 3), ...extra });
  });
}

function expectSameGrid(actual: ReturnType<typeof evaluateGrid>, expected: ReturnType<typeof evaluateGrid>, label: string): void {
  let worst = 0;
  for (let k = 0; k < expected.level_m.length; k++) {
    worst = Math.max(worst, Math.abs(actual.level_m[k]! - expected.level_m[k]!), Math.abs(actual.drawdown_m[k]! - expected.drawdown_m[k]!));
    if (actual.flags[k] !== expected.flags[k]) expect.fail(`${label}: flags differ at node ${k}: ${actual.flags[k]} vs ${expected.flags[k]}`);
  }
  expect(worst, label).toBeLessThanOrEqual(1e-9);
  expect(actual.flagCounts, label).toEqual(expected.flagCounts);
}

const cases: Array<[string, Scenario, number | null]> = [
  ['Theis with a no-flow line', scenarioWith({ aquifer: confinedAquifer(), wells: ring(12), boundaries: [{ kind: 'no-flow', from: [70, -200], to: [70, 200] }] }), 86400],
  ['Thiem (R = 90 m) with a constant-head line', scenarioWith({ aquifer: confinedAquifer({ influenceRadius_m: 90 }), wells: ring(10), boundaries: [{ kind: 'constant-head', from: [-200, 50], to: [200, 50] }] }), null],
  ['unconfined transient', scenarioWith({ aquifer: unconfinedAquifer(), wells: ring(8, { rate_m3_s: 0.001 }) }), 3 * 86400],
  ['leaky transient', scenarioWith({ aquifer: leakyAquifer(), wells: ring(8) }), 86400],
  ['leaky steady', scenarioWith({ aquifer: leakyAquifer(), wells: ring(8) }), null],
  ['Theis between two parallel no-flow lines', scenarioWith({ aquifer: confinedAquifer(), wells: ring(6), boundaries: [{ kind: 'no-flow', from: [-200, 45], to: [200, 45] }, { kind: 'no-flow', from: [-200, -45], to: [200, -45] }] }), 86400],
];

describe('IncrementalGrid', () => {
  it.each(cases)('equals a full evaluation after each of 40 random edits: %s', (name, start, time_s) => {
    const random = seeded(name.length * 7919);
    const inc = new IncrementalGrid(grid, time_s);
    let scenario = structuredClone(start);
    expectSameGrid(inc.evaluate(scenario), evaluateGrid({ scenario, grid, time_s }), `${name}, start`);
    let incrementalSteps = 0;
    let next = 100;
    for (let step = 0; step < 40; step++) {
      const s = structuredClone(scenario);
      const r = random();
      const k = Math.floor(random() * s.wells.length);
      if (r < 0.6 && s.wells.length > 0) {
        // A drag: a few metres, sometimes onto a grid node or close to another well.
        s.wells[k]!.x += (random() - 0.5) * 12;
        s.wells[k]!.y += (random() - 0.5) * 12;
      } else if (r < 0.75 && s.wells.length > 0) {
        s.wells[k]!.rate_m3_s = 0.0005 + random() * 0.004;
      } else if (r < 0.88) {
        s.wells.push(well(`N${next++}`, (random() - 0.5) * 100, (random() - 0.5) * 70, { rate_m3_s: 0.001 + random() * 0.002 }));
      } else if (s.wells.length > 2) {
        s.wells.splice(k, 1);
      }
      scenario = s;
      const got = inc.evaluate(scenario);
      if (inc.stats.mode === 'incremental') incrementalSteps++;
      expectSameGrid(got, evaluateGrid({ scenario, grid, time_s }), `${name}, step ${step} (${inc.stats.mode}${inc.stats.reason ? `: ${inc.stats.reason}` : ''})`);
    }
    // Parallel lines take more image terms as the total rate grows: those steps go in full.
    expect(incrementalSteps).toBeGreaterThan(name.includes('parallel') ? 0 : 30);
  });

  it('replaces only the moved well’s share, and goes in full when anything but wells changes', () => {
    const scenario = cases[0]![1];
    const inc = new IncrementalGrid(grid, 86400);
    inc.evaluate(scenario);
    const moved = structuredClone(scenario);
    moved.wells[3]!.x += 2.5;
    inc.evaluate(moved);
    expect(inc.stats).toEqual({ mode: 'incremental', wellsChanged: 1 });
    inc.evaluate(moved);
    expect(inc.stats).toEqual({ mode: 'incremental', wellsChanged: 0 });
    const wetter = { ...moved, aquifer: { ...moved.aquifer, conductivity_m_s: moved.aquifer.conductivity_m_s * 2 } };
    expectSameGrid(inc.evaluate(wetter), evaluateGrid({ scenario: wetter, grid, time_s: 86400 }), 'K doubled');
    expect(inc.stats.mode).toBe('full');
    expect(inc.stats.reason).toBe('the scenario changed beyond its wells');
    inc.evaluate(wetter, 'full');
    expect(inc.stats.reason).toBe('full evaluation asked for');
  });

  it('updates partially penetrating wells well by well too, and goes in full when a screen changes the tables', () => {
    const wells = ring(6, { screenTop_m: -5, screenBottom_m: -12 });
    const scenario = scenarioWith({ aquifer: confinedAquifer(), wells });
    const inc = new IncrementalGrid(grid, 86400);
    inc.evaluate(scenario);
    let s = scenario;
    const random = seeded(17);
    for (let step = 0; step < 12; step++) {
      s = structuredClone(s);
      const k = Math.floor(random() * s.wells.length);
      if (step === 6) s.wells[k]!.screenBottom_m = -15; // a longer screen: its own share changes
      else { s.wells[k]!.x += (random() - 0.5) * 8; s.wells[k]!.y += (random() - 0.5) * 8; }
      expectSameGrid(inc.evaluate(s), evaluateGrid({ scenario: s, grid, time_s: 86400 }), `step ${step} (${inc.stats.mode})`);
      expect(inc.stats.mode, `step ${step}`).toBe('incremental');
    }
    // A well with a smaller radius moves where the correction tables start: all in full.
    s = structuredClone(s);
    s.wells[0]!.radius_m = 0.03;
    expectSameGrid(inc.evaluate(s), evaluateGrid({ scenario: s, grid, time_s: 86400 }), 'smaller radius');
    expect(inc.stats).toMatchObject({ mode: 'full', reason: 'the partial-penetration tables changed' });
  });
});
