/**
 * The engine work a request may ask for, by name. The pool's worker threads run these (see
 * `compute-worker.mjs`); the same table runs in process when the pool is off (`threads: 0`, the
 * bench's "before"). Every task takes and returns plain structured-clone data. A new kind of work
 * (Monte Carlo realisations, …) is one more entry here, and `ComputePool.run` can run it at once.
 */
import { DrydigError, type Scenario } from '../../shared/schema';
import { runDesign, runRealisationChunk, type DesignBasis, type DesignResult, type RealisationChunk, type RealisationOutcome, type RunDesignOptions } from '../../shared/design';
import { runSectionJob, type SectionJob, type SectionJobAnswer } from '../../shared/section';
import { analysePumpingTest, type AnalysePumpingTestOptions, type PumpingTestResult } from '../../shared/testing';
import { evaluateGridBandForRequest, runEvaluation, type GridBandRequest, type RunEvaluationOptions } from '../evaluation';
import type { GridBand } from '../../shared/field';
import type { EvaluateResponse } from '../request-schemas';
import { computePlanOutcome, computeMonitoringPlan, type PlanOutcome } from '../exports/plan-compute';
import { renderExportBody, type ExportBodyInput } from '../exports/render-export-body';
import type { MonitoringPlan, PlanReading } from '../../shared/exports';

/** Reports progress of a long task: a stage name and the fraction done (0…1). */
export type ProgressReporter = (stage: string, fraction: number) => void;

export interface ComputeTaskTable {
  evaluate: (input: RunEvaluationOptions) => EvaluateResponse;
  /** One band of rows of a grid split across threads (evaluation-in-bands.ts). */
  gridBand: (input: GridBandRequest) => GridBand;
  design: (input: DesignTaskInput, progress: ProgressReporter) => Promise<DesignResult>;
  /** The design without its Monte Carlo realisations, and the basis they are re-solved from (the caller runs them as `realisations` chunks). */
  designWithBasis: (input: DesignTaskInput, progress: ProgressReporter) => Promise<{ result: DesignResult; basis: DesignBasis | null }>;
  /** A chunk of Monte Carlo realisations. */
  realisations: (input: RealisationChunk) => Promise<RealisationOutcome[]>;
  planResults: (input: { scenario: Scenario }) => PlanOutcome;
  monitoringPlan: (input: { scenario: Scenario; readings: readonly PlanReading[] }) => MonitoringPlan & { error?: string };
  section: (input: SectionJob) => SectionJobAnswer;
  pumpingTest: (input: AnalysePumpingTestOptions) => PumpingTestResult;
  exportBody: (input: ExportBodyInput) => string;
  /** Test and bench aid: holds its thread for `ms` (a stand-in for a long solve). */
  sleep: (input: { ms: number }) => { slept_ms: number };
}

export type ComputeTaskName = keyof ComputeTaskTable;
/** What a design task takes (plain data). */
export type DesignTaskInput = Pick<RunDesignOptions, 'scenario' | 'mode' | 'options' | 'scenarioPath' | 'optionsPath' | 'rates'>;
export type ComputeInput<N extends ComputeTaskName> = Parameters<ComputeTaskTable[N]>[0];
export type ComputeOutput<N extends ComputeTaskName> = Awaited<ReturnType<ComputeTaskTable[N]>>;

export const COMPUTE_TASKS: ComputeTaskTable = {
  evaluate: (input) => runEvaluation(input),
  gridBand: (input) => evaluateGridBandForRequest(input),
  design: (input, progress) => runDesign({ ...input, onProgress: progress }),
  designWithBasis: async (input, progress) => {
    let basis: DesignBasis | null = null;
    const result = await runDesign({ ...input, onProgress: progress, monteCarlo: { defer: true }, onBasis: (b) => (basis = b) });
    return { result, basis };
  },
  realisations: (chunk) => runRealisationChunk(chunk),
  planResults: ({ scenario }) => computePlanOutcome(scenario),
  monitoringPlan: ({ scenario, readings }) => computeMonitoringPlan(scenario, readings),
  section: (job) => runSectionJob(job),
  pumpingTest: (input) => analysePumpingTest(input),
  exportBody: (input) => renderExportBody(input),
  sleep: ({ ms }) => {
    const until = Date.now() + ms;
    while (Date.now() < until) {
      // Busy on purpose: it stands for engine work that holds the thread.
    }
    return { slept_ms: ms };
  },
};

/**
 * An engine argument guard (a RangeError such as "theisWellFunction: argument u must be a number
 * > 0") reached from a request means the request lies outside what the method can compute — a
 * 400 with the engine's words, never a 500. Anything else passes unchanged.
 */
export function asRequestError(error: unknown): unknown {
  if (error instanceof RangeError && / argument \w+ must be /.test(error.message)) {
    return new DrydigError('DRYDIG_ERR_INVALID_REQUEST', `the request lies outside the range the methods can compute (${error.message}); check times, levels and aquifer parameters`);
  }
  return error;
}
