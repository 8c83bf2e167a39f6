/**
 * `--time`: seconds since pumping started, `steady`, or a comma-separated list of them. A unit
 * suffix (`s`, `min`, `h`, `d`) is accepted at this edge for convenience; everything inside and in
 * the output stays in seconds. Zero, negative and non-finite times are refused, never clamped.
 */
import { parseStrictNumber } from './points-argument';
import { usageError } from './parse-options';

const UNIT_SECONDS: Record<string, number> = { s: 1, min: 60, h: 3600, d: 86_400 };

/** One time: seconds, or null for steady state. */
export function parseTimeValue(text: string): number | null {
  const t = text.trim().toLowerCase();
  if (t === 'steady') return null;
  const match = /^(.*?)(s|min|h|d)?$/.exec(t);
  const number = parseStrictNumber(match?.[1] ?? '');
  const unit = UNIT_SECONDS[match?.[2] ?? 's'] ?? 1;
  if (number === undefined) {
    throw usageError(`--time: "${text.trim()}" is not a time; give seconds (e.g. 604800), a number with s, min, h or d (e.g. 7d), or "steady"`);
  }
  const time_s = number * unit;
  if (!(time_s > 0) || !Number.isFinite(time_s)) throw usageError(`--time: ${text.trim()} must be greater than 0 (pumping starts at t = 0); use "steady" for steady state`);
  return time_s;
}

/** A list `"3600,86400,steady"`; duplicates are kept (the caller asked for them). */
export function parseTimeArgument(text: string): Array<number | null> {
  const parts = text.split(',').map((p) => p.trim()).filter((p) => p !== '');
  if (parts.length === 0) throw usageError('--time needs a value');
  return parts.map(parseTimeValue);
}
