import { describe, expect, it } from 'vitest';
import { layoutWellRing, nextWellIds, offsetRing } from '../../../client/layout';
import { getPolygonPerimeter } from '../../../shared/geometry';

function expectNear(a: number, b: number, tol = 1e-9) {
  expect(Math.abs(a - b), `${a} vs ${b}`).toBeLessThanOrEqual(tol);
}

describe('offsetRing(outline, d) offsets a polygon outward', () => {
  // Exact geometry: a w × h rectangle offset by d with mitred corners is (w + 2d) × (h + 2d).
  it.each([
    [[[0, 0], [40, 0], [40, 20], [0, 20]], 1.5, 2 * (43 + 23)],
    [[[0, 20], [40, 20], [40, 0], [0, 0]], 1.5, 2 * (43 + 23)], // clockwise input
    [[[0, 0], [30, 0], [30, 30], [0, 30]], -3, 4 * 24], // negative: inside
  ] as Array<[Array<[number, number]>, number, number]>)('a rectangle offset by %s gives perimeter %d', (outline, d, perimeter) => {
    expectNear(getPolygonPerimeter(offsetRing(outline, d)), perimeter);
  });
  it('bevels a sharp corner instead of a long spike', () => {
    // A 10° wedge: a mitre would reach d / sin(5°) ≈ 11.5 d from the tip.
    const tipAngle = (10 * Math.PI) / 180;
    const outline: Array<[number, number]> = [[0, 0], [100 * Math.cos(tipAngle / 2), -100 * Math.sin(tipAngle / 2)], [100 * Math.cos(tipAngle / 2), 100 * Math.sin(tipAngle / 2)]];
    const ring = offsetRing(outline, 2);
    for (const [x, y] of ring) expect(Math.hypot(x, y)).toBeLessThan(120);
    expect(ring.length).toBe(outline.length + 1);
    expect(Math.min(...ring.map(([x, y]) => Math.hypot(x, y)))).toBeLessThanOrEqual(2 + 1e-9);
  });
});

describe('layoutWellRing({outline, offset_m, spacing_m}) spaces wells evenly along the offset', () => {
  it('puts 24 wells 6 m apart on a 30 m square offset 3 m (perimeter 144 m, exact)', () => {
    const l = layoutWellRing({ outline: [[0, 0], [30, 0], [30, 30], [0, 30]], offset_m: 3, spacing_m: 6 });
    expect(l.positions).toHaveLength(24);
    expectNear(l.spacing_m, 6);
    expectNear(l.perimeter_m, 144);
    expect(l.positions[0]).toEqual([-3, -3]);
    expect(l.positions[1]).toEqual([3, -3]);
    // Consecutive wells are one spacing apart along the path (straight edges here).
    for (let k = 1; k < 6; k++) {
      const a = l.positions[k - 1]!;
      const b = l.positions[k]!;
      expectNear(Math.hypot(b[0] - a[0], b[1] - a[1]), 6, 1e-6);
    }
  });
  it('rounds the count so the ring closes evenly', () => {
    const l = layoutWellRing({ outline: [[0, 0], [10, 0], [10, 10], [0, 10]], offset_m: 0.5, spacing_m: 3 });
    // Perimeter 44 m / 3 m = 14.67 → 15 wells at 2.933 m.
    expect(l.positions).toHaveLength(15);
    expectNear(l.spacing_m, 44 / 15);
  });
  it('rejects a spacing that is not positive', () => {
    expect(() => layoutWellRing({ outline: [[0, 0], [1, 0], [0, 1]], spacing_m: 0 })).toThrow(/spacing_m/);
  });
});

describe('nextWellIds(prefix, n, taken) numbers new wells in order', () => {
  it('skips ids already used and zero-pads', () => {
    expect(nextWellIds('R', 3, new Set(['R02']))).toEqual(['R01', 'R03', 'R04']);
    expect(nextWellIds('W', 2, new Set(Array.from({ length: 120 }, (_, k) => `x${k}`)))).toEqual(['W001', 'W002']);
  });
});
