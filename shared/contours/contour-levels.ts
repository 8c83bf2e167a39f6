/**
 * Choosing contour levels: "nice" round steps (1, 2, 2.5, 5 × 10ᵏ) so labels read as plain
 * numbers, the way levels are drawn on site plans (common practice).
 */

/** Options for `niceContourLevels`. */
export interface NiceContourLevelsOptions {
  /** Smallest value in the field (any unit; the levels come back in the same unit). */
  min: number;
  /** Largest value in the field. */
  max: number;
  /** About how many levels to draw (default 10); the result may hold a few more or fewer. */
  targetCount?: number;
  /** Use this step instead of choosing one (must be > 0). */
  step?: number;
  /** Largest number of levels returned, whatever the step (default 200; guards a tiny step). */
  maxCount?: number;
}

const NICE_STEPS = [1, 2, 2.5, 5, 10];

/** A round step near range / targetCount. */
export function niceStep(range: number, targetCount = 10): number {
  if (!(range > 0) || !Number.isFinite(range)) return 1;
  const raw = range / Math.max(1, targetCount);
  const power = 10 ** Math.floor(Math.log10(raw));
  const factor = NICE_STEPS.find((s) => s * power >= raw * 0.999) ?? 10;
  return factor * power;
}

/**
 * Levels strictly inside (min, max] at multiples of a nice step. Empty when the field is flat or
 * not finite (a flat field has no contour lines — callers say so rather than drawing none silently).
 */
export function niceContourLevels(options: NiceContourLevelsOptions): number[] {
  const { min, max } = options;
  if (!Number.isFinite(min) || !Number.isFinite(max) || !(max > min)) return [];
  const step = options.step !== undefined && options.step > 0 ? options.step : niceStep(max - min, options.targetCount ?? 10);
  const maxCount = options.maxCount ?? 200;
  const levels: number[] = [];
  // Start at the first multiple above min; round to the step's decimals so 0.1 + 0.2 prints 0.3.
  const decimals = Math.max(0, -Math.floor(Math.log10(step)) + 2);
  for (let k = Math.floor(min / step) + 1; k * step <= max + step * 1e-9; k++) {
    const level = Number((k * step).toFixed(decimals));
    if (level > min && level <= max) levels.push(level);
    if (levels.length >= maxCount) break;
  }
  return levels;
}
