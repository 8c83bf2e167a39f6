/** Decimals needed to print every multiple of a contour step exactly (0.25 → 2, 0.5 → 1, 2 → 0). */
export function stepDecimals(step: number): number {
  if (!(step > 0) || !Number.isFinite(step)) return 2;
  for (let d = 0; d <= 4; d++) {
    const scaled = step * 10 ** d;
    if (Math.abs(scaled - Math.round(scaled)) < 1e-6 * Math.max(1, scaled)) return d;
  }
  return 4;
}
