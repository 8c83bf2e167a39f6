/** parseTimeArgument: --time in seconds, with a unit, "steady", or a list. */
import { describe, expect, it } from 'vitest';
import { parseTimeArgument } from '../../server/cli/time-argument';

describe('parseTimeArgument(text)', () => {
  const cases: Array<[string, Array<number | null>]> = [
    ['604800', [604_800]],
    ['7d', [604_800]],
    ['12h', [43_200]],
    ['90min', [5400]],
    ['3600s', [3600]],
    ['1.5e3', [1500]],
    ['steady', [null]],
    ['Steady', [null]],
    ['3600,1d,steady', [3600, 86_400, null]],
  ];
  it.each(cases)('reads %s', (text, expected) => {
    expect(parseTimeArgument(text)).toEqual(expected);
  });

  const bad: Array<[string, string]> = [
    ['0', 'greater than 0'],
    ['-3600', 'greater than 0'],
    ['abc', 'is not a time'],
    ['1e999', 'is not a time'],
    ['3600,abc', '"abc"'],
    ['10m', 'is not a time'],
    [',', 'needs a value'],
  ];
  it.each(bad)('refuses %s', (text, says) => {
    expect(() => parseTimeArgument(text)).toThrow(says);
  });
});
