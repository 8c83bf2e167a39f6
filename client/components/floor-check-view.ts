/**
 * The pit-floor check of each excavation in a design: which check governs and by how much, the
 * factors of safety against the required ones, the time from a power failure until the floor is
 * unsafe, and the safe-dig chart and table (deepest safe formation level over time).
 */
import { html, nothing, svg } from 'lit';
import { LightElement } from './light-element';
import type { DesignExcavationResult } from '../../shared/design/design-result';
import { FLOOR_SHORTFALL_LABELS, GOVERNING_CHECK_LABELS } from '../../shared/floor/floor-wording';
import { linearScale, niceTicks } from './chart-axes';
import { formatDuration } from './time-format';

const W = 320;
const H = 150;
const PAD = { left: 44, right: 8, top: 8, bottom: 28 };

export class FloorCheckView extends LightElement {
  static override properties = { excavations: { attribute: false }, formatLength: { attribute: false } };
  declare excavations: DesignExcavationResult[];
  /** Formats a level in the display unit. */
  declare formatLength: (level_m: number) => string;

  constructor() {
    super();
    this.excavations = [];
    this.formatLength = (v) => `${v.toFixed(2)} m`;
  }

  private fs(value: number | null, required: number | null) {
    if (value === null || required === null) return nothing;
    const ok = value >= required * (1 - 1e-6);
    return html`<span class=${ok ? 'dd-yes' : 'dd-no'} data-fs>${value.toFixed(3)}</span> (required ${required.toFixed(3)})`;
  }

  private chart(e: DesignExcavationResult) {
    // A steady design has one step (time null): a table row, no chart.
    const steps = e.floor!.safeDig.filter((s): s is { time_s: number; safeFormationLevel_m: number } => s.time_s !== null);
    if (steps.length < 2) return nothing;
    const levels = [...steps.map((s) => s.safeFormationLevel_m), e.formationLevel_m];
    const lo = Math.min(...levels) - 0.2;
    const hi = Math.max(...levels) + 0.2;
    const t0 = Math.log10(steps[0]!.time_s);
    const t1 = Math.log10(steps.at(-1)!.time_s);
    const x = linearScale(t0, t1, PAD.left, W - PAD.right);
    const y = linearScale(lo, hi, H - PAD.bottom, PAD.top);
    const path = steps.map((s, i) => `${i === 0 ? 'M' : 'L'}${x(Math.log10(s.time_s)).toFixed(1)},${y(s.safeFormationLevel_m).toFixed(1)}`).join(' ');
    return html`<svg class="dd-safe-dig-chart" viewBox="0 0 ${W} ${H}" role="img" aria-label="Safe-dig chart: deepest safe formation level over time, ${e.id}">
      ${niceTicks(lo, hi, 4).map((v) => svg`<line x1=${PAD.left} x2=${W - PAD.right} y1=${y(v)} y2=${y(v)} class="dd-grid" /><text x=${PAD.left - 4} y=${y(v) + 3} text-anchor="end" class="dd-tick">${v.toFixed(1)}</text>`)}
      <line x1=${PAD.left} x2=${W - PAD.right} y1=${y(e.formationLevel_m)} y2=${y(e.formationLevel_m)} class="dd-formation-line" stroke-dasharray="4 3" />
      <path d=${path} class="dd-safe-dig-line" fill="none" />
      <text x=${PAD.left} y=${H - 8} class="dd-tick">${formatDuration(steps[0]!.time_s)}</text>
      <text x=${W - PAD.right} y=${H - 8} text-anchor="end" class="dd-tick">${formatDuration(steps.at(-1)!.time_s)}</text>
      <text x=${(PAD.left + W) / 2} y=${H - 8} text-anchor="middle" class="dd-tick">time since pumping started (log)</text>
    </svg>`;
  }

  private excavation(e: DesignExcavationResult) {
    const f = e.floor;
    if (!f) return nothing;
    const unsafeWord = f.governing === 'dry' ? FLOOR_SHORTFALL_LABELS.water : FLOOR_SHORTFALL_LABELS.floor;
    return html`<section class="dd-floor-check" data-excavation=${e.id} data-governing=${f.governing}>
      <h4>${e.id}: governed by ${GOVERNING_CHECK_LABELS[f.governing]}</h4>
      ${f.profileSource === null ? html`<p class="dd-warn">No ground profile: only the dry check was made (uplift and heave not checked).</p>` : nothing}
      <dl class="dd-design-kv">
        <dt>Target (governing)</dt><dd>${this.formatLength(e.targetLevel_m)} · ${e.met ? 'met' : html`<strong class="dd-no">${unsafeWord}</strong>`}</dd>
        ${f.allowableLevel_m !== null ? html`<dt>Allowable head under the floor</dt><dd>${this.formatLength(f.allowableLevel_m)}</dd>` : nothing}
        ${f.upliftFS !== null || f.requiredUpliftFS !== null ? html`<dt>Uplift FS at the critical point</dt><dd>${f.upliftFS === null ? 'no pressure under the plug' : this.fs(f.upliftFS, f.requiredUpliftFS)}</dd>` : nothing}
        ${f.requiredHeaveFS !== null ? html`<dt>Heave FS (i_c / i)</dt><dd>${f.heaveFS === null ? 'no upward gradient' : this.fs(f.heaveFS, f.requiredHeaveFS)}</dd>` : nothing}
        ${f.allowableLevel_m !== null
          ? html`<dt>Power failure: floor unsafe after</dt><dd data-time-to-unsafe>${f.timeToUnsafe_s === null ? (e.met ? 'more than the checked span' : 'already unsafe') : formatDuration(f.timeToUnsafe_s)}</dd>`
          : nothing}
      </dl>
      ${f.safeDig.length > 0
        ? html`<h4>Safe-dig sequence</h4>${this.chart(e)}
            <table class="dd-safe-dig-table"><thead><tr><th>after</th><th>dig to (deepest safe formation)</th></tr></thead>
              <tbody>${f.safeDig.map((s) => html`<tr><td>${formatDuration(s.time_s)}</td><td>${this.formatLength(s.safeFormationLevel_m)}</td></tr>`)}</tbody></table>`
        : nothing}
    </section>`;
  }

  override render() {
    if (!this.excavations.some((e) => e.floor)) return nothing;
    return html`<h3>Pit floor</h3>${this.excavations.map((e) => this.excavation(e))}`;
  }
}
customElements.define('floor-check-view', FloorCheckView);
