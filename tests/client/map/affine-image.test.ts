import { describe, expect, it } from 'vitest';
import { applySimilarity, similarityFromRefs } from '../../../client/map/affine-image';

function expectNear(a: number, b: number, tol = 1e-9) {
  expect(Math.abs(a - b), `${a} vs ${b}`).toBeLessThanOrEqual(tol);
}

describe('similarityFromRefs(p1, s1, p2, s2) places an image by two reference points', () => {
  // Exact: a similarity is fixed by two point pairs (scale, rotation, offset).
  it('an unrotated plan at 0.1 m/px with its top-left at (100, 200)', () => {
    const t = similarityFromRefs([0, 0], [100, 200], [1000, 0], [200, 200])!;
    expectNear(t.scale_m_px, 0.1);
    expectNear(t.rotation_rad, 0);
    // Image y runs down, site y up: pixel (0, 500) is 50 m south of the top-left.
    const [x, y] = applySimilarity(t, 0, 500);
    expectNear(x, 100);
    expectNear(y, 150);
  });
  it('a plan rotated 90° counter-clockwise (image right → site north)', () => {
    const t = similarityFromRefs([0, 0], [0, 0], [100, 0], [0, 50])!;
    expectNear(t.scale_m_px, 0.5);
    expectNear(t.rotation_rad, Math.PI / 2);
    const [x, y] = applySimilarity(t, 0, 100); // 100 px down the image → 50 m east
    expectNear(x, 50);
    expectNear(y, 0);
  });
  it('reproduces both reference points for an arbitrary placement', () => {
    const p1: [number, number] = [123, 456];
    const s1: [number, number] = [389201.5, 5819433.2];
    const p2: [number, number] = [1789, 97];
    const s2: [number, number] = [389362.25, 5819512.75];
    const t = similarityFromRefs(p1, s1, p2, s2)!;
    for (const [p, s] of [[p1, s1], [p2, s2]] as const) {
      const [x, y] = applySimilarity(t, p[0], p[1]);
      expectNear(x, s[0], 1e-6);
      expectNear(y, s[1], 1e-6);
    }
  });
  it('returns null when the two points coincide', () => {
    expect(similarityFromRefs([0, 0], [0, 0], [0, 0], [5, 5])).toBeNull();
    expect(similarityFromRefs([0, 0], [1, 1], [5, 5], [1, 1])).toBeNull();
  });
});
