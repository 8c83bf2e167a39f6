/**
 * The design solver: rates that bring every control point to its target at the design time,
 * within every well's limits; then times, standby checks and the pump and bid summary.
 *
 * Steps: control points → unit responses (field engine) → linear rows (`rate-problem.ts`,
 * `well-limits.ts`) → solve (closed form, LP or MIP) → check on a grid twice as dense, adding
 * control points where a level stands above target, until none does (bounded rounds) → verify
 * with the field engine's own evaluation of the solved rates → report.
 */
import { DrydigError, parseScenario, type DesignMode } from '../schema';
import { equivalentWellInflow, evaluatePoints, wellLevels, type PointResult } from '../field';
import { generateControlPoints, getExcavationTargetLevel, type ControlPoint } from './control-points';
import { resolveDesignOptions } from './design-options';
import type {
  DesignControlPointResult,
  DesignExcavationResult,
  DesignReason,
  DesignResult,
  DesignWellResult,
  OutOfServiceCheck,
  QuickCheck,
} from './design-result';
import {
  findBindingLimits,
  solveLayout,
  solveOptimalRates,
  solveUniformRate,
  type RateProblem,
  type RateSolution,
} from './rate-problem';
import { sichardtCapacity, wettedScreenLength } from './sichardt-capacity';
import { buildDesignWells, buildLimitRows, narrowIntervals } from './well-limits';
import { summariseDesign } from './bid-summary';
import { applyDesignRates, designResponse, variableConversions, type DesignContext } from './design-context';
import { computeTimes } from './design-times';

/**
 * The design asks for the target less this, m, so the engine's evaluation lands at or below the
 * target despite the LP’s tolerances and between control points (1 mm: far inside the 1 cm acceptance).
 */
export const DESIGN_TOLERANCE_M = 1e-3;
/** Most refinement rounds (each adds the check points still above target). */
export const MAX_REFINEMENT_ROUNDS = 10;
/** Most rounds that narrow the linearisation intervals of the well limits. */
export const MAX_TIGHTENING_ROUNDS = 4;
/**
 * Largest unit-response matrix one design may build (check points × design wells): 5 million
 * entries is 40 MB of Float64 and a few seconds of well-function evaluations.
 */
export const MAX_RESPONSE_ENTRIES = 5_000_000;
/** Most check points added per round. */
const MAX_ADDED_PER_ROUND = 400;

export interface RunDesignOptions {
  /** The scenario (validated here; bad fields are named with `scenarioPath` in front). */
  scenario: unknown;
  /** Solve mode; default the scenario's designOptions.mode, else 'optimal'. */
  mode?: DesignMode;
  /** Option overrides (CLI flags, API options), field by field over scenario.designOptions. */
  options?: unknown;
  /** JSON pointer of the scenario in the request for messages. Default ''. */
  scenarioPath?: string;
  /** JSON pointer of the options for messages. Default '/options'. */
  optionsPath?: string;
  /** Progress callback (stage name, fraction 0–1) for long runs. */
  onProgress?: (stage: string, fraction: number) => void;
}

function dot(matrix: Float64Array, row: number, nW: number, rates: Float64Array): number {
  let s = 0;
  for (let j = 0; j < nW; j++) s += matrix[row * nW + j]! * rates[j]!;
  return s;
}

const fmt = (v: number, digits = 3) => Number(v.toPrecision(digits)).toString();
const litres = (q_m3_s: number) => `${fmt(q_m3_s * 1000)} L/s`;

/**
 * Runs a design. Throws `DrydigError` naming the field for bad input; never returns NaN
 * silently: results outside a method's validity carry flags, reasons and cautions.
 */
export async function runDesign(input: RunDesignOptions): Promise<DesignResult> {
  const started = Date.now();
  const progress = input.onProgress ?? (() => undefined);
  const scenario = parseScenario(input.scenario, input.scenarioPath ?? '');
  const options = resolveDesignOptions({ scenario, overrides: input.options, overridesPath: input.optionsPath ?? '/options' });
  const mode: DesignMode = input.mode ?? options.mode;
  const a = scenario.aquifer;

  const startOf = new Map<string, number>();
  for (const stage of options.stages) for (const id of stage.wellIds) startOf.set(id, stage.start_s);
  const indices = scenario.wells.map((w, i) => ({ w, i })).filter(({ w }) => mode === 'layout' || w.active !== false).map(({ i }) => i);
  const wells = buildDesignWells({ scenario, indices, startOf, headerLevel_m: options.headerLevel_m, suctionLiftLimit_m: options.suctionLiftLimit_m });
  const nW = wells.length;
  if (options.outOfServiceWell !== null && !wells.some((w) => w.id === options.outOfServiceWell)) {
    const path = `${input.options !== undefined && (input.options as Record<string, unknown>).outOfServiceWell !== undefined ? (input.optionsPath ?? '/options') : '/designOptions'}/outOfServiceWell`;
    throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', `${path}: well "${options.outOfServiceWell}" is not one of the design wells (inactive wells are not pumped)`, [
      { path, message: `well "${options.outOfServiceWell}" is not one of the design wells (inactive wells are not pumped)` },
    ]);
  }
  const designTime_s = scenario.design.time_s;
  // Well limits hold in the design state (design time). Constant rates kept on beyond it draw the
  // wells lower still; that is checked at the end of pumping and reported as a caution.
  const limitTime_s = designTime_s;
  const endTime_s = designTime_s === null ? null : Math.max(designTime_s, options.duration_s);
  const ctx: DesignContext = {
    scenario,
    options,
    mode,
    wells,
    matrixScenario: { ...scenario, wells: scenario.wells.map((w) => ({ ...w, active: false })) },
    designTime_s,
    limitTime_s,
    ...variableConversions(scenario),
  };

  progress('control points', 0.05);
  const pointOptions = {
    excavations: scenario.excavations,
    spacing_m: options.controlSpacing_m,
    userPoints: options.controlPoints,
    userPointsPath: options.controlPointsPath,
    spacingPath: options.controlSpacingPath,
  };
  const designPoints = generateControlPoints(pointOptions);
  const checkPoints = generateControlPoints({ ...pointOptions, densify: 2 });
  const xy = (p: ControlPoint) => [p.x, p.y] as const;
  if (checkPoints.length * nW > MAX_RESPONSE_ENTRIES) {
    const path = options.controlSpacingPath;
    throw new DrydigError(
      'DRYDIG_ERR_INVALID_REQUEST',
      `${path}: ${checkPoints.length} check points × ${nW} wells is more than the ${MAX_RESPONSE_ENTRIES} unit responses one design may use; give a coarser control spacing or fewer candidate wells`,
      [{ path, message: `gives ${checkPoints.length} check points for ${nW} wells; use a coarser spacing or fewer candidate wells` }],
    );
  }

  progress('unit responses', 0.1);
  const checkResponse = designResponse(ctx, checkPoints.map(xy), designTime_s);
  const designResponseMatrix = designResponse(ctx, designPoints.map(xy), designTime_s);
  // At the well's own axis the engine evaluates its own well at r_w and every other well at the
  // axis distance — the same point the engine's wellLevels() reports.
  const faceResponse = designResponse(
    ctx,
    wells.map((w) => [w.x, w.y] as const),
    limitTime_s,
  );
  const limitInput = { aquifer: a, wells, faceResponse, variableForLevel: ctx.variableForLevel, levelForVariable: ctx.levelForVariable };
  let limitSet = buildLimitRows(limitInput);
  // Layout: the set chosen by the first MIP; later rounds refine its rates by LP.
  let chosen: Uint8Array | null = null;

  // Requirement rows: "level ≤ target − tolerance" ⇔ Σ a_ij·Q_j ≥ variable(target − tolerance).
  const requiredFor = (p: ControlPoint) => ctx.variableForLevel(p.targetLevel_m - DESIGN_TOLERANCE_M);
  const unreachable = checkPoints.filter((p) => !Number.isFinite(requiredFor(p)));
  const rowResponses: Float64Array[] = [];
  const rowRequired: number[] = [];
  const rowPoints: ControlPoint[] = [];
  const addRow = (response: Float64Array, p: ControlPoint) => {
    const r = requiredFor(p);
    if (!Number.isFinite(r) || r <= 0) return;
    rowResponses.push(response);
    rowRequired.push(r);
    rowPoints.push(p);
  };
  designPoints.forEach((p, i) => addRow(designResponseMatrix.subarray(i * nW, (i + 1) * nW), p));
  const inDesign = new Set<number>();

  const buildProblem = (): RateProblem => {
    const response = new Float64Array(rowResponses.length * nW);
    rowResponses.forEach((r, i) => response.set(r, i * nW));
    const keep = (j: number) => chosen === null || chosen[j] === 1;
    return {
      nWells: nW,
      response,
      required: Float64Array.from(rowRequired),
      limits: limitSet.limits.filter((l) => keep(l.wellIndex)),
      upper: limitSet.upper.map((u, j) => (keep(j) ? u : 0)),
      lower: limitSet.lower.map((v, j) => (keep(j) ? v : 0)),
      upperKind: limitSet.upperKind,
    };
  };

  // Layout cost per m³: the option's cost plus the energy to lift it, estimated with the head from
  // the deepest target to ground (ρ·g·H/η per m³, in kWh: / 3.6e6 J).
  const deepestTarget = Math.min(...scenario.excavations.map(getExcavationTargetLevel), a.staticLevel_m);
  const headEstimate_m = Math.max(0, scenario.groundLevel_m - deepestTarget) + options.dischargeHead_m + options.frictionAllowance_m;
  const layoutCostPerM3 = options.pumpedVolumeCost_per_m3 + (options.energyPrice_per_kWh * 1000 * 9.80665 * headEstimate_m) / (options.pumpEfficiency * 3.6e6);
  let layoutSearch: { status: string; mipGap?: number } | null = null;
  const solve = async (p: RateProblem): Promise<RateSolution> => {
    if (nW === 0) return { status: 'infeasible', rates: new Float64Array(0), objective: 0, detail: 'no wells', criticalRow: -1 };
    if (p.required.length === 0) return { status: 'optimal', rates: new Float64Array(nW), objective: 0, detail: 'no lowering needed', criticalRow: -1 };
    if (mode === 'uniform') return solveUniformRate(p);
    if (mode === 'layout' && chosen !== null) return { ...(await solveOptimalRates(p)), installed: chosen };
    if (mode === 'layout') {
      const layout = await solveLayout(p, { wellCost: options.wellCost, pumpedVolumeCost_per_m3: layoutCostPerM3, duration_s: options.duration_s }, options.layoutTimeLimit_s);
      layoutSearch = { status: layout.status, ...(layout.mipGap !== undefined ? { mipGap: layout.mipGap } : {}) };
      return layout;
    }
    return solveOptimalRates(p);
  };

  let problem = buildProblem();
  let solution: RateSolution;
  let rounds = 0;
  let tighteningRounds = 0;
  let restarted = false;
  let solveTime_ms = 0;
  // Confined/leaky rows are exact in the levels; only well loss and unconfined chords can be tightened.
  const canTighten = mode !== 'uniform' && (a.kind === 'unconfined' || wells.some((w) => w.wellLoss_s2_m5 > 0));
  const checkLevel = (i: number, rates: Float64Array) => ctx.levelForVariable(dot(checkResponse, i, nW, rates));
  for (;;) {
    progress('solving', Math.min(0.5, 0.2 + 0.04 * rounds));
    const t0 = Date.now();
    solution = await solve(problem);
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
      problem = buildProblem();
      continue;
    }
    let changed = false;
    // When the solve is infeasible the best-achievable rates leave many points above target; adding
    // them cannot help, so refine control points only for a feasible solution.
    if (solution.status !== 'infeasible') {
      const violated: Array<{ i: number; over: number }> = [];
      checkPoints.forEach((p, i) => {
        if (inDesign.has(i) || !Number.isFinite(requiredFor(p))) return;
        const over = checkLevel(i, solution.rates) - p.targetLevel_m;
        if (over > 0) violated.push({ i, over });
      });
      violated.sort((x, y) => y.over - x.over);
      for (const { i } of violated.slice(0, MAX_ADDED_PER_ROUND)) {
        inDesign.add(i);
        addRow(checkResponse.subarray(i * nW, (i + 1) * nW), checkPoints[i]!);
      }
      changed = violated.length > 0;
    }
    const anyBinding = findBindingLimits(problem, solution.rates).some((b) => b !== null);
    if (canTighten && tighteningRounds < MAX_TIGHTENING_ROUNDS && (anyBinding || solution.status === 'infeasible') && solution.rates.some((q) => q > 0)) {
      const faceValues = Float64Array.from(wells, (_, j) => dot(faceResponse, j, nW, solution.rates));
      limitSet = buildLimitRows({ ...limitInput, intervals: narrowIntervals(limitSet.intervals, faceValues, solution.rates) });
      tighteningRounds++;
      changed = true;
    }
    if (!changed) break;
    problem = buildProblem();
  }
  const rates = solution.rates;
  const installed = solution.installed ?? new Uint8Array(nW).fill(1);

  progress('verifying', 0.55);
  const solved = applyDesignRates(scenario, wells, rates);
  const verify = evaluatePoints({ scenario: solved, points: checkPoints.map(xy), time_s: designTime_s });
  const levels = wellLevels({ scenario: solved, time_s: limitTime_s });
  const binding = findBindingLimits(problem, rates);

  // Wells.
  const verificationIssues: string[] = [];
  const wellResults: DesignWellResult[] = wells.map((w, j) => {
    const level = levels[w.scenarioIndex]!;
    const q = rates[j]!;
    const capacity = sichardtCapacity({
      radius_m: w.radius_m,
      wettedLength_m: wettedScreenLength(w.screenTop_m, w.screenBottom_m, level.pumpingLevel_m),
      conductivity_m_s: a.conductivity_m_s,
    });
    if (q > 0 && q > capacity * (1 + 1e-6)) verificationIssues.push(`well ${w.id} pumps ${litres(q)}, above its Sichardt capacity ${litres(capacity)} at the verified pumping level`);
    if (q > 0 && level.pumpingLevel_m < w.minimumLevel_m - 1e-6)
      verificationIssues.push(`well ${w.id}: pumping level ${fmt(level.pumpingLevel_m, 4)} m is below its floor ${fmt(w.minimumLevel_m, 4)} m`);
    return {
      id: w.id,
      kind: w.kind,
      x: w.x,
      y: w.y,
      rate_m3_s: q,
      // Layout: a chosen well the refined rates leave idle need not be installed.
      installed: installed[j] === 1 && (mode !== 'layout' || q > 0),
      start_s: w.start_s,
      capacity_m3_s: capacity,
      fullScreenCapacity_m3_s: w.fullScreenCapacity_m3_s,
      utilisation: capacity > 0 ? q / capacity : q > 0 ? null : 0,
      pumpingLevel_m: level.pumpingLevel_m,
      minimumPumpingLevel_m: w.minimumLevel_m,
      limit: q > 0 ? binding[j]! : null,
      head_m: null,
      flags: level.flags,
    };
  });

  // Excavations.
  const pointResults: PointResult[] = verify.points;
  const excavations: DesignExcavationResult[] = scenario.excavations.map((e) => {
    let worst = -Infinity;
    let at = -1;
    let designCount = 0;
    let checkCount = 0;
    let above = 0;
    checkPoints.forEach((p, i) => {
      if (p.excavationId !== e.id) return;
      checkCount++;
      const over = pointResults[i]!.level_m - p.targetLevel_m;
      if (over > 0) above++;
      if (over > worst) {
        worst = over;
        at = i;
      }
    });
    for (const p of designPoints) if (p.excavationId === e.id) designCount++;
    const cp = checkPoints[at]!;
    return {
      id: e.id,
      targetLevel_m: getExcavationTargetLevel(e),
      formationLevel_m: e.formationLevel_m,
      met: worst <= 0,
      worstShortfall_m: worst,
      critical: { x: cp.x, y: cp.y, level_m: pointResults[at]!.level_m, targetLevel_m: cp.targetLevel_m, kind: cp.kind },
      timeToTarget_s: null,
      recoveryToFormation_s: null,
      criticalRecoveryToFormation_s: null,
      controlPointCount: designCount + [...inDesign].filter((i) => checkPoints[i]!.excavationId === e.id).length,
      checkPointCount: checkCount,
      pointsAboveTarget: above,
    };
  });
  const userPointsMet = checkPoints.every((p, i) => p.excavationId !== null || pointResults[i]!.level_m <= p.targetLevel_m);

  // Reasons.
  const reasons: DesignReason[] = [];
  for (const e of scenario.excavations) {
    if (unreachable.some((p) => p.excavationId === e.id))
      reasons.push({
        code: 'target-below-aquifer-base',
        excavationId: e.id,
        message: `Excavation "${e.id}": its target level ${fmt(getExcavationTargetLevel(e), 4)} m lies below the aquifer base (${a.base_m} m); wells in an unconfined aquifer cannot lower groundwater below the base — consider a cut-off, sump pumping at the base, or check the ground model.`,
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
      if (!Number.isFinite(requiredFor(p)) || requiredFor(p) <= 0) return false;
      let s = 0;
      for (let j = 0; j < nW; j++) s += Math.max(0, checkResponse[i * nW + j]!);
      return !(s > 0);
    });
    if (noInfluence.length > 0)
      reasons.push({
        code: 'no-well-influence',
        message: `${noInfluence.length} control point(s) (first at ${fmt(noInfluence[0]!.x, 7)}, ${fmt(noInfluence[0]!.y, 7)}) are not lowered by any well: they lie on or beyond a boundary, or beyond the radius of influence of every well.`,
      });
    const group = (kind: 'capacity' | 'wetted-screen' | 'suction-lift') => wells.filter((_, j) => rates[j]! > 0 && binding[j] === kind).map((w) => w.id);
    const list = (ids: string[]) => (ids.length > 8 ? `${ids.slice(0, 8).join(', ')} and ${ids.length - 8} more` : ids.join(', '));
    const atCapacity = group('capacity');
    if (atCapacity.length > 0)
      reasons.push({
        code: 'well-capacity',
        wellIds: atCapacity,
        message: `${atCapacity.length} well(s) pump at their Sichardt capacity with the whole screen wetted (${list(atCapacity)}): more wells, larger radius or longer screens are needed.`,
      });
    const wetted = group('wetted-screen');
    if (wetted.length > 0)
      reasons.push({
        code: 'wetted-screen',
        wellIds: wetted,
        message: `${wetted.length} well(s) are drawn down so far that the wetted screen left limits their yield (${list(wetted)}): the wells dewater themselves; deepen the screens or add wells.`,
      });
    const suction = group('suction-lift');
    if (suction.length > 0)
      reasons.push({
        code: 'suction-lift',
        wellIds: suction,
        message: `${suction.length} well point(s) reach the suction-lift limit (pumping level ${options.suctionLiftLimit_m} m below the header at ${fmt(options.headerLevel_m, 4)} m) (${list(suction)}): use deep wells or ejectors, lower the header, or add a second stage.`,
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

  const feasible =
    nW > 0 && solution.status !== 'error' && excavations.every((e) => e.met) && userPointsMet && unreachable.length === 0 && verificationIssues.length === 0;

  // Times, recovery and the chart.
  progress('times', 0.65);
  const times = computeTimes({ ctx, rates, designPoints: [...designPoints, ...[...inDesign].map((i) => checkPoints[i]!)], excavations });

  // One well out of service.
  progress('standby check', 0.85);
  const outOfService = outOfServiceCheck(ctx, checkPoints, checkResponse, rates);

  // Quick check.
  const total = rates.reduce((s, q) => s + q, 0);
  const quickCheck: QuickCheck[] = scenario.excavations.map((e) => {
    const shared = scenario.excavations.length > 1 ? ' The superposition total serves every excavation.' : '';
    try {
      const c = equivalentWellInflow({ scenario, excavationId: e.id, time_s: designTime_s });
      return {
        excavationId: e.id,
        equivalentWellInflow_m3_s: c.rate_m3_s,
        equivalentRadius_m: c.equivalentRadius_m,
        superpositionTotal_m3_s: total,
        ratio: c.rate_m3_s > 0 ? total / c.rate_m3_s : null,
        note: `Equivalent well (r_e = sqrt(A/π), ${c.method}), boundaries ignored: a rough figure; a ratio far from 1 deserves a second look.${shared}`,
      };
    } catch (error) {
      return {
        excavationId: e.id,
        equivalentWellInflow_m3_s: null,
        equivalentRadius_m: null,
        superpositionTotal_m3_s: total,
        ratio: null,
        note: `No equivalent-well estimate: ${error instanceof Error ? error.message : String(error)}`,
      };
    }
  });

  const summary = summariseDesign({ scenario, options, wells, wellResults, rates, installed });

  // Cautions.
  const cautions: string[] = [
    'Idealised model (homogeneous, isotropic aquifer, infinite except the stated straight boundaries, fully penetrating wells): treat rates and levels as estimates; confirm by site investigation and pumping tests, follow local codes, and have the design checked by a licensed engineer.',
  ];
  if (a.kind === 'unconfined' || wells.some((w) => w.wellLoss_s2_m5 > 0))
    cautions.push(
      'Well limits are checked with linear, conservative rows: unconfined pumping levels use the chord of the Dupuit level curve and well loss C·Q² its secant, so capacities and suction-lift margins are under-, never over-stated; the reported pumping levels are the engine’s exact values.',
    );
  if (endTime_s !== null && designTime_s !== null && endTime_s > designTime_s && rates.some((q) => q > 0)) {
    const late = wellLevels({ scenario: solved, time_s: endTime_s });
    const over = wells.filter((w, j) => {
      const q = rates[j]!;
      if (!(q > 0)) return false;
      const pl = late[w.scenarioIndex]!.pumpingLevel_m;
      const cap = sichardtCapacity({ radius_m: w.radius_m, wettedLength_m: wettedScreenLength(w.screenTop_m, w.screenBottom_m, pl), conductivity_m_s: a.conductivity_m_s });
      return pl < w.minimumLevel_m || q > cap;
    });
    if (over.length > 0)
      cautions.push(
        `Kept at the design rates to the end of pumping (${fmt(endTime_s / 86400)} days), ${over.length} well(s) would pass their suction-lift or wetted-screen limit (${over
          .slice(0, 8)
          .map((w) => w.id)
          .join(', ')}${over.length > 8 ? ', …' : ''}): plan to reduce the rates once the target is reached, and check the levels as pumping goes on.`,
      );
  }
  const flagged = (flag: string) => pointResults.filter((p) => p.flags.includes(flag as never)).length;
  if (flagged('large-drawdown') > 0)
    cautions.push(`${flagged('large-drawdown')} check point(s) are drawn down more than about 25 % of the saturated thickness: Dupuit–Jacob results degrade there; treat levels as approximate.`);
  if (flagged('dewatered') > 0) cautions.push(`${flagged('dewatered')} check point(s) are dewatered to the aquifer base in the model.`);
  if (flagged('confined-to-unconfined') > 0)
    cautions.push(`${flagged('confined-to-unconfined')} check point(s) have the head below the aquifer top: the aquifer turns unconfined there and the confined solution overstates the drawdown.`);
  if (wellResults.some((w) => w.flags.includes('dewatered'))) cautions.push('Some wells are dewatered at the face in the model: check the screens.');
  if (a.kind !== 'unconfined' && scenario.excavations.some((e) => a.top_m !== undefined && e.formationLevel_m < a.top_m))
    cautions.push('An excavation reaches into the confined aquifer: check base stability (uplift and heave) separately.');
  if (wells.some((w) => w.kind === 'wellpoint'))
    cautions.push(`Suction-lift limit ${options.suctionLiftLimit_m} m below the header is common practice (well points work to about 5–6 m), not a property of the site.`);
  if (designTime_s === null)
    cautions.push(`Steady design: allow about ${Math.round((options.initialRateFactor - 1) * 100)} % more flow for the first ${fmt(options.initialPeriod_s / 86400)} days while storage drains (UFC 3-220-05).`);
  // Assigned inside solve(); TypeScript cannot see that.
  const layoutInfo = layoutSearch as { status: string; mipGap?: number } | null;
  if (layoutInfo !== null)
    cautions.push(
      `Layout choice by mixed-integer programming: ${layoutInfo.status === 'time-limit' ? 'the search stopped at its time limit' : 'the search stopped'} with the chosen layout's cost within ${fmt(100 * (layoutInfo.mipGap ?? 0), 2)} % of the best possible; costs per well and per m³ are the options' placeholders unless you set them.`,
    );
  if (mode === 'uniform' && solution.status === 'optimal')
    cautions.push('Uniform mode: every well pumps the same rate; wells at the ends of a line carry more load in reality.');

  if (designPoints.length === 0)
    cautions.push('The scenario has no excavations or control points: there is nothing to design for, so every rate is 0.');
  const modelNotes = [...verify.model.notes];
  progress('done', 1);
  return {
    mode,
    feasible,
    totalRate_m3_s: total,
    wells: wellResults,
    excavations: excavations.map((e) => ({ ...e, ...(times.excavations.get(e.id) ?? {}) })),
    reasons,
    designTime_s,
    limitCheckTime_s: limitTime_s,
    controlPoints: buildControlPointResults(designPoints, checkPoints, inDesign, pointResults, times.pointTimes),
    timeSeries: times.series,
    outOfService,
    summary,
    quickCheck,
    ...(mode === 'layout' ? { chosenWellIds: wells.filter((_, j) => installed[j] === 1 && rates[j]! > 0).map((w) => w.id) } : {}),
    solver: {
      status: solution.status,
      rounds,
      objective: solution.objective,
      ...(layoutInfo !== null ? { layoutStatus: layoutInfo.status, ...(layoutInfo.mipGap !== undefined ? { mipGap: layoutInfo.mipGap } : {}) } : {}),
      solveTime_ms: Math.max(solveTime_ms, 0),
    },
    cautions,
    modelNotes: [...modelNotes, `Design run took ${Date.now() - started} ms.`],
  };
}

function buildControlPointResults(
  designPoints: ControlPoint[],
  checkPoints: ControlPoint[],
  inDesign: Set<number>,
  checkResults: PointResult[],
  pointTimes: Map<ControlPoint, number | null>,
): DesignControlPointResult[] {
  // The design set as reported: design points (levels at them from the check evaluation where they coincide).
  const key = (p: { x: number; y: number }) => `${p.x.toFixed(6)},${p.y.toFixed(6)}`;
  const byKey = new Map<string, number>();
  checkPoints.forEach((p, i) => byKey.set(key(p), i));
  const out: DesignControlPointResult[] = [];
  const push = (p: ControlPoint, level: number | undefined, flags: string[]) =>
    out.push({
      x: p.x,
      y: p.y,
      kind: p.kind,
      excavationId: p.excavationId,
      targetLevel_m: p.targetLevel_m,
      level_m: level ?? NaN,
      timeToTarget_s: pointTimes.get(p) ?? null,
      flags,
    });
  for (const p of designPoints) {
    const i = byKey.get(key(p));
    if (i !== undefined) push(p, checkResults[i]!.level_m, checkResults[i]!.flags);
  }
  for (const i of inDesign) push(checkPoints[i]!, checkResults[i]!.level_m, checkResults[i]!.flags);
  return out.filter((p) => Number.isFinite(p.level_m));
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
    const withB = ctx.levelForVariable(dot(designResponse(ctx, pt, ctx.designTime_s), 0, nW, rates));
    const withoutB = ctx.levelForVariable(dot(designResponse(without, pt, ctx.designTime_s), 0, nW, rates));
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

/** One well out of service at the design time: is every target still met by the others? */
function outOfServiceCheck(ctx: DesignContext, checkPoints: ControlPoint[], checkResponse: Float64Array, rates: Float64Array): OutOfServiceCheck | null {
  const nW = ctx.wells.length;
  if (nW === 0) return null;
  const base = checkPoints.map((_, i) => dot(checkResponse, i, nW, rates));
  const relevant = checkPoints.map((p) => p.excavationId !== null || p.kind === 'user');
  const worstWithout = (j: number) => {
    let worst = -Infinity;
    checkPoints.forEach((p, i) => {
      if (!relevant[i] || !Number.isFinite(ctx.variableForLevel(p.targetLevel_m))) return;
      const level = ctx.levelForVariable(base[i]! - checkResponse[i * nW + j]! * rates[j]!);
      worst = Math.max(worst, level - p.targetLevel_m);
    });
    return worst;
  };
  let worstWell = -1;
  let worstValue = -Infinity;
  const perWell = ctx.wells.map((_, j) => (rates[j]! > 0 ? worstWithout(j) : -Infinity));
  perWell.forEach((v, j) => {
    if (v > worstValue) {
      worstValue = v;
      worstWell = j;
    }
  });
  if (worstWell < 0 || !Number.isFinite(worstValue)) return null;
  const chosen = ctx.options.outOfServiceWell !== null ? ctx.wells.findIndex((w) => w.id === ctx.options.outOfServiceWell) : -1;
  const j = chosen >= 0 ? chosen : worstWell;
  const value = chosen >= 0 ? worstWithout(chosen) : worstValue;
  return {
    wellId: ctx.wells[j]!.id,
    chosenBy: chosen >= 0 ? 'option' : 'worst-case',
    met: value <= 0,
    worstShortfall_m: Number.isFinite(value) ? value : worstValue,
    worstWellId: ctx.wells[worstWell]!.id,
    worstWellShortfall_m: worstValue,
  };
}
