import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { partialPenetrationCorrection } from '../../../shared/wells';

interface Case { r: number; D: number; d: number; l: number; d2: number; l2?: number; ratio?: number; B?: number; fs: string }
// Source: scripts/reference/partial-penetration.py (mpmath 1.3.0, 30 digits), the Hantush (1961)
// series in the Kruseman & de Ridder (1994, ch. 10) form, itself checked there against a z-image sum.
const reference = JSON.parse(readFileSync(new URL('../../../fixtures/reference/partial-penetration.json', import.meta.url), 'utf8')) as { cases: Case[] };

describe('partialPenetrationCorrection', () => {
  it.each(reference.cases.map((c) => [`r=${c.r} D=${c.D} screen ${c.d}–${c.l} obs ${c.d2}${c.l2 !== undefined ? `–${c.l2}` : ''} Kh/Kv=${c.ratio ?? 1}${c.B ? ` B=${c.B}` : ''}`, c] as const))(
    'matches the mpmath series for %s',
    (_label, c) => {
      const f = partialPenetrationCorrection({
        distance_m: c.r,
        thickness_m: c.D,
        screenTopDepth_m: c.d,
        screenBottomDepth_m: c.l,
        observationTopDepth_m: c.d2,
        ...(c.l2 !== undefined ? { observationBottomDepth_m: c.l2 } : {}),
        ...(c.ratio !== undefined ? { anisotropyKhKv: c.ratio } : {}),
        ...(c.B !== undefined ? { leakageFactor_m: c.B } : {}),
      });
      const expected = Number(c.fs);
      expect(Math.abs(f - expected), `got ${f}, expected ${expected}`).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(expected)));
    },
  );

  it('is exactly zero for a fully penetrating screen', () => {
    expect(partialPenetrationCorrection({ distance_m: 0.1, thickness_m: 10, screenTopDepth_m: 0, screenBottomDepth_m: 10, observationTopDepth_m: 2 })).toBe(0);
  });
});
