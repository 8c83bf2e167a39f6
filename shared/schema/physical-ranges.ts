/**
 * Physical ranges every numeric field of the documents is held to, so a value no site can have
 * (a base at −1e308 m, K = 1e-320 m/s) is refused with its range at the door instead of failing
 * every later computation. Bounds are generous: they exclude the impossible, not the unusual.
 */
import { Type } from '@sinclair/typebox';

/** Levels: within ±20 km of the site datum, m. */
export const LEVEL_LIMIT_M = 20_000;
/** Plan coordinates: within ±10⁸ m (any projected grid on Earth, with room for false origins). */
export const COORDINATE_LIMIT_M = 1e8;
/** Times and durations: up to 10¹⁰ s (about 317 years). */
export const TIME_LIMIT_S = 1e10;
/** Hydraulic conductivity K, m/s: from an intact clay (10⁻¹³) to open gravel (1). */
export const CONDUCTIVITY_RANGE_M_S = [1e-13, 1] as const;
/** Lengths such as a radius of influence or a leakage factor, m. */
export const LENGTH_LIMIT_M = 1e7;

type Doc = { description?: string };

/** A level (elevation above the site datum), m. */
export const Level = (options: Doc = {}) => Type.Number({ minimum: -LEVEL_LIMIT_M, maximum: LEVEL_LIMIT_M, ...options });
/** A plan coordinate, m. */
export const Coordinate = (options: Doc = {}) => Type.Number({ minimum: -COORDINATE_LIMIT_M, maximum: COORDINATE_LIMIT_M, ...options });
/** A time since the start of pumping or a duration, s (≥ 0). */
export const TimeSpan = (options: Doc & { exclusiveMinimum?: number } = {}) =>
  Type.Number(options.exclusiveMinimum !== undefined ? { maximum: TIME_LIMIT_S, ...options } : { minimum: 0, maximum: TIME_LIMIT_S, ...options });
/** A positive length, m. */
export const Length = (options: Doc = {}) => Type.Number({ exclusiveMinimum: 0, maximum: LENGTH_LIMIT_M, ...options });
/**
 * Coefficient of volume compressibility m_v, m²/kN: from a very stiff clay or dense sand
 * (about 10⁻⁵) to a peat (about 10⁻²), with room either side (generous on purpose).
 */
export const COMPRESSIBILITY_RANGE_M2_KN = [1e-7, 0.1] as const;
/** Oedometer (constrained) modulus E_oed = 1/m_v, kPa: the same range inverted. */
export const OEDOMETER_MODULUS_RANGE_KPA = [10, 1e7] as const;
