/**
 * Worker threads for the CLI's split grid evaluation (`drydig evaluate --grid … --threads N`):
 * N threads, each taking one band of rows at a time; closed when the command is done.
 */
import { Worker } from 'node:worker_threads';
import type { GridBand } from '../../shared/field';
import { DrydigError, type ErrorCode, type FieldIssue } from '../../shared/schema';
import type { BandRunners, GridBandRequest, RunEvaluationOptions } from '../evaluation';
import { runEvaluation } from '../evaluation';
import type { EvaluateResponse } from '../request-schemas';

type Answer = { id: number; ok: true; band: GridBand } | { id: number; ok: false; error: { code: ErrorCode; message: string; issues: FieldIssue[] } };

export interface BandThreads extends BandRunners {
  close(): Promise<void>;
}

/** `threads` workers answering band requests; points run in this thread. */
export function startBandThreads(threads: number): BandThreads {
  const workers = Array.from({ length: threads }, () => new Worker(new URL('./grid-band-worker.mjs', import.meta.url)));
  const waiting = new Map<number, { resolve: (band: GridBand) => void; reject: (error: Error) => void }>();
  let next = 0;
  for (const worker of workers) {
    worker.on('message', (answer: Answer) => {
      const w = waiting.get(answer.id);
      if (!w) return;
      waiting.delete(answer.id);
      if (answer.ok) w.resolve(answer.band);
      else w.reject(new DrydigError(answer.error.code, answer.error.message, answer.error.issues));
    });
    worker.on('error', (error) => {
      for (const w of waiting.values()) w.reject(error);
      waiting.clear();
    });
  }
  return {
    bands: threads,
    runPoints: async (options: RunEvaluationOptions): Promise<EvaluateResponse> => runEvaluation(options),
    runBand: (request: GridBandRequest) =>
      new Promise<GridBand>((resolve, reject) => {
        const id = next++;
        waiting.set(id, { resolve, reject });
        workers[id % workers.length]!.postMessage({ id, request });
      }),
    close: async () => {
      await Promise.all(workers.map((w) => w.terminate()));
    },
  };
}
