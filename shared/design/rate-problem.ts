/**
 * The design as a linear problem in the well rates Q (m³/s).
 *
 * Confined and leaky drawdown is linear in the rates (superposition; Theis 1935, Hantush & Jacob
 * 1955, Thiem 1906, de Glee 1930). Unconfined flow is linear in the discharge potential:
 * Dupuit–Thiem superposes in H² − h², and the transient model superposes Jacob's s_c
 * (design.md §5). The target "level ≤ target" is, exactly, "variable ≥ variable(target)", with
 * variable = drawdown (confined, leaky) or s_c = (H² − h²)/(2H) (unconfined), both monotone in
 * the level. So the requirement at every control point is one linear row Σ_j a_ij·Q_j ≥ r_i,
 * and the optimum follows from one LP — no iteration on the rates.
 *
 * Well limits (pumping level above a floor, Sichardt capacity with the wetted screen) are
 * written as linear rows that are conservative, see `well-limits.ts`.
 *
 * Inside the solver rates are in L/s and every row is divided by its largest coefficient, so
 * HiGHS's absolute tolerances (1e-7) stand for the same small error in every row.
 */
import { solveLinearProgram, type LinearRow } from './linear-program';

/** What a well-limit row stands for (the binding reason when it is tight). */
export type LimitKind = 'wetted-screen' | 'suction-lift' | 'air-entry' | 'interval' | 'mound';

export interface LimitRow {
  /** The well whose limit this is. */
  wellIndex: number;
  kind: LimitKind;
  /** Dense coefficients over all wells, per m³/s. */
  coefficients: Float64Array;
  /** Σ coefficients·Q ≤ rhs. */
  rhs: number;
}

export interface RateProblem {
  nWells: number;
  /** Control rows: response (row-major nRows × nWells, variable per m³/s). */
  response: Float64Array;
  /** Required value of the variable at each control row (drawdown or s_c, m). */
  required: Float64Array;
  limits: LimitRow[];
  /** Upper bound on each rate, m³/s (Sichardt full-screen capacity, or 0 when the well cannot pump). */
  upper: Float64Array;
  /** Lower bound on each rate, m³/s (linearisation intervals; default 0). */
  lower?: Float64Array;
  /** Why each upper bound is what it is. */
  upperKind: Array<'capacity' | 'suction-lift' | 'air-entry' | 'wetted-screen'>;
  /** 1 for an injection (recharge) well: its rate lies in [lower, 0] and costs |Q|. Default none. */
  injection?: Uint8Array;
  /** Upper limits on the variable at receptor points (drawdown limits). Default none. */
  ceilings?: CeilingRows;
}

/**
 * Drawdown limits as rows: Σ_j a_cj·Q_j ≤ max_c (variable at receptor point c, per m³/s), with
 * the receptor each row belongs to, so an infeasible design can name it.
 */
export interface CeilingRows {
  /** Row-major nRows × nWells. */
  response: Float64Array;
  /** Largest variable allowed per row (drawdown or s_c, m). */
  max: Float64Array;
  /** Index of the receptor of each row (into `names`). */
  owner: Int32Array;
  /** Receptor ids. */
  names: string[];
}

export type RateStatus = 'optimal' | 'infeasible' | 'time-limit' | 'error';

export interface RateSolution {
  status: RateStatus;
  /** Rates, m³/s (best achievable when infeasible). */
  rates: Float64Array;
  /** Layout mode: installed wells. */
  installed?: Uint8Array;
  objective: number | null;
  mipGap?: number;
  detail: string;
  /** Index of the control row that is hardest to meet (the binding one). */
  criticalRow: number;
}

const L_PER_M3 = 1000;
const TIGHT = 1e-6;

function controlRows(p: RateProblem, rowIndices: number[], shortfallColumn: number | null): LinearRow[] {
  const rows: LinearRow[] = [];
  const n = p.nWells;
  for (const i of rowIndices) {
    let max = 0;
    for (let j = 0; j < n; j++) max = Math.max(max, Math.abs(p.response[i * n + j]!));
    const scale = max > 0 ? max / L_PER_M3 : 1;
    const columns: number[] = [];
    const coefficients: number[] = [];
    for (let j = 0; j < n; j++) {
      const a = p.response[i * n + j]! / L_PER_M3;
      if (Math.abs(a) > 1e-12 * scale) {
        columns.push(j);
        coefficients.push(a / scale);
      }
    }
    if (shortfallColumn !== null) {
      columns.push(shortfallColumn);
      coefficients.push(1 / scale);
    }
    rows.push({ columns, coefficients, lower: p.required[i]! / scale, upper: Infinity });
  }
  return rows;
}

function limitRows(p: RateProblem): LinearRow[] {
  const rows: LinearRow[] = [];
  for (const lim of p.limits) {
    let max = 0;
    for (const c of lim.coefficients) max = Math.max(max, Math.abs(c));
    const scale = max > 0 ? max / L_PER_M3 : 1;
    const columns: number[] = [];
    const coefficients: number[] = [];
    lim.coefficients.forEach((c, j) => {
      const a = c / L_PER_M3;
      if (Math.abs(a) > 1e-12 * scale) {
        columns.push(j);
        coefficients.push(a / scale);
      }
    });
    rows.push({ columns, coefficients, lower: -Infinity, upper: lim.rhs / scale });
  }
  return rows;
}

/** The ceiling rows (drawdown limits), scaled like the control rows; `slackBase` adds one slack column per receptor. */
function ceilingRows(p: RateProblem, slackBase: number | null = null): LinearRow[] {
  const c = p.ceilings;
  if (!c) return [];
  const n = p.nWells;
  const rows: LinearRow[] = [];
  for (let i = 0; i < c.max.length; i++) {
    let max = 0;
    for (let j = 0; j < n; j++) max = Math.max(max, Math.abs(c.response[i * n + j]!));
    if (!(max > 0)) continue;
    const scale = max / L_PER_M3;
    const columns: number[] = [];
    const coefficients: number[] = [];
    for (let j = 0; j < n; j++) {
      const a = c.response[i * n + j]! / L_PER_M3;
      if (Math.abs(a) > 1e-12 * scale) {
        columns.push(j);
        coefficients.push(a / scale);
      }
    }
    if (slackBase !== null) {
      columns.push(slackBase + c.owner[i]!);
      coefficients.push(-1 / scale);
    }
    rows.push({ columns, coefficients, lower: -Infinity, upper: c.max[i]! / scale });
  }
  return rows;
}

/** Objective weight of each rate: +1 for abstraction, −1 for injection (rate ≤ 0), so the sum is Σ|Q|. */
const rateCosts = (p: RateProblem) => Array.from({ length: p.nWells }, (_, j) => (p.injection?.[j] ? -1 : 1));
/** A solved column back to a rate in m³/s, with the sign its well allows. */
const toRate = (p: RateProblem, j: number, v: number) => (p.injection?.[j] ? Math.min(0, v) : Math.max(0, v)) / L_PER_M3;

/** Index of the control row with the largest shortfall (variable units) for the given rates. */
export function findCriticalRow(p: RateProblem, rates: Float64Array): number {
  let worst = -Infinity;
  let at = -1;
  const n = p.nWells;
  for (let i = 0; i < p.required.length; i++) {
    let s = 0;
    for (let j = 0; j < n; j++) s += p.response[i * n + j]! * rates[j]!;
    const short = p.required[i]! - s;
    if (short > worst) {
      worst = short;
      at = i;
    }
  }
  return at;
}

const lowerBounds = (p: RateProblem) => Array.from({ length: p.nWells }, (_, j) => (p.lower?.[j] ?? 0) * L_PER_M3);
const allRows = (p: RateProblem) => Array.from({ length: p.required.length }, (_, i) => i);

/**
 * Per-well optimum: minimise Σ Q_j subject to every control row and every well limit (LP).
 * When no rates meet every row, returns the best achievable rates (`solveBestAchievableRates`)
 * with status 'infeasible'.
 */
export async function solveOptimalRates(p: RateProblem): Promise<RateSolution> {
  const n = p.nWells;
  const rows = [...controlRows(p, allRows(p), null), ...limitRows(p), ...ceilingRows(p)];
  const lp = await solveLinearProgram({
    cost: rateCosts(p),
    lower: lowerBounds(p),
    upper: Array.from(p.upper, (u) => u * L_PER_M3),
    rows,
  });
  if (lp.status === 'optimal') {
    const rates = Float64Array.from(lp.x, (v, j) => toRate(p, j, v));
    return { status: 'optimal', rates, objective: lp.objective / L_PER_M3, detail: lp.detail, criticalRow: findCriticalRow(p, rates) };
  }
  if (lp.status === 'infeasible') return solveBestAchievableRates(p);
  return { status: 'error', rates: new Float64Array(n), objective: null, detail: lp.detail, criticalRow: -1 };
}

/**
 * Best achievable: minimise the largest shortfall z over the control rows (in the variable's
 * metres) within the well limits, then, at that z, the total rate. Status 'infeasible' when z > 0.
 */
export async function solveBestAchievableRates(p: RateProblem): Promise<RateSolution> {
  const n = p.nWells;
  const z = n;
  const rows = [...controlRows(p, allRows(p), z), ...limitRows(p), ...ceilingRows(p)];
  const upper = [...Array.from(p.upper, (u) => u * L_PER_M3), Infinity];
  const lower = [...lowerBounds(p), 0];
  const first = await solveLinearProgram({ cost: [...new Array<number>(n).fill(0), 1], lower, upper, rows });
  if (first.status !== 'optimal') return { status: 'error', rates: new Float64Array(n), objective: null, detail: first.detail, criticalRow: -1 };
  const zStar = Math.max(0, first.x[z]!);
  upper[z] = zStar * (1 + 1e-7) + 1e-9;
  const second = await solveLinearProgram({ cost: [...rateCosts(p), 0], lower, upper, rows });
  const x = second.status === 'optimal' ? second.x : first.x;
  const rates = Float64Array.from({ length: n }, (_, j) => toRate(p, j, x[j]!));
  return {
    status: zStar > 1e-7 ? 'infeasible' : 'optimal',
    rates,
    objective: rates.reduce((s, q) => s + Math.abs(q), 0),
    detail: zStar > 1e-7 ? `largest shortfall ${zStar.toPrecision(3)} m (in the solved variable)` : second.detail,
    criticalRow: findCriticalRow(p, rates),
  };
}

/**
 * Uniform rate: every design well pumps the same q. The least q meeting row i is r_i / Σ_j a_ij,
 * so q = max_i of that (closed form); the well limits cap q at min_r rhs_r / Σ_j c_rj.
 * When the cap is lower, q is the cap and the status is 'infeasible'.
 */
export function solveUniformRate(p: RateProblem): RateSolution & { cap_m3_s: number; capRow: number | 'upper' | null; capWell: number } {
  const n = p.nWells;
  let need = 0;
  let critical = -1;
  let unreachableRow = -1;
  for (let i = 0; i < p.required.length; i++) {
    let sum = 0;
    for (let j = 0; j < n; j++) sum += p.response[i * n + j]!;
    const r = p.required[i]!;
    if (r <= 0) continue;
    if (!(sum > 0)) {
      if (unreachableRow < 0) unreachableRow = i;
      continue;
    }
    if (r / sum > need) {
      need = r / sum;
      critical = i;
    }
  }
  let cap = Infinity;
  let capRow: number | 'upper' | null = null;
  let capWell = -1;
  for (let j = 0; j < n; j++)
    if (p.upper[j]! < cap) {
      cap = p.upper[j]!;
      capRow = 'upper';
      capWell = j;
    }
  p.limits.forEach((lim, r) => {
    const sum = lim.coefficients.reduce((s, c) => s + c, 0);
    if (sum > 0 && lim.rhs / sum < cap) {
      cap = Math.max(0, lim.rhs / sum);
      capRow = r;
      capWell = lim.wellIndex;
    }
  });
  const q = Math.min(need, cap);
  const rates = new Float64Array(n).fill(q);
  const unreachable = unreachableRow >= 0;
  const feasible = !unreachable && need <= cap * (1 + 1e-12);
  return {
    status: feasible ? 'optimal' : 'infeasible',
    rates,
    objective: rates.reduce((s, v) => s + v, 0),
    detail: feasible ? 'closed form' : unreachable ? 'a control point no well can lower' : 'the well limits cap the uniform rate below the one needed',
    criticalRow: unreachable ? unreachableRow : feasible ? critical : findCriticalRow(p, rates),
    cap_m3_s: cap,
    capRow,
    capWell,
  };
}

export interface LayoutCosts {
  /** Cost of installing one well, bid currency. */
  wellCost: number;
  /** Cost per m³ pumped, bid currency. */
  pumpedVolumeCost_per_m3: number;
  /** Pumping duration the volume is priced over, s. */
  duration_s: number;
}

/**
 * Layout choice (MIP): binary y_j installs candidate j; minimise wellCost·Σy + (cost per m³ ·
 * duration)·ΣQ subject to the control rows, Q_j ≤ cap_j·y_j, and the well limits. Stops at a
 * relative gap of `mipRelativeGap` (default 2 % of the cost: rings of near-identical candidates
 * have many near-equal layouts and proving the last fraction of a percent takes minutes) or
 * after `timeLimit_s` (default 20 s) with the
 * best layout found (status 'time-limit', gap reported). The search starts from a greedy layout
 * (the LP optimum with every candidate, then the least-used well dropped while the rest still
 * meet every target), so a stopped search is never worse than that. Infeasible with every
 * candidate installed → best achievable rates with all installed.
 */
export async function solveLayout(p: RateProblem, costs: LayoutCosts, timeLimit_s = 20, mipRelativeGap = 0.02): Promise<RateSolution> {
  const n = p.nWells;
  const started = Date.now();
  const upper_L_s = Float64Array.from(p.upper, (u) => u * L_PER_M3);
  const perLitre = (costs.pumpedVolumeCost_per_m3 * costs.duration_s) / L_PER_M3;
  // A tiny cost per litre keeps rates least among equal-cost layouts when pumping is free.
  const rateCost = perLitre > 0 ? perLitre : 1e-6 * Math.max(costs.wellCost, 1);
  const costOf = (rates: Float64Array) => {
    let wells = 0;
    let litres = 0;
    rates.forEach((q) => {
      if (q > 0) wells++;
      litres += q * L_PER_M3;
    });
    return wells * costs.wellCost + litres * rateCost;
  };

  // A good start for the search (greedy, bounded to a third of the time): the per-well optimum
  // with every candidate, then drop the least-used well while the rest still meet every target.
  const all = await solveOptimalRates(p);
  if (all.status === 'infeasible') return { ...all, installed: Uint8Array.from(all.rates, (q) => (q > 0 ? 1 : 0)) };
  if (all.status !== 'optimal') return all;
  let best = all.rates;
  let bestCost = costOf(best);
  const closed = new Uint8Array(n);
  for (let j = 0; j < n; j++) if (!(best[j]! > 0)) closed[j] = 1;
  const tried = new Uint8Array(n);
  while (Date.now() - started < (timeLimit_s * 1000) / 3) {
    let pick = -1;
    for (let j = 0; j < n; j++) if (!closed[j] && !tried[j] && (pick < 0 || best[j]! < best[pick]!)) pick = j;
    if (pick < 0) break;
    tried[pick] = 1;
    const trial = { ...p, upper: Float64Array.from(p.upper, (u, j) => (closed[j] || j === pick ? 0 : u)) };
    const s = await solveOptimalRates(trial);
    if (s.status === 'optimal' && costOf(s.rates) < bestCost) {
      best = s.rates;
      bestCost = costOf(best);
      closed[pick] = 1;
      for (let j = 0; j < n; j++) if (!(best[j]! > 0)) closed[j] = 1;
      tried.fill(0);
    }
  }

  const rows = [...controlRows(p, allRows(p), null), ...limitRows(p), ...ceilingRows(p)];
  for (let j = 0; j < n; j++) rows.push({ columns: [j, n + j], coefficients: [1, -Math.max(upper_L_s[j]!, 0)], lower: -Infinity, upper: 0 });
  const start = [...Array.from(best, (q) => q * L_PER_M3), ...Array.from(best, (q) => (q > 0 ? 1 : 0))];
  const remaining = Math.max(1, timeLimit_s - (Date.now() - started) / 1000);
  const mip = await solveLinearProgram({
    cost: [...new Array<number>(n).fill(rateCost), ...new Array<number>(n).fill(costs.wellCost)],
    lower: new Array<number>(2 * n).fill(0),
    upper: [...Array.from(upper_L_s), ...new Array<number>(n).fill(1)],
    rows,
    integer: Array.from({ length: n }, (_, j) => n + j),
    timeLimit_s: remaining,
    mipRelativeGap,
    start,
  });
  const greedy = (detail: string): RateSolution => ({
    status: 'time-limit',
    rates: best,
    installed: Uint8Array.from(best, (q) => (q > 0 ? 1 : 0)),
    objective: bestCost,
    detail,
    criticalRow: findCriticalRow(p, best),
  });
  if (mip.status === 'optimal' || mip.status === 'time-limit') {
    const rates = Float64Array.from({ length: n }, (_, j) => Math.max(0, mip.x[j]!) / L_PER_M3);
    const installed = Uint8Array.from({ length: n }, (_, j) => (mip.x[n + j]! > 0.5 ? 1 : 0));
    for (let j = 0; j < n; j++) if (!installed[j]) rates[j] = 0;
    if (mip.objective > bestCost * (1 + 1e-9)) return { ...greedy(`greedy layout (the search found none cheaper: ${mip.detail})`), ...(mip.mipGap !== undefined ? { mipGap: mip.mipGap } : {}) };
    return {
      status: mip.status,
      rates,
      installed,
      objective: mip.objective,
      ...(mip.mipGap !== undefined ? { mipGap: mip.mipGap } : {}),
      detail: mip.detail,
      criticalRow: findCriticalRow(p, rates),
    };
  }
  // The search gave nothing usable (e.g. a numerical failure): the greedy layout still holds.
  return greedy(`greedy layout (search: ${mip.detail})`);
}

/**
 * Which receptors' drawdown limits keep the targets from being met: the control rows and well
 * limits held, each receptor's rows given a slack t_r ≥ 0 (variable metres), Σ t_r minimised.
 * Returns the slack per receptor (0: not in the way), or null when the targets cannot be met even
 * with every receptor limit lifted (then the wells, not the receptors, are the reason).
 */
export async function findBlockingCeilings(p: RateProblem): Promise<Float64Array | null> {
  const c = p.ceilings;
  if (!c || c.max.length === 0) return null;
  const n = p.nWells;
  const nR = c.names.length;
  const rows = [...controlRows(p, allRows(p), null), ...limitRows(p), ...ceilingRows(p, n)];
  const lp = await solveLinearProgram({
    cost: [...new Array<number>(n).fill(0), ...new Array<number>(nR).fill(1)],
    lower: [...lowerBounds(p), ...new Array<number>(nR).fill(0)],
    upper: [...Array.from(p.upper, (u) => u * L_PER_M3), ...new Array<number>(nR).fill(Infinity)],
    rows,
  });
  if (lp.status !== 'optimal') return null;
  return Float64Array.from({ length: nR }, (_, r) => Math.max(0, lp.x[n + r]!));
}

/** Which limits are tight for the given rates: per well, the binding kind (null: none). */
export function findBindingLimits(p: RateProblem, rates: Float64Array): Array<'capacity' | 'suction-lift' | 'air-entry' | 'wetted-screen' | null> {
  const out: Array<'capacity' | 'suction-lift' | 'air-entry' | 'wetted-screen' | null> = new Array(p.nWells).fill(null);
  for (let j = 0; j < p.nWells; j++) if (rates[j]! >= p.upper[j]! * (1 - TIGHT) && p.upper[j]! >= 0 && rates[j]! > 0) out[j] = p.upperKind[j]!;
  for (const lim of p.limits) {
    if (lim.kind === 'interval' || lim.kind === 'mound') continue;
    let act = 0;
    lim.coefficients.forEach((c, j) => (act += c * rates[j]!));
    const tol = TIGHT * Math.max(Math.abs(lim.rhs), 1e-3);
    if (act >= lim.rhs - tol) out[lim.wellIndex] = lim.kind;
  }
  return out;
}
