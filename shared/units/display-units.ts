/**
 * The user's choice of display units. Stored in the scenario's optional `view.units` (the
 * scenario itself stays SI); defaults for the two systems the UI offers.
 */
import { type Quantity, type UnitId, UNITS } from './unit-definitions';

/** SI (metric) or US customary display. */
export type UnitSystem = 'si' | 'us';

/** One display unit per quantity. */
export type DisplayUnits = Record<Quantity, UnitId>;

/**
 * Display units for a system. SI rates default to m³/h (the unit pumps are bought in across most
 * metric markets; common practice), conductivity to m/s (site-investigation reports), US customary
 * to ft, gpm and ft/d, well loss in s²/ft⁵ and volumes in US gallons. Coordinates of a local site
 * grid follow the length system; a projected CRS keeps its own unit (`coordinateUnit`).
 */
export function defaultDisplayUnits(system: UnitSystem): DisplayUnits {
  return system === 'us'
    ? { length: 'ft', rate: 'gpm', velocity: 'ft/d', time: 'd', area: 'ft²', transmissivity: 'ft²/d', wellLoss: 's²/ft⁵', volume: 'gal', coordinate: 'ft E/N' }
    : { length: 'm', rate: 'm³/h', velocity: 'm/s', time: 'd', area: 'm²', transmissivity: 'm²/s', wellLoss: 's²/m⁵', volume: 'm³', coordinate: 'm E/N' };
}

/**
 * Merges a partial, possibly untrusted preference object (e.g. from a saved scenario) over the
 * system defaults, dropping entries that name an unknown unit or the wrong quantity.
 */
export function resolveDisplayUnits(system: UnitSystem, overrides: Partial<Record<string, unknown>> = {}): DisplayUnits {
  const units = defaultDisplayUnits(system);
  for (const q of Object.keys(units) as Quantity[]) {
    const id = overrides[q];
    if (typeof id === 'string' && Object.prototype.hasOwnProperty.call(UNITS, id) && UNITS[id as UnitId].quantity === q) {
      units[q] = id as UnitId;
    }
  }
  return units;
}
