/**
 * A stage of a design run: the receptors (neighbours) under the design — drawdown, settlement and
 * angular distortion at each (`shared/receptors/`), and, when the solve could not meet the targets
 * with the drawdown limits, which receptors stood in the way.
 */
import { getReceptors, type Scenario } from '../schema';
import { assessReceptors, drawdownForSettlement, receptorBlocksMessage, receptorCautions, receptorOverLimitMessage, receptorTimeline, RECEPTOR_METHOD_CAUTION, type ReceptorResult } from '../receptors';
import type { DesignContext } from './design-context';
import type { DesignReason } from './design-result';
import { findBlockingCeilings, type RateProblem, type RateSolution } from './rate-problem';
import { designEndTime } from './receptor-ceilings';

export interface ReceptorStage {
  /** Null when the scenario has no receptors (the result then has no `receptors` block). */
  results: ReceptorResult[] | null;
  reasons: DesignReason[];
  cautions: string[];
  /** True when every drawdown limit holds. */
  limitsMet: boolean;
}

export interface CheckReceptorsOptions {
  ctx: DesignContext;
  /** The scenario with the design rates applied. */
  solved: Scenario;
  problem: RateProblem;
  solution: RateSolution;
}

/** Assesses the receptors and explains a receptor that blocks the design. */
export async function checkReceptors({ ctx, solved, problem, solution }: CheckReceptorsOptions): Promise<ReceptorStage> {
  const receptors = getReceptors(ctx.scenario);
  if (receptors.length === 0) return { results: null, reasons: [], cautions: [], limitsMet: true };
  const results = assessReceptors({ scenario: solved, designTime_s: ctx.designTime_s, timeline_s: receptorTimeline(ctx.designTime_s, designEndTime(ctx)) });
  const reasons: DesignReason[] = [];
  if (solution.status === 'infeasible' && problem.ceilings) {
    const slack = await findBlockingCeilings(problem);
    problem.ceilings.names.forEach((id, k) => {
      const s = slack?.[k] ?? 0;
      const limit = receptors.find((r) => r.id === id)?.maxDrawdown_m ?? 0;
      if (s > 1e-6) reasons.push({ code: 'receptor-drawdown-limit', receptorId: id, message: receptorBlocksMessage(id, limit, s) });
    });
  }
  for (const r of results)
    if (r.flags.includes('drawdown-exceeds') && !reasons.some((x) => x.receptorId === r.id))
      reasons.push({ code: 'receptor-drawdown-limit', receptorId: r.id, message: receptorOverLimitMessage(r) });
  const cautions = [RECEPTOR_METHOD_CAUTION];
  results.forEach((r, i) => {
    const layer = receptors[i]!.compressibleLayer;
    const allow = receptors[i]!.allowableSettlement_m;
    cautions.push(...receptorCautions(r, layer && allow !== undefined ? drawdownForSettlement(allow, layer) : null));
  });
  return { results, reasons, cautions, limitsMet: results.every((r) => !r.flags.includes('drawdown-exceeds')) };
}
