/**
 * CSV writing (RFC 4180: comma separated, CRLF line ends, quotes doubled). Text cells that a
 * spreadsheet would run as a formula (=, +, -, @, tab, CR first) get a leading apostrophe, so an
 * id typed as "=cmd|…" cannot execute on the site office PC (OWASP CSV injection guidance).
 * Numbers are written as numbers.
 */

/** One CSV cell. */
export function csvCell(value: string | number | null | undefined): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  let text = value;
  if (/^[=+\-@\t\r]/.test(text)) text = `'${text}`;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** Rows of cells → CSV text with CRLF line ends and a final line end. */
export function csvRows(rows: ReadonlyArray<ReadonlyArray<string | number | null | undefined>>): string {
  return rows.map((r) => r.map(csvCell).join(',')).join('\r\n') + '\r\n';
}

/** Rounds to `decimals` places for output (levels to the millimetre, coordinates to the millimetre). */
export function roundTo(value: number, decimals: number): number {
  const f = 10 ** decimals;
  return Math.round(value * f) / f;
}
