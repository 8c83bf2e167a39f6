/** encodeFlagRuns / decodeFlagRuns: the grid flag-mask encoding documented in the OpenAPI schema. */
import { describe, expect, it } from 'vitest';
import { decodeFlagRuns, encodeFlagRuns, roundGridDrawdown } from '../../../server/evaluation';

describe('encodeFlagRuns(masks)', () => {
  const cases: Array<{ name: string; masks: number[]; runs: Array<[number, number, number]> }> = [
    { name: 'no flags gives no runs', masks: [0, 0, 0, 0], runs: [] },
    { name: 'one flagged node', masks: [0, 16, 0], runs: [[1, 1, 16]] },
    { name: 'a run at each end', masks: [4, 4, 0, 0, 1, 1, 1], runs: [[0, 2, 4], [4, 3, 1]] },
    { name: 'adjacent runs of different masks stay apart', masks: [3, 3, 1, 1, 0], runs: [[0, 2, 3], [2, 2, 1]] },
    { name: 'every node flagged the same', masks: [32, 32, 32], runs: [[0, 3, 32]] },
  ];
  it.each(cases)('$name', ({ masks, runs }) => {
    expect(encodeFlagRuns(Uint8Array.from(masks))).toEqual(runs);
    expect(Array.from(decodeFlagRuns(runs, masks.length))).toEqual(masks);
  });

  it('decodeFlagRuns refuses a run outside the grid', () => {
    expect(() => decodeFlagRuns([[2, 5, 1]], 4)).toThrow(RangeError);
  });
});

describe('roundGridDrawdown(value_m) rounds to 0.1 mm', () => {
  const cases: Array<[number, number]> = [
    [0.44260000000000005, 0.4426],
    [1.23456, 1.2346],
    [1.23454, 1.2345],
    [-0.00001, 0],
    [12.5, 12.5],
  ];
  it.each(cases)('%f → %f', (value, expected) => {
    expect(roundGridDrawdown(value)).toBe(expected);
    expect(Object.is(roundGridDrawdown(value), -0)).toBe(false);
  });
});
