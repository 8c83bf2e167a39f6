/**
 * The one symbol set of the plan: wells by kind, piezometers, excavations, boundaries, receptors
 * (neighbours) and the two shortfall kinds (water above target, floor unsafe). The designer map, its key, the site view
 * and the report all draw from here, so a symbol means the same thing everywhere.
 *
 * Sizes are screen pixels; a drawing in other units passes `unit` (its units per pixel). Colours
 * are the Okabe–Ito palette (safe for the common colour-vision deficiencies) and an ink.
 */
import type { Well } from '../schema';
import { PLAN_COLOURS } from './plan-colours';
import { SHORTFALL_SYMBOLS, type ShortfallKind } from './shortfall-symbols';

/** Shortfall kinds that mark an excavation's area on a plan. */
export type ShortfallAreaKind = Extract<ShortfallKind, 'above-target' | 'floor-unsafe'>;

export { PLAN_COLOURS } from './plan-colours';

/** A circle symbol, in screen pixels. */
export interface CircleSymbol {
  radius_px: number;
  fill: string;
  stroke: string;
  strokeWidth_px: number;
  /** SVG dash array in pixels, or null for a solid line. */
  dash_px: string | null;
}

const WELL_RADIUS_PX: Record<Well['kind'], number> = { wellpoint: 4, deep: 6.5, ejector: 5 };

/** What a well's symbol shows besides its kind. */
export interface WellSymbolState {
  /** False for an inactive well (grey, dashed). Default true. */
  active?: boolean;
  /** True for an injection well (negative rate). */
  injecting?: boolean;
}

/** The well symbol: a disc by kind (well point open, deep well filled, ejector dashed). */
export function wellSymbol(kind: Well['kind'], state: WellSymbolState = {}): CircleSymbol {
  const inactive = state.active === false;
  return {
    radius_px: WELL_RADIUS_PX[kind],
    fill: inactive ? PLAN_COLOURS.inactive : state.injecting ? PLAN_COLOURS.injection : kind === 'deep' ? PLAN_COLOURS.ink : '#ffffff',
    stroke: PLAN_COLOURS.ink,
    strokeWidth_px: kind === 'deep' ? 2.2 : 1.5,
    dash_px: inactive ? '2 2' : kind === 'ejector' ? '3 1.5' : null,
  };
}

/** The piezometer symbol: a ring with a centre dot (wells are plain discs). */
export const PIEZOMETER_SYMBOL = { ringRadius_px: 6.5, ringStrokeWidth_px: 2.6, dotRadius_px: 2 } as const;

/** Excavation outline: ink line, no fill, so the field shows through. */
export const EXCAVATION_SYMBOL = { stroke: PLAN_COLOURS.ink, strokeWidth_px: 1.8 } as const;

/** Boundary lines by kind. */
export const BOUNDARY_SYMBOLS = {
  'constant-head': { stroke: PLAN_COLOURS.constantHead, strokeWidth_px: 3, dash_px: null },
  'no-flow': { stroke: PLAN_COLOURS.noFlow, strokeWidth_px: 2.5, dash_px: '10 5' },
} as const;


/** What a receptor's symbol shows about the last design: within limits, over a limit, no limit given, or not designed. */
export type ReceptorVerdict = 'ok' | 'exceeds' | 'not-checked' | null;

/**
 * Receptor (neighbour) symbols: a point receptor is a diamond with a solid centre, a polyline
 * receptor a dashed line with a small square at each of its points. The colour gives the last
 * design's verdict; the receptor table says it in words, so colour is never the only carrier.
 */
export const RECEPTOR_SYMBOL = {
  pointHalf_px: 7.5, pointStrokeWidth_px: 2.6, centreHalf_px: 3,
  vertexHalf_px: 4, vertexStrokeWidth_px: 2.2,
  lineWidth_px: 4, lineDash_px: '8 4',
} as const;

/** A receptor's colour for the last design's verdict. */
export function receptorColour(verdict: ReceptorVerdict): string {
  return verdict === 'ok' ? PLAN_COLOURS.met : verdict === 'exceeds' ? PLAN_COLOURS.shortfall : PLAN_COLOURS.receptor;
}

const n = (v: number) => String(Number(v.toFixed(2)));

/** A well symbol as SVG markup at (cx, cy); `unit` is drawing units per pixel (default 1). */
export function wellSymbolSvg(cx: number, cy: number, symbol: CircleSymbol, unit = 1, extraRadius_px = 0): string {
  const dash = symbol.dash_px ? ` stroke-dasharray="${symbol.dash_px.split(' ').map((d) => n(Number(d) * unit)).join(' ')}"` : '';
  return `<circle cx="${n(cx)}" cy="${n(cy)}" r="${n((symbol.radius_px + extraRadius_px) * unit)}" fill="${symbol.fill}" stroke="${symbol.stroke}" stroke-width="${n(symbol.strokeWidth_px * unit)}"${dash}/>`;
}

/** The piezometer symbol as SVG markup at (cx, cy). */
export function piezometerSymbolSvg(cx: number, cy: number, unit = 1): string {
  const p = PIEZOMETER_SYMBOL;
  return `<circle class="dd-pz-ring" cx="${n(cx)}" cy="${n(cy)}" r="${n(p.ringRadius_px * unit)}" fill="#fff" fill-opacity="0.85" stroke="${PLAN_COLOURS.piezometer}" stroke-width="${n(p.ringStrokeWidth_px * unit)}"/><circle class="dd-pz-dot" cx="${n(cx)}" cy="${n(cy)}" r="${n(p.dotRadius_px * unit)}" fill="${PLAN_COLOURS.ink}"/>`;
}

/** A point receptor's diamond as SVG markup at (cx, cy). */
export function receptorPointSymbolSvg(cx: number, cy: number, colour: string, unit = 1): string {
  const r = RECEPTOR_SYMBOL;
  const diamond = (h: number) => `M${n(cx)} ${n(cy - h)}L${n(cx + h)} ${n(cy)}L${n(cx)} ${n(cy + h)}L${n(cx - h)} ${n(cy)}Z`;
  return `<path class="dd-receptor-diamond" d="${diamond(r.pointHalf_px * unit)}" fill="#fff" fill-opacity="0.9" stroke="${colour}" stroke-width="${n(r.pointStrokeWidth_px * unit)}"/><path d="${diamond(r.centreHalf_px * unit)}" fill="${colour}"/>`;
}

/** The small square at each point of a polyline receptor, as SVG markup at (cx, cy). */
export function receptorVertexSymbolSvg(cx: number, cy: number, colour: string, unit = 1): string {
  const r = RECEPTOR_SYMBOL;
  const h = r.vertexHalf_px * unit;
  return `<rect x="${n(cx - h)}" y="${n(cy - h)}" width="${n(2 * h)}" height="${n(2 * h)}" fill="#fff" stroke="${colour}" stroke-width="${n(r.vertexStrokeWidth_px * unit)}"/>`;
}

/** A polyline receptor's dashed line as SVG markup along the path data `d`. */
export function receptorLineSvg(d: string, colour: string, unit = 1): string {
  const r = RECEPTOR_SYMBOL;
  const dash = r.lineDash_px.split(' ').map((v) => n(Number(v) * unit)).join(' ');
  return `<path class="dd-receptor-line" d="${d}" fill="none" stroke="${colour}" stroke-width="${n(r.lineWidth_px * unit)}" stroke-dasharray="${dash}" stroke-opacity="0.9"/>`;
}

/**
 * A receptor's whole symbol in a drawing: `toX`/`toY` map site metres to drawing units, `unit` is
 * drawing units per pixel. Labels are the caller's (each drawing places its own text).
 */
export function receptorSymbolSvg(
  geometry: { type: 'Point'; coordinates: readonly [number, number] } | { type: 'LineString'; coordinates: ReadonlyArray<readonly [number, number]> },
  verdict: ReceptorVerdict, toX: (x: number) => number, toY: (y: number) => number, unit = 1,
): string {
  const colour = receptorColour(verdict);
  if (geometry.type === 'Point') return receptorPointSymbolSvg(toX(geometry.coordinates[0]), toY(geometry.coordinates[1]), colour, unit);
  const d = geometry.coordinates.map(([x, y], i) => `${i ? 'L' : 'M'}${n(toX(x))},${n(toY(y))}`).join('');
  return receptorLineSvg(d, colour, unit) + geometry.coordinates.map(([x, y]) => receptorVertexSymbolSvg(toX(x), toY(y), colour, unit)).join('');
}

/**
 * An SVG hatch pattern for a shortfall kind (id `dd-hatch-<kind>`, or `id` when given), to put in
 * `<defs>`: the hatch of `shortfall-symbols.ts` (angle, spacing, width, crossed or not).
 */
export function shortfallPatternSvg(kind: ShortfallAreaKind, unit = 1, id = `dd-hatch-${kind}`): string {
  const s = SHORTFALL_SYMBOLS[kind];
  const h = s.hatch!;
  const size = h.spacing_px * unit;
  // Stripes along y, rotated: 135° for angle 1, 45° for −1 (as the map's canvas hatch), a second set when crossed.
  const stripe = `<rect width="${n(h.width_px * unit)}" height="${n(size)}" fill="${s.colour}"/>`;
  const cross = h.cross ? `<rect width="${n(size)}" height="${n(h.width_px * unit)}" fill="${s.colour}"/>` : '';
  return `<pattern id="${id}" patternUnits="userSpaceOnUse" width="${n(size)}" height="${n(size)}" patternTransform="rotate(${h.angle === 1 ? 135 : 45})">${stripe}${cross}</pattern>`;
}

/** The edge of a shortfall area: its colour and dash (px). */
export function shortfallEdge(kind: ShortfallAreaKind): { stroke: string; dash_px: string | null } {
  const s = SHORTFALL_SYMBOLS[kind];
  return { stroke: s.colour, dash_px: s.dash.length ? s.dash.join(' ') : null };
}

/** Keys of the symbols a plan can show. */
export type PlanSymbolKey = 'wellpoint' | 'deep' | 'ejector' | 'piezometer' | 'excavation' | 'shortfall-water' | 'shortfall-floor' | 'constant-head' | 'no-flow' | 'receptor-point' | 'receptor-line';

/** Words for each symbol in a key. */
export const PLAN_SYMBOL_LABELS: Record<PlanSymbolKey, string> = {
  wellpoint: 'Well point',
  deep: 'Deep well',
  ejector: 'Ejector',
  piezometer: 'Piezometer (monitoring)',
  excavation: 'Excavation',
  'shortfall-water': SHORTFALL_SYMBOLS['above-target'].label,
  'shortfall-floor': SHORTFALL_SYMBOLS['floor-unsafe'].label,
  'constant-head': 'Constant-head boundary',
  'no-flow': 'No-flow boundary',
  'receptor-point': 'Neighbour (receptor): green within limits, vermilion over a limit, purple not checked',
  'receptor-line': 'Neighbour along a line (wall, service): colours as for a point',
};

/** A key swatch (22 × 14 px) as standalone SVG markup. */
export function planSymbolSwatchSvg(key: PlanSymbolKey): string {
  const open = '<svg xmlns="http://www.w3.org/2000/svg" class="dd-swatch-svg" viewBox="0 0 22 14" width="22" height="14" aria-hidden="true">';
  let body: string;
  switch (key) {
    case 'wellpoint':
    case 'deep':
    case 'ejector':
      body = wellSymbolSvg(11, 7, wellSymbol(key));
      break;
    case 'piezometer':
      body = piezometerSymbolSvg(11, 7);
      break;
    case 'excavation':
      body = `<rect x="2" y="2" width="18" height="10" fill="none" stroke="${EXCAVATION_SYMBOL.stroke}" stroke-width="${EXCAVATION_SYMBOL.strokeWidth_px}"/>`;
      break;
    case 'shortfall-water':
    case 'shortfall-floor': {
      const kind: ShortfallAreaKind = key === 'shortfall-water' ? 'above-target' : 'floor-unsafe';
      const edge = shortfallEdge(kind);
      body = `<defs>${shortfallPatternSvg(kind, 1, `dd-swatch-hatch-${kind}`)}</defs><rect x="2" y="2" width="18" height="10" fill="url(#dd-swatch-hatch-${kind})" stroke="${edge.stroke}" stroke-width="2"${edge.dash_px ? ' stroke-dasharray="4 2"' : ''}/>`;
      break;
    }
    case 'constant-head':
    case 'no-flow': {
      const b = BOUNDARY_SYMBOLS[key];
      body = `<line x1="1" y1="7" x2="21" y2="7" stroke="${b.stroke}" stroke-width="${b.strokeWidth_px}"${b.dash_px ? ' stroke-dasharray="5 2.5"' : ''}/>`;
      break;
    }
    case 'receptor-point':
      body = receptorPointSymbolSvg(11, 7, PLAN_COLOURS.receptor, 0.8);
      break;
    case 'receptor-line':
      body = receptorLineSvg('M1,7L21,7', PLAN_COLOURS.receptor, 0.6) + receptorVertexSymbolSvg(1.5, 7, PLAN_COLOURS.receptor, 0.6) + receptorVertexSymbolSvg(20.5, 7, PLAN_COLOURS.receptor, 0.6);
      break;
  }
  return `${open}${body}</svg>`;
}

/** The key of a plan as HTML: one swatch and its words per symbol shown. */
export function planKeyHtml(keys: readonly PlanSymbolKey[]): string {
  return `<ul class="plan-key">${keys.map((k) => `<li data-symbol="${k}">${planSymbolSwatchSvg(k)} ${PLAN_SYMBOL_LABELS[k]}</li>`).join('')}</ul>`;
}

/** Which symbols a plan of these wells, excavations, piezometers and boundaries shows. */
export function planSymbolKeys(options: {
  wells: ReadonlyArray<{ kind: Well['kind'] }>;
  piezometerCount: number;
  excavationCount: number;
  boundaryKinds: ReadonlyArray<'constant-head' | 'no-flow'>;
  shortfallKinds: readonly ShortfallAreaKind[];
  /** Geometry types of the receptors shown (default none). */
  receptorTypes?: ReadonlyArray<'Point' | 'LineString'>;
}): PlanSymbolKey[] {
  const keys: PlanSymbolKey[] = [];
  for (const k of ['wellpoint', 'deep', 'ejector'] as const) if (options.wells.some((w) => w.kind === k)) keys.push(k);
  if (options.piezometerCount > 0) keys.push('piezometer');
  if (options.excavationCount > 0) keys.push('excavation');
  if (options.shortfallKinds.includes('above-target')) keys.push('shortfall-water');
  if (options.shortfallKinds.includes('floor-unsafe')) keys.push('shortfall-floor');
  for (const k of ['constant-head', 'no-flow'] as const) if (options.boundaryKinds.includes(k)) keys.push(k);
  if (options.receptorTypes?.includes('Point')) keys.push('receptor-point');
  if (options.receptorTypes?.includes('LineString')) keys.push('receptor-line');
  return keys;
}

/** The shortfall kind of an excavation whose target is not met: floor unsafe when a floor check governs. */
export function shortfallKindOf(governing: 'dry' | 'uplift' | 'heave' | undefined): ShortfallAreaKind {
  return governing === 'uplift' || governing === 'heave' ? 'floor-unsafe' : 'above-target';
}

/**
 * Excavations not meeting their target, by id, with the kind of shortfall: from the design check
 * when there is one, else from the grid check (water above target).
 */
export function excavationShortfalls(
  design: { excavations: ReadonlyArray<{ id: string; met: boolean; floor?: { governing: 'dry' | 'uplift' | 'heave' } }> } | null | undefined,
  grid: ReadonlyArray<{ id: string; shortfall_m: number | null }>,
): Record<string, ShortfallAreaKind> {
  const out: Record<string, ShortfallAreaKind> = {};
  if (design) {
    for (const x of design.excavations) if (!x.met) out[x.id] = shortfallKindOf(x.floor?.governing);
  } else {
    for (const x of grid) if ((x.shortfall_m ?? 0) > 0) out[x.id] = 'above-target';
  }
  return out;
}

/** The last design's verdict per receptor id, from a design result's receptor rows. */
export function receptorVerdicts(design: { receptors?: ReadonlyArray<{ id: string; status: 'ok' | 'exceeds' | 'not-checked' }> } | null | undefined): Record<string, ReceptorVerdict> {
  return Object.fromEntries((design?.receptors ?? []).map((r) => [r.id, r.status] as const));
}
