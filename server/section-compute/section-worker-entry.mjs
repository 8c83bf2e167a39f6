// Worker-thread entry for section jobs: loads the TypeScript engine through tsx and answers
// { id, job } messages with { id, answer } or { id, error: { code, message, issues } }.
import { parentPort } from 'node:worker_threads';
import { register } from 'tsx/esm/api';

register();
const { runSectionJob } = await import('../../shared/section/index.ts');

parentPort.on('message', ({ id, job }) => {
  try {
    parentPort.postMessage({ id, answer: runSectionJob(job) });
  } catch (error) {
    const known = error && typeof error === 'object' && typeof error.code === 'string' && error.code.startsWith('DRYDIG_ERR_');
    parentPort.postMessage({
      id,
      error: known
        ? { code: error.code, message: error.message, issues: error.issues ?? [] }
        : { code: 'DRYDIG_ERR_INTERNAL', message: String((error && error.message) || error), issues: [] },
    });
  }
});
