/**
 * <shortfall-badges>: one badge per excavation — target met or not at the design time, the worst
 * shortfall in the user's length unit and where it is. Clicking a badge emits `focus-excavation`.
 * Met/short is said in words and by symbol, not by colour alone.
 */
import { html, nothing } from 'lit';
import { LightElement } from './light-element';
import type { ExcavationShortfall } from '../worker/engine-protocol';
import { formatQuantity, type DisplayUnits } from '../../shared/units';
import { formatDuration } from './time-format';

export class ShortfallBadges extends LightElement {
  static override properties = { shortfall: { attribute: false }, units: { attribute: false }, stale: { type: Boolean } };
  declare shortfall: ExcavationShortfall[];
  declare units: DisplayUnits;
  declare stale: boolean;

  constructor() {
    super();
    this.shortfall = [];
    this.stale = false;
  }

  override render() {
    if (this.shortfall.length === 0) return nothing;
    const u = this.units;
    const when = this.shortfall[0]!.time_s === null ? 'steady state' : `design time ${formatDuration(this.shortfall[0]!.time_s)}`;
    return html`<div class="dd-badges ${this.stale ? 'dd-stale' : ''}" aria-live="polite">
      ${this.shortfall.map((s) => {
        const where = `${formatQuantity(s.worst.x, u.length, { decimals: 1, withUnit: false })}, ${formatQuantity(s.worst.y, u.length, { decimals: 1, withUnit: false })}`;
        return html`<button type="button" class="dd-badge ${s.met ? 'dd-met' : 'dd-short'}" data-excavation=${s.id} data-met=${String(s.met)}
            title="Go to the highest computed level in ${s.id}" @click=${() => this.emit('focus-excavation', s.id)}>
          <span class="dd-badge-icon" aria-hidden="true">${s.met ? '✓' : '▲'}</span>
          <span class="dd-badge-text"><strong>${s.id}</strong>
          ${s.met
            ? html`<span class="dd-badge-state">Target met</span> <span class="dd-badge-value">${formatQuantity(-s.worstShortfall_m, u.length, { decimals: 2 })} to spare</span>`
            : html`<span class="dd-badge-state">Short by</span> <span class="dd-badge-value">${formatQuantity(s.worstShortfall_m, u.length, { decimals: 2 })}</span>`}
          <small>worst at ${where} · ${when}${!s.met ? ` · ${Math.round(s.areaFraction * 100)} % of the pit above target` : ''}${s.flags.length ? ` · flags: ${s.flags.join(', ')}` : ''}</small></span>
        </button>`;
      })}
    </div>`;
  }
}
if (!customElements.get('shortfall-badges')) customElements.define('shortfall-badges', ShortfallBadges);
