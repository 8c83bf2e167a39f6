/**
 * Request and response schemas of `POST /api/v1/evaluate`, built from the shared scenario schema
 * so the route validates, serialises and documents (OpenAPI) from one source.
 */
import { Type, type Static } from '@sinclair/typebox';
import { PointSchema, ScenarioSchema, ScenarioWarningSchema } from '../../shared/schema';
import { FLAG_BITS, type ModelInfo, type PointFlag } from '../../shared/field';

/** Default largest number of points one evaluate request may ask for. */
export const DEFAULT_MAX_POINTS = 100_000;
/** Default largest number of grid nodes (× times) one evaluate request may ask for. */
export const DEFAULT_MAX_GRID_NODES = 250_000;
/** Largest number of times one evaluate request may ask for. */
export const MAX_TIMES = 1000;

const FLAG_NAMES = Object.keys(FLAG_BITS) as PointFlag[];

/** Every method the engine may report; the type check below fails if the engine adds one. */
export const MODEL_METHODS = ['theis', 'thiem', 'theis-unconfined', 'dupuit-thiem', 'hantush-jacob', 'de-glee'] as const satisfies readonly ModelInfo['method'][];
type UnlistedMethod = Exclude<ModelInfo['method'], (typeof MODEL_METHODS)[number]>;
const allMethodsListed: [UnlistedMethod] extends [never] ? true : never = true;
void allMethodsListed;

export const PointFlagSchema = Type.Union(
  FLAG_NAMES.map((f) => Type.Literal(f)),
  { description: 'A validity flag: the number is still given, but lies outside the method\u2019s comfortable validity.' },
);

/** A time since pumping started, s, or null for steady state. */
export const TimeSchema = Type.Union([Type.Number({ exclusiveMinimum: 0 }), Type.Null()], {
  description: 'Time since pumping started, s (> 0), or null for steady state.',
});

export const GridRequestSchema = Type.Object(
  {
    origin: PointSchema,
    spacing_m: Type.Tuple([Type.Number({ exclusiveMinimum: 0 }), Type.Number({ exclusiveMinimum: 0 })], {
      description: 'Node spacing [dx, dy], m (> 0).',
    }),
    counts: Type.Tuple([Type.Integer({ minimum: 1 }), Type.Integer({ minimum: 1 })], {
      description: 'Node counts [nx, ny]; node (i, j) is at origin + (i·dx, j·dy).',
    }),
  },
  { additionalProperties: false, description: 'A regular grid of nodes.' },
);
export type GridRequest = Static<typeof GridRequestSchema>;

/** Limits an evaluate route is built with (they appear in the OpenAPI description). */
export interface EvaluateLimits {
  /** Largest number of points × times per request. Default 100 000. */
  maxPoints: number;
  /** Largest number of grid nodes × times per request. Default 250 000. */
  maxGridNodes: number;
}

/** A point to evaluate: any finite plan position (the scenario's own positions carry the physical ranges). */
const EvaluatePointSchema = Type.Tuple([Type.Number(), Type.Number()], { description: 'Plan position [x, y] in metres.' });

/** The body of `POST /api/v1/evaluate`. */
export function buildEvaluateRequestSchema(limits: EvaluateLimits) {
  return Type.Object(
    {
      scenario: ScenarioSchema,
      points: Type.Optional(
        Type.Array(EvaluatePointSchema, {
          maxItems: limits.maxPoints,
          description: `Plan positions [x, y] to evaluate, m. At most ${limits.maxPoints} points × times.`,
        }),
      ),
      times_s: Type.Optional(
        Type.Array(TimeSchema, {
          minItems: 1,
          maxItems: MAX_TIMES,
          description: 'Times to evaluate, s since pumping started; null = steady state. Absent: the scenario\u2019s design time.',
        }),
      ),
      grid: Type.Optional(
        Type.Object(GridRequestSchema.properties, {
          additionalProperties: false,
          description: `A regular grid to evaluate for contouring. At most ${limits.maxGridNodes} nodes × times.`,
        }),
      ),
    },
    { additionalProperties: false },
  );
}
export type EvaluateRequest = Static<ReturnType<typeof buildEvaluateRequestSchema>>;

export const PointResultSchema = Type.Object(
  {
    x: Type.Number({ description: 'm' }),
    y: Type.Number({ description: 'm' }),
    time_s: Type.Union([Type.Number(), Type.Null()], { description: 'Time since pumping started, s; null = steady state.' }),
    level_m: Type.Number({ description: 'Groundwater (unconfined) or piezometric (confined/leaky) level, m above datum.' }),
    drawdown_m: Type.Number({ description: 'Drawdown below the static level, m (positive down).' }),
    flags: Type.Array(PointFlagSchema),
  },
  { additionalProperties: false },
);

export const ModelInfoSchema = Type.Object(
  {
    method: Type.Union(
      MODEL_METHODS.map((m) => Type.Literal(m)),
      { description: 'The published method applied.' },
    ),
    influenceRadius_m: Type.Optional(Type.Number({ description: 'Steady runs: radius of influence used, m.' })),
    influenceRadiusSource: Type.Optional(Type.Union([Type.Literal('scenario'), Type.Literal('sichardt')])),
    transmissivity_m2_s: Type.Number({ description: 'Transmissivity used, m²/s.' }),
    imagesPerWell: Type.Number({ description: 'Image wells added per real well for the boundaries.' }),
    truncationBound_m: Type.Optional(Type.Number({ description: 'Parallel boundaries: bound on the image-series truncation error, m.' })),
    notes: Type.Array(Type.String(), { description: 'Assumptions and limits, in words; show them beside the results.' }),
  },
  // The engine may add fields; the server passes them on untouched.
  { additionalProperties: true },
);

export const FlagMaskSchema = Type.Object(
  {
    encoding: Type.Literal('runs'),
    runs: Type.Array(Type.Tuple([Type.Integer(), Type.Integer(), Type.Integer()]), {
      description:
        'Runs [start, length, mask] over the row-major node index k = j·nx + i, in increasing order, '
        + 'covering only nodes whose mask is not 0; every node not in a run has mask 0. '
        + `mask is a bit set of flags: ${FLAG_NAMES.map((f) => `${f} ${FLAG_BITS[f]}`).join(', ')}.`,
    }),
  },
  { additionalProperties: false },
);

export const GridAnswerSchema = Type.Object(
  {
    grid: GridRequestSchema,
    time_s: Type.Union([Type.Number(), Type.Null()], { description: 'Time since pumping started, s; null = steady state.' }),
    staticLevel_m: Type.Number({ description: 'Static level; level at node k = staticLevel_m − drawdown_m[k], m.' }),
    drawdown_m: Type.Array(Type.Number(), {
      description: 'Drawdown at each node, m, row-major (k = j·nx + i, j along y), rounded to 0.1 mm.',
    }),
    flags: Type.Record(Type.String(), Type.Integer(), { description: 'How many nodes carry each flag.' }),
    flagMask: FlagMaskSchema,
  },
  { additionalProperties: false },
);

export const EvaluateResponseSchema = Type.Object(
  {
    points: Type.Optional(Type.Array(PointResultSchema, { description: 'One entry per point per time, time by time in the order asked.' })),
    grids: Type.Optional(Type.Array(GridAnswerSchema, { description: 'One grid per time, in the order asked.' })),
    model: ModelInfoSchema,
    models: Type.Array(
      Type.Object({ time_s: Type.Union([Type.Number(), Type.Null()]), model: ModelInfoSchema }, { additionalProperties: false }),
      { description: 'The model used at each time asked (steady and transient times use different methods).' },
    ),
    cautions: Type.Array(Type.String(), { description: 'Limits of the results; show them wherever the results are shown.' }),
    warnings: Type.Array(ScenarioWarningSchema, { description: 'Scenario fields accepted but probably not meant, by JSON pointer (not errors).' }),
  },
  { additionalProperties: false },
);
export type EvaluateResponse = Static<typeof EvaluateResponseSchema>;
