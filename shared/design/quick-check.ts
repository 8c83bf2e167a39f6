/** The equivalent-well quick check of each excavation beside the superposition total. */
import { equivalentWellInflow } from '../field';
import type { DesignContext } from './design-context';
import type { QuickCheck } from './design-result';

/** One quick check per excavation: equivalent-well inflow, r_e and the ratio to the design total. */
export function buildQuickChecks(ctx: DesignContext, total_m3_s: number): QuickCheck[] {
  const { scenario } = ctx;
  return scenario.excavations.map((e) => {
    const shared = scenario.excavations.length > 1 ? ' The superposition total serves every excavation.' : '';
    try {
      const c = equivalentWellInflow({ scenario, excavationId: e.id, time_s: ctx.designTime_s });
      // Far outside the formula's range (e.g. a design time of a fraction of a second, W(u) → 0)
      // the estimate is no number at all: say so rather than hand out Infinity.
      if (!Number.isFinite(c.rate_m3_s)) throw new RangeError(`the estimate is not a finite number here (${String(c.rate_m3_s)} m³/s): the design time is outside the formula's useful range`);
      return {
        excavationId: e.id,
        equivalentWellInflow_m3_s: c.rate_m3_s,
        equivalentRadius_m: c.equivalentRadius_m,
        superpositionTotal_m3_s: total_m3_s,
        ratio: c.rate_m3_s > 0 ? total_m3_s / c.rate_m3_s : null,
        note: `Equivalent well (r_e = sqrt(A/π), ${c.method}), boundaries ignored: a rough figure; a ratio far from 1 deserves a second look.${shared}`,
      };
    } catch (error) {
      return {
        excavationId: e.id,
        equivalentWellInflow_m3_s: null,
        equivalentRadius_m: null,
        superpositionTotal_m3_s: total_m3_s,
        ratio: null,
        note: `No equivalent-well estimate: ${error instanceof Error ? error.message : String(error)}`,
      };
    }
  });
}
