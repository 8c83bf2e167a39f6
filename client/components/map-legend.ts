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
import { SHORTFALL_AREA_KINDS, SHORTFALL_SYMBOLS, shortfallSwatchCss } from '../map/shortfall-symbols';

export class MapLegend extends LightElement {
  static override properties = {
    result: { attribute: false }, units: { attribute: false }, staticLevel_m: { type: Number }, collapsed: { state: true },
    computing: { type: Number }, paused: { type: Boolean },
  };
  declare result: FieldResult | null;
  declare units: DisplayUnits;
  declare staticLevel_m: number;
  declare collapsed: boolean;
  declare computing: number;
  /** Results paused by an invalid field: the key is greyed and says the picture is not current. */
  declare paused: boolean;

  constructor() {
    super();
    this.result = null;
    this.staticLevel_m = 0;
    // On a phone the key starts folded so the plan stays visible.
    this.collapsed = typeof window !== 'undefined' && window.innerWidth < 820;
    this.computing = -1;
    this.paused = false;
  }

  override render() {
    const r = this.result;
    const u = this.units;
    if (this.collapsed) return html`<button type="button" class="dd-legend-toggle" @click=${() => (this.collapsed = false)}>Key ▸</button>`;
    const levels = r?.levels ?? [];
    const dmax = Math.max(r?.colourMax_m ?? r?.drawdownRange.max ?? 1, 1e-6);
    const fixedScale = r && r.colourTime_s !== undefined && r.colourTime_s !== r.time_s;
    const toDrawdown = (v: number) => (r?.quantity === 'level' ? this.staticLevel_m - v : v);
    // Steps listed deepest drawdown first, so the scale reads like the ground: dark = deep.
    const steps = levels.map((lv, i) => ({ lv, next: levels[i + 1] ?? r!.range.max }));
    const ordered = r?.quantity === 'level' ? steps : steps.slice().reverse();
    return html`<div class="dd-legend ${this.paused ? 'dd-stale' : ''}" aria-label="Map key">
      <div class="dd-legend-head"><strong>${r?.quantity === 'level' ? 'Groundwater level' : 'Drawdown'}</strong>
        <span>${r ? formatDuration(r.time_s) : ''}</span>
        <button type="button" class="dd-icon" title="Hide key" @click=${() => (this.collapsed = true)}>▾</button></div>
      ${this.computing >= 0 ? html`<div class="dd-progress" role="progressbar" aria-valuemin="0" aria-valuemax="100" aria-valuenow=${Math.round(this.computing * 100)}>
        <span style="width:${Math.round(this.computing * 100)}%"></span><em>Computing ${Math.round(this.computing * 100)} %</em></div>` : nothing}
      ${this.paused && r ? html`<p class="dd-legend-stale-note" role="status">Not computed for the current inputs: the greyed picture is the last result. Fix the field named above.</p>` : nothing}
      ${r && levels.length > 0 ? html`<ol class="dd-scale">${ordered.slice(0, 16).map(({ lv, next }) => html`<li>
          <span class="dd-swatch" style="background:${drawdownColour(Math.abs(toDrawdown((lv + next) / 2)) / dmax)}"></span>
          ${formatQuantity(lv, u.length, { decimals: levelDecimals(levels, toSi(1, u.length)) })}</li>`)}</ol>`
        : html`<p class="dd-hint">${r ? 'Flat field: no contours at this time.' : 'No results yet.'}</p>`}
      ${r && r.levelsWanted ? html`<p class="dd-legend-scale-note" data-note="levels-capped">That interval needs ${r.levelsWanted} contours; drawn every ${formatQuantity(r.levels.length > 1 ? Math.abs(r.levels[1]! - r.levels[0]!) : 0, u.length, { significant: 3 })} instead (at most 60).</p>` : nothing}
      ${r && levels.length > 0 ? html`<p class="dd-legend-scale-note" data-note="colour-scale">${fixedScale
        ? `Colours: the design time's scale (${formatDuration(r.colourTime_s ?? null)}, up to ${formatQuantity(dmax, u.length, { decimals: 2 })} drawdown), the same at every time.`
        : `Colours: up to ${formatQuantity(dmax, u.length, { decimals: 2 })} drawdown${r.colourTime_s !== undefined ? ', kept for every time on the slider' : ''}.`}</p>` : nothing}
      <ul class="dd-symbols">
        ${KEY_SYMBOLS.filter(([key]) => key !== 'shortfall-water').map(([key, cls]) => html`<li><span class="dd-sym dd-sym-svg ${cls}">${unsafeSVG(planSymbolSwatchSvg(key))}</span>${PLAN_SYMBOL_LABELS[key]}</li>`)}
        ${SHORTFALL_AREA_KINDS.map((k) => html`<li data-key=${k}><span class="dd-sym dd-sym-shortfall" style="color:${SHORTFALL_SYMBOLS[k].colour};border-style:${SHORTFALL_SYMBOLS[k].dash.length ? 'dashed' : 'solid'};background:${shortfallSwatchCss(k)}"></span>${SHORTFALL_SYMBOLS[k].label} <b class="dd-key-glyph" style="color:${SHORTFALL_SYMBOLS[k].colour}">${SHORTFALL_SYMBOLS[k].glyph}</b></li>`)}
        <li><span class="dd-sym dd-sym-svg dd-sym-receptor">${unsafeSVG(planSymbolSwatchSvg('receptor-point'))}</span>${PLAN_SYMBOL_LABELS['receptor-point']}</li>
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
