/**
 * The compute pool of the request being served, found without passing it through every call:
 * the compute plugin runs each request inside a scope (AsyncLocalStorage) holding the app's pool,
 * the client's key and the lane. Code outside a request (the CLI, unit tests) gets the in-process
 * runner.
 */
import { AsyncLocalStorage } from 'node:async_hooks';
import { createComputePool, type ComputePool, type ComputeRunOptions } from './compute-pool';
import type { ComputeInput, ComputeOutput, ComputeTaskName } from './compute-tasks';
import type { ComputeLane } from './fair-queue';

export interface ComputeScope {
  pool: ComputePool;
  /** Who asked: the fair queue's key. */
  client: string;
  /** Lane for jobs of this request unless the call says otherwise. */
  lane: ComputeLane;
  /** Aborted when the request goes away. */
  signal?: AbortSignal;
}

export interface ComputeRunner {
  /** Threads one request may use at once (0: in process). */
  readonly threadsPerClient: number;
  run<N extends ComputeTaskName>(task: N, input: ComputeInput<N>, options?: ComputeRunOptions): Promise<ComputeOutput<N>>;
}

const scopes = new AsyncLocalStorage<ComputeScope>();
let inProcess: ComputePool | null = null;

/** Runs `fn` (and everything it starts) in the scope. */
export function runInComputeScope<T>(scope: ComputeScope, fn: () => T): T {
  return scopes.run(scope, fn);
}

/** The scope of the current request, if any. */
export function currentComputeScope(): ComputeScope | undefined {
  return scopes.getStore();
}

/** Puts the rest of this request's jobs in a lane (the first view of a share link uses 'view'). */
export function useComputeLane(lane: ComputeLane): void {
  const scope = scopes.getStore();
  if (scope) scope.lane = lane;
}

/** Runs tasks on the current request's pool with its client and lane (or in process outside a request). */
export function currentCompute(): ComputeRunner {
  const scope = scopes.getStore();
  if (!scope) {
    inProcess ??= createComputePool({ threads: 0 });
    return { threadsPerClient: 0, run: (task, input, options) => inProcess!.run(task, input, options) };
  }
  return {
    threadsPerClient: scope.pool.threadsPerClient,
    run: (task, input, options = {}) =>
      scope.pool.run(task, input, { client: scope.client, lane: scope.lane, ...(scope.signal ? { signal: scope.signal } : {}), ...options }),
  };
}
