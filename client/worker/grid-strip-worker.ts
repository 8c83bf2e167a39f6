/**
 * A strip worker: evaluates one strip of a full grid with the shared engine and sends the arrays
 * back transferred. The engine worker starts one per core (client/worker/strip-pool.ts).
 */
import { evaluateGrid } from '../../shared/field';
import { DrydigError } from '../../shared/schema';
import type { StripRequest, StripResponse } from './grid-strip-protocol';

const scope = self as unknown as DedicatedWorkerGlobalScope;

scope.onmessage = (event: MessageEvent<StripRequest>) => {
  const { id, scenario, grid, time_s } = event.data;
  try {
    const result = evaluateGrid({ scenario, grid, time_s });
    scope.postMessage({ id, result } satisfies StripResponse, [result.drawdown_m.buffer, result.level_m.buffer, result.flags.buffer]);
  } catch (error) {
    const drydig = error instanceof DrydigError ? { code: error.code, issues: error.issues } : undefined;
    scope.postMessage({ id, error: (error as Error)?.message ?? String(error), ...(drydig ? { drydig } : {}) } satisfies StripResponse);
  }
};
