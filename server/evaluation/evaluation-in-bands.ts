/**
 * A grid evaluation split into bands of rows, each run where the caller says (a pool thread on
 * the server, a worker thread in the CLI), then put back together. The answer is the same as
 * `runEvaluation`'s byte for byte: bands keep the whole grid's node coordinates and kernel chunks
 * (`evaluateGridBand`), so every value is bit-identical (test: tests/server/evaluation/evaluation-in-bands.test.ts).
 */
import type { GridBand, GridSpec } from '../../shared/field';
import type { EvaluateResponse } from '../request-schemas';
import { gridAnswer, type GridBandRequest, type RunEvaluationOptions } from './run-evaluation';

/** Wells × nodes × times below which a grid is not worth splitting (a thread's start-up costs more). */
export const MIN_SPLIT_WORK = 4_000_000;

/** Wells × nodes × times of a request's grid (0 without a grid). */
export function gridSplitWork(options: Pick<RunEvaluationOptions, 'scenario' | 'grid' | 'times_s'>): number {
  const g = options.grid;
  return g ? options.scenario.wells.length * g.counts[0] * g.counts[1] * Math.max(1, options.times_s?.length ?? 1) : 0;
}

/** Rows 0 … ny−1 in `parts` nearly equal bands [j0, j1). */
export function splitRows(ny: number, parts: number): Array<readonly [number, number]> {
  const n = Math.max(1, Math.min(Math.floor(parts), ny));
  const bands: Array<readonly [number, number]> = [];
  for (let b = 0; b < n; b++) bands.push([Math.floor((b * ny) / n), Math.floor(((b + 1) * ny) / n)] as const);
  return bands;
}

/** The bands put back into one grid's arrays and flag counts. */
export function joinGridBands(grid: GridSpec, bands: readonly GridBand[]): Pick<GridBand, 'drawdown_m' | 'level_m' | 'flags' | 'flagCounts' | 'time_s' | 'model'> {
  const [nx, ny] = grid.counts;
  const drawdown_m = new Float64Array(nx * ny);
  const level_m = new Float64Array(nx * ny);
  const flags = new Uint8Array(nx * ny);
  const first = bands[0];
  if (!first) throw new RangeError('joinGridBands: no bands');
  const flagCounts = { ...first.flagCounts };
  for (const key of Object.keys(flagCounts) as Array<keyof typeof flagCounts>) flagCounts[key] = 0;
  for (const band of bands) {
    const at = band.rows[0] * nx;
    drawdown_m.set(band.drawdown_m, at);
    level_m.set(band.level_m, at);
    flags.set(band.flags, at);
    for (const key of Object.keys(flagCounts) as Array<keyof typeof flagCounts>) flagCounts[key] += band.flagCounts[key] ?? 0;
  }
  return { drawdown_m, level_m, flags, flagCounts, time_s: first.time_s, model: first.model };
}

export interface BandRunners {
  /** Runs the points part (the request without its grid). */
  runPoints(options: RunEvaluationOptions): Promise<EvaluateResponse>;
  /** Runs one band of rows. */
  runBand(request: GridBandRequest): Promise<GridBand>;
  /** How many bands to split each grid into. */
  bands: number;
}

/** `runEvaluation` with each grid split into bands run by `runners` (in parallel). */
export async function runEvaluationInBands(options: RunEvaluationOptions, runners: BandRunners): Promise<EvaluateResponse> {
  const { scenario, grid } = options;
  if (!grid || runners.bands <= 1) return runners.runPoints(options);
  const times = options.times_s ?? [scenario.design.time_s];
  const pointsPart = runners.runPoints({ ...options, grid: undefined });
  const gridParts = times.map(async (time_s) => {
    const bands = await Promise.all(splitRows(grid.counts[1], runners.bands).map((rows) =>
      runners.runBand({ scenario, grid, time_s, rows, scenarioPath: options.scenarioPath ?? '' })));
    return gridAnswer(scenario, grid, time_s, joinGridBands(grid, bands));
  });
  const [base, grids] = await Promise.all([pointsPart, Promise.all(gridParts)]);
  // The same keys in the same order as runEvaluation: results first, then the notes.
  const { points, model, models, cautions, warnings } = base;
  return { ...(options.points ? { points: points ?? [] } : {}), grids, model, models, cautions, warnings };
}
