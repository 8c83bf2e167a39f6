/**
 * Compact encoding of a grid's per-node flag masks: most nodes carry no flag, and flagged nodes
 * come in contiguous patches (a dewatered core, the ring beyond the radius of influence), so runs
 * of equal non-zero masks are far shorter than one mask per node.
 */

/** One run: nodes `start … start + length − 1` (row-major index) all carry bit mask `mask` (≠ 0). */
export type FlagRun = [start: number, length: number, mask: number];

/** Runs of equal non-zero masks, in increasing index order; zero masks are left out. */
export function encodeFlagRuns(flags: ArrayLike<number>): FlagRun[] {
  const runs: FlagRun[] = [];
  let k = 0;
  const n = flags.length;
  while (k < n) {
    const mask = flags[k] ?? 0;
    if (mask === 0) {
      k++;
      continue;
    }
    const start = k;
    while (k < n && flags[k] === mask) k++;
    runs.push([start, k - start, mask]);
  }
  return runs;
}

/** Inverse of encodeFlagRuns for a grid of `nodeCount` nodes; throws on a run outside the grid. */
export function decodeFlagRuns(runs: ReadonlyArray<readonly [number, number, number]>, nodeCount: number): Uint8Array {
  const flags = new Uint8Array(nodeCount);
  for (const [start, length, mask] of runs) {
    if (start < 0 || length < 1 || start + length > nodeCount) throw new RangeError(`flag run [${start}, ${length}] lies outside a grid of ${nodeCount} nodes`);
    flags.fill(mask, start, start + length);
  }
  return flags;
}
