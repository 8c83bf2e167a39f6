/**
 * A key of what a design's heads depend on — ground, aquifer, boundaries, excavations, well
 * places and kinds, the design time — leaving out the well rates (the design chooses its own, and
 * applying them must not make its result look out of date) and the view settings.
 */
import type { Scenario } from '../../shared/schema';

/** Equal keys: a design result made for one scenario still describes the other. */
export function designInputsKey(s: Scenario): string {
  const wells = s.wells.map(({ rate_m3_s: _rate, schedule: _schedule, ...rest }) => rest);
  return JSON.stringify([s.groundLevel_m, s.aquifer, s.boundaries ?? [], s.excavations, s.ground ?? null, wells, s.design]);
}
