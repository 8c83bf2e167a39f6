/**
 * Warnings about a valid scenario: things the engine accepts and computes, but that are rarely
 * what the designer meant. They are not errors (the run goes ahead); each names the JSON pointer
 * of the field and has a stable code. Returned by the validate, evaluate and design routes and
 * commands and listed in the client's side panel.
 */
import { Type, type Static } from '@sinclair/typebox';
import type { Scenario } from './scenario-schema';

export const ScenarioWarningSchema = Type.Object(
  {
    code: Type.Union([Type.Literal('wells-coincide'), Type.Literal('screen-above-water'), Type.Literal('water-above-ground'), Type.Literal('well-radius-large'), Type.Literal('negative-margin-not-applied')]),
    path: Type.String({ description: 'JSON pointer of the field.' }),
    message: Type.String(),
  },
  { additionalProperties: false, description: 'Accepted, but probably not meant: check the field.' },
);
export type ScenarioWarning = Static<typeof ScenarioWarningSchema>;

/** Largest well radius taken as plausible, m (dewatering wells are about 0.025–0.5 m; common practice). */
export const LARGEST_PLAUSIBLE_WELL_RADIUS_M = 1;

/** Most warnings listed (the rest are counted in the last one). */
const MAX_WARNINGS = 50;

/** The warnings of a scenario that passed validation; `pathPrefix` is put in front of every pointer. */
export function findScenarioWarnings(scenario: Scenario, pathPrefix = ''): ScenarioWarning[] {
  const out: ScenarioWarning[] = [];
  const add = (code: ScenarioWarning['code'], path: string, message: string) => out.push({ code, path: `${pathPrefix}${path}`, message });
  const a = scenario.aquifer;
  if (a.staticLevel_m > scenario.groundLevel_m)
    add('water-above-ground', '/aquifer/staticLevel_m', `static level (${a.staticLevel_m} m) is above ground level (${scenario.groundLevel_m} m): a flooded or artesian site; check that both are elevations on the same datum`);
  scenario.excavations.forEach((e, i) => {
    if (e.margin_m < 0)
      add('negative-margin-not-applied', `/excavations/${i}/margin_m`, `a negative margin (${e.margin_m} m) is not applied below the allowable uplift level: the plug's uplift check sets the target (it may stand above formation) and no margin may take its factor of safety below the required one`);
  });
  scenario.wells.forEach((w, i) => {
    if (w.radius_m > LARGEST_PLAUSIBLE_WELL_RADIUS_M)
      add('well-radius-large', `/wells/${i}/radius_m`, `well radius ${w.radius_m} m is more than ${LARGEST_PLAUSIBLE_WELL_RADIUS_M} m: is it a diameter, or in another unit? (dewatering wells are about 0.025–0.5 m)`);
    if (w.screenBottom_m !== undefined && w.screenBottom_m >= a.staticLevel_m)
      add('screen-above-water', `/wells/${i}/screenBottom_m`, `the whole screen (bottom ${w.screenBottom_m} m) is above the static level (${a.staticLevel_m} m): the well cannot draw water (evaluation still pumps its rate; the design gives it no capacity)`);
  });
  // Two wells closer than the larger radius occupy one bore: their rates add at one spot.
  const order = scenario.wells.map((w, i) => ({ w, i })).sort((p, q) => p.w.x - q.w.x);
  for (let k = 0; k < order.length; k++) {
    const { w, i } = order[k]!;
    for (let m = k + 1; m < order.length; m++) {
      const o = order[m]!;
      const reach = Math.max(w.radius_m, o.w.radius_m, 0.01);
      if (o.w.x - w.x > reach) break;
      if (Math.hypot(o.w.x - w.x, o.w.y - w.y) <= reach) {
        const [first, second] = i < o.i ? [{ w, i }, o] : [o, { w, i }];
        add('wells-coincide', `/wells/${second.i}/x`, `well "${second.w.id}" stands at the same spot as well "${first.w.id}" (/wells/${first.i}): their rates add there, doubling the capacity at one point; move or remove one`);
      }
    }
  }
  if (out.length > MAX_WARNINGS) return [...out.slice(0, MAX_WARNINGS - 1), { ...out[MAX_WARNINGS - 1]!, message: `${out[MAX_WARNINGS - 1]!.message} (and ${out.length - MAX_WARNINGS} more warnings)` }];
  return out;
}
