/**
 * Colours of the plan map. Drawdown uses viridis (van der Walt & Smith, 2015, matplotlib's
 * perceptually uniform sequential map, CC0), reversed so little drawdown is pale and deep
 * drawdown dark. Shortfall uses Okabe & Ito's (2008) colour-blind-safe vermilion, always with
 * a hatch so it does not rely on colour alone.
 */
import { PLAN_COLOURS } from '../../shared/exports/plan-symbols';

// viridis at 0, 1/8, …, 1 (matplotlib _cm_listed; nine-stop sampling).
const VIRIDIS = ['#440154', '#472d7b', '#3b528b', '#2c728e', '#21918c', '#28ae80', '#5ec962', '#addc30', '#fde725'];

function hexToRgb(hex: string): [number, number, number] {
  const n = Number.parseInt(hex.slice(1), 16);
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
}
const STOPS = VIRIDIS.map(hexToRgb);

/** Viridis colour at t ∈ [0, 1] (clamped), as `rgb(r g b)`. */
export function viridis(t: number): string {
  const c = Math.min(1, Math.max(0, Number.isFinite(t) ? t : 0)) * (STOPS.length - 1);
  const i = Math.min(STOPS.length - 2, Math.floor(c));
  const f = c - i;
  const a = STOPS[i]!;
  const b = STOPS[i + 1]!;
  const mix = (k: number) => Math.round(a[k]! + (b[k]! - a[k]!) * f);
  return `rgb(${mix(0)} ${mix(1)} ${mix(2)})`;
}

/** Colour for a drawdown as a fraction of the largest on the map (0 = none → pale, 1 → dark). */
export function drawdownColour(fraction: number): string {
  return viridis(1 - fraction);
}

/** Okabe–Ito vermilion: shortfall (computed level above target) — the plan symbol set's colour. */
export const SHORTFALL_COLOUR = PLAN_COLOURS.shortfall;
/** Okabe–Ito bluish green: target met (the plan symbol set's). */
export const MET_COLOUR = PLAN_COLOURS.met;
/** Okabe–Ito blue: selection and the user's own marks. */
export const SELECTION_COLOUR = '#0072b2';
/** Okabe–Ito reddish purple: design critical points. */
export const CRITICAL_COLOUR = '#cc79a7';
/** Ink for lines and labels (the plan symbol set's). */
export const INK = PLAN_COLOURS.ink;
