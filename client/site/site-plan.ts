/**
 * <site-plan>: the plan for a phone — excavations, numbered wells, piezometers, level contours and,
 * when the user allows it, their own position. SVG, so it stays sharp when pinched and works
 * without map tiles. Site y (northing) grows up; SVG y grows down.
 */
import { LitElement, css, svg, html, nothing } from 'lit';
import type { Scenario } from '../../shared/schema';
import type { LinkView } from './site-api';

export interface PlanPosition {
  x: number;
  y: number;
  accuracy_m: number;
}

export class SitePlan extends LitElement {
  static override properties = {
    scenario: { attribute: false },
    contours: { attribute: false },
    position: { attribute: false },
    selected: { type: Number },
  };
  declare scenario: Scenario | null;
  declare contours: LinkView['contours'];
  declare position: PlanPosition | null;
  declare selected: number;

  static override styles = css`
    :host { display: block; }
    svg { width: 100%; height: auto; background: #fbfcfd; border: 1px solid #9aa7b4; border-radius: 6px; touch-action: pinch-zoom; }
    .well { cursor: pointer; }
    text { font-family: system-ui, sans-serif; }
  `;

  constructor() {
    super();
    this.scenario = null;
    this.contours = null;
    this.position = null;
    this.selected = -1;
  }

  private extent(s: Scenario): { minX: number; minY: number; maxX: number; maxY: number } {
    const xs: number[] = [];
    const ys: number[] = [];
    for (const w of s.wells) { xs.push(w.x); ys.push(w.y); }
    for (const e of s.excavations) for (const [x, y] of e.outline) { xs.push(x); ys.push(y); }
    const monitoring = (s as Scenario & { monitoring?: { piezometers: Array<{ x: number; y: number }> } }).monitoring;
    for (const p of monitoring?.piezometers ?? []) { xs.push(p.x); ys.push(p.y); }
    if (xs.length === 0) return { minX: -50, minY: -50, maxX: 50, maxY: 50 };
    const minX = Math.min(...xs), maxX = Math.max(...xs), minY = Math.min(...ys), maxY = Math.max(...ys);
    const pad = Math.max(5, 0.12 * Math.max(maxX - minX, maxY - minY));
    return { minX: minX - pad, minY: minY - pad, maxX: maxX + pad, maxY: maxY + pad };
  }

  override render() {
    const s = this.scenario;
    if (!s) return nothing;
    const ext = this.extent(s);
    const W = 1000;
    const scale = W / (ext.maxX - ext.minX);
    const H = Math.max(300, Math.round((ext.maxY - ext.minY) * scale));
    const X = (x: number) => (x - ext.minX) * scale;
    const Y = (y: number) => (ext.maxY - y) * scale;
    const d = (pts: ReadonlyArray<readonly [number, number]>, close: boolean) =>
      pts.map(([x, y], i) => `${i ? 'L' : 'M'}${X(x).toFixed(1)},${Y(y).toFixed(1)}`).join('') + (close ? 'Z' : '');
    const fontPx = 22;
    const monitoring = (s as Scenario & { monitoring?: { piezometers: Array<{ id: string; x: number; y: number }> } }).monitoring;
    const barTarget = (ext.maxX - ext.minX) / 4;
    const p10 = 10 ** Math.floor(Math.log10(barTarget));
    const bar = [5, 2, 1].map((f) => f * p10).find((v) => v <= barTarget) ?? p10;
    const pos = this.position;
    return html`<svg viewBox="0 0 ${W} ${H}" role="img" aria-label="Site plan: wells, excavations and piezometers">
      ${(this.contours?.lines ?? []).map((line) => svg`<g>${line.coordinates.map((part) => svg`<path d=${d(part, false)} fill="none" stroke="#7fb0d6" stroke-width="1.5"/>`)}
        ${line.coordinates[0]?.[0] ? svg`<text x=${X(line.coordinates[0][Math.floor(line.coordinates[0].length / 2)]?.[0] ?? 0)} y=${Y(line.coordinates[0][Math.floor(line.coordinates[0].length / 2)]?.[1] ?? 0)} font-size="16" fill="#3a78a8">${Number(line.level_m.toFixed(2))}</text>` : nothing}</g>`)}
      ${(s.boundaries ?? []).map((b) => svg`<path d=${d([b.from, b.to], false)} stroke=${b.kind === 'constant-head' ? '#0a8' : '#a50'} stroke-width="4" stroke-dasharray="14 7"/>`)}
      ${s.excavations.map((e) => svg`<path d=${d(e.outline, true)} fill="rgba(200,60,40,0.10)" stroke="#c33" stroke-width="3"/>
        <text x=${X(e.outline[0]?.[0] ?? 0)} y=${Y(e.outline[0]?.[1] ?? 0) - 8} font-size=${fontPx} fill="#a22" font-weight="600">${e.id}</text>`)}
      ${(monitoring?.piezometers ?? []).map((p) => svg`<rect x=${X(p.x) - 9} y=${Y(p.y) - 9} width="18" height="18" fill="#2a2" stroke="#050" stroke-width="2"/>
        <text x=${X(p.x) + 14} y=${Y(p.y) + 22} font-size=${fontPx * 0.8} fill="#050">${p.id}</text>`)}
      ${s.wells.map((w, i) => svg`<g class="well" @click=${() => this.pick(i)}>
        <circle cx=${X(w.x)} cy=${Y(w.y)} r=${i === this.selected ? 13 : 8} fill=${w.active === false ? '#fff' : i === this.selected ? '#e80' : '#124'} stroke="#124" stroke-width="2"/>
        <text x=${X(w.x) + 11} y=${Y(w.y) - 10} font-size=${fontPx * 0.8} fill="#124">${i + 1}</text></g>`)}
      ${pos
        ? svg`<g aria-label="your position"><circle cx=${X(pos.x)} cy=${Y(pos.y)} r=${Math.max(10, pos.accuracy_m * scale)} fill="rgba(30,120,255,0.15)" stroke="rgba(30,120,255,0.6)"/>
            <circle cx=${X(pos.x)} cy=${Y(pos.y)} r="9" fill="#1e78ff" stroke="#fff" stroke-width="3"/></g>`
        : nothing}
      <g transform="translate(20,${H - 24})"><rect width=${bar * scale} height="8" fill="#000"/><text y="-6" font-size="18">${bar} m</text></g>
      <g transform="translate(${W - 40},50)"><path d="M0,-30 L10,0 L0,-7 L-10,0 Z" fill="#000"/><text y="22" font-size="16" text-anchor="middle">grid N</text></g>
    </svg>`;
  }

  private pick(index: number): void {
    this.dispatchEvent(new CustomEvent('well-picked', { detail: { index }, bubbles: true, composed: true }));
  }
}
if (!customElements.get('site-plan')) customElements.define('site-plan', SitePlan);
