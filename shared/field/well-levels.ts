import type { Scenario } from '../schema';
import { evaluatePreparedPoint } from './evaluate-points';
import { prepareField } from './prepare-field';
import { getWellRateAt } from './rate-steps';
import { FLAG_BITS, type ModelInfo, type WellLevel } from './types';
import { flagsFromBits } from './interpret-sum';

/** Options of {@link wellLevels}. */
export interface WellLevelsOptions {
  scenario: Scenario;
  /** Undefined: the design time; null: steady state. */
  time_s?: number | null;
}

/**
 * Level at the face of every well (r = r_w from its own axis, all other wells and all images
 * included) and inside it after the well loss C·Q² (design.md section 5; the quadratic
 * well-loss term usually credited to Jacob 1947 — from memory). For injection the loss raises the
 * level, so it is applied as C·Q·|Q|. Inactive wells are listed with rate 0 (the level at their place).
 *
 * Unconfined levels come from the Dupuit / Jacob-corrected discharge potential and exclude the
 * seepage face, so the real water level in a pumping well stands lower than `aquiferLevel_m`.
 * A pumping level at or below the aquifer base adds the flag `dewatered` (the well cannot give
 * that rate), one below a confined top `confined-to-unconfined`; the level is never clamped.
 */
export function wellLevels({ scenario, time_s }: WellLevelsOptions): WellLevel[] {
  return wellLevelsWithModel({ scenario, time_s }).wells;
}

/** {@link wellLevels} together with the model used. */
export function wellLevelsWithModel({ scenario, time_s }: WellLevelsOptions): { wells: WellLevel[]; model: ModelInfo } {
  const field = prepareField({ scenario, time_s });
  const t = field.model.time_s;
  const wells = scenario.wells.map((w, i): WellLevel => {
    const r = evaluatePreparedPoint(field, w.x, w.y, i);
    const q = getWellRateAt(w, t === null ? null : t);
    const pumpingNow = t === null || t > 0 ? q : 0;
    const c = w.wellLoss_s2_m5 ?? 0;
    const loss = c * pumpingNow * Math.abs(pumpingNow);
    const pumpingLevel = r.level_m - loss;
    // The well loss can take the level inside the well below the base (the well cannot deliver
    // that rate) or below a confined top even where the aquifer at the face stays confined:
    // flag the well, and report the computed level unclamped so the shortfall is visible.
    const flags = [...r.flags];
    const model = field.model;
    if (pumpingLevel <= model.base_m && !flags.includes('dewatered')) flags.push('dewatered');
    if (model.top_m !== undefined && pumpingLevel < model.top_m && !flags.includes('confined-to-unconfined')) flags.push('confined-to-unconfined');
    return {
      id: w.id,
      rate_m3_s: pumpingNow,
      aquiferLevel_m: r.level_m,
      wellLoss_m: loss,
      pumpingLevel_m: pumpingLevel,
      flags: flagsFromBits(flags.reduce((m, f) => m | FLAG_BITS[f], 0)),
    };
  });
  return { wells, model: field.info };
}
