/**
 * The plan as an SVG string: excavations, numbered wells, boundaries, piezometers, level contours
 * with labels, a scale bar and a north arrow. Used by the printable report; the site view draws
 * the same picture live. Site y (northing) grows up; SVG y grows down, hence the flip.
 */
import type { Scenario } from '../schema';
import { planExtent, type PlanResults } from './plan-results';
import { escapeHtml } from './escape-html';

/** Options for `renderPlanSvg`. */
export interface PlanSvgOptions {
  scenario: Scenario;
  results?: PlanResults;
  /** Drawing width, px. Default 720. */
  width_px?: number;
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
  for (const b of scenario.boundaries ?? [])
    parts.push(`<path d="${path([b.from, b.to], false)}" stroke="${b.kind === 'constant-head' ? '#0a8' : '#a50'}" stroke-width="2" stroke-dasharray="6 3"/>`);
  for (const e of scenario.excavations) {
    parts.push(`<path d="${path(e.outline, true)}" fill="rgba(200,60,40,0.08)" stroke="#c33" stroke-width="1.6"/>`);
    const first = e.outline[0];
    if (first) parts.push(`<text x="${sx(first[0])}" y="${Number(sy(first[1])) - 4}" font-size="11" fill="#a22">${escapeHtml(e.id)}</text>`);
  }
  const monitoring = (scenario as Scenario & { monitoring?: { piezometers: Array<{ id: string; x: number; y: number }> } }).monitoring;
  for (const p of monitoring?.piezometers ?? []) {
    parts.push(`<rect x="${Number(sx(p.x)) - 4}" y="${Number(sy(p.y)) - 4}" width="8" height="8" fill="#2a2" stroke="#050"/>`);
    parts.push(`<text x="${Number(sx(p.x)) + 6}" y="${Number(sy(p.y)) + 12}" font-size="9" fill="#050">${escapeHtml(p.id)}</text>`);
  }
  const labelEvery = scenario.wells.length > 60 ? Math.ceil(scenario.wells.length / 60) : 1;
  scenario.wells.forEach((well, i) => {
    parts.push(`<circle cx="${sx(well.x)}" cy="${sy(well.y)}" r="3.5" fill="${well.active === false ? '#fff' : '#124'}" stroke="#124"/>`);
    if (i % labelEvery === 0) parts.push(`<text x="${Number(sx(well.x)) + 5}" y="${Number(sy(well.y)) - 4}" font-size="9" fill="#124">${i + 1}</text>`);
  });
  const bar = niceLength(spanX / 4);
  const barPx = bar * scale;
  parts.push(`<g transform="translate(12,${h - 14})"><rect width="${barPx.toFixed(1)}" height="5" fill="#000"/><text y="-3" font-size="10">${bar} m</text></g>`);
  parts.push(`<g transform="translate(${w - 24},28)"><path d="M0,-18 L6,0 L0,-4 L-6,0 Z" fill="#000"/><text y="12" font-size="9" text-anchor="middle">grid N</text></g>`);
  parts.push('</svg>');
  return parts.join('');
}
