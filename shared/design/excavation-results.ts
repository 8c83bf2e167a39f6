/**
 * Stage 7 of a design run: per excavation, the verified worst point against its target — met or
 * not, by how much, where — and the control-point table of the result.
 */
import type { PointResult } from '../field';
import type { ControlPoint } from './control-points';
import type { DesignContext } from './design-context';
import type { DesignControlPointResult, DesignExcavationResult } from './design-result';

export interface SummariseExcavationsOptions {
  ctx: DesignContext;
  designPoints: ControlPoint[];
  checkPoints: ControlPoint[];
  /** Check points added to the rows by refinement. */
  addedCheckPoints: ReadonlySet<number>;
  pointResults: PointResult[];
}

/** Each excavation's verified state at the design time (times are added by a later stage). */
export function summariseExcavations({ ctx, designPoints, checkPoints, addedCheckPoints, pointResults }: SummariseExcavationsOptions): DesignExcavationResult[] {
  return ctx.scenario.excavations.map((e) => {
    let worst = -Infinity;
    let at = -1;
    let designCount = 0;
    let checkCount = 0;
    let above = 0;
    checkPoints.forEach((p, i) => {
      if (p.excavationId !== e.id) return;
      checkCount++;
      const over = pointResults[i]!.level_m - p.targetLevel_m;
      if (over > 0) above++;
      if (over > worst) {
        worst = over;
        at = i;
      }
    });
    for (const p of designPoints) if (p.excavationId === e.id) designCount++;
    const cp = checkPoints[at]!;
    return {
      id: e.id,
      targetLevel_m: ctx.targetOf(e),
      formationLevel_m: e.formationLevel_m,
      met: worst <= 0,
      worstShortfall_m: worst,
      critical: { x: cp.x, y: cp.y, level_m: pointResults[at]!.level_m, targetLevel_m: cp.targetLevel_m, kind: cp.kind },
      timeToTarget_s: null,
      recoveryToFormation_s: null,
      recoveryNote: null,
      controlPointCount: designCount + [...addedCheckPoints].filter((i) => checkPoints[i]!.excavationId === e.id).length,
      checkPointCount: checkCount,
      pointsAboveTarget: above,
    };
  });
}

/** True when every user control point outside the excavations stands at or below its target. */
export function areUserPointsMet(checkPoints: ControlPoint[], pointResults: PointResult[]): boolean {
  return checkPoints.every((p, i) => p.excavationId !== null || pointResults[i]!.level_m <= p.targetLevel_m);
}

/**
 * The design set as reported: design points (levels at them from the check evaluation where they
 * coincide) and the check points added by refinement.
 */
export function buildControlPointResults(
  designPoints: ControlPoint[],
  checkPoints: ControlPoint[],
  addedCheckPoints: ReadonlySet<number>,
  checkResults: PointResult[],
  pointTimes: Map<ControlPoint, number | null>,
): DesignControlPointResult[] {
  const key = (p: { x: number; y: number }) => `${p.x.toFixed(6)},${p.y.toFixed(6)}`;
  const byKey = new Map<string, number>();
  checkPoints.forEach((p, i) => byKey.set(key(p), i));
  const out: DesignControlPointResult[] = [];
  const push = (p: ControlPoint, level: number | undefined, flags: string[]) =>
    out.push({
      x: p.x,
      y: p.y,
      kind: p.kind,
      excavationId: p.excavationId,
      targetLevel_m: p.targetLevel_m,
      level_m: level ?? NaN,
      timeToTarget_s: pointTimes.get(p) ?? null,
      flags,
    });
  for (const p of designPoints) {
    const i = byKey.get(key(p));
    if (i !== undefined) push(p, checkResults[i]!.level_m, checkResults[i]!.flags);
  }
  for (const i of addedCheckPoints) push(checkPoints[i]!, checkResults[i]!.level_m, checkResults[i]!.flags);
  return out.filter((p) => Number.isFinite(p.level_m));
}
