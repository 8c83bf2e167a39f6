/**
 * Well limits as linear rows in the rates, written so that satisfying them guarantees the real
 * (non-linear) limit — conservative, with no iteration.
 *
 * The pumping level in well j is ℓ_j = level(v_j) − C_j·Q_j², with v_j = Σ_k b_jk·Q_k the
 * superposed variable at the well face (drawdown, or Jacob's s_c when unconfined) and C_j the
 * well-loss coefficient (design.md §5). Two kinds of limit:
 * - floor: ℓ_j ≥ L (suction lift for well points: L = header − lift limit);
 * - Sichardt (1928): Q_j ≤ α_j·h_w with α_j = 2π·r_w·√K/15 and h_w = min(screen top, ℓ_j) −
 *   screen bottom, the wetted screen — as the well is drawn down its yield falls.
 *
 * Linearisation, both conservative:
 * - level(v) is linear for confined/leaky aquifers (static − v) and concave for unconfined
 *   (base + sqrt(H² − 2H·v)), so on an interval [v_lo, v_hi] it lies above its chord. The first
 *   solve takes [0, v(limit)]: the chord under-states the level in the well, by up to a few
 *   decimetres at mid-range drawdown and by nothing at the limit itself.
 * - C·Q² ≤ C·((q_lo + q_hi)·Q − q_lo·q_hi) on [q_lo, q_hi] (the secant); first [0, Q̄] with Q̄ the
 *   full-screen capacity, or sqrt((static − screen bottom)/C) when smaller, which no feasible
 *   rate can exceed.
 * Later rounds narrow both intervals around the previous solution (`narrowIntervals`): a bounded
 * number of LP solves, each conservative, each no worse than the one before.
 */
import type { Aquifer, Scenario, Well, WellKind } from '../schema';
import { sichardtEntranceVelocity } from './sichardt-capacity';
import type { LimitRow } from './rate-problem';

/** A well of the design set, with the screen and limits the design uses. */
export interface DesignWell {
  id: string;
  /** Index in `scenario.wells`. */
  scenarioIndex: number;
  x: number;
  y: number;
  radius_m: number;
  kind: WellKind;
  /** Time the well is switched on, s (staged start). */
  start_s: number;
  /** Screen top used, m: the given top, else aquifer top (confined/leaky) or static level; never above the static level. */
  screenTop_m: number;
  /** Screen bottom used, m: the given bottom, else the aquifer base. */
  screenBottom_m: number;
  /** Well-loss coefficient C, s²/m⁵ (0 when not given). */
  wellLoss_s2_m5: number;
  /** Sichardt yield per metre of wetted screen α = 2π·r_w·√K/15, m²/s. */
  capacityPerMetre_m2_s: number;
  /** α × (screen top − screen bottom), m³/s. */
  fullScreenCapacity_m3_s: number;
  /**
   * Lowest pumping level allowed, m: for well points the highest of header − suction lift, the
   * given screen top (air entry: a well point drawn below its screen top sucks air) and the
   * screen bottom; the screen bottom otherwise.
   */
  minimumLevel_m: number;
  /** What sets that floor. */
  floorKind: 'suction-lift' | 'air-entry' | 'wetted-screen';
  /** Share of the Sichardt capacity the design may use (utilisation factor, −; 1 = all of it). */
  capacityFactor?: number;
  /** Injection (recharge) well: the design rate lies in [−injectionCapacity_m3_s, 0]. */
  injection?: boolean;
  /** Most an injection well may inject, m³/s (positive). */
  injectionCapacity_m3_s?: number;
}

/**
 * Share of the Sichardt full-screen capacity an injection well is allowed by default: recharge
 * wells clog and take markedly less than they yield (common practice, from memory; Powers et al.
 * (2007) and CIRIA C750 discuss recharge wells — a pumping or injection test should set it).
 */
export const DEFAULT_INJECTION_SHARE = 0.5;

/** True when the scenario marks the well as injecting: a negative rate, or a negative first non-zero schedule step. */
export function isInjectionWell(w: Well): boolean {
  if (w.rate_m3_s !== undefined) return w.rate_m3_s < 0;
  const first = w.schedule?.find((s) => s.rate_m3_s !== 0);
  return first !== undefined && first.rate_m3_s < 0;
}

/** Largest rate the scenario format allows for one well, m³/s. */
const MAX_WELL_RATE_M3_S = 10;

export interface BuildDesignWellsOptions {
  scenario: Scenario;
  /** Indices into scenario.wells of the design set. */
  indices: number[];
  /** Start time per well id (staged start); absent = 0. */
  startOf: Map<string, number>;
  headerLevel_m: number;
  suctionLiftLimit_m: number;
  /** Share of the Sichardt capacity the rows allow (−). Default 1. */
  capacityFactor?: number;
  /** Well points' given screen top as a floor (air entry). Default false. */
  airEntryCheck?: boolean;
}

/** The design wells with default screens and their limits. */
export function buildDesignWells({ scenario, indices, startOf, headerLevel_m, suctionLiftLimit_m, capacityFactor = 1, airEntryCheck = false }: BuildDesignWellsOptions): DesignWell[] {
  const a = scenario.aquifer;
  const defaultTop = a.kind === 'unconfined' ? a.staticLevel_m : (a.top_m ?? a.staticLevel_m);
  return indices.map((index) => {
    const w: Well = scenario.wells[index]!;
    const screenBottom_m = Math.max(w.screenBottom_m ?? a.base_m, a.base_m);
    // Screen above the water table (or above a confined aquifer's top) passes no water.
    const screenTop_m = Math.min(w.screenTop_m ?? defaultTop, defaultTop);
    const alpha = 2 * Math.PI * w.radius_m * sichardtEntranceVelocity(a.conductivity_m_s);
    const suctionFloor = headerLevel_m - suctionLiftLimit_m;
    const isWellpoint = w.kind === 'wellpoint';
    // Air entry: only a screen top the scenario gives (the default top is the water table itself).
    const airFloor = airEntryCheck && isWellpoint && w.screenTop_m !== undefined ? screenTop_m : -Infinity;
    const floorKind: DesignWell['floorKind'] =
      isWellpoint && Math.max(suctionFloor, airFloor) > screenBottom_m ? (airFloor > suctionFloor ? 'air-entry' : 'suction-lift') : 'wetted-screen';
    const floor = floorKind === 'air-entry' ? airFloor : floorKind === 'suction-lift' ? suctionFloor : screenBottom_m;
    const fullScreen = alpha * Math.max(0, screenTop_m - screenBottom_m);
    const injection = isInjectionWell(w);
    return {
      ...(injection ? { injection, injectionCapacity_m3_s: Math.min(w.injectionCapacity_m3_s ?? DEFAULT_INJECTION_SHARE * fullScreen, MAX_WELL_RATE_M3_S) } : {}),
      id: w.id,
      scenarioIndex: index,
      x: w.x,
      y: w.y,
      radius_m: w.radius_m,
      kind: w.kind,
      start_s: startOf.get(w.id) ?? 0,
      screenTop_m,
      screenBottom_m,
      wellLoss_s2_m5: w.wellLoss_s2_m5 ?? 0,
      capacityPerMetre_m2_s: alpha,
      fullScreenCapacity_m3_s: fullScreen,
      minimumLevel_m: floor,
      floorKind,
      capacityFactor,
    };
  });
}

/**
 * Where the linearisation is taken, per well: the chord of level(v) over [vLo, vHi] and the
 * secant of Q² over [qLo, qHi]. Both lie below / above the curve only inside their interval, so
 * the interval itself is added as rows. Narrower intervals around a previous solution give a
 * tighter (still conservative) row that the previous solution also satisfies, so each
 * tightening round can only lower the objective.
 */
export interface LimitInterval {
  vLo: number;
  vHi: number;
  qLo_m3_s: number;
  qHi_m3_s: number;
}

export interface BuildLimitRowsOptions {
  aquifer: Aquifer;
  wells: DesignWell[];
  /** Face responses: row j = the variable at well j's face per m³/s from each well (nW × nW). */
  faceResponse: Float64Array;
  /** The superposed variable that gives a level exactly (drawdown or s_c). */
  variableForLevel: (level_m: number) => number;
  /** The level for a superposed variable (exact). */
  levelForVariable: (v: number) => number;
  /** Linearisation intervals per well; absent: from no drawdown to the limit, and 0 to the capacity. */
  intervals?: Array<LimitInterval | null>;
  /** Ground level, m: the mound in an injection well stays below it. Default no limit. */
  groundLevel_m?: number;
}

/**
 * The level in an injection well stays at or below ground: level = static − v + C·Q², with
 * level(v) ≤ static − v (confined/leaky exactly; unconfined: the concave level(v) lies under its
 * tangent at v = 0, whose slope is −1) and C·Q² ≤ C·Q̄·|Q| = −C·Q̄·Q on [−Q̄, 0] (the secant).
 * So −Σ b_k·Q_k − C·Q̄·Q_j ≤ ground − static is conservative.
 */
function moundRow(j: number, w: DesignWell, face: Float64Array, aquifer: Aquifer, groundLevel_m: number): LimitRow {
  const coefficients = Float64Array.from(face, (b) => -b);
  coefficients[j] = coefficients[j]! - w.wellLoss_s2_m5 * (w.injectionCapacity_m3_s ?? 0);
  // Ground at or below the static level (artesian): no rise is allowed, so the row asks for none.
  const rhs = Number.isFinite(groundLevel_m) ? Math.max(0, groundLevel_m - aquifer.staticLevel_m) : 1e6;
  return { wellIndex: j, kind: 'mound', coefficients, rhs };
}

export interface WellLimitRows {
  limits: LimitRow[];
  upper: Float64Array;
  upperKind: Array<'capacity' | 'suction-lift' | 'air-entry' | 'wetted-screen'>;
  /** Lower bounds on the rates from the intervals, m³/s. */
  lower: Float64Array;
  /** The intervals used (to be narrowed in the next round). */
  intervals: LimitInterval[];
}

/** Linear, conservative rows for every well's floor and Sichardt limit (see the file comment). */
export function buildLimitRows({ aquifer, wells, faceResponse, variableForLevel, levelForVariable, intervals, groundLevel_m = Infinity }: BuildLimitRowsOptions): WellLimitRows {
  const n = wells.length;
  const staticLevel = aquifer.staticLevel_m;
  const limits: LimitRow[] = [];
  const upper = new Float64Array(n);
  const lower = new Float64Array(n);
  const used: LimitInterval[] = [];
  const upperKind: WellLimitRows['upperKind'] = [];
  wells.forEach((w, j) => {
    if (w.injection) {
      // Injection: Q in [−capacity, 0], no floor or Sichardt row of its own; the mound row below.
      upper[j] = 0;
      lower[j] = -(w.injectionCapacity_m3_s ?? 0);
      upperKind.push('capacity');
      used.push(intervals?.[j] ?? { vLo: 0, vHi: 0, qLo_m3_s: 0, qHi_m3_s: 0 });
      limits.push(moundRow(j, w, faceResponse.subarray(j * n, (j + 1) * n), aquifer, groundLevel_m));
      return;
    }
    let cap = Math.min(w.fullScreenCapacity_m3_s * (w.capacityFactor ?? 1), MAX_WELL_RATE_M3_S);
    let kind: WellLimitRows['upperKind'][number] = 'capacity';
    const C = w.wellLoss_s2_m5;
    if (C > 0) {
      const byLoss = Math.sqrt(Math.max(0, staticLevel - w.screenBottom_m) / C);
      if (byLoss < cap) {
        cap = byLoss;
        kind = 'wetted-screen';
      }
    }
    const hasFloorRow = w.floorKind !== 'wetted-screen';
    if (hasFloorRow && w.minimumLevel_m >= staticLevel) {
      cap = 0;
      kind = w.floorKind;
    }
    const vFloor = variableForLevel(Math.max(w.minimumLevel_m, w.screenBottom_m));
    const given = intervals?.[j] ?? null;
    const iv: LimitInterval = given ?? { vLo: 0, vHi: vFloor, qLo_m3_s: 0, qHi_m3_s: cap };
    const qHi = Math.min(iv.qHi_m3_s, cap);
    const qLo = Math.min(iv.qLo_m3_s, qHi);
    upper[j] = qHi;
    lower[j] = qLo;
    upperKind.push(kind);
    used.push({ ...iv, qLo_m3_s: qLo, qHi_m3_s: qHi });
    const face = faceResponse.subarray(j * n, (j + 1) * n);
    // Well loss C·Q² ≤ C·((qLo + qHi)·Q − qLo·qHi) on [qLo, qHi].
    const lossSlope = C * (qLo + qHi);
    const lossConst = C * qLo * qHi;
    // Level at the face ≥ A − B·v on [vLo, vHi] (exact for confined/leaky: A = static, B = 1).
    const chord = (vLo: number, vHi: number) => {
      if (aquifer.kind !== 'unconfined' || !(vHi > vLo)) return { A: staticLevel, B: 1 };
      const hLo = levelForVariable(vLo);
      const hHi = levelForVariable(vHi);
      const B = (hLo - hHi) / (vHi - vLo);
      return { A: hLo + B * vLo, B };
    };

    if (hasFloorRow && w.minimumLevel_m < staticLevel && cap > 0) {
      const L = w.minimumLevel_m;
      const { A, B } = chord(Math.min(iv.vLo, variableForLevel(L)), Math.min(iv.vHi, variableForLevel(L)));
      const coefficients = Float64Array.from(face, (b) => B * b);
      coefficients[j] = coefficients[j]! + lossSlope;
      limits.push({ wellIndex: j, kind: w.floorKind === 'air-entry' ? 'air-entry' : 'suction-lift', coefficients, rhs: A - L + lossConst });
    }
    if (w.screenBottom_m < staticLevel && cap > 0) {
      const alpha = w.capacityPerMetre_m2_s * (w.capacityFactor ?? 1);
      const vBottom = variableForLevel(w.screenBottom_m);
      const { A, B } = chord(Math.min(iv.vLo, vBottom), Math.min(iv.vHi, vBottom));
      const coefficients = Float64Array.from(face, (b) => alpha * B * b);
      coefficients[j] = coefficients[j]! + 1 + alpha * lossSlope;
      limits.push({ wellIndex: j, kind: 'wetted-screen', coefficients, rhs: alpha * (A - w.screenBottom_m + lossConst) });
    }
    if (aquifer.kind === 'unconfined' && cap > 0) {
      // The chord holds only on [vLo, vHi]: keep the face variable there.
      if (iv.vHi < vFloor) limits.push({ wellIndex: j, kind: 'interval', coefficients: Float64Array.from(face), rhs: iv.vHi });
      if (iv.vLo > 0) limits.push({ wellIndex: j, kind: 'interval', coefficients: Float64Array.from(face, (b) => -b), rhs: -iv.vLo });
    }
  });
  return { limits, upper, upperKind, lower, intervals: used };
}

/**
 * Narrower intervals around a solution (face variable v*, rate Q*): [0.8·v*, v* + 0.5·(v_hi − v*)]
 * and [0.8·Q*, Q* + 0.5·(q_hi − Q*)]. They contain the solution, so it stays feasible; each round
 * halves the distance to the far end, where the chord and the secant err most.
 */
export function narrowIntervals(previous: LimitInterval[], faceValues: Float64Array, rates: Float64Array): LimitInterval[] {
  return previous.map((iv, j) => {
    const v = Math.max(0, faceValues[j]!);
    const q = Math.max(0, rates[j]!);
    const vHi = Math.min(iv.vHi, Math.max(v, v + 0.5 * (iv.vHi - v)));
    const vLo = Math.min(Math.max(iv.vLo, 0.8 * v), v);
    const qHi = Math.min(iv.qHi_m3_s, Math.max(q, q + 0.5 * (iv.qHi_m3_s - q)));
    const qLo = Math.min(Math.max(iv.qLo_m3_s, 0.8 * q), q);
    return { vLo, vHi, qLo_m3_s: qLo, qHi_m3_s: qHi };
  });
}
