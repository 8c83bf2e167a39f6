/**
 * Reading evaluation points from the command line: inline `"x,y;x,y"` or a CSV file with a
 * header naming x and y (any other columns ignored) or exactly two unnamed numeric columns.
 * Every rejection names the line and column, so a 10 000-row survey export can be fixed in one go.
 */
import { DrydigError } from '../../shared/schema';

export type PlanPoint = [number, number];

const NUMBER_PATTERN = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/** Strict decimal number: no hex, no empty string as 0, no trailing junk; finite only. */
export function parseStrictNumber(text: string): number | undefined {
  const t = text.trim();
  if (!NUMBER_PATTERN.test(t)) return undefined;
  const value = Number(t);
  return Number.isFinite(value) ? value : undefined;
}

/** True when the text reads as inline coordinates rather than a file name. */
export function looksLikeInlinePoints(text: string): boolean {
  return /\d/.test(text) && /^[\s0-9eE+\-.,;]*$/.test(text);
}

function pointsError(message: string): DrydigError {
  return new DrydigError('DRYDIG_ERR_CLI_USAGE', message);
}

/** Parses `"x,y;x,y"` (spaces allowed, a trailing `;` ignored). */
export function parseInlinePoints(text: string): PlanPoint[] {
  const pairs = text.split(';').map((p) => p.trim());
  if (pairs.length > 1 && pairs[pairs.length - 1] === '') pairs.pop();
  const points: PlanPoint[] = [];
  pairs.forEach((pair, k) => {
    const parts = pair.split(',');
    if (parts.length !== 2) {
      throw pointsError(`--points: point ${k + 1} ("${pair}") must be two numbers "x,y"; separate points with ";"`);
    }
    const x = parseStrictNumber(parts[0]!);
    const y = parseStrictNumber(parts[1]!);
    if (x === undefined || y === undefined) {
      const bad = x === undefined ? parts[0]! : parts[1]!;
      throw pointsError(`--points: point ${k + 1}: "${bad.trim()}" is not a finite number`);
    }
    points.push([x, y]);
  });
  return points;
}

const X_NAMES = ['x', 'x_m', 'easting', 'easting_m', 'e'];
const Y_NAMES = ['y', 'y_m', 'northing', 'northing_m', 'n'];

function splitRow(line: string, delimiter: string): string[] {
  return line.split(delimiter).map((cell) => cell.trim().replace(/^"(.*)"$/, '$1').trim());
}

/**
 * Parses a points CSV. Delimiter: tab, `;` or `,` (detected from the first row); with a tab or
 * `;` delimiter a decimal comma is accepted. `label` names the file in messages.
 */
export function parsePointsCsv(text: string, label: string): PlanPoint[] {
  const lines = text.replace(/^\uFEFF/, '').split(/\r\n|\n|\r/);
  const rows: Array<{ line: number; text: string }> = [];
  lines.forEach((t, i) => {
    if (t.trim() !== '' && !t.trimStart().startsWith('#')) rows.push({ line: i + 1, text: t });
  });
  const first = rows[0];
  if (!first) throw new DrydigError('DRYDIG_ERR_FILE', `${label}: no points (the file is empty)`);

  const delimiter = first.text.includes('\t') ? '\t' : first.text.includes(';') ? ';' : ',';
  const decimalComma = delimiter !== ',';
  const toNumber = (cell: string) => parseStrictNumber(decimalComma ? cell.replace(',', '.') : cell);

  const firstCells = splitRow(first.text, delimiter);
  const hasHeader = firstCells.some((c) => toNumber(c) === undefined);
  let xCol = 0;
  let yCol = 1;
  let dataRows = rows;
  if (hasHeader) {
    const names = firstCells.map((c) => c.toLowerCase());
    xCol = names.findIndex((n) => X_NAMES.includes(n));
    yCol = names.findIndex((n) => Y_NAMES.includes(n));
    if (xCol === -1 || yCol === -1) {
      throw new DrydigError(
        'DRYDIG_ERR_FILE',
        `${label} line ${first.line}: the header must name an x and a y column (found: ${firstCells.join(', ') || 'nothing'})`,
      );
    }
    dataRows = rows.slice(1);
  } else if (firstCells.length !== 2) {
    throw new DrydigError(
      'DRYDIG_ERR_FILE',
      `${label} line ${first.line}: ${firstCells.length} columns without a header row; give exactly two (x,y) or add a header naming x and y`,
    );
  }
  const columnName = (col: number) => (hasHeader ? firstCells[col] : col === xCol ? 'x' : 'y');

  const points: PlanPoint[] = [];
  for (const row of dataRows) {
    const cells = splitRow(row.text, delimiter);
    const coordinate = (col: number): number => {
      const cell = cells[col];
      if (cell === undefined || cell === '') throw new DrydigError('DRYDIG_ERR_FILE', `${label} line ${row.line}: column ${columnName(col)} is missing`);
      const value = toNumber(cell);
      if (value === undefined) {
        throw new DrydigError('DRYDIG_ERR_FILE', `${label} line ${row.line}, column ${columnName(col)}: "${cell.slice(0, 40)}" is not a finite number`);
      }
      return value;
    };
    points.push([coordinate(xCol), coordinate(yCol)]);
  }
  if (points.length === 0) throw new DrydigError('DRYDIG_ERR_FILE', `${label}: no points below the header row`);
  return points;
}
