/**
 * The monitoring job of the engine worker: one piezometer's row of the monitoring plan, made by
 * the same `buildMonitoringPlan` the server uses for the site view and the monitoring CSV, so the
 * designer sees exactly the expected, alert and action levels the site team will be given.
 */
import { evaluatePoints } from '../../shared/field';
import { buildMonitoringPlan, getMonitoring } from '../../shared/exports';
import type { MonitoringRequest, MonitoringResult } from './engine-protocol';

/** Plans only the piezometer asked for (the others would cost a series each and be thrown away). */
export function runMonitoringJob(req: MonitoringRequest): MonitoringResult {
  const { scenario, piezometerId } = req;
  const monitoring = getMonitoring(scenario);
  const piezometer = monitoring?.piezometers.find((p) => p.id === piezometerId);
  const only = monitoring && piezometer ? { ...scenario, monitoring: { ...monitoring, piezometers: [piezometer] } } : scenario;
  const plan = buildMonitoringPlan({ scenario: only, engine: { evaluatePoints } });
  return {
    kind: 'monitoring',
    id: req.id,
    piezometer: piezometer ? (plan.piezometers[0] ?? null) : null,
    pumpingStart: plan.pumpingStart,
    interval_s: plan.interval_s,
    staticLevel_m: plan.staticLevel_m,
    notes: plan.notes,
  };
}
