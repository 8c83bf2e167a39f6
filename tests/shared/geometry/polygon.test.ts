import { describe, expect, it } from 'vitest';
import {
  getPolygonArea, getPolygonSignedArea, getPolygonPerimeter, getPolygonCentroid,
  isPointInPolygon, findSelfIntersection,
} from '../../../shared/geometry';

// Closed forms of plane geometry (exact; no outside source needed beyond elementary geometry).
const rectangle: Array<[number, number]> = [[0, 0], [40, 0], [40, 20], [0, 20]];

describe('polygon helpers', () => {
  it('getPolygonArea(rectangle) is width × height, whichever the winding', () => {
    expect(getPolygonArea(rectangle)).toBe(800);
    expect(getPolygonSignedArea(rectangle)).toBe(800);
    expect(getPolygonSignedArea([...rectangle].reverse())).toBe(-800);
  });
  it('tolerates a repeated closing vertex', () => {
    expect(getPolygonArea([...rectangle, [0, 0]])).toBe(800);
    expect(getPolygonPerimeter([...rectangle, [0, 0]])).toBe(120);
  });
  it('getPolygonCentroid of an L-shape is the area-weighted centre', () => {
    // L of a 2×1 bar (centre (1, 0.5), area 2) and a 1×1 square on top (centre (0.5, 1.5), area 1).
    const l: Array<[number, number]> = [[0, 0], [2, 0], [2, 1], [1, 1], [1, 2], [0, 2]];
    const [cx, cy] = getPolygonCentroid(l);
    expect(cx).toBeCloseTo((2 * 1 + 1 * 0.5) / 3, 12);
    expect(cy).toBeCloseTo((2 * 0.5 + 1 * 1.5) / 3, 12);
  });
  it('isPointInPolygon tells inside from outside, including in a notch', () => {
    const l: Array<[number, number]> = [[0, 0], [2, 0], [2, 1], [1, 1], [1, 2], [0, 2]];
    expect(isPointInPolygon(0.5, 1.5, l)).toBe(true);
    expect(isPointInPolygon(1.5, 1.5, l)).toBe(false);
    expect(isPointInPolygon(-1, 0.5, l)).toBe(false);
  });
  it('findSelfIntersection finds a bow-tie and passes a simple ring', () => {
    expect(findSelfIntersection(rectangle)).toBeNull();
    expect(findSelfIntersection([[0, 0], [10, 10], [10, 0], [0, 10]])).not.toBeNull();
  });
});
