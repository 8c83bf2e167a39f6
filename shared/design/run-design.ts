/**
 * The design solver: rates that bring every control point to its target at the design time,
 * within every well's limits; then times, standby checks and the pump and bid summary.
 *
 * Stages, one file each: setup and control points (`design-setup.ts`) → unit responses
 * (`design-responses.ts`) → requirement and limit rows (`requirement-rows.ts`, `well-limits.ts`)
 * → solve and refine (`solve-design-rates.ts`: closed form, LP or MIP; check points above target
 * added, limit linearisation narrowed, bounded rounds) → verify with the field engine's own
 * evaluation (`verify-design.ts`) → excavations (`excavation-results.ts`) → reasons
 * (`design-reasons.ts`) → times (`design-times.ts`) → one well out (`out-of-service-check.ts`) →
 * quick check (`quick-check.ts`) → bid summary (`bid-summary.ts`) → cautions
 * (`design-run-cautions.ts`). A new check is a new stage here, not a branch inside another.
 */
import { findScenarioWarnings } from '../schema';
import type { DesignResult } from './design-result';
import { summariseDesign } from './bid-summary';
import { computeTimes } from './design-times';
import { prepareDesign, placeDesignPoints, type RunDesignOptions } from './design-setup';
import { computeDesignResponses } from './design-responses';
import { solveDesignRates } from './solve-design-rates';
import { roundDesignRates } from './round-design-rates';
import { verifyDesign } from './verify-design';
import { areUserPointsMet, buildControlPointResults, summariseExcavations } from './excavation-results';
import { explainDesign, findUnreachablePoints } from './design-reasons';
import { checkOneWellOut } from './out-of-service-check';
import { buildQuickChecks } from './quick-check';
import { collectDesignCautions } from './design-run-cautions';
import { checkFloors } from './floor-stage';
import { floorCautions } from '../floor';
import { describeRounding, STEADY_RECOVERY_CAUTION } from './design-wording';
import { createDesignBasis } from './scaled-design';
import { buildSensitivityTable } from './sensitivity-stage';
import { buildRobustDesigns } from './robust-design';
import { planMonteCarlo, runMonteCarlo, summariseMonteCarlo } from './monte-carlo';

/**
 * Runs a design. Throws `DrydigError` naming the field for bad input; never returns NaN
 * silently: results outside a method's validity carry flags, reasons and cautions.
 */
export async function runDesign(input: RunDesignOptions): Promise<DesignResult> {
  const started = Date.now();
  const progress = input.onProgress ?? (() => undefined);
  const { ctx, endTime_s } = prepareDesign(input);
  const { scenario, options, wells, mode } = ctx;

  progress('control points', 0.05);
  const { designPoints, checkPoints } = placeDesignPoints(ctx);

  progress('unit responses', 0.1);
  const responses = computeDesignResponses(ctx, designPoints, checkPoints);

  const { solution, problem, rows, rounds, solveTime_ms, layoutSearch } = await solveDesignRates({ ctx, designPoints, checkPoints, responses, progress });
  // Practical rates (minimum, step) before verification, so the field engine re-checks the rounded design.
  const { rates, rounding } = roundDesignRates({ rates: solution.rates, wellIds: wells.map((w) => w.id), options });
  const installed = solution.installed ?? new Uint8Array(wells.length).fill(1);

  progress('verifying', 0.55);
  const verified = verifyDesign({ ctx, rates, installed, problem, checkPoints });
  const { pointResults, wellResults, verificationIssues } = verified;
  const addedCheckPoints = rows.addedCheckPoints;
  const excavations = summariseExcavations({ ctx, designPoints, checkPoints, addedCheckPoints, pointResults });
  const userPointsMet = areUserPointsMet(checkPoints, pointResults);
  const reasons = explainDesign({
    ctx,
    checkPoints,
    checkResponse: responses.check,
    rows,
    solution,
    rounds,
    binding: verified.binding,
    excavations,
    userPointsMet,
    verificationIssues,
  });
  const feasible =
    wells.length > 0 &&
    solution.status !== 'error' &&
    excavations.every((e) => e.met) &&
    userPointsMet &&
    findUnreachablePoints(rows, checkPoints).length === 0 &&
    verificationIssues.length === 0;

  progress('times', 0.65);
  const refinedDesignPoints = [...designPoints, ...[...addedCheckPoints].map((i) => checkPoints[i]!)];
  const times = computeTimes({ ctx, rates, designPoints: refinedDesignPoints, excavations, feasible });

  progress('floor checks', 0.8);
  const floors = checkFloors({ ctx, rates, checkPoints, pointLevels_m: pointResults.map((r) => r.level_m) });

  progress('standby check', 0.85);
  const outOfService = checkOneWellOut(ctx, checkPoints, responses.check, rates);

  const total = rates.reduce((s, q) => s + q, 0);
  const quickCheck = buildQuickChecks(ctx, total);
  const summary = summariseDesign({ scenario, options, wells, wellResults, rates, installed });
  const cautions = collectDesignCautions({
    ctx,
    rates,
    solved: verified.solved,
    endTime_s,
    pointResults,
    wellResults,
    layoutSearch,
    solvedOptimally: solution.status === 'optimal',
    designPointCount: designPoints.length,
  });
  cautions.push(...floorCautions([...floors].map(([excavationId, f]) => ({ excavationId, ...f }))));
  if (ctx.designTime_s === null && rates.some((q) => q > 0)) cautions.push(STEADY_RECOVERY_CAUTION);

  // The unknowns: sensitivity table, robust designs, Monte Carlo — all re-solves from one basis.
  const basis = createDesignBasis({ ctx, options: input.options, designPoints, checkPoints, addedCheckPoints, rates, installed });
  input.onBasis?.(basis);
  progress('sensitivity', 0.88);
  const sensitivity = await buildSensitivityTable(ctx, basis);
  progress('robust designs', 0.9);
  const robust = await buildRobustDesigns(options, basis, total);
  let uncertainty = null;
  if (options.monteCarlo && !input.monteCarlo?.defer) {
    const plan = planMonteCarlo(scenario, options.monteCarlo);
    const t0 = Date.now();
    const outcomes = await runMonteCarlo({
      basis,
      plan,
      ...(input.monteCarlo?.runChunk ? { runChunk: input.monteCarlo.runChunk } : {}),
      concurrency: input.monteCarlo?.concurrency ?? 1,
      ...(input.monteCarlo?.signal ? { signal: input.monteCarlo.signal } : {}),
      onProgress: (done, runs) => progress(`monte carlo ${done}/${runs}`, 0.92 + (0.08 * done) / runs),
    });
    uncertainty = summariseMonteCarlo({ plan, outcomes, elapsed_ms: Date.now() - t0, workers: input.monteCarlo?.workers ?? 0, summary });
  }
  progress('done', 1);
  return {
    mode,
    feasible,
    totalRate_m3_s: total,
    wells: wellResults,
    excavations: excavations.map((e) => ({ ...e, ...(times.excavations.get(e.id) ?? {}), ...(floors.has(e.id) ? { floor: floors.get(e.id)! } : {}) })),
    reasons,
    designTime_s: ctx.designTime_s,
    limitCheckTime_s: ctx.limitTime_s,
    controlPoints: buildControlPointResults(designPoints, checkPoints, addedCheckPoints, pointResults, times.pointTimes),
    timeSeries: times.series,
    outOfService,
    summary,
    quickCheck,
    ...(mode === 'layout' ? { chosenWellIds: wells.filter((_, j) => installed[j] === 1 && rates[j]! > 0).map((w) => w.id) } : {}),
    solver: {
      status: solution.status,
      rounds,
      objective: solution.objective,
      ...(layoutSearch !== null ? { layoutStatus: layoutSearch.status, ...(layoutSearch.mipGap !== undefined ? { mipGap: layoutSearch.mipGap } : {}) } : {}),
      solveTime_ms: Math.max(solveTime_ms, 0),
    },
    cautions: rounding === null ? cautions : [...cautions, describeRounding(rounding)],
    ...(rounding !== null ? { rateRounding: rounding } : {}),
    ...(sensitivity ? { sensitivity } : {}),
    ...(robust ? { robust } : {}),
    ...(uncertainty ? { uncertainty } : {}),
    modelNotes: [...verified.modelNotes, `Design run took ${Date.now() - started} ms.`],
    warnings: findScenarioWarnings(scenario, input.scenarioPath ?? ''),
  };
}
