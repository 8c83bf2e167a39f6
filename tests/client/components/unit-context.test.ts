import { describe, expect, it } from 'vitest';
import { displayValue, parseDisplayNumber } from '../../../client/components/unit-context';
import { stepDecimals } from '../../../client/components/step-decimals';

describe('parseDisplayNumber(text, unit, pointer, label) turns typed text into SI', () => {
  it.each([
    ['36', 'm³/h', 0.01],
    ['2e-4', 'm/s', 2e-4],
    ['2×10⁻⁴', 'm/s', 2e-4],
    ['1,5', 'm', 1.5],
    [' 10 ', 'ft', 3.048], // 1 ft = 0.3048 m exactly (NIST SP 811)
    ['100', 'gpm', 0.00630901964], // 100 × 3.785411784 L / 60 s (NIST SP 811)
  ] as const)('"%s" %s → %d', (text, unit, expected) => {
    const r = parseDisplayNumber(text, unit, '/x', 'x');
    expect(r.ok).toBe(true);
    if (r.ok) expect(Math.abs(r.value_si - expected)).toBeLessThanOrEqual(1e-15 + 1e-12 * expected);
  });
  it('names the field for text that is not a number, and for an empty field', () => {
    expect(parseDisplayNumber('lots', 'm³/h', '/wells/3/rate_m3_s', 'rate')).toEqual({ ok: false, message: '/wells/3/rate_m3_s: rate "lots" is not a number' });
    expect(parseDisplayNumber('', 'm', '/aquifer/base_m', 'aquifer base')).toEqual({ ok: false, message: '/aquifer/base_m: aquifer base is empty — enter a number' });
  });
});

describe('displayValue(value_si, unit) shows SI values in form units', () => {
  it.each([
    [5819414.9331, 'm', '5819414.933'],
    [0.0006, 'm³/h', '2.16'],
    [2e-4, 'm/s', '2e-4'],
    [2e-4, 'ft/d', '56.69'],
    [undefined, 'm', ''],
  ] as const)('%s in %s → "%s"', (v, unit, expected) => {
    expect(displayValue(v, unit)).toBe(expected);
  });
});

describe('stepDecimals(step) gives the decimals contour labels need', () => {
  it.each([[0.25, 2], [0.5, 1], [2.5, 1], [2, 0], [0.1, 1], [0.05, 2], [0.001, 3]])('stepDecimals(%d) = %d', (step, d) => {
    expect(stepDecimals(step)).toBe(d);
  });
});
