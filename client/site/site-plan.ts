/**
 * <site-plan>: the plan for a phone — excavations, numbered wells, piezometers, level contours and,
 * when the user allows it, their own position. SVG, so it works without map tiles. Symbols are the
 * one plan set (`shared/exports/plan-symbols.ts`) the designer map and the report use.
 *
 * Text and symbols keep their screen size (about 13 px labels) whatever the viewport, and the plan
 * zooms and pans: buttons, the wheel, a drag, or two fingers. At the whole-plan view a one-finger
 * vertical drag still scrolls the page. Site y (northing) grows up; SVG y grows down.
 */
import { LitElement, css, svg, html, nothing } from 'lit';
import { unsafeSVG } from 'lit/directives/unsafe-svg.js';
import type { Scenario } from '../../shared/schema';
import { getReceptors } from '../../shared/schema/receptor-schema';
import {
  BOUNDARY_SYMBOLS, EXCAVATION_SYMBOL, PLAN_COLOURS, piezometerSymbolSvg, receptorSymbolSvg, shortfallEdge, shortfallPatternSvg, wellSymbol, wellSymbolSvg, type ReceptorVerdict, type ShortfallAreaKind,
} from '../../shared/exports/plan-symbols';
import type { LinkView } from './site-api';

export interface PlanPosition {
  x: number;
  y: number;
  accuracy_m: number;
}

interface Box { x: number; y: number; w: number; h: number }

/** Drawing width of the whole plan, SVG units. */
const W = 1000;
/** Label size on screen, px. */
const LABEL_PX = 13;
const MAX_ZOOM = 40;

export class SitePlan extends LitElement {
  static override properties = {
    scenario: { attribute: false },
    contours: { attribute: false },
    position: { attribute: false },
    selected: { type: Number },
    shortfall: { attribute: false },
    receptorVerdicts: { attribute: false },
    box: { state: true },
    width_px: { state: true },
  };
  declare scenario: Scenario | null;
  declare contours: LinkView['contours'];
  declare position: PlanPosition | null;
  declare selected: number;
  /** Excavations not meeting their target, by id, with the kind of shortfall. */
  declare shortfall: Readonly<Record<string, ShortfallAreaKind>>;
  /** The design's verdict per receptor id (colours the receptor symbols). */
  declare receptorVerdicts: Readonly<Record<string, ReceptorVerdict>>;
  /** The visible part of the drawing (viewBox); null: the whole plan. */
  declare box: Box | null;
  /** Shown width of the drawing, CSS px. */
  declare width_px: number;
  private resize: ResizeObserver | null = null;
  private pointers = new Map<number, { x: number; y: number }>();
  private gesture: { box: Box; points: Array<{ x: number; y: number }> } | null = null;

  static override styles = css`
    :host { display: block; position: relative; }
    svg { display: block; width: 100%; height: auto; background: #fbfcfd; border: 1px solid #9aa7b4; border-radius: 6px; user-select: none; -webkit-user-select: none; }
    svg.zoomed { touch-action: none; cursor: grab; }
    svg.whole { touch-action: pan-y; }
    .well { cursor: pointer; }
    text { font-family: system-ui, sans-serif; paint-order: stroke; stroke: #fbfcfd; stroke-linejoin: round; }
    .zoom { position: absolute; right: 0.4rem; top: 0.4rem; display: flex; flex-direction: column; gap: 0.3rem; }
    .zoom button { width: 2.6rem; height: 2.6rem; min-height: 0; padding: 0; border-radius: 6px; border: 1px solid #124; background: #fff; color: #124; font: 600 1.2rem/1 system-ui, sans-serif; cursor: pointer; }
    .zoom button.fit { font-size: 0.7rem; }
  `;

  constructor() {
    super();
    this.scenario = null;
    this.contours = null;
    this.position = null;
    this.selected = -1;
    this.shortfall = {};
    this.receptorVerdicts = {};
    this.box = null;
    this.width_px = 0;
  }

  override connectedCallback(): void {
    super.connectedCallback();
    if (typeof ResizeObserver !== 'undefined') {
      this.resize = new ResizeObserver((entries) => {
        const w = entries[0]?.contentRect.width ?? 0;
        if (w > 0 && Math.abs(w - this.width_px) > 0.5) this.width_px = w;
      });
      this.resize.observe(this);
    }
  }

  override disconnectedCallback(): void {
    super.disconnectedCallback();
    this.resize?.disconnect();
    this.resize = null;
  }

  private extent(s: Scenario): { minX: number; minY: number; maxX: number; maxY: number } {
    const xs: number[] = [];
    const ys: number[] = [];
    for (const w of s.wells) { xs.push(w.x); ys.push(w.y); }
    for (const e of s.excavations) for (const [x, y] of e.outline) { xs.push(x); ys.push(y); }
    for (const p of piezometersOf(s)) { xs.push(p.x); ys.push(p.y); }
    for (const r of getReceptors(s)) for (const [x, y] of r.geometry.type === 'Point' ? [r.geometry.coordinates] : r.geometry.coordinates) { xs.push(x); ys.push(y); }
    if (xs.length === 0) return { minX: -50, minY: -50, maxX: 50, maxY: 50 };
    const minX = Math.min(...xs), maxX = Math.max(...xs), minY = Math.min(...ys), maxY = Math.max(...ys);
    const pad = Math.max(5, 0.12 * Math.max(maxX - minX, maxY - minY));
    return { minX: minX - pad, minY: minY - pad, maxX: maxX + pad, maxY: maxY + pad };
  }

  /** The whole drawing, SVG units. */
  private whole(s: Scenario): Box & { scale: number; ext: ReturnType<SitePlan['extent']> } {
    const ext = this.extent(s);
    const scale = W / (ext.maxX - ext.minX);
    return { x: 0, y: 0, w: W, h: Math.max(300, Math.round((ext.maxY - ext.minY) * scale)), scale, ext };
  }

  /** Zooms by `factor` (> 1: in) about a drawing point (default the centre of the view). */
  zoomBy(factor: number, about?: { x: number; y: number }): void {
    const s = this.scenario;
    if (!s) return;
    const all = this.whole(s);
    const b = this.box ?? all;
    const w = Math.min(all.w, Math.max(all.w / MAX_ZOOM, b.w / factor));
    const k = w / b.w;
    const c = about ?? { x: b.x + b.w / 2, y: b.y + b.h / 2 };
    this.setBox({ x: c.x - (c.x - b.x) * k, y: c.y - (c.y - b.y) * k, w, h: b.h * k }, all);
  }

  /** Back to the whole plan. */
  fit(): void {
    this.box = null;
  }

  private setBox(b: Box, all: Box): void {
    if (b.w >= all.w - 1e-6) {
      this.box = null;
      return;
    }
    // Keep some of the plan in view.
    const x = Math.min(all.w - b.w * 0.2, Math.max(-b.w * 0.8, b.x));
    const y = Math.min(all.h - b.h * 0.2, Math.max(-b.h * 0.8, b.y));
    this.box = { x, y, w: b.w, h: b.h };
  }

  /** Screen point → drawing point of the current view. */
  private toDrawing(svgEl: SVGSVGElement, clientX: number, clientY: number, view: Box): { x: number; y: number } {
    const r = svgEl.getBoundingClientRect();
    return { x: view.x + ((clientX - r.left) / r.width) * view.w, y: view.y + ((clientY - r.top) / r.height) * view.h };
  }

  private onWheel(ev: WheelEvent): void {
    const s = this.scenario;
    if (!s || !(ev.ctrlKey || this.box)) return; // a plain wheel over the whole plan scrolls the page
    ev.preventDefault();
    const svgEl = ev.currentTarget as SVGSVGElement;
    const view = this.box ?? this.whole(s);
    this.zoomBy(Math.exp(-ev.deltaY * 0.0025), this.toDrawing(svgEl, ev.clientX, ev.clientY, view));
  }

  private onPointerDown(ev: PointerEvent): void {
    const s = this.scenario;
    if (!s) return;
    this.pointers.set(ev.pointerId, { x: ev.clientX, y: ev.clientY });
    // One pointer pans a zoomed plan; two pinch at any zoom.
    if (this.pointers.size === 2 || (this.pointers.size === 1 && this.box)) {
      (ev.currentTarget as Element).setPointerCapture?.(ev.pointerId);
      this.gesture = { box: this.box ?? this.whole(s), points: [...this.pointers.values()] };
    }
  }

  private onPointerMove(ev: PointerEvent): void {
    if (!this.pointers.has(ev.pointerId)) return;
    this.pointers.set(ev.pointerId, { x: ev.clientX, y: ev.clientY });
    const g = this.gesture;
    const s = this.scenario;
    if (!g || !s) return;
    const svgEl = ev.currentTarget as SVGSVGElement;
    const r = svgEl.getBoundingClientRect();
    const perPx = g.box.w / r.width;
    const now = [...this.pointers.values()];
    const all = this.whole(s);
    if (now.length >= 2 && g.points.length >= 2) {
      const [a0, b0] = g.points as [{ x: number; y: number }, { x: number; y: number }];
      const [a1, b1] = now as [{ x: number; y: number }, { x: number; y: number }];
      const k = Math.hypot(a0.x - b0.x, a0.y - b0.y) / Math.max(1, Math.hypot(a1.x - b1.x, a1.y - b1.y));
      const m0 = { x: (a0.x + b0.x) / 2, y: (a0.y + b0.y) / 2 };
      const m1 = { x: (a1.x + b1.x) / 2, y: (a1.y + b1.y) / 2 };
      const about = { x: g.box.x + (m0.x - r.left) * perPx, y: g.box.y + (m0.y - r.top) * perPx };
      const w = Math.min(all.w, Math.max(all.w / MAX_ZOOM, g.box.w * k));
      const kk = w / g.box.w;
      this.setBox({ x: about.x - (about.x - g.box.x) * kk - (m1.x - m0.x) * perPx * kk, y: about.y - (about.y - g.box.y) * kk - (m1.y - m0.y) * perPx * kk, w, h: g.box.h * kk }, all);
    } else if (now.length === 1 && g.points.length === 1) {
      const p0 = g.points[0]!;
      const p1 = now[0]!;
      this.setBox({ ...g.box, x: g.box.x - (p1.x - p0.x) * perPx, y: g.box.y - (p1.y - p0.y) * perPx }, all);
    }
  }

  private onPointerUp(ev: PointerEvent): void {
    this.pointers.delete(ev.pointerId);
    const s = this.scenario;
    // A finger lifted from a pinch: the other carries on as a pan from here.
    this.gesture = s && this.pointers.size > 0 && this.box ? { box: this.box, points: [...this.pointers.values()] } : null;
  }

  override render() {
    const s = this.scenario;
    if (!s) return nothing;
    const all = this.whole(s);
    const { ext, scale } = all;
    const view = this.box ?? all;
    // Drawing units per screen pixel: text and symbols keep their screen size when zoomed or on a phone.
    const u = view.w / (this.width_px > 0 ? this.width_px : 640);
    const X = (x: number) => (x - ext.minX) * scale;
    const Y = (y: number) => (ext.maxY - y) * scale;
    const d = (pts: ReadonlyArray<readonly [number, number]>, close: boolean) =>
      pts.map(([x, y], i) => `${i ? 'L' : 'M'}${X(x).toFixed(1)},${Y(y).toFixed(1)}`).join('') + (close ? 'Z' : '');
    const font = LABEL_PX * u;
    const halo = 3 * u;
    const barTarget = (view.w / scale) / 4;
    const p10 = 10 ** Math.floor(Math.log10(barTarget));
    const bar = [5, 2, 1].map((f) => f * p10).find((v) => v <= barTarget) ?? p10;
    const pos = this.position;
    const kinds = [...new Set(Object.values(this.shortfall ?? {}))];
    return html`<svg class=${this.box ? 'zoomed' : 'whole'} viewBox="${view.x} ${view.y} ${view.w} ${view.h}" role="img" aria-label="Site plan: wells, excavations and piezometers"
        data-zoom=${(all.w / view.w).toFixed(2)}
        @wheel=${(e: WheelEvent) => this.onWheel(e)} @pointerdown=${(e: PointerEvent) => this.onPointerDown(e)} @pointermove=${(e: PointerEvent) => this.onPointerMove(e)}
        @pointerup=${(e: PointerEvent) => this.onPointerUp(e)} @pointercancel=${(e: PointerEvent) => this.onPointerUp(e)}>
      ${kinds.length ? svg`<defs>${unsafeSVG(kinds.map((k) => shortfallPatternSvg(k, u)).join(''))}</defs>` : nothing}
      ${(this.contours?.lines ?? []).map((line) => {
        const first = line.coordinates[0];
        const mid = first?.[Math.floor(first.length / 2)];
        return svg`<g>${line.coordinates.map((part) => svg`<path d=${d(part, false)} fill="none" stroke="#7fb0d6" stroke-width=${1.5 * u}/>`)}
          ${mid ? svg`<text x=${X(mid[0])} y=${Y(mid[1])} font-size=${font * 0.85} stroke-width=${halo} fill="#3a78a8">${Number(line.level_m.toFixed(2))}</text>` : nothing}</g>`;
      })}
      ${(s.boundaries ?? []).map((b) => {
        const sym = BOUNDARY_SYMBOLS[b.kind];
        return svg`<path d=${d([b.from, b.to], false)} stroke=${sym.stroke} stroke-width=${sym.strokeWidth_px * u} stroke-dasharray=${sym.dash_px ? sym.dash_px.split(' ').map((v) => Number(v) * u).join(' ') : 'none'}/>`;
      })}
      ${s.excavations.map((e) => {
        const kind = this.shortfall?.[e.id];
        const edge = kind ? shortfallEdge(kind) : { stroke: EXCAVATION_SYMBOL.stroke, dash_px: null };
        return svg`<path d=${d(e.outline, true)} fill=${kind ? `url(#dd-hatch-${kind})` : 'none'} fill-opacity="0.4" data-shortfall=${kind ?? 'none'}
            stroke=${edge.stroke} stroke-width=${EXCAVATION_SYMBOL.strokeWidth_px * u} stroke-dasharray=${edge.dash_px ? edge.dash_px.split(' ').map((v) => Number(v) * u).join(' ') : 'none'}/>
          <text x=${X(e.outline[0]?.[0] ?? 0)} y=${Y(e.outline[0]?.[1] ?? 0) - 5 * u} font-size=${font} stroke-width=${halo} fill=${PLAN_COLOURS.ink} font-weight="600">${e.id}</text>`;
      })}
      ${getReceptors(s).map((r) => {
        const [lx, ly] = r.geometry.type === 'Point' ? r.geometry.coordinates : r.geometry.coordinates[0]!;
        return svg`<g class="receptor" data-receptor-id=${r.id}>${unsafeSVG(receptorSymbolSvg(r.geometry, this.receptorVerdicts?.[r.id] ?? null, X, Y, u))}
          <text x=${X(lx) + 10 * u} y=${Y(ly) - 8 * u} font-size=${font * 0.9} stroke-width=${halo} fill=${PLAN_COLOURS.ink}>${r.id}</text></g>`;
      })}
      ${s.wells.map((w, i) => {
        const injecting = (w.rate_m3_s ?? w.schedule?.[0]?.rate_m3_s ?? 0) < 0;
        const sym = wellSymbol(w.kind, { active: w.active !== false, injecting });
        const selected = i === this.selected;
        return svg`<g class="well" data-well-id=${w.id} @click=${() => this.pick(i)}>
          ${selected ? svg`<circle cx=${X(w.x)} cy=${Y(w.y)} r=${(sym.radius_px + 5) * u} fill="none" stroke="#0072b2" stroke-width=${3 * u}/>` : nothing}
          ${unsafeSVG(wellSymbolSvg(X(w.x), Y(w.y), sym, u))}
          <circle cx=${X(w.x)} cy=${Y(w.y)} r=${14 * u} fill="transparent"/>
          <text x=${X(w.x) + 8 * u} y=${Y(w.y) - 6 * u} font-size=${font} stroke-width=${halo} fill=${PLAN_COLOURS.ink}>${i + 1}</text></g>`;
      })}
      ${piezometersOf(s).map((p) => svg`<g class="piezometer" data-piezometer-id=${p.id}>${unsafeSVG(piezometerSymbolSvg(X(p.x), Y(p.y), u))}
        <text x=${X(p.x) + 9 * u} y=${Y(p.y) + 14 * u} font-size=${font * 0.9} stroke-width=${halo} fill=${PLAN_COLOURS.ink}>${p.id}</text></g>`)}
      ${pos
        ? svg`<g aria-label="your position"><circle cx=${X(pos.x)} cy=${Y(pos.y)} r=${Math.max(10 * u, pos.accuracy_m * scale)} fill="rgba(30,120,255,0.15)" stroke="rgba(30,120,255,0.6)"/>
            <circle cx=${X(pos.x)} cy=${Y(pos.y)} r=${7 * u} fill="#1e78ff" stroke="#fff" stroke-width=${2.5 * u}/></g>`
        : nothing}
      <g transform="translate(${view.x + 12 * u},${view.y + view.h - 12 * u})"><rect width=${bar * scale} height=${5 * u} fill="#000"/><text y=${-5 * u} font-size=${font * 0.9} stroke-width=${halo}>${bar} m</text></g>
      <g transform="translate(${view.x + view.w - 70 * u},${view.y + 30 * u})"><path d="M0,${-20 * u} L${7 * u},0 L0,${-5 * u} L${-7 * u},0 Z" fill="#000"/><text y=${15 * u} font-size=${font * 0.8} stroke-width=${halo} text-anchor="middle">grid N</text></g>
    </svg>
    <div class="zoom">
      <button type="button" name="zoom-in" aria-label="Zoom in" @click=${() => this.zoomBy(2)}>+</button>
      <button type="button" name="zoom-out" aria-label="Zoom out" @click=${() => this.zoomBy(0.5)}>−</button>
      <button type="button" name="zoom-fit" class="fit" aria-label="Whole plan" @click=${() => this.fit()}>all</button>
    </div>`;
  }

  private pick(index: number): void {
    this.dispatchEvent(new CustomEvent('well-picked', { detail: { index }, bubbles: true, composed: true }));
  }
}

function piezometersOf(s: Scenario): Array<{ id: string; x: number; y: number }> {
  return (s as Scenario & { monitoring?: { piezometers: Array<{ id: string; x: number; y: number }> } }).monitoring?.piezometers ?? [];
}
if (!customElements.get('site-plan')) customElements.define('site-plan', SitePlan);
