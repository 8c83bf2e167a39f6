/** Conversions between SI and display units (factors in `unit-definitions.ts`, NIST SP 811). */
import { UNITS, type UnitId } from './unit-definitions';

/** A value given in `unit`, returned in SI (m, m³/s, m/s, s, m², m²/s, s²/m⁵). */
export function toSi(value: number, unit: UnitId): number {
  return value * UNITS[unit].toSi;
}

/** An SI value returned in `unit`. */
export function fromSi(value_si: number, unit: UnitId): number {
  return value_si / UNITS[unit].toSi;
}

/** A value in unit `from` returned in unit `to` (same quantity; throws on a mismatch). */
export function convertUnit(value: number, from: UnitId, to: UnitId): number {
  const a = UNITS[from];
  const b = UNITS[to];
  if (a.quantity !== b.quantity) throw new RangeError(`cannot convert ${a.quantity} (${from}) to ${b.quantity} (${to})`);
  return (value * a.toSi) / b.toSi;
}
