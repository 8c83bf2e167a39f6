/**
 * `drydig evaluate SCENARIO.json --points "x,y;x,y"|FILE.csv [--time T] [--grid … [--threads N]] [--pretty | --csv]`:
 * levels and drawdowns on stdout as JSON (design.md section 4), the same answer the HTTP API
 * gives. Without --time: the scenario's design time (steady state when that is null).
 */
import { availableParallelism } from 'node:os';
import { gridSplitWork, MIN_SPLIT_WORK, runEvaluation, runEvaluationInBands, type RunEvaluationOptions } from '../evaluation';
import type { EvaluateResponse } from '../request-schemas';
import type { GridSpec } from '../../shared/field';
import type { CliCommand } from './cli-io';
import { parseOptions, usageError } from './parse-options';
import { looksLikeInlinePoints, parseInlinePoints, parsePointsCsv, parseStrictNumber, type PlanPoint } from './points-argument';
import { readScenarioFile, readTextFile } from './read-scenario-file';
import { parseTimeArgument } from './time-argument';
import { formatPointsCsv } from './points-csv-output';
import { EVALUATE_HELP } from './usage-text';
import { writeWarnings } from './write-warnings';

/** Largest points CSV read, bytes. */
const MAX_POINTS_FILE_BYTES = 256 * 1024 * 1024;

/** `x0,y0,dx,dy,nx,ny` → a grid spec. */
export function parseGridArgument(text: string): GridSpec {
  const parts = text.split(',').map((p) => p.trim());
  const numbers = parts.map((p) => parseStrictNumber(p));
  if (parts.length !== 6 || numbers.some((n) => n === undefined)) {
    throw usageError('--grid must be six numbers "x0,y0,dx,dy,nx,ny" (origin, spacing in m, node counts)');
  }
  const [x0, y0, dx, dy, nx, ny] = numbers as number[] as [number, number, number, number, number, number];
  if (!(dx > 0) || !(dy > 0)) throw usageError('--grid: spacings dx and dy must be greater than 0 m');
  if (!Number.isInteger(nx) || !Number.isInteger(ny) || nx < 1 || ny < 1) throw usageError('--grid: node counts nx and ny must be whole numbers ≥ 1');
  return { origin: [x0, y0], spacing_m: [dx, dy], counts: [nx, ny] };
}

/** `--threads N`: a whole number from 1 to 256. */
function parseThreadsArgument(value: string): number {
  const n = Number(value);
  if (!Number.isInteger(n) || n < 1 || n > 256) throw usageError(`--threads must be a whole number from 1 to 256 (got "${value}")`);
  return n;
}

/** The evaluation, its grid split by rows over `threads` worker threads when it is large enough to gain. */
async function evaluateOnThreads(options: RunEvaluationOptions, threads: number): Promise<EvaluateResponse> {
  if (threads <= 1 || gridSplitWork(options) < MIN_SPLIT_WORK) return runEvaluation(options);
  const { startBandThreads } = await import('./band-threads');
  const pool = startBandThreads(threads);
  try {
    return await runEvaluationInBands(options, pool);
  } finally {
    await pool.close();
  }
}

function readPoints(value: string, cwd: string): PlanPoint[] {
  if (looksLikeInlinePoints(value) && !/\.(csv|txt|tsv)$/i.test(value)) return parseInlinePoints(value);
  const text = readTextFile(value, cwd, 'points file', MAX_POINTS_FILE_BYTES);
  return parsePointsCsv(text, value);
}

export const runEvaluateCommand: CliCommand = async (args, io) => {
  const { positionals, values } = parseOptions(args, { points: 'value', time: 'value', grid: 'value', threads: 'value', pretty: 'flag', csv: 'flag', help: 'flag' }, 'evaluate');
  if (values.help) {
    io.stdout(EVALUATE_HELP);
    return 0;
  }
  const [file, ...extra] = positionals;
  if (!file) throw usageError('evaluate: give a scenario file: drydig evaluate SCENARIO.json --points "x,y;x,y"');
  if (extra.length > 0) throw usageError(`evaluate: one scenario file only (also got ${extra.join(' ')})`);
  if (values.points === undefined && values.grid === undefined) throw usageError('evaluate: --points is required (inline "x,y;x,y" or a CSV file), or give --grid');
  if (values.csv && (values.grid !== undefined || values.points === undefined)) throw usageError('evaluate: --csv writes points only; give --points and leave out --grid');
  if (values.csv && values.pretty) throw usageError('evaluate: --pretty is for JSON; leave it out with --csv');

  // Arguments first, then the (possibly large) scenario, so a typo is reported before any reading.
  const times_s = values.time !== undefined ? parseTimeArgument(values.time) : undefined;
  const grid = values.grid !== undefined ? parseGridArgument(values.grid) : undefined;
  const threads = values.threads !== undefined ? parseThreadsArgument(values.threads) : availableParallelism();
  const points = values.points !== undefined ? readPoints(values.points, io.cwd) : undefined;
  const scenario = readScenarioFile(file, io.cwd);

  const answer = await evaluateOnThreads({ scenario, points, grid, times_s }, threads);
  io.stdout(values.csv ? formatPointsCsv(answer) : `${JSON.stringify(answer, null, values.pretty ? 2 : undefined)}\n`);
  if (values.csv) writeWarnings(answer.warnings, io);
  return 0;
};
