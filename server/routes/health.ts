/**
 * `GET /api/v1/health`: liveness for monitoring, plus what this build computes and the request
 * limits it enforces, so a client can size its requests.
 */
import { readFileSync } from 'node:fs';
import type { FastifyPluginAsync } from 'fastify';
import { FLAG_BITS, type PointFlag } from '../../shared/field';
import { ErrorResponseSchema, HealthResponseSchema, MODEL_METHODS, type HealthResponse } from '../request-schemas';

export interface HealthRoutesOptions {
  /** Limits to report (the values the app was built with). */
  limits: HealthResponse['limits'];
}

/** The version in package.json, read once; 'unknown' if it cannot be read (never fails a health check). */
export function readPackageVersion(): string {
  try {
    const pkg = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version?: unknown };
    return typeof pkg.version === 'string' ? pkg.version : 'unknown';
  } catch {
    return 'unknown';
  }
}

export const healthRoutes: FastifyPluginAsync<HealthRoutesOptions> = async (app, options) => {
  const answer: HealthResponse = {
    status: 'ok',
    version: readPackageVersion(),
    engine: {
      scenarioFormat: 'drydig.scenario',
      scenarioVersion: 1,
      methods: [...MODEL_METHODS],
      flags: Object.keys(FLAG_BITS) as PointFlag[],
    },
    limits: options.limits,
  };
  app.get(
    '/health',
    {
      schema: {
        summary: 'Service status, version, engine capabilities and request limits',
        tags: ['service'],
        response: { 200: HealthResponseSchema, '4xx': ErrorResponseSchema },
      },
    },
    async () => answer,
  );
};
