import { describe, expect, it } from 'vitest';
import { evaluatePoints, evaluateSeries, logSpacedTimes } from '../../../shared/field';
import { confinedAquifer, expectClose, scenarioWith, well } from './field-test-helpers';

describe('logSpacedTimes', () => {
  it('logSpacedTimes spaces times evenly in log t, ends included', () => {
    const t = logSpacedTimes({ end_s: 1e5, count: 5, start_s: 10 });
    [10, 100, 1000, 1e4, 1e5].forEach((v, k) => expectClose(t[k]!, v, { rel: 1e-13 }));
    expect(t[0]).toBe(10);
    expect(t[4]).toBe(1e5);
  });

  it('logSpacedTimes starts four log cycles before the end by default', () => {
    expect(logSpacedTimes({ end_s: 864000, count: 3 })[0]).toBeCloseTo(86.4, 10);
  });

  it('logSpacedTimes names a bad count or start', () => {
    expect(() => logSpacedTimes({ end_s: 100, count: 0 })).toThrow(/\/count/);
    expect(() => logSpacedTimes({ end_s: 100, count: 3, start_s: 200 })).toThrow(/\/start_s/);
  });
});

describe('evaluateSeries', () => {
  const scenario = scenarioWith({
    aquifer: confinedAquifer(),
    wells: [well('W', 0, 0, { schedule: [{ from_s: 0, rate_m3_s: 0.01 }, { from_s: 86400, rate_m3_s: 0 }] })],
  });

  it('evaluateSeries equals evaluatePoints at each time, through drawdown and recovery', () => {
    const times = [0, ...logSpacedTimes({ end_s: 5 * 86400, count: 12, start_s: 60 })];
    const series = evaluateSeries({ scenario, point: [12, 5], times_s: times });
    series.samples.forEach((s, k) => {
      const p = evaluatePoints({ scenario, points: [[12, 5]], time_s: times[k]! }).points[0]!;
      expect(s.drawdown_m).toBe(p.drawdown_m);
      expect(s.level_m).toBe(p.level_m);
    });
    expect(series.samples[0]!.drawdown_m).toBe(0);
    // Drawdown peaks at the stop and recovers afterwards.
    const atStop = evaluatePoints({ scenario, points: [[12, 5]], time_s: 86400 }).points[0]!.drawdown_m;
    expect(series.samples.at(-1)!.drawdown_m).toBeLessThan(0.2 * atStop);
  });

  it('evaluateSeries names a non-finite time by its index', () => {
    expect(() => evaluateSeries({ scenario, point: [1, 1], times_s: [1, Number.NaN] })).toThrow(/\/times_s\/1/);
  });
});
