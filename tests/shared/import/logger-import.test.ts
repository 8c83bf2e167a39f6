import { describe, expect, it } from 'vitest';
import { DrydigError } from '../../../shared/schema';
import { parseLoggerReadings, previewLoggerFile } from '../../../shared/import';

describe('parseLoggerReadings(text, mapping)', () => {
  it('turns ISO times into seconds since the start and levels into drawdowns', () => {
    const text = 'timestamp,level\n2027-03-01T07:00:00Z,13.00\n2027-03-01T07:10:00Z,12.40\n2027-03-01T08:00:00+01:00,12.30\n';
    const rows = parseLoggerReadings(text, { time: 'timestamp', timeFormat: 'iso', value: 'level', valueKind: 'level', staticLevel_m: 13 });
    expect(rows.map((r) => r.time_s)).toEqual([0, 600, 0]);
    expect(rows[1]!.drawdown_m).toBeCloseTo(0.6, 12);
  });

  it('converts transducer pressure to a level with the stated γw: 98.1 kPa over a sensor at 2 m is 12 m', () => {
    // Hand calculation: h = p/γw = 98.1 kPa / 9.81 kN/m³ = 10 m of water above the sensor; 2 + 10 = 12 m.
    const rows = parseLoggerReadings('t_min,p_kpa\n0,98.1\n', { time: 't_min', timeFormat: 'min', value: 'p_kpa', valueKind: 'pressure', sensorLevel_m: 2 });
    expect(rows[0]!.level_m).toBeCloseTo(12, 12);
    const saline = parseLoggerReadings('t_min,p_kpa\n0,100.55\n', { time: 't_min', timeFormat: 'min', value: 'p_kpa', valueKind: 'pressure', sensorLevel_m: 2, waterUnitWeight_kN_m3: 10.055 });
    expect(saline[0]!.level_m).toBeCloseTo(12, 12);
  });

  it('names every bad line', () => {
    try {
      parseLoggerReadings('when,level\n2027-03-01 07:00,13\n2027-03-01T07:10:00Z,x\n', { time: 'when', timeFormat: 'iso', value: 'level', valueKind: 'level' });
      throw new Error('did not throw');
    } catch (error) {
      expect(error).toBeInstanceOf(DrydigError);
      expect((error as DrydigError).message).toMatch(/2 bad row\(s\): line 2: time "2027-03-01 07:00" is not an ISO 8601 date-time with a zone.*; line 3: level "x" is not a number/);
    }
  });

  it('previews the header and first rows for the column mapping', () => {
    expect(previewLoggerFile('a,b\n1,2\n3,4\n', 1)).toEqual({ headers: ['a', 'b'], sample: [['1', '2']] });
  });
});
