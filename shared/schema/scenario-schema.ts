/**
 * Scenario format v1 — the one schema used by the server, the CLI and the client.
 *
 * Contract: `../shared/design.md` section 3. Fields listed there keep their meaning; fields added
 * here are optional extensions. SI units throughout; every field name carries its unit.
 * TypeScript types are derived from this schema (`Static<>`), never written twice.
 */
import { Type, type Static } from '@sinclair/typebox';
import { GroundProfileSchema } from './ground-schema';
import { CONDUCTIVITY_RANGE_M_S, COORDINATE_LIMIT_M, LENGTH_LIMIT_M, LEVEL_LIMIT_M, TIME_LIMIT_S } from './physical-ranges';

/** A finite number (JSON cannot carry NaN or Infinity; this also rejects them from JS callers). */
const Finite = (options: { description?: string; minimum?: number; exclusiveMinimum?: number; maximum?: number } = {}) =>
  Type.Number({ ...options });
/** Physical ranges (physical-ranges.ts): a level, a plan coordinate, a time. */
const LevelNum = (description: string) => Finite({ minimum: -LEVEL_LIMIT_M, maximum: LEVEL_LIMIT_M, description });
const CoordinateNum = (description?: string) => Finite({ minimum: -COORDINATE_LIMIT_M, maximum: COORDINATE_LIMIT_M, ...(description ? { description } : {}) });

/** A plan position [x, y] in site metres (easting, northing in the scenario's CRS when set). */
export const PointSchema = Type.Tuple([CoordinateNum(), CoordinateNum()], { description: 'Plan position [x, y] in metres.' });
export type PlanPoint = Static<typeof PointSchema>;

export const AquiferKindSchema = Type.Union(
  [Type.Literal('confined'), Type.Literal('unconfined'), Type.Literal('leaky')],
  { description: 'Aquifer type.' },
);
export type AquiferKind = Static<typeof AquiferKindSchema>;

export const AquiferSchema = Type.Object(
  {
    kind: AquiferKindSchema,
    conductivity_m_s: Finite({ minimum: CONDUCTIVITY_RANGE_M_S[0], maximum: CONDUCTIVITY_RANGE_M_S[1], description: 'Hydraulic conductivity K, m/s.' }),
    base_m: LevelNum('Aquifer base elevation, m above site datum.'),
    top_m: Type.Optional(LevelNum('Confined/leaky: aquifer top elevation, m (b = top − base).')),
    staticLevel_m: LevelNum('Undisturbed groundwater (piezometric) level, m.'),
    storativity: Type.Optional(Finite({ exclusiveMinimum: 0, maximum: 1, description: 'Confined/leaky: storativity S (−).' })),
    specificYield: Type.Optional(Finite({ exclusiveMinimum: 0, maximum: 1, description: 'Unconfined: specific yield Sy (−).' })),
    leakageFactor_m: Type.Optional(Finite({ exclusiveMinimum: 0, maximum: LENGTH_LIMIT_M, description: 'Leaky only: leakage factor B = sqrt(T·c), m.' })),
    anisotropyKhKv: Type.Optional(
      Finite({ minimum: 0.01, maximum: 10_000, description: 'Anisotropy Kh/Kv (−) for the partial-penetration correction of wells screened over part of the aquifer. Default 1 (isotropic).' }),
    ),
    influenceRadius_m: Type.Optional(
      Finite({ exclusiveMinimum: 0, maximum: LENGTH_LIMIT_M, description: 'Steady runs: radius of influence R, m. Absent: Sichardt estimate.' }),
    ),
  },
  { additionalProperties: false },
);
export type Aquifer = Static<typeof AquiferSchema>;

export const BoundarySchema = Type.Object(
  {
    kind: Type.Union([Type.Literal('constant-head'), Type.Literal('no-flow')]),
    from: PointSchema,
    to: PointSchema,
    label: Type.Optional(Type.String({ maxLength: 200 })),
  },
  { additionalProperties: false, description: 'A straight boundary (infinite line through from→to), treated by image wells.' },
);
export type Boundary = Static<typeof BoundarySchema>;

export const ExcavationSchema = Type.Object(
  {
    id: Type.String({ minLength: 1, maxLength: 64 }),
    outline: Type.Array(PointSchema, { minItems: 3, maxItems: 10_000, description: 'Closed polygon (last point joins the first).' }),
    formationLevel_m: LevelNum('Formation (dig) level, m.'),
    margin_m: Finite({
      minimum: -50,
      maximum: 50,
      description: 'Groundwater must stand this far below formation, m — or, where a pit-floor check governs, below its allowable level. Negative only over a low-permeability plug, and then not applied below the allowable uplift level.',
    }),
    ground: Type.Optional(GroundProfileSchema),
  },
  { additionalProperties: false },
);
export type Excavation = Static<typeof ExcavationSchema>;

export const ScheduleStepSchema = Type.Object(
  {
    from_s: Finite({ minimum: 0, maximum: TIME_LIMIT_S, description: 'Time this rate starts, s after the start of pumping.' }),
    rate_m3_s: Finite({ minimum: -10, maximum: 10, description: 'Rate from then on, m³/s (+ abstraction).' }),
  },
  { additionalProperties: false },
);
export type ScheduleStep = Static<typeof ScheduleStepSchema>;

export const WellKindSchema = Type.Union([Type.Literal('wellpoint'), Type.Literal('deep'), Type.Literal('ejector')]);
export type WellKind = Static<typeof WellKindSchema>;

export const WellSchema = Type.Object(
  {
    id: Type.String({ minLength: 1, maxLength: 64 }),
    x: CoordinateNum('Easting / plan x, m.'),
    y: CoordinateNum('Northing / plan y, m.'),
    radius_m: Finite({ exclusiveMinimum: 0, maximum: 5, description: 'Well radius r_w, m.' }),
    kind: WellKindSchema,
    rate_m3_s: Type.Optional(Finite({ minimum: -10, maximum: 10, description: 'Constant rate from t = 0, m³/s.' })),
    schedule: Type.Optional(Type.Array(ScheduleStepSchema, { minItems: 1, maxItems: 1000 })),
    wellLoss_s2_m5: Type.Optional(
      Finite({ minimum: 0, maximum: 1e9, description: 'Well-loss coefficient C: level in the well = aquifer drawdown + C·Q², s²/m⁵.' }),
    ),
    screenTop_m: Type.Optional(LevelNum('Screen top elevation, m (default: aquifer top or static level).')),
    screenBottom_m: Type.Optional(LevelNum('Screen bottom elevation, m (default: aquifer base).')),
    active: Type.Optional(Type.Boolean({ description: 'False: candidate or out of service; not pumped. Default true.' })),
  },
  { additionalProperties: false },
);
export type Well = Static<typeof WellSchema>;

export const DesignSchema = Type.Object(
  {
    time_s: Type.Union([Finite({ exclusiveMinimum: 0, maximum: TIME_LIMIT_S }), Type.Null()], {
      description: 'Time at which the target must be met, s; null = steady state.',
    }),
  },
  { additionalProperties: true },
);
export type Design = Static<typeof DesignSchema>;

export const ScenarioSchema = Type.Object(
  {
    format: Type.Literal('drydig.scenario'),
    version: Type.Literal(1),
    name: Type.String({ maxLength: 200 }),
    crs: Type.Optional(Type.String({ pattern: '^EPSG:[0-9]{4,6}$', description: 'EPSG code of the site grid; absent = local grid.' })),
    proj4: Type.Optional(Type.String({ maxLength: 2000, description: 'proj4 definition for a crs the client does not know.' })),
    groundLevel_m: LevelNum('Site ground elevation, m (uniform in v1).'),
    aquifer: AquiferSchema,
    boundaries: Type.Optional(Type.Array(BoundarySchema, { maxItems: 8 })),
    excavations: Type.Array(ExcavationSchema, { maxItems: 100 }),
    wells: Type.Array(WellSchema, { maxItems: 5000 }),
    design: DesignSchema,
    ground: Type.Optional(GroundProfileSchema),
  },
  {
    // Later issues add optional top-level sections (underlay, monitoring, design options, …).
    additionalProperties: true,
    $id: 'DrydigScenarioV1',
  },
);
export type Scenario = Static<typeof ScenarioSchema>;
