/**
 * The seepage job of the engine worker: the same `runSectionJob` the CLI and the service run,
 * so the panel shows exactly the numbers `drydig section` prints.
 */
import { runSectionJob } from '../../shared/section';
import type { SeepageRequest, SeepageResult } from './engine-protocol';

export function runSeepageJob(req: SeepageRequest): SeepageResult {
  const t0 = performance.now();
  const answer = runSectionJob(req.job);
  return { kind: 'seepage', id: req.id, answer, compute_ms: performance.now() - t0 };
}
