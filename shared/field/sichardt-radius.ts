import { DrydigError } from '../schema';

/** Options of {@link sichardtRadius}. */
export interface SichardtRadiusOptions {
  /** Design drawdown s at the wells, m (> 0). */
  drawdown_m: number;
  /** Hydraulic conductivity K, m/s (> 0). */
  conductivity_m_s: number;
}

/**
 * Sichardt's empirical radius of influence R = 3000·s·√K (R and s in m, K in m/s).
 *
 * Sichardt (1928), as reproduced in Powers et al. (2007) and Preene et al. (2016, CIRIA C750).
 * An empirical calibration for steady drawdown around wells in sands and gravels; it carries no
 * time and no recharge, so treat the result as an order-of-magnitude estimate.
 *
 * @returns R, m
 * @throws DrydigError (DRYDIG_ERR_INVALID_REQUEST) when s ≤ 0 or K ≤ 0 (no estimate exists)
 */
export function sichardtRadius({ drawdown_m, conductivity_m_s }: SichardtRadiusOptions): number {
  if (!(drawdown_m > 0) || !Number.isFinite(drawdown_m)) {
    throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', `/drawdown_m: Sichardt radius needs a design drawdown > 0 m, got ${drawdown_m}`, [
      { path: '/drawdown_m', message: 'must be a finite number > 0' },
    ]);
  }
  if (!(conductivity_m_s > 0) || !Number.isFinite(conductivity_m_s)) {
    throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', `/conductivity_m_s: Sichardt radius needs a conductivity > 0 m/s, got ${conductivity_m_s}`, [
      { path: '/conductivity_m_s', message: 'must be a finite number > 0' },
    ]);
  }
  return 3000 * drawdown_m * Math.sqrt(conductivity_m_s);
}
