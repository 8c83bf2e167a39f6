/**
 * Reading and writing numbers in display units inside forms: what every panel needs to show SI
 * values in the user's units and turn typed text back into SI with a message naming the field.
 */
import { formatNumber, fromSi, toSi, type DisplayUnits, type Quantity, type UnitId } from '../../shared/units';

/** A number typed in a form, converted to SI, or the reason it could not be. */
export type ParsedNumber = { ok: true; value_si: number } | { ok: false; message: string };

/** Parses text typed for the field at `pointer` in unit `unit` ("" → error unless optional). */
export function parseDisplayNumber(text: string, unit: UnitId | null, pointer: string, label: string): ParsedNumber {
  const t = text.trim().replace(/\s+/g, '').replace(/,(?=\d{1,3}$)/, '.');
  if (t === '') return { ok: false, message: `${pointer}: ${label} is empty — enter a number` };
  // Accept 2e-4 and 2×10⁻⁴ alike (the form shows the latter).
  const normalised = t.replace(/×10\^?([⁻-]?)([⁰¹²³⁴⁵⁶⁷⁸⁹\d]+)/, (_, sign: string, digits: string) => {
    const map = '⁰¹²³⁴⁵⁶⁷⁸⁹';
    const d = digits.split('').map((c) => (map.includes(c) ? String(map.indexOf(c)) : c)).join('');
    return `e${sign ? '-' : ''}${d}`;
  });
  const v = Number(normalised);
  if (!Number.isFinite(v)) return { ok: false, message: `${pointer}: ${label} "${text.slice(0, 30)}" is not a number` };
  return { ok: true, value_si: unit ? toSi(v, unit) : v };
}

/** An SI value as form text in `unit` (plain digits, enough precision to round-trip typical data). */
export function displayValue(value_si: number | undefined, unit: UnitId | null, significant = 4): string {
  if (value_si === undefined || !Number.isFinite(value_si)) return '';
  const v = unit ? fromSi(value_si, unit) : value_si;
  const a = Math.abs(v);
  if (a !== 0 && a < 1e-3) return v.toExponential(significant - 1).replace(/\.?0+e/, 'e');
  // Coordinates and levels: keep millimetres however large the number (UTM northings are 7 digits).
  if (a >= 100) return String(Number(v.toFixed(3)));
  return formatNumber(v, { significant: Math.max(significant, 4) });
}

/** The display unit of a quantity. */
export function unitOf(units: DisplayUnits, q: Quantity): UnitId {
  return units[q];
}
