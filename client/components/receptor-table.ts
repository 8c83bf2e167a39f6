/**
 * <receptor-table>: the Design tab's table of receptors (neighbours) under the design — drawdown,
 * settlement, angular distortion and status per receptor, with its flags in words.
 */
import { html, nothing } from 'lit';
import { LightElement } from './light-element';
// Deep imports on purpose: the receptors folder's index also pulls in the field engine.
import type { ReceptorResult } from '../../shared/receptors/receptor-result';
import { formatAngularDistortion, RECEPTOR_STATUS_WORDS, RECEPTOR_TABLE_NOTE } from '../../shared/receptors/receptor-wording';
import { formatQuantity, type DisplayUnits } from '../../shared/units';


export class ReceptorTable extends LightElement {
  static override properties = { receptors: { attribute: false }, units: { attribute: false } };
  declare receptors: ReceptorResult[] | undefined;
  declare units: DisplayUnits;

  override render() {
    const list = this.receptors;
    if (!list || list.length === 0) return nothing;
    const len = (v: number | null, digits = 2) => (v === null ? '—' : formatQuantity(v, this.units.length, { decimals: digits }));
    const mm = (v: number | null) => (v === null ? '—' : `${(v * 1000).toFixed(1)} mm`);
    return html`<h3>Neighbours <small>${list.length} receptors</small></h3>
      <div class="dd-design-wells"><table class="dd-design-table dd-receptor-table" aria-label="Receptors">
        <thead><tr><th>Receptor</th><th>drawdown</th><th>limit</th><th>settlement</th><th>allowable</th><th>β max</th><th>β allowable</th><th>status</th></tr></thead>
        <tbody>${list.map(
          (r) => html`<tr data-receptor=${r.id} class=${r.status === 'exceeds' ? 'dd-bad' : ''}>
            <td><strong>${r.id}</strong> <small>${r.kind}${r.label ? ` — ${r.label}` : ''}</small></td>
            <td data-drawdown>${len(r.maxDrawdownOverDig_m)}</td><td>${len(r.maxDrawdown_m)}</td>
            <td data-settlement>${mm(r.settlement_m)}</td><td>${mm(r.allowableSettlement_m)}</td>
            <td>${r.maxAngularDistortion === null ? '—' : formatAngularDistortion(r.maxAngularDistortion)}</td><td>${formatAngularDistortion(r.allowableAngularDistortion)}</td>
            <td data-status=${r.status}>${RECEPTOR_STATUS_WORDS[r.status]}${r.flags.length > 0 ? html`<br /><small>${r.flags.join(', ')}</small>` : nothing}</td></tr>`,
        )}</tbody></table></div>
      <p class="dd-hint">${RECEPTOR_TABLE_NOTE}</p>`;
  }
}
if (!customElements.get('receptor-table')) customElements.define('receptor-table', ReceptorTable);
