/**
 * The one evaluation path the HTTP route and the CLI share: expand the requested times, call the
 * field engine, check its numbers and shape the answer. No hydraulics here — the engine in
 * `shared/field` computes every value; this only arranges them.
 */
import { evaluateGrid, evaluateGridBand, evaluatePoints } from '../../shared/field';
import type { GridBand, GridResult, GridSpec, ModelInfo, PointResult } from '../../shared/field';
import { DrydigError, findScenarioWarnings, summariseIssues, type Scenario } from '../../shared/schema';
import type { EvaluateResponse } from '../request-schemas';
import { encodeFlagRuns } from './flag-runs';
import { RESULT_CAUTIONS } from './result-cautions';

export interface RunEvaluationOptions {
  /** A scenario already checked by `parseScenario`. */
  scenario: Scenario;
  /** Plan positions [x, y], m. Default: none. */
  points?: ReadonlyArray<readonly [number, number]>;
  /** A regular grid to evaluate. Default: none. */
  grid?: GridSpec;
  /** Times since pumping started, s; null = steady. Default: the scenario's design time only. */
  times_s?: ReadonlyArray<number | null>;
  /**
   * JSON pointer the scenario sits at in the caller's document, put in front of engine issue
   * paths: '/scenario' for the HTTP body, '' for a scenario file. Default ''.
   */
  scenarioPath?: string;
}

/** Grid drawdowns are rounded to 1 / this many metres (0.1 mm): finer than any contour interval or level survey. */
export const GRID_DRAWDOWN_STEPS_PER_M = 10_000;

/**
 * Rounds to 0.1 mm. Dividing by the integer step count (rather than multiplying by 1e-4) gives the
 * double nearest the 4-decimal value, so the JSON reads 0.4426, not 0.44260000000000005; −0 becomes 0.
 */
export function roundGridDrawdown(value_m: number): number {
  return Math.round(value_m * GRID_DRAWDOWN_STEPS_PER_M) / GRID_DRAWDOWN_STEPS_PER_M + 0;
}

function describeTime(time_s: number | null): string {
  return time_s === null ? 'steady state' : `t = ${time_s} s`;
}

/** The engine must never hand out NaN or Infinity (design rule); if it does, fail loudly. */
function assertFinitePoint(p: PointResult): void {
  if (!Number.isFinite(p.level_m) || !Number.isFinite(p.drawdown_m)) {
    throw new DrydigError(
      'DRYDIG_ERR_INTERNAL',
      `the engine returned a non-finite level or drawdown at (${p.x}, ${p.y}), ${describeTime(p.time_s)}`,
    );
  }
}

/** Engine errors about the scenario itself; others (points, grid, times) already name request fields. */
const SCENARIO_ERROR_CODES = new Set(['DRYDIG_ERR_INVALID_SCENARIO', 'DRYDIG_ERR_UNSUPPORTED_BOUNDARIES']);

/** Re-throws an engine DrydigError about the scenario with its field paths placed inside the caller's document. */
export function relocateEngineError(error: unknown, scenarioPath: string): never {
  if (error instanceof DrydigError && scenarioPath !== '' && SCENARIO_ERROR_CODES.has(error.code) && error.issues.length > 0) {
    const issues = error.issues.map((i) => ({ path: `${scenarioPath}${i.path}`, message: i.message }));
    throw new DrydigError(error.code, summariseIssues(issues), issues);
  }
  throw error;
}

type GridAnswer = NonNullable<EvaluateResponse['grids']>[number];

/** One grid of the answer: drawdowns rounded to 0.1 mm, flags as runs; fails loudly on a non-finite value. */
export function gridAnswer(scenario: Scenario, grid: GridSpec, time_s: number | null, result: Pick<GridResult, 'drawdown_m' | 'flags' | 'flagCounts' | 'time_s'>): GridAnswer {
  const drawdown_m = new Array<number>(result.drawdown_m.length);
  for (let k = 0; k < result.drawdown_m.length; k++) {
    const value = result.drawdown_m[k] ?? Number.NaN;
    if (!Number.isFinite(value)) {
      const nx = grid.counts[0];
      throw new DrydigError('DRYDIG_ERR_INTERNAL', `the engine returned a non-finite drawdown at grid node (${k % nx}, ${Math.floor(k / nx)}), ${describeTime(time_s)}`);
    }
    drawdown_m[k] = roundGridDrawdown(value);
  }
  return {
    grid: {
      origin: [grid.origin[0], grid.origin[1]],
      spacing_m: [grid.spacing_m[0], grid.spacing_m[1]],
      counts: [grid.counts[0], grid.counts[1]],
    },
    time_s: result.time_s,
    staticLevel_m: scenario.aquifer.staticLevel_m,
    drawdown_m,
    flags: { ...result.flagCounts },
    flagMask: { encoding: 'runs', runs: encodeFlagRuns(result.flags) },
  };
}

/** What one band of a split grid evaluation takes (plain data, for a worker thread). */
export interface GridBandRequest {
  scenario: Scenario;
  grid: GridSpec;
  time_s: number | null;
  rows: readonly [number, number];
  scenarioPath?: string;
}

/** One band of rows, with scenario errors placed in the caller's document as `runEvaluation` does. */
export function evaluateGridBandForRequest(request: GridBandRequest): GridBand {
  try {
    return evaluateGridBand({ scenario: request.scenario, grid: request.grid, time_s: request.time_s }, request.rows);
  } catch (error) {
    relocateEngineError(error, request.scenarioPath ?? '');
  }
}

/**
 * Evaluates points and/or a grid of a scenario at each requested time.
 * Points come back time by time (all points at the first time, then the next …).
 */
export function runEvaluation(options: RunEvaluationOptions): EvaluateResponse {
  const { scenario, points, grid } = options;
  const scenarioPath = options.scenarioPath ?? '';
  const times = options.times_s ?? [scenario.design.time_s];
  const models: Array<{ time_s: number | null; model: ModelInfo }> = [];
  const pointResults: PointResult[] = [];
  const grids: NonNullable<EvaluateResponse['grids']> = [];

  try {
    for (const time_s of times) {
      let model: ModelInfo | undefined;
      if (points && points.length > 0) {
        const result = evaluatePoints({ scenario, points, time_s });
        for (const p of result.points) {
          assertFinitePoint(p);
          pointResults.push(p);
        }
        model = result.model;
      }
      if (grid) {
        const result = evaluateGrid({ scenario, grid, time_s });
        grids.push(gridAnswer(scenario, grid, time_s, result));
        model ??= result.model;
      }
      if (!model) {
        // Neither points nor grid: still report the model so a caller can inspect assumptions.
        model = evaluatePoints({ scenario, points: [], time_s }).model;
      }
      models.push({ time_s, model });
    }
  } catch (error) {
    relocateEngineError(error, scenarioPath);
  }

  const first = models[0];
  if (!first) throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', '/times_s: give at least one time', [{ path: '/times_s', message: 'must have at least 1 entry' }]);
  // Results first, so a person reading the CLI output sees the numbers before the notes.
  return {
    ...(points ? { points: pointResults } : {}),
    ...(grid ? { grids } : {}),
    model: first.model,
    models,
    cautions: [...RESULT_CAUTIONS],
    warnings: findScenarioWarnings(scenario, scenarioPath),
  };
}
