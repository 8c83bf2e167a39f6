/**
 * Keeping a ring of new wells off the wells already there: positions within a tolerance of an
 * existing well are set aside (skipped and reported), so a ring is never silently stacked on one.
 */

/** Positions closer than `tolerance_m` to a well in `wells` (for a ring laid over existing wells). */
export function splitByNearbyWells(
  positions: ReadonlyArray<readonly [number, number]>, wells: ReadonlyArray<{ x: number; y: number }>, tolerance_m: number,
): { free: Array<[number, number]>; taken: Array<[number, number]> } {
  const free: Array<[number, number]> = [];
  const taken: Array<[number, number]> = [];
  for (const [x, y] of positions) {
    const near = wells.some((w) => Math.hypot(w.x - x, w.y - y) < tolerance_m);
    (near ? taken : free).push([x, y]);
  }
  return { free, taken };
}
