// Worker-thread entry of the compute pool (piscina): loads the TypeScript task table through tsx
// and runs { task, input, port? } — answering { ok, value } or { ok: false, error: { code,
// message, issues } }, so a DrydigError keeps its code across the thread boundary. Progress goes
// to `port` (a MessagePort) as { stage, fraction } messages.
import { register } from 'tsx/esm/api';

register();
const { COMPUTE_TASKS, asRequestError } = await import('./compute-tasks.ts');

export default async function runComputeTask({ task, input, port }) {
  const progress = (stage, fraction) => port?.postMessage({ stage, fraction });
  try {
    const run = COMPUTE_TASKS[task];
    if (typeof run !== 'function') throw new Error(`unknown compute task ${String(task)}`);
    return { ok: true, value: await run(input, progress) };
  } catch (thrown) {
    const error = asRequestError(thrown);
    const known = error && typeof error === 'object' && typeof error.code === 'string' && error.code.startsWith('DRYDIG_ERR_');
    return {
      ok: false,
      error: known
        ? { code: error.code, message: error.message, issues: error.issues ?? [] }
        : { code: 'DRYDIG_ERR_INTERNAL', message: String((error && error.message) || error), issues: [] },
    };
  } finally {
    port?.close();
  }
}
