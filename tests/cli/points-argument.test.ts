/** parseInlinePoints / parsePointsCsv: the ways a designer hands points to `drydig evaluate`. */
import { describe, expect, it } from 'vitest';
import { looksLikeInlinePoints, parseInlinePoints, parsePointsCsv, parseStrictNumber } from '../../server/cli/points-argument';
import { DrydigError } from '../../shared/schema';

describe('parseInlinePoints("x,y;x,y")', () => {
  const cases: Array<[string, Array<[number, number]>]> = [
    ['10,5', [[10, 5]]],
    ['10,5;-3.5,2e2', [[10, 5], [-3.5, 200]]],
    [' 1 , 2 ; 3 , 4 ;', [[1, 2], [3, 4]]],
    ['389215.25,5819415.75', [[389215.25, 5819415.75]]],
  ];
  it.each(cases)('reads %s', (text, expected) => {
    expect(parseInlinePoints(text)).toEqual(expected);
  });

  const bad: Array<[string, string]> = [
    ['10', 'point 1'],
    ['10,5,3', 'point 1'],
    ['1,2;;3,4', 'point 2'],
    ['1,2;3,', 'point 2'],
    ['1,2;0x10,4', 'point 2'],
    ['1e400,2', 'not a finite number'],
  ];
  it.each(bad)('refuses %s naming %s', (text, says) => {
    expect(() => parseInlinePoints(text)).toThrow(DrydigError);
    expect(() => parseInlinePoints(text)).toThrow(says);
  });
});

describe('parsePointsCsv(text, label)', () => {
  const cases: Array<{ name: string; text: string; expected: Array<[number, number]> }> = [
    { name: 'a header x,y', text: 'x,y\n1,2\n3,4\n', expected: [[1, 2], [3, 4]] },
    { name: 'a header in another order with extra columns', text: 'name,y_m,x_m\nP1,20,10\nP2,40,30', expected: [[10, 20], [30, 40]] },
    { name: 'easting and northing', text: 'Easting,Northing\n389215,5819415', expected: [[389215, 5819415]] },
    { name: 'two unnamed numeric columns', text: '1,2\n3.5,-4\n', expected: [[1, 2], [3.5, -4]] },
    { name: 'Windows line ends, a byte-order mark, blank and comment lines', text: '\uFEFFx,y\r\n# survey 12 May\r\n\r\n1,2\r\n', expected: [[1, 2]] },
    { name: 'semicolons with decimal commas', text: 'x;y\n1,5;2,25\n', expected: [[1.5, 2.25]] },
    { name: 'tabs', text: 'x\ty\n1\t2\n', expected: [[1, 2]] },
    { name: 'quoted cells', text: '"x","y"\n"1","2"\n', expected: [[1, 2]] },
  ];
  it.each(cases)('reads $name', ({ text, expected }) => {
    expect(parsePointsCsv(text, 'p.csv')).toEqual(expected);
  });

  const bad: Array<{ name: string; text: string; says: string }> = [
    { name: 'an empty file', text: '', says: 'p.csv: no points' },
    { name: 'a header only', text: 'x,y\n', says: 'no points below the header' },
    { name: 'a header without x and y', text: 'a,b\n1,2', says: 'p.csv line 1: the header must name an x and a y column' },
    { name: 'a text cell', text: 'x,y\n1,2\n3,abc\n', says: 'p.csv line 3, column y: "abc" is not a finite number' },
    { name: 'a short row', text: 'x,y\n1,2\n3\n', says: 'p.csv line 3: column y is missing' },
    { name: 'three unnamed columns', text: '1,2,3\n', says: '3 columns without a header row' },
  ];
  it.each(bad)('refuses $name with a message naming the line', ({ text, says }) => {
    expect(() => parsePointsCsv(text, 'p.csv')).toThrow(says);
  });
});

describe('helpers', () => {
  it.each([['12', 12], ['-1.5e3', -1500], ['.5', 0.5], ['', undefined], [' ', undefined], ['0x10', undefined], ['1e999', undefined], ['Infinity', undefined], ['1,5', undefined]] as const)(
    'parseStrictNumber(%j) is %j',
    (text, value) => {
      expect(parseStrictNumber(text)).toBe(value);
    },
  );
  it.each([['10,5;3,4', true], ['points.csv', false], ['./data/p', false], ['-3.5,2', true]] as const)('looksLikeInlinePoints(%j) is %j', (text, inline) => {
    expect(looksLikeInlinePoints(text)).toBe(inline);
  });
});
