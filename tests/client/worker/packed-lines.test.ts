import { describe, expect, it } from 'vitest';
import { linesOnLayers, meanVertex, packLines, packedCount } from '../../../client/worker/packed-lines';

describe('packLines(lines)', () => {
  const lines = [
    { layer: 'KERB', points: [[0, 0], [2, 0]] as Array<[number, number]>, closed: false },
    { layer: 'PIT', points: [[0, 0], [4, 0], [4, 4], [0, 4]] as Array<[number, number]>, closed: true },
    { layer: 'KERB', points: [[2, 0], [2, 6]] as Array<[number, number]>, closed: false },
  ];
  it('keeps every vertex, layer and closed flag in typed arrays', () => {
    const p = packLines(lines);
    expect(packedCount(p)).toBe(3);
    expect(p.layers).toEqual(['KERB', 'PIT']);
    expect([...p.layerOf]).toEqual([0, 1, 0]);
    expect([...p.closed]).toEqual([0, 1, 0]);
    expect([...p.offsets]).toEqual([0, 2, 6, 8]);
    expect([...p.coords]).toEqual([0, 0, 2, 0, 0, 0, 4, 0, 4, 4, 0, 4, 2, 0, 2, 6]);
  });
  it('picks the lines of chosen layers and their mean vertex', () => {
    const p = packLines(lines);
    expect(linesOnLayers(p, new Set(['KERB']))).toEqual([0, 2]);
    expect(meanVertex(p, [0, 2])).toEqual([1.5, 1.5]);
    expect(meanVertex(p, [])).toBeNull();
  });
});
