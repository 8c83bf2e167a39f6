/**
 * Helpers for the field-engine tests: a tolerance check and small scenario builders (invented
 * aquifers, used only to exercise the formulas — the expected values come from the sources named
 * in each test).
 */
import { expect } from 'vitest';
import type { Aquifer, Boundary, Scenario, Well } from '../../../shared/schema';

/** Passes when |actual − expected| ≤ abs + rel·|expected|; the message shows both. */
export function expectClose(actual: number, expected: number, tolerance: { abs?: number; rel?: number }, label = ''): void {
  const allowed = (tolerance.abs ?? 0) + (tolerance.rel ?? 0) * Math.abs(expected);
  const diff = Math.abs(actual - expected);
  expect(Number.isFinite(actual), `${label} finite`).toBe(true);
  expect(diff, `${label}: got ${actual}, expected ${expected} (allowed ±${allowed.toExponential(2)})`).toBeLessThanOrEqual(allowed);
}

/** A confined aquifer b = 20 m (top 0, base −20), static level 8 m. */
export function confinedAquifer(extra: Partial<Aquifer> = {}): Aquifer {
  return { kind: 'confined', conductivity_m_s: 2.5e-4, base_m: -20, top_m: 0, staticLevel_m: 8, storativity: 2e-4, ...extra };
}

/** An unconfined aquifer H = 20 m (base −10, static level 10 m). */
export function unconfinedAquifer(extra: Partial<Aquifer> = {}): Aquifer {
  return { kind: 'unconfined', conductivity_m_s: 3e-4, base_m: -10, staticLevel_m: 10, specificYield: 0.1, ...extra };
}

/** A leaky aquifer b = 20 m, B = 300 m. */
export function leakyAquifer(extra: Partial<Aquifer> = {}): Aquifer {
  return { kind: 'leaky', conductivity_m_s: 2.5e-4, base_m: -20, top_m: 0, staticLevel_m: 8, storativity: 2e-4, leakageFactor_m: 300, ...extra };
}

/** A well with defaults (r_w 0.1 m, deep, active). */
export function well(id: string, x: number, y: number, extra: Partial<Well> = {}): Well {
  return { id, x, y, radius_m: 0.1, kind: 'deep', ...extra };
}

/** A scenario around the given aquifer and wells. */
export function scenarioWith(options: {
  aquifer: Aquifer;
  wells: Well[];
  boundaries?: Boundary[];
  time_s?: number | null;
  excavations?: Scenario['excavations'];
}): Scenario {
  return {
    format: 'drydig.scenario',
    version: 1,
    name: 'test (invented)',
    groundLevel_m: 12,
    aquifer: options.aquifer,
    boundaries: options.boundaries ?? [],
    excavations: options.excavations ?? [],
    wells: options.wells,
    design: { time_s: options.time_s === undefined ? 86400 : options.time_s },
  };
}
