/**
 * Strip workers, one per core, for the full grid evaluations of the engine worker: each takes
 * the next strip from one queue, so the fine map after a change uses every core. A strip whose
 * job was cancelled before its turn is dropped, so a drag never waits behind a stale fine grid
 * for more than the strips already running.
 */
import type { GridResult, GridSpec } from '../../shared/field/types';
import type { Scenario } from '../../shared/schema';
import type { StripRequest, StripResponse } from './grid-strip-protocol';
import type { StripEvaluator } from './field-job';
import { DrydigError } from '../../shared/schema';

/** At most this many strip workers, whatever the core count (memory and start-up). */
export const MAX_STRIP_WORKERS = 8;

/** Strip workers to start for `cores` logical cores (navigator.hardwareConcurrency). */
export function stripWorkerCount(cores: number | undefined): number {
  const n = Math.floor(cores ?? 1);
  return Number.isFinite(n) ? Math.max(1, Math.min(MAX_STRIP_WORKERS, n)) : 1;
}

interface Queued {
  request: StripRequest;
  skip?: () => boolean;
  resolve: (r: GridResult | null) => void;
  reject: (e: Error) => void;
}

/** A worker as the pool needs it (a Web Worker, or a stand-in in tests). */
export interface StripWorker {
  postMessage(message: StripRequest): void;
  onmessage: ((event: MessageEvent<StripResponse>) => void) | null;
  terminate(): void;
}

export class StripPool {
  private readonly idle: StripWorker[] = [];
  private readonly running = new Map<number, Queued>();
  private readonly queue: Queued[] = [];
  private nextId = 1;
  readonly size: number;

  constructor(workers: StripWorker[]) {
    this.size = workers.length;
    for (const w of workers) {
      w.onmessage = (event) => this.receive(w, event.data);
      this.idle.push(w);
    }
  }

  /** Evaluates one strip on the next free worker (null: skipped before its turn). */
  readonly evaluate: StripEvaluator = (scenario: Scenario, grid: GridSpec, time_s: number | null, skip?: () => boolean) =>
    new Promise<GridResult | null>((resolve, reject) => {
      this.queue.push({ request: { id: this.nextId++, scenario, grid, time_s }, skip, resolve, reject });
      this.pump();
    });

  dispose(): void {
    for (const w of this.idle) w.terminate();
  }

  private pump(): void {
    while (this.idle.length > 0 && this.queue.length > 0) {
      const job = this.queue.shift()!;
      if (job.skip?.()) {
        job.resolve(null);
        continue;
      }
      const w = this.idle.pop()!;
      this.running.set(job.request.id, job);
      w.postMessage(job.request);
    }
  }

  private receive(w: StripWorker, msg: StripResponse): void {
    const job = this.running.get(msg.id);
    this.running.delete(msg.id);
    this.idle.push(w);
    if (job) {
      if ('result' in msg) job.resolve(msg.result);
      else job.reject(msg.drydig ? new DrydigError(msg.drydig.code, msg.error, msg.drydig.issues) : new Error(msg.error));
    }
    this.pump();
  }
}
