/**
 * The chosen design under other ground: the scenario with K and S scaled, re-solved (the least
 * flow that meets every target there) and re-evaluated at the chosen rates (is every target still
 * met, by how much not, the uplift factor of safety). The sensitivity table, the Monte Carlo
 * realisations and the robust designs are all made of these.
 *
 * Scaling: K × f_K (so T × f_K); S (confined, leaky) or Sy (unconfined) × f_S; a leaky aquifer's
 * B = sqrt(T·c) × sqrt(f_K) with the aquitard's resistance c held. A given radius of influence is
 * held; the Sichardt estimate follows K. The ground profile (plug weight, floor targets) is held.
 * Re-solves use the least-total-pumping LP (uniform designs: the uniform rate) over the design's
 * own wells — in layout mode the wells the search chose — not a new layout search.
 */
import type { DesignMode, Scenario } from '../schema';
import type { ControlPoint } from './control-points';
import { responseDot, type DesignContext } from './design-context';
import { computeDesignResponses, type DesignResponses } from './design-responses';
import { prepareDesign } from './design-setup';
import { solveDesignRates } from './solve-design-rates';
import { upliftFactorOfSafety } from '../floor';

/** Everything a re-solve needs from the ordinary design (plain data: it crosses thread boundaries). */
export interface DesignBasis {
  /** The validated scenario (layout mode: only the chosen wells active). */
  scenario: Scenario;
  /** Mode of the re-solves: uniform stays uniform; optimal and layout re-solve by LP. */
  mode: DesignMode;
  /** The run's option overrides as given (validated again with the scaled scenario). */
  options?: unknown;
  /** Control points of the ordinary design (K-independent: they follow the outlines and targets). */
  designPoints: ControlPoint[];
  checkPoints: ControlPoint[];
  /** Check points the ordinary design added as rows (a re-solve starts with them). */
  seedCheckPoints: number[];
  /** The chosen rates by well id, m³/s. */
  rates: Array<{ id: string; rate_m3_s: number }>;
}

/** A scaled scenario's design context and unit responses. */
export interface ScaledCase {
  ctx: DesignContext;
  responses: DesignResponses;
  kFactor: number;
  sFactor: number;
}

/** The scenario with K scaled by kFactor and storage by sFactor (see the file comment). */
export function scaleAquifer(scenario: Scenario, kFactor: number, sFactor: number): Scenario {
  const a = scenario.aquifer;
  const scaled = { ...a, conductivity_m_s: a.conductivity_m_s * kFactor };
  if (a.storativity !== undefined) scaled.storativity = a.storativity * sFactor;
  if (a.specificYield !== undefined) scaled.specificYield = a.specificYield * sFactor;
  if (a.leakageFactor_m !== undefined) scaled.leakageFactor_m = a.leakageFactor_m * Math.sqrt(kFactor);
  return { ...scenario, aquifer: scaled };
}

/** The context and responses of the scaled scenario (throws DrydigError when a scaled value leaves the physical range). */
export function prepareScaledCase(basis: DesignBasis, kFactor: number, sFactor: number): ScaledCase {
  const { ctx } = prepareDesign({ scenario: scaleAquifer(basis.scenario, kFactor, sFactor), mode: basis.mode, options: basis.options });
  return { ctx, responses: computeDesignResponses(ctx, basis.designPoints, basis.checkPoints), kFactor, sFactor };
}

/** The chosen rates in the order of `ctx.wells`, m³/s. */
export function ratesFor(ctx: DesignContext, rates: DesignBasis['rates']): Float64Array {
  const byId = new Map(rates.map((r) => [r.id, r.rate_m3_s] as const));
  return Float64Array.from(ctx.wells, (w) => byId.get(w.id) ?? 0);
}

/** Whether a check point counts for "every target met": inside an excavation, or a user point. */
export const countsForTargets = (p: ControlPoint) => p.excavationId !== null || p.kind === 'user';

/** Tolerance on "met" for round-off at the ordinary design's own ground, m. */
export const MET_TOLERANCE_M = 1e-6;

export interface RatesOutcome {
  /** Every target met with the given rates. */
  met: boolean;
  /** Highest level above its target over the relevant check points, m (≤ 0 when met). */
  worstShortfall_m: number;
  /** Per excavation: highest head and the uplift FS there (null: no plug, or no pressure under it). */
  excavations: Array<{ id: string; worstShortfall_m: number; head_m: number; upliftFS: number | null }>;
}

/**
 * The levels the rates give at the check points (superposition of the unit responses, the field
 * engine's own) against their targets.
 */
export function evaluateRates(c: ScaledCase, checkPoints: ControlPoint[], rates: Float64Array, without: number = -1): RatesOutcome {
  const { ctx } = c;
  const nW = ctx.wells.length;
  let worst = -Infinity;
  const perExcavation = new Map<string, { worst: number; head: number }>();
  checkPoints.forEach((p, i) => {
    if (!countsForTargets(p)) return;
    let v = responseDot(c.responses.check, i, nW, rates);
    if (without >= 0) v -= c.responses.check[i * nW + without]! * rates[without]!;
    const level = Number.isFinite(ctx.variableForLevel(p.targetLevel_m)) ? ctx.levelForVariable(v) : Infinity;
    const over = level - p.targetLevel_m;
    worst = Math.max(worst, over);
    if (p.excavationId !== null) {
      const e = perExcavation.get(p.excavationId) ?? { worst: -Infinity, head: -Infinity };
      e.worst = Math.max(e.worst, over);
      if (Number.isFinite(level)) e.head = Math.max(e.head, level);
      perExcavation.set(p.excavationId, e);
    }
  });
  const excavations = [...perExcavation].map(([id, e]) => {
    const plug = ctx.floors.get(id)?.ground?.plug;
    return { id, worstShortfall_m: e.worst, head_m: e.head, upliftFS: plug && Number.isFinite(e.head) ? upliftFactorOfSafety(plug, e.head) : null };
  });
  return { met: worst <= MET_TOLERANCE_M, worstShortfall_m: worst, excavations };
}

export interface ScaledSolve {
  /** Every target met within every well limit. */
  feasible: boolean;
  /** Least total flow that does it, m³/s (null: no rates do, within the well limits). */
  totalRate_m3_s: number | null;
  rates: Float64Array;
}

/** Re-solves the design on the scaled case (LP or uniform; refinement from the ordinary design's rows). */
export async function solveScaledCase(basis: DesignBasis, c: ScaledCase): Promise<ScaledSolve> {
  const solved = await solveDesignRates({
    ctx: c.ctx,
    designPoints: basis.designPoints,
    checkPoints: basis.checkPoints,
    responses: c.responses,
    progress: () => undefined,
    seedCheckPoints: basis.seedCheckPoints,
  });
  const rates = solved.solution.rates;
  const feasible = solved.solution.status === 'optimal' && evaluateRates(c, basis.checkPoints, rates).met;
  return { feasible, totalRate_m3_s: feasible ? rates.reduce((s, q) => s + q, 0) : null, rates };
}

/** Builds the basis of re-solves from the ordinary design's stages. */
export function createDesignBasis(input: {
  ctx: DesignContext;
  options?: unknown;
  designPoints: ControlPoint[];
  checkPoints: ControlPoint[];
  addedCheckPoints: Iterable<number>;
  rates: Float64Array;
  installed: Uint8Array;
}): DesignBasis {
  const { ctx } = input;
  const layout = ctx.mode === 'layout';
  const chosen = new Set(ctx.wells.filter((_, j) => input.installed[j] === 1 && input.rates[j]! > 0).map((w) => w.id));
  const scenario: Scenario = layout ? { ...ctx.scenario, wells: ctx.scenario.wells.map((w) => ({ ...w, active: chosen.has(w.id) })) } : ctx.scenario;
  const options = input.options === undefined ? undefined : { ...(input.options as Record<string, unknown>) };
  if (options) {
    delete options.mode;
    // A layout's unchosen wells are inactive in the basis; the standby check is not re-run there.
    if (layout) delete options.outOfServiceWell;
  }
  return {
    scenario,
    mode: ctx.mode === 'uniform' ? 'uniform' : 'optimal',
    ...(options ? { options } : {}),
    designPoints: input.designPoints,
    checkPoints: input.checkPoints,
    seedCheckPoints: [...input.addedCheckPoints],
    rates: ctx.wells.map((w, j) => ({ id: w.id, rate_m3_s: input.rates[j]! })),
  };
}
