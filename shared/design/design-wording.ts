import type { RateRounding } from './round-design-rates';
import { formatFloorDuration as formatSpan } from '../floor';
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

/**
 * The power-failure figure in words: one definition, at the critical point of an excavation, in
 * the client badge and chart note, the design CSV and the report. `format` turns seconds into the
 * display's duration. Where there is no figure, the note says why (and nothing asks standby to act
 * "after 0 s").
 */
export function describeRecovery(e: { recoveryToFormation_s: number | null; recoveryNote: string | null }, format: (t_s: number) => string = formatSpan): string {
  if (e.recoveryToFormation_s !== null) return `back at formation level after ${format(e.recoveryToFormation_s)} (at the critical point)`;
  return `back at formation level: ${e.recoveryNote ?? 'no figure'}`;
}

/** Why an excavation carries no power-failure figure (shown in its place). */
export const RECOVERY_NOTES = {
  infeasible: 'no figure — the design is not feasible, so there is no design state to recover from',
  notMet: 'no figure — the target is not met at the design time, so the floor is not dry when the pumps stop',
  aboveFormation: 'no figure — the design holds the head above formation (pressure relief under a plug); the time until the floor becomes unsafe is the standby figure',
  beyondSpan: (span_s: number) => `more than ${formatSpan(span_s)}, the span checked after the stop`,
  noStorage: (reason: string) => `no figure — the recovery after a stop needs the aquifer's storage: ${reason}`,
} as const;

/** What standby power must do with the figure (only said where there is one). */
export const RECOVERY_STANDBY_NOTE = 'standby pumps and power must take over within that time.';

/** The assumption behind the recovery of a steady design (shown with every steady design). */
export const STEADY_RECOVERY_CAUTION =
  'Power failure in a steady design: the pumps stop at the steady state and the recovery is the steady cone minus the transient cone of an injection of the same rates from the stop (Theis 1935 superposition). Where the steady state uses a radius of influence, this recovers sooner than stopping after a long pumping period (Cooper–Jacob: ln(t_p/t′) against ln((t_p + t′)/t′), t_p = R²S/(2.25T)), so the time back at formation is on the short, safe side; late in the recovery curve (near t_p) levels can rise above the static level, which means nothing. Confirm storage and the radius of influence by a pumping test.';

