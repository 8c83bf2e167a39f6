/**
 * `POST /api/v1/evaluate`: levels and drawdowns of a scenario at points and/or on a grid, at one
 * or more times. The scenario is checked by the shared validator (so messages name fields such as
 * `/scenario/aquifer/storativity` and include the cross-field checks); the rest of the body by the
 * route schema. The numbers come from the shared field engine unchanged.
 */
import type { FastifyPluginAsync } from 'fastify';
import { DrydigError, parseScenario, type Scenario } from '../../shared/schema';
import { checkEvaluateWork, currentCompute, DEFAULT_MAX_WORK, isQuickEvaluate } from '../compute';
import { gridSplitWork, MIN_SPLIT_WORK, runEvaluationInBands } from '../evaluation';
import { computeRateLimit, type SecurityOptions } from '../security';
import {
  buildEvaluateRequestSchema,
  DEFAULT_MAX_GRID_NODES,
  DEFAULT_MAX_POINTS,
  ErrorResponseSchema,
  EvaluateResponseSchema,
  type EvaluateRequest,
} from '../request-schemas';

export interface EvaluateRoutesOptions {
  /** Largest grid nodes × times per request. Default 250 000. */
  maxGridNodes?: number;
  /** Largest points × times per request. Default 100 000. */
  maxPoints?: number;
  /** Largest wells × points × times per request. Default 2.5·10⁸. */
  maxWork?: number;
  /** The per-client compute rate limit. */
  security?: SecurityOptions;
}

/** Throws the size errors a request can earn before any computing starts. */
function checkRequestSize(body: EvaluateRequest, limits: { maxPoints: number; maxGridNodes: number }): void {
  const timeCount = body.times_s?.length ?? 1;
  const pointCount = body.points?.length ?? 0;
  if (pointCount * timeCount > limits.maxPoints) {
    const path = body.times_s ? '/times_s' : '/points';
    throw new DrydigError(
      'DRYDIG_ERR_TOO_MANY_POINTS',
      `${path}: ${pointCount} points × ${timeCount} times = ${pointCount * timeCount} evaluations, more than the limit of ${limits.maxPoints}`,
      [{ path, message: `points × times must not exceed ${limits.maxPoints}` }],
    );
  }
  if (body.grid) {
    const [nx, ny] = body.grid.counts;
    const nodes = nx * ny * timeCount;
    if (nodes > limits.maxGridNodes) {
      const times = timeCount > 1 ? ` × ${timeCount} times` : '';
      throw new DrydigError(
        'DRYDIG_ERR_GRID_TOO_LARGE',
        `/grid/counts: ${nx} × ${ny} nodes${times} = ${nodes}, more than the limit of ${limits.maxGridNodes}`,
        [{ path: '/grid/counts', message: `nodes × times must not exceed ${limits.maxGridNodes}` }],
      );
    }
  }
  if (!body.points && !body.grid) {
    throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', '/points: give points, a grid, or both', [
      { path: '/points', message: 'give points, a grid, or both' },
    ]);
  }
}

export const evaluateRoutes: FastifyPluginAsync<EvaluateRoutesOptions> = async (app, options) => {
  const limits = {
    maxPoints: options.maxPoints ?? DEFAULT_MAX_POINTS,
    maxGridNodes: options.maxGridNodes ?? DEFAULT_MAX_GRID_NODES,
  };
  const body = buildEvaluateRequestSchema(limits);

  app.post<{ Body: EvaluateRequest }>(
    '/evaluate',
    {
      config: computeRateLimit(options.security),
      schema: {
        summary: 'Levels and drawdowns at points and on a grid',
        description:
          'Evaluates the scenario with the shared field engine at each time in times_s (absent: the design time; null: steady state). '
          + 'Points come back one entry per point per time; grids one per time, drawdowns rounded to 0.1 mm with flag masks run-length encoded. '
          + 'Flagged results lie outside the method\u2019s comfortable validity; cautions travel with every answer.',
        tags: ['evaluate'],
        body,
        response: { 200: EvaluateResponseSchema, '4xx': ErrorResponseSchema, '5xx': ErrorResponseSchema },
      },
      // Before the schema runs: the shared validator words scenario problems better than ajv and
      // checks fields against each other (levels in order, parameters the aquifer kind needs).
      preValidation: async (request) => {
        const raw = request.body as { scenario?: unknown } | null | undefined;
        if (raw && typeof raw === 'object' && !Array.isArray(raw) && 'scenario' in raw) {
          parseScenario(raw.scenario, '/scenario');
        }
      },
    },
    async (request) => {
      checkRequestSize(request.body, limits);
      checkEvaluateWork(request.body, options.maxWork ?? DEFAULT_MAX_WORK);
      const scenario: Scenario = request.body.scenario;
      // On the compute pool: a large grid never holds the event loop. A large grid is split into
      // bands of rows over the threads this client may hold (the others stay free for others).
      const compute = currentCompute();
      const input = { scenario, points: request.body.points, grid: request.body.grid, times_s: request.body.times_s, scenarioPath: '/scenario' };
      const lane = isQuickEvaluate(request.body) ? { lane: 'quick' as const } : {};
      const bands = gridSplitWork(input) >= MIN_SPLIT_WORK ? compute.threadsPerClient : 1;
      if (bands <= 1) return compute.run('evaluate', input, lane);
      return runEvaluationInBands(input, {
        bands,
        runPoints: (options) => compute.run('evaluate', options, lane),
        runBand: (band) => compute.run('gridBand', band, lane),
      });
    },
  );
};
