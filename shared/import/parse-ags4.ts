/**
 * AGS4 data files (the geotechnical trade's open transfer format, Association of Geotechnical and
 * Geoenvironmental Specialists, AGS4): plain text where every line is a quoted, comma-separated
 * row whose first field says what it is — `"GROUP","LOCA"`, then `"HEADING",…` (field names),
 * `"UNIT",…`, `"TYPE",…` and `"DATA",…` rows. Groups follow one another, separated by blank
 * lines. This parser reads every group generically; what drydig uses of them is in
 * `ags-boreholes.ts`. Malformed files get a message naming the line.
 */
import { DrydigError } from '../schema';

/** One AGS group: its headings, units and data rows (values as text, keyed by heading). */
export interface AgsGroup {
  name: string;
  headings: string[];
  units: string[];
  rows: Array<{ line: number; values: Record<string, string> }>;
}

/** Largest AGS file read, characters (a large site investigation is a few MB). */
export const MAX_AGS_CHARS = 32 * 1024 * 1024;

function fail(source: string, line: number, message: string): never {
  throw new DrydigError('DRYDIG_ERR_INVALID_IMPORT', `${source}: line ${line}: ${message}`, [{ path: `${source}/line/${line}`, message }]);
}

/** Splits one AGS line into its quoted fields ("" inside a field is a quote). */
export function splitAgsLine(text: string, line: number, source: string): string[] {
  const fields: string[] = [];
  let i = 0;
  while (i < text.length) {
    while (text[i] === ' ' || text[i] === '\t') i++;
    if (text[i] !== '"') fail(source, line, `fields must be in double quotes (found ${JSON.stringify(text.slice(i, i + 12))})`);
    i++;
    let field = '';
    for (;;) {
      if (i >= text.length) fail(source, line, 'a quoted field is not closed');
      const c = text[i]!;
      if (c === '"' && text[i + 1] === '"') {
        field += '"';
        i += 2;
      } else if (c === '"') {
        i++;
        break;
      } else {
        field += c;
        i++;
      }
    }
    fields.push(field);
    while (text[i] === ' ' || text[i] === '\t') i++;
    if (i < text.length) {
      if (text[i] !== ',') fail(source, line, `expected a comma after field ${fields.length}`);
      i++;
    }
  }
  return fields;
}

/** Parses AGS4 text into its groups, keyed by group name. */
export function parseAgs4(text: string, source = 'ags'): Map<string, AgsGroup> {
  if (text.length > MAX_AGS_CHARS) throw new DrydigError('DRYDIG_ERR_INVALID_IMPORT', `${source}: the file is larger than ${MAX_AGS_CHARS / 1024 / 1024} MB`);
  const groups = new Map<string, AgsGroup>();
  let current: AgsGroup | null = null;
  const lines = text.replace(/^\uFEFF/, '').split(/\r\n|\n|\r/);
  lines.forEach((raw, index) => {
    const line = index + 1;
    if (raw.trim() === '') return;
    const fields = splitAgsLine(raw, line, source);
    const [kind, ...rest] = fields;
    switch (kind) {
      case 'GROUP': {
        const name = rest[0];
        if (!name || !/^[A-Z0-9]{4}$/.test(name)) fail(source, line, `a GROUP row needs a four-character group name (got ${JSON.stringify(name ?? '')})`);
        if (groups.has(name)) fail(source, line, `group ${name} appears twice`);
        current = { name, headings: [], units: [], rows: [] };
        groups.set(name, current);
        return;
      }
      case 'HEADING':
        if (!current) fail(source, line, 'a HEADING row before any GROUP row');
        current.headings = rest;
        return;
      case 'UNIT':
      case 'TYPE':
        if (!current) fail(source, line, `a ${kind} row before any GROUP row`);
        if (current.headings.length === 0) fail(source, line, `a ${kind} row before the HEADING row of group ${current.name}`);
        if (kind === 'UNIT') current.units = rest;
        return;
      case 'DATA': {
        if (!current) fail(source, line, 'a DATA row before any GROUP row');
        const g: AgsGroup = current;
        if (g.headings.length === 0) fail(source, line, `a DATA row before the HEADING row of group ${g.name}`);
        if (rest.length !== g.headings.length) fail(source, line, `group ${g.name} has ${g.headings.length} headings but this DATA row has ${rest.length} fields`);
        const values: Record<string, string> = {};
        g.headings.forEach((h, k) => (values[h] = rest[k]!));
        g.rows.push({ line, values });
        return;
      }
      default:
        fail(source, line, `unknown row type ${JSON.stringify(kind ?? '')} (AGS4 rows start with GROUP, HEADING, UNIT, TYPE or DATA)`);
    }
  });
  if (groups.size === 0) throw new DrydigError('DRYDIG_ERR_INVALID_IMPORT', `${source}: no AGS groups found (is this an AGS4 file?)`);
  return groups;
}
