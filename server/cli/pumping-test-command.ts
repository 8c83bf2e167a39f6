/**
 * `drydig pumping-test READINGS.csv --rate Q[unit] [--distance R] [--method …] [--stop T]`:
 * aquifer parameters from a pumping test's readings (design.md §8), printed as
 * `{"fits":[{"method","transmissivity_m2_s","storativity","leakageFactor_m"?,"rmse_m","interval"?,…}],…}`.
 * A bare number is SI (m³/s, m, s); a unit may follow it (25m3/h, 7L/s, 110gpm, 100ft, 24h).
 */
import { DrydigError } from '../../shared/schema';
import { parseQuantity, type Quantity } from '../../shared/units';
import { ALL_TEST_METHODS, analysePumpingTest, parseReadingsCsv, type TestMethod } from '../../shared/testing';
import type { CliCommand } from './cli-io';
import { parseOptions, usageError } from './parse-options';
import { readTextFile } from './read-scenario-file';

export const PUMPING_TEST_HELP = `drydig pumping-test READINGS.csv --rate Q [options]

  READINGS.csv         columns time_s (or time_min, time_h, time_d), drawdown_m (or drawdown_ft,
                       or level_m / level_ft with --static-level), and optionally distance_m,
                       well, phase (pumping|recovery), rate_m3_s / rate_m3_h / rate_l_s / rate_gpm
  --rate Q             pumping rate: m³/s, or with a unit: 25m3/h, 7L/s, 110gpm (required unless
                       the file has a rate column)
  --distance R         distance of the observation well from the pumped well: m, or 100ft
                       (required unless the file has a distance column)
  --method M[,M…]      theis, cooper-jacob, recovery, hantush, step (default: every one that applies)
  --stop T             time the pump stopped: s, or 24h, 2d … (later readings are recovery)
  --static-level L     static water level, m (when the file gives water levels, not drawdowns)
  --u-max U            Cooper–Jacob / recovery limit of u (default 0.05)
  --per-well           also fit each observation well on its own
  --pretty             indent the JSON

Prints {"fits":[{"method","transmissivity_m2_s","storativity","leakageFactor_m"?,"rmse_m",
"interval"?,…}],"readings":…,"cautions":[…]}. Intervals are approximate 95 % confidence
intervals. Parameters from a test carry its idealisations; check them against the logs and have
them reviewed by a licensed engineer.
`;

function quantityFlag(values: Record<string, string>, flag: string, quantity: Quantity): number | undefined {
  const text = values[flag];
  if (text === undefined) return undefined;
  const parsed = parseQuantity(text, quantity);
  if (!parsed.ok) throw usageError(`pumping-test: --${flag}: ${parsed.message}`);
  return parsed.value_si;
}

export const runPumpingTestCommand: CliCommand = async (args, io) => {
  const spec = {
    rate: 'value',
    distance: 'value',
    method: 'value',
    stop: 'value',
    'static-level': 'value',
    'u-max': 'value',
    'per-well': 'flag',
    pretty: 'flag',
    help: 'flag',
  } as const;
  const { positionals, values } = parseOptions(args, spec, 'pumping-test');
  if (values.help) {
    io.stdout(PUMPING_TEST_HELP);
    return 0;
  }
  const [file, ...extra] = positionals;
  if (!file) throw usageError('pumping-test: give a readings file: drydig pumping-test READINGS.csv --rate Q');
  if (extra.length > 0) throw usageError(`pumping-test: one readings file only (also got ${extra.join(' ')})`);
  const rate_m3_s = quantityFlag(values, 'rate', 'rate');
  if (rate_m3_s !== undefined && !(rate_m3_s > 0 && rate_m3_s <= 10)) throw usageError('pumping-test: --rate must be > 0 and at most 10 m³/s');
  const distance_m = quantityFlag(values, 'distance', 'length');
  if (distance_m !== undefined && !(distance_m > 0 && distance_m <= 1e5)) throw usageError('pumping-test: --distance must be > 0 and at most 100 km');
  const stop_s = quantityFlag(values, 'stop', 'time');
  if (stop_s !== undefined && !(stop_s > 0)) throw usageError('pumping-test: --stop must be > 0');
  const staticLevel_m = quantityFlag(values, 'static-level', 'length');
  const uMax = values['u-max'] !== undefined ? Number(values['u-max']) : undefined;
  if (uMax !== undefined && !(uMax > 0 && uMax <= 1)) throw usageError('pumping-test: --u-max must be a number > 0 and at most 1');
  let methods: TestMethod[] | undefined;
  if (values.method !== undefined) {
    methods = values.method.split(',').map((m) => m.trim()) as TestMethod[];
    const bad = methods.filter((m) => !ALL_TEST_METHODS.includes(m));
    if (bad.length > 0) throw usageError(`pumping-test: --method must be among ${ALL_TEST_METHODS.join(', ')} (got "${bad.join(', ')}")`);
  }
  const text = readTextFile(file, io.cwd, 'readings file', 32 * 1024 * 1024);
  const readings = parseReadingsCsv(text, {
    sourceName: file,
    ...(rate_m3_s !== undefined ? { rate_m3_s } : {}),
    ...(distance_m !== undefined ? { distance_m } : {}),
    ...(staticLevel_m !== undefined ? { staticLevel_m } : {}),
    ...(stop_s !== undefined ? { stop_s } : {}),
  });
  try {
    const result = analysePumpingTest({ readings, ...(methods ? { methods } : {}), stop_s: stop_s ?? null, perWell: values['per-well'] === 'true', ...(uMax !== undefined ? { uMax } : {}), path: file });
    io.stdout(`${JSON.stringify(result, null, values.pretty ? 2 : undefined)}\n`);
  } catch (error) {
    if (error instanceof DrydigError) throw error;
    throw new DrydigError('DRYDIG_ERR_INVALID_READINGS', `${file}: ${error instanceof Error ? error.message : String(error)}`);
  }
  return 0;
};
