/**
 * A typed quantity with its unit, as a person writes it at an edge (CLI flag, import dialog):
 * `25m3/h`, `7 L/s`, `110 gpm`, `30 ft`, `2h`, or a bare number, which is SI (design.md §8).
 * ASCII spellings are accepted for the superscripts (`m3/h` for m³/h, `l/s` for L/s).
 */
import { UNITS, type Quantity, type UnitId } from './unit-definitions';

const ALIASES: Record<string, UnitId> = {
  'm3/s': 'm³/s',
  'm3/h': 'm³/h',
  'm3/d': 'm³/d',
  'l/s': 'L/s',
  lps: 'L/s',
  'us gpm': 'gpm',
  sec: 's',
  hr: 'h',
  day: 'd',
  days: 'd',
  'm2/s': 'm²/s',
  'm2/d': 'm²/d',
};

/** Result of parsing: the SI value, or why the text is not a quantity of that kind. */
export type ParsedQuantity = { ok: true; value_si: number; unit: UnitId } | { ok: false; message: string };

/** Parses `text` as a quantity of `quantity`; a bare number is taken as SI. */
export function parseQuantity(text: string, quantity: Quantity): ParsedQuantity {
  const t = text.trim();
  const match = /^([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s*(.*)$/.exec(t);
  const allowed = Object.values(UNITS).filter((u) => u.quantity === quantity).map((u) => u.id);
  if (!match) return { ok: false, message: `"${t.slice(0, 40)}" is not a number with a unit (e.g. 12.5 ${allowed[1] ?? allowed[0]})` };
  const value = Number(match[1]);
  const written = match[2]!.trim();
  const si = allowed[0] as UnitId;
  if (written === '') return { ok: true, value_si: value, unit: si };
  const unit = (Object.prototype.hasOwnProperty.call(UNITS, written) ? written : ALIASES[written.toLowerCase()]) as UnitId | undefined;
  if (unit === undefined || UNITS[unit].quantity !== quantity) return { ok: false, message: `unit "${written.slice(0, 20)}" is not a ${quantity} unit (use ${allowed.join(', ')})` };
  return { ok: true, value_si: value * UNITS[unit].toSi, unit };
}
