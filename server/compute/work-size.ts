/**
 * The size limit on engine work, checked before any work starts: a request's cost grows with
 * wells × points × times (each well's response summed at each point at each time). Today's
 * engine does about 4·10⁷ of these per second on one core (bench), so the default limit of
 * 2.5·10⁸ keeps a request well inside its time budget; past it the answer is a 413 naming the
 * field and the numbers.
 */
import { DrydigError, type Scenario } from '../../shared/schema';
import { getMonitoring, monitoringTimes } from '../../shared/exports';

/** Largest wells × points × times one request may ask for. */
export const DEFAULT_MAX_WORK = 250_000_000;

function refuse(path: string, wells: number, points: number, times: number, what: string, limit: number): never {
  const work = wells * points * times;
  throw new DrydigError(
    'DRYDIG_ERR_WORK_TOO_LARGE',
    `${path}: ${wells} wells × ${points} ${what} × ${times} times = ${work.toExponential(2)}, more than the limit of ${limit.toExponential(2)} (wells × points × times)`,
    [{ path, message: `wells × points × times must not exceed ${limit}` }],
  );
}

/**
 * Largest wells × points × times that goes in the quick lane (a thread kept for small requests):
 * about 25 ms of engine work at the rate above, the size of a site team's point check.
 */
export const QUICK_WORK = 1_000_000;

type EvaluateBody = { scenario: Scenario; points?: readonly unknown[]; grid?: { counts: readonly [number, number] }; times_s?: readonly unknown[] };

function evaluateSize(body: EvaluateBody): { wells: number; points: number; times: number } {
  return {
    wells: body.scenario.wells.length,
    points: (body.points?.length ?? 0) + (body.grid ? body.grid.counts[0] * body.grid.counts[1] : 0),
    times: body.times_s?.length ?? 1,
  };
}

/** Throws DRYDIG_ERR_WORK_TOO_LARGE when an evaluate request is over the limit. */
export function checkEvaluateWork(body: EvaluateBody, limit = DEFAULT_MAX_WORK): void {
  const { wells, points, times } = evaluateSize(body);
  if (wells * points * times > limit) refuse(body.grid ? '/grid/counts' : '/points', wells, points, times, 'points', limit);
}

/** Whether an evaluate request is small enough for the quick lane. */
export function isQuickEvaluate(body: EvaluateBody): boolean {
  const { wells, points, times } = evaluateSize(body);
  return Math.max(1, wells) * points * times <= QUICK_WORK;
}

/** Throws DRYDIG_ERR_WORK_TOO_LARGE when a scenario's monitoring plan (piezometers × its times) is over the limit. */
export function checkMonitoringWork(scenario: Scenario, limit = DEFAULT_MAX_WORK, path = '/monitoring/piezometers'): void {
  const wells = scenario.wells.length;
  const piezometers = getMonitoring(scenario)?.piezometers.length ?? 0;
  const times = monitoringTimes(scenario)?.times_s.length ?? 1;
  if (wells * piezometers * times > limit) refuse(path, wells, piezometers, times, 'piezometers', limit);
}
