/**
 * Monitoring follows the receptors: low-level (too much drawdown) triggers for piezometers and
 * receptors, and no default action level for a piezometer outside every excavation (there the
 * designed level stands above the pit target, so a reading exactly as designed was classed "action").
 */
import { describe, expect, it } from 'vitest';
import { buildMonitoringPlan, classifyReading } from '../../../shared/exports';
import type { Scenario } from '../../../shared/schema';
import { engine, expectClose } from './export-test-helpers';

const DAY = 86_400;

/** Invented test site: confined, one well beside a pit, a piezometer inside, one outside, a house. */
function scenario(): Scenario {
  return {
    format: 'drydig.scenario', version: 1, name: 'low triggers test (invented)', groundLevel_m: 12,
    aquifer: { kind: 'confined', conductivity_m_s: 2e-4, base_m: -20, top_m: 0, staticLevel_m: 10, storativity: 2e-4 },
    boundaries: [],
    excavations: [{ id: 'pit', outline: [[10, 0], [30, 0], [30, 20], [10, 20]], formationLevel_m: 7, margin_m: 0.5 }],
    wells: [{ id: 'W1', x: 0, y: 0, radius_m: 0.15, kind: 'deep', rate_m3_s: 0.01 }],
    design: { time_s: 5 * DAY },
    monitoring: {
      piezometers: [
        { id: 'PZ-in', x: 20, y: 10 },
        { id: 'PZ-out', x: 60, y: 40, lowActionLevel_m: 8 },
      ],
    },
    receptors: [
      { id: 'house', kind: 'building', geometry: { type: 'LineString', coordinates: [[40, -10], [40, 10]] }, compressibleLayer: { thickness_m: 4, mv_m2_kN: 3e-4 }, allowableSettlement_m: 0.03, maxDrawdown_m: 5 },
    ],
  } as Scenario;
}

describe('buildMonitoringPlan low-level triggers', () => {
  const plan = buildMonitoringPlan({ scenario: scenario(), engine });
  const [inside, outside] = plan.piezometers;

  it('gives a piezometer outside every excavation no default action level, so a reading as designed is "ok"', () => {
    expect(outside).toMatchObject({ actionLevel_m: null, actionSource: 'outside', excavationId: null });
    expect(inside).toMatchObject({ actionLevel_m: 6.5, actionSource: 'excavation-target', excavationId: 'pit' });
    const designRow = outside!.series.find((r) => r.time_s === 5 * DAY)!;
    const asDesigned = buildMonitoringPlan({
      scenario: scenario(), engine,
      readings: [{ readingId: 1, piezometerId: 'PZ-out', measuredAt: '', time_s: 5 * DAY, level_m: designRow.expectedLevel_m, enteredBy: '', note: '' }],
    });
    expect(asDesigned.piezometers[1]!.readings[0]!.status).toBe('ok');
  });

  it('sets the low alert at expected − 0.3 m and the designer’s low action level', () => {
    for (const r of outside!.series) {
      expectClose(r.expectedLevel_m - r.lowAlertLevel_m, 0.3, { abs: 1e-12 }, 'default low alert offset (common practice)');
      expect(r.lowActionLevel_m).toBe(8);
    }
    expect(inside!.series.every((r) => r.lowActionLevel_m === null)).toBe(true);
  });

  it('classes readings below the low alert and low action levels', () => {
    const row = outside!.series.find((r) => r.time_s === 2 * DAY)!;
    const withReadings = buildMonitoringPlan({
      scenario: scenario(), engine,
      readings: [
        { readingId: 1, piezometerId: 'PZ-out', measuredAt: '', time_s: 2 * DAY, level_m: row.expectedLevel_m - 0.2, enteredBy: '', note: '' },
        { readingId: 2, piezometerId: 'PZ-out', measuredAt: '', time_s: 2 * DAY, level_m: Math.max(8.01, row.expectedLevel_m - 0.5), enteredBy: '', note: '' },
        { readingId: 3, piezometerId: 'PZ-out', measuredAt: '', time_s: 2 * DAY, level_m: 7.9, enteredBy: '', note: '' },
      ],
    });
    expect(row.expectedLevel_m - 0.5).toBeGreaterThan(8.01);
    expect(withReadings.piezometers[1]!.readings.map((r) => r.status)).toEqual(['ok', 'low-alert', 'low-action']);
  });

  it('orders the classes: action, then low action, then the alerts', () => {
    const levels = { alert_m: 9, action_m: 8.5, lowAlert_m: 9.5, lowAction_m: 8 };
    expect(classifyReading(8.6, levels)).toBe('action');
    expect(classifyReading(7.9, { ...levels, action_m: null })).toBe('low-action');
    expect(classifyReading(9.2, { ...levels, action_m: null, lowAlert_m: 8.2 })).toBe('alert');
    expect(classifyReading(8.1, { ...levels, action_m: null, alert_m: 9.5, lowAlert_m: 8.2 })).toBe('low-alert');
  });

  it('gives each receptor low-level rows with its low action level from the smaller limit drawdown', () => {
    const [house] = plan.receptors;
    // Allowable settlement 30 mm on H = 4 m, m_v = 3e-4 m²/kN: Δh = 0.03 / (3e-4 × 9.81 × 4) = 2.5484 m < 5 m limit.
    const dh = 0.03 / (3e-4 * 9.81 * 4);
    expect(house).toMatchObject({ id: 'house', lowActionSource: 'allowable-settlement', lowAlertOffset_m: 0.3 });
    expectClose(house!.lowActionLevel_m!, 10 - dh, { abs: 1e-9 }, 'static − drawdown giving the allowable settlement (hand)');
    expect(house!.series.length).toBe(outside!.series.length);
    // The monitored point is the receptor's most drawn-down sample point: nearest the well.
    expect(Math.hypot(house!.x, house!.y)).toBeCloseTo(40, 6);
    for (const r of house!.series) expectClose(r.expectedLevel_m - r.lowAlertLevel_m, 0.3, { abs: 1e-12 }, 'low alert offset');
  });
});
