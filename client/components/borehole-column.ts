/**
 * <borehole-column>: the ground profile drawn to scale as a borehole log — layers on a level
 * axis, low-permeability plugs and granular ground hatched apart, ground and static level, the
 * selected excavation's formation (the ground above it shown as dug), and, once a design has
 * run, the aquifer's computed head at the critical point and the allowable uplift level.
 */
import { html, nothing, svg } from 'lit';
import { LightElement } from './light-element';
import type { GroundLayer } from '../../shared/schema';
import { BOREHOLE_LABELS } from '../../shared/floor/floor-wording';
import { formatNumber, formatQuantity, fromSi, type DisplayUnits } from '../../shared/units';
import { linearScale, niceTicks } from './chart-axes';

/** The design's figures under one floor, for the column. */
export interface BoreholeDesignLevels {
  /** Computed aquifer head at the critical point, m. */
  head_m: number | null;
  /** Allowable head for uplift (or heave), m; null when no such check applies. */
  allowable_m: number | null;
  /** The design was run before later edits. */
  stale: boolean;
}

const W = 300;
const H = 320;
const PAD = { top: 12, bottom: 30 };
const COL = { x0: 44, x1: 116 };
const LABEL_X = 128;
const LABEL_GAP = 11;

type LineKind = 'ground' | 'static' | 'formation' | 'head' | 'allowable';

let patternSerial = 0;

export class BoreholeColumn extends LightElement {
  static override properties = {
    layers: { attribute: false }, units: { attribute: false }, groundLevel_m: { attribute: false }, staticLevel_m: { attribute: false },
    formation: { attribute: false }, design: { attribute: false }, caption: { attribute: false },
  };
  declare layers: GroundLayer[] | null;
  declare units: DisplayUnits;
  declare groundLevel_m: number;
  declare staticLevel_m: number | null;
  /** The selected excavation's formation level. */
  declare formation: { id: string; level_m: number } | null;
  declare design: BoreholeDesignLevels | null;
  /** Whose profile it is ("site", "excavation basement"). */
  declare caption: string;
  private readonly ids: { plug: string; granular: string };

  constructor() {
    super();
    this.layers = null;
    this.groundLevel_m = 0;
    this.staticLevel_m = null;
    this.formation = null;
    this.design = null;
    this.caption = '';
    const n = ++patternSerial;
    this.ids = { plug: `dd-hatch-plug-${n}`, granular: `dd-hatch-granular-${n}` };
  }

  private levelText(v_m: number): string {
    return formatQuantity(v_m, this.units.length, { decimals: 2 });
  }

  /** Label positions pushed apart so none overlaps the one above it (page order top → bottom). */
  private spread(ys: number[]): number[] {
    const order = ys.map((y, i) => ({ y, i })).sort((a, b) => a.y - b.y);
    const out = [...ys];
    let last = -Infinity;
    for (const o of order) {
      const y = Math.max(o.y, last + LABEL_GAP);
      out[o.i] = y;
      last = y;
    }
    return out;
  }

  private defs() {
    return svg`<defs>
      <pattern id=${this.ids.plug} patternUnits="userSpaceOnUse" width="8" height="8">
        <rect width="8" height="8" class="dd-bh-plug-fill" />
        <path d="M-2,2 L2,-2 M0,8 L8,0 M6,10 L10,6" class="dd-bh-plug-hatch" />
      </pattern>
      <pattern id=${this.ids.granular} patternUnits="userSpaceOnUse" width="7" height="7">
        <rect width="7" height="7" class="dd-bh-granular-fill" />
        <circle cx="1.8" cy="1.8" r="0.9" class="dd-bh-granular-dot" /><circle cx="5.3" cy="5.3" r="0.9" class="dd-bh-granular-dot" />
      </pattern>
    </defs>`;
  }

  override render() {
    const layers = this.layers;
    if (!layers || layers.length === 0) return nothing;
    const u = this.units.length;
    const d = this.design;
    const lines: Array<{ kind: LineKind; level_m: number; text: string }> = [
      { kind: 'ground', level_m: this.groundLevel_m, text: `${BOREHOLE_LABELS.ground} ${this.levelText(this.groundLevel_m)}` },
    ];
    if (this.staticLevel_m !== null) lines.push({ kind: 'static', level_m: this.staticLevel_m, text: `${BOREHOLE_LABELS.static} ${this.levelText(this.staticLevel_m)}` });
    if (this.formation) lines.push({ kind: 'formation', level_m: this.formation.level_m, text: `${BOREHOLE_LABELS.formation(this.formation.id)} ${this.levelText(this.formation.level_m)}` });
    if (d?.head_m != null) lines.push({ kind: 'head', level_m: d.head_m, text: `${BOREHOLE_LABELS.head} ${this.levelText(d.head_m)}` });
    if (d?.allowable_m != null) lines.push({ kind: 'allowable', level_m: d.allowable_m, text: `${BOREHOLE_LABELS.allowable} ${this.levelText(d.allowable_m)}` });

    const all = [...layers.flatMap((l) => [l.top_m, l.bottom_m]), ...lines.map((l) => l.level_m)];
    const lo_m = Math.min(...all);
    const hi_m = Math.max(...all);
    const pad_m = Math.max((hi_m - lo_m) * 0.03, 0.1);
    const lo = fromSi(lo_m - pad_m, u);
    const hi = fromSi(hi_m + pad_m, u);
    const y = linearScale(lo, hi, H - PAD.bottom, PAD.top);
    const Y = (z_m: number) => y(fromSi(z_m, u));
    const labelY = this.spread(lines.map((l) => Y(l.level_m) + 3));
    const dug = this.formation && this.formation.level_m < this.groundLevel_m ? this.formation : null;
    const keyY = H - 13;

    return html`<figure class="dd-borehole">
      <figcaption>${BOREHOLE_LABELS.title(this.caption)}</figcaption>
      <svg class="dd-borehole-column" viewBox="0 0 ${W} ${H}" role="img" aria-label=${`${BOREHOLE_LABELS.title(this.caption)}: ${layers.map((l) => `${l.id} (${l.kind}) ${this.levelText(l.top_m)} to ${this.levelText(l.bottom_m)}`).join('; ')}`}>
        ${this.defs()}
        ${niceTicks(lo, hi, 6).map((v) => svg`<line x1="36" x2=${COL.x0} y1=${y(v)} y2=${y(v)} class="dd-bh-tick" /><text x="33" y=${y(v) + 3} text-anchor="end" class="dd-bh-tick-text">${formatNumber(v, { decimals: Math.abs(hi - lo) < 5 ? 1 : 0 })}</text>`)}
        <text x="6" y=${PAD.top + 2} class="dd-bh-tick-text" transform=${`rotate(-90 6 ${PAD.top + 2})`} text-anchor="end">${BOREHOLE_LABELS.levelAxis(u)}</text>
        ${layers.map((l) => svg`<rect data-layer=${l.id} data-kind=${l.kind} x=${COL.x0} y=${Y(l.top_m)} width=${COL.x1 - COL.x0} height=${Math.max(Y(l.bottom_m) - Y(l.top_m), 0.5)}
          fill=${`url(#${this.ids[l.kind]})`} class="dd-bh-layer" />`)}
        ${dug ? svg`<rect x=${COL.x0} y=${Y(this.groundLevel_m)} width=${COL.x1 - COL.x0} height=${Math.max(Y(dug.level_m) - Y(this.groundLevel_m), 0)} class="dd-bh-dug" />` : nothing}
        ${layers.map((l) => {
          // Name the layer in the part left under the formation when it has room there: that is the ground the checks weigh.
          const left_m = dug && l.top_m > dug.level_m && l.bottom_m < dug.level_m ? dug.level_m : l.top_m;
          const top = Y(left_m);
          const h = Y(l.bottom_m) - top;
          const room = h >= 12 ? { top, h } : { top: Y(l.top_m), h: Y(l.bottom_m) - Y(l.top_m) };
          return room.h >= 12
            ? svg`<text x=${(COL.x0 + COL.x1) / 2} y=${room.top + room.h / 2 + 3.5} text-anchor="middle" class="dd-bh-layer-name">${l.id.length > 12 ? `${l.id.slice(0, 11)}…` : l.id}</text>`
            : nothing;
        })}
        ${lines.map((l, i) => svg`<g class=${`dd-bh-line dd-bh-${l.kind}`} data-line=${l.kind}>
          <line x1=${COL.x0 - 6} x2=${LABEL_X - 4} y1=${Y(l.level_m)} y2=${Y(l.level_m)} />
          ${l.kind === 'static' || l.kind === 'head' ? svg`<path d=${`M${COL.x1 + 2},${Y(l.level_m) - 6} l8,0 l-4,6 z`} class="dd-bh-water-mark" />` : nothing}
          <line x1=${LABEL_X - 4} x2=${LABEL_X - 1} y1=${Y(l.level_m)} y2=${labelY[i]! - 3} class="dd-bh-leader" />
          <text x=${LABEL_X} y=${labelY[i]}>${l.text}</text>
        </g>`)}
        <g class="dd-bh-key" transform=${`translate(${COL.x0} ${keyY})`}>
          <rect width="16" height="10" fill=${`url(#${this.ids.plug})`} class="dd-bh-layer" /><text x="20" y="9">${BOREHOLE_LABELS.keyPlug}</text>
          <rect x="140" width="16" height="10" fill=${`url(#${this.ids.granular})`} class="dd-bh-layer" /><text x="160" y="9">${BOREHOLE_LABELS.keyGranular}</text>
        </g>
      </svg>
      ${d?.stale ? html`<p class="dd-warn dd-bh-note">${BOREHOLE_LABELS.stale}</p>` : d ? nothing : html`<p class="dd-hint dd-bh-note">${BOREHOLE_LABELS.noDesign}</p>`}
    </figure>`;
  }
}
if (!customElements.get('borehole-column')) customElements.define('borehole-column', BoreholeColumn);
