/**
 * A worker thread of the CLI's split grid evaluation: takes band requests on its port and answers
 * each with the band (its arrays transferred, not copied) or the error's code, message and issues.
 * Built into dist/cli/grid-band-worker.mjs; from source, grid-band-worker.mjs loads it through tsx.
 */
import { parentPort } from 'node:worker_threads';
import { evaluateGridBandForRequest, type GridBandRequest } from '../evaluation/run-evaluation';

parentPort?.on('message', (message: { id: number; request: GridBandRequest }) => {
  try {
    const band = evaluateGridBandForRequest(message.request);
    parentPort!.postMessage({ id: message.id, ok: true, band }, [band.drawdown_m.buffer as ArrayBuffer, band.level_m.buffer as ArrayBuffer, band.flags.buffer as ArrayBuffer]);
  } catch (thrown) {
    const e = thrown as { code?: unknown; message?: unknown; issues?: unknown };
    const known = typeof e?.code === 'string' && e.code.startsWith('DRYDIG_ERR_');
    parentPort!.postMessage({ id: message.id, ok: false, error: { code: known ? e.code : 'DRYDIG_ERR_INTERNAL', message: String(e?.message ?? thrown), issues: known && Array.isArray(e.issues) ? e.issues : [] } });
  }
});
