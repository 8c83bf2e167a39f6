import { DrydigError, type Scenario } from '../schema';
import { checkPoints, evaluatePreparedPoint } from './evaluate-points';
import { prepareField } from './prepare-field';
import type { ModelInfo, PointFlag } from './types';

/** Options of {@link evaluateSeries}. */
export interface EvaluateSeriesOptions {
  scenario: Scenario;
  /** Plan position [x, y], m. */
  point: readonly [number, number];
  /** Times since pumping started, s (each finite; ≤ 0 gives the static level). */
  times_s: readonly number[];
}

/** One time of a series. */
export interface SeriesSample {
  time_s: number;
  level_m: number;
  drawdown_m: number;
  flags: PointFlag[];
}

/** Result of {@link evaluateSeries}. */
export interface SeriesResult {
  x: number;
  y: number;
  samples: SeriesSample[];
  /** Model of the last time (the method and notes are the same at every time). */
  model: ModelInfo;
}

/**
 * Level and drawdown at one point over time (hydrographs, recovery after a stop): a transient
 * evaluation at each time, schedules superposed in time.
 *
 * @throws DrydigError naming `/times_s/i` or `/point` for bad input
 */
export function evaluateSeries({ scenario, point, times_s }: EvaluateSeriesOptions): SeriesResult {
  checkPoints([point], '/point');
  if (!Array.isArray(times_s)) {
    throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', '/times_s: must be an array of times in seconds', [{ path: '/times_s', message: 'must be an array' }]);
  }
  times_s.forEach((t, i) => {
    if (!Number.isFinite(t)) {
      throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', `/times_s/${i}: must be a finite number of seconds`, [
        { path: `/times_s/${i}`, message: 'must be a finite number of seconds' },
      ]);
    }
  });
  const [x, y] = point;
  let model: ModelInfo | undefined;
  const samples = times_s.map((t) => {
    const field = prepareField({ scenario, time_s: t });
    model = field.info;
    const r = evaluatePreparedPoint(field, x, y);
    return { time_s: t, level_m: r.level_m, drawdown_m: r.drawdown_m, flags: r.flags };
  });
  model ??= prepareField({ scenario, time_s: scenario.design.time_s ?? 1 }).info;
  return { x, y, samples, model };
}
