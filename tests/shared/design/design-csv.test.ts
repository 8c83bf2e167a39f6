import { describe, expect, it } from 'vitest';
import { designResultToCsv, runDesign } from '../../../shared/design';
import { singleWellScenario } from './design-test-helpers';

/** Minimal RFC 4180 reader for the test: quoted fields may hold commas and doubled quotes. */
function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let field = '';
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const c = text[i]!;
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') {
        field += '"';
        i++;
      } else if (c === '"') quoted = false;
      else field += c;
    } else if (c === '"') quoted = true;
    else if (c === ',') {
      row.push(field);
      field = '';
    } else if (c === '\r' && text[i + 1] === '\n') {
      row.push(field);
      rows.push(row);
      row = [];
      field = '';
      i++;
    } else field += c;
  }
  return rows;
}

describe('designResultToCsv', () => {
  it('writes the summary, wells and excavations as RFC 4180 CSV that reads back to the JSON numbers', async () => {
    const result = await runDesign({ scenario: singleWellScenario(), mode: 'uniform' });
    const csv = designResultToCsv(result);
    expect(csv.endsWith('\r\n')).toBe(true);
    const rows = parseCsv(csv);
    expect(rows[0]).toEqual(['quantity', 'value', 'unit']);
    const total = rows.find((r) => r[0] === 'total rate')!;
    expect(Number(total[1])).toBeCloseTo(result.totalRate_m3_s, 12);
    expect(total[2]).toBe('m3/s');
    const header = rows.findIndex((r) => r[0] === 'well');
    expect(rows[header + 1]![0]).toBe('W1');
    expect(Number(rows[header + 1]![6])).toBeCloseTo(result.wells[0]!.rate_m3_s, 12);
    // Cautions contain commas: they must come back whole.
    const caution = result.cautions[0]!;
    expect(rows.some((r) => r.length === 1 && r[0] === caution)).toBe(true);
  });
});
