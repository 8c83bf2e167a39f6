import { describe, expect, it } from 'vitest';
import {
  contourGrid, contourExcess, contourMask, contourSetToGeoJSON, niceContourLevels, niceStep,
  ringSignedArea, signedDistanceToRing,
} from '../../../shared/contours';
import type { GridSpec } from '../../../shared/field/types';

/** Absolute tolerance check. */
function expectNear(actual: number, expected: number, tol: number) {
  expect(Math.abs(actual - expected), `${actual} vs ${expected}`).toBeLessThanOrEqual(tol);
}

/** Samples f at the nodes of a grid, row-major. */
function sample(grid: GridSpec, f: (x: number, y: number) => number): Float64Array {
  const [nx, ny] = grid.counts;
  const out = new Float64Array(nx * ny);
  for (let j = 0; j < ny; j++) for (let i = 0; i < nx; i++) out[j * nx + i] = f(grid.origin[0] + i * grid.spacing_m[0], grid.origin[1] + j * grid.spacing_m[1]);
  return out;
}

const square: GridSpec = { origin: [100, 200], spacing_m: [1, 1], counts: [11, 11] }; // x 100..110, y 200..210

describe('niceContourLevels({min, max}) picks round levels', () => {
  // Round steps 1, 2, 2.5, 5 × 10^k: common practice for plan contours (no single source).
  const cases: Array<[number, number, number, number[]]> = [
    [0, 1, 5, [0.2, 0.4, 0.6, 0.8, 1]],
    [0.13, 4.9, 10, [0.5, 1, 1.5, 2, 2.5, 3, 3.5, 4, 4.5]],
    [-2, 2, 4, [-1, 0, 1, 2]],
    [7.2, 10.5, 6, [8, 9, 10]], // range 3.3 / 6 = 0.55 → step 1
  ];
  it.each(cases)('niceContourLevels(%d, %d, target %d) = %o', (min, max, targetCount, expected) => {
    expect(niceContourLevels({ min, max, targetCount })).toEqual(expected);
  });
  it('returns no levels for a flat or non-finite field', () => {
    expect(niceContourLevels({ min: 3, max: 3 })).toEqual([]);
    expect(niceContourLevels({ min: Number.NaN, max: 3 })).toEqual([]);
  });
  it('niceStep(range, n) is one of 1, 2, 2.5, 5 × 10^k', () => {
    expect(niceStep(10, 10)).toBe(1);
    expect(niceStep(4.77, 10)).toBe(0.5);
    expect(niceStep(0.9, 4)).toBe(0.25);
  });
  it('honours an explicit step and caps the count', () => {
    expect(niceContourLevels({ min: 0, max: 1, step: 0.25 })).toEqual([0.25, 0.5, 0.75, 1]);
    expect(niceContourLevels({ min: 0, max: 1000, step: 0.001, maxCount: 5 })).toHaveLength(5);
  });
});

describe('contourGrid({values, grid, levels}) traces contours in site metres', () => {
  // Exact identity: marching squares with linear interpolation reproduces a linear field's
  // contours exactly, so v = x − 100 contoured at L is the straight line x = 100 + L.
  it.each([2.5, 5, 7.25])('a linear field v = x gives the straight line x = %d across the grid', (level) => {
    const set = contourGrid({ values: sample(square, (x) => x - 100), grid: square, levels: [level] });
    expect(set.lines).toHaveLength(1);
    const line = set.lines[0]!;
    expect(line.level).toBe(level);
    // One open polyline from the south edge to the north edge: the frame pieces are cut away.
    expect(line.coordinates).toHaveLength(1);
    const pts = line.coordinates[0]!;
    for (const [x] of pts) expectNear(x, 100 + level, 1e-9);
    const ys = pts.map((p) => p[1]).sort((a, b) => a - b);
    expectNear(ys[0]!, 200, 1e-9);
    expectNear(ys[ys.length - 1]!, 210, 1e-9);
    // Exact: the area at or above L is (10 − L) × 10 m².
    expectNear(set.areas[0]!.area_m2, (10 - level) * 10, 1e-9);
    // A vertical line's label reads along it: angle ±π/2 folded to +π/2.
    expect(line.labels.length).toBeGreaterThan(0);
    for (const label of line.labels) {
      expectNear(Math.abs(label.angle_rad), Math.PI / 2, 1e-9);
      expectNear(label.x, 100 + level, 1e-9);
    }
  });

  it('a cone v = −r traces a closed circle whose area matches πR² (exact geometry, to grid resolution)', () => {
    const grid: GridSpec = { origin: [-20, -20], spacing_m: [0.5, 0.5], counts: [81, 81] };
    const set = contourGrid({ values: sample(grid, (x, y) => -Math.hypot(x, y)), grid, levels: [-10] });
    const area = set.areas[0]!;
    // Linear interpolation of r along edges is within h²/(8R) of the true radius: area to 0.2 %.
    expectNear(area.area_m2, Math.PI * 100, Math.PI * 100 * 0.002);
    const loop = set.lines[0]!.coordinates[0]!;
    expect(loop[0]).toEqual(loop[loop.length - 1]);
    for (const [x, y] of loop) expectNear(Math.hypot(x, y), 10, 0.02);
    // RFC 7946 §3.1.6: exterior ring counter-clockwise.
    expect(ringSignedArea(area.coordinates[0]![0]!)).toBeGreaterThan(0);
  });

  it('a well-like dip contoured in both directions gives an exterior ring and a hole', () => {
    // v = r on a 40 m square: {v ≥ 5} is the square minus a disc; the disc is a clockwise hole.
    const grid: GridSpec = { origin: [-20, -20], spacing_m: [0.5, 0.5], counts: [81, 81] };
    const set = contourGrid({ values: sample(grid, (x, y) => Math.hypot(x, y)), grid, levels: [5] });
    const polygon = set.areas[0]!.coordinates[0]!;
    expect(polygon).toHaveLength(2);
    expect(ringSignedArea(polygon[0]!)).toBeGreaterThan(0);
    expect(ringSignedArea(polygon[1]!)).toBeLessThan(0);
    expectNear(set.areas[0]!.area_m2, 1600 - 25 * Math.PI, 25 * Math.PI * 0.005);
    // The isoline is only the circle: the square frame is not a contour.
    expect(set.lines[0]!.coordinates).toHaveLength(1);
  });

  it('treats NaN values as holes below every level (d3-contour convention) instead of throwing', () => {
    const values = sample(square, (x) => x - 100);
    values[5 * 11 + 8] = Number.NaN;
    const set = contourGrid({ values, grid: square, levels: [5] });
    expect(set.areas[0]!.coordinates.length).toBeGreaterThan(0);
    for (const line of set.lines) for (const l of line.coordinates) for (const p of l) expect(Number.isFinite(p[0] + p[1])).toBe(true);
  });

  it('returns no line for a level outside the field', () => {
    const set = contourGrid({ values: sample(square, (x) => x - 100), grid: square, levels: [50] });
    expect(set.lines).toHaveLength(0);
    expect(set.areas[0]!.area_m2).toBe(0);
  });

  it('rejects a values array that does not match the grid with a message', () => {
    expect(() => contourGrid({ values: [1, 2, 3], grid: square, levels: [1] })).toThrow(/expected 121 values/);
  });
});

describe('contourExcess({values, grid, threshold, outline}) finds the part of a polygon above a threshold', () => {
  const outline: Array<[number, number]> = [[102, 202], [108, 202], [108, 208], [102, 208]];
  it('a linear field v = x − 100 above 6 inside a 6 m square covers (8 − 6) × 6 = 12 m² (exact)', () => {
    const r = contourExcess({ values: sample(square, (x) => x - 100), grid: square, threshold: 6, outline });
    expectNear(r.area_m2, 12, 1e-6);
    for (const ring of r.coordinates[0]!) for (const [x, y] of ring) {
      expect(x).toBeGreaterThanOrEqual(106 - 1e-9);
      expect(x).toBeLessThanOrEqual(108 + 1e-9);
      expect(y).toBeGreaterThanOrEqual(202 - 1e-9);
      expect(y).toBeLessThanOrEqual(208 + 1e-9);
    }
    expect(r.peak?.x).toBe(108);
    expectNear(r.peak!.excess, 2, 1e-12);
  });
  it('is empty with a negative peak when the whole polygon is below the threshold', () => {
    const r = contourExcess({ values: sample(square, () => 3), grid: square, threshold: 5, outline });
    expect(r.coordinates).toHaveLength(0);
    expect(r.area_m2).toBe(0);
    expectNear(r.peak!.excess, -2, 1e-12);
    expect(r.nodesInside).toBe(49);
  });
  it('covers the whole polygon when everything is above the threshold (a 36 m² square)', () => {
    const r = contourExcess({ values: sample(square, () => 9), grid: square, threshold: 5, outline });
    expectNear(r.area_m2, 36, 1e-6);
  });
  it('counts a non-finite value as exceeding, never as safe', () => {
    const values = sample(square, () => 3);
    values[5 * 11 + 5] = Number.NaN;
    const r = contourExcess({ values, grid: square, threshold: 5, outline });
    expect(r.area_m2).toBeGreaterThan(0);
    expect(r.peak!.excess).toBe(Infinity);
  });
  it('signedDistanceToRing is positive inside and negative outside (exact for a square)', () => {
    expectNear(signedDistanceToRing(105, 205, outline), 3, 1e-12);
    expectNear(signedDistanceToRing(110, 205, outline), -2, 1e-12);
    expectNear(signedDistanceToRing(111, 211, outline), -Math.SQRT2 * 3, 1e-12);
  });
});

describe('contourMask({flags, grid, bits}) outlines flagged nodes', () => {
  it('puts the edge half-way between flagged and unflagged nodes', () => {
    const flags = Uint8Array.from(sample(square, (x) => (x >= 105 ? 1 : 0)));
    const r = contourMask({ flags, grid: square, bits: 1 });
    expect(r.count).toBe(6 * 11);
    const xs = r.coordinates[0]![0]!.map((p) => p[0]);
    expectNear(Math.min(...xs), 104.5, 1e-9);
    expectNear(Math.max(...xs), 110, 1e-9);
  });
  it('returns nothing when no node has the bit', () => {
    const r = contourMask({ flags: new Uint8Array(121).fill(2), grid: square, bits: 1 });
    expect(r).toEqual({ coordinates: [], count: 0 });
  });
});

describe('contourSetToGeoJSON(set) wraps contours as GeoJSON features', () => {
  const set = contourGrid({ values: sample(square, (x) => x - 100), grid: square, levels: [5] });
  it('writes one MultiLineString per level with the value under the given name', () => {
    const fc = contourSetToGeoJSON(set, { valueName: 'drawdown_m' });
    expect(fc.type).toBe('FeatureCollection');
    expect(fc['drydig:coordinates']).toBe('site-metres');
    expect(fc.features[0]!.geometry.type).toBe('MultiLineString');
    expect(fc.features[0]!.properties).toEqual({ kind: 'contour', drawdown_m: 5 });
  });
  it('transforms coordinates with toLonLat and adds areas on request', () => {
    const fc = contourSetToGeoJSON(set, { toLonLat: (x, y) => [x / 1000, y / 1000], includeAreas: true });
    expect(fc['drydig:coordinates']).toBe('lonlat');
    const line = fc.features[0]!.geometry.coordinates as number[][][];
    expectNear(line[0]![0]![0]!, 0.105, 1e-12);
    expect(fc.features[1]!.geometry.type).toBe('MultiPolygon');
    expectNear(fc.features[1]!.properties.area_m2 as number, 50, 1e-9);
  });
});

describe('contourGrid({holes}) leaves out nodes with no value', () => {
  it('cuts lines away from a column of holes instead of tracing its edge', () => {
    // v = y − 200 with the three easternmost node columns missing (like ground across a boundary).
    const values = sample(square, (_x, y) => y - 200);
    const holes = Uint8Array.from(sample(square, (x) => (x >= 108 ? 1 : 0)));
    const set = contourGrid({ values, grid: square, levels: [2, 4, 6, 8], holes });
    for (const line of set.lines) {
      for (const part of line.coordinates) {
        for (const [x, y] of part) {
          // Lines stay in cells clear of holes (x ≤ 107) and are the exact horizontals y = 200 + L.
          expect(x).toBeLessThanOrEqual(107 + 1e-9);
          expectNear(y, 200 + line.level, 1e-9);
        }
      }
      // No vertical piece along the hole edge.
      expect(line.coordinates.every((part) => part.every((p) => Math.abs(p[1] - (200 + line.level)) < 1e-9))).toBe(true);
    }
    // Areas exclude the holes: d3-contour interpolates towards −∞ at a hole, so the edge sits on the
    // last valid node column: {v ≥ 2} spans x 100…107, y 202…210 → 56 m².
    expectNear(set.areas[0]!.area_m2, 7 * 8, 1e-9);
  });
  it('rejects a holes array of the wrong length', () => {
    expect(() => contourGrid({ values: sample(square, () => 1), grid: square, levels: [0.5], holes: [1] })).toThrow(/hole flags/);
  });
});
