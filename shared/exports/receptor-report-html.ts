/**
 * The receptors (neighbours) under a design as HTML: per receptor the drawdown against its limit,
 * the settlement against the allowable, the largest angular distortion against its limit, and the
 * status with its flags. Used by the report and the site view, so both show one table; words from
 * `shared/receptors/receptor-wording.ts`.
 */
import type { DesignResult } from '../design';
import { formatAngularDistortion, RECEPTOR_STATUS_WORDS, RECEPTOR_TABLE_NOTE } from '../receptors/receptor-wording';
import { escapeHtml as e } from './escape-html';

const metres = (v: number | null) => (v === null ? '—' : v.toFixed(2));
const millimetres = (v: number | null) => (v === null ? '—' : (v * 1000).toFixed(1));
const beta = (v: number | null) => (v === null ? '—' : formatAngularDistortion(v));

/** The receptor table ('' when the design has no receptors). */
export function writeReceptorTableHtml(design: Pick<DesignResult, 'receptors'>): string {
  const list = design.receptors ?? [];
  if (list.length === 0) return '';
  const rows = list
    .map((r) => {
      const flags = r.flags.length > 0 ? `<br /><small>${e(r.flags.join(', '))}</small>` : '';
      return `<tr data-receptor="${e(r.id)}"><th scope="row" class="sticky">${e(r.id)} <small>${e(r.kind)}${r.label ? ` — ${e(r.label)}` : ''}</small></th><td>${metres(r.maxDrawdownOverDig_m)}</td><td>${metres(r.maxDrawdown_m)}</td><td>${millimetres(r.settlement_m)}</td><td>${millimetres(r.allowableSettlement_m)}</td><td>${beta(r.maxAngularDistortion)}</td><td>${beta(r.allowableAngularDistortion)}</td><td class="${r.status === 'exceeds' ? 'bad' : r.status === 'ok' ? 'ok' : ''}" data-status="${r.status}">${e(RECEPTOR_STATUS_WORDS[r.status])}${flags}</td></tr>`;
    })
    .join('');
  return `<h3>Neighbours (receptors)</h3><div class="scroll"><table class="receptors" aria-label="Receptors"><thead><tr><th>Receptor</th><th>drawdown m</th><th>limit m</th><th>settlement mm</th><th>allowable mm</th><th>β max</th><th>β allowable</th><th>status</th></tr></thead><tbody>${rows}</tbody></table></div><p class="note">${e(RECEPTOR_TABLE_NOTE)}</p>`;
}
