/**
 * Computed pictures of a stored revision (plan grid and contours, monitoring plan), cached by the
 * revision's checksum: a revision never changes, so neither does what is computed from it.
 * An engine failure (e.g. boundary geometry the image-well method cannot take) is reported in
 * words beside the export, never turned into a crash or a blank.
 */
import { DrydigError, type Scenario } from '../../shared/schema';
import {
  buildMonitoringPlan,
  computePlanResults,
  type MonitoringPlan,
  type PlanReading,
  type PlanResults,
} from '../../shared/exports';
import { fieldEngine } from './field-engine';
import { readPackageVersion } from '../routes/health';

/**
 * Which engine computed the levels, checks and design shown beside a revision. The scenario is
 * stored exactly; what is computed from it can change with a new engine version, so every view and
 * report says which one it is.
 */
export const COMPUTED_BY = `drydig ${readPackageVersion()}`;

const MAX_CACHED = 64;
const planCache = new Map<string, PlanResults | { error: string }>();

function remember<T>(cache: Map<string, T>, key: string, make: () => T): T {
  const hit = cache.get(key);
  if (hit !== undefined) {
    cache.delete(key);
    cache.set(key, hit);
    return hit;
  }
  const value = make();
  cache.set(key, value);
  if (cache.size > MAX_CACHED) cache.delete(cache.keys().next().value as string);
  return value;
}

function describeFailure(error: unknown): string {
  if (error instanceof DrydigError) return error.message;
  return 'the field could not be computed for this scenario';
}

/** Plan results for a revision (by its checksum), or the reason they could not be computed. */
export function planResultsFor(sha256: string, scenario: Scenario): { results?: PlanResults; error?: string } {
  const value = remember(planCache, sha256, () => {
    try {
      return computePlanResults({ scenario, engine: fieldEngine });
    } catch (error) {
      return { error: describeFailure(error) };
    }
  });
  return 'error' in value ? { error: value.error } : { results: value };
}

/** Monitoring plan with readings assessed (readings change, so this is not cached). */
export function monitoringPlanFor(scenario: Scenario, readings: readonly PlanReading[]): MonitoringPlan & { error?: string } {
  try {
    return buildMonitoringPlan({ scenario, engine: fieldEngine, readings });
  } catch (error) {
    return {
      present: false, pumpingStart: null, interval_s: null, staticLevel_m: scenario.aquifer.staticLevel_m, piezometers: [],
      notes: [], error: describeFailure(error),
    };
  }
}

/** Alias used by the routes: the monitoring plan of a scenario with its readings. */
export const buildMonitoringSeries = (scenario: Scenario, readings: readonly PlanReading[]) => monitoringPlanFor(scenario, readings);
