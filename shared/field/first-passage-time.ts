/**
 * First-passage time of a monotone history: the first time a level crosses a threshold (a point
 * reaching its target while pumping, a head rising back above a level after the pumps stop).
 * Drawdown under constant pumping grows monotonically with time, and after a stop the residual
 * drawdown falls monotonically (Theis 1935 superposition: every well function grows with t), so
 * the crossing is bracketed by log-spaced samples and then bisected in log t.
 */
import { logSpacedTimes } from './log-spaced-times';

/** Options of {@link firstPassageTime}. */
export interface FirstPassageTimeOptions {
  /** True once the threshold is crossed at time t (s from the start of the history); monotone in t. */
  reached: (t_s: number) => boolean;
  /** First sample, s (> 0). */
  start_s: number;
  /** Last sample, s: beyond it the answer is null. */
  end_s: number;
  /** Log-spaced samples from start_s to end_s (default 24). */
  samples?: number;
  /** Bisection steps in log t inside the bracketing interval (default 30: relative error < 1e-8 for 24 samples per 10 decades). */
  bisections?: number;
}

/**
 * First time at which `reached` holds, s: 0 when it already holds at t = 0; null when it does not
 * hold by `end_s`. Below the first sample the bracket is [start_s/1000, start_s].
 */
export function firstPassageTime({ reached, start_s, end_s, samples = 24, bisections = 30 }: FirstPassageTimeOptions): number | null {
  if (reached(0)) return 0;
  let previous = start_s / 1000;
  for (const t of logSpacedTimes({ end_s, count: samples, start_s })) {
    if (reached(t)) return bisectLog(reached, previous, t, bisections);
    previous = t;
  }
  return null;
}

/** Smallest t in (lo, hi] with reached(t), given !reached(lo) and reached(hi), by bisection in log t. */
function bisectLog(reached: (t_s: number) => boolean, lo: number, hi: number, steps: number): number {
  let a = lo;
  let b = hi;
  for (let k = 0; k < steps; k++) {
    const m = Math.sqrt(a * b);
    if (reached(m)) b = m;
    else a = m;
  }
  return b;
}
