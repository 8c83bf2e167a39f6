/**
 * Display units drydig converts to and from. Inside, every quantity is SI; a unit here is only a
 * factor at the edge: value_si = value_display × toSi.
 *
 * Factors are exact by definition (NIST Special Publication 811, 2008 ed., Appendix B):
 * 1 ft = 0.3048 m exactly (international foot, 1959); 1 US gallon = 231 in³ = 3.785411784 L
 * exactly; 1 d = 86 400 s; 1 h = 3600 s; 1 L = 10⁻³ m³ (1964 CGPM).
 */

/** Exact length of one international foot, m (NIST SP 811 B.8). */
export const FOOT_M = 0.3048;
/** Exact volume of one US liquid gallon, m³ (NIST SP 811 B.8: 3.785 411 784 L). */
export const US_GALLON_M3 = 3.785411784e-3;
/** Seconds in one day. */
export const DAY_S = 86_400;
/** Seconds in one hour. */
export const HOUR_S = 3_600;

/** The physical quantities the UI shows. */
export type Quantity = 'length' | 'rate' | 'velocity' | 'time' | 'area' | 'transmissivity' | 'wellLoss' | 'volume' | 'coordinate';

/** One display unit of a quantity. */
export interface UnitDefinition {
  /** Stable id, also the label shown beside values (e.g. `m³/h`). */
  id: string;
  quantity: Quantity;
  /** Multiply a value in this unit by `toSi` to get SI. */
  toSi: number;
  /** Long name for tooltips and exports. */
  name: string;
}

const def = (id: string, quantity: Quantity, toSi: number, name: string): UnitDefinition => ({ id, quantity, toSi, name });

/** Every display unit, keyed by id. */
export const UNITS = {
  m: def('m', 'length', 1, 'metre'),
  ft: def('ft', 'length', FOOT_M, 'international foot'),

  'm³/s': def('m³/s', 'rate', 1, 'cubic metre per second'),
  'm³/h': def('m³/h', 'rate', 1 / HOUR_S, 'cubic metre per hour'),
  'm³/d': def('m³/d', 'rate', 1 / DAY_S, 'cubic metre per day'),
  'L/s': def('L/s', 'rate', 1e-3, 'litre per second'),
  gpm: def('gpm', 'rate', US_GALLON_M3 / 60, 'US gallon per minute'),

  'm/s': def('m/s', 'velocity', 1, 'metre per second'),
  'm/d': def('m/d', 'velocity', 1 / DAY_S, 'metre per day'),
  'ft/d': def('ft/d', 'velocity', FOOT_M / DAY_S, 'foot per day'),

  s: def('s', 'time', 1, 'second'),
  min: def('min', 'time', 60, 'minute'),
  h: def('h', 'time', HOUR_S, 'hour'),
  d: def('d', 'time', DAY_S, 'day'),

  'm²': def('m²', 'area', 1, 'square metre'),
  'ft²': def('ft²', 'area', FOOT_M * FOOT_M, 'square foot'),

  'm²/s': def('m²/s', 'transmissivity', 1, 'square metre per second'),
  'm²/d': def('m²/d', 'transmissivity', 1 / DAY_S, 'square metre per day'),
  'ft²/d': def('ft²/d', 'transmissivity', (FOOT_M * FOOT_M) / DAY_S, 'square foot per day'),

  's²/m⁵': def('s²/m⁵', 'wellLoss', 1, 'second squared per metre to the fifth'),
  // C·Q² in metres with Q in m³/h: C_si = C_h × 3600² — the form well-loss is often quoted in.
  'h²/m⁵': def('h²/m⁵', 'wellLoss', HOUR_S * HOUR_S, 'hour squared per metre to the fifth'),
  // US form: C·Q² in feet with Q in ft³/s (Walton 1962 quotes C in s²/ft⁵; from memory): 1 ft/(ft³/s)² = 0.3048⁻⁵ s²/m⁵.
  's²/ft⁵': def('s²/ft⁵', 'wellLoss', FOOT_M ** -5, 'second squared per foot to the fifth'),

  'm³': def('m³', 'volume', 1, 'cubic metre'),
  gal: def('gal', 'volume', US_GALLON_M3, 'US gallon'),

  // Coordinates: the site grid's own unit (a projected CRS's unit, e.g. metres for UTM; see coordinateUnit).
  'm E/N': def('m E/N', 'coordinate', 1, 'metre (site grid)'),
  'ft E/N': def('ft E/N', 'coordinate', FOOT_M, 'international foot (local site grid)'),
} as const satisfies Record<string, UnitDefinition>;

/** Id of any display unit. */
export type UnitId = keyof typeof UNITS;

/** Units of one quantity, in the order the UI offers them. */
export function listUnits(quantity: Quantity): UnitDefinition[] {
  return Object.values(UNITS).filter((u) => u.quantity === quantity);
}

/** True when `id` names a known display unit. */
export function isUnitId(id: string): id is UnitId {
  return Object.prototype.hasOwnProperty.call(UNITS, id);
}
