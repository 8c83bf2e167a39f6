import { describe, expect, it } from 'vitest';
import { runMonitoringJob } from '../../../client/worker/monitoring-job';
import { evaluatePoints } from '../../../shared/field';
import { buildMonitoringPlan } from '../../../shared/exports';
import { DEFAULT_ALERT_OFFSET_M, type Monitoring, type Scenario } from '../../../shared/schema';
import demo from '../../../fixtures/demo-wellpoints-unconfined.json';

type WithMonitoring = Scenario & { monitoring: Monitoring };

/** One well at the origin in a confined aquifer, steady state with R given: Thiem (1906) applies exactly. */
function thiemScenario(): WithMonitoring {
  return {
    format: 'drydig.scenario', version: 1, name: 'Thiem check', groundLevel_m: 20,
    aquifer: { kind: 'confined', conductivity_m_s: 1e-4, base_m: -10, top_m: 5, staticLevel_m: 15, storativity: 1e-4, influenceRadius_m: 500 },
    boundaries: [],
    excavations: [{ id: 'pit', outline: [[-10, -10], [10, -10], [10, 10], [-10, 10]], formationLevel_m: 14, margin_m: 0.5 }],
    wells: [{ id: 'W', x: 0, y: 0, radius_m: 0.2, kind: 'deep', rate_m3_s: 0.01 }],
    design: { time_s: null },
    monitoring: {
      piezometers: [
        { id: 'PZ1', x: 5, y: 0 },
        { id: 'PZ2', x: 30, y: 40, alertOffset_m: 0.5, actionLevel_m: 14.2 },
      ],
    },
  };
}

// Thiem (1906): s = Q/(2πT)·ln(R/r), T = K·b = 1e-4 × 15 = 1.5e-3 m²/s, Q = 0.01 m³/s, R = 500 m.
const thiem = (r: number) => (0.01 / (2 * Math.PI * 1.5e-3)) * Math.log(500 / r);
const close = (a: number, b: number, tol = 1e-9) => Math.abs(a - b) <= tol;

describe('runMonitoringJob(request) plans one piezometer as the site team gets it', () => {
  it.each([
    // [id, r from the well (m), alert offset (m), action level (m), action source]
    ['PZ1', 5, DEFAULT_ALERT_OFFSET_M, 14 - 0.5, 'excavation-target'],
    ['PZ2', 50, 0.5, 14.2, 'designer'],
  ] as const)('gives %s the Thiem level at r = %d m, the alert offset and the action level', (id, r, offset, action, source) => {
    const res = runMonitoringJob({ kind: 'monitoring', id: 7, scenario: thiemScenario(), piezometerId: id });
    expect(res.id).toBe(7);
    const p = res.piezometer!;
    expect(p.id).toBe(id);
    expect(p.series).toHaveLength(1); // steady state: one row, no time
    const row = p.series[0]!;
    expect(row.time_s).toBeNull();
    expect(close(row.expectedLevel_m, 15 - thiem(r))).toBe(true);
    expect(close(row.alertLevel_m, 15 - thiem(r) + offset)).toBe(true);
    expect(p.actionLevel_m).toBe(action);
    expect(p.actionSource).toBe(source);
    expect(res.interval_s).toBeNull();
    expect(res.staticLevel_m).toBe(15);
  });

  it('answers null for an id the scenario does not hold, and for a scenario with no monitoring', () => {
    expect(runMonitoringJob({ kind: 'monitoring', id: 1, scenario: thiemScenario(), piezometerId: 'PZ9' }).piezometer).toBeNull();
    const { monitoring: _dropped, ...bare } = thiemScenario();
    expect(runMonitoringJob({ kind: 'monitoring', id: 2, scenario: bare as Scenario, piezometerId: 'PZ1' }).piezometer).toBeNull();
  });

  it('matches the server\'s buildMonitoringPlan row for row on the well-point demo (the same numbers the site view shows)', () => {
    const scenario = demo as unknown as WithMonitoring;
    const full = buildMonitoringPlan({ scenario, engine: { evaluatePoints } });
    expect(full.piezometers.length).toBe(scenario.monitoring.piezometers.length);
    for (const expected of full.piezometers) {
      const res = runMonitoringJob({ kind: 'monitoring', id: 3, scenario, piezometerId: expected.id });
      expect(res.piezometer).toEqual(expected);
      expect(res.pumpingStart).toBe(scenario.monitoring.pumpingStart);
      // t = 0 is the static level by definition; afterwards the level falls (the wells abstract).
      expect(res.piezometer!.series[0]!.expectedLevel_m).toBe(scenario.aquifer.staticLevel_m);
      expect(res.piezometer!.series.at(-1)!.expectedLevel_m).toBeLessThan(scenario.aquifer.staticLevel_m);
    }
  });
});
