/**
 * An excavation outline from CSV: one vertex per row, easting then northing in site metres (or
 * in feet when the user says so), optional header row. Comma, semicolon or tab separated.
 */
import type { OutlineImport } from './geojson-outlines';

/** Options for `parseCsvOutline`. */
export interface ParseCsvOutlineOptions {
  text: string;
  /** Multiply values by this to get metres (default 1; 0.3048 for feet). */
  toMetres?: number;
}

/**
 * Reads the outline. A header naming the columns (easting/x/e and northing/y/n, any case) picks
 * them; without one, the first two numeric columns are used. A row that is not two numbers is
 * reported by its line number.
 */
export function parseCsvOutline(options: ParseCsvOutlineOptions): OutlineImport {
  const scale = options.toMetres ?? 1;
  const lines = options.text.split(/\r?\n/).map((l) => l.trim()).filter((l) => l.length > 0 && !l.startsWith('#'));
  if (lines.length === 0) return { ok: false, message: 'The CSV file is empty.' };
  const sep = [';', '\t', ','].find((s) => lines[0]!.includes(s)) ?? ',';
  const split = (l: string) => l.split(sep).map((c) => c.trim().replace(/^"|"$/g, ''));
  let xCol = 0;
  let yCol = 1;
  let start = 0;
  const header = split(lines[0]!);
  if (header.some((c) => c !== '' && !Number.isFinite(Number(c)))) {
    const find = (names: string[]) => header.findIndex((c) => names.includes(c.toLowerCase().replace(/[^a-z]/g, '')));
    const xi = find(['easting', 'x', 'e', 'east', 'eastingm']);
    const yi = find(['northing', 'y', 'n', 'north', 'northingm']);
    if (xi < 0 || yi < 0) {
      return { ok: false, message: `Line 1 looks like a header but names no easting and northing columns (found: ${header.join(', ')}).` };
    }
    xCol = xi;
    yCol = yi;
    start = 1;
  }
  const outline: Array<[number, number]> = [];
  for (let i = start; i < lines.length; i++) {
    const cells = split(lines[i]!);
    // Accept a decimal comma only with a semicolon separator (the usual European export).
    const parse = (c: string | undefined) => Number(sep === ';' ? c?.replace(',', '.') : c);
    const x = parse(cells[xCol]);
    const y = parse(cells[yCol]);
    if (!Number.isFinite(x) || !Number.isFinite(y)) {
      return { ok: false, message: `Line ${i + 1}: expected easting and northing numbers, got "${lines[i]!.slice(0, 60)}".` };
    }
    outline.push([x * scale, y * scale]);
  }
  const first = outline[0];
  const last = outline[outline.length - 1];
  if (first && last && outline.length > 1 && first[0] === last[0] && first[1] === last[1]) outline.pop();
  if (outline.length < 3) return { ok: false, message: `An outline needs at least 3 vertices; the file has ${outline.length}.` };
  return { ok: true, outlines: [{ outline }], notes: [] };
}
