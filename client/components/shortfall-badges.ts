/**
 * <shortfall-badges>: one badge per excavation — how it stands against its governing target at
 * the time shown (which time is said on the badge), the worst shortfall in the user's length unit
 * and where it is. Clicking a badge emits `focus-excavation`. The state is said in words and by
 * the symbol of `client/map/shortfall-symbols.ts`, not by colour alone. A dewatered result is not
 * a pass; a result paused by an invalid field says "not computed".
 */
import { html, nothing } from 'lit';
import { LightElement } from './light-element';
import type { ExcavationShortfall } from '../worker/engine-protocol';
import { formatQuantity, type DisplayUnits } from '../../shared/units';
import { SHORTFALL_SYMBOLS, type ShortfallKind } from '../map/shortfall-symbols';
import { formatDuration } from './time-format';

export class ShortfallBadges extends LightElement {
  static override properties = {
    shortfall: { attribute: false }, units: { attribute: false }, stale: { type: Boolean }, paused: { type: Boolean },
    designTime_s: { attribute: false },
  };
  declare shortfall: ExcavationShortfall[];
  declare units: DisplayUnits;
  /** A newer result is being computed (the badges fade a little). */
  declare stale: boolean;
  /** Results are paused by an invalid field: these badges are not for the current inputs. */
  declare paused: boolean;
  /** The scenario's design time, s (null: steady state), to say whether the time shown is it. */
  declare designTime_s: number | null | undefined;

  constructor() {
    super();
    this.shortfall = [];
    this.stale = false;
    this.paused = false;
    this.designTime_s = undefined;
  }

  private when(time_s: number | null): string {
    if (time_s === null) return 'steady state';
    const design = this.designTime_s === undefined || (this.designTime_s !== null && Math.abs(time_s - this.designTime_s) <= 1e-6 * this.designTime_s);
    return design ? `at the design time ${formatDuration(time_s)}` : `at ${formatDuration(time_s)} (time shown)`;
  }

  override render() {
    if (this.shortfall.length === 0) return nothing;
    const u = this.units;
    return html`<div class="dd-badges ${this.stale ? 'dd-stale' : ''}" aria-live="polite">
      ${this.shortfall.map((s) => {
        const kind: ShortfallKind = this.paused ? 'stale' : s.kind;
        const sym = SHORTFALL_SYMBOLS[kind];
        const where = `${formatQuantity(s.worst.x, u.length, { decimals: 1, withUnit: false })}, ${formatQuantity(s.worst.y, u.length, { decimals: 1, withUnit: false })}`;
        return html`<button type="button" class="dd-badge dd-badge-${kind} ${sym.pass ? 'dd-met' : 'dd-short'}" data-excavation=${s.id} data-met=${String(sym.pass)} data-kind=${kind}
            title="Go to the highest computed level in ${s.id}" @click=${() => this.emit('focus-excavation', s.id)}>
          <span class="dd-badge-icon" data-kind=${kind} aria-hidden="true" style="color:${sym.colour}">${sym.glyph}</span>
          <span class="dd-badge-text"><strong>${s.id}</strong> ${this.renderState(kind, s)}
          <small>${kind === 'stale' ? 'Results paused: fix the field named above; this is the last result, for older inputs' : html`worst at ${where} · ${this.when(s.time_s)}${s.kind === 'above-target' ? ` · ${Math.round(s.areaFraction * 100)} % of the pit above target` : s.kind === 'floor-unsafe' ? ` · ${Math.round(s.areaFraction * 100)} % of the pit over the ${s.governing === 'heave' ? 'heave' : 'uplift'} limit` : ''}${this.floorWords(s)}${s.flags.length ? ` · flags: ${s.flags.join(', ')}` : ''}`}</small></span>
        </button>`;
      })}
    </div>`;
  }

  private renderState(kind: ShortfallKind, s: ExcavationShortfall) {
    const u = this.units;
    const value = (v: number) => formatQuantity(v, u.length, { decimals: 2 });
    switch (kind) {
      case 'stale':
        return html`<span class="dd-badge-state">Not computed</span>`;
      case 'met':
        return html`<span class="dd-badge-state">Target met</span> <span class="dd-badge-value">${value(-s.worstShortfall_m)} to spare</span>`;
      case 'dewatered':
        return html`<span class="dd-badge-state">Not verified</span> <span class="dd-badge-value">drawn down to the aquifer base</span>
          <small>The level shown is the base, not a computed level: the wells cannot deliver these rates; reduce them or check the ground model.</small>`;
      case 'floor-unsafe':
        return html`<span class="dd-badge-state">Floor unsafe</span> <span class="dd-badge-value">head ${value(s.worstShortfall_m)} above the ${s.governing === 'heave' ? 'heave' : 'uplift'} limit</span>`;
      case 'above-target':
      default:
        return html`<span class="dd-badge-state">Short by</span> <span class="dd-badge-value">${value(s.worstShortfall_m)}</span> <span class="dd-badge-kind">water above target</span>`;
    }
  }

  private floorWords(s: ExcavationShortfall): string {
    const f = s.floorFS;
    if (!f) return '';
    return ` · ${f.check} FS ${f.fs === null ? 'no upward load' : f.fs.toFixed(2)} (required ${f.required.toFixed(3)})`;
  }
}
if (!customElements.get('shortfall-badges')) customElements.define('shortfall-badges', ShortfallBadges);
