import { DrydigError } from '../schema';
import { isInsideBoundaries } from './image-wells';
import { flagsFromBits, interpretSum, type InterpretedSum } from './interpret-sum';
import { prepareField, type PreparedField } from './prepare-field';
import { superposeAtPoint, type PointSum } from './superpose';
import { partialPenetrationAt } from './partial-penetration-sum';
import { FLAG_BITS, type EvaluatePointsOptions, type EvaluatePointsResult, type PointResult } from './types';

/** Checks points are finite pairs; names the first bad one (`/points/3`). */
export function checkPoints(points: ReadonlyArray<readonly [number, number]>, path = '/points'): void {
  if (!Array.isArray(points)) {
    throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', `${path}: must be an array of [x, y] pairs`, [{ path, message: 'must be an array of [x, y] pairs' }]);
  }
  points.forEach((p, i) => {
    if (!Array.isArray(p) || p.length < 2 || !Number.isFinite(p[0]) || !Number.isFinite(p[1])) {
      throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', `${path}/${i}: must be a pair of finite numbers [x, y] in metres`, [
        { path: `${path}/${i}`, message: 'must be a pair of finite numbers [x, y] in metres' },
      ]);
    }
  });
}

/**
 * Evaluates a prepared field at one point into a PointResult.
 * @param skipWell a well whose face this point is (its r_w clamp is expected, not flagged)
 */
export function evaluatePreparedPoint(field: PreparedField, x: number, y: number, skipWell = -1): PointResult & { sum: number } {
  const { model, sources, geometry } = field;
  if (!isInsideBoundaries(geometry, x, y)) {
    // Across a boundary: outside the modelled aquifer; the image field there means nothing.
    return { x, y, time_s: model.time_s, level_m: model.staticLevel_m, drawdown_m: 0, flags: ['beyond-boundary'], sum: 0 };
  }
  const sum: PointSum = superposeAtPoint(sources, x, y, { value: 0, withinWell: false, reached: false }, skipWell);
  if (field.penetration) sum.value += partialPenetrationAt(field.penetration, sources, x, y, skipWell);
  const out: InterpretedSum = interpretSum(model, sum.value, { level_m: 0, drawdown_m: 0, flagBits: 0 });
  let bits = out.flagBits;
  if (sum.withinWell) bits |= FLAG_BITS['within-well-radius'];
  if (sources.kind === 'thiem' && sources.count > 0 && !sum.reached) bits |= FLAG_BITS['beyond-influence-radius'];
  return { x, y, time_s: model.time_s, level_m: out.level_m, drawdown_m: out.drawdown_m, flags: flagsFromBits(bits), sum: sum.value };
}

/**
 * Level and drawdown at plan points at one time: superposition of all pumping wells, their rate
 * steps (superposition in time) and their image wells (see design.md section 5).
 *
 * `time_s` undefined → the scenario's design time; null → steady state. Points nearer than r_w
 * to a well are evaluated at r_w (flag `within-well-radius`).
 *
 * @throws DrydigError naming the field for an unusable scenario, point or time
 */
export function evaluatePoints({ scenario, points, time_s }: EvaluatePointsOptions): EvaluatePointsResult {
  checkPoints(points);
  const field = prepareField({ scenario, time_s });
  const results: PointResult[] = points.map(([x, y]) => {
    const { sum: _sum, ...result } = evaluatePreparedPoint(field, x, y);
    return result;
  });
  return { points: results, model: field.info };
}
