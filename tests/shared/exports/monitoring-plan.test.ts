/**
 * buildMonitoringPlan: expected levels at piezometers over time, alert and action levels, and
 * readings assessed against the design. Reference levels: Theis (1935) superposed in space and
 * time, computed with mpmath by reference/monitoring_theis.py (versions in its JSON output).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { buildMonitoringPlan, monitoringTimes, writeMonitoringCsv } from '../../../shared/exports';
import type { Scenario } from '../../../shared/schema';
import { engine, expectClose } from './export-test-helpers';

const reference = JSON.parse(readFileSync(new URL('./reference/monitoring_theis.json', import.meta.url), 'utf8')) as {
  rows: Array<{ time_d: number; level_m: number }>;
};
const DAY = 86_400;

/** Invented test site: confined, two wells, the second stops after 5 days. */
function scenario(): Scenario {
  return {
    format: 'drydig.scenario', version: 1, name: 'monitoring test (invented)', groundLevel_m: 12,
    aquifer: { kind: 'confined', conductivity_m_s: 2e-4, base_m: -20, top_m: 0, staticLevel_m: 10, storativity: 2e-4 },
    boundaries: [],
    excavations: [{ id: 'pit', outline: [[10, 0], [30, 0], [30, 20], [10, 20]], formationLevel_m: 7, margin_m: 0.5 }],
    wells: [
      { id: 'W1', x: 0, y: 0, radius_m: 0.15, kind: 'deep', rate_m3_s: 0.01 },
      { id: 'W2', x: 50, y: 0, radius_m: 0.15, kind: 'deep', schedule: [{ from_s: 0, rate_m3_s: 0.008 }, { from_s: 5 * DAY, rate_m3_s: 0 }] },
    ],
    design: { time_s: 5 * DAY },
    monitoring: {
      pumpingStart: '2027-03-01T07:00:00Z',
      piezometers: [
        { id: 'PZ-in', x: 20, y: 10 },
        { id: 'PZ-out', x: 60, y: 40, alertOffset_m: 0.5, actionLevel_m: 8.5 },
      ],
    },
  } as Scenario;
}

describe('monitoringTimes(scenario)', () => {
  it('runs daily from 0 to a week past the last rate change, with 1, 3, 6 and 12 h rows first', () => {
    const times = monitoringTimes(scenario());
    expect(times?.interval_s).toBe(DAY);
    expect(times?.times_s.slice(0, 6)).toEqual([0, 3600, 3 * 3600, 6 * 3600, 12 * 3600, DAY]);
    expect(times?.times_s.at(-1)).toBe(12 * DAY);
    expect(times?.times_s).toHaveLength(17);
  });

  it('widens the interval so a long horizon stays within 400 rows', () => {
    const s = scenario();
    s.design.time_s = 1000 * DAY;
    const times = monitoringTimes(s);
    expect(times!.times_s.length).toBeLessThanOrEqual(404);
    expect(times!.interval_s % 3600).toBe(0);
  });
});

describe('buildMonitoringPlan({ scenario, engine })', () => {
  const plan = buildMonitoringPlan({ scenario: scenario(), engine });
  const inside = plan.piezometers[0]!;

  it.each(reference.rows)('expects the Theis level at day $time_d (mpmath reference)', ({ time_d, level_m }) => {
    const row = inside.series.find((r) => r.time_s === time_d * DAY);
    expect(row).toBeDefined();
    expectClose(row!.expectedLevel_m, level_m, { abs: 1e-6 }, 'Theis superposition, mpmath (reference/monitoring_theis.py)');
  });

  it('starts at the static level and dates each row from the pumping start', () => {
    expect(inside.series[0]).toMatchObject({ time_s: 0, expectedLevel_m: 10, at: '2027-03-01T07:00:00.000Z' });
    expect(inside.series.find((r) => r.time_s === 2 * DAY)!.at).toBe('2027-03-03T07:00:00.000Z');
  });

  it('sets alert = expected + 0.3 m by default, and the designer’s offset when given', () => {
    for (const r of inside.series) expectClose(r.alertLevel_m - r.expectedLevel_m, 0.3, { abs: 1e-12 }, 'default alert offset (common practice)');
    const outside = plan.piezometers[1]!;
    for (const r of outside.series) expectClose(r.alertLevel_m - r.expectedLevel_m, 0.5, { abs: 1e-12 }, 'designer offset');
  });

  it('defaults the action level to the containing excavation’s target, from the design time on', () => {
    expect(inside).toMatchObject({ actionLevel_m: 6.5, actionSource: 'excavation-target', excavationId: 'pit', actionFrom_s: 5 * DAY });
    expect(inside.series.find((r) => r.time_s === 4 * DAY)!.actionLevel_m).toBeNull();
    expect(inside.series.find((r) => r.time_s === 5 * DAY)!.actionLevel_m).toBe(6.5);
    expect(plan.piezometers[1]).toMatchObject({ actionLevel_m: 8.5, actionSource: 'designer' });
  });

  it('assesses readings against the expected level at the moment they were taken', () => {
    const withReadings = buildMonitoringPlan({
      scenario: scenario(), engine,
      readings: [
        { readingId: 1, piezometerId: 'PZ-in', measuredAt: '2027-03-02T07:00:00Z', time_s: DAY, level_m: reference.rows[0]!.level_m + 0.1, enteredBy: '', note: '' },
        { readingId: 2, piezometerId: 'PZ-in', measuredAt: '2027-03-03T07:00:00Z', time_s: 2 * DAY, level_m: reference.rows[1]!.level_m + 0.45, enteredBy: '', note: '' },
        { readingId: 3, piezometerId: 'PZ-in', measuredAt: '2027-03-06T07:00:00Z', time_s: 5 * DAY, level_m: 6.9, enteredBy: '', note: '' },
      ],
    });
    const [a, b, c] = withReadings.piezometers[0]!.readings;
    expectClose(a!.departure_m, 0.1, { abs: 1e-6 }, 'reading − Theis level');
    expect(a!.status).toBe('ok');
    expect(b!.status).toBe('alert');
    expect(c!.status).toBe('action');
  });

  it('reports a plan with no piezometers as absent rather than failing', () => {
    const s = scenario();
    delete (s as Record<string, unknown>).monitoring;
    const empty = buildMonitoringPlan({ scenario: s, engine });
    expect(empty.present).toBe(false);
    expect(empty.piezometers).toEqual([]);
  });
});

describe('writeMonitoringCsv(plan)', () => {
  it('writes one row per piezometer and time with levels to the millimetre, and the cautions', () => {
    const csv = writeMonitoringCsv(buildMonitoringPlan({ scenario: scenario(), engine }));
    const lines = csv.trimEnd().split('\r\n');
    expect(lines[0]).toBe('piezometer_id,time_s,time_d,date_time,expected_level_m,alert_level_m,action_level_m,flags');
    const day1 = lines.find((l) => l.startsWith('PZ-in,86400,'))!.split(',');
    expect(Number(day1[4])).toBe(Number(reference.rows[0]!.level_m.toFixed(3)));
    expect(lines.filter((l) => l.startsWith('PZ-')).length).toBe(34);
    expect(csv).toContain('caution,');
  });
});
