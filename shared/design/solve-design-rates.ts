/**
 * Stages 4–5 of a design run: solve the rate problem in the chosen mode (closed form, LP or MIP)
 * and refine — add the check points still above target as rows, narrow the linearisation of the
 * well limits around the solution — until nothing changes (bounded rounds).
 */
import type { ControlPoint } from './control-points';
import { responseDot, type DesignContext } from './design-context';
import type { DesignResponses } from './design-responses';
import { findBindingLimits, solveLayout, solveOptimalRates, solveUniformRate, type RateProblem, type RateSolution } from './rate-problem';
import { RequirementRows } from './requirement-rows';
import { buildLimitRows, narrowIntervals, type BuildLimitRowsOptions } from './well-limits';

/** Most refinement rounds (each adds the check points still above target). */
export const MAX_REFINEMENT_ROUNDS = 10;
/** Most rounds that narrow the linearisation intervals of the well limits. */
export const MAX_TIGHTENING_ROUNDS = 4;
/** Most check points added per round. */
const MAX_ADDED_PER_ROUND = 400;

/** How the layout's integer search ended. */
export interface LayoutSearch {
  status: string;
  mipGap?: number;
}

/** The solved rates and how the solve went. */
export interface SolvedDesign {
  solution: RateSolution;
  /** The last problem solved (its rows name the binding limits). */
  problem: RateProblem;
  rows: RequirementRows;
  rounds: number;
  solveTime_ms: number;
  layoutSearch: LayoutSearch | null;
}

/**
 * Layout cost per m³: the option's cost plus the energy to lift it, estimated with the head from
 * the deepest target to ground (ρ·g·H/η per m³, in kWh: / 3.6e6 J).
 */
export function layoutCostPerCubicMetre(ctx: DesignContext): number {
  const { scenario, options } = ctx;
  const deepestTarget = Math.min(...scenario.excavations.map(ctx.targetOf), scenario.aquifer.staticLevel_m);
  const headEstimate_m = Math.max(0, scenario.groundLevel_m - deepestTarget) + options.dischargeHead_m + options.frictionAllowance_m;
  return options.pumpedVolumeCost_per_m3 + (options.energyPrice_per_kWh * 1000 * 9.80665 * headEstimate_m) / (options.pumpEfficiency * 3.6e6);
}

/** One solve in the run's mode. Layout: the first call chooses the wells (MIP), later ones refine their rates (LP). */
function createModeSolver(ctx: DesignContext, onLayout: (search: LayoutSearch) => void) {
  const { mode, options } = ctx;
  const nW = ctx.wells.length;
  const costPerM3 = mode === 'layout' ? layoutCostPerCubicMetre(ctx) : 0;
  return async (p: RateProblem, chosen: Uint8Array | null): Promise<RateSolution> => {
    if (nW === 0) return { status: 'infeasible', rates: new Float64Array(0), objective: 0, detail: 'no wells', criticalRow: -1 };
    if (p.required.length === 0) return { status: 'optimal', rates: new Float64Array(nW), objective: 0, detail: 'no lowering needed', criticalRow: -1 };
    if (mode === 'uniform') return solveUniformRate(p);
    if (mode === 'layout' && chosen !== null) return { ...(await solveOptimalRates(p)), installed: chosen };
    if (mode === 'layout') {
      const layout = await solveLayout(p, { wellCost: options.wellCost, pumpedVolumeCost_per_m3: costPerM3, duration_s: options.duration_s }, options.layoutTimeLimit_s);
      onLayout({ status: layout.status, ...(layout.mipGap !== undefined ? { mipGap: layout.mipGap } : {}) });
      return layout;
    }
    return solveOptimalRates(p);
  };
}

export interface SolveDesignRatesOptions {
  ctx: DesignContext;
  designPoints: ControlPoint[];
  checkPoints: ControlPoint[];
  responses: DesignResponses;
  /** Progress callback (stage name, fraction 0–1). */
  progress: (stage: string, fraction: number) => void;
  /**
   * Check points to add as rows from the start (indices into `checkPoints`): a re-solve of a
   * scaled design starts from the points the ordinary design needed, which saves rounds.
   */
  seedCheckPoints?: Iterable<number>;
}

/** Solves and refines the rates (see the file comment). */
export async function solveDesignRates({ ctx, designPoints, checkPoints, responses, progress, seedCheckPoints }: SolveDesignRatesOptions): Promise<SolvedDesign> {
  const { mode, wells } = ctx;
  const a = ctx.scenario.aquifer;
  const nW = wells.length;
  const limitInput: BuildLimitRowsOptions = {
    aquifer: a,
    wells,
    faceResponse: responses.face,
    variableForLevel: ctx.variableForLevel,
    levelForVariable: ctx.levelForVariable,
  };
  let limitSet = buildLimitRows(limitInput);
  // Layout: the set chosen by the first MIP; later rounds refine its rates by LP.
  let chosen: Uint8Array | null = null;
  const rows = new RequirementRows(ctx);
  designPoints.forEach((p, i) => rows.add(responses.design.subarray(i * nW, (i + 1) * nW), p));
  for (const i of seedCheckPoints ?? []) {
    if (rows.addedCheckPoints.has(i) || i < 0 || i >= checkPoints.length) continue;
    rows.addedCheckPoints.add(i);
    rows.add(responses.check.subarray(i * nW, (i + 1) * nW), checkPoints[i]!);
  }

  let layoutSearch: LayoutSearch | null = null;
  const solve = createModeSolver(ctx, (search) => (layoutSearch = search));
  let problem = rows.toProblem(limitSet, chosen);
  let solution: RateSolution;
  let rounds = 0;
  let tighteningRounds = 0;
  let restarted = false;
  let solveTime_ms = 0;
  // Confined/leaky rows are exact in the levels; only well loss and unconfined chords can be tightened.
  const canTighten = mode !== 'uniform' && (a.kind === 'unconfined' || wells.some((w) => w.wellLoss_s2_m5 > 0));
  const checkLevel = (i: number, rates: Float64Array) => ctx.levelForVariable(responseDot(responses.check, i, nW, rates));
  for (;;) {
    progress('solving', Math.min(0.5, 0.2 + 0.04 * rounds));
    const t0 = Date.now();
    solution = await solve(problem, chosen);
    solveTime_ms += Date.now() - t0;
    rounds++;
    if (mode === 'layout' && chosen === null && solution.installed && (solution.status === 'optimal' || solution.status === 'time-limit'))
      chosen = solution.installed;
    if (solution.status === 'error' || rounds >= MAX_REFINEMENT_ROUNDS) break;
    if (solution.status === 'infeasible' && (tighteningRounds > 0 || (mode === 'layout' && rounds > 1)) && !restarted) {
      // Narrowed intervals, or a layout chosen before control points were added, can exclude a
      // feasible design: start again once from the wide intervals and a fresh layout choice.
      restarted = true;
      tighteningRounds = MAX_TIGHTENING_ROUNDS;
      limitSet = buildLimitRows(limitInput);
      chosen = null;
      problem = rows.toProblem(limitSet, chosen);
      continue;
    }
    let changed = false;
    // When the solve is infeasible the best-achievable rates leave many points above target; adding
    // them cannot help, so refine control points only for a feasible solution.
    if (solution.status !== 'infeasible') changed = addViolatedCheckPoints(rows, checkPoints, responses.check, nW, (i) => checkLevel(i, solution.rates));
    const anyBinding = findBindingLimits(problem, solution.rates).some((b) => b !== null);
    if (canTighten && tighteningRounds < MAX_TIGHTENING_ROUNDS && (anyBinding || solution.status === 'infeasible') && solution.rates.some((q) => q > 0)) {
      const faceValues = Float64Array.from(wells, (_, j) => responseDot(responses.face, j, nW, solution.rates));
      limitSet = buildLimitRows({ ...limitInput, intervals: narrowIntervals(limitSet.intervals, faceValues, solution.rates) });
      tighteningRounds++;
      changed = true;
    }
    if (!changed) break;
    problem = rows.toProblem(limitSet, chosen);
  }
  return { solution, problem, rows, rounds, solveTime_ms, layoutSearch };
}

/** Adds the check points standing highest above target (at most MAX_ADDED_PER_ROUND); true when any was. */
function addViolatedCheckPoints(rows: RequirementRows, checkPoints: ControlPoint[], checkResponse: Float64Array, nW: number, levelAt: (i: number) => number): boolean {
  const violated: Array<{ i: number; over: number }> = [];
  checkPoints.forEach((p, i) => {
    if (rows.addedCheckPoints.has(i) || !Number.isFinite(rows.requiredFor(p))) return;
    const over = levelAt(i) - p.targetLevel_m;
    if (over > 0) violated.push({ i, over });
  });
  violated.sort((x, y) => y.over - x.over);
  for (const { i } of violated.slice(0, MAX_ADDED_PER_ROUND)) {
    rows.addedCheckPoints.add(i);
    rows.add(checkResponse.subarray(i * nW, (i + 1) * nW), checkPoints[i]!);
  }
  return violated.length > 0;
}
