/**
 * Stage 8 of a design run: why a target is not met, in words, with stable codes — targets below
 * the aquifer base, wells at their limits, points no well reaches, constant-head boundaries
 * feeding the wells, the solver's own state and what verification found.
 */
import type { ControlPoint } from './control-points';
import { designResponse, responseDot, type DesignContext } from './design-context';
import type { DesignExcavationResult, DesignReason } from './design-result';
import { formatFigure as fmt, listIds } from './design-wording';
import type { findBindingLimits, RateSolution } from './rate-problem';
import type { RequirementRows } from './requirement-rows';

export interface ExplainDesignOptions {
  ctx: DesignContext;
  checkPoints: ControlPoint[];
  checkResponse: Float64Array;
  rows: RequirementRows;
  solution: RateSolution;
  rounds: number;
  binding: ReturnType<typeof findBindingLimits>;
  excavations: DesignExcavationResult[];
  userPointsMet: boolean;
  verificationIssues: string[];
}

/** Check points whose target no rate can reach (below the base of an unconfined aquifer). */
export function findUnreachablePoints(rows: RequirementRows, checkPoints: ControlPoint[]): ControlPoint[] {
  return checkPoints.filter((p) => !Number.isFinite(rows.requiredFor(p)));
}

/** The reasons of a design result (empty when everything is met). */
export function explainDesign({ ctx, checkPoints, checkResponse, rows, solution, rounds, binding, excavations, userPointsMet, verificationIssues }: ExplainDesignOptions): DesignReason[] {
  const { scenario, options, mode, wells } = ctx;
  const a = scenario.aquifer;
  const nW = wells.length;
  const rates = solution.rates;
  const unreachable = findUnreachablePoints(rows, checkPoints);
  const reasons: DesignReason[] = [];
  for (const e of scenario.excavations) {
    if (unreachable.some((p) => p.excavationId === e.id))
      reasons.push({
        code: 'target-below-aquifer-base',
        excavationId: e.id,
        message: `Excavation "${e.id}": its target level ${fmt(ctx.targetOf(e), 4)} m lies below the aquifer base (${a.base_m} m); ${a.kind === 'unconfined' ? 'wells in an unconfined aquifer cannot lower groundwater below the base' : `the ${a.kind} aquifer would be drained before the head reached it (the head is held at the base and flagged "dewatered")`} — consider a cut-off, sump pumping at the base, or check the ground model.`,
      });
  }
  if (nW === 0)
    reasons.push({
      code: 'no-active-wells',
      message: mode === 'layout' ? 'The scenario has no wells to choose from: add candidate wells.' : 'No active wells: add wells, or mark candidates active (or use layout mode).',
    });
  const anyUnmet = excavations.some((e) => !e.met) || !userPointsMet;
  if (anyUnmet && nW > 0) {
    const noInfluence = checkPoints.filter((p, i) => {
      const required = rows.requiredFor(p);
      if (!Number.isFinite(required) || required <= 0) return false;
      let s = 0;
      for (let j = 0; j < nW; j++) s += Math.max(0, checkResponse[i * nW + j]!);
      return !(s > 0);
    });
    if (noInfluence.length > 0)
      reasons.push({
        code: 'no-well-influence',
        message: `${noInfluence.length} control point(s) (first at ${fmt(noInfluence[0]!.x, 7)}, ${fmt(noInfluence[0]!.y, 7)}) are not lowered by any well: they lie on or beyond a boundary, or beyond the radius of influence of every well.`,
      });
    const group = (kind: 'capacity' | 'wetted-screen' | 'suction-lift' | 'air-entry') => wells.filter((_, j) => rates[j]! > 0 && binding[j] === kind).map((w) => w.id);
    const atCapacity = group('capacity');
    if (atCapacity.length > 0)
      reasons.push({
        code: 'well-capacity',
        wellIds: atCapacity,
        message: `${atCapacity.length} well(s) pump at their allowed Sichardt capacity (× ${options.capacityUtilisationFactor}) with the whole screen wetted (${listIds(atCapacity)}): more wells, larger radius or longer screens are needed.`,
      });
    const wetted = group('wetted-screen');
    if (wetted.length > 0)
      reasons.push({
        code: 'wetted-screen',
        wellIds: wetted,
        message: `${wetted.length} well(s) are drawn down so far that the wetted screen left limits their yield (${listIds(wetted)}): the wells dewater themselves; deepen the screens or add wells.`,
      });
    const suction = group('suction-lift');
    if (suction.length > 0)
      reasons.push({
        code: 'suction-lift',
        wellIds: suction,
        message: `${suction.length} well point(s) reach the suction-lift limit (pumping level ${options.suctionLiftLimit_m} m below the header at ${fmt(options.headerLevel_m, 4)} m) (${listIds(suction)}): use deep wells or ejectors, lower the header, or add a second stage.`,
      });
    const air = group('air-entry');
    if (air.length > 0)
      reasons.push({
        code: 'air-entry',
        wellIds: air,
        message: `${air.length} well point(s) are drawn down to their screen top, where they would suck air (${listIds(air)}): set the screens deeper, add well points, or use deep wells or ejectors.`,
      });
    reasons.push(...constantHeadReasons(ctx, excavations, rates));
    if (reasons.length === 0 || (reasons.every((r) => r.code === 'target-below-aquifer-base') && unreachable.length === 0))
      reasons.push({
        code: 'solver',
        message: `The targets were not all met after ${rounds} solve round(s) (${solution.detail}); refine the control spacing or check the scenario.`,
      });
  }
  if (solution.status === 'error') reasons.push({ code: 'solver', message: `The solver failed: ${solution.detail}.` });
  for (const issue of verificationIssues) reasons.push({ code: 'solver', message: `Verification: ${issue}.` });
  for (const e of excavations)
    if (!e.met && !reasons.some((r) => r.excavationId === e.id))
      reasons.unshift({
        code: reasons[0]?.code ?? 'solver',
        excavationId: e.id,
        message: `Excavation "${e.id}" is not met: ${e.pointsAboveTarget} of ${e.checkPointCount} check points stay above the target ${fmt(e.targetLevel_m, 4)} m; best achievable level ${fmt(e.critical.level_m, 4)} m at (${fmt(e.critical.x, 8)}, ${fmt(e.critical.y, 8)}), ${fmt(e.worstShortfall_m)} m above the target (the control points are listed in controlPoints).`,
      });
  return reasons;
}

/** Reasons naming a constant-head boundary that holds the level up at an unmet critical point. */
function constantHeadReasons(ctx: DesignContext, excavations: DesignExcavationResult[], rates: Float64Array): DesignReason[] {
  const lines = (ctx.scenario.boundaries ?? []).map((b, index) => ({ b, index })).filter(({ b }) => b.kind === 'constant-head');
  if (lines.length === 0) return [];
  const reasons: DesignReason[] = [];
  const without: DesignContext = {
    ...ctx,
    matrixScenario: { ...ctx.matrixScenario, boundaries: (ctx.scenario.boundaries ?? []).filter((b) => b.kind !== 'constant-head') },
  };
  for (const e of excavations) {
    if (e.met) continue;
    const pt = [[e.critical.x, e.critical.y] as const];
    const nW = ctx.wells.length;
    const withB = ctx.levelForVariable(responseDot(designResponse(ctx, pt, ctx.designTime_s), 0, nW, rates));
    const withoutB = ctx.levelForVariable(responseDot(designResponse(without, pt, ctx.designTime_s), 0, nW, rates));
    const gain = withB - withoutB;
    if (gain > Math.max(0.05, 0.25 * e.worstShortfall_m)) {
      const nearest = lines
        .map(({ b, index }) => {
          const [x1, y1] = b.from;
          const [x2, y2] = b.to;
          const d = Math.abs((x2 - x1) * (y1 - e.critical.y) - (x1 - e.critical.x) * (y2 - y1)) / Math.hypot(x2 - x1, y2 - y1);
          return { d, index, label: b.label };
        })
        .sort((p, q) => p.d - q.d)[0]!;
      reasons.push({
        code: 'constant-head-boundary',
        excavationId: e.id,
        message: `Excavation "${e.id}": the constant-head boundary ${nearest.label ? `"${nearest.label}" ` : ''}(/boundaries/${nearest.index}) ${fmt(nearest.d)} m from the critical point feeds the wells; without it the same rates would lower the level there by ${fmt(gain)} m more. Wells between the excavation and the boundary, a cut-off, or more capacity are needed.`,
      });
    }
  }
  return reasons;
}
