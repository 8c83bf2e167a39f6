/**
 * Gives the app its compute pool (`app.compute`) and runs every request inside a compute scope
 * (`compute-context.ts`): the pool, the client's key for the fair queue (its address) and a
 * signal that is aborted when the client goes away before the answer, so its waiting or running
 * work is dropped. The pool's threads stop when the app closes.
 */
import fp from 'fastify-plugin';
import { createComputePool, type ComputePool, type ComputePoolOptions } from './compute-pool';
import { runInComputeScope } from './compute-context';

declare module 'fastify' {
  interface FastifyInstance {
    compute: ComputePool;
  }
}

export const computePlugin = fp<ComputePoolOptions>(
  async (app, options) => {
    const pool = createComputePool(options);
    app.decorate('compute', pool);
    app.addHook('onClose', async () => pool.close());
    app.addHook('onRequest', (request, reply, done) => {
      const controller = new AbortController();
      reply.raw.once('close', () => {
        if (!reply.raw.writableFinished) controller.abort();
      });
      runInComputeScope({ pool, client: request.ip, lane: 'normal', signal: controller.signal }, done);
    });
  },
  { name: 'drydig-compute', fastify: '5.x' },
);
