/**
 * The plan as an SVG string: excavations, numbered wells, boundaries, piezometers, level contours
 * with labels, a scale bar and a north arrow. Used by the printable report; the site view draws
 * the same picture live. Symbols come from `plan-symbols.ts`, the set the designer map uses. Site y (northing) grows up; SVG y grows down, hence the flip.
 */
import type { Scenario } from '../schema';
import { planExtent, type PlanResults } from './plan-results';
import { escapeHtml } from './escape-html';
import { getReceptors } from '../schema/receptor-schema';
import { BOUNDARY_SYMBOLS, EXCAVATION_SYMBOL, PLAN_COLOURS, piezometerSymbolSvg, receptorSymbolSvg, shortfallEdge, shortfallPatternSvg, wellSymbol, wellSymbolSvg, type ReceptorVerdict, type ShortfallAreaKind } from './plan-symbols';

/** Options for `renderPlanSvg`. */
export interface PlanSvgOptions {
  scenario: Scenario;
  results?: PlanResults;
  /** Drawing width, px. Default 720. */
  width_px?: number;
  /** Excavations whose target is not met, by id, with the kind of shortfall (hatched). */
  shortfall?: Readonly<Record<string, ShortfallAreaKind>>;
  /** The last design's verdict per receptor id (colours the receptor symbols); none = not checked. */
  receptorVerdicts?: Readonly<Record<string, ReceptorVerdict>>;
}

function niceLength(target: number): number {
  const p = 10 ** Math.floor(Math.log10(target));
  return [1, 2, 5, 10].map((f) => f * p).reverse().find((v) => v <= target) ?? p;
}

/** The plan drawing as standalone SVG markup. */
export function renderPlanSvg(options: PlanSvgOptions): string {
  const { scenario, results } = options;
  const { min, max } = planExtent(scenario);
  const w = options.width_px ?? 720;
  const spanX = max[0] - min[0];
  const spanY = max[1] - min[1];
  const scale = w / spanX;
  const h = Math.max(120, Math.round(spanY * scale));
  const sx = (x: number) => ((x - min[0]) * scale).toFixed(1);
  const sy = (y: number) => ((max[1] - y) * scale).toFixed(1);
  const path = (pts: ReadonlyArray<readonly [number, number]>, close: boolean) =>
    pts.map(([x, y], i) => `${i === 0 ? 'M' : 'L'}${sx(x)},${sy(y)}`).join('') + (close ? 'Z' : '');
  const parts: string[] = [];
  parts.push(`<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${w} ${h}" width="100%" role="img" aria-label="Plan of wells, excavations and groundwater-level contours">`);
  parts.push(`<rect x="0" y="0" width="${w}" height="${h}" fill="#fff" stroke="#888"/>`);
  if (results) {
    for (const line of results.contours.lines) {
      for (const part of line.coordinates) parts.push(`<path d="${path(part, false)}" fill="none" stroke="#2b7bb9" stroke-width="0.8"/>`);
      const label = line.labels[0];
      if (label) parts.push(`<text x="${sx(label.x)}" y="${sy(label.y)}" font-size="9" fill="#1d5a8a" text-anchor="middle">${escapeHtml(String(Number(line.level.toFixed(2))))}</text>`);
    }
  }
  for (const b of scenario.boundaries ?? []) {
    const sym = BOUNDARY_SYMBOLS[b.kind];
    parts.push(`<path d="${path([b.from, b.to], false)}" stroke="${sym.stroke}" stroke-width="${sym.strokeWidth_px}"${sym.dash_px ? ` stroke-dasharray="${sym.dash_px}"` : ''}/>`);
  }
  const short = options.shortfall ?? {};
  const kinds = [...new Set(Object.values(short))];
  if (kinds.length) parts.push(`<defs>${kinds.map((k) => shortfallPatternSvg(k)).join('')}</defs>`);
  for (const e of scenario.excavations) {
    const kind = short[e.id];
    const edge = kind ? shortfallEdge(kind) : { stroke: EXCAVATION_SYMBOL.stroke, dash_px: null };
    parts.push(`<path d="${path(e.outline, true)}" fill="${kind ? `url(#dd-hatch-${kind})` : 'none'}" fill-opacity="0.4" stroke="${edge.stroke}" stroke-width="${EXCAVATION_SYMBOL.strokeWidth_px}"${edge.dash_px ? ` stroke-dasharray="${edge.dash_px}"` : ''}${kind ? ` data-shortfall="${kind}"` : ''}/>`);
    const first = e.outline[0];
    if (first) parts.push(`<text x="${sx(first[0])}" y="${Number(sy(first[1])) - 4}" font-size="11" font-weight="600" fill="${PLAN_COLOURS.ink}">${escapeHtml(e.id)}</text>`);
  }
  for (const r of getReceptors(scenario)) {
    parts.push(`<g data-receptor="${escapeHtml(r.id)}">${receptorSymbolSvg(r.geometry, options.receptorVerdicts?.[r.id] ?? null, (x) => Number(sx(x)), (y) => Number(sy(y)))}</g>`);
    const [lx, ly] = r.geometry.type === 'Point' ? r.geometry.coordinates : r.geometry.coordinates[0]!;
    parts.push(`<text x="${Number(sx(lx)) + 9}" y="${Number(sy(ly)) - 7}" font-size="9" fill="${PLAN_COLOURS.ink}">${escapeHtml(r.id)}</text>`);
  }
  const monitoring = (scenario as Scenario & { monitoring?: { piezometers: Array<{ id: string; x: number; y: number }> } }).monitoring;
  const labelEvery = scenario.wells.length > 60 ? Math.ceil(scenario.wells.length / 60) : 1;
  scenario.wells.forEach((well, i) => {
    const injecting = (well.rate_m3_s ?? well.schedule?.[0]?.rate_m3_s ?? 0) < 0;
    parts.push(wellSymbolSvg(Number(sx(well.x)), Number(sy(well.y)), wellSymbol(well.kind, { active: well.active !== false, injecting })));
    if (i % labelEvery === 0) parts.push(`<text x="${Number(sx(well.x)) + 7}" y="${Number(sy(well.y)) - 5}" font-size="9" fill="${PLAN_COLOURS.ink}">${i + 1}</text>`);
  });
  // Piezometers above the wells they sit among, as on the designer map.
  for (const p of monitoring?.piezometers ?? []) {
    parts.push(piezometerSymbolSvg(Number(sx(p.x)), Number(sy(p.y))));
    parts.push(`<text x="${Number(sx(p.x)) + 8}" y="${Number(sy(p.y)) + 12}" font-size="9" fill="${PLAN_COLOURS.ink}">${escapeHtml(p.id)}</text>`);
  }
  const bar = niceLength(spanX / 4);
  const barPx = bar * scale;
  parts.push(`<g transform="translate(12,${h - 14})"><rect width="${barPx.toFixed(1)}" height="5" fill="#000"/><text y="-3" font-size="10">${bar} m</text></g>`);
  parts.push(`<g transform="translate(${w - 24},28)"><path d="M0,-18 L6,0 L0,-4 L-6,0 Z" fill="#000"/><text y="12" font-size="9" text-anchor="middle">grid N</text></g>`);
  parts.push('</svg>');
  return parts.join('');
}
