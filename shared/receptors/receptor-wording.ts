/**
 * The words of the receptor checks: one place for the reasons, cautions and notes the design
 * result, the Design tab and the report show about neighbours.
 */
import type { ReceptorResult } from './receptor-result';

const fig = (v: number, digits = 3) => Number(v.toPrecision(digits)).toString();
const mm = (v_m: number) => `${fig(v_m * 1000)} mm`;
/** β as "1/N" (N rounded), the way the published limits are written. */
export const formatAngularDistortion = (beta: number): string => (beta > 0 ? `1/${Math.round(1 / beta)}` : '0');

/** A receptor's status in words (Design tab, site view, report). */
export const RECEPTOR_STATUS_WORDS: Readonly<Record<ReceptorResult['status'], string>> = { ok: 'within limits', exceeds: 'over a limit', 'not-checked': 'no limit given' };

/** What the receptor table's figures are (Design tab, site view, report). */
export const RECEPTOR_TABLE_NOTE =
  'Drawdown and settlement are the largest over the pumping period; settlement by one-dimensional consolidation (m_v·γw·Δh·H), β = Δs/L between neighbouring points (default limit 1/500, Bjerrum 1963). Screening estimates — see the cautions.';

/** Why a receptor keeps the targets from being met (slack: extra drawdown the targets need there). */
export function receptorBlocksMessage(id: string, limit_m: number, slack_m: number): string {
  return `receptor ${id}: keeping its drawdown within ${fig(limit_m)} m keeps a target from being met — the targets need about ${fig(slack_m)} m more drawdown there; raise its limit, recharge near it with injection wells, or move the abstraction away from it`;
}

/** A receptor drawn down beyond its limit by the design as solved (uniform mode, or the check). */
export function receptorOverLimitMessage(r: ReceptorResult): string {
  return `receptor ${r.id}: drawdown ${fig(r.maxDrawdownOverDig_m)} m over the pumping period exceeds its limit ${fig(r.maxDrawdown_m ?? 0)} m`;
}

/** Cautions for one receptor's result (settlement and distortion beyond the limits, validity). */
export function receptorCautions(r: ReceptorResult, suggestedLimit_m: number | null): string[] {
  const out: string[] = [];
  if (r.flags.includes('settlement-exceeds'))
    out.push(`Receptor ${r.id}: settlement ${mm(r.settlement_m ?? 0)} exceeds the allowable ${mm(r.allowableSettlement_m ?? 0)}${suggestedLimit_m !== null && r.maxDrawdown_m === null ? `; a drawdown limit (maxDrawdown_m) of ${fig(suggestedLimit_m)} m there would keep it within` : ''}.`);
  if (r.flags.includes('angular-distortion-exceeds'))
    out.push(`Receptor ${r.id}: angular distortion ${formatAngularDistortion(r.maxAngularDistortion ?? 0)} exceeds the allowable ${formatAngularDistortion(r.allowableAngularDistortion)} (differential settlement ${mm(r.differentialSettlement_m ?? 0)}).`);
  if (r.flags.includes('head-rise')) out.push(`Receptor ${r.id}: the head rises there at some time (injection); swelling is not modelled — m_v of loading overstates it.`);
  if (r.flags.includes('large-strain')) out.push(`Receptor ${r.id}: the vertical strain m_v·Δσ′ exceeds 5 %, beyond the constant-m_v, small-strain model; use a consolidation test over the stress range.`);
  return out;
}

/** The caution every design with receptors carries (method and its limits). */
export const RECEPTOR_METHOD_CAUTION =
  'Receptor settlement is one-dimensional consolidation, s = m_v·γw·Δh·H, fully consolidated (an upper bound at the time the drawdown holds; clays take time to consolidate), with the drawdown of the pumped aquifer at the receptor; angular distortion is Δs/L between neighbouring points, tilt not removed. It is an estimate for screening: a condition survey, the structure’s own tolerances and a licensed engineer decide.';
