/**
 * One step from a fit to the scenario: K = T / b from the scenario's saturated thickness
 * (confined/leaky: top − base; unconfined: static level − base), S to storativity (confined,
 * leaky) or specific yield (unconfined), B to the leakage factor (a confined aquifer becomes
 * leaky), C to a chosen well's well loss — and the record of where they came from, with the
 * confidence interval of K the uncertainty analysis samples from.
 */
import type { PumpingTestRecord, Scenario } from '../schema';
import type { PumpingTestFit } from './fit-result';

export interface ApplyTestParametersOptions {
  scenario: Scenario;
  fit: PumpingTestFit;
  /** Well that gets the step test's well-loss coefficient. */
  wellId?: string;
  /** File name or note kept with the record. */
  source?: string;
  /** ISO time of the change (the caller's clock; shared/ reads none). */
  appliedAt?: string;
}

export interface AppliedTestParameters {
  scenario: Scenario;
  /** What changed, in words, for the user to confirm. */
  changes: string[];
}

/** Saturated thickness b the scenario's aquifer gives, m. */
export function saturatedThickness(scenario: Scenario): number {
  const a = scenario.aquifer;
  return a.kind === 'unconfined' ? a.staticLevel_m - a.base_m : (a.top_m ?? a.staticLevel_m) - a.base_m;
}

/** The scenario with the fit's parameters applied (a new object; the input is not changed). */
export function applyTestParameters({ scenario, fit, wellId, source, appliedAt }: ApplyTestParametersOptions): AppliedTestParameters {
  const a = { ...scenario.aquifer };
  const changes: string[] = [];
  const b = saturatedThickness(scenario);
  const record: PumpingTestRecord = { method: fit.method, rmse_m: fit.rmse_m, readings: fit.validity.readings, confidence: fit.interval?.confidence ?? 0.95 };
  if (source !== undefined) record.source = source.slice(0, 200);
  if (appliedAt !== undefined) record.appliedAt = appliedAt;
  if (fit.transmissivity_m2_s !== null) {
    if (!(b > 0)) throw new RangeError('the aquifer has no saturated thickness (check its levels) to turn T into K');
    const K = fit.transmissivity_m2_s / b;
    a.conductivity_m_s = K;
    changes.push(`K = T / b = ${fit.transmissivity_m2_s.toPrecision(3)} m²/s / ${b.toPrecision(4)} m = ${K.toPrecision(3)} m/s`);
    record.transmissivity_m2_s = fit.transmissivity_m2_s;
    record.conductivity_m_s = K;
    record.saturatedThickness_m = b;
    const tI = fit.interval?.transmissivity_m2_s;
    if (tI) {
      record.transmissivityInterval_m2_s = tI;
      record.conductivityInterval_m_s = [tI[0] / b, tI[1] / b];
    }
  }
  if (fit.storativity !== null) {
    if (a.kind === 'unconfined') {
      a.specificYield = fit.storativity;
      changes.push(`Sy = ${fit.storativity.toPrecision(3)}`);
    } else {
      a.storativity = fit.storativity;
      changes.push(`S = ${fit.storativity.toPrecision(3)}`);
    }
    record.storativity = fit.storativity;
    if (fit.interval?.storativity) record.storativityInterval = fit.interval.storativity;
  }
  if (fit.leakageFactor_m !== undefined) {
    if (a.kind === 'unconfined') changes.push('B not applied: the scenario’s aquifer is unconfined (a leakage factor needs a confined aquifer under an aquitard)');
    else {
      if (a.kind === 'confined') changes.push('aquifer kind confined → leaky');
      a.kind = 'leaky';
      a.leakageFactor_m = fit.leakageFactor_m;
      changes.push(`B = ${fit.leakageFactor_m.toPrecision(3)} m`);
      record.leakageFactor_m = fit.leakageFactor_m;
    }
  }
  let wells = scenario.wells;
  if (fit.wellLoss_s2_m5 !== undefined && fit.wellLoss_s2_m5 >= 0 && wellId !== undefined) {
    const index = wells.findIndex((w) => w.id === wellId);
    if (index < 0) throw new RangeError(`well "${wellId}" is not in the scenario`);
    wells = wells.map((w, i) => (i === index ? { ...w, wellLoss_s2_m5: fit.wellLoss_s2_m5! } : w));
    changes.push(`C = ${fit.wellLoss_s2_m5.toPrecision(3)} s²/m⁵ on well ${wellId}`);
    record.wellLoss_s2_m5 = fit.wellLoss_s2_m5;
    record.wellId = wellId;
  }
  return { scenario: { ...scenario, aquifer: a, wells, pumpingTest: record } as Scenario, changes };
}
