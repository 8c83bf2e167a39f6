/**
 * Stage 6 of a design run: the solved rates evaluated by the field engine itself — levels at the
 * check points, pumping levels and capacities of the wells — and whatever the linear rows missed.
 */
import { evaluatePoints, wellLevels, type PointResult } from '../field';

type WellLevel = ReturnType<typeof wellLevels>[number];
import type { Scenario } from '../schema';
import type { ControlPoint } from './control-points';
import { applyDesignRates, pointXY, type DesignContext } from './design-context';
import type { DesignWellResult } from './design-result';
import { formatFigure, formatLitres, IDLE_WELL_NOTE, INJECTION_WELL_NOTE } from './design-wording';
import type { DesignWell } from './well-limits';
import { findBindingLimits, type RateProblem } from './rate-problem';
import { sichardtCapacity, wettedScreenLength } from './sichardt-capacity';

export interface VerifiedDesign {
  /** The scenario with the design rates applied. */
  solved: Scenario;
  /** Engine results at the check points, at the design time. */
  pointResults: PointResult[];
  /** Model notes of that evaluation. */
  modelNotes: string[];
  wellResults: DesignWellResult[];
  /** Limits the engine finds broken, in words (each becomes a solver reason). */
  verificationIssues: string[];
  /** Limit binding per design well (null: none). */
  binding: ReturnType<typeof findBindingLimits>;
}

export interface VerifyDesignOptions {
  ctx: DesignContext;
  rates: Float64Array;
  /** Layout: 1 for wells chosen. */
  installed: Uint8Array;
  problem: RateProblem;
  checkPoints: ControlPoint[];
}

/**
 * An injection well's result: rate ≤ 0, its allowed capacity the injection capacity, and the
 * level in the well (raised by the mound and the well loss) checked against ground level.
 */
function injectionWellResult(ctx: DesignContext, w: DesignWell, q: number, level: WellLevel, chosen: boolean, issues: string[]): DesignWellResult {
  const capacity = w.injectionCapacity_m3_s ?? 0;
  const ground = ctx.scenario.groundLevel_m;
  if (q < 0 && -q > capacity * (1 + 1e-6)) issues.push(`injection well ${w.id} takes ${formatLitres(-q)}, above its injection capacity ${formatLitres(capacity)}`);
  if (q < 0 && level.pumpingLevel_m > Math.max(ground, ctx.scenario.aquifer.staticLevel_m) + 1e-6)
    issues.push(`injection well ${w.id}: the level in the well, ${formatFigure(level.pumpingLevel_m, 4)} m, stands above ground (${formatFigure(ground, 4)} m)`);
  const used = q < 0;
  return {
    id: w.id,
    kind: w.kind,
    x: w.x,
    y: w.y,
    rate_m3_s: q,
    installed: chosen && used,
    start_s: w.start_s,
    capacity_m3_s: capacity,
    fullScreenCapacity_m3_s: w.fullScreenCapacity_m3_s,
    utilisation: capacity > 0 ? -q / capacity : used ? null : 0,
    pumpingLevel_m: level.pumpingLevel_m,
    minimumPumpingLevel_m: w.minimumLevel_m,
    allowedCapacity_m3_s: capacity,
    limit: used && -q >= capacity * (1 - 1e-6) ? 'capacity' : null,
    head_m: null,
    flags: level.flags,
    idle: !used,
    injection: true,
    note: used ? INJECTION_WELL_NOTE : IDLE_WELL_NOTE,
  };
}

/** Evaluates the design with the field engine and reports each well against its limits. */
export function verifyDesign({ ctx, rates, installed, problem, checkPoints }: VerifyDesignOptions): VerifiedDesign {
  const { scenario, wells } = ctx;
  const a = scenario.aquifer;
  const solved = applyDesignRates(scenario, wells, rates);
  const verify = evaluatePoints({ scenario: solved, points: checkPoints.map(pointXY), time_s: ctx.designTime_s });
  const levels = wellLevels({ scenario: solved, time_s: ctx.limitTime_s });
  const binding = findBindingLimits(problem, rates);
  const verificationIssues: string[] = [];
  const wellResults: DesignWellResult[] = wells.map((w, j) => {
    const level = levels[w.scenarioIndex]!;
    const q = rates[j]!;
    const capacity = sichardtCapacity({
      radius_m: w.radius_m,
      wettedLength_m: wettedScreenLength(w.screenTop_m, w.screenBottom_m, level.pumpingLevel_m),
      conductivity_m_s: a.conductivity_m_s,
    });
    if (w.injection) return injectionWellResult(ctx, w, q, level, installed[j] === 1, verificationIssues);
    const allowed = capacity * (w.capacityFactor ?? 1);
    if (q > 0 && q > allowed * (1 + 1e-6))
      verificationIssues.push(`well ${w.id} pumps ${formatLitres(q)}, above its allowed capacity ${formatLitres(allowed)} (Sichardt capacity ${formatLitres(capacity)} × ${w.capacityFactor ?? 1}) at the verified pumping level`);
    if (q > 0 && level.pumpingLevel_m < w.minimumLevel_m - 1e-6)
      verificationIssues.push(`well ${w.id}: pumping level ${formatFigure(level.pumpingLevel_m, 4)} m is below its floor ${formatFigure(w.minimumLevel_m, 4)} m`);
    return {
      id: w.id,
      kind: w.kind,
      x: w.x,
      y: w.y,
      rate_m3_s: q,
      // Every mode: a well the rates leave at zero is idle and may be omitted; quantities and cost leave it out too.
      installed: installed[j] === 1 && q > 0,
      start_s: w.start_s,
      capacity_m3_s: capacity,
      fullScreenCapacity_m3_s: w.fullScreenCapacity_m3_s,
      utilisation: capacity > 0 ? q / capacity : q > 0 ? null : 0,
      pumpingLevel_m: level.pumpingLevel_m,
      minimumPumpingLevel_m: w.minimumLevel_m,
      allowedCapacity_m3_s: allowed,
      limit: q > 0 ? binding[j]! : null,
      head_m: null,
      flags: level.flags,
      idle: !(q > 0),
      ...(q > 0 ? {} : { note: IDLE_WELL_NOTE }),
    };
  });
  return { solved, pointResults: verify.points, modelNotes: [...verify.model.notes], wellResults, verificationIssues, binding };
}
