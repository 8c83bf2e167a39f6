/**
 * `POST /api/v1/section`: steady seepage in a vertical section — `{ section }` (a section
 * document) or `{ scenario, fromScenario? }` (a half-section built across an excavation), with
 * `compare` for the options side by side. The body is checked by the shared validators on the
 * event loop (messages name fields such as `/section/walls/0/toe_m`); the solve runs on the
 * compute pool within its time budget.
 */
import { Type, type Static } from '@sinclair/typebox';
import type { FastifyPluginAsync } from 'fastify';
import { DrydigError, parseScenario, parseSection, ScenarioSchema, SectionDocumentSchema } from '../../shared/schema';
import type { SectionJob } from '../../shared/section';
import { computeRateLimit, type SecurityOptions } from '../security';
import { ErrorResponseSchema } from '../request-schemas';
import { currentCompute } from '../compute';

const Level = (description: string) => Type.Number({ minimum: -20_000, maximum: 20_000, description });

export const SectionRequestSchema = Type.Object(
  {
    section: Type.Optional(SectionDocumentSchema),
    scenario: Type.Optional(ScenarioSchema),
    fromScenario: Type.Optional(Type.Object({
      excavationId: Type.Optional(Type.String({ minLength: 1, maxLength: 64 })),
      toe_m: Type.Optional(Level('Wall toe, m. Default formation − max(2 m, retained head).')),
      outsideHead_m: Type.Optional(Level('Outside water level, m (e.g. the plan model’s head at the excavation edge). Default the static level.')),
      insideHead_m: Type.Optional(Level('Water level held on the floor, m. Default the formation level.')),
      outsideDistance_m: Type.Optional(Type.Number({ minimum: 1, maximum: 10_000, description: 'Wall to outer edge, m. Default max(30 m, 3 × depth to base).' })),
    }, { additionalProperties: false })),
    compare: Type.Optional(Type.Union([
      Type.Boolean(),
      Type.Object({
        toeLevels_m: Type.Optional(Type.Array(Level('Toe level, m.'), { minItems: 1, maxItems: 12 })),
        reliefHead_m: Type.Optional(Level('Head held in the relief wells, m.')),
        insideLevel_m: Type.Optional(Level('Lower inside level, m.')),
      }, { additionalProperties: false }),
    ])),
    flowNet: Type.Optional(Type.Boolean({ description: 'Include the flow net. Default true.' })),
    planTotalRate_m3_s: Type.Optional(Type.Number({ minimum: 0, maximum: 100, description: 'The plan design’s total flow, shown beside flow per metre × perimeter.' })),
  },
  { additionalProperties: false, description: 'A section document, or a scenario to build one from; options compare and flowNet.' },
);
export type SectionRequest = Static<typeof SectionRequestSchema>;

/** The answer: the design.md §8 fields are named; the rest of the result passes through. */
export const SectionResponseSchema = Type.Object(
  {
    flow_m3_s_per_m: Type.Optional(Type.Number({ description: 'Plane: total flow per metre run, m³/s/m.' })),
    flow_m3_s: Type.Optional(Type.Number({ description: 'Axisymmetric: total flow, m³/s.' })),
    exitGradient: Type.Object({ max: Type.Number(), x_m: Type.Union([Type.Number(), Type.Null()]), criticalGradient: Type.Number(), fs: Type.Union([Type.Number(), Type.Null()]) }, { additionalProperties: true }),
    floor: Type.Array(Type.Object({ x_m: Type.Number(), head_m: Type.Number(), gradient: Type.Number() }, { additionalProperties: true })),
    heave: Type.Union([Type.Object({ method: Type.Literal('Terzaghi prism'), fs: Type.Union([Type.Number(), Type.Null()]) }, { additionalProperties: true }), Type.Null()]),
  },
  { additionalProperties: true },
);

export interface SectionSolverOptions {
  /** Time budget of one section solve on the compute pool, ms. Default the pool's (30 s). */
  timeout_ms?: number;
}

export interface SectionRoutesOptions {
  solver?: SectionSolverOptions;
  /** The per-client compute rate limit. */
  security?: SecurityOptions;
}

export const sectionRoutes: FastifyPluginAsync<SectionRoutesOptions> = async (app, options) => {
  const runOptions = options.solver?.timeout_ms !== undefined ? { timeout_ms: options.solver.timeout_ms } : {};

  app.post<{ Body: SectionRequest }>(
    '/section',
    {
      config: computeRateLimit(options.security),
      schema: {
        summary: 'Steady seepage in a vertical section: flow, exit gradient, heave and uplift',
        description:
          'Solves steady anisotropic Darcy flow in a plane or axisymmetric section (finite volumes on a graded mesh, MIC(0)-preconditioned conjugate gradients) and answers the flow and its split, '
          + 'the floor profile and exit gradient against γ′/γw, Terzaghi’s heave prism, slab and plug uplift and the flow net; compare adds the wall toe sweep, relief wells and a lower inside level. '
          + 'Give section (format drydig.section) or scenario (a half-section is built across its excavation). Cautions travel with every answer.',
        tags: ['section'],
        body: SectionRequestSchema,
        response: { 200: SectionResponseSchema, '4xx': ErrorResponseSchema, '5xx': ErrorResponseSchema },
      },
      // Before the schema: the shared validators word problems better and check fields together.
      preValidation: async (request) => {
        const raw = request.body as Record<string, unknown> | null | undefined;
        if (!raw || typeof raw !== 'object' || Array.isArray(raw)) return;
        if ('section' in raw && 'scenario' in raw) throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', '/scenario: give either section or scenario, not both', [{ path: '/scenario', message: 'give either section or scenario' }]);
        if (!('section' in raw) && !('scenario' in raw)) throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', '/section: give a section document (or a scenario to build one from)', [{ path: '/section', message: 'is required (or give scenario)' }]);
        if ('section' in raw) parseSection(raw.section, '/section');
        if ('scenario' in raw) parseScenario(raw.scenario, '/scenario');
      },
    },
    async (request) => currentCompute().run('section', request.body as SectionJob, runOptions),
  );
};
