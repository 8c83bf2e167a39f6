/**
 * Control points: where the design must bring groundwater down to the target level. For each
 * excavation: the outline's vertices, points along each edge at a spacing, and a grid inside;
 * plus any user points. Corners and edge midpoints between wells are where the level usually
 * stands highest for a perimeter ring, the centre for a large pit, so all three kinds are kept.
 */
import { DrydigError, type DesignControlPoint, type Excavation } from '../schema';
import { isPointInPolygon, openRing } from '../geometry';

/** Where a control point came from. */
export type ControlPointKind = 'vertex' | 'edge' | 'grid' | 'user';

export interface ControlPoint {
  x: number;
  y: number;
  /** Level the groundwater must reach here at the design time, m. */
  targetLevel_m: number;
  /** Excavation the point belongs to (null for a user point outside every excavation). */
  excavationId: string | null;
  kind: ControlPointKind;
  label?: string;
}

/** Target level of an excavation: formation level − margin, m. */
export function getExcavationTargetLevel(excavation: Excavation): number {
  return excavation.formationLevel_m - excavation.margin_m;
}

/** Default control spacing for an outline: the shorter bounding-box side / 8, within 0.5–25 m. */
export function defaultControlSpacing(outline: Excavation['outline']): number {
  const xs = outline.map((p) => p[0]);
  const ys = outline.map((p) => p[1]);
  const shorter = Math.min(Math.max(...xs) - Math.min(...xs), Math.max(...ys) - Math.min(...ys));
  return Math.min(25, Math.max(0.5, shorter / 8));
}

/** Largest number of control points one design may use (bounds solver memory and time). */
export const MAX_CONTROL_POINTS = 20_000;

export interface GenerateControlPointsOptions {
  excavations: readonly Excavation[];
  /** Spacing along edges and of the inside grid, m. Null: `defaultControlSpacing` per excavation. */
  spacing_m: number | null;
  /** Divide the spacing by this (check grids use 2: twice as dense as the design grid). Default 1. */
  densify?: number;
  /** User control points. */
  userPoints?: readonly DesignControlPoint[];
  /** JSON pointer of the user points for messages. Default '/designOptions/controlPoints'. */
  userPointsPath?: string;
  /** JSON pointer of the spacing for messages. Default '/designOptions/controlSpacing_m'. */
  spacingPath?: string;
  /** Target level of an excavation, m. Default formation − margin; the design passes the floor check's governing level. */
  targetOf?: (excavation: Excavation) => number;
}

/**
 * Control points of all excavations and the user points, each with its target level.
 * A point inside several excavations takes the lowest target. Throws `DrydigError` naming the
 * field when a user point has no target or the spacing makes more than `MAX_CONTROL_POINTS`.
 */
export function generateControlPoints({
  excavations,
  spacing_m,
  densify = 1,
  userPoints = [],
  userPointsPath = '/designOptions/controlPoints',
  spacingPath = '/designOptions/controlSpacing_m',
  targetOf = getExcavationTargetLevel,
}: GenerateControlPointsOptions): ControlPoint[] {
  const points: ControlPoint[] = [];
  const lowestTargetAt = (x: number, y: number, fallback: number): number => {
    let target = fallback;
    for (const e of excavations) if (isPointInPolygon(x, y, e.outline)) target = Math.min(target, targetOf(e));
    return target;
  };
  const push = (p: ControlPoint) => {
    points.push(p);
    if (points.length > MAX_CONTROL_POINTS)
      throw new DrydigError(
        'DRYDIG_ERR_INVALID_REQUEST',
        `${spacingPath}: the control spacing gives more than ${MAX_CONTROL_POINTS} control points; use a coarser spacing`,
        [{ path: spacingPath, message: `gives more than ${MAX_CONTROL_POINTS} control points; use a coarser spacing` }],
      );
  };

  for (const e of excavations) {
    const target = targetOf(e);
    const spacing = (spacing_m ?? defaultControlSpacing(e.outline)) / densify;
    const ring = openRing(e.outline);
    for (let i = 0; i < ring.length; i++) {
      const [x1, y1] = ring[i]!;
      const [x2, y2] = ring[(i + 1) % ring.length]!;
      push({ x: x1, y: y1, targetLevel_m: lowestTargetAt(x1, y1, target), excavationId: e.id, kind: 'vertex' });
      const length = Math.hypot(x2 - x1, y2 - y1);
      const n = Math.ceil(length / spacing - 1e-9);
      for (let k = 1; k < n; k++) {
        const x = x1 + ((x2 - x1) * k) / n;
        const y = y1 + ((y2 - y1) * k) / n;
        push({ x, y, targetLevel_m: lowestTargetAt(x, y, target), excavationId: e.id, kind: 'edge' });
      }
    }
    const xs = ring.map((p) => p[0]);
    const ys = ring.map((p) => p[1]);
    const x0 = Math.min(...xs);
    const y0 = Math.min(...ys);
    const nx = Math.max(1, Math.round((Math.max(...xs) - x0) / spacing));
    const ny = Math.max(1, Math.round((Math.max(...ys) - y0) / spacing));
    const dx = (Math.max(...xs) - x0) / nx;
    const dy = (Math.max(...ys) - y0) / ny;
    // Cell centres: never on the outline, so inside-tests are unambiguous.
    for (let j = 0; j < ny; j++) {
      for (let i = 0; i < nx; i++) {
        const x = x0 + (i + 0.5) * dx;
        const y = y0 + (j + 0.5) * dy;
        if (isPointInPolygon(x, y, e.outline)) push({ x, y, targetLevel_m: lowestTargetAt(x, y, target), excavationId: e.id, kind: 'grid' });
      }
    }
  }

  userPoints.forEach((u, i) => {
    const owner = excavations.find((e) => isPointInPolygon(u.x, u.y, e.outline));
    let target = u.targetLevel_m;
    if (target === undefined) {
      if (!owner)
        throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', `${userPointsPath}/${i}/targetLevel_m: is required for a point outside every excavation`, [
          { path: `${userPointsPath}/${i}/targetLevel_m`, message: 'is required for a point outside every excavation' },
        ]);
      target = lowestTargetAt(u.x, u.y, Infinity);
    }
    push({ x: u.x, y: u.y, targetLevel_m: target, excavationId: owner?.id ?? null, kind: 'user', ...(u.label ? { label: u.label } : {}) });
  });
  return points;
}
