/**
 * Screen levels for new wells: by default a new well takes the screen of the wells of its kind
 * already in the scenario (the first one that has both levels), so a well point added beside
 * short-screen well points is not given a full-thickness screen. Blank means the engine's default
 * (aquifer top or static level to the base).
 */
import type { Scenario, WellKind } from '../../shared/schema';

/** Screen top and bottom elevations, m; either may be absent (the engine's default). */
export interface WellScreen {
  screenTop_m?: number;
  screenBottom_m?: number;
}

/** The screen of the first well of `kind` in the scenario with both levels set, else none. */
export function screenOfKind(scenario: Scenario | undefined, kind: WellKind): WellScreen {
  const w = scenario?.wells.find((k) => k.kind === kind && k.screenTop_m !== undefined && k.screenBottom_m !== undefined);
  return w ? { screenTop_m: w.screenTop_m, screenBottom_m: w.screenBottom_m } : {};
}

/** The screen fields to write on a new well (absent levels left out, not written as undefined). */
export function screenFields(screen: WellScreen): WellScreen {
  const out: WellScreen = {};
  if (screen.screenTop_m !== undefined) out.screenTop_m = screen.screenTop_m;
  if (screen.screenBottom_m !== undefined) out.screenBottom_m = screen.screenBottom_m;
  return out;
}
