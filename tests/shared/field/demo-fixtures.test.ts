import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { evaluateGrid, evaluatePoints, wellLevels } from '../../../shared/field';
import { parseScenario } from '../../../shared/schema';

// The invented demo sites (fixtures/README.md): the engine runs them end to end without NaN and
// carries its cautions. No expected numbers here — the demo data is invented.
const load = (name: string) => parseScenario(JSON.parse(readFileSync(new URL(`../../../fixtures/${name}.json`, import.meta.url), 'utf8')));

describe.each(['demo-wellpoints-unconfined', 'demo-deepwells-confined'])('the engine on %s', (name) => {
  const scenario = load(name);
  const [x0, y0] = scenario.excavations[0]!.outline[0]!;

  it.each([undefined, null])('evaluateGrid (time %s) returns finite levels and the caution note', (time_s) => {
    const g = evaluateGrid({ scenario, grid: { origin: [x0 - 100, y0 - 100], spacing_m: [4, 4], counts: [60, 60] }, time_s });
    expect(Array.from(g.level_m).every(Number.isFinite)).toBe(true);
    expect(Array.from(g.drawdown_m).every(Number.isFinite)).toBe(true);
    expect(g.model.notes.join(' ')).toMatch(/licensed engineer/);
  });

  it('evaluatePoints and wellLevels draw the excavation down without NaN', () => {
    const p = evaluatePoints({ scenario, points: scenario.excavations[0]!.outline });
    for (const pt of p.points) expect(pt.drawdown_m).toBeGreaterThan(0);
    for (const w of wellLevels({ scenario })) expect(Number.isFinite(w.pumpingLevel_m)).toBe(true);
  });
});
