/**
 * A pumping-test analysis: the methods that apply to the readings, each fitted and judged, in one
 * result (design.md §8). Constant-rate readings go to Theis, Cooper–Jacob and Hantush–Jacob;
 * readings after the stop to Theis recovery; readings at several rates to the step-drawdown
 * analysis. A method that does not apply is left out with a caution saying why — never a fit
 * of numbers that mean nothing.
 */
import { DrydigError } from '../schema';
import type { PumpingTestFit, PumpingTestResult, TestMethod } from './fit-result';
import { fitTheisCurve } from './theis-curve-fit';
import { fitCooperJacob, COOPER_JACOB_U_MAX } from './cooper-jacob-fit';
import { fitTheisRecovery } from './theis-recovery-fit';
import { fitHantushCurve } from './hantush-curve-fit';
import { analyseStepDrawdown } from './step-drawdown-analysis';
import { groupReadingsByWell, type TestReading } from './test-readings';

export const ALL_TEST_METHODS: readonly TestMethod[] = ['theis', 'cooper-jacob', 'recovery', 'hantush', 'step'];

export interface AnalysePumpingTestOptions {
  readings: readonly TestReading[];
  /** Methods to run; default every one that applies. */
  methods?: readonly TestMethod[];
  /** Pump stop time, s (recovery). Default: none, unless readings are marked recovery. */
  stop_s?: number | null;
  /** Fit each observation well on its own as well as all together. Default false. */
  perWell?: boolean;
  /** Cooper–Jacob / recovery limit of u. Default 0.05. */
  uMax?: number;
  /** Rate used for the result, m³/s (default: the readings' most common pumping rate). */
  rate_m3_s?: number;
  /** JSON pointer of the options for messages. Default ''. */
  path?: string;
}

const CAUTION =
  'Parameters from a pumping test describe the ground the test reached, under the test’s conditions: they carry the method’s idealisations (homogeneous, isotropic, infinite aquifer unless stated) and the fit’s uncertainty. Check them against the borehole logs and grain sizes, and have them reviewed by a licensed engineer before a design rests on them.';

/** Runs the analysis. Throws DrydigError (DRYDIG_ERR_INVALID_READINGS) when nothing can be fitted. */
export function analysePumpingTest(options: AnalysePumpingTestOptions): PumpingTestResult {
  const path = options.path ?? '';
  const readings = options.readings.filter((r) => Number.isFinite(r.time_s) && Number.isFinite(r.drawdown_m));
  const uMax = options.uMax ?? COOPER_JACOB_U_MAX;
  if (!(uMax > 0 && uMax <= 1)) throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', `${path}/uMax: must be > 0 and at most 1`, [{ path: `${path}/uMax`, message: 'must be > 0 and at most 1' }]);
  const marked = readings.filter((r) => r.phase === 'recovery');
  const stop_s = options.stop_s ?? (marked.length > 0 ? Math.max(...readings.filter((r) => r.phase === 'pumping').map((r) => r.time_s), 0) : null);
  const pumping = readings.filter((r) => r.phase === 'pumping' && (stop_s === null || r.time_s <= stop_s));
  const rates = [...new Set(pumping.map((r) => r.rate_m3_s))];
  const isStepTest = rates.length > 1;
  const rate_m3_s = options.rate_m3_s ?? (rates.length === 1 ? rates[0]! : Math.max(...rates, 0));
  const requested = options.methods ?? ALL_TEST_METHODS;
  const cautions: string[] = [CAUTION];
  const fits: PumpingTestFit[] = [];
  const tryFit = (method: TestMethod, run: () => PumpingTestFit) => {
    try {
      fits.push(run());
    } catch (error) {
      if (!(error instanceof RangeError)) throw error;
      cautions.push(`${METHOD_LABELS[method]}: not fitted — ${error.message}.`);
    }
  };
  const groups = groupReadingsByWell(pumping);
  const perWell = options.perWell === true && groups.size > 1;
  const constantRate = (method: TestMethod, fit: (list: TestReading[], well: string | null) => PumpingTestFit) => {
    if (!requested.includes(method)) return;
    if (isStepTest) {
      cautions.push(`${METHOD_LABELS[method]}: not fitted — the readings are at ${rates.length} different rates (a step test); fit a constant-rate test, or use the step-drawdown analysis.`);
      return;
    }
    const all = [...pumping].sort((a, b) => a.time_s - b.time_s);
    tryFit(method, () => fit(all, groups.size === 1 ? [...groups.keys()][0]! : null));
    if (perWell) for (const [well, list] of groups) tryFit(method, () => fit(list, well));
  };
  constantRate('theis', fitTheisCurve);
  constantRate('cooper-jacob', (list, well) => fitCooperJacob(list, well, uMax));
  constantRate('hantush', fitHantushCurve);
  if (requested.includes('recovery')) {
    if (stop_s === null) {
      if (options.methods?.includes('recovery')) cautions.push('Theis recovery: not fitted — no pump stop time (give stop_s / --stop, or mark readings as recovery).');
    } else {
      const theis = fits.find((f) => f.method === 'theis' && f.well === null) ?? fits.find((f) => f.method === 'theis');
      const recoveryGroups = groupReadingsByWell(readings.filter((r) => r.time_s > stop_s));
      for (const [well, list] of recoveryGroups)
        tryFit('recovery', () =>
          fitTheisRecovery(
            list.map((r) => ({ ...r, rate_m3_s: rate_m3_s })),
            well,
            { stop_s, uMax, ...(theis?.storativity && theis.transmissivity_m2_s ? { storativity: theis.storativity, transmissivity_m2_s: theis.transmissivity_m2_s } : {}) },
          ),
        );
      if (recoveryGroups.size === 0) cautions.push(`Theis recovery: not fitted — no readings after the stop at ${stop_s} s.`);
    }
  }
  if (requested.includes('step') && (isStepTest || options.methods?.includes('step'))) tryFit('step', () => analyseStepDrawdown(pumping, groups.size === 1 ? [...groups.keys()][0]! : null));
  if (fits.length === 0)
    throw new DrydigError('DRYDIG_ERR_INVALID_READINGS', `${path || 'readings'}: no method could be fitted: ${cautions.slice(1).join(' ')}`, [{ path: path || 'readings', message: 'no method could be fitted' }]);
  const pumpedWell = [...groups.values()].flat().some((r) => r.distance_m < 1);
  if (pumpedWell && !isStepTest) cautions.push('Readings in the pumped well include its well loss and any partial penetration: T from them is a lower bound; prefer observation wells.');
  return {
    fits,
    readings: {
      count: readings.length,
      wells: [...groupReadingsByWell(readings)].map(([well, list]) => ({ well, distance_m: list[0]!.distance_m, count: list.length, recovery: list.filter((r) => stop_s !== null && r.time_s > stop_s).length })),
    },
    rate_m3_s,
    stop_s,
    cautions,
  };
}

/** What each method is called in words (one place for the labels). */
export const METHOD_LABELS: Record<TestMethod, string> = {
  theis: 'Theis curve fit',
  'cooper-jacob': 'Cooper–Jacob straight line',
  recovery: 'Theis recovery',
  hantush: 'Hantush–Jacob leaky fit',
  step: 'Step-drawdown analysis',
};
