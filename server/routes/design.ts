/** Placeholder: filled in by its issue. */
import type { FastifyPluginAsync } from 'fastify';

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export const designRoutes: FastifyPluginAsync<any> = async () => {};
