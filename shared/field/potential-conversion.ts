/**
 * Exact conversions between the superposed variable and the groundwater level.
 *
 * Unconfined: the discharge-potential drawdown s_c = (H² − h²)/(2H), h the saturated thickness
 * (level − base), H its static value. It is Jacob's (1944) corrected drawdown s_c = s − s²/(2H)
 * written the other way, and it superposes linearly (Dupuit 1863; Kruseman & de Ridder 1994 ch. 3).
 * Confined and leaky: s = static − h itself superposes.
 */
import { DrydigError, type Aquifer } from '../schema';

/** Options of {@link levelFromPotentialDrawdown}. */
export interface LevelFromPotentialDrawdownOptions {
  aquifer: Aquifer;
  /** Superposed drawdown: s_c (unconfined) or s (confined/leaky), m. */
  potentialDrawdown_m: number;
}

/**
 * Level for a superposed drawdown, m: unconfined h = base + sqrt(H² − 2H·s_c), confined/leaky
 * static − s. Where 2H·s_c ≥ H² the unconfined aquifer is dewatered and the level is the base
 * (evaluations flag such points "dewatered").
 */
export function levelFromPotentialDrawdown({ aquifer, potentialDrawdown_m }: LevelFromPotentialDrawdownOptions): number {
  // A confined head below the base means the aquifer is drained there: held at the base.
  if (aquifer.kind !== 'unconfined') return Math.max(aquifer.staticLevel_m - potentialDrawdown_m, aquifer.base_m);
  const H = aquifer.staticLevel_m - aquifer.base_m;
  const disc = H * H - 2 * H * potentialDrawdown_m;
  return disc > 0 ? aquifer.base_m + Math.sqrt(disc) : aquifer.base_m;
}

/** Options of {@link potentialDrawdownForLevel}. */
export interface PotentialDrawdownForLevelOptions {
  aquifer: Aquifer;
  /** A groundwater level, m (unconfined: at or above the base). */
  level_m: number;
}

/**
 * Superposed drawdown that gives a level exactly, m: unconfined s_c = (H² − (h − base)²)/(2H),
 * confined/leaky static − h. "Level ≤ target" is then "Σ unit responses × rates ≥ this", a linear
 * constraint on the rates (level falls monotonically as s_c rises).
 *
 * @throws DrydigError (DRYDIG_ERR_INVALID_REQUEST, path /level_m) for an unconfined level below
 *   the aquifer base: groundwater in this model cannot be lowered below the base
 */
export function potentialDrawdownForLevel({ aquifer, level_m }: PotentialDrawdownForLevelOptions): number {
  if (aquifer.kind !== 'unconfined') return aquifer.staticLevel_m - level_m;
  const H = aquifer.staticLevel_m - aquifer.base_m;
  const h = level_m - aquifer.base_m;
  if (!(h >= 0)) {
    throw new DrydigError(
      'DRYDIG_ERR_INVALID_REQUEST',
      `/level_m: level ${level_m} m is below the aquifer base (${aquifer.base_m} m); an unconfined aquifer cannot be drawn below its base`,
      [{ path: '/level_m', message: `is below the aquifer base ${aquifer.base_m} m` }],
    );
  }
  return (H * H - h * h) / (2 * H);
}
