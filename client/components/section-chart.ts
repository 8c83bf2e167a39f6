/**
 * <section-chart>: a vertical cross-section along a drawn line A→B — ground, excavation formation
 * and target levels where the line crosses a pit, the computed water table (or piezometric level),
 * the static level, the aquifer top and base, and the wells the line passes within `wellBand_m` of.
 * Vertical exaggeration is stated, because sections of dewatering are always exaggerated.
 */
import { html, svg, nothing } from 'lit';
import { LightElement } from './light-element';
import type { Scenario } from '../../shared/schema';
import type { SectionResult } from '../worker/engine-protocol';
import { isPointInPolygon } from '../../shared/geometry';
import { fromSi, formatNumber, type DisplayUnits } from '../../shared/units';
import { linearScale, niceTicks } from './chart-axes';

/** Wells within this distance of the section line are drawn on it, m (or 2 % of its length). */
const WELL_BAND_M = 2;

export class SectionChart extends LightElement {
  static override properties = { section: { attribute: false }, scenario: { attribute: false }, units: { attribute: false } };
  declare section: SectionResult | null;
  declare scenario: Scenario | undefined;
  declare units: DisplayUnits;

  constructor() {
    super();
    this.section = null;
  }

  /** Wells near the line: distance along it and offset from it, m. */
  wellsCut(): Array<{ id: string; along_m: number; offset_m: number; bottom_m: number; top_m: number; kind: string }> {
    const s = this.scenario;
    const sec = this.section;
    if (!s || !sec) return [];
    const [x0, y0] = sec.from;
    const dx = sec.to[0] - x0;
    const dy = sec.to[1] - y0;
    const len = Math.hypot(dx, dy);
    if (len === 0) return [];
    const band = Math.max(WELL_BAND_M, 0.02 * len);
    const out = [];
    for (const w of s.wells) {
      const t = ((w.x - x0) * dx + (w.y - y0) * dy) / (len * len);
      if (t < 0 || t > 1) continue;
      const off = Math.abs((w.x - x0) * dy - (w.y - y0) * dx) / len;
      if (off > band) continue;
      out.push({ id: w.id, along_m: t * len, offset_m: off, kind: w.kind, top_m: s.groundLevel_m, bottom_m: w.screenBottom_m ?? s.aquifer.base_m });
    }
    return out;
  }

  override render() {
    const sec = this.section;
    const s = this.scenario;
    if (!sec || !s || sec.points.length < 2) return html`<p class="dd-hint">Draw a section line with the Section tool: click its start A, then its end B.</p>`;
    const u = this.units.length;
    const W = 640, H = 250, L = 52, R = 14, T = 14, B = 34;
    const a = s.aquifer;
    const length = sec.points[sec.points.length - 1]!.distance_m;
    const pitAt = sec.points.map((p) => s.excavations.find((e) => isPointInPolygon(p.x, p.y, e.outline)) ?? null);
    const levels = sec.points.map((p) => p.level_m);
    const lo = Math.min(a.base_m, ...levels, ...s.excavations.map((e) => e.formationLevel_m - e.margin_m));
    const hi = Math.max(s.groundLevel_m, a.staticLevel_m);
    const pad = (hi - lo) * 0.06;
    const x = linearScale(0, fromSi(length, u), L, W - R);
    const y = linearScale(fromSi(lo - pad, u), fromSi(hi + pad, u), H - B, T);
    const X = (d_m: number) => x(fromSi(d_m, u));
    const Y = (z_m: number) => y(fromSi(z_m, u));
    const exaggeration = ((H - B - T) / (hi - lo + 2 * pad)) / ((W - R - L) / Math.max(length, 1e-9));
    // Ground profile: the pit floor (formation) inside excavations, ground level elsewhere.
    const ground = sec.points.map((p, i) => `${i ? 'L' : 'M'}${X(p.distance_m).toFixed(1)},${Y(pitAt[i] ? pitAt[i]!.formationLevel_m : s.groundLevel_m).toFixed(1)}`).join('');
    const water = sec.points.map((p, i) => `${i ? 'L' : 'M'}${X(p.distance_m).toFixed(1)},${Y(p.level_m).toFixed(1)}`).join('');
    const targets: Array<{ x0: number; x1: number; z: number; above: boolean }> = [];
    let run: { x0: number; x1: number; z: number; above: boolean } | null = null;
    sec.points.forEach((p, i) => {
      const e = pitAt[i];
      const z = e ? e.formationLevel_m - e.margin_m : null;
      if (z !== null && run && run.z === z) {
        run.x1 = p.distance_m;
        run.above ||= p.level_m > z;
      } else {
        if (run) targets.push(run);
        run = z !== null ? { x0: p.distance_m, x1: p.distance_m, z, above: p.level_m > z } : null;
      }
    });
    if (run) targets.push(run);
    const xTicks = niceTicks(0, fromSi(length, u), 6);
    const yTicks = niceTicks(fromSi(lo - pad, u), fromSi(hi + pad, u), 5);
    const wells = this.wellsCut();
    const confined = a.kind !== 'unconfined' && a.top_m !== undefined;
    return html`<svg class="dd-chart dd-section" viewBox="0 0 ${W} ${H}" role="img" aria-label="Cross-section A to B">
      <defs><pattern id="dd-base-hatch" width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)"><line x1="0" y1="0" x2="0" y2="6" class="dd-hatch-line"></line></pattern></defs>
      ${yTicks.map((v) => svg`<line class="dd-grid" x1=${L} x2=${W - R} y1=${y(v)} y2=${y(v)}></line><text class="dd-tick" x=${L - 4} y=${y(v) + 3} text-anchor="end">${formatNumber(v, { significant: 4 })}</text>`)}
      ${xTicks.map((v) => svg`<text class="dd-tick" x=${x(v)} y=${H - B + 13} text-anchor="middle">${formatNumber(v, { significant: 4 })}</text>`)}
      <rect class="dd-base" x=${L} y=${Y(a.base_m)} width=${W - R - L} height=${Math.max(0, H - B - Y(a.base_m))} fill="url(#dd-base-hatch)"></rect>
      <line class="dd-base-line" x1=${L} x2=${W - R} y1=${Y(a.base_m)} y2=${Y(a.base_m)}></line>
      ${confined ? svg`<line class="dd-top-line" x1=${L} x2=${W - R} y1=${Y(a.top_m!)} y2=${Y(a.top_m!)}></line><text class="dd-tick" x=${W - R - 2} y=${Y(a.top_m!) - 3} text-anchor="end">aquifer top</text>` : nothing}
      <line class="dd-static" x1=${L} x2=${W - R} y1=${Y(a.staticLevel_m)} y2=${Y(a.staticLevel_m)}></line>
      <path class="dd-ground" d=${ground}></path>
      ${targets.map((t) => svg`<line class="dd-target ${t.above ? 'dd-target-short' : ''}" x1=${X(t.x0)} x2=${X(t.x1)} y1=${Y(t.z)} y2=${Y(t.z)}></line>`)}
      ${wells.map((w) => svg`<g class="dd-section-well"><line x1=${X(w.along_m)} x2=${X(w.along_m)} y1=${Y(w.top_m)} y2=${Y(w.bottom_m)}></line>
        <text class="dd-tick" x=${X(w.along_m)} y=${Y(w.top_m) - 3} text-anchor="middle">${w.id}</text></g>`)}
      <path class="dd-water" d=${water}></path>
      <text class="dd-end" x=${L} y=${T - 2}>A</text><text class="dd-end" x=${W - R} y=${T - 2} text-anchor="end">B</text>
      <text class="dd-axis" x=${12} y=${T + (H - B - T) / 2} transform="rotate(-90 12 ${T + (H - B - T) / 2})" text-anchor="middle">elevation (${u})</text>
      <text class="dd-axis" x=${L + (W - R - L) / 2} y=${H - 3} text-anchor="middle">distance along A→B (${u}) · vertical exaggeration ×${formatNumber(exaggeration, { significant: 2 })}</text>
    </svg>
    <ul class="dd-section-key">
      <li><span class="dd-k dd-k-ground"></span>Ground / formation</li>
      <li><span class="dd-k dd-k-target"></span>Target (formation − margin)</li>
      <li><span class="dd-k dd-k-water"></span>${a.kind === 'unconfined' ? 'Computed water table' : 'Computed piezometric level'}</li>
      <li><span class="dd-k dd-k-static"></span>Static level</li>
      <li><span class="dd-k dd-k-well"></span>Wells within ${formatNumber(fromSi(Math.max(WELL_BAND_M, 0.02 * length), u), { significant: 2 })} ${u} of the line (${wells.length})</li>
    </ul>`;
  }
}
if (!customElements.get('section-chart')) customElements.define('section-chart', SectionChart);
