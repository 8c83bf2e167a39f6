/**
 * `GET /api/v1/openapi.json`: an OpenAPI 3.1 description generated from the schemas every route
 * registers with, so it can never drift from what the server validates. Routes are collected by
 * an `onRoute` hook installed on the root instance before any plugin (`installRouteCatalog`), so a
 * route another feature adds later appears without touching this file.
 */
import type { FastifyInstance, FastifyPluginAsync, RouteOptions } from 'fastify';
import { Type } from '@sinclair/typebox';
import { ERROR_TABLE } from '../../shared/schema';
import { readPackageVersion } from './health';
import { RESULT_CAUTIONS } from '../evaluation';
import { ErrorResponseSchema } from '../request-schemas';

/** What the catalog keeps of one route. */
export interface CatalogRoute {
  method: string;
  /** Full path with prefix, Fastify syntax (`/api/v1/scenarios/:id`). */
  url: string;
  schema?: Record<string, unknown>;
}

declare module 'fastify' {
  /** Documentation keys a route schema may carry; Fastify ignores them, the OpenAPI builder reads them. */
  interface FastifySchema {
    summary?: string;
    description?: string;
    tags?: string[];
    deprecated?: boolean;
    /** Leave this route out of the OpenAPI description. */
    hide?: boolean;
  }
  interface FastifyInstance {
    /** Every route registered after `installRouteCatalog`, in registration order. */
    drydigRouteCatalog: CatalogRoute[];
  }
}

/** Starts collecting routes; call on the root instance before registering any plugin. */
export function installRouteCatalog(app: FastifyInstance): void {
  const catalog: CatalogRoute[] = [];
  app.decorate('drydigRouteCatalog', catalog);
  app.addHook('onRoute', (route: RouteOptions) => {
    const methods = Array.isArray(route.method) ? route.method : [route.method];
    for (const method of methods) {
      catalog.push({ method: String(method).toUpperCase(), url: route.url, schema: route.schema as Record<string, unknown> | undefined });
    }
  });
}

type Json = null | boolean | number | string | Json[] | { [key: string]: Json };
type JsonObject = { [key: string]: Json };

function isObject(value: unknown): value is JsonObject {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/**
 * Rewrites a route's JSON Schema (draft-07, as TypeBox and ajv use it) for OpenAPI 3.1 (JSON
 * Schema 2020-12): tuples become `prefixItems`, and sub-schemas with an `$id` move to
 * `components.schemas` behind a `$ref`, so the scenario schema appears once however many routes use it.
 */
export function convertSchema(schema: unknown, components: Record<string, Json>): Json {
  // JSON round trip drops TypeBox's symbol keys and any functions.
  const plain = JSON.parse(JSON.stringify(schema ?? {})) as Json;
  return convertNode(plain, components);
}

function convertNode(node: Json, components: Record<string, Json>): Json {
  if (Array.isArray(node)) return node.map((n) => convertNode(n, components));
  if (!isObject(node)) return node;
  const out: JsonObject = {};
  for (const [key, value] of Object.entries(node)) {
    out[key] = key === 'const' || key === 'enum' || key === 'examples' || key === 'default' ? value : convertNode(value, components);
  }
  if (Array.isArray(out.items)) {
    out.prefixItems = out.items;
    if (out.additionalItems === false) out.items = false;
    else delete out.items;
    delete out.additionalItems;
  }
  if (typeof out.$ref === 'string' && !out.$ref.startsWith('#')) {
    // A schema shared with app.addSchema, referenced as "Name#" or "Name".
    out.$ref = `#/components/schemas/${out.$ref.replace(/#.*$/, '')}`;
  }
  if (typeof out.$id === 'string') {
    const id = out.$id;
    delete out.$id;
    if (!(id in components)) components[id] = out;
    return { $ref: `#/components/schemas/${id}` };
  }
  return out;
}

function toOpenApiPath(url: string): { path: string; pathParams: string[] } {
  const pathParams: string[] = [];
  const path = url
    .split('/')
    .map((segment) => {
      if (segment.startsWith(':')) {
        const name = segment.slice(1).replace(/\(.*\)$/, '');
        pathParams.push(name);
        return `{${name}}`;
      }
      if (segment === '*') {
        pathParams.push('wildcard');
        return '{wildcard}';
      }
      return segment;
    })
    .join('/');
  return { path, pathParams };
}

function operationId(method: string, path: string): string {
  const words = path
    .replace(/^\/api\/v1\//, '')
    .split(/[^A-Za-z0-9]+/)
    .filter((w) => w.length > 0)
    .map((w) => w[0]!.toUpperCase() + w.slice(1));
  return method.toLowerCase() + (words.join('') || 'Root');
}

function parametersFrom(schema: unknown, where: 'path' | 'query', components: Record<string, Json>, forced: string[] = []): JsonObject[] {
  const converted = schema === undefined ? {} : convertSchema(schema, components);
  const props = isObject(converted) && isObject(converted.properties) ? converted.properties : {};
  const required = isObject(converted) && Array.isArray(converted.required) ? converted.required : [];
  const names = new Set([...Object.keys(props), ...forced]);
  return [...names].map((name) => {
    const sub = props[name] ?? { type: 'string' };
    const parameter: JsonObject = { name, in: where, required: where === 'path' || required.includes(name), schema: sub };
    if (isObject(sub) && typeof sub.description === 'string') parameter.description = sub.description;
    return parameter;
  });
}

const STATUS_WORDS: Record<string, string> = { '200': 'OK', '201': 'Created', '204': 'No content', '4XX': 'Bad request (see error.code)', '5XX': 'Server error' };

function responsesFrom(response: unknown, components: Record<string, Json>): JsonObject {
  const out: JsonObject = {};
  if (isObject(response as Json)) {
    for (const [status, schema] of Object.entries(response as Record<string, unknown>)) {
      const key = status.toUpperCase();
      const s = schema as Record<string, unknown>;
      if (isObject(s as Json) && isObject(s.content as Json)) {
        const content: JsonObject = {};
        for (const [type, media] of Object.entries(s.content as Record<string, { schema?: unknown }>)) {
          content[type] = { schema: convertSchema(media.schema, components) };
        }
        out[key] = { description: typeof s.description === 'string' ? s.description : STATUS_WORDS[key] ?? 'Response', content };
      } else {
        const description = typeof s?.description === 'string' ? s.description : STATUS_WORDS[key] ?? 'Response';
        out[key] = { description, content: { 'application/json': { schema: convertSchema(s, components) } } };
      }
    }
  }
  if (!('4XX' in out) && !('DEFAULT' in out) && !('default' in out)) {
    out.default = { description: 'Error', content: { 'application/json': { schema: { $ref: '#/components/schemas/DrydigErrorResponse' } } } };
  }
  if ('DEFAULT' in out) {
    out.default = out.DEFAULT!;
    delete out.DEFAULT;
  }
  return out;
}

/** Builds the OpenAPI 3.1 document for every `/api/` route in the catalog (HEAD and hidden routes left out). */
export function buildOpenApiDocument(options: {
  routes: CatalogRoute[];
  version: string;
  /** Schemas shared through `app.addSchema`, by $id. */
  sharedSchemas?: Record<string, unknown>;
  errorSchema: unknown;
}): JsonObject {
  const components: Record<string, Json> = {};
  for (const [id, schema] of Object.entries(options.sharedSchemas ?? {})) convertSchema({ ...(schema as object), $id: id }, components);
  convertSchema(options.errorSchema, components);

  const paths: Record<string, JsonObject> = {};
  for (const route of options.routes) {
    if (!route.url.startsWith('/api/') || route.method === 'HEAD') continue;
    const schema = route.schema ?? {};
    if (schema.hide === true) continue;
    const { path, pathParams } = toOpenApiPath(route.url);
    const operation: JsonObject = { operationId: operationId(route.method, path) };
    for (const key of ['summary', 'description', 'tags', 'deprecated'] as const) {
      if (schema[key] !== undefined) operation[key] = JSON.parse(JSON.stringify(schema[key])) as Json;
    }
    const parameters = [
      ...parametersFrom(schema.params, 'path', components, pathParams),
      ...(schema.querystring ? parametersFrom(schema.querystring, 'query', components) : []),
    ];
    if (parameters.length > 0) operation.parameters = parameters;
    if (schema.body !== undefined) {
      operation.requestBody = { required: true, content: { 'application/json': { schema: convertSchema(schema.body, components) } } };
    }
    operation.responses = responsesFrom(schema.response, components);
    paths[path] ??= {};
    paths[path][route.method.toLowerCase()] = operation;
  }

  return {
    openapi: '3.1.0',
    info: {
      title: 'drydig compute service',
      version: options.version,
      description:
        'Construction-dewatering well-field design: drawdown, design rates and checks from a scenario (format drydig.scenario v1). '
        + 'SI units throughout; every field name carries its unit. Every failure answers { error: { code, message, fix, issues? } } '
        + `with a stable code (${Object.keys(ERROR_TABLE).length} codes, listed in components.schemas.DrydigErrorResponse). `
        + RESULT_CAUTIONS.join(' '),
    },
    paths,
    components: { schemas: components },
  };
}

export const openapiRoutes: FastifyPluginAsync = async (app) => {
  let cached: JsonObject | undefined;
  app.get(
    '/openapi.json',
    {
      schema: {
        summary: 'This description (OpenAPI 3.1), generated from the route schemas',
        tags: ['service'],
        response: {
          200: Type.Object(
            { openapi: Type.Literal('3.1.0'), info: Type.Object({ title: Type.String(), version: Type.String() }, { additionalProperties: true }) },
            { additionalProperties: true, description: 'An OpenAPI 3.1 document.' },
          ),
          '4xx': ErrorResponseSchema,
        },
      },
    },
    async () => {
      // Built on first request: by then every plugin has registered its routes.
      cached ??= buildOpenApiDocument({
        routes: app.drydigRouteCatalog ?? [],
        version: readPackageVersion(),
        sharedSchemas: app.getSchemas() as Record<string, unknown>,
        errorSchema: ErrorResponseSchema,
      });
      return cached;
    },
  );
};
