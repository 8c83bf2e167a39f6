/**
 * Design jobs held in memory while they run and for a while after: a long design (a Monte Carlo
 * analysis of many realisations) is started, polled for progress, and cancelled by id. Ids are
 * random (unguessable); a client may hold a few running jobs; finished jobs are forgotten after a
 * time to live.
 */
import { randomBytes } from 'node:crypto';
import type { DesignResult } from '../../shared/design';
import type { ErrorResponse } from '../request-schemas';

export type DesignJobState = 'running' | 'done' | 'failed' | 'cancelled';

export interface DesignJob {
  id: string;
  client: string;
  state: DesignJobState;
  stage: string;
  fraction: number;
  result?: DesignResult;
  error?: ErrorResponse['error'];
  /** When it finished, ms since epoch (for the time to live). */
  finishedAt?: number;
  controller: AbortController;
}

export interface DesignJobStoreOptions {
  /** Running jobs one client may hold. Default 2. */
  maxRunningPerClient?: number;
  /** Jobs held in all. Default 200. */
  maxJobs?: number;
  /** How long a finished job is kept, ms. Default 10 minutes. */
  keep_ms?: number;
}

export class DesignJobStore {
  readonly #jobs = new Map<string, DesignJob>();
  readonly #options: Required<DesignJobStoreOptions>;

  constructor(options: DesignJobStoreOptions = {}) {
    this.#options = { maxRunningPerClient: 2, maxJobs: 200, keep_ms: 10 * 60_000, ...options };
  }

  /** A new running job, or a refusal in words when the client or the store is full. */
  create(client: string): DesignJob | string {
    this.#forgetOld();
    const running = [...this.#jobs.values()].filter((j) => j.client === client && j.state === 'running').length;
    if (running >= this.#options.maxRunningPerClient) return `this client already has ${running} design jobs running; wait for one or cancel it`;
    if (this.#jobs.size >= this.#options.maxJobs) return 'the service holds as many design jobs as it keeps; try again in a minute';
    const job: DesignJob = { id: randomBytes(12).toString('base64url'), client, state: 'running', stage: 'queued', fraction: 0, controller: new AbortController() };
    this.#jobs.set(job.id, job);
    return job;
  }

  get(id: string): DesignJob | undefined {
    this.#forgetOld();
    return this.#jobs.get(id);
  }

  finish(job: DesignJob, outcome: Pick<DesignJob, 'state' | 'result' | 'error'>): void {
    Object.assign(job, outcome, { finishedAt: Date.now(), fraction: outcome.state === 'done' ? 1 : job.fraction });
  }

  /** Cancels every running job (the app is closing). */
  cancelAll(): void {
    for (const job of this.#jobs.values()) if (job.state === 'running') job.controller.abort();
  }

  #forgetOld(): void {
    const now = Date.now();
    for (const [id, job] of this.#jobs) if (job.finishedAt !== undefined && now - job.finishedAt > this.#options.keep_ms) this.#jobs.delete(id);
  }
}
