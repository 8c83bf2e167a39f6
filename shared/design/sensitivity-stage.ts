/**
 * Design stage: the sensitivity table. For each factor, K (then S) of the scenario is scaled and
 * the chosen design is (a) re-evaluated at its rates — are the targets still met, by how much not,
 * the uplift factor of safety where the floor check applies — and (b) re-solved: the least total
 * flow that meets every target with the scaled value (`scaled-design.ts`). S only matters in a
 * transient design, so a steady design's table scales K only.
 */
import { DrydigError } from '../schema';
import type { DesignContext } from './design-context';
import { evaluateRates, prepareScaledCase, ratesFor, solveScaledCase, type DesignBasis } from './scaled-design';
import type { SensitivityResult, SensitivityRow } from './uncertainty-result';

/** The table for the options' factors and parameters (null when the options ask for none). */
export async function buildSensitivityTable(ctx: DesignContext, basis: DesignBasis): Promise<SensitivityResult | null> {
  const asked = ctx.options.sensitivity;
  if (!asked) return null;
  const steady = ctx.designTime_s === null;
  const parameters = asked.parameters.filter((p) => p === 'conductivity' || !steady);
  const a = ctx.scenario.aquifer;
  const storage = a.kind === 'unconfined' ? a.specificYield : a.storativity;
  const rows: SensitivityRow[] = [];
  for (const parameter of parameters) {
    for (const factor of asked.factors) {
      const kf = parameter === 'conductivity' ? factor : 1;
      const sf = parameter === 'storage' ? factor : 1;
      const value = parameter === 'conductivity' ? a.conductivity_m_s * factor : (storage ?? 0) * factor;
      try {
        const c = prepareScaledCase(basis, kf, sf);
        const at = evaluateRates(c, basis.checkPoints, ratesFor(c.ctx, basis.rates));
        const solved = await solveScaledCase(basis, c);
        const fs = at.excavations.map((e) => e.upliftFS).filter((v): v is number => v !== null);
        rows.push({
          parameter,
          factor,
          value,
          totalRate_m3_s: solved.totalRate_m3_s,
          feasible: solved.feasible,
          met: at.met,
          worstShortfall_m: at.worstShortfall_m,
          upliftFS: fs.length > 0 ? Math.min(...fs) : null,
        });
      } catch (error) {
        if (!(error instanceof DrydigError)) throw error;
        // A scaled value outside the physical range: the row says so rather than vanishing.
        rows.push({ parameter, factor, value, totalRate_m3_s: null, feasible: false, met: false, worstShortfall_m: null, upliftFS: null, note: `not computed: ${error.message}` });
      }
    }
  }
  return {
    factors: [...asked.factors],
    rows,
    note:
      'Each row scales one parameter and holds the rest. "met" and the shortfall are the chosen rates with the scaled value; the flow is a re-solve (least total pumping over the design’s wells). '
      + (steady ? 'A steady design does not depend on S, so only K is scaled. ' : '')
      + 'Lower K needs less flow for the same drawdown in steady confined flow (drawdown ∝ 1/T) but lowers every well’s Sichardt capacity (∝ √K); higher K needs more flow.',
  };
}
