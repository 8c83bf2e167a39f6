/**
 * <seepage-drawing>: a section drawn to scale (equal horizontal and vertical scales): layers,
 * walls, the water held on each surface segment, the flow net (equipotentials and flow lines
 * from the engine) and the floor stretches where the exit gradient is unsafe, shaded.
 */
import { html, svg, nothing } from 'lit';
import type { SectionDocument } from '../../shared/schema';
import type { SectionResult } from '../../shared/section';
import { LightElement } from './light-element';

const LAYER_FILLS = ['#e9dcc0', '#d9c9a3', '#cdbb94', '#bfae8a', '#e3d6b8', '#d2c29c'];

function segmentsPath(segments: readonly number[], y: (z: number) => number): string {
  let d = '';
  for (let k = 0; k + 3 < segments.length; k += 4) d += `M${segments[k]!.toFixed(3)} ${y(segments[k + 1]!).toFixed(3)}L${segments[k + 2]!.toFixed(3)} ${y(segments[k + 3]!).toFixed(3)}`;
  return d;
}

export class SeepageDrawing extends LightElement {
  static override properties = { section: { attribute: false }, result: { attribute: false } };
  declare section: SectionDocument | null;
  declare result: SectionResult | null;

  constructor() {
    super();
    this.section = null;
    this.result = null;
  }

  override render() {
    const doc = this.section;
    if (!doc) return nothing;
    const { x0_m: x0, x1_m: x1 } = doc.extent;
    const base = doc.layers[doc.layers.length - 1]!.bottom_m;
    const heads = doc.surface.flatMap((s) => (s.head_m === null ? [] : [s.head_m]));
    const top = Math.max(...doc.surface.map((s) => s.level_m), ...heads, ...(doc.walls ?? []).map((w) => w.top_m)) + 0.5;
    const y = (z: number) => top - z;
    const pad = 0.02 * (x1 - x0);
    const soil = [`${x0},${y(base)}`, ...doc.surface.flatMap((s) => [`${s.x0_m},${y(s.level_m)}`, `${s.x1_m},${y(s.level_m)}`]), `${x1},${y(base)}`].join(' ');
    const net = this.result?.flowNet;
    const unsafe = this.result?.exitGradient.unsafe ?? [];
    const floorLevel = Math.min(...doc.surface.map((s) => s.level_m));
    const band = Math.max(0.3, 0.05 * (top - base));
    return html`<svg class="dd-seepage-drawing" role="img" aria-label="Section drawn to scale with layers, walls, water levels and the flow net"
        viewBox="${x0 - pad} ${-pad} ${x1 - x0 + 2 * pad} ${top - base + 2 * pad}" preserveAspectRatio="xMidYMid meet">
      <defs><clipPath id="dd-seepage-soil"><polygon points=${soil}></polygon></clipPath></defs>
      <g clip-path="url(#dd-seepage-soil)">
        ${doc.layers.map((l, i) => svg`<rect x=${x0} y=${y(l.top_m)} width=${x1 - x0} height=${l.top_m - l.bottom_m} fill=${LAYER_FILLS[i % LAYER_FILLS.length]!}><title>${l.id ?? `layer ${i + 1}`}: kh ${l.kh_m_s} m/s, kv ${l.kv_m_s} m/s</title></rect>`)}
        ${unsafe.map((u) => svg`<rect class="dd-seepage-unsafe" x=${u.x0_m} y=${y(floorLevel)} width=${u.x1_m - u.x0_m} height=${band} fill="#d55e00" fill-opacity="0.45"><title>exit gradient FS below the required factor</title></rect>`)}
        ${net ? svg`<path class="dd-seepage-equipotentials" d=${net.equipotentials.map((e) => segmentsPath(e.segments, y)).join('')} fill="none" stroke="#b04a00" stroke-width="1" stroke-dasharray="4 3" vector-effect="non-scaling-stroke"></path>
          <path class="dd-seepage-flowlines" d=${net.flowLines.map((f) => segmentsPath(f.segments, y)).join('')} fill="none" stroke="#0072b2" stroke-width="1.2" vector-effect="non-scaling-stroke"></path>` : nothing}
      </g>
      <polyline points=${soil} fill="none" stroke="#5b4a2e" stroke-width="1.5" vector-effect="non-scaling-stroke"></polyline>
      ${doc.surface.filter((s) => s.head_m !== null).map((s) => svg`<g class="dd-seepage-water"><line x1=${s.x0_m} x2=${s.x1_m} y1=${y(s.head_m!)} y2=${y(s.head_m!)} stroke="#0072b2" stroke-width="2" vector-effect="non-scaling-stroke"></line>
        <path d="M${(s.x0_m + s.x1_m) / 2 - 0.4 * band} ${y(s.head_m!) - 0.7 * band}h${0.8 * band}l${-0.4 * band} ${0.7 * band}z" fill="#0072b2"><title>water level ${s.head_m} m</title></path></g>`)}
      ${(doc.walls ?? []).map((w) => svg`<line class="dd-seepage-wall" x1=${w.x_m} x2=${w.x_m} y1=${y(w.top_m)} y2=${y(w.toe_m)} stroke="#1d2730" stroke-width="4" vector-effect="non-scaling-stroke"><title>wall, toe ${w.toe_m} m</title></line>`)}
      ${(doc.wells ?? []).map((w) => svg`<line x1=${w.x_m} x2=${w.x_m} y1=${y(w.screenTop_m)} y2=${y(w.screenBottom_m)} stroke="#009e73" stroke-width="3" stroke-dasharray="2 2" vector-effect="non-scaling-stroke"><title>well screen ${w.screenTop_m}…${w.screenBottom_m} m</title></line>`)}
      ${(doc.drains ?? []).map((d) => svg`<circle cx=${d.x_m} cy=${y(d.level_m)} r=${band / 2} fill="#009e73"><title>drain at ${d.level_m} m</title></circle>`)}
      ${this.result?.heave ? svg`<rect x=${Math.min(this.result.heave.x_m, this.result.heave.x_m + (this.result.heave.x_m > (x0 + x1) / 2 ? -this.result.heave.width_m : this.result.heave.width_m))} y=${y(floorLevel)} width=${this.result.heave.width_m} height=${this.result.heave.depth_m} fill="none" stroke="#cc79a7" stroke-width="1.5" stroke-dasharray="6 3" vector-effect="non-scaling-stroke"><title>Terzaghi heave prism d × d/2</title></rect>` : nothing}
    </svg>`;
  }
}

customElements.define('seepage-drawing', SeepageDrawing);
