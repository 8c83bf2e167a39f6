/**
 * Safe-dig sequence and time to unsafe after a power failure, for one well in an infinite confined
 * aquifer, against Theis (1935) heads and the Theis recovery equation computed with mpmath by
 * scripts/reference/floor-time-checks.py (values in fixtures/reference/floor-time-checks.json).
 */
import { describe, expect, it } from 'vitest';
import { FLOOR_CHECK_DEFAULTS, safeDigSequence, timeUntilHeadAbove } from '../../../shared/floor';
import type { Scenario } from '../../../shared/schema';
import reference from '../../../fixtures/reference/floor-time-checks.json';
import { expectClose } from '../design/design-test-helpers';

const p = reference.parameters;
function scenario(stop_s: number | null): Scenario {
  return {
    format: 'drydig.scenario',
    version: 1,
    name: 'one well under a clay plug (test)',
    groundLevel_m: 15,
    aquifer: { kind: 'confined', conductivity_m_s: p.conductivity_m_s, base_m: -15, top_m: 5, staticLevel_m: p.staticLevel_m, storativity: p.storativity },
    ground: {
      layers: [
        { id: 'clay', top_m: 15, bottom_m: 5, kind: 'plug', unitWeightSat_kN_m3: p.plugUnitWeightSat_kN_m3 },
        { id: 'sand', top_m: 5, bottom_m: -15, kind: 'granular', unitWeightSat_kN_m3: 20 },
      ],
    },
    excavations: [{ id: 'pit', outline: [[10, -5], [20, -5], [20, 5], [10, 5]], formationLevel_m: p.formationLevel_m, margin_m: 0.5 }],
    wells: [
      stop_s === null
        ? { id: 'W1', x: 0, y: 0, radius_m: 0.15, kind: 'deep', rate_m3_s: p.rate_m3_s }
        : { id: 'W1', x: 0, y: 0, radius_m: 0.15, kind: 'deep', schedule: [{ from_s: 0, rate_m3_s: p.rate_m3_s }, { from_s: stop_s, rate_m3_s: 0 }] },
    ],
    design: { time_s: p.stop_s },
  } as Scenario;
}
const point = [[p.distance_m, 0]] as const;

describe('safe-dig sequence', () => {
  it('matches the deepest formation the Theis head allows over the plug, at each time', () => {
    const s = scenario(null);
    const steps = safeDigSequence({ scenario: s, excavation: s.excavations[0]!, options: FLOOR_CHECK_DEFAULTS, points: point, times_s: reference.safeDig.map((r) => r.time_s) });
    steps.forEach((step, i) => expectClose(step.safeFormationLevel_m, reference.safeDig[i]!.safeFormationLevel_m, { abs: 2e-3 }, `t = ${step.time_s} s`));
    // Deepens as the head falls.
    for (let i = 1; i < steps.length; i++) expect(steps[i]!.safeFormationLevel_m).toBeLessThanOrEqual(steps[i - 1]!.safeFormationLevel_m);
  });
});

describe('time to unsafe after a power failure', () => {
  it('matches the Theis recovery equation from the state at the stop', () => {
    const stopped = scenario(p.stop_s);
    const t = timeUntilHeadAbove({ stopped, points: point, stop_s: p.stop_s, level_m: reference.allowableLevel_m, span_s: 1e7 });
    expect(t).not.toBeNull();
    expectClose(t!, reference.timeToUnsafe_s, { rel: 1e-4 });
  });
  it('is 0 when the head already stands above the level at the stop', () => {
    const stopped = scenario(p.stop_s);
    expect(timeUntilHeadAbove({ stopped, points: point, stop_s: p.stop_s, level_m: reference.headAtStop_m - 0.5, span_s: 1e7 })).toBe(0);
  });
});
