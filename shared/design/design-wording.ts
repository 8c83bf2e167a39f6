import type { RateRounding } from './round-design-rates';
/** Number wording shared by the design's reasons and cautions (one place for how figures read). */

/** A figure to `digits` significant digits, without trailing zeros. */
export const formatFigure = (v: number, digits = 3): string => Number(v.toPrecision(digits)).toString();

/** A rate in m³/s as litres per second, e.g. "1.25 L/s". */
export const formatLitres = (q_m3_s: number): string => `${formatFigure(q_m3_s * 1000)} L/s`;

/** A list of ids, the first eight and a count of the rest. */
export const listIds = (ids: readonly string[]): string => (ids.length > 8 ? `${ids.slice(0, 8).join(', ')} and ${ids.length - 8} more` : ids.join(', '));

/** Per-well note for a design well the solve leaves at zero rate. */
export const IDLE_WELL_NOTE = 'idle — may be omitted';

/** The caution that says how the solved rates were made practical. */
export function describeRounding(r: RateRounding): string {
  const parts = [
    r.minimumRate_m3_s > 0 ? `rates below ${formatLitres(r.minimumRate_m3_s)} raised to it${r.raisedToMinimumWellIds.length > 0 ? ` (${listIds(r.raisedToMinimumWellIds)})` : ' (none was)'}` : '',
    r.rateStep_m3_s > 0 ? `rates rounded up to multiples of ${formatLitres(r.rateStep_m3_s)}` : '',
  ].filter((p) => p !== '');
  return `Practical rates: ${parts.join('; ')}; total ${formatLitres(r.totalBefore_m3_s)} → ${formatLitres(r.totalAfter_m3_s)}. The levels, well limits, times and bid shown are the field engine's re-check with the rounded rates.`;
}

/** Per-well note for an injection (recharge) well the design uses. */
export const INJECTION_WELL_NOTE = 'injection — puts water back (rate below zero)';
