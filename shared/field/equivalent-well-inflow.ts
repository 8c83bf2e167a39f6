import { DrydigError, type Scenario } from '../schema';
import { getPolygonArea } from '../geometry';
import { besselK0, hantushWellFunction, theisWellFunction } from '../wells';
import { formatMetres, getTransmissivity, resolveTime, type FieldModel } from './field-model';
import { sichardtRadius } from './sichardt-radius';

/** Options of {@link equivalentWellInflow}. */
export interface EquivalentWellInflowOptions {
  scenario: Scenario;
  /** Id of the excavation in scenario.excavations. */
  excavationId: string;
  /** Undefined: the scenario's design time; null: steady state. */
  time_s?: number | null;
}

/** The equivalent-well estimate of total inflow to an excavation. */
export interface EquivalentWellInflow {
  excavationId: string;
  /** Total rate to hold the target level at the equivalent radius, m³/s. */
  rate_m3_s: number;
  /** r_e = sqrt(A/π), m. */
  equivalentRadius_m: number;
  /** Drawdown needed at r_e: static level − (formation − margin), m. */
  drawdown_m: number;
  targetLevel_m: number;
  method: FieldModel['method'];
  /** Steady confined/unconfined: R0 = r_e + R measured from the centre, m. */
  influenceRadius_m?: number;
  influenceRadiusSource?: 'scenario' | 'sichardt';
  /** Transient: u = r_e²S/(4Tt) at the design time. */
  u?: number;
  /** Transient: whether Cooper–Jacob's straight line would be valid (u < 0.05). */
  cooperJacobValid?: boolean;
  /** Plain-language assumptions and cautions. */
  assumptions: string[];
}

/**
 * Quick estimate of the total inflow to a compact excavation by the equivalent-well method: the
 * well field replaced by one large well of radius r_e = sqrt(A/π) holding the target drawdown.
 *
 * - steady confined: Thiem Q = 2πT·s / ln(R0/r_e);
 * - steady unconfined: Dupuit Q = πK·(H² − h²) / ln(R0/r_e), h = H − s;
 * - steady leaky: de Glee Q = 2πT·s / K0(r_e/B);
 * - transient (design time t): Theis Q = 4πT·s / W(u), u = r_e²S/(4Tt) — the exact Theis form at
 *   r_e, which reduces to Cooper–Jacob's ln(2.25Tt/(r_e²S)) for small u; unconfined with T = K·H,
 *   S = Sy and s replaced by Jacob's s − s²/(2H); leaky with W(u, r_e/B) (Hantush & Jacob 1955).
 *
 * R0 = r_e + R with R the scenario's radius of influence or Sichardt's 3000·s·√K, measured from the
 * edge of the excavation (the equivalent-well convention of the dewatering texts, e.g. Preene et
 * al. 2016 CIRIA C750 — from memory).
 *
 * @throws DrydigError naming `/excavationId` (unknown id) or the excavation's formation level
 *   when the target lies at or below the base of an unconfined aquifer
 */
export function equivalentWellInflow({ scenario, excavationId, time_s }: EquivalentWellInflowOptions): EquivalentWellInflow {
  const index = scenario.excavations.findIndex((e) => e.id === excavationId);
  const excavation = scenario.excavations[index];
  if (!excavation) {
    throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', `/excavationId: no excavation "${excavationId}" in the scenario`, [
      { path: '/excavationId', message: `names no excavation in the scenario ("${excavationId}")` },
    ]);
  }
  const a = scenario.aquifer;
  const t = resolveTime(scenario, time_s);
  const area = getPolygonArea(excavation.outline);
  const re = Math.sqrt(area / Math.PI);
  const target = excavation.formationLevel_m - excavation.margin_m;
  const s = a.staticLevel_m - target;
  const T = getTransmissivity(a);
  const K = a.conductivity_m_s;
  const steady = t === null;
  const method: FieldModel['method'] =
    a.kind === 'leaky' ? (steady ? 'de-glee' : 'hantush-jacob') : a.kind === 'confined' ? (steady ? 'thiem' : 'theis') : steady ? 'dupuit-thiem' : 'theis-unconfined';
  const assumptions = [
    `Equivalent well of radius r_e = sqrt(A/π) = ${formatMetres(re)} m for the ${formatMetres(area)} m² excavation; valid for compact plans (length up to a few times the width) — long trenches need a line-sink treatment.`,
    'Idealised: homogeneous, isotropic aquifer, fully penetrating wells at the excavation edge, no boundaries; an estimate for bidding, not a design. Confirm with site investigation, local codes and a licensed engineer.',
  ];
  const result: EquivalentWellInflow = { excavationId, rate_m3_s: 0, equivalentRadius_m: re, drawdown_m: s, targetLevel_m: target, method, assumptions };
  if (!(s > 0)) {
    assumptions.push(`The target level ${formatMetres(target)} m is at or above the static level ${formatMetres(a.staticLevel_m)} m: no lowering is needed.`);
    return result;
  }
  const H = a.staticLevel_m - a.base_m;
  if (a.kind === 'unconfined' && s >= H) {
    const path = `/excavations/${index}/formationLevel_m`;
    throw new DrydigError('DRYDIG_ERR_INVALID_SCENARIO', `${path}: the target level ${target} m is at or below the aquifer base ${a.base_m} m; wells cannot draw an unconfined aquifer to its base`, [
      { path, message: `minus the margin lies at or below the aquifer base (${a.base_m} m)` },
    ]);
  }
  if (a.kind !== 'unconfined' && target < a.base_m) {
    const path = `/excavations/${index}/formationLevel_m`;
    throw new DrydigError('DRYDIG_ERR_INVALID_SCENARIO', `${path}: the target level ${target} m is below the base ${a.base_m} m of the ${a.kind} aquifer; no head in it can fall that low (the aquifer drains first)`, [
      { path, message: `minus the margin lies below the aquifer base (${a.base_m} m)` },
    ]);
  }
  if (a.kind !== 'unconfined' && a.top_m !== undefined && target < a.top_m) {
    assumptions.push(`The target ${formatMetres(target)} m is below the aquifer top ${formatMetres(a.top_m)} m: near the excavation the aquifer turns unconfined. At steady state the thinner saturated section makes the confined formula slightly overstate the rate; in a transient run the water drained from the dewatered zone (specific yield) is not counted, so the rate needed to reach the target in time may be understated.`);
  }

  if (steady) {
    if (a.kind === 'leaky') {
      const B = a.leakageFactor_m!;
      result.rate_m3_s = (2 * Math.PI * T * s) / besselK0(re / B);
      assumptions.push('Steady leaky aquifer: de Glee (1930); no radius of influence is needed.');
      return result;
    }
    let R: number;
    if (a.influenceRadius_m !== undefined) {
      R = a.influenceRadius_m;
      result.influenceRadiusSource = 'scenario';
    } else {
      R = sichardtRadius({ drawdown_m: s, conductivity_m_s: K });
      result.influenceRadiusSource = 'sichardt';
    }
    const R0 = re + R;
    result.influenceRadius_m = R0;
    assumptions.push(
      `Radius of influence R0 = r_e + R = ${formatMetres(R0)} m (${result.influenceRadiusSource === 'sichardt' ? `Sichardt R = 3000·s·√K = ${formatMetres(R)} m` : `R = ${formatMetres(R)} m from the scenario`}); the rate varies with 1/ln(R0/r_e), so it is not very sensitive to R.`,
    );
    const lnRatio = Math.log(R0 / re);
    if (a.kind === 'confined') {
      result.rate_m3_s = (2 * Math.PI * T * s) / lnRatio;
    } else {
      const h = H - s;
      result.rate_m3_s = (Math.PI * K * (H * H - h * h)) / lnRatio;
    }
    return result;
  }

  const time = t;
  if (!(time > 0)) {
    throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', '/time_s: the equivalent-well estimate needs a design time > 0 s (or null for steady state)', [
      { path: '/time_s', message: 'must be > 0 s or null' },
    ]);
  }
  const S = a.kind === 'unconfined' ? a.specificYield! : a.storativity!;
  const u = (re * re * S) / (4 * T * time);
  result.u = u;
  result.cooperJacobValid = u < 0.05;
  const sEff = a.kind === 'unconfined' ? s - (s * s) / (2 * H) : s;
  const W = a.kind === 'leaky' ? hantushWellFunction(u, re / a.leakageFactor_m!) : theisWellFunction(u);
  result.rate_m3_s = (4 * Math.PI * T * sEff) / W;
  assumptions.push(
    `Transient at t = ${time} s: Theis form Q = 4πT·s/W(u) with u = ${u.toPrecision(3)}${u < 0.05 ? ' (Cooper–Jacob’s straight line would agree within about 2 %)' : ' (too large for Cooper–Jacob; the full W(u) is used)'}; the rate is the one that reaches the target at that time, and it is higher for a shorter time.`,
  );
  if (a.kind === 'unconfined') assumptions.push('Unconfined: T = K·H and S = Sy, with the drawdown through Jacob’s correction s − s²/(2H).');
  return result;
}
