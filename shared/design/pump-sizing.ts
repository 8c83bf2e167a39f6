/**
 * Pump head, power and counts for the bid. Hydraulic power P = ρ·g·Q·H (any fluid mechanics
 * text); input (electrical) power P / η with η the wire-to-water efficiency.
 */

/** Density of water used for pump power, kg/m³ (fresh water near 10 °C, rounded). */
export const WATER_DENSITY_KG_M3 = 1000;
/** Standard gravity g, m/s² (CGPM 1901, exact). */
export const STANDARD_GRAVITY_M_S2 = 9.80665;

export interface TotalDynamicHeadOptions {
  /** Level the water is lifted to before the discharge line: ground level or header level, m. */
  dischargeLevel_m: number;
  /** Pumping level in the well (aquifer level at the well face minus well loss), m. */
  pumpingLevel_m: number;
  /** Pressure head at the discharge point, m. */
  dischargeHead_m: number;
  /** Friction loss allowance in riser, header and discharge main, m. */
  frictionAllowance_m: number;
}

/**
 * Total dynamic head H = (discharge level − pumping level) + discharge head + friction, m.
 * The static lift is measured from the pumping level inside the well, which already includes
 * the well loss C·Q² (design.md §5), so no separate well-loss term is added.
 */
export function totalDynamicHead({ dischargeLevel_m, pumpingLevel_m, dischargeHead_m, frictionAllowance_m }: TotalDynamicHeadOptions): number {
  return Math.max(0, dischargeLevel_m - pumpingLevel_m) + dischargeHead_m + frictionAllowance_m;
}

export interface PumpPowerOptions {
  /** Flow, m³/s. */
  rate_m3_s: number;
  /** Total dynamic head, m. */
  head_m: number;
  /** Wire-to-water efficiency η (0–1]. */
  efficiency: number;
}

export interface PumpPower {
  /** ρ·g·Q·H, W. */
  hydraulic_W: number;
  /** ρ·g·Q·H / η, W. */
  input_W: number;
}

/** Hydraulic power ρ·g·Q·H and input power ρ·g·Q·H/η, W. */
export function pumpPower({ rate_m3_s, head_m, efficiency }: PumpPowerOptions): PumpPower {
  const hydraulic_W = WATER_DENSITY_KG_M3 * STANDARD_GRAVITY_M_S2 * Math.max(0, rate_m3_s) * head_m;
  return { hydraulic_W, input_W: hydraulic_W / efficiency };
}

export interface PumpCountOptions {
  /** Flow the duty pumps must deliver (safety factor included), m³/s. */
  flow_m3_s: number;
  /** Rated flow of one pump set, m³/s. */
  pumpCapacity_m3_s: number;
  /** Standby pumps per duty pump; rounded up, at least one when any duty pump runs. */
  standbyRatio: number;
}

/** Duty pumps = ⌈Q / Q_pump⌉; standby = max(1, ⌈duty · ratio⌉) (common practice). */
export function pumpCounts({ flow_m3_s, pumpCapacity_m3_s, standbyRatio }: PumpCountOptions): { duty: number; standby: number } {
  if (flow_m3_s <= 0) return { duty: 0, standby: 0 };
  const duty = Math.ceil(flow_m3_s / pumpCapacity_m3_s - 1e-9);
  return { duty, standby: Math.max(1, Math.ceil(duty * standbyRatio - 1e-9)) };
}
