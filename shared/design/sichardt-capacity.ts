/**
 * Well capacity from Sichardt's limiting entrance velocity.
 *
 * Sichardt (1928), as given in the construction dewatering texts (e.g. Powers et al. 2007;
 * Preene, Roberts & Powrie 2016, CIRIA C750): the water may enter the aquifer face at the
 * screen at no more than v_max = √K / 15 (SI: K in m/s, v in m/s), so a well of radius r_w with
 * a wetted screen length h_w yields at most q_max = 2π·r_w·h_w·√K / 15 (m³/s).
 */

/** Sichardt's limiting entrance velocity v_max = √K / 15, m/s (K in m/s). */
export function sichardtEntranceVelocity(conductivity_m_s: number): number {
  return Math.sqrt(conductivity_m_s) / 15;
}

export interface SichardtCapacityOptions {
  /** Well (screen) radius r_w, m. */
  radius_m: number;
  /** Wetted screen length h_w, m (screen length below the pumping level). */
  wettedLength_m: number;
  /** Hydraulic conductivity K, m/s. */
  conductivity_m_s: number;
}

/** Sichardt (1928) well capacity q_max = 2π·r_w·h_w·√K / 15, m³/s; 0 for a dry screen. */
export function sichardtCapacity({ radius_m, wettedLength_m, conductivity_m_s }: SichardtCapacityOptions): number {
  return 2 * Math.PI * radius_m * Math.max(0, wettedLength_m) * sichardtEntranceVelocity(conductivity_m_s);
}

/**
 * Wetted screen length for a water level `level_m` in the well: the part of the screen
 * [screenBottom_m, screenTop_m] below the level, m (0 when the level is below the screen).
 */
export function wettedScreenLength(screenTop_m: number, screenBottom_m: number, level_m: number): number {
  return Math.max(0, Math.min(screenTop_m, level_m) - screenBottom_m);
}
