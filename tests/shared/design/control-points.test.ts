import { describe, expect, it } from 'vitest';
import { defaultControlSpacing, generateControlPoints, getExcavationTargetLevel } from '../../../shared/design';
import type { Excavation } from '../../../shared/schema';

const pit: Excavation = { id: 'pit', outline: [[0, 0], [40, 0], [40, 20], [0, 20]], formationLevel_m: 7, margin_m: 0.5 };

describe('generateControlPoints', () => {
  it('places vertices, edge points at the spacing and a grid of cell centres inside', () => {
    // 40 × 20 m at 5 m: 4 vertices; edges 8 + 4 + 8 + 4 segments → 7 + 3 + 7 + 3 = 20 edge points;
    // grid 8 × 4 = 32 cell centres. Counted by hand.
    const points = generateControlPoints({ excavations: [pit], spacing_m: 5 });
    const count = (kind: string) => points.filter((p) => p.kind === kind).length;
    expect([count('vertex'), count('edge'), count('grid')]).toEqual([4, 20, 32]);
    expect(points.every((p) => p.targetLevel_m === 6.5 && p.excavationId === 'pit')).toBe(true);
    expect(points.find((p) => p.kind === 'grid')).toMatchObject({ x: 2.5, y: 2.5 });
  });

  it('doubles the density for check points', () => {
    const points = generateControlPoints({ excavations: [pit], spacing_m: 5, densify: 2 });
    expect(points.filter((p) => p.kind === 'grid')).toHaveLength(16 * 8);
  });

  it('gives a point inside two excavations the lower target', () => {
    const deeper: Excavation = { id: 'sump', outline: [[10, 5], [15, 5], [15, 10], [10, 10]], formationLevel_m: 5, margin_m: 1 };
    const points = generateControlPoints({ excavations: [pit, deeper], spacing_m: 5 });
    const inside = points.find((p) => p.excavationId === 'pit' && p.x === 12.5 && p.y === 7.5)!;
    expect(inside.targetLevel_m).toBe(4);
  });

  it('takes a user point’s target from its excavation, or from the point', () => {
    const points = generateControlPoints({ excavations: [pit], spacing_m: 10, userPoints: [{ x: 1, y: 1 }, { x: 60, y: 0, targetLevel_m: 9 }] });
    const users = points.filter((p) => p.kind === 'user');
    expect(users).toEqual([
      { x: 1, y: 1, targetLevel_m: 6.5, excavationId: 'pit', kind: 'user' },
      { x: 60, y: 0, targetLevel_m: 9, excavationId: null, kind: 'user' },
    ]);
  });

  it('names the field when too many points would be made', () => {
    expect(() => generateControlPoints({ excavations: [pit], spacing_m: 0.01, spacingPath: '/options/controlSpacing_m' })).toThrow(/\/options\/controlSpacing_m/);
  });
});

describe('defaultControlSpacing and getExcavationTargetLevel', () => {
  it('uses the shorter side / 8 within 0.5–25 m', () => {
    expect(defaultControlSpacing(pit.outline)).toBe(2.5);
    expect(defaultControlSpacing([[0, 0], [1, 0], [1, 1]])).toBe(0.5);
    expect(defaultControlSpacing([[0, 0], [1000, 0], [1000, 1000]])).toBe(25);
  });
  it('is formation level minus margin', () => {
    expect(getExcavationTargetLevel(pit)).toBe(6.5);
  });
});
