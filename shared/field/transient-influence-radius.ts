import { DrydigError } from '../schema';

/** Options of {@link transientInfluenceRadius}. */
export interface TransientInfluenceRadiusOptions {
  /** Transmissivity T, m²/s (> 0). */
  transmissivity_m2_s: number;
  /** Storativity S, or specific yield Sy for an unconfined aquifer (−, > 0). */
  storativity: number;
  /** Time since pumping started, s (≥ 0). */
  time_s: number;
}

/**
 * Transient radius of influence R0 = sqrt(2.25·T·t/S): the distance at which the Cooper–Jacob
 * straight line reaches zero drawdown.
 *
 * Cooper & Jacob (1946) Trans. AGU 27: s = Q/(4πT)·ln(2.25Tt/(r²S)) vanishes at r = R0.
 * The Theis drawdown is not zero there (W(0.5625) ≈ 0.45), so R0 marks where drawdown becomes
 * small, not where it ends.
 *
 * @returns R0, m (0 at t = 0)
 * @throws DrydigError (DRYDIG_ERR_INVALID_REQUEST) for T ≤ 0, S ≤ 0 or t < 0
 */
export function transientInfluenceRadius({ transmissivity_m2_s, storativity, time_s }: TransientInfluenceRadiusOptions): number {
  const bad = (path: string, message: string): never => {
    throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', `transient radius of influence: ${path.slice(1)} ${message}`, [{ path, message }]);
  };
  if (!(transmissivity_m2_s > 0) || !Number.isFinite(transmissivity_m2_s)) bad('/transmissivity_m2_s', 'must be a finite number > 0');
  if (!(storativity > 0) || !Number.isFinite(storativity)) bad('/storativity', 'must be a finite number > 0');
  if (!(time_s >= 0) || !Number.isFinite(time_s)) bad('/time_s', 'must be a finite number ≥ 0');
  return Math.sqrt((2.25 * transmissivity_m2_s * time_s) / storativity);
}
