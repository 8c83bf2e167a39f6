/**
 * A design run on the compute pool, with its Monte Carlo realisations (designOptions.monteCarlo)
 * split into chunks over the pool's threads: the ordinary design first (one job, which also hands
 * back the basis of re-solves), then the realisations, a few chunks in flight at once so the fair
 * queue keeps room for other clients. Progress reports the realisations done; the signal cancels
 * every chunk waiting or running. The service's design routes and the CLI both use it.
 */
import { planMonteCarlo, resolveDesignOptions, runMonteCarlo, summariseMonteCarlo, type DesignResult } from '../../shared/design';
import { parseScenario } from '../../shared/schema';
import type { ComputeRunner } from './compute-context';
import type { DesignTaskInput, ProgressReporter } from './compute-tasks';
import type { ComputeLane } from './fair-queue';

/** Share of the progress bar the ordinary design takes when realisations follow. */
const DESIGN_SHARE = 0.25;

export interface RunDesignOnPoolOptions {
  runner: ComputeRunner;
  input: DesignTaskInput;
  /** Lane of the ordinary design (a layout search: long). Realisation chunks run in the normal lane. */
  lane?: ComputeLane;
  /** Chunks of realisations in flight at once (the pool's threads). */
  concurrency: number;
  /** Worker threads behind the runner (reported in the result; 0 = in process). */
  workers: number;
  signal?: AbortSignal;
  onProgress?: ProgressReporter;
}

export async function runDesignOnPool({ runner, input, lane = 'normal', concurrency, workers, signal, onProgress }: RunDesignOnPoolOptions): Promise<DesignResult> {
  const common = { lane, ...(signal ? { signal } : {}) };
  const scenario = parseScenario(input.scenario, input.scenarioPath ?? '');
  const options = resolveDesignOptions({ scenario, overrides: input.options, overridesPath: input.optionsPath ?? '/options' });
  if (!options.monteCarlo) return runner.run('design', input, { ...common, ...(onProgress ? { onProgress } : {}) });

  const { result, basis } = await runner.run('designWithBasis', input, { ...common, onProgress: (stage, f) => onProgress?.(stage, DESIGN_SHARE * f) });
  if (!basis) return result;
  const plan = planMonteCarlo(scenario, options.monteCarlo);
  const started = Date.now();
  const outcomes = await runMonteCarlo({
    basis,
    plan,
    concurrency,
    ...(signal ? { signal } : {}),
    runChunk: (chunk) => runner.run('realisations', chunk, { lane: 'normal', ...(signal ? { signal } : {}) }),
    onProgress: (done, runs) => onProgress?.(`monte carlo ${done}/${runs}`, DESIGN_SHARE + ((1 - DESIGN_SHARE) * done) / runs),
  });
  return { ...result, uncertainty: summariseMonteCarlo({ plan, outcomes, elapsed_ms: Date.now() - started, workers, summary: result.summary }) };
}
