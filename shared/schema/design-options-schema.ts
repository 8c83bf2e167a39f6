/**
 * Design options: how the design solver places control points, which limits it applies to the
 * wells, and the figures the pump and bid summary is priced with. Stored in a scenario as the
 * optional top-level `designOptions` object; CLI flags and API `options` override field by field.
 *
 * Every field is optional; the default is given in its description and in `DESIGN_OPTION_DEFAULTS`
 * (`shared/design/design-options.ts`). SI units inside; currency is whatever the bid is priced in.
 */
import { Type, type Static } from '@sinclair/typebox';
import { DESIGN_BID_OPTION_FIELDS } from './design-bid-options-schema';
import { DESIGN_UNCERTAINTY_OPTION_FIELDS } from './design-uncertainty-options-schema';
import { COORDINATE_LIMIT_M, LEVEL_LIMIT_M, TIME_LIMIT_S } from './physical-ranges';

/** Layout searches stop within this many seconds: a longer one would hold a pool thread that others are waiting for. */
export const MAX_LAYOUT_TIME_LIMIT_S = 60;
const LEVEL = { minimum: -LEVEL_LIMIT_M, maximum: LEVEL_LIMIT_M };
const COORDINATE = { minimum: -COORDINATE_LIMIT_M, maximum: COORDINATE_LIMIT_M };
const MONEY = 1e9;

export const DesignModeSchema = Type.Union([Type.Literal('uniform'), Type.Literal('optimal'), Type.Literal('layout')], {
  description: 'uniform: one rate for all active wells; optimal: least total pumping per well (LP); layout: choose wells and rates at least cost (MIP).',
});
export type DesignMode = Static<typeof DesignModeSchema>;

export const DesignControlPointSchema = Type.Object(
  {
    x: Type.Number({ ...COORDINATE, description: 'Easting, m.' }),
    y: Type.Number({ ...COORDINATE, description: 'Northing, m.' }),
    targetLevel_m: Type.Optional(
      Type.Number({ ...LEVEL, description: 'Level the groundwater must reach here, m. Default: the target of the excavation the point lies in.' }),
    ),
    label: Type.Optional(Type.String({ maxLength: 200 })),
  },
  { additionalProperties: false, description: 'A user control point (e.g. a lift pit or a sensitive spot).' },
);
export type DesignControlPoint = Static<typeof DesignControlPointSchema>;

export const DesignStageSchema = Type.Object(
  {
    wellIds: Type.Array(Type.String({ minLength: 1, maxLength: 64 }), { minItems: 1, maxItems: 5000 }),
    start_s: Type.Number({ minimum: 0, maximum: TIME_LIMIT_S, description: 'Time these wells are switched on, s after the first pumps start.' }),
  },
  { additionalProperties: false, description: 'A group of wells switched on later than t = 0 (staged start).' },
);
export type DesignStage = Static<typeof DesignStageSchema>;

/** Pit-floor checks (design.md §8): EN 1997-1 UPL partial factors and the factor on the critical gradient (HYD). */
export const FloorOptionsSchema = Type.Object(
  {
    partialFactors: Type.Optional(
      Type.Object(
        {
          destabilising: Type.Optional(Type.Number({ minimum: 1, maximum: 2, description: 'γG;dst on the water pressure under the plug (−). Default 1.0 (EN 1997-1 Table A.15, recommended value; national annexes differ).' })),
          stabilising: Type.Optional(Type.Number({ exclusiveMinimum: 0, maximum: 1, description: 'γG;stb on the weight of the plug (−). Default 0.9 (EN 1997-1 Table A.15, recommended value; national annexes differ).' })),
        },
        { additionalProperties: false },
      ),
    ),
    heaveFactor: Type.Optional(Type.Number({ minimum: 1, maximum: 5, description: 'Required factor of the critical gradient over the upward gradient in a granular floor (−). Default 1.5 (common practice).' })),
  },
  { additionalProperties: false, description: 'Pit-floor safety checks: uplift of a low-permeability plug and heave of a granular floor.' },
);

export const DesignOptionsSchema = Type.Object(
  {
    mode: Type.Optional(DesignModeSchema),
    controlSpacing_m: Type.Optional(
      Type.Number({ exclusiveMinimum: 0, maximum: 1000, description: 'Spacing of control points along edges and of the grid inside each excavation, m. Default: the shorter side of the outline’s bounding box / 8, within 0.5–25 m.' }),
    ),
    controlPoints: Type.Optional(Type.Array(DesignControlPointSchema, { maxItems: 5000 })),
    suctionLiftLimit_m: Type.Optional(
      Type.Number({ exclusiveMinimum: 0, maximum: 10, description: 'Well points: deepest pumping level below the header, m. Default 5.5 (common practice: 5–6 m).' }),
    ),
    capacityUtilisationFactor: Type.Optional(
      Type.Number({ exclusiveMinimum: 0, maximum: 1, description: 'Share of each well’s Sichardt capacity the design may use (−). Common practice 0.8 (an allowance for screen clogging and the scatter of Sichardt’s rule); default 1 (the whole capacity, flagged in the cautions).' }),
    ),
    airEntryCheck: Type.Optional(
      Type.Boolean({ description: 'Keep each well point’s pumping level above its given screen top (air entry) as a limit row. Default false (the cautions list well points drawn below it).' }),
    ),
    headerLevel_m: Type.Optional(Type.Number({ ...LEVEL, description: 'Well-point header elevation, m. Default: ground level.' })),
    pumpEfficiency: Type.Optional(
      Type.Number({ exclusiveMinimum: 0, maximum: 1, description: 'Wire-to-water efficiency η of the pump sets (−). Default 0.6 (common practice).' }),
    ),
    dischargeHead_m: Type.Optional(
      Type.Number({ minimum: 0, maximum: 200, description: 'Head at the discharge point above ground level, m. Default 3.' }),
    ),
    frictionAllowance_m: Type.Optional(
      Type.Number({ minimum: 0, maximum: 200, description: 'Friction loss allowance in riser and discharge main, m. Default 2 (common practice).' }),
    ),
    safetyFactor: Type.Optional(
      Type.Number({ minimum: 1, maximum: 5, description: 'Factor on the computed flow for pump and discharge sizing (−). Default 1.25 (common practice).' }),
    ),
    initialRateFactor: Type.Optional(
      Type.Number({ minimum: 1, maximum: 5, description: 'Steady designs: factor on the steady rate for the first weeks while storage drains (−). Default 1.3 (UFC 3-220-05).' }),
    ),
    initialPeriod_s: Type.Optional(
      Type.Number({ minimum: 0, maximum: TIME_LIMIT_S, description: 'Steady designs: length of that initial period, s. Default 14 days.' }),
    ),
    pumpCapacity_m3_s: Type.Optional(
      Type.Number({ exclusiveMinimum: 0, maximum: 10, description: 'Rated flow of one pump set, m³/s. Default 0.02 (72 m³/h).' }),
    ),
    standbyRatio: Type.Optional(
      Type.Number({ minimum: 0, maximum: 2, description: 'Standby pumps per duty pump (rounded up, at least one). Default 0.5 (common practice).' }),
    ),
    energyPrice_per_kWh: Type.Optional(Type.Number({ minimum: 0, maximum: MONEY, description: 'Energy price per kWh, bid currency. Default 0.2 (placeholder: enter your own).' })),
    wellCost: Type.Optional(Type.Number({ minimum: 0, maximum: MONEY, description: 'Cost of installing one well, bid currency. Default 5000 (placeholder: enter your own).' })),
    pumpedVolumeCost_per_m3: Type.Optional(
      Type.Number({ minimum: 0, maximum: MONEY, description: 'Cost per m³ pumped besides energy (discharge fees, treatment), bid currency. Default 0.1 (placeholder).' }),
    ),
    duration_s: Type.Optional(
      Type.Number({ exclusiveMinimum: 0, maximum: TIME_LIMIT_S, description: 'Pumping duration for energy, volume and cost, s. Default 90 days.' }),
    ),
    stages: Type.Optional(Type.Array(DesignStageSchema, { maxItems: 100 })),
    layoutTimeLimit_s: Type.Optional(
      Type.Number({ exclusiveMinimum: 0, maximum: MAX_LAYOUT_TIME_LIMIT_S, description: `Layout mode: longest the integer search may run before it returns its best layout, s (at most ${MAX_LAYOUT_TIME_LIMIT_S}). Default 20.` }),
    ),
    floor: Type.Optional(FloorOptionsSchema),
    outOfServiceWell: Type.Optional(
      Type.String({ minLength: 1, maxLength: 64, description: 'Well to take out of service in the standby check. Default: the one whose loss hurts most.' }),
    ),
    ...DESIGN_BID_OPTION_FIELDS,
    ...DESIGN_UNCERTAINTY_OPTION_FIELDS,
  },
  { additionalProperties: false, description: 'Design solver and bid-sizing options (all optional; defaults documented per field).' },
);
export type DesignOptions = Static<typeof DesignOptionsSchema>;
