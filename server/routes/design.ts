/**
 * `POST /api/v1/design`: design rates for a scenario — `{ scenario, mode?, options? }` in, the
 * design JSON of design.md section 4 out (the same answer as `drydig design`). The scenario and
 * the options are checked by the shared validators first, so messages name fields such as
 * `/scenario/aquifer/storativity` or `/options/pumpEfficiency`; the route schema then documents
 * the body and the response for the OpenAPI document.
 */
import { createRequire } from 'node:module';
import { Worker } from 'node:worker_threads';
import { Type, type Static } from '@sinclair/typebox';
import type { FastifyPluginAsync } from 'fastify';
import {
  DesignResultSchema,
  runDesign,
  setLinearProgramSolver,
  solveWithHighs,
  validateDesignOptions,
  type LinearProgram,
  type LinearProgramSolution,
  type LinearProgramSolver,
} from '../../shared/design';
import { DesignModeSchema, DesignOptionsSchema, DrydigError, parseScenario, ScenarioSchema, summariseIssues, type Scenario } from '../../shared/schema';
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

/**
 * HiGHS in a worker thread: a solve (a layout search may take its whole time limit) runs off the
 * event loop, so the service keeps answering. The worker runs the same `solveWithHighs` code from
 * its source text and loads the `highs` package itself; solves queue one after another.
 */
export function createWorkerLinearSolver(): { solve: LinearProgramSolver; close: () => Promise<void> } {
  const highsPath = createRequire(import.meta.url).resolve('highs');
  const source = `'use strict';
const { parentPort } = require('node:worker_threads');
const loadHighs = require(${JSON.stringify(highsPath)});
const __name = (f) => f;
const solveWithHighs = ${solveWithHighs.toString()};
const ready = loadHighs();
parentPort.on('message', async ({ id, problem }) => {
  try {
    const highs = await ready;
    parentPort.postMessage({ id, solution: solveWithHighs(highs, problem) });
  } catch (error) {
    parentPort.postMessage({ id, error: String((error && error.message) || error) });
  }
});`;
  let worker: Worker | null = null;
  let nextId = 1;
  const pending = new Map<number, { resolve: (s: LinearProgramSolution) => void; reject: (e: Error) => void }>();
  const failAll = (error: Error) => {
    for (const p of pending.values()) p.reject(error);
    pending.clear();
    worker = null;
  };
  const start = (): Worker => {
    const w = new Worker(source, { eval: true });
    w.on('message', (m: { id: number; solution?: LinearProgramSolution; error?: string }) => {
      const p = pending.get(m.id);
      if (!p) return;
      pending.delete(m.id);
      if (m.solution) p.resolve(m.solution);
      else p.reject(new Error(`LP solver: ${m.error ?? 'no answer'}`));
    });
    w.on('error', (e) => failAll(e instanceof Error ? e : new Error(String(e))));
    w.on('exit', (code) => {
      if (pending.size > 0) failAll(new Error(`LP solver worker stopped (exit code ${code})`));
      worker = null;
    });
    w.unref();
    return w;
  };
  let queue: Promise<unknown> = Promise.resolve();
  const solve: LinearProgramSolver = (problem: LinearProgram) => {
    const run = () =>
      new Promise<LinearProgramSolution>((resolve, reject) => {
        worker ??= start();
        const id = nextId++;
        pending.set(id, { resolve, reject });
        worker.postMessage({ id, problem });
      });
    const result = queue.then(run, run);
    queue = result.catch(() => undefined);
    return result;
  };
  const close = async () => {
    const w = worker;
    worker = null;
    if (w) await w.terminate();
  };
  return { solve, close };
}

export const designRoutes: FastifyPluginAsync = async (app) => {
  const solver = createWorkerLinearSolver();
  const previous = setLinearProgramSolver(solver.solve);
  app.addHook('onClose', async () => {
    setLinearProgramSolver(previous);
    await solver.close();
  });

  app.post<{ Body: DesignRequest }>(
    '/design',
    {
      schema: {
        summary: 'Design rates that meet every excavation’s target level',
        description:
          'Solves for well rates with the shared design solver: uniform (one rate for every active well, closed form), optimal (least total pumping per well, linear programming) '
          + 'or layout (which wells to install and their rates at least cost, mixed-integer programming). Every control point must reach its target at the design time within '
          + 'each well’s Sichardt capacity, suction lift and wetted-screen limits. feasible:false comes with reasons and the best achievable levels. The answer carries the '
          + 'times to target, the recovery after a power failure, a one-well-out check, the pump and bid summary, an equivalent-well quick check and cautions.',
        tags: ['design'],
        body: DesignRequestSchema,
        response: { 200: DesignResultSchema, '4xx': ErrorResponseSchema, '5xx': ErrorResponseSchema },
      },
      // Before the schema runs: the shared validators word problems better than ajv and check
      // fields against each other.
      preValidation: async (request) => {
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
      },
    },
    async (request) => {
      const scenario: Scenario = request.body.scenario;
      try {
        return await runDesign({ scenario, mode: request.body.mode, options: request.body.options, scenarioPath: '/scenario', optionsPath: '/options' });
      } catch (error) {
        // Options stored in the scenario sit under /scenario in this body.
        if (error instanceof DrydigError && error.issues.some((i) => i.path.startsWith('/designOptions'))) {
          const issues = error.issues.map((i) => ({ ...i, path: i.path.startsWith('/designOptions') ? `/scenario${i.path}` : i.path }));
          throw new DrydigError(error.code, summariseIssues(issues), issues);
        }
        throw error;
      }
    },
  );
};
