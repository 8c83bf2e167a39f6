/**
 * `drydig design SCENARIO.json [--mode uniform|optimal|layout] [options…] [--pretty | --csv]`:
 * design rates that bring every excavation to its target, printed as the JSON contract of
 * design.md section 4 (plus capacities, times, checks, the bid summary, cautions). Options
 * stored in the scenario's `designOptions` apply; flags override them field by field.
 */
import { designResultToCsv } from '../../shared/design';
import { createComputePool, defaultComputeThreads, runDesignOnPool, type DesignTaskInput } from '../compute';
import type { DesignMode, DesignOptions } from '../../shared/schema';
import { parseQuantity } from '../../shared/units';
import type { CliCommand } from './cli-io';
import { parseOptions, usageError } from './parse-options';
import { parseStrictNumber } from './points-argument';
import { parseJsonText, readScenarioFile, readTextFile } from './read-scenario-file';
import { parseTimeValue } from './time-argument';
import { writeWarnings } from './write-warnings';

export const DESIGN_HELP = `drydig design SCENARIO.json [--mode uniform|optimal|layout] [options] [--pretty | --csv]

  --mode M             uniform: one rate for every active well; optimal (default): least total
                       pumping per well (linear programming); layout: choose which wells
                       (active or not) to install and their rates at least cost (MIP)
  --options FILE.json  design options as JSON (same fields as the scenario's designOptions)
  --spacing M          control-point spacing, m (default: pit's shorter side / 8)
  --suction-lift M     well points: deepest pumping level below the header, m (default 5.5)
  --capacity-factor F  share of each well's Sichardt capacity the design may use (default 0.8, common practice)
  --header-level M     header elevation, m (default: ground level)
  --efficiency E       pump wire-to-water efficiency, 0–1 (default 0.6)
  --discharge-head M   discharge head, m (default 3)
  --friction M         friction allowance, m (default 2)
  --safety-factor F    factor on the flow for pumps and discharge (default 1.25)
  --pump-capacity Q    rated flow of one pump, with its unit: 20L/s, 72m3/h, 317gpm (a bare
                       number is m³/s; default 0.02 m³/s = 20 L/s)
  --minimum-rate Q     smallest practical rate per well, with its unit (e.g. 0.2L/s)
  --rate-step Q        round rates up to multiples of this, with its unit (e.g. 0.05L/s); the
                       design is re-checked with the rounded rates
  --currency CODE      currency label of the costs (default XXX: none set)
  --standby-ratio R    standby pumps per duty pump (default 0.5)
  --energy-price P     per kWh (default 0.2, a placeholder)
  --well-cost C        per well installed (default 5000, a placeholder)
  --volume-cost C      per m³ pumped besides energy (default 0.1, a placeholder)
  --duration T         pumping duration: seconds or 90d, 12h … (default 90d)
  --out-of-service ID  the well to take out in the standby check (default: the worst one)
  --sensitivity        add the sensitivity table: the design re-evaluated and re-solved with K
                       and S scaled (default factors 1/3, 1/2, 1, 2, 3)
  --sensitivity-factors LIST  factors for that table, comma-separated (e.g. 0.5,1,2)
  --monte-carlo N      add the Monte Carlo analysis: N realisations of lognormal K (median the
                       scenario's K): probability the rates meet every target, P50/P90 flow
  --seed S             seed of the random numbers (default 1; same seed, same answer)
  --k-spread F         geometric standard deviation of K (default: from the scenario's pumping
                       test K interval, else 2)
  --s-spread F         geometric standard deviation of S (default 1: S held)
  --price-at-p90       also price the bid at the P90 flow
  --workers W          worker threads for the realisations (default: the cores; 0 = in process)
  --one-well-out       add a robust design that meets every target with any one well out
  --k-factor F         add a robust design that meets every target for K ÷ F … K × F
  --pretty             indent the JSON
  --csv                write the summary, wells and excavations as CSV instead of JSON

Prints {"mode","feasible","totalRate_m3_s","wells":[{"id","rate_m3_s",…}],
"excavations":[{"id","targetLevel_m","met","worstShortfall_m","critical":{"x","y","level_m"}}],
"reasons":[…], …}. feasible:false comes with reasons and the best achievable levels.
Results are estimates from idealised models; confirm with site investigation, local codes and a
licensed engineer.
`;

const NUMBER_FLAGS: Record<string, keyof DesignOptions> = {
  spacing: 'controlSpacing_m',
  'suction-lift': 'suctionLiftLimit_m',
  'capacity-factor': 'capacityUtilisationFactor',
  'header-level': 'headerLevel_m',
  efficiency: 'pumpEfficiency',
  'discharge-head': 'dischargeHead_m',
  friction: 'frictionAllowance_m',
  'safety-factor': 'safetyFactor',
  'standby-ratio': 'standbyRatio',
  'energy-price': 'energyPrice_per_kWh',
  'well-cost': 'wellCost',
  'volume-cost': 'pumpedVolumeCost_per_m3',
};

/** Rates typed with their unit, as everywhere a user types a flow (`parseQuantity`: 20L/s, 72m3/h; bare = m³/s). */
const RATE_FLAGS: Record<string, keyof DesignOptions> = {
  'pump-capacity': 'pumpCapacity_m3_s',
  'minimum-rate': 'minimumRate_m3_s',
  'rate-step': 'rateStep_m3_s',
};

const MODES: readonly DesignMode[] = ['uniform', 'optimal', 'layout'];

export const runDesignCommand: CliCommand = async (args, io) => {
  const spec = {
    mode: 'value',
    options: 'value',
    duration: 'value',
    'out-of-service': 'value',
    currency: 'value',
    sensitivity: 'flag',
    'sensitivity-factors': 'value',
    'monte-carlo': 'value',
    seed: 'value',
    'k-spread': 'value',
    's-spread': 'value',
    'price-at-p90': 'flag',
    workers: 'value',
    'one-well-out': 'flag',
    'k-factor': 'value',
    ...Object.fromEntries(Object.keys(RATE_FLAGS).map((k) => [k, 'value'])),
    pretty: 'flag',
    csv: 'flag',
    help: 'flag',
    ...Object.fromEntries(Object.keys(NUMBER_FLAGS).map((k) => [k, 'value'])),
  } as const;
  const { positionals, values } = parseOptions(args, spec, 'design');
  if (values.help) {
    io.stdout(DESIGN_HELP);
    return 0;
  }
  const [file, ...extra] = positionals;
  if (!file) throw usageError('design: give a scenario file: drydig design SCENARIO.json [--mode uniform|optimal|layout]');
  if (extra.length > 0) throw usageError(`design: one scenario file only (also got ${extra.join(' ')})`);
  if (values.csv && values.pretty) throw usageError('design: --pretty is for JSON; leave it out with --csv');
  let mode: DesignMode | undefined;
  if (values.mode !== undefined) {
    if (!MODES.includes(values.mode as DesignMode)) throw usageError(`design: --mode must be one of ${MODES.join(', ')} (got "${values.mode}")`);
    mode = values.mode as DesignMode;
  }

  // Flags first, then files, so a typo is reported before any reading.
  const overrides: Record<string, unknown> = {};
  for (const [flag, key] of Object.entries(NUMBER_FLAGS)) {
    const text = values[flag];
    if (text === undefined) continue;
    const n = parseStrictNumber(text);
    if (n === undefined) throw usageError(`design: --${flag} must be a number (got "${text}")`);
    overrides[key] = n;
  }
  if (values.duration !== undefined) {
    const t = parseTimeValue(values.duration);
    if (t === null) throw usageError('design: --duration must be a time (e.g. 7776000 or 90d), not "steady"');
    overrides.duration_s = t;
  }
  if (values['out-of-service'] !== undefined) overrides.outOfServiceWell = values['out-of-service'];
  for (const [flag, key] of Object.entries(RATE_FLAGS)) {
    const text = values[flag];
    if (text === undefined) continue;
    const q = parseQuantity(text, 'rate');
    if (!q.ok) throw usageError(`design: --${flag}: ${q.message}`);
    overrides[key] = q.value_si;
  }
  if (values.currency !== undefined) overrides.currency = values.currency;
  let fileOptions: Record<string, unknown> = {};
  if (values.options !== undefined) {
    const parsed = parseJsonText(readTextFile(values.options, io.cwd, 'design options file'), values.options);
    if (typeof parsed !== 'object' || parsed === null || Array.isArray(parsed)) throw usageError(`design: ${values.options} must hold a JSON object of design options`);
    fileOptions = parsed as Record<string, unknown>;
  }
  const unknowns = parseUncertaintyFlags(values);
  const scenario = readScenarioFile(file, io.cwd);
  const options = { ...fileOptions, ...overrides, ...mergeUncertaintyOptions(unknowns, scenario, fileOptions) };

  const input = { scenario, ...(mode ? { mode } : {}), ...(Object.keys(options).length > 0 ? { options } : {}), optionsPath: '/options' };
  const result = await runDesignWithWorkers(input, unknowns.workers);
  io.stdout(values.csv ? designResultToCsv(result) : `${JSON.stringify(result, jsonNumbers, values.pretty ? 2 : undefined)}\n`);
  if (values.csv) writeWarnings(result.warnings, io);
  return 0;
};

/** JSON cannot carry Infinity or NaN; write null (fields that can be unbounded say so in their docs). */
function jsonNumbers(_key: string, value: unknown): unknown {
  return typeof value === 'number' && !Number.isFinite(value) ? null : value;
}

/** The uncertainty flags, checked (a bad number is a usage error naming the flag). */
interface UncertaintyFlags {
  sensitivity?: { factors?: number[] };
  monteCarlo: Record<string, unknown>;
  robust?: { oneWellOut?: boolean; conductivityFactor?: number };
  workers: number | null;
}

function positiveNumber(values: Record<string, string>, flag: string): number | undefined {
  const text = values[flag];
  if (text === undefined) return undefined;
  const n = parseStrictNumber(text);
  if (n === undefined || !(n > 0)) throw usageError(`design: --${flag} must be a positive number (got "${text}")`);
  return n;
}

function wholeNumber(values: Record<string, string>, flag: string): number | undefined {
  const text = values[flag];
  if (text === undefined) return undefined;
  if (!/^\d+$/.test(text)) throw usageError(`design: --${flag} must be a whole number (got "${text}")`);
  return Number(text);
}

function parseUncertaintyFlags(values: Record<string, string>): UncertaintyFlags {
  const out: UncertaintyFlags = { monteCarlo: {}, workers: wholeNumber(values, 'workers') ?? null };
  const factorsText = values['sensitivity-factors'];
  if (values.sensitivity || factorsText !== undefined) {
    out.sensitivity = {};
    if (factorsText !== undefined) {
      const factors = factorsText.split(',').map((t) => parseStrictNumber(t.trim()));
      if (factors.some((f) => f === undefined || !(f > 0))) throw usageError(`design: --sensitivity-factors must be positive numbers separated by commas (got "${factorsText}")`);
      out.sensitivity.factors = factors as number[];
    }
  }
  const runs = wholeNumber(values, 'monte-carlo');
  const seed = wholeNumber(values, 'seed');
  const kSpread = positiveNumber(values, 'k-spread');
  const sSpread = positiveNumber(values, 's-spread');
  if (runs !== undefined) out.monteCarlo.runs = runs;
  if (seed !== undefined) out.monteCarlo.seed = seed;
  if (kSpread !== undefined) out.monteCarlo.kSpread = kSpread;
  if (sSpread !== undefined) out.monteCarlo.sSpread = sSpread;
  if (values['price-at-p90']) out.monteCarlo.priceAtP90 = true;
  const kFactor = positiveNumber(values, 'k-factor');
  if (values['one-well-out'] || kFactor !== undefined) out.robust = { ...(values['one-well-out'] ? { oneWellOut: true } : {}), ...(kFactor !== undefined ? { conductivityFactor: kFactor } : {}) };
  return out;
}

/** Flags over the options file over the scenario's stored options, per block (the Monte Carlo block field by field). */
function mergeUncertaintyOptions(flags: UncertaintyFlags, scenario: unknown, fileOptions: Record<string, unknown>): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  const stored = ((scenario as { designOptions?: Record<string, unknown> }).designOptions ?? {}) as Record<string, unknown>;
  const block = (key: string): Record<string, unknown> => ({ ...((stored[key] as object | undefined) ?? {}), ...((fileOptions[key] as object | undefined) ?? {}) });
  if (flags.sensitivity) out.sensitivity = { ...block('sensitivity'), ...flags.sensitivity };
  if (flags.robust) out.robust = { ...block('robust'), ...flags.robust };
  if (Object.keys(flags.monteCarlo).length > 0) {
    const mc = { ...block('monteCarlo'), ...flags.monteCarlo };
    if (mc.runs === undefined) throw usageError('design: --seed, --k-spread, --s-spread and --price-at-p90 need --monte-carlo N (or designOptions.monteCarlo.runs)');
    out.monteCarlo = mc;
  }
  return out;
}

/** Runs the design; Monte Carlo realisations go over worker threads (the compute pool, all its threads for this one client). */
async function runDesignWithWorkers(input: DesignTaskInput, workers: number | null) {
  const wantsRealisations = (input.options as { monteCarlo?: unknown } | undefined)?.monteCarlo !== undefined
    || (input.scenario as { designOptions?: { monteCarlo?: unknown } }).designOptions?.monteCarlo !== undefined;
  const threads = wantsRealisations ? (workers ?? defaultComputeThreads()) : 0;
  // The ordinary design and the realisations may each take a while on a busy machine: a generous budget.
  const pool = createComputePool({ threads, perClientSlots: Math.max(1, threads), timeout_ms: 600_000, longTimeout_ms: 600_000 });
  try {
    return await runDesignOnPool({ runner: pool, input, concurrency: Math.max(1, threads), workers: threads });
  } finally {
    await pool.close();
  }
}
