import { DrydigError, type Scenario } from '../schema';
import { checkPoints } from './evaluate-points';
import { isInsideBoundaries } from './image-wells';
import { interpretSum, type InterpretedSum } from './interpret-sum';
import { levelFromPotentialDrawdown } from './potential-conversion';
import { prepareField } from './prepare-field';
import type { RateStep } from './rate-steps';
import { getModelRateSteps } from './source-set';
import { superposeAtPoint, superposeByWell, type PointSum } from './superpose';
import { partialPenetrationAt } from './partial-penetration-sum';
import type { ModelInfo } from './types';

/** Options of {@link unitResponseMatrix}. */
export interface UnitResponseMatrixOptions {
  scenario: Scenario;
  /** Points where levels are constrained, [x, y] in m. */
  points: ReadonlyArray<readonly [number, number]>;
  /** Undefined: the design time; null: steady state. */
  time_s?: number | null;
  /** Wells whose rates are the unknowns (default: every well, active or not, in scenario order). */
  wellIds?: readonly string[];
}

/** Linear response of the field to the rates of chosen wells. */
export interface UnitResponseMatrix {
  wellIds: string[];
  points: Array<readonly [number, number]>;
  /**
   * Row-major nPoints × nWells: entry (i, j) is the superposed variable at point i per 1 m³/s
   * pumped constantly from t = 0 by well j, its images included, m per m³/s.
   */
  values: Float64Array;
  /** drawdown (confined/leaky) or discharge-potential drawdown s_c (unconfined). */
  variable: 'drawdown' | 'discharge-potential';
  /**
   * The same variable at each point from the active wells NOT in wellIds, pumping their own
   * rates / schedules (0 when every pumping well is a variable), m.
   */
  background: Float64Array;
  /** 1 where point i lies across a boundary (outside the aquifer; its row is zero). */
  outside: Uint8Array;
  /** Level for a summed variable at point i (background + Σ values·rates), m; unconfined dewatered → base. */
  toLevel: (potentialSum: number, pointIndex: number) => number;
  /** Drawdown for a summed variable at point i, m (unconfined: H − h exactly). */
  toDrawdown: (potentialSum: number, pointIndex: number) => number;
  /** Model used; for two parallel boundaries truncationBound_m is per 1 m³/s of one well. */
  model: ModelInfo;
}

/**
 * The linear map from well rates to the superposed variable at points, for the design solver.
 * With levelFromPotentialDrawdown / potentialDrawdownForLevel, "level ≤ target" becomes exactly
 * background + Σ_j values(i, j)·Q_j ≥ potentialDrawdownForLevel(target) (Theis / Thiem / Hantush /
 * de Glee are linear in Q; unconfined via the Jacob/Dupuit discharge potential).
 *
 * @throws DrydigError naming `/wellIds/k` for an unknown well, or the scenario / point field
 */
export function unitResponseMatrix({ scenario, points, time_s, wellIds }: UnitResponseMatrixOptions): UnitResponseMatrix {
  checkPoints(points);
  const ids = wellIds ? [...wellIds] : scenario.wells.map((w) => w.id);
  const indexById = new Map(scenario.wells.map((w, i) => [w.id, i] as const));
  const columns = ids.map((id, k) => {
    const i = indexById.get(id);
    if (i === undefined) {
      throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', `/wellIds/${k}: no well "${id}" in the scenario`, [
        { path: `/wellIds/${k}`, message: `names no well in the scenario ("${id}")` },
      ]);
    }
    return i;
  });
  const isVariable = new Set(columns);
  if (isVariable.size !== columns.length) {
    const k = columns.findIndex((c, j) => columns.indexOf(c) !== j);
    throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', `/wellIds/${k}: well "${ids[k]}" is listed twice`, [
      { path: `/wellIds/${k}`, message: 'repeats a well listed before' },
    ]);
  }
  const unit: RateStep[] = [{ from_s: 0, deltaRate_m3_s: 1 }];
  // One source set holds the unit sources of the variable wells; another the fixed background.
  const unitField = prepareField({ scenario, time_s, stepsOf: (i) => (isVariable.has(i) ? unit : []), boundRate_m3_s: 1 });
  const backgroundField = prepareField({
    scenario,
    time_s,
    stepsOf: (i) => (isVariable.has(i) ? [] : getModelRateSteps(scenario, unitField.model, i)),
  });

  const nP = points.length;
  const nW = columns.length;
  const values = new Float64Array(nP * nW);
  const background = new Float64Array(nP);
  const outside = new Uint8Array(nP);
  const columnOfWell = new Int32Array(scenario.wells.length).fill(-1);
  columns.forEach((wi, j) => {
    columnOfWell[wi] = j;
  });
  const sum: PointSum = { value: 0, withinWell: false, reached: false };
  points.forEach(([x, y], p) => {
    if (!isInsideBoundaries(unitField.geometry, x, y)) {
      outside[p] = 1;
      return;
    }
    superposeByWell(unitField.sources, x, y, values, p * nW, columnOfWell);
    background[p] = superposeAtPoint(backgroundField.sources, x, y, sum).value;
    const penetration = unitField.penetration;
    if (penetration) {
      partialPenetrationAt(penetration, unitField.sources, x, y, -1, { row: values, rowOffset: p * nW, column: columnOfWell });
      background[p]! += partialPenetrationAt(penetration, backgroundField.sources, x, y);
    }
  });

  const aquifer = scenario.aquifer;
  const model = unitField.model;
  const scratch: InterpretedSum = { level_m: 0, drawdown_m: 0, flagBits: 0 };
  return {
    wellIds: ids,
    points: points.map((p) => [p[0], p[1]] as const),
    values,
    variable: model.variable,
    background,
    outside,
    toLevel: (potentialSum) => levelFromPotentialDrawdown({ aquifer, potentialDrawdown_m: potentialSum }),
    toDrawdown: (potentialSum) => interpretSum(model, potentialSum, scratch).drawdown_m,
    model: unitField.info,
  };
}
