/**
 * Design jobs: `POST /api/v1/design/jobs` starts a design (the body of `POST /api/v1/design`) and
 * answers 202 with its id at once; `GET /api/v1/design/jobs/:id` gives its state, progress (stage
 * and fraction; a Monte Carlo run says how many realisations are done) and, when done, the result;
 * `DELETE /api/v1/design/jobs/:id` cancels it (its chunks waiting or running on the compute pool
 * are dropped). For runs long enough to want a progress bar and a cancel button.
 */
import { Type } from '@sinclair/typebox';
import type { FastifyPluginAsync } from 'fastify';
import { DesignResultSchema } from '../../shared/design';
import { DrydigError } from '../../shared/schema';
import { runDesignOnPool } from '../compute';
import { classifyError } from '../error-handling';
import { ErrorResponseSchema } from '../request-schemas';
import { computeRateLimit, type SecurityOptions } from '../security';
import { checkDesignBody, DesignRequestSchema, designLane, designTaskInput, withScenarioPaths, type DesignRequest } from './design';
import { DesignJobStore, type DesignJob } from './design-job-store';

const JobStateSchema = Type.Union([Type.Literal('running'), Type.Literal('done'), Type.Literal('failed'), Type.Literal('cancelled')]);

export const DesignJobSchema = Type.Object({
  id: Type.String(),
  state: JobStateSchema,
  stage: Type.String({ description: 'What the job is doing (e.g. "monte carlo 120/1000").' }),
  fraction: Type.Number({ description: 'Share done, 0–1.' }),
  result: Type.Optional(DesignResultSchema),
  error: Type.Optional(ErrorResponseSchema.properties.error),
});

const IdParams = Type.Object({ id: Type.String({ minLength: 1, maxLength: 64 }) });

const view = (job: DesignJob) => ({
  id: job.id,
  state: job.state,
  stage: job.stage,
  fraction: job.fraction,
  ...(job.result ? { result: job.result } : {}),
  ...(job.error ? { error: job.error } : {}),
});

function notFound(id: string): DrydigError {
  return new DrydigError('DRYDIG_ERR_NOT_FOUND', `/id: no design job "${id.slice(0, 64)}" (finished jobs are kept for 10 minutes)`, [{ path: '/id', message: 'names no design job' }]);
}

export const designJobRoutes: FastifyPluginAsync<{ security?: SecurityOptions }> = async (app, options) => {
  const store = new DesignJobStore();
  app.addHook('onClose', async () => store.cancelAll());

  app.post<{ Body: DesignRequest }>(
    '/design/jobs',
    {
      config: computeRateLimit(options.security),
      schema: {
        summary: 'Start a design job (progress and cancel)',
        description: 'The body of POST /api/v1/design. Answers 202 with the job id at once; poll GET /api/v1/design/jobs/{id} for progress and the result, DELETE it to cancel.',
        tags: ['design'],
        body: DesignRequestSchema,
        response: { 202: DesignJobSchema, '4xx': ErrorResponseSchema, '5xx': ErrorResponseSchema },
      },
      preValidation: checkDesignBody,
    },
    async (request, reply) => {
      const job = store.create(request.ip);
      if (typeof job === 'string') throw new DrydigError('DRYDIG_ERR_BUSY', job);
      const pool = app.compute;
      const client = request.ip;
      const signal = job.controller.signal;
      // The job outlives the request: it runs on the app's pool with its own signal, not the request's.
      void runDesignOnPool({
        runner: { threadsPerClient: pool.threadsPerClient, run: (task, input, runOptions = {}) => pool.run(task, input, { client, ...runOptions, signal }) },
        input: designTaskInput(request.body),
        lane: designLane(request.body),
        concurrency: Math.max(1, pool.threads),
        workers: pool.threads,
        signal,
        onProgress: (stage, fraction) => {
          job.stage = stage;
          job.fraction = Math.max(job.fraction, Math.min(1, fraction));
        },
      }).then(
        (result) => store.finish(job, { state: signal.aborted ? 'cancelled' : 'done', ...(signal.aborted ? {} : { result }) }),
        (error: unknown) => {
          if (signal.aborted) return store.finish(job, { state: 'cancelled' });
          const { body, internal } = classifyError(withScenarioPaths(error));
          if (internal) request.log.error({ err: error }, 'design job failed');
          store.finish(job, { state: 'failed', error: body.error });
        },
      );
      return reply.code(202).send(view(job));
    },
  );

  app.get<{ Params: { id: string } }>(
    '/design/jobs/:id',
    { schema: { summary: 'State, progress and result of a design job', tags: ['design'], params: IdParams, response: { 200: DesignJobSchema, '4xx': ErrorResponseSchema } } },
    async (request) => {
      const job = store.get(request.params.id);
      if (!job) throw notFound(request.params.id);
      return view(job);
    },
  );

  app.delete<{ Params: { id: string } }>(
    '/design/jobs/:id',
    { schema: { summary: 'Cancel a design job', tags: ['design'], params: IdParams, response: { 200: DesignJobSchema, '4xx': ErrorResponseSchema } } },
    async (request) => {
      const job = store.get(request.params.id);
      if (!job) throw notFound(request.params.id);
      if (job.state === 'running') {
        job.controller.abort();
        store.finish(job, { state: 'cancelled' });
      }
      return view(job);
    },
  );
};
