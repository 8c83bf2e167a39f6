import { describe, expect, it } from 'vitest';
import {
  toSi, fromSi, convertUnit, formatQuantity, formatNumber, defaultDisplayUnits, resolveDisplayUnits,
  listUnits, UNITS, type UnitId,
} from '../../../shared/units';

/** Relative tolerance check: conversions are products of exact factors, so 1e-14 is ample. */
function expectClose(actual: number, expected: number, rel = 1e-14) {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(rel * Math.max(1, Math.abs(expected)));
}

describe('toSi(value, unit) returns SI values from exact unit definitions', () => {
  // Source for every factor: NIST Special Publication 811 (2008), Appendix B.8/B.9 —
  // 1 ft = 0.3048 m exactly; 1 US gal = 3.785 411 784 L exactly; 1 d = 86 400 s.
  const cases: Array<[number, UnitId, number, string]> = [
    [1, 'ft', 0.3048, 'NIST SP 811: ft → m exact'],
    [100, 'ft', 30.48, 'NIST SP 811'],
    [1, 'gpm', 3.785411784e-3 / 60, 'NIST SP 811: gal → m³, /60 s'],
    [100, 'gpm', 6.30901964e-3, '100 gal/min = 378.5411784 L / 60 s = 6.30901964 L/s (exact)'],
    [1, 'm³/h', 1 / 3600, 'definition of the hour'],
    [36, 'm³/h', 0.01, 'definition of the hour'],
    [10, 'L/s', 0.01, '1 L = 1e-3 m³ (CGPM 1964)'],
    [86.4, 'm³/d', 1e-3, 'definition of the day'],
    [1, 'm/d', 1 / 86400, 'definition of the day'],
    [17.28, 'm/d', 2e-4, '2e-4 m/s × 86 400 s/d = 17.28 m/d'],
    [1, 'ft/d', 0.3048 / 86400, 'NIST SP 811'],
    [1, 'ft²', 0.09290304, 'NIST SP 811: ft² = 9.290 304 E-02 m² exact'],
    [1, 'ft²/d', 0.09290304 / 86400, 'NIST SP 811'],
    [2, 'h', 7200, 'definition of the hour'],
    [1, 'h²/m⁵', 3600 * 3600, 'C·Q² with Q in m³/h: C_si = C_h·3600²'],
  ];
  it.each(cases)('toSi(%d, %s) = %d (%s)', (value, unit, expected) => {
    expectClose(toSi(value, unit), expected);
  });
});

describe('fromSi(value, unit) inverts toSi', () => {
  it.each(Object.keys(UNITS) as UnitId[])('fromSi(toSi(v, %s)) returns v', (unit) => {
    for (const v of [0, 1, -2.5, 1e-7, 12345.678]) expectClose(fromSi(toSi(v, unit), unit), v, 1e-13);
  });
  it('fromSi(0.0630901964, "gpm") is 1000 gpm (NIST SP 811, exact)', () => {
    expectClose(fromSi(0.0630901964, 'gpm'), 1000, 1e-13);
  });
});

describe('convertUnit(value, from, to) converts within one quantity', () => {
  it('converts 1 L/s to 15.850 323 141 gpm (60 / 3.785411784, NIST SP 811)', () => {
    expectClose(convertUnit(1, 'L/s', 'gpm'), 60 / 3.785411784, 1e-13);
    expect(convertUnit(1, 'L/s', 'gpm')).toBeCloseTo(15.850323141, 8);
  });
  it('converts 1 m³/h to 4.402 867 5 gpm (1000 / (60 × 3.785411784))', () => {
    expect(convertUnit(1, 'm³/h', 'gpm')).toBeCloseTo(4.40286754, 7);
  });
  it('converts 1 m/d to 3.280 839 9 ft/d (1 / 0.3048)', () => {
    expect(convertUnit(1, 'm/d', 'ft/d')).toBeCloseTo(3.280839895, 8);
  });
  it('throws a RangeError between different quantities', () => {
    expect(() => convertUnit(1, 'm', 'gpm')).toThrow(RangeError);
  });
});

describe('formatQuantity(value_si, unit) prints display values with their unit', () => {
  const cases: Array<[number, UnitId, Parameters<typeof formatQuantity>[2], string]> = [
    [0.01, 'm³/h', {}, '36\u00a0m³/h'],
    [0.3048, 'ft', { decimals: 2 }, '1.00\u00a0ft'],
    [2e-4, 'm/s', {}, '2×10⁻⁴\u00a0m/s'],
    [2e-4, 'm/d', {}, '17.3\u00a0m/d'],
    [-0.0001, 'm', { decimals: 2 }, '0.00\u00a0m'],
    [Number.NaN, 'm', {}, '—\u00a0m'],
    [1.5, 'm', { withUnit: false, decimals: 1 }, '1.5'],
  ];
  it.each(cases)('formatQuantity(%d, %s, %o) = %s', (v, unit, opts, expected) => {
    expect(formatQuantity(v, unit, opts)).toBe(expected);
  });
  it('formatNumber prints large values in exponent form', () => {
    expect(formatNumber(2.5e6)).toBe('2.5×10⁶');
  });
});

describe('display unit choices', () => {
  it('defaultDisplayUnits("us") uses ft, gpm and ft/d', () => {
    const u = defaultDisplayUnits('us');
    expect([u.length, u.rate, u.velocity]).toEqual(['ft', 'gpm', 'ft/d']);
  });
  it('resolveDisplayUnits drops unknown ids and ids of the wrong quantity', () => {
    const u = resolveDisplayUnits('si', { rate: 'L/s', length: 'gpm', velocity: 'furlong/fortnight' });
    expect(u.rate).toBe('L/s');
    expect(u.length).toBe('m');
    expect(u.velocity).toBe('m/s');
  });
  it('listUnits("rate") offers every rate unit', () => {
    expect(listUnits('rate').map((u) => u.id)).toEqual(['m³/s', 'm³/h', 'm³/d', 'L/s', 'gpm']);
  });
});
