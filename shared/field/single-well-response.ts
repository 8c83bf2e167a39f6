/**
 * Drawdown around one fully penetrating well in an infinite, homogeneous aquifer, per aquifer
 * kind (the building blocks the field engine superposes; design.md section 5).
 */
import { DrydigError } from '../schema';
import { besselK0, hantushWellFunction, theisWellFunction } from '../wells';
import { LARGE_DRAWDOWN_FRACTION } from './interpret-sum';
import type { PointFlag } from './types';

/** A single-well drawdown with its validity flags (unconfined responses). */
export interface SingleWellResult {
  /** Drawdown, m (positive down). */
  drawdown_m: number;
  flags: PointFlag[];
}

const need = (value: number, name: string, positive = true): void => {
  const ok = Number.isFinite(value) && (positive ? value > 0 : true);
  if (!ok) {
    throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', `/${name}: must be a finite number${positive ? ' > 0' : ''}, got ${String(value)}`, [
      { path: `/${name}`, message: `must be a finite number${positive ? ' > 0' : ''}` },
    ]);
  }
};

/** Options shared by the transient confined responses. */
export interface TheisOptions {
  /** Pumping rate Q, m³/s (+ abstraction). */
  rate_m3_s: number;
  /** Transmissivity T, m²/s. */
  transmissivity_m2_s: number;
  /** Storativity S (−). */
  storativity: number;
  /** Distance from the well axis r, m (> 0). */
  distance_m: number;
  /** Time since pumping started t, s (≤ 0 gives 0). */
  time_s: number;
}

/** Theis (1935): s = Q/(4πT)·W(u), u = r²S/(4Tt). 0 for t ≤ 0. */
export function theisDrawdown(o: TheisOptions): number {
  need(o.rate_m3_s, 'rate_m3_s', false);
  need(o.transmissivity_m2_s, 'transmissivity_m2_s');
  need(o.storativity, 'storativity');
  need(o.distance_m, 'distance_m');
  need(o.time_s, 'time_s', false);
  if (o.time_s <= 0) return 0;
  const u = (o.distance_m ** 2 * o.storativity) / (4 * o.transmissivity_m2_s * o.time_s);
  return (o.rate_m3_s / (4 * Math.PI * o.transmissivity_m2_s)) * theisWellFunction(u);
}

/**
 * Cooper & Jacob (1946): s = Q/(4πT)·ln(2.25Tt/(r²S)), the small-u form of Theis; valid for
 * u = r²S/(4Tt) below about 0.05 (its error then is under ~2 % of W). Not used by the engine,
 * which always evaluates W(u) exactly; provided for checks and quick hand calculations.
 */
export function cooperJacobDrawdown(o: TheisOptions): number {
  need(o.transmissivity_m2_s, 'transmissivity_m2_s');
  need(o.storativity, 'storativity');
  need(o.distance_m, 'distance_m');
  need(o.time_s, 'time_s');
  return (o.rate_m3_s / (4 * Math.PI * o.transmissivity_m2_s)) * Math.log((2.25 * o.transmissivity_m2_s * o.time_s) / (o.distance_m ** 2 * o.storativity));
}

/** Options of {@link thiemDrawdown}. */
export interface ThiemOptions {
  /** Pumping rate Q, m³/s. */
  rate_m3_s: number;
  /** Transmissivity T, m²/s. */
  transmissivity_m2_s: number;
  /** Distance r, m (> 0). */
  distance_m: number;
  /** Radius of influence R, m. */
  influenceRadius_m: number;
}

/** Thiem (1906): s = Q/(2πT)·ln(R/r) for r < R, 0 beyond. */
export function thiemDrawdown(o: ThiemOptions): number {
  need(o.transmissivity_m2_s, 'transmissivity_m2_s');
  need(o.distance_m, 'distance_m');
  need(o.influenceRadius_m, 'influenceRadius_m');
  if (o.distance_m >= o.influenceRadius_m) return 0;
  return (o.rate_m3_s / (2 * Math.PI * o.transmissivity_m2_s)) * Math.log(o.influenceRadius_m / o.distance_m);
}

/** Options of {@link unconfinedDrawdownFromPotential}. */
export interface PotentialDrawdownOptions {
  /** Static saturated thickness H, m. */
  saturatedThickness_m: number;
  /** Discharge-potential drawdown s_c, m. */
  potentialDrawdown_m: number;
}

/** Options of {@link jacobCorrectedDrawdown}. */
export interface JacobCorrectionOptions {
  /** Static saturated thickness H, m. */
  saturatedThickness_m: number;
  /** Unconfined drawdown s, m. */
  drawdown_m: number;
}

/**
 * Unconfined drawdown from the discharge-potential drawdown: s = H − sqrt(H² − 2H·s_c), the
 * exact inverse of Jacob's (1944) correction s_c = s − s²/(2H). Where 2H·s_c ≥ H² the aquifer is
 * dewatered: drawdown H, flag `dewatered`.
 */
export function unconfinedDrawdownFromPotential({ saturatedThickness_m: H, potentialDrawdown_m }: PotentialDrawdownOptions): SingleWellResult {
  need(H, 'saturatedThickness_m');
  const disc = H * H - 2 * H * potentialDrawdown_m;
  if (disc <= 0) return { drawdown_m: H, flags: ['dewatered', 'large-drawdown'] };
  const s = H - Math.sqrt(disc);
  return { drawdown_m: s, flags: Math.abs(s) > LARGE_DRAWDOWN_FRACTION * H ? ['large-drawdown'] : [] };
}

/** Jacob (1944) correction: s_c = s − s²/(2H), the confined-equivalent drawdown of an unconfined one. */
export function jacobCorrectedDrawdown({ saturatedThickness_m: H, drawdown_m: s }: JacobCorrectionOptions): number {
  need(H, 'saturatedThickness_m');
  return s - (s * s) / (2 * H);
}

/** Options of the unconfined responses. */
export interface UnconfinedOptions {
  /** Pumping rate Q, m³/s. */
  rate_m3_s: number;
  /** Hydraulic conductivity K, m/s. */
  conductivity_m_s: number;
  /** Static saturated thickness H, m. */
  saturatedThickness_m: number;
  /** Distance r, m (> 0). */
  distance_m: number;
}

/** Options of {@link dupuitThiemDrawdown}. */
export interface DupuitThiemOptions extends UnconfinedOptions {
  /** Radius of influence R, m. */
  influenceRadius_m: number;
}

/** Dupuit–Thiem: H² − h² = Q/(πK)·ln(R/r) for r < R (Dupuit 1863, Thiem 1906). */
export function dupuitThiemDrawdown(o: DupuitThiemOptions): SingleWellResult {
  need(o.conductivity_m_s, 'conductivity_m_s');
  const T = o.conductivity_m_s * o.saturatedThickness_m;
  const sc = thiemDrawdown({ rate_m3_s: o.rate_m3_s, transmissivity_m2_s: T, distance_m: o.distance_m, influenceRadius_m: o.influenceRadius_m });
  // (H² − h²) = 2H·s_c with s_c = Q/(2πKH)·ln(R/r): the same relation, written in s_c.
  return unconfinedDrawdownFromPotential({ saturatedThickness_m: o.saturatedThickness_m, potentialDrawdown_m: sc });
}

/** Options of {@link unconfinedTheisDrawdown}. */
export interface UnconfinedTheisOptions extends UnconfinedOptions {
  /** Specific yield Sy (−). */
  specificYield: number;
  /** Time since pumping started, s (≤ 0 gives 0). */
  time_s: number;
}

/** Unconfined transient: Theis on the discharge potential with T = K·H, S = Sy, then the exact back-transform. */
export function unconfinedTheisDrawdown(o: UnconfinedTheisOptions): SingleWellResult {
  need(o.conductivity_m_s, 'conductivity_m_s');
  const T = o.conductivity_m_s * o.saturatedThickness_m;
  const sc = theisDrawdown({ rate_m3_s: o.rate_m3_s, transmissivity_m2_s: T, storativity: o.specificYield, distance_m: o.distance_m, time_s: o.time_s });
  return unconfinedDrawdownFromPotential({ saturatedThickness_m: o.saturatedThickness_m, potentialDrawdown_m: sc });
}

/** Options of {@link hantushJacobDrawdown}: those of Theis plus the leakage factor. */
export interface HantushJacobOptions extends TheisOptions {
  /** Leakage factor B = sqrt(T·c), m. */
  leakageFactor_m: number;
}

/** Hantush & Jacob (1955): s = Q/(4πT)·W(u, r/B). 0 for t ≤ 0. */
export function hantushJacobDrawdown(o: HantushJacobOptions): number {
  need(o.leakageFactor_m, 'leakageFactor_m');
  need(o.transmissivity_m2_s, 'transmissivity_m2_s');
  need(o.storativity, 'storativity');
  need(o.distance_m, 'distance_m');
  if (o.time_s <= 0) return 0;
  const u = (o.distance_m ** 2 * o.storativity) / (4 * o.transmissivity_m2_s * o.time_s);
  return (o.rate_m3_s / (4 * Math.PI * o.transmissivity_m2_s)) * hantushWellFunction(u, o.distance_m / o.leakageFactor_m);
}

/** Options of {@link deGleeDrawdown}. */
export interface DeGleeOptions {
  /** Pumping rate Q, m³/s. */
  rate_m3_s: number;
  /** Transmissivity T, m²/s. */
  transmissivity_m2_s: number;
  /** Distance r, m (> 0). */
  distance_m: number;
  /** Leakage factor B = sqrt(T·c), m. */
  leakageFactor_m: number;
}

/** de Glee (1930), steady leaky: s = Q/(2πT)·K0(r/B). */
export function deGleeDrawdown(o: DeGleeOptions): number {
  need(o.leakageFactor_m, 'leakageFactor_m');
  need(o.transmissivity_m2_s, 'transmissivity_m2_s');
  need(o.distance_m, 'distance_m');
  return (o.rate_m3_s / (2 * Math.PI * o.transmissivity_m2_s)) * besselK0(o.distance_m / o.leakageFactor_m);
}
