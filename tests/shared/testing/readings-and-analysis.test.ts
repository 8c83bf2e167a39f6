import { describe, expect, it } from 'vitest';
import { parseScenario } from '../../../shared/schema';
import { drydigErrorOf as codeOf } from '../../helpers/drydig-error-of';
import { analysePumpingTest, applyTestParameters, parseReadingsCsv, theisDrawdown, type PumpingTestFit } from '../../../shared/testing';

describe('parseReadingsCsv(text)', () => {
  it('reads units from column suffixes: minutes, feet and a distance column', () => {
    const rows = parseReadingsCsv('time_min,drawdown_ft,distance_ft,well\n1,0.5,100,PZ1\n2,"1.0",100,PZ1\n', { rate_m3_s: 0.01 });
    expect(rows).toHaveLength(2);
    expect(rows[0]).toMatchObject({ time_s: 60, well: 'PZ1', line: 2 });
    expect(rows[0]!.drawdown_m).toBeCloseTo(0.1524, 12);
    expect(rows[1]!.distance_m).toBeCloseTo(30.48, 12);
  });

  it('turns water levels into drawdowns with the static level given', () => {
    const rows = parseReadingsCsv('time_s;level_m\n60;9.7\n', { staticLevel_m: 10, distance_m: 12, rate_m3_s: 0.01 });
    expect(rows[0]!.drawdown_m).toBeCloseTo(0.3, 12);
  });

  it('marks readings after the stop as recovery', () => {
    const rows = parseReadingsCsv('time_h,drawdown_m\n1,0.5\n3,0.2\n', { distance_m: 10, rate_m3_s: 0.01, stop_s: 7200 });
    expect(rows.map((r) => r.phase)).toEqual(['pumping', 'recovery']);
  });

  it('names every bad row by its line number and drops none silently', () => {
    const e = codeOf(() => parseReadingsCsv('time_s,drawdown_m\n60,0.1\nabc,0.2\n120,\n-5,0.3\n', { distance_m: 10, rate_m3_s: 0.01 }));
    expect(e.code).toBe('DRYDIG_ERR_INVALID_READINGS');
    expect(e.message).toMatch(/3 bad row\(s\): line 3: time "abc" is not a number; line 4: drawdown is empty; line 5: time must be > 0/);
  });

  it('refuses a file without a time column, naming the columns it found', () => {
    expect(codeOf(() => parseReadingsCsv('t,drawdown_m\n1,2\n', { distance_m: 1, rate_m3_s: 1 })).message).toMatch(/no time column.*"t"/);
  });

  it('asks for the static level when the file gives levels', () => {
    expect(codeOf(() => parseReadingsCsv('time_s,level_m\n1,2\n', { distance_m: 1, rate_m3_s: 1 })).message).toMatch(/static level/);
  });
});

describe('analysePumpingTest({ readings })', () => {
  const Q = 0.01;
  const T = 2e-3;
  const S = 2e-4;
  const csv = ['time_s,drawdown_m,distance_m,well', ...Array.from({ length: 25 }, (_, k) => 120 * 10 ** ((k * 3) / 24)).map((t) => `${t},${theisDrawdown(Q, T, S, 25, t)},25,PZ1`)].join('\n');

  it('runs Theis, Cooper–Jacob and Hantush on a constant-rate test and leaves the step analysis out', () => {
    const result = analysePumpingTest({ readings: parseReadingsCsv(csv, { rate_m3_s: Q }) });
    expect(result.fits.map((f) => f.method)).toEqual(['theis', 'cooper-jacob', 'hantush']);
    expect(result.fits[0]!.transmissivity_m2_s!).toBeCloseTo(T, 9);
    expect(result.cautions[0]).toMatch(/licensed engineer/);
  });

  it('refuses the constant-rate methods on a step test and says why', () => {
    const steps = 'time_s,drawdown_m,rate_l_s\n1800,1,5\n3600,1.1,5\n5400,2.2,10\n7200,2.3,10\n9000,3.5,15\n10800,3.6,15\n';
    const result = analysePumpingTest({ readings: parseReadingsCsv(steps, { distance_m: 0.15 }) });
    expect(result.fits.map((f) => f.method)).toEqual(['step']);
    expect(result.cautions.join(' ')).toMatch(/3 different rates/);
  });
});

describe('applyTestParameters({ scenario, fit })', () => {
  const scenario = parseScenario({
    format: 'drydig.scenario',
    version: 1,
    name: 'test',
    groundLevel_m: 10,
    aquifer: { kind: 'confined', conductivity_m_s: 1e-4, base_m: -10, top_m: 0, staticLevel_m: 8, storativity: 1e-4 },
    excavations: [],
    wells: [{ id: 'PW', x: 0, y: 0, radius_m: 0.15, kind: 'deep', rate_m3_s: 0.01 }],
    design: { time_s: 86400 },
  });

  it('sets K = T / b with b = top − base, S, and keeps the interval of K for the uncertainty analysis', () => {
    const fit = analysePumpingTest({ readings: parseReadingsCsv('time_s,drawdown_m\n600,0.4\n1200,0.5\n2400,0.6\n4800,0.7\n9600,0.8\n', { distance_m: 20, rate_m3_s: 0.01 }), methods: ['theis'] }).fits[0]!;
    const { scenario: applied, changes } = applyTestParameters({ scenario, fit, source: 'test.csv' });
    expect(applied.aquifer.conductivity_m_s).toBeCloseTo(fit.transmissivity_m2_s! / 10, 15);
    expect(applied.aquifer.storativity).toBe(fit.storativity);
    const record = (applied as { pumpingTest?: { conductivityInterval_m_s?: [number, number] } }).pumpingTest!;
    expect(record.conductivityInterval_m_s![0]).toBeCloseTo(fit.interval!.transmissivity_m2_s![0] / 10, 15);
    expect(changes[0]).toMatch(/K = T \/ b/);
    expect(() => parseScenario(applied)).not.toThrow();
  });

  it('turns a confined aquifer leaky when B is applied, and puts C on the chosen well', () => {
    const fit: PumpingTestFit = { method: 'hantush', well: null, transmissivity_m2_s: 1e-3, storativity: 1e-4, leakageFactor_m: 300, rmse_m: 0.01, validity: { readings: 10, fractionSmallU: null, uMax: null, notes: [] }, departures: [], curve: [], residuals: [] };
    const { scenario: leaky } = applyTestParameters({ scenario, fit });
    expect(leaky.aquifer).toMatchObject({ kind: 'leaky', leakageFactor_m: 300 });
    const { leakageFactor_m: _b, ...rest } = fit;
    const step: PumpingTestFit = { ...rest, method: 'step', transmissivity_m2_s: null, storativity: null, wellLoss_s2_m5: 2e5 };
    const { scenario: withLoss } = applyTestParameters({ scenario, fit: step, wellId: 'PW' });
    expect(withLoss.wells[0]!.wellLoss_s2_m5).toBe(2e5);
  });

  it('is refused by the scenario schema when its record holds a bad interval', () => {
    expect(() => parseScenario({ ...scenario, pumpingTest: { method: 'theis', conductivityInterval_m_s: [2e-4, 1e-4] } })).toThrow(/pumpingTest\/conductivityInterval_m_s/);
  });
});
