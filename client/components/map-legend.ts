/**
 * <map-legend>: the key to the plan — the drawdown colour steps with their contour values,
 * the symbols (well kinds, piezometers, outlines, boundaries, shortfall, validity flags present) and a short
 * caution, in the corner of the map where the results are.
 */
import { html, nothing } from 'lit';
import { LightElement } from './light-element';
import type { FieldResult } from '../worker/engine-protocol';
import { formatQuantity, toSi, type DisplayUnits } from '../../shared/units';
import { drawdownColour } from '../map/colour-scale';
import { FLAG_LABELS } from './flag-labels';
import { formatDuration } from './time-format';
import { stepDecimals } from './step-decimals';
import { unsafeSVG } from 'lit/directives/unsafe-svg.js';
import { PLAN_SYMBOL_LABELS, planSymbolSwatchSvg, type PlanSymbolKey } from '../../shared/exports/plan-symbols';

/** Symbols of the key, from the one plan symbol set, with the class names the styles and tests use. */
const KEY_SYMBOLS: Array<[PlanSymbolKey, string]> = [
  ['wellpoint', 'dd-sym-wellpoint'], ['deep', 'dd-sym-deep'], ['ejector', 'dd-sym-ejector'], ['piezometer', 'dd-sym-piezometer'],
  ['excavation', 'dd-sym-pit'], ['shortfall-water', 'dd-sym-short'], ['constant-head', 'dd-sym-ch'], ['no-flow', 'dd-sym-nf'],
];

export class MapLegend extends LightElement {
  static override properties = {
    result: { attribute: false }, units: { attribute: false }, staticLevel_m: { type: Number }, collapsed: { state: true },
    computing: { type: Number },
  };
  declare result: FieldResult | null;
  declare units: DisplayUnits;
  declare staticLevel_m: number;
  declare collapsed: boolean;
  declare computing: number;

  constructor() {
    super();
    this.result = null;
    this.staticLevel_m = 0;
    // On a phone the key starts folded so the plan stays visible.
    this.collapsed = typeof window !== 'undefined' && window.innerWidth < 820;
    this.computing = -1;
  }

  override render() {
    const r = this.result;
    const u = this.units;
    if (this.collapsed) return html`<button type="button" class="dd-legend-toggle" @click=${() => (this.collapsed = false)}>Key ▸</button>`;
    const levels = r?.levels ?? [];
    const dmax = Math.max(r?.drawdownRange.max ?? 1, 1e-6);
    const toDrawdown = (v: number) => (r?.quantity === 'level' ? this.staticLevel_m - v : v);
    // Steps listed deepest drawdown first, so the scale reads like the ground: dark = deep.
    const steps = levels.map((lv, i) => ({ lv, next: levels[i + 1] ?? r!.range.max }));
    const ordered = r?.quantity === 'level' ? steps : steps.slice().reverse();
    return html`<div class="dd-legend" aria-label="Map key">
      <div class="dd-legend-head"><strong>${r?.quantity === 'level' ? 'Groundwater level' : 'Drawdown'}</strong>
        <span>${r ? formatDuration(r.time_s) : ''}</span>
        <button type="button" class="dd-icon" title="Hide key" @click=${() => (this.collapsed = true)}>▾</button></div>
      ${this.computing >= 0 ? html`<div class="dd-progress" role="progressbar" aria-valuemin="0" aria-valuemax="100" aria-valuenow=${Math.round(this.computing * 100)}>
        <span style="width:${Math.round(this.computing * 100)}%"></span><em>Computing ${Math.round(this.computing * 100)} %</em></div>` : nothing}
      ${r && levels.length > 0 ? html`<ol class="dd-scale">${ordered.slice(0, 16).map(({ lv, next }) => html`<li>
          <span class="dd-swatch" style="background:${drawdownColour(Math.abs(toDrawdown((lv + next) / 2)) / dmax)}"></span>
          ${formatQuantity(lv, u.length, { decimals: levelDecimals(levels, toSi(1, u.length)) })}</li>`)}</ol>`
        : html`<p class="dd-hint">${r ? 'Flat field: no contours at this time.' : 'No results yet.'}</p>`}
      <ul class="dd-symbols">
        ${KEY_SYMBOLS.map(([key, cls]) => html`<li><span class="dd-sym dd-sym-svg ${cls}">${unsafeSVG(planSymbolSwatchSvg(key))}</span>${PLAN_SYMBOL_LABELS[key]}</li>`)}
        <li><span class="dd-sym dd-sym-receptor"></span>Neighbour (receptor; green within limits, red over)</li>
        ${(r?.flagAreas ?? []).map((f) => html`<li class="dd-legend-flag"><span class="dd-sym dd-sym-flag-${f.flag}"></span>${FLAG_LABELS[f.flag]?.title ?? f.flag}</li>`)}
      </ul>
      <p class="dd-legend-caution">Idealised model — estimates only; see Results for limits.</p>
    </div>`;
  }
}

function levelDecimals(levels: number[], unit_m: number): number {
  const step = levels.length > 1 ? Math.abs(levels[1]! - levels[0]!) / unit_m : 1;
  return Math.max(1, stepDecimals(step));
}
if (!customElements.get('map-legend')) customElements.define('map-legend', MapLegend);
