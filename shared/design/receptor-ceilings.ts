/**
 * Drawdown limits of receptors as rows of the rate problem: at every sample point of a receptor
 * with `maxDrawdown_m` (its own points and points between, ≤ 5 m apart) and at every time of the
 * receptor timeline (design time, end of pumping and log-spaced times before it — the drawdown
 * need not grow monotonically once injection wells act), the superposed variable may not exceed
 * the one of the level static − (limit − tolerance).
 */
import { getReceptors } from '../schema';
import { receptorSamplePoints, receptorTimeline } from '../receptors';
import { designResponse, type DesignContext } from './design-context';
import type { CeilingRows } from './rate-problem';
import { DESIGN_TOLERANCE_M } from './requirement-rows';

/** End of pumping, s: the later of the design time and the pumping duration (null: steady). */
export function designEndTime(ctx: DesignContext): number | null {
  return ctx.designTime_s === null ? null : Math.max(ctx.designTime_s, ctx.options.duration_s);
}

/** The times the receptors are checked at (steady state: the one null time). */
export function receptorTimes(ctx: DesignContext): Array<number | null> {
  const times = receptorTimeline(ctx.designTime_s, designEndTime(ctx));
  return times.length === 0 ? [ctx.designTime_s] : times;
}

/** Ceiling rows for every receptor with a drawdown limit, or null when none has one (or in uniform mode). */
export function buildReceptorCeilings(ctx: DesignContext): CeilingRows | null {
  if (ctx.mode === 'uniform') return null;
  const limited = getReceptors(ctx.scenario).filter((r) => r.maxDrawdown_m !== undefined);
  if (limited.length === 0 || ctx.wells.length === 0) return null;
  const nW = ctx.wells.length;
  const static_m = ctx.scenario.aquifer.staticLevel_m;
  const responses: Float64Array[] = [];
  const max: number[] = [];
  const owner: number[] = [];
  const times = receptorTimes(ctx);
  limited.forEach((r, k) => {
    const points = receptorSamplePoints(r);
    const ceiling = ctx.variableForLevel(static_m - Math.max(0, r.maxDrawdown_m! - DESIGN_TOLERANCE_M));
    // A limit below the aquifer base cannot bind: no rate lowers water below it.
    if (!Number.isFinite(ceiling)) return;
    for (const t of times) {
      const m = designResponse(ctx, points, t);
      for (let i = 0; i < points.length; i++) {
        responses.push(m.subarray(i * nW, (i + 1) * nW));
        max.push(ceiling);
        owner.push(k);
      }
    }
  });
  const response = new Float64Array(responses.length * nW);
  responses.forEach((row, i) => response.set(row, i * nW));
  return { response, max: Float64Array.from(max), owner: Int32Array.from(owner), names: limited.map((r) => r.id) };
}
