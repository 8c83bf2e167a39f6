/**
 * The Web Worker that runs the shared engine off the main thread. Jobs run one at a time in
 * arrival order; a `cancel` message stops a queued job at once and a running field job at its
 * next strip boundary, so a drag never waits behind a stale fine grid. Full grids (the fine map)
 * are split by rows over strip workers, one per core (navigator.hardwareConcurrency, at most
 * MAX_STRIP_WORKERS), started on the first full grid; drag frames stay here (kept grids).
 */
import { DrydigError } from '../../shared/schema';
import type { EngineRequest, EngineResponse } from './engine-protocol';
import { JobCancelled, runFieldJob, runInspectJob, runSectionJob } from './field-job';
import { runMonitoringJob } from './monitoring-job';
import { runSeepageJob } from './seepage-job';
import { StripPool, stripWorkerCount } from './strip-pool';

const scope = self as unknown as DedicatedWorkerGlobalScope;
const queue: EngineRequest[] = [];
const cancelled = new Set<number>();
let running = false;

const post = (message: EngineResponse) => scope.postMessage(message);
// A macrotask turn lets queued `cancel` messages reach onmessage between strips.
const pause = () => new Promise<void>((resolve) => setTimeout(resolve, 0));

scope.onmessage = (event: MessageEvent<EngineRequest>) => {
  const req = event.data;
  if (req.kind === 'cancel') {
    cancelled.add(req.id);
    return;
  }
  queue.push(req);
  if (!running) void drain();
};

let pool: StripPool | null | undefined;

/** The strip workers (null where this browser cannot start a worker from a worker, or has one core). */
function stripPool(): StripPool | null {
  if (pool !== undefined) return pool;
  const count = stripWorkerCount(scope.navigator?.hardwareConcurrency);
  try {
    pool = count > 1 && typeof Worker === 'function'
      ? new StripPool(Array.from({ length: count }, (_, k) => new Worker(new URL('./grid-strip-worker.ts', import.meta.url), { type: 'module', name: `drydig-strip-${k + 1}` })))
      : null;
  } catch {
    pool = null;
  }
  return pool;
}

async function drain(): Promise<void> {
  running = true;
  while (queue.length > 0) {
    const req = queue.shift()!;
    if (req.kind === 'cancel') continue;
    if (cancelled.delete(req.id)) {
      post({ kind: 'cancelled', id: req.id });
      continue;
    }
    try {
      if (req.kind === 'field') {
        const strips = !req.incremental && req.stripWorkers !== false && (req.strips ?? 1) > 1 ? stripPool() : null;
        const result = await runFieldJob(req, {
          ...(strips ? { parallel: { evaluate: strips.evaluate, strips: 2 * strips.size } } : {}),
          progress: (fraction) => post({ kind: 'progress', id: req.id, fraction }),
          isCancelled: () => cancelled.has(req.id),
          pause,
        });
        post(strips ? { ...result, stripWorkers: strips.size } : result);
      } else if (req.kind === 'inspect') {
        post(runInspectJob(req));
      } else if (req.kind === 'monitoring') {
        post(runMonitoringJob(req));
      } else if (req.kind === 'seepage') {
        post(runSeepageJob(req));
      } else {
        post(runSectionJob(req));
      }
    } catch (error) {
      if (error instanceof JobCancelled) post({ kind: 'cancelled', id: req.id });
      else if (error instanceof DrydigError) post({ kind: 'error', id: req.id, message: error.message, issues: error.issues });
      else post({ kind: 'error', id: req.id, message: `The engine could not compute this: ${(error as Error)?.message ?? String(error)}` });
    }
    cancelled.delete(req.id);
  }
  running = false;
}
