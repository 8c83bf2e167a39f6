import { DrydigError } from '../schema';

/** Options of {@link logSpacedTimes}. */
export interface LogSpacedTimesOptions {
  /** Last time, s (> 0). */
  end_s: number;
  /** Number of times (≥ 1; whole number). */
  count: number;
  /** First time, s (> 0, < end_s). Default end_s / 10⁴ (four log cycles, as pumping-test plots). */
  start_s?: number;
}

/**
 * Times evenly spaced in log t from start_s to end_s inclusive (for hydrographs: drawdown
 * changes evenly per log cycle, Cooper & Jacob 1946).
 *
 * @throws DrydigError (DRYDIG_ERR_INVALID_REQUEST) naming the bad option
 */
export function logSpacedTimes({ end_s, count, start_s }: LogSpacedTimesOptions): number[] {
  const bad = (path: string, message: string): never => {
    throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', `${path}: ${message}`, [{ path, message }]);
  };
  if (!(Number.isFinite(end_s) && end_s > 0)) bad('/end_s', 'must be a finite number of seconds > 0');
  if (!(Number.isInteger(count) && count >= 1 && count <= 100_000)) bad('/count', 'must be a whole number from 1 to 100000');
  const start = start_s ?? end_s / 1e4;
  if (!(Number.isFinite(start) && start > 0 && start <= end_s)) bad('/start_s', 'must be a finite number of seconds > 0 and ≤ end_s');
  if (count === 1) return [end_s];
  const a = Math.log(start);
  const step = (Math.log(end_s) - a) / (count - 1);
  const times = Array.from({ length: count }, (_, k) => Math.exp(a + k * step));
  times[0] = start;
  times[count - 1] = end_s;
  return times;
}
