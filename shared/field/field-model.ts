/**
 * The aquifer model a field evaluation uses: which published method, with which derived
 * parameters (T, S, H, R), and the plain-language assumptions to show beside the results.
 */
import { DrydigError, type Aquifer, type AquiferKind, type Scenario } from '../schema';
import type { ModelInfo } from './types';
import { sichardtRadius } from './sichardt-radius';
import { CONFINED_TO_UNCONFINED_EFFECT } from './validity-wording';

/** Which quantity superposes linearly for the aquifer kind. */
export type FieldVariable = 'drawdown' | 'discharge-potential';

/** Derived parameters of one evaluation (internal to the field engine, exported for its helpers). */
export interface FieldModel {
  kind: AquiferKind;
  method: ModelInfo['method'];
  /** Evaluation time, s; null for steady state. */
  time_s: number | null;
  /** T, m²/s: K·(top − base) confined/leaky, K·H unconfined. */
  transmissivity_m2_s: number;
  /** S (confined/leaky) or Sy (unconfined), −. */
  storativity: number;
  /** Confined/leaky: aquifer thickness b, m. Unconfined: static saturated thickness H, m. */
  thickness_m: number;
  staticLevel_m: number;
  base_m: number;
  /** Confined/leaky: aquifer top, m. */
  top_m?: number;
  /** Leaky: B, m. */
  leakageFactor_m?: number;
  /** Steady confined/unconfined: R, m. */
  influenceRadius_m?: number;
  influenceRadiusSource?: 'scenario' | 'sichardt';
  variable: FieldVariable;
  notes: string[];
}

/** Lowest target level over the excavations (formation − margin) and the drawdown it needs. */
export interface DesignDrawdown {
  /** Static level minus the lowest target level, m (may be ≤ 0 when no lowering is needed). */
  drawdown_m: number;
  /** The excavation setting it; undefined when the scenario has none. */
  excavationId?: string;
  targetLevel_m?: number;
}

/** The design drawdown of a scenario: static level − min over excavations of (formation − margin). */
export function getDesignDrawdown(scenario: Scenario): DesignDrawdown {
  let lowest: { id: string; level: number } | undefined;
  for (const e of scenario.excavations) {
    const level = e.formationLevel_m - e.margin_m;
    if (!lowest || level < lowest.level) lowest = { id: e.id, level };
  }
  if (!lowest) return { drawdown_m: 0 };
  return { drawdown_m: scenario.aquifer.staticLevel_m - lowest.level, excavationId: lowest.id, targetLevel_m: lowest.level };
}

const requireField = <T>(value: T | undefined, path: string, what: string): T => {
  if (value === undefined) {
    throw new DrydigError('DRYDIG_ERR_INVALID_SCENARIO', `${path}: ${what}`, [{ path, message: what }]);
  }
  return value;
};

/** Options of {@link resolveFieldModel}. */
export interface ResolveFieldModelOptions {
  scenario: Scenario;
  /** Evaluation time, s. Undefined: the scenario's design time. Null: steady state. */
  time_s?: number | null;
}

/** Resolves the evaluation time: undefined → design time; checks it is finite. */
export function resolveTime(scenario: Scenario, time_s: number | null | undefined): number | null {
  const t = time_s === undefined ? scenario.design.time_s : time_s;
  if (t !== null && !Number.isFinite(t)) {
    throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', `/time_s: must be a finite number of seconds or null, got ${String(t)}`, [
      { path: '/time_s', message: 'must be a finite number of seconds or null (steady state)' },
    ]);
  }
  return t;
}

/** Transmissivity T of the aquifer, m²/s: K·(top − base) confined/leaky, K·(static − base) unconfined. */
export function getTransmissivity(aquifer: Aquifer): number {
  return aquifer.conductivity_m_s * getThickness(aquifer);
}

function getThickness(aquifer: Aquifer): number {
  if (aquifer.kind === 'unconfined') return aquifer.staticLevel_m - aquifer.base_m;
  const top = requireField(aquifer.top_m, '/aquifer/top_m', `is required for a ${aquifer.kind} aquifer`);
  return top - aquifer.base_m;
}

/**
 * Derives the method and parameters for a scenario at a time (see design.md section 5).
 * Steady confined/unconfined runs take R from `aquifer.influenceRadius_m`, else Sichardt's
 * R = 3000·s·√K with s the design drawdown ({@link getDesignDrawdown}).
 *
 * @throws DrydigError (DRYDIG_ERR_INVALID_SCENARIO) naming the missing or unusable field
 */
export function resolveFieldModel({ scenario, time_s }: ResolveFieldModelOptions): FieldModel {
  const a = scenario.aquifer;
  const t = resolveTime(scenario, time_s);
  const thickness = getThickness(a);
  if (!(thickness > 0)) {
    const path = a.kind === 'unconfined' ? '/aquifer/staticLevel_m' : '/aquifer/top_m';
    throw new DrydigError('DRYDIG_ERR_INVALID_SCENARIO', `${path}: the aquifer has no saturated thickness (${thickness} m)`, [
      { path, message: `gives a saturated thickness of ${thickness} m; it must be > 0` },
    ]);
  }
  const T = a.conductivity_m_s * thickness;
  const steady = t === null;
  const notes: string[] = [
    'Idealised model: homogeneous aquifer of uniform thickness (isotropic except for the Kh/Kv of the partial-penetration correction), infinite except for the stated straight boundaries; wells screened over part of the aquifer get Hantush’s correction, the rest penetrate fully. Results are estimates; confirm with site investigation, local codes and a licensed engineer.',
  ];

  const base: Omit<FieldModel, 'method' | 'storativity' | 'variable'> = {
    kind: a.kind,
    time_s: t,
    transmissivity_m2_s: T,
    thickness_m: thickness,
    staticLevel_m: a.staticLevel_m,
    base_m: a.base_m,
    notes,
  };
  if (a.top_m !== undefined && a.kind !== 'unconfined') base.top_m = a.top_m;

  if (a.kind === 'leaky') {
    const S = requireField(a.storativity, '/aquifer/storativity', 'is required for a leaky aquifer');
    const B = requireField(a.leakageFactor_m, '/aquifer/leakageFactor_m', 'is required for a leaky aquifer');
    notes.push(
      steady
        ? 'Steady state in a leaky aquifer: de Glee (1930), s = Q/(2πT)·K0(r/B); leakage through the aquitard from an unpumped layer of constant head balances the pumping.'
        : 'Leaky aquifer, transient: Hantush & Jacob (1955), s = Q/(4πT)·W(u, r/B); aquitard storage neglected, the layer above keeps its head.',
    );
    return { ...base, method: steady ? 'de-glee' : 'hantush-jacob', storativity: S, leakageFactor_m: B, variable: 'drawdown' };
  }

  const storativity =
    a.kind === 'confined'
      ? requireField(a.storativity, '/aquifer/storativity', 'is required for a confined aquifer')
      : requireField(a.specificYield, '/aquifer/specificYield', 'is required for an unconfined aquifer');
  const variable: FieldVariable = a.kind === 'unconfined' ? 'discharge-potential' : 'drawdown';
  const model: FieldModel = {
    ...base,
    method: a.kind === 'confined' ? (steady ? 'thiem' : 'theis') : steady ? 'dupuit-thiem' : 'theis-unconfined',
    storativity,
    variable,
  };

  if (a.kind === 'unconfined') {
    notes.push(
      steady
        ? 'Unconfined, steady: Dupuit–Thiem, H² − h² = Q/(πK)·ln(R/r), superposed in H² − h² (Dupuit 1863, Thiem 1906); no seepage face at the well, no recharge.'
        : 'Unconfined, transient: Theis on the discharge potential with T = K·H, S = Sy, then s = H − sqrt(H² − 2H·s_c) (the inverse of Jacob’s 1944 correction); delayed (gravity) drainage is not modelled: in the first hours to days the aquifer answers with its much smaller elastic storage, so real early drawdown can exceed this estimate before it converges to it.',
      'Dupuit assumptions degrade where drawdown exceeds about a quarter of the saturated thickness (flag "large-drawdown"); levels inside a pumping well exclude the seepage face.',
    );
  } else {
    notes.push(
      steady
        ? 'Confined, steady: Thiem (1906), s = Q/(2πT)·ln(R/r).'
        : 'Confined, transient: Theis (1935), s = Q/(4πT)·W(u), u = r²S/(4Tt).',
      `Where the head falls below the aquifer top the aquifer turns unconfined locally (flag "confined-to-unconfined"): ${CONFINED_TO_UNCONFINED_EFFECT}; treat levels there as approximate.`,
    );
  }

  if (steady) {
    if (a.influenceRadius_m !== undefined) {
      model.influenceRadius_m = a.influenceRadius_m;
      model.influenceRadiusSource = 'scenario';
      notes.push(`Radius of influence R = ${formatMetres(a.influenceRadius_m)} m from the scenario; each source adds nothing beyond R.`);
    } else {
      const design = getDesignDrawdown(scenario);
      if (!(design.drawdown_m > 0)) {
        throw new DrydigError(
          'DRYDIG_ERR_INVALID_SCENARIO',
          '/aquifer/influenceRadius_m: a steady run needs a radius of influence; give influenceRadius_m or an excavation whose target level is below the static level',
          [{ path: '/aquifer/influenceRadius_m', message: 'is required for a steady run when no excavation target lies below the static level' }],
        );
      }
      const R = sichardtRadius({ drawdown_m: design.drawdown_m, conductivity_m_s: a.conductivity_m_s });
      model.influenceRadius_m = R;
      model.influenceRadiusSource = 'sichardt';
      notes.push(
        `Radius of influence R = ${formatMetres(R)} m by Sichardt (1928), R = 3000·s·√K with the design drawdown s = ${formatMetres(design.drawdown_m)} m (excavation "${design.excavationId ?? ''}"); an empirical estimate: give aquifer.influenceRadius_m when a pumping test or boundary fixes it. Each source adds nothing beyond R.`,
      );
    }
  }
  return model;
}

/** Metres to a short string for notes (3 significant figures, no exponent for site scales). */
export function formatMetres(value_m: number): string {
  if (value_m === 0) return '0';
  const abs = Math.abs(value_m);
  if (abs >= 1000) return value_m.toFixed(0);
  return Number(value_m.toPrecision(3)).toString();
}
