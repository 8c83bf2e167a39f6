/**
 * The engine work behind a stored revision's views, as plain functions the compute pool's
 * threads run: plan results (grid, contours, checks) and the monitoring plan. An engine failure
 * (e.g. boundary geometry the image-well method cannot take) comes back in words, never a crash.
 */
import { DrydigError, type Scenario } from '../../shared/schema';
import { buildMonitoringPlan, computePlanResults, type MonitoringPlan, type PlanReading, type PlanResults } from '../../shared/exports';
import { fieldEngine } from './field-engine';

/** Plan results, or why there are none. */
export type PlanOutcome = { results: PlanResults } | { error: string };

export function describeComputeFailure(error: unknown): string {
  if (error instanceof DrydigError) return error.message;
  return 'the field could not be computed for this scenario';
}

export function computePlanOutcome(scenario: Scenario): PlanOutcome {
  try {
    return { results: computePlanResults({ scenario, engine: fieldEngine }) };
  } catch (error) {
    return { error: describeComputeFailure(error) };
  }
}

/** The monitoring plan with readings assessed, or an empty plan saying why. */
export function computeMonitoringPlan(scenario: Scenario, readings: readonly PlanReading[]): MonitoringPlan & { error?: string } {
  try {
    return buildMonitoringPlan({ scenario, engine: fieldEngine, readings });
  } catch (error) {
    return {
      present: false, pumpingStart: null, interval_s: null, staticLevel_m: scenario.aquifer.staticLevel_m, piezometers: [], receptors: [],
      notes: [], error: describeComputeFailure(error),
    };
  }
}
