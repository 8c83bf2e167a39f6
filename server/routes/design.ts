/**
 * `POST /api/v1/design`: design rates for a scenario — `{ scenario, mode?, options? }` in, the
 * design JSON of design.md section 4 out (the same answer as `drydig design`). The scenario and
 * the options are checked by the shared validators first, so messages name fields such as
 * `/scenario/aquifer/storativity` or `/options/pumpEfficiency`; the route schema then documents
 * the body and the response for the OpenAPI document.
 */
import { Type, type Static } from '@sinclair/typebox';
import type { FastifyPluginAsync } from 'fastify';
import { DesignResultSchema, validateDesignOptions } from '../../shared/design';
import { currentCompute, currentComputeScope, runDesignOnPool } from '../compute';
import { DesignModeSchema, DesignOptionsSchema, DrydigError, parseScenario, ScenarioSchema, summariseIssues } from '../../shared/schema';
import { computeRateLimit, type SecurityOptions } from '../security';
import { ErrorResponseSchema } from '../request-schemas';

export const DesignRequestSchema = Type.Object(
  {
    scenario: ScenarioSchema,
    mode: Type.Optional(DesignModeSchema),
    options: Type.Optional(DesignOptionsSchema),
  },
  { additionalProperties: false, description: 'A scenario, the solve mode (default optimal, or the scenario’s designOptions.mode), and option overrides.' },
);
export type DesignRequest = Static<typeof DesignRequestSchema>;

/** The design task's input from a request body (messages name fields under /scenario and /options). */
export function designTaskInput(body: DesignRequest) {
  return { scenario: body.scenario, ...(body.mode ? { mode: body.mode } : {}), ...(body.options ? { options: body.options } : {}), scenarioPath: '/scenario', optionsPath: '/options' };
}

/** The queue lane of a design: a layout search (which may run for its whole time limit) goes in the long lane. */
export function designLane(body: DesignRequest): 'long' | 'normal' {
  return requestedMode(body) === 'layout' ? 'long' : 'normal';
}

/** Options stored in the scenario sit under /scenario in a request body: the error's paths say so. */
export function withScenarioPaths(error: unknown): unknown {
  if (error instanceof DrydigError && error.issues.some((i) => i.path.startsWith('/designOptions'))) {
    const issues = error.issues.map((i) => ({ ...i, path: i.path.startsWith('/designOptions') ? `/scenario${i.path}` : i.path }));
    return new DrydigError(error.code, summariseIssues(issues), issues);
  }
  return error;
}

/** Checks a design body with the shared validators (better words than ajv; fields checked against each other). */
export async function checkDesignBody(request: { body: unknown }): Promise<void> {
  const raw = request.body as { scenario?: unknown; options?: unknown } | null | undefined;
  if (!raw || typeof raw !== 'object' || Array.isArray(raw)) return;
  if ('scenario' in raw) parseScenario(raw.scenario, '/scenario');
  if ('options' in raw) {
    const issues = validateDesignOptions(raw.options, '/options');
    if (issues.length > 0) throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', summariseIssues(issues), issues);
  }
  if ('scenario' in raw && raw.scenario && typeof raw.scenario === 'object') {
    const stored = (raw.scenario as Record<string, unknown>).designOptions;
    const issues = validateDesignOptions(stored, '/scenario/designOptions');
    if (issues.length > 0) throw new DrydigError('DRYDIG_ERR_INVALID_SCENARIO', summariseIssues(issues), issues);
  }
}

/** The mode a design request solves in: the body's, else the scenario's designOptions.mode, else optimal. */
function requestedMode(body: DesignRequest): string {
  const stored = (body.scenario as { designOptions?: { mode?: unknown } }).designOptions?.mode;
  return body.mode ?? body.options?.mode ?? (typeof stored === 'string' ? stored : 'optimal');
}

export const designRoutes: FastifyPluginAsync<{ security?: SecurityOptions }> = async (app, options) => {

  app.post<{ Body: DesignRequest }>(
    '/design',
    {
      config: computeRateLimit(options.security),
      schema: {
        summary: 'Design rates that meet every excavation’s target level',
        description:
          'Solves for well rates with the shared design solver: uniform (one rate for every active well, closed form), optimal (least total pumping per well, linear programming) '
          + 'or layout (which wells to install and their rates at least cost, mixed-integer programming). Every control point must reach its target at the design time within '
          + 'each well’s Sichardt capacity, suction lift and wetted-screen limits. feasible:false comes with reasons and the best achievable levels. The answer carries the '
          + 'times to target, the recovery after a power failure, a one-well-out check, the pump and bid summary, an equivalent-well quick check and cautions; on request (options.sensitivity, '
          + 'options.monteCarlo, options.robust) a sensitivity table for K and S, a seeded Monte Carlo analysis of K (probability met, P50/P90 flow, histogram; realisations in chunks over '
          + 'the compute pool) and robust designs (any one well out; K within a factor) with the extra flow each costs. For progress and cancel use POST /api/v1/design/jobs.',
        tags: ['design'],
        body: DesignRequestSchema,
        response: { 200: DesignResultSchema, '4xx': ErrorResponseSchema, '5xx': ErrorResponseSchema },
      },
      // Before the schema runs: the shared validators word problems better than ajv and check
      // fields against each other.
      preValidation: checkDesignBody,
    },
    async (request) => {
      try {
        // On the compute pool; a layout search (which may run for its whole time limit) in the long lane.
        // Monte Carlo realisations (options.monteCarlo) follow as chunks over the pool's threads.
        const threads = currentComputeScope()?.pool.threads ?? 0;
        return await runDesignOnPool({ runner: currentCompute(), input: designTaskInput(request.body), lane: designLane(request.body), concurrency: Math.max(1, threads), workers: threads });
      } catch (error) {
        throw withScenarioPaths(error);
      }
    },
  );
};
