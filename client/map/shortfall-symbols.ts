/**
 * The one set of symbols for how an excavation stands against its target: the hatch on the plan,
 * the mark at its highest level, the badge icon and the key's swatch all come from here, so the
 * plan map, the key and (later) the site view draw the same thing. Our own design: patterns and
 * glyphs differ between kinds so none relies on colour alone (Okabe & Ito, 2008, colours).
 */
import { MET_COLOUR, SHORTFALL_COLOUR } from './colour-scale';

/**
 * How an excavation stands at the time shown:
 * - `met`: the highest computed level inside is at or below the governing target;
 * - `above-target`: water stands above the level the floor must be dry to (formation − margin);
 * - `floor-unsafe`: the aquifer's head under the floor is above the level the uplift or heave
 *   check allows (EN 1997-1 UPL / HYD) — the floor may lift or boil even if it looks dry;
 * - `dewatered`: the aquifer is drawn down to its base inside the pit, so the level shown is the
 *   base, not a computed level: not a pass (the true level and yield are not known);
 * - `stale`: not computed for the current inputs (results paused).
 */
export type ShortfallKind = 'met' | 'above-target' | 'floor-unsafe' | 'dewatered' | 'stale';

/** How one kind is drawn. */
export interface ShortfallSymbol {
  /** Short words for the key and the badge. */
  label: string;
  /** Glyph for the badge icon and the map mark. */
  glyph: string;
  /** Edge and hatch colour. */
  colour: string;
  /** Hatch of the area concerned; null: no area is drawn for this kind. */
  hatch: { angle: 1 | -1; cross: boolean; spacing_px: number; width_px: number } | null;
  /** Edge dash in px (empty: solid). */
  dash: number[];
  /** Whether this kind counts as a pass. */
  pass: boolean;
}

/** Floor unsafe: Okabe–Ito's reddish purple (#cc79a7) darkened for contrast on the bands; its own hatch and glyph. */
export const FLOOR_UNSAFE_COLOUR = '#a2306f';
/** Grey for results that are not computed or not verified. */
export const NOT_VERIFIED_COLOUR = '#5f6a73';

export const SHORTFALL_SYMBOLS: Readonly<Record<ShortfallKind, ShortfallSymbol>> = {
  met: { label: 'Target met', glyph: '✓', colour: MET_COLOUR, hatch: null, dash: [], pass: true },
  'above-target': {
    label: 'Water above target', glyph: '▲', colour: SHORTFALL_COLOUR,
    hatch: { angle: 1, cross: false, spacing_px: 6, width_px: 2 }, dash: [], pass: false,
  },
  'floor-unsafe': {
    label: 'Floor unsafe (uplift or heave)', glyph: '⇑', colour: FLOOR_UNSAFE_COLOUR,
    hatch: { angle: -1, cross: true, spacing_px: 7, width_px: 1.6 }, dash: [7, 3], pass: false,
  },
  dewatered: { label: 'Not verified: drawn down to the aquifer base', glyph: '?', colour: NOT_VERIFIED_COLOUR, hatch: null, dash: [2, 3], pass: false },
  stale: { label: 'Not computed', glyph: '…', colour: NOT_VERIFIED_COLOUR, hatch: null, dash: [], pass: false },
};

/** Kinds that mark an area on the plan, in drawing order, for the key. */
export const SHORTFALL_AREA_KINDS: ReadonlyArray<ShortfallKind> = ['above-target', 'floor-unsafe'];

/** CSS background of a key swatch for a kind (the same hatch the plan draws). */
export function shortfallSwatchCss(kind: ShortfallKind): string {
  const s = SHORTFALL_SYMBOLS[kind];
  if (!s.hatch) return 'transparent';
  const line = (deg: number) => `repeating-linear-gradient(${deg}deg, ${s.colour} 0 ${s.hatch!.width_px}px, transparent ${s.hatch!.width_px}px ${s.hatch!.spacing_px - 1}px)`;
  const first = s.hatch.angle === 1 ? 135 : 45;
  return s.hatch.cross ? `${line(first)}, ${line(first === 135 ? 45 : 135)}` : line(first);
}
