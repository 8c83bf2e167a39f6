/**
 * GET /api/v1/openapi.json: generated from the registered routes, so every /api/v1 route appears,
 * including routes plugins add after the catalog is installed.
 */
import Fastify from 'fastify';
import { Type } from '@sinclair/typebox';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../../../server/app';
import { installErrorHandling } from '../../../server/error-handling';
import { installRouteCatalog, openapiRoutes } from '../../../server/routes/openapi';

type Doc = {
  openapi: string;
  paths: Record<string, Record<string, { operationId: string; parameters?: Array<{ name: string; in: string; required: boolean }>; requestBody?: { content: Record<string, { schema: unknown }> }; responses: Record<string, unknown> }>>;
  components: { schemas: Record<string, unknown> };
};

let app: FastifyInstance;
let doc: Doc;
beforeAll(async () => {
  app = await buildApp({ clientDir: false, dataDir: ':memory:' });
  const response = await app.inject({ method: 'GET', url: '/api/v1/openapi.json' });
  expect(response.statusCode).toBe(200);
  doc = JSON.parse(response.body) as Doc;
});
afterAll(async () => {
  await app.close();
});

function collectRefs(node: unknown, out: string[] = []): string[] {
  if (Array.isArray(node)) node.forEach((n) => collectRefs(n, out));
  else if (node && typeof node === 'object') {
    for (const [k, v] of Object.entries(node)) {
      if (k === '$ref' && typeof v === 'string') out.push(v);
      else collectRefs(v, out);
    }
  }
  return out;
}

describe('GET /api/v1/openapi.json', () => {
  it('is an OpenAPI 3.1 document', () => {
    expect(doc.openapi).toBe('3.1.0');
  });

  it('lists every /api/v1 route the app registered, with its method', () => {
    const routes = app.drydigRouteCatalog.filter((r) => r.url.startsWith('/api/v1') && r.method !== 'HEAD');
    expect(routes.length).toBeGreaterThanOrEqual(3);
    for (const route of routes) {
      const path = route.url.replace(/:([A-Za-z0-9_]+)/g, '{$1}');
      expect(doc.paths[path], `${route.method} ${route.url}`).toBeDefined();
      expect(doc.paths[path]![route.method.toLowerCase()], `${route.method} ${route.url}`).toBeDefined();
    }
    expect(Object.keys(doc.paths)).toEqual(expect.arrayContaining(['/api/v1/health', '/api/v1/evaluate', '/api/v1/openapi.json']));
  });

  it('describes the evaluate body with the shared scenario schema, once, as a component', () => {
    const body = doc.paths['/api/v1/evaluate']!.post!.requestBody!.content['application/json']!.schema as { properties: Record<string, unknown> };
    expect(body.properties.scenario).toEqual({ $ref: '#/components/schemas/DrydigScenarioV1' });
    const scenario = doc.components.schemas.DrydigScenarioV1 as { properties: Record<string, unknown>; required: string[] };
    expect(scenario.required).toEqual(expect.arrayContaining(['format', 'version', 'aquifer', 'wells', 'design']));
  });

  it('writes tuples as 2020-12 prefixItems (a point is exactly [x, y])', () => {
    const body = doc.paths['/api/v1/evaluate']!.post!.requestBody!.content['application/json']!.schema as { properties: { points: { items: Record<string, unknown> } } };
    const point = body.properties.points.items;
    expect(point.prefixItems).toEqual([{ type: 'number' }, { type: 'number' }]);
    expect(point.items).toBe(false);
    expect(point).not.toHaveProperty('additionalItems');
  });

  it('documents the error envelope and every reference resolves to a component', () => {
    expect(doc.components.schemas.DrydigErrorResponse).toBeDefined();
    const evaluate = doc.paths['/api/v1/evaluate']!.post!;
    expect(Object.keys(evaluate.responses)).toEqual(expect.arrayContaining(['200', '4XX']));
    for (const ref of collectRefs(doc)) {
      expect(ref.startsWith('#/components/schemas/'), ref).toBe(true);
      expect(doc.components.schemas[ref.slice('#/components/schemas/'.length)], ref).toBeDefined();
    }
  });

  it('gives each operation a unique operationId', () => {
    const ids = Object.values(doc.paths).flatMap((ops) => Object.values(ops).map((o) => o.operationId));
    expect(new Set(ids).size).toBe(ids.length);
  });
});

describe('installRouteCatalog(app)', () => {
  it('picks up routes a plugin registers later, with path parameters and query parameters', async () => {
    const local = Fastify();
    installErrorHandling(local);
    installRouteCatalog(local);
    await local.register(
      async (scope) => {
        scope.get(
          '/widgets/:widgetId',
          {
            schema: {
              summary: 'A later feature',
              params: Type.Object({ widgetId: Type.String() }),
              querystring: Type.Object({ depth_m: Type.Optional(Type.Number()) }),
            },
          },
          async () => ({}),
        );
        scope.get('/hidden', { schema: { hide: true } }, async () => ({}));
      },
      { prefix: '/api/v1' },
    );
    await local.register(openapiRoutes, { prefix: '/api/v1' });
    const later = JSON.parse((await local.inject({ method: 'GET', url: '/api/v1/openapi.json' })).body) as Doc;
    await local.close();
    const op = later.paths['/api/v1/widgets/{widgetId}']!.get!;
    expect(op).toBeDefined();
    expect(op.parameters).toEqual([
      expect.objectContaining({ name: 'widgetId', in: 'path', required: true }),
      expect.objectContaining({ name: 'depth_m', in: 'query', required: false }),
    ]);
    expect(later.paths['/api/v1/hidden']).toBeUndefined();
    expect(Object.keys(op.responses)).toContain('default');
  });
});
