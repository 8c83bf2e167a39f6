/**
 * The one pool of worker threads that runs every request's engine work (piscina), sized to the
 * cores. In front of it a fair queue (`fair-queue.ts`) decides who runs next; each job has a time
 * budget from when it starts (past it the thread is stopped — piscina replaces it — and the job
 * fails with DRYDIG_ERR_COMPUTE_TIMEOUT); a full queue is refused at once with DRYDIG_ERR_BUSY
 * (503, Retry-After). `threads: 0` runs the same tasks in process, on the caller's event loop —
 * how the service worked before the pool, kept for the CLI and the bench's comparison.
 *
 * `run(task, input, { client, lane, timeout_ms, signal, onProgress })` is generic: any entry of
 * the task table, with progress messages and cancellation, so other work (Monte Carlo
 * realisations, …) can use the same threads and the same fairness.
 */
import { availableParallelism } from 'node:os';
import { MessageChannel } from 'node:worker_threads';
import { Piscina } from 'piscina';
import { DrydigError, type ErrorCode, type FieldIssue } from '../../shared/schema';
import { asRequestError, COMPUTE_TASKS, type ComputeInput, type ComputeOutput, type ComputeTaskName, type ProgressReporter } from './compute-tasks';
import { FairQueue, type ComputeLane } from './fair-queue';

export interface ComputePoolOptions {
  /** Worker threads. Default the cores (at least 2, so a long job always leaves one free); 0 = in process. */
  threads?: number;
  /** Time budget of a job from when it starts running, ms. Default 30 000. */
  timeout_ms?: number;
  /** Time budget of a long-lane job (a layout search), ms. Default 75 000 (the 60 s layout cap and a margin). */
  longTimeout_ms?: number;
  /** Jobs that may wait in all. Default 32. */
  maxQueued?: number;
  /** Jobs one client may have waiting. Default 4. */
  maxQueuedPerClient?: number;
  /** Seconds a refused client is told to wait (Retry-After). Default 5. */
  retryAfter_s?: number;
  /** Threads kept for the quick lane (small requests) beyond `threads`. Default 1; 0 = none. */
  quickThreads?: number;
  /** Threads one client may hold at once. Default threads − 1 (at least 1); the CLI, the only client, takes all. */
  perClientSlots?: number;
}

export interface ComputeRunOptions {
  /** Who asked (a client address or account); jobs are shared fairly between clients. Default 'local'. */
  client?: string;
  /** Queue lane. Default 'normal'. */
  lane?: ComputeLane;
  /** Overrides the pool's time budget for this job, ms. */
  timeout_ms?: number;
  /** Cancels the job (waiting: withdrawn; running: its thread is stopped). */
  signal?: AbortSignal;
  /** Progress of the task, where it reports any. */
  onProgress?: ProgressReporter;
}

export interface ComputePool {
  readonly threads: number;
  /** Threads one client may hold at once (0 in process): how many bands a split grid gets. */
  readonly threadsPerClient: number;
  run<N extends ComputeTaskName>(task: N, input: ComputeInput<N>, options?: ComputeRunOptions): Promise<ComputeOutput<N>>;
  /** What is running and waiting now (health, tests). */
  stats(): { threads: number; running: number; queued: number };
  close(): Promise<void>;
}

export const DEFAULT_COMPUTE_TIMEOUT_MS = 30_000;
export const DEFAULT_LONG_COMPUTE_TIMEOUT_MS = 75_000;

type WorkerAnswer = { ok: true; value: unknown } | { ok: false; error: { code: ErrorCode; message: string; issues: FieldIssue[] } };

/** A refusal for load: 503 with the Retry-After the error handler sends. */
export function busyError(message: string, retryAfter_s: number): DrydigError {
  return Object.assign(new DrydigError('DRYDIG_ERR_BUSY', message), { retryAfter_s });
}

function cancelledError(): DrydigError {
  return new DrydigError('DRYDIG_ERR_CANCELLED', 'the computation was cancelled before it finished');
}

/** Runs a task in process (no thread, no budget): the pool's `threads: 0`. */
async function runInProcess<N extends ComputeTaskName>(task: N, input: ComputeInput<N>, options: ComputeRunOptions): Promise<ComputeOutput<N>> {
  const run = COMPUTE_TASKS[task] as (input: unknown, progress: ProgressReporter) => unknown;
  try {
    return (await run(input, options.onProgress ?? (() => undefined))) as ComputeOutput<N>;
  } catch (error) {
    throw asRequestError(error);
  }
}

function inProcessPool(): ComputePool {
  return {
    threads: 0,
    threadsPerClient: 0,
    run: (task, input, options = {}) => runInProcess(task, input, options),
    stats: () => ({ threads: 0, running: 0, queued: 0 }),
    close: async () => undefined,
  };
}

/** The default thread count: the cores this process may use, at least 2. */
export function defaultComputeThreads(): number {
  return Math.max(2, availableParallelism());
}

export function createComputePool(options: ComputePoolOptions = {}): ComputePool {
  const threads = options.threads ?? defaultComputeThreads();
  if (threads === 0) return inProcessPool();
  const timeout_ms = options.timeout_ms ?? DEFAULT_COMPUTE_TIMEOUT_MS;
  const longTimeout_ms = options.longTimeout_ms ?? DEFAULT_LONG_COMPUTE_TIMEOUT_MS;
  const retryAfter_s = options.retryAfter_s ?? 5;
  const quickThreads = options.quickThreads ?? 1;
  const queue = new FairQueue({
    slots: threads,
    quickSlots: quickThreads,
    maxQueued: options.maxQueued ?? 32,
    maxQueuedPerClient: options.maxQueuedPerClient ?? 4,
    ...(options.perClientSlots !== undefined ? { perClientSlots: options.perClientSlots } : {}),
  });
  let piscina: Piscina | null = null;
  let closed = false;
  // Threads start on first use and stop when idle, so an app that computes nothing costs nothing.
  const threadsOf = () =>
    (piscina ??= new Piscina({
      filename: new URL('./compute-worker.mjs', import.meta.url).href,
      minThreads: 0,
      maxThreads: threads + quickThreads,
      idleTimeout: 60_000,
      // The fair queue decides order; piscina only ever sees as many jobs as it has threads.
      maxQueue: threads + quickThreads,
      concurrentTasksPerWorker: 1,
    }));

  const runOnThread = async (task: ComputeTaskName, input: unknown, signal: AbortSignal, onProgress?: ProgressReporter): Promise<unknown> => {
    const channel = onProgress ? new MessageChannel() : null;
    if (channel && onProgress) {
      channel.port1.on('message', (m: { stage: string; fraction: number }) => onProgress(m.stage, m.fraction));
      channel.port1.unref();
    }
    try {
      const answer = (await threadsOf().run(
        { task, input, ...(channel ? { port: channel.port2 } : {}) },
        { signal, ...(channel ? { transferList: [channel.port2] } : {}) },
      )) as WorkerAnswer;
      if (answer.ok) return answer.value;
      throw new DrydigError(answer.error.code, answer.error.message, answer.error.issues);
    } finally {
      channel?.port1.close();
    }
  };

  const run = <N extends ComputeTaskName>(task: N, input: ComputeInput<N>, runOptions: ComputeRunOptions = {}): Promise<ComputeOutput<N>> => {
    if (closed) return Promise.reject(busyError('the service is shutting down', retryAfter_s));
    const lane = runOptions.lane ?? 'normal';
    const budget_ms = runOptions.timeout_ms ?? (lane === 'long' ? longTimeout_ms : timeout_ms);
    const outer = runOptions.signal;
    if (outer?.aborted) return Promise.reject(cancelledError());
    return new Promise<ComputeOutput<N>>((resolve, reject) => {
      const job = {
        client: runOptions.client ?? 'local',
        lane,
        start: (done: () => void) => {
          outer?.removeEventListener('abort', onAbortWaiting);
          const controller = new AbortController();
          let timedOut = false;
          const timer = setTimeout(() => {
            timedOut = true;
            controller.abort();
          }, budget_ms);
          const onAbort = () => controller.abort();
          outer?.addEventListener('abort', onAbort, { once: true });
          runOnThread(task, input, controller.signal, runOptions.onProgress)
            .then((value) => resolve(value as ComputeOutput<N>))
            .catch((error: unknown) => {
              if (timedOut) reject(new DrydigError('DRYDIG_ERR_COMPUTE_TIMEOUT', `the computation did not finish within its ${budget_ms / 1000} s budget; it was stopped`));
              else if (controller.signal.aborted) reject(cancelledError());
              else reject(error);
            })
            .finally(() => {
              clearTimeout(timer);
              outer?.removeEventListener('abort', onAbort);
              done();
            });
        },
      };
      const onAbortWaiting = () => {
        if (queue.withdraw(job)) reject(cancelledError());
      };
      outer?.addEventListener('abort', onAbortWaiting, { once: true });
      const refusal = queue.enqueue(job);
      if (refusal) {
        outer?.removeEventListener('abort', onAbortWaiting);
        reject(busyError(
          refusal === 'queue-full'
            ? `the service is busy: ${queue.queued} computations are already waiting; try again in ${retryAfter_s} s`
            : `this client already has computations waiting; wait for them or try again in ${retryAfter_s} s`,
          retryAfter_s,
        ));
      }
    });
  };

  return {
    threads,
    threadsPerClient: options.perClientSlots ?? Math.max(1, threads - 1),
    run,
    stats: () => ({ threads, running: queue.running, queued: queue.queued }),
    close: async () => {
      closed = true;
      const p = piscina;
      piscina = null;
      if (p) await p.destroy();
    },
  };
}
