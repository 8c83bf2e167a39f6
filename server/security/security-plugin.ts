/**
 * Security headers (@fastify/helmet) and rate limiting of write endpoints (@fastify/rate-limit).
 * Register before the routes: the rate limiter attaches to routes as they are added, and only to
 * routes whose config carries `rateLimit` (see `writeRateLimit()`).
 */
import fp from 'fastify-plugin';
import helmet from '@fastify/helmet';
import rateLimit from '@fastify/rate-limit';
import { DrydigError } from '../../shared/schema';
import { buildCspDirectives } from './content-security-policy';

export interface SecurityOptions {
  /** Write requests allowed per client address per window. Default 300. */
  writeMax?: number;
  /** Window of the write limit, ms. Default 60 000. */
  writeWindow_ms?: number;
  /** Origin of an optional map-tile server allowed by the CSP. Default none. */
  tileOrigin?: string;
  /** Compute requests (evaluate, design, section, pumping test) allowed per client address per window. Default 120. */
  computeMax?: number;
  /** Window of the compute limit, ms. Default 60 000. */
  computeWindow_ms?: number;
}

export const DEFAULT_WRITE_MAX = 300;
export const DEFAULT_WRITE_WINDOW_MS = 60_000;
export const DEFAULT_COMPUTE_MAX = 120;
export const DEFAULT_COMPUTE_WINDOW_MS = 60_000;

/** Route `config` that puts a compute endpoint under the per-client compute rate limit. */
export function computeRateLimit(security: SecurityOptions = {}): { rateLimit: { max: number; timeWindow: number; errorResponseBuilder: RateLimitErrorBuilder } } {
  return {
    rateLimit: {
      max: security.computeMax ?? DEFAULT_COMPUTE_MAX,
      timeWindow: security.computeWindow_ms ?? DEFAULT_COMPUTE_WINDOW_MS,
      errorResponseBuilder: (_request, context) => rateLimited(`too many compute requests: at most ${context.max} per ${context.after}; try again in ${context.after}`),
    },
  };
}

type RateLimitErrorBuilder = (request: unknown, context: { max: number; after: string }) => Error;

function rateLimited(message: string): Error {
  return Object.assign(new DrydigError('DRYDIG_ERR_RATE_LIMITED', message), { statusCode: 429 });
}

/** Route `config` that puts a write endpoint under the write rate limit. */
export function writeRateLimit(): { rateLimit: Record<string, never> } {
  return { rateLimit: {} };
}

/** Helmet + rate limiting; `false` options elsewhere let tests turn the write limit off. */
export const securityPlugin = fp<SecurityOptions>(
  async (app, opts) => {
    await app.register(helmet, {
      contentSecurityPolicy: { useDefaults: false, directives: buildCspDirectives({ tileOrigin: opts.tileOrigin }) },
      // The client loads only same-origin resources; COEP would block an optional tile server.
      crossOriginEmbedderPolicy: false,
      referrerPolicy: { policy: 'no-referrer' },
    });
    await app.register(rateLimit, {
      global: false,
      max: opts.writeMax ?? DEFAULT_WRITE_MAX,
      timeWindow: opts.writeWindow_ms ?? DEFAULT_WRITE_WINDOW_MS,
      errorResponseBuilder: (_request, context) => rateLimited(`too many write requests: at most ${context.max} per ${context.after}; try again in ${context.after}`),
    });
  },
  { name: 'drydig-security', fastify: '5.x' },
);
