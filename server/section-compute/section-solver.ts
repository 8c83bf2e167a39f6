/**
 * Section jobs off the event loop: one worker thread runs them one after another, each within a
 * time budget; a job past its budget has its worker terminated (the next job starts a fresh one)
 * and fails with DRYDIG_ERR_COMPUTE_TIMEOUT. The interface — `run(job) → Promise<answer>` and
 * `close()` — is what a shared worker pool would offer, so the route can move onto one unchanged.
 */
import { Worker } from 'node:worker_threads';
import { DrydigError, type ErrorCode, type FieldIssue } from '../../shared/schema';
import type { SectionJob, SectionJobAnswer } from '../../shared/section';

export interface SectionSolverOptions {
  /** Time budget per job, ms (from when the job starts running). Default 30 000. */
  timeout_ms?: number;
  /** Most jobs waiting behind the running one; more are refused as busy. Default 8. */
  maxQueued?: number;
}

export interface SectionSolver {
  run: (job: SectionJob) => Promise<SectionJobAnswer>;
  close: () => Promise<void>;
}

interface WorkerReply {
  id: number;
  answer?: SectionJobAnswer;
  error?: { code: ErrorCode; message: string; issues: FieldIssue[] };
}

const ENTRY = new URL('./section-worker-entry.mjs', import.meta.url);

/** A solver running section jobs in its own worker thread. */
export function createSectionSolver(options: SectionSolverOptions = {}): SectionSolver {
  const timeout_ms = options.timeout_ms ?? 30_000;
  const maxQueued = options.maxQueued ?? 8;
  let worker: Worker | null = null;
  let nextId = 1;
  let queued = 0;
  let tail: Promise<unknown> = Promise.resolve();
  let closed = false;

  const runOne = (job: SectionJob) =>
    new Promise<SectionJobAnswer>((resolve, reject) => {
      const w = (worker ??= new Worker(ENTRY));
      w.unref();
      const id = nextId++;
      const finish = () => {
        clearTimeout(timer);
        w.off('message', onMessage);
        w.off('error', onError);
        w.off('exit', onExit);
      };
      const onMessage = (m: WorkerReply) => {
        if (m.id !== id) return;
        finish();
        if (m.answer) resolve(m.answer);
        else reject(new DrydigError(m.error?.code ?? 'DRYDIG_ERR_INTERNAL', m.error?.message ?? 'no answer from the section worker', m.error?.issues ?? []));
      };
      const onError = (e: unknown) => {
        finish();
        worker = null;
        reject(e instanceof Error ? e : new Error(String(e)));
      };
      const onExit = (code: number) => {
        finish();
        worker = null;
        reject(new Error(`section worker stopped (exit code ${code})`));
      };
      const timer = setTimeout(() => {
        finish();
        worker = null;
        void w.terminate();
        reject(new DrydigError('DRYDIG_ERR_COMPUTE_TIMEOUT', `the section did not solve within its ${timeout_ms / 1000} s budget`));
      }, timeout_ms);
      w.on('message', onMessage);
      w.on('error', onError);
      w.on('exit', onExit);
      w.postMessage({ id, job });
    });

  const run = (job: SectionJob): Promise<SectionJobAnswer> => {
    if (closed) return Promise.reject(new Error('the section solver is closed'));
    if (queued >= maxQueued) return Promise.reject(new DrydigError('DRYDIG_ERR_COMPUTE_TIMEOUT', `${queued} section jobs are already waiting; try again shortly`));
    queued++;
    const start = () => {
      queued--;
      return runOne(job);
    };
    const result = tail.then(start, start);
    tail = result.catch(() => undefined);
    return result;
  };

  const close = async () => {
    closed = true;
    const w = worker;
    worker = null;
    if (w) await w.terminate();
  };
  return { run, close };
}
