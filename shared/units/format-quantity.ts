/** Formatting SI values for display, with the unit label. */
import { fromSi } from './convert-unit';
import type { UnitId } from './unit-definitions';

/** Options for `formatQuantity`. */
export interface FormatQuantityOptions {
  /** Significant digits for values that are not plain decimals (default 3). */
  significant?: number;
  /** Fixed decimals instead of significant digits (e.g. 2 for levels to the centimetre). */
  decimals?: number;
  /** Append the unit label (default true). */
  withUnit?: boolean;
}

/**
 * Formats an SI value in the given display unit: fixed decimals when asked, otherwise
 * significant digits, switching to exponent form below 10⁻³ or at 10⁶ and above (K in m/s).
 * Non-finite values print as "—" rather than "NaN".
 */
export function formatQuantity(value_si: number, unit: UnitId, options: FormatQuantityOptions = {}): string {
  const v = fromSi(value_si, unit);
  const suffix = options.withUnit === false ? '' : `\u00a0${unit}`;
  if (!Number.isFinite(v)) return `—${suffix}`;
  return `${formatNumber(v, options)}${suffix}`;
}

/** Formats a plain number as `formatQuantity` does (no unit). */
export function formatNumber(v: number, options: Pick<FormatQuantityOptions, 'significant' | 'decimals'> = {}): string {
  if (!Number.isFinite(v)) return '—';
  if (options.decimals !== undefined) {
    const s = v.toFixed(options.decimals);
    return s === `-${(0).toFixed(options.decimals)}` ? s.slice(1) : s;
  }
  const sig = options.significant ?? 3;
  const a = Math.abs(v);
  if (a === 0) return '0';
  if (a < 1e-3 || a >= 1e6) {
    const [mantissa, exponent] = v.toExponential(sig - 1).split('e');
    return `${String(Number(mantissa))}×10${toSuperscript(Number(exponent))}`;
  }
  return String(Number(v.toPrecision(sig)));
}

const SUPERSCRIPT = '⁰¹²³⁴⁵⁶⁷⁸⁹';
function toSuperscript(n: number): string {
  const digits = String(Math.abs(n)).split('').map((d) => SUPERSCRIPT[Number(d)] ?? d).join('');
  return (n < 0 ? '⁻' : '') + digits;
}
