/**
 * Computed pictures of a stored revision (plan grid and contours, monitoring plan), run on the
 * compute pool of the request (server/compute) and cached by the revision's checksum: a revision
 * never changes, so neither does what is computed from it. The cache holds the promise, so
 * parallel requests share one computation.
 */
import type { Scenario } from '../../shared/schema';
import type { MonitoringPlan, PlanReading, PlanResults } from '../../shared/exports';
import { readPackageVersion } from '../routes/health';
import { currentCompute } from '../compute/compute-context';
import type { PlanOutcome } from './plan-compute';

/**
 * Which engine computed the levels, checks and design shown beside a revision. The scenario is
 * stored exactly; what is computed from it can change with a new engine version, so every view and
 * report says which one it is.
 */
export const COMPUTED_BY = `drydig ${readPackageVersion()}`;

const MAX_CACHED = 64;
const planCache = new Map<string, Promise<PlanOutcome>>();

/** Plan results for a revision (by its checksum), or the reason they could not be computed. */
export async function planResultsFor(sha256: string, scenario: Scenario): Promise<{ results?: PlanResults; error?: string }> {
  let pending = planCache.get(sha256);
  if (pending) {
    planCache.delete(sha256);
  } else {
    pending = currentCompute().run('planResults', { scenario });
    // A refusal (busy, past its budget) is not a property of the revision: do not keep it.
    pending.catch(() => planCache.delete(sha256));
  }
  planCache.set(sha256, pending);
  if (planCache.size > MAX_CACHED) planCache.delete(planCache.keys().next().value as string);
  const value = await pending;
  return 'error' in value ? { error: value.error } : { results: value.results };
}

/** Monitoring plan with readings assessed (readings change, so this is not cached). */
export function monitoringPlanFor(scenario: Scenario, readings: readonly PlanReading[]): Promise<MonitoringPlan & { error?: string }> {
  return currentCompute().run('monitoringPlan', { scenario, readings });
}

/** Alias used by the routes: the monitoring plan of a scenario with its readings. */
export const buildMonitoringSeries = (scenario: Scenario, readings: readonly PlanReading[]) => monitoringPlanFor(scenario, readings);
