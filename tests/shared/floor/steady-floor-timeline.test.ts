/**
 * The floor of a steady design: the safe-dig level at the steady state and the time to unsafe
 * after the pumps stop at the steady state, for one well under a clay plug with a given radius of
 * influence, against the Thiem (1906) head and the steady-cone recovery (Theis 1935 superposition)
 * computed with mpmath by scripts/reference/steady-recovery.py (fixtures/reference/steady-recovery.json;
 * EN 1997-1 UPL recommended factors).
 */
import { describe, expect, it } from 'vitest';
import { FLOOR_CHECK_DEFAULTS, safeDigSequence, safeFormationLevel, safeLevelFinder, timeUntilLevelAbove } from '../../../shared/floor';
import { steadyRecovery } from '../../../shared/field';
import type { Scenario } from '../../../shared/schema';
import reference from '../../../fixtures/reference/steady-recovery.json';
import plug from '../../../fixtures/reference/floor-time-checks.json';
import { expectClose } from '../design/design-test-helpers';

const ref = reference.floor;
const p = plug.parameters;
function scenario(formationLevel_m: number): Scenario {
  return {
    format: 'drydig.scenario',
    version: 1,
    name: 'one well under a clay plug, steady (test)',
    groundLevel_m: 15,
    aquifer: { kind: 'confined', conductivity_m_s: p.conductivity_m_s, base_m: -15, top_m: 5, staticLevel_m: p.staticLevel_m, storativity: p.storativity, influenceRadius_m: ref.influenceRadius_m },
    ground: {
      layers: [
        { id: 'clay', top_m: 15, bottom_m: 5, kind: 'plug', unitWeightSat_kN_m3: p.plugUnitWeightSat_kN_m3 },
        { id: 'sand', top_m: 5, bottom_m: -15, kind: 'granular', unitWeightSat_kN_m3: 20 },
      ],
    },
    excavations: [{ id: 'pit', outline: [[10, -5], [20, -5], [20, 5], [10, 5]], formationLevel_m, margin_m: 0.5 }],
    wells: [{ id: 'W1', x: 0, y: 0, radius_m: 0.15, kind: 'deep', rate_m3_s: ref.rate_m3_s }],
    design: { time_s: null },
  } as Scenario;
}
const point = [[ref.distance_m, 0]] as const;

describe('safe-dig level of a steady design', () => {
  it('is one step at the steady state (time null), the deepest formation the Thiem head allows over the plug', () => {
    const s = scenario(6);
    const steps = safeDigSequence({ scenario: s, excavation: s.excavations[0]!, options: FLOOR_CHECK_DEFAULTS, points: point, times_s: [null] });
    expect(steps).toHaveLength(1);
    expect(steps[0]!.time_s).toBeNull();
    expectClose(steps[0]!.safeFormationLevel_m, ref.safeFormationLevelAtSteady_m, { abs: 2e-3 });
  });
  it('gives the same level from the finder (profile analysed once) as from the one-off call', () => {
    const s = scenario(6);
    const find = safeLevelFinder(s, s.excavations[0]!, FLOOR_CHECK_DEFAULTS);
    for (const head of [5.5, 6.8, ref.steadyHead_m, 9, 14]) expect(find(head)).toBe(safeFormationLevel(s, s.excavations[0]!, FLOOR_CHECK_DEFAULTS, head));
  });
});

describe('time to unsafe after a power failure at the steady state', () => {
  it('matches the steady-cone recovery equation', () => {
    const recover = steadyRecovery(scenario(7));
    expectClose(recover(point, 0)[0]!.level_m, ref.steadyHead_m, { abs: 1e-9 }, 'steady head at the stop');
    const t = timeUntilLevelAbove({ levelsAt: (pts, dt) => recover(pts, dt).map((r) => r.level_m), points: point, level_m: ref.allowableLevelFormation7_m, span_s: 1e7 });
    expect(t).not.toBeNull();
    expectClose(t!, ref.timeToUnsafeFormation7_s, { rel: 1e-4 });
  });
});
