/**
 * The design check shown in the report and the site view: the shared design stages run on the
 * stored revision's own rates (`rates: 'scenario'` — checked, not re-solved), so the set-out
 * table, the summary and the report show one agreed set of rates. A revision never changes, so the result
 * is cached by the revision's checksum (the promise, so parallel requests share one solve). It runs
 * on the request's compute pool; a refusal for load (busy, past its time budget) is passed on and
 * not cached, since it says nothing about the revision.
 */
import type { Scenario } from '../../shared/schema';
import type { DesignResult } from '../../shared/design';
import { DrydigError } from '../../shared/schema';
import { currentCompute } from '../compute/compute-context';

/** A design result, or why there is none. */
export interface DesignOutcome {
  design: DesignResult | null;
  /** Why the solver gave no result (bad options, a problem too large), in words. */
  error: string | null;
}

const MAX_CACHED = 32;
/** Refusals that depend on the load, not on the revision. */
const LOAD_REFUSALS = new Set<string>(['DRYDIG_ERR_BUSY', 'DRYDIG_ERR_COMPUTE_TIMEOUT']);
const cache = new Map<string, Promise<DesignOutcome>>();

/** Design for a revision (by checksum): solved once, then served from the cache. */
export function designFor(sha256: string, scenario: Scenario): Promise<DesignOutcome> {
  const hit = cache.get(sha256);
  if (hit) return hit;
  const pending = currentCompute()
    .run('design', { scenario, rates: 'scenario' })
    .then((design): DesignOutcome => ({ design, error: null }))
    .catch((error: unknown): DesignOutcome => {
      if (error instanceof DrydigError && LOAD_REFUSALS.has(error.code)) {
        cache.delete(sha256);
        throw error;
      }
      return { design: null, error: error instanceof DrydigError ? error.message : 'the design solver could not run on this scenario' };
    });
  cache.set(sha256, pending);
  if (cache.size > MAX_CACHED) cache.delete(cache.keys().next().value as string);
  return pending;
}
