/**
 * Robust design options, each solved beside the ordinary design (designOptions.robust):
 *
 * - **One well out (N − 1)**: rates such that every target is met with any one well out of
 *   service. Exactly: for every outage k, the rows Σ_{j≠k} a_ij·Q_j ≥ r_i (the control rows with
 *   well k's column removed). Instead of all n × rows at once, the rows are generated lazily — solve,
 *   find the (outage, check point) pairs still above target with the check grid, add those rows,
 *   solve again — which ends at the same optimum over the check grid with far fewer rows.
 *   Well limits are checked with every well on: taking a well out raises the levels at the others
 *   (less interference), so their pumping levels and wetted screens are no worse then.
 * - **K within a factor f**: rates that meet every target at K ÷ f, K and K × f at once (the rows
 *   and well limits of the three cases stacked in one LP). Which end governs depends on the site:
 *   in steady confined flow drawdown ∝ Q/T, so lower K needs *less* flow for the same lowering,
 *   but every well's Sichardt capacity falls with √K; higher K needs more flow and gains capacity
 *   more slowly (so high K usually runs out of capacity first). Transient cones also spread more
 *   slowly at low K, so distant control points can need more flow at low K. Solving both ends
 *   leaves the choice to the LP.
 *
 * Well limits use the wide (un-narrowed) linearisation: conservative over the whole range, so a
 * robust design may be refused where narrowed limits would just allow it (said in the note).
 */
import { DrydigError } from '../schema';
import type { ControlPoint } from './control-points';
import { responseDot } from './design-context';
import { solveOptimalRates, solveUniformRate, type LimitRow, type RateProblem, type RateSolution } from './rate-problem';
import { DESIGN_TOLERANCE_M, RequirementRows } from './requirement-rows';
import { countsForTargets, MET_TOLERANCE_M, prepareScaledCase, type DesignBasis, type ScaledCase } from './scaled-design';
import type { RobustDesign } from './uncertainty-result';
import { buildLimitRows } from './well-limits';
import type { ResolvedDesignOptions } from './design-options';

/** Most LP solves of one robust design. */
export const MAX_ROBUST_ROUNDS = 15;
/** Most rows added per case or outage per round. */
const MAX_ADDED_PER_ROUND = 60;

interface OutageRow {
  response: Float64Array;
  required: number;
}

export interface RobustSolveOptions {
  basis: DesignBasis;
  cases: ScaledCase[];
  /** Also every single-well outage (N − 1). */
  outages: boolean;
}

export interface RobustSolve {
  solution: RateSolution;
  rounds: number;
  /** Highest level above target over every case (and outage), m, with the solution's rates. */
  worstShortfall_m: number;
  worstCase: string;
}

/** The violations of `rates` in a case: check points above target with all wells on, and with each one out. */
function findViolations(c: ScaledCase, checkPoints: ControlPoint[], rates: Float64Array, outages: boolean) {
  const nW = c.ctx.wells.length;
  const allOn: Array<{ i: number; over: number }> = [];
  const out: Array<Array<{ i: number; over: number }>> = Array.from({ length: nW }, () => []);
  let worst = -Infinity;
  let worstWell = -1;
  checkPoints.forEach((p, i) => {
    if (!countsForTargets(p) || !Number.isFinite(c.ctx.variableForLevel(p.targetLevel_m))) return;
    const v = responseDot(c.responses.check, i, nW, rates);
    const over = c.ctx.levelForVariable(v) - p.targetLevel_m;
    if (over > worst) [worst, worstWell] = [over, -1];
    if (over > MET_TOLERANCE_M) allOn.push({ i, over });
    if (!outages) return;
    for (let k = 0; k < nW; k++) {
      if (!(rates[k]! > 0)) continue;
      const o = c.ctx.levelForVariable(v - c.responses.check[i * nW + k]! * rates[k]!) - p.targetLevel_m;
      if (o > worst) [worst, worstWell] = [o, k];
      if (o > MET_TOLERANCE_M) out[k]!.push({ i, over: o });
    }
  });
  return { allOn, out, worst, worstWell };
}

const worstFirst = (list: Array<{ i: number; over: number }>) => list.sort((a, b) => b.over - a.over).slice(0, MAX_ADDED_PER_ROUND);

/** Solves rates meeting every case (and outage) by lazily generated rows (see the file comment). */
export async function solveRobustRates({ basis, cases, outages }: RobustSolveOptions): Promise<RobustSolve> {
  const nW = cases[0]!.ctx.wells.length;
  const rowSets = cases.map((c) => {
    const rows = new RequirementRows(c.ctx);
    basis.designPoints.forEach((p, i) => rows.add(c.responses.design.subarray(i * nW, (i + 1) * nW), p));
    for (const i of basis.seedCheckPoints) {
      rows.addedCheckPoints.add(i);
      rows.add(c.responses.check.subarray(i * nW, (i + 1) * nW), basis.checkPoints[i]!);
    }
    return rows;
  });
  const limitSets = cases.map((c) =>
    buildLimitRows({ aquifer: c.ctx.scenario.aquifer, wells: c.ctx.wells, faceResponse: c.responses.face, variableForLevel: c.ctx.variableForLevel, levelForVariable: c.ctx.levelForVariable }),
  );
  const outageRows: OutageRow[] = [];
  const outageKeys = new Set<string>();
  const limits: LimitRow[] = limitSets.flatMap((l) => l.limits);
  const upper = Float64Array.from({ length: nW }, (_, j) => Math.min(...limitSets.map((l) => l.upper[j]!)));
  const uniform = basis.mode === 'uniform';

  let solution: RateSolution = { status: 'error', rates: new Float64Array(nW), objective: null, detail: 'not solved', criticalRow: -1 };
  let rounds = 0;
  while (rounds < MAX_ROBUST_ROUNDS) {
    const responses = [...rowSets.flatMap((r) => r.responses), ...outageRows.map((o) => o.response)];
    const required = [...rowSets.flatMap((r) => r.required), ...outageRows.map((o) => o.required)];
    const response = new Float64Array(responses.length * nW);
    responses.forEach((r, i) => response.set(r, i * nW));
    const problem: RateProblem = { nWells: nW, response, required: Float64Array.from(required), limits, upper, upperKind: limitSets[0]!.upperKind };
    solution = uniform ? solveUniformRate(problem) : await solveOptimalRates(problem);
    rounds++;
    if (solution.status !== 'optimal') break;
    let added = false;
    cases.forEach((c, ci) => {
      const v = findViolations(c, basis.checkPoints, solution.rates, outages);
      for (const { i } of worstFirst(v.allOn)) {
        if (rowSets[ci]!.addedCheckPoints.has(i)) continue;
        rowSets[ci]!.addedCheckPoints.add(i);
        rowSets[ci]!.add(c.responses.check.subarray(i * nW, (i + 1) * nW), basis.checkPoints[i]!);
        added = true;
      }
      v.out.forEach((list, k) => {
        for (const { i } of worstFirst(list)) {
          const key = `${ci}:${i}:${k}`;
          if (outageKeys.has(key)) continue;
          const r = c.ctx.variableForLevel(basis.checkPoints[i]!.targetLevel_m - DESIGN_TOLERANCE_M);
          if (!Number.isFinite(r) || r <= 0) continue;
          const row = Float64Array.from(c.responses.check.subarray(i * nW, (i + 1) * nW));
          row[k] = 0;
          outageRows.push({ response: row, required: r });
          outageKeys.add(key);
          added = true;
        }
      });
    });
    if (!added) break;
  }
  let worst = -Infinity;
  let worstCase = '';
  cases.forEach((c) => {
    const v = findViolations(c, basis.checkPoints, solution.rates, outages);
    if (v.worst > worst) {
      worst = v.worst;
      const kText = c.kFactor === 1 ? 'the scenario’s K' : c.kFactor < 1 ? `K ÷ ${formatFactor(1 / c.kFactor)}` : `K × ${formatFactor(c.kFactor)}`;
      worstCase = v.worstWell >= 0 ? `well ${c.ctx.wells[v.worstWell]!.id} out, ${kText}` : `every well on, ${kText}`;
    }
  });
  return { solution, rounds, worstShortfall_m: worst, worstCase };
}

const formatFactor = (f: number) => String(Number(f.toPrecision(3)));

/** The robust design options asked for, each with the extra flow it costs over the ordinary design. */
export async function buildRobustDesigns(options: ResolvedDesignOptions, basis: DesignBasis, ordinaryTotal_m3_s: number): Promise<RobustDesign[] | null> {
  const asked = options.robust;
  if (!asked.oneWellOut && asked.conductivityFactor === null) return null;
  const out: RobustDesign[] = [];
  const describe = async (kind: RobustDesign['kind'], cases: ScaledCase[], outages: boolean, note: string, factor?: number): Promise<RobustDesign> => {
    const s = await solveRobustRates({ basis, cases, outages });
    const ok = s.solution.status === 'optimal' && s.worstShortfall_m <= MET_TOLERANCE_M;
    const total = ok ? s.solution.rates.reduce((a, q) => a + q, 0) : null;
    return {
      kind,
      ...(factor !== undefined ? { conductivityFactor: factor } : {}),
      feasible: ok,
      totalRate_m3_s: total,
      extraRate_m3_s: total === null ? null : total - ordinaryTotal_m3_s,
      extraShare: total === null || !(ordinaryTotal_m3_s > 0) ? null : total / ordinaryTotal_m3_s - 1,
      wells: cases[0]!.ctx.wells.map((w, j) => ({ id: w.id, rate_m3_s: s.solution.rates[j]! })),
      worstShortfall_m: s.worstShortfall_m,
      worstCase: s.worstCase,
      rounds: s.rounds,
      note: ok ? note : `${note} No rates within the well limits (wide, conservative linearisation) meet every case: ${s.solution.detail}; the rates shown are the best achievable.`,
    };
  };
  // A scaled K outside the physical range: that robust design is reported as not computed.
  const refused = (kind: RobustDesign['kind'], error: DrydigError, factor?: number): RobustDesign => ({
    kind,
    ...(factor !== undefined ? { conductivityFactor: factor } : {}),
    feasible: false,
    totalRate_m3_s: null,
    extraRate_m3_s: null,
    extraShare: null,
    wells: [],
    worstShortfall_m: null,
    worstCase: 'not computed',
    rounds: 0,
    note: `not computed: ${error.message}`,
  });
  if (asked.oneWellOut) {
    out.push(await describe('one-well-out', [prepareScaledCase(basis, 1, 1)], true,
      'Every target met with any one well out of service, the others at these rates (N − 1 rows for every outage, generated where the check grid needs them). Well limits are checked with every well on.'));
  }
  if (asked.conductivityFactor !== null) {
    const f = asked.conductivityFactor;
    let cases: ScaledCase[];
    try {
      cases = [prepareScaledCase(basis, 1 / f, 1), prepareScaledCase(basis, 1, 1), prepareScaledCase(basis, f, 1)];
    } catch (error) {
      if (!(error instanceof DrydigError)) throw error;
      out.push(refused('conductivity-range', error, f));
      return out;
    }
    out.push(await describe('conductivity-range', cases, false,
      `Every target met at K ÷ ${formatFactor(f)}, K and K × ${formatFactor(f)} with the same rates, within each case’s well limits (Sichardt capacity ∝ √K). Lower K needs less flow per metre of lowering in steady confined flow (drawdown ∝ 1/T) but lowers the wells’ capacity; higher K needs more flow.`, f));
  }
  return out;
}
