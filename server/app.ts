/**
 * The Fastify application factory. `buildApp()` wires plugins; `main.ts` only listens, so tests
 * drive the app with `inject`. Each feature is one plugin under `/api/v1/<feature>`.
 */
import Fastify, { type FastifyInstance, type FastifyReply } from 'fastify';
import { classifyError, installErrorHandling } from './error-handling';
import { healthRoutes } from './routes/health';
import { evaluateRoutes } from './routes/evaluate';
import { installRouteCatalog, openapiRoutes } from './routes/openapi';
import { designRoutes } from './routes/design';
import { designJobRoutes } from './routes/design-jobs';
import { validateRoutes } from './routes/validate';
import { pumpingTestRoutes } from './routes/pumping-test';
import { sectionRoutes, type SectionSolverOptions } from './routes/section';
import { scenarioRoutes } from './routes/scenarios';
import { linkRoutes } from './routes/links';
import { authPlugin } from './auth';
import { clientStatic } from './routes/client-static';
import { DEFAULT_MAX_GRID_NODES, DEFAULT_MAX_POINTS } from './request-schemas';
import { computePlugin, type ComputePoolOptions } from './compute';
import {
  checkTileOrigin,
  connectionTimeoutOptions,
  installHostAllowList,
  limitConnections,
  LOOPBACK_HOST_NAMES,
  securityPlugin,
  withRedactedLogging,
  type ConnectionLimits,
  type SecurityOptions,
} from './security';

export interface AppOptions {
  /** Folder for stored scenarios (SQLite). Default `./data`; ':memory:' keeps nothing on disk. */
  dataDir?: string;
  /** Fastify logger option; default off in tests, on in `main.ts`. */
  logger?: boolean | object;
  /** Largest accepted request body, bytes. Default 8 MiB. */
  bodyLimit_bytes?: number;
  /** Largest grid an evaluate request may ask for, nodes (× times). Default 250 000. */
  maxGridNodes?: number;
  /** Largest number of points (× times) an evaluate request may ask for. Default 100 000. */
  maxPoints?: number;
  /** Serve the built web client from this folder. Default `client/dist` when it exists. */
  clientDir?: string | false;
  /** Security headers and write rate limits (server/security). Default: 300 writes per minute per client. */
  security?: SecurityOptions;
  /**
   * https origin of a background map-tile server the client may load images from and connect
   * to, added to the Content-Security-Policy (img-src, connect-src), e.g.
   * 'https://tiles.example.org'. Takes precedence over `security.tileOrigin`. Default none: the
   * client loads same-origin resources only. Anything that is not an https origin is refused.
   */
  tileOrigin?: string;
  /**
   * The compute pool every request's engine work runs on (server/compute): threads (default the
   * cores, at least 2; 0 = in process), time budget per job, queue limits. Defaults: 30 s a job
   * (75 s a layout search), 32 waiting, 4 per client.
   */
  compute?: ComputePoolOptions;
  /** Section solves: their time budget on the compute pool. Default the pool's. */
  section?: SectionSolverOptions;
  /** Largest wells × points × times of one evaluate. Default 2.5·10⁸. */
  maxWork?: number;
  /**
   * Host names the service answers for (the Host header, port ignored); others get 421. Default
   * localhost, 127.0.0.1 and ::1; `drydig serve` adds its bind address and `--host-name` values.
   */
  hostNames?: readonly string[];
  /** Header and request time-outs, idle keep-alive, connections per address (server/security/connection-limits). */
  connections?: ConnectionLimits;
}

export const DEFAULT_BODY_LIMIT_BYTES = 8 * 1024 * 1024;
export { DEFAULT_MAX_GRID_NODES, DEFAULT_MAX_POINTS };

/** The CSP tile origin from the options, checked; throws naming the option when it is not an https origin. */
function resolveTileOrigin(options: AppOptions): string | undefined {
  const [text, source] = options.tileOrigin !== undefined ? [options.tileOrigin, 'tileOrigin'] : [options.security?.tileOrigin, 'security.tileOrigin'];
  if (text === undefined) return undefined;
  const checked = checkTileOrigin(text, source);
  if (!checked.ok) throw new TypeError(checked.message);
  return checked.origin;
}

export async function buildApp(options: AppOptions = {}): Promise<FastifyInstance> {
  const bodyLimit_bytes = options.bodyLimit_bytes ?? DEFAULT_BODY_LIMIT_BYTES;
  const app = Fastify({
    // Share tokens in URLs are redacted from every log line.
    logger: withRedactedLogging(options.logger ?? false),
    bodyLimit: bodyLimit_bytes,
    ...connectionTimeoutOptions(options.connections),
    ajv: { customOptions: { allErrors: false, coerceTypes: false, removeAdditional: false } },
    // Errors the router raises before any handler (malformed %-escapes, over-long parameters)
    // leave in the same JSON error shape as every other failure.
    frameworkErrors: (error, _request, reply) => {
      const { status, body } = classifyError(error);
      void (reply as FastifyReply).status(status).type('application/json; charset=utf-8').send(body);
    },
  });
  installErrorHandling(app);
  limitConnections(app.server, options.connections);
  // First of all hooks: a request for another host name is not served at all (DNS rebinding).
  installHostAllowList(app, options.hostNames ?? LOOPBACK_HOST_NAMES);
  // Before any plugin, so every route (whoever adds it) lands in the OpenAPI description.
  installRouteCatalog(app);
  // Before the routes: the rate limiter attaches to write routes as they are added.
  const security = { ...options.security, tileOrigin: resolveTileOrigin(options) };
  await app.register(securityPlugin, security);
  // Before the routes: every request runs in a compute scope (the pool, its client, its lane).
  await app.register(computePlugin, options.compute ?? {});
  const maxGridNodes = options.maxGridNodes ?? DEFAULT_MAX_GRID_NODES;
  const maxPoints = options.maxPoints ?? DEFAULT_MAX_POINTS;
  await app.register(healthRoutes, { prefix: '/api/v1', limits: { bodyLimit_bytes, maxGridNodes, maxPoints } });
  await app.register(evaluateRoutes, { prefix: '/api/v1', maxGridNodes, maxPoints, security, ...(options.maxWork ? { maxWork: options.maxWork } : {}) });
  await app.register(designRoutes, { prefix: '/api/v1', security });
  await app.register(designJobRoutes, { prefix: '/api/v1', security });
  await app.register(validateRoutes, { prefix: '/api/v1' });
  await app.register(pumpingTestRoutes, { prefix: '/api/v1', security });
  await app.register(sectionRoutes, { prefix: '/api/v1', solver: options.section, security });
  // Accounts: opens the store, session cookie, /api/v1/auth; the storage routes require a session.
  await app.register(authPlugin, { prefix: '/api/v1', dataDir: options.dataDir ?? 'data' });
  await app.register(scenarioRoutes, { prefix: '/api/v1', dataDir: options.dataDir ?? 'data' });
  await app.register(linkRoutes, { prefix: '/api/v1' });
  await app.register(openapiRoutes, { prefix: '/api/v1' });
  if (options.clientDir !== false) await app.register(clientStatic, { clientDir: options.clientDir });
  return app;
}
