/**
 * The compute pool's worker-thread task (piscina calls the default export): runs
 * { task, input, port? } from the task table and answers { ok, value } or { ok: false, error:
 * { code, message, issues } }, so a DrydigError keeps its code across the thread boundary.
 * Progress goes to `port` (a MessagePort) as { stage, fraction } messages. From source,
 * compute-worker.mjs loads this through tsx; the CLI build writes dist/cli/compute-worker.mjs.
 */
import type { MessagePort } from 'node:worker_threads';
import { asRequestError, COMPUTE_TASKS } from './compute-tasks';

export default async function runComputeTask({ task, input, port }: { task: string; input: unknown; port?: MessagePort }): Promise<unknown> {
  const progress = (stage: string, fraction: number) => port?.postMessage({ stage, fraction });
  try {
    const run = (COMPUTE_TASKS as unknown as Record<string, (input: unknown, progress: (stage: string, fraction: number) => void) => unknown>)[task];
    if (typeof run !== 'function') throw new Error(`unknown compute task ${String(task)}`);
    return { ok: true, value: await run(input, progress) };
  } catch (thrown) {
    const error = asRequestError(thrown) as { code?: unknown; message?: unknown; issues?: unknown } | null;
    const known = !!error && typeof error === 'object' && typeof error.code === 'string' && error.code.startsWith('DRYDIG_ERR_');
    return {
      ok: false,
      error: known
        ? { code: error!.code, message: error!.message, issues: error!.issues ?? [] }
        : { code: 'DRYDIG_ERR_INTERNAL', message: String((error && error.message) || error), issues: [] },
    };
  } finally {
    port?.close();
  }
}
