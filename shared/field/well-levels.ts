import type { Scenario } from '../schema';
import { evaluatePreparedPoint } from './evaluate-points';
import { prepareField } from './prepare-field';
import { getWellRateAt } from './rate-steps';
import type { ModelInfo, WellLevel } from './types';

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
    return {
      id: w.id,
      rate_m3_s: pumpingNow,
      aquiferLevel_m: r.level_m,
      wellLoss_m: loss,
      pumpingLevel_m: r.level_m - loss,
      flags: r.flags,
    };
  });
  return { wells, model: field.info };
}
