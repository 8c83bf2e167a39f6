// Worker-thread entry of the compute pool (piscina) when running from source: loads the
// TypeScript task runner (compute-worker-task.ts) through tsx. The CLI build writes
// dist/cli/compute-worker.mjs from the same runner, with no loader.
import { register } from 'tsx/esm/api';

register();
const { default: runComputeTask } = await import('./compute-worker-task.ts');

export default runComputeTask;
