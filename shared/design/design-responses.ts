/**
 * Stage 2 of a design run: unit responses of the design wells (variable per m³/s, staged starts
 * honoured) at the check points, the design points and each well's own axis.
 */
import type { ControlPoint } from './control-points';
import { designResponse, pointXY, type DesignContext } from './design-context';

export interface DesignResponses {
  /** Check points × wells, at the design time. */
  check: Float64Array;
  /** Design points × wells, at the design time. */
  design: Float64Array;
  /** Well axes × wells, at the limit-check time (the point the engine's wellLevels() reports). */
  face: Float64Array;
}

/** The three response matrices a design uses. */
export function computeDesignResponses(ctx: DesignContext, designPoints: ControlPoint[], checkPoints: ControlPoint[]): DesignResponses {
  return {
    check: designResponse(ctx, checkPoints.map(pointXY), ctx.designTime_s),
    design: designResponse(ctx, designPoints.map(pointXY), ctx.designTime_s),
    // At the well's own axis the engine evaluates its own well at r_w and every other well at the
    // axis distance — the same point the engine's wellLevels() reports.
    face: designResponse(
      ctx,
      ctx.wells.map((w) => [w.x, w.y] as const),
      ctx.limitTime_s,
    ),
  };
}
