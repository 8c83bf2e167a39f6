/**
 * Every failure the service answers — bad JSON, a body that fails its schema, an engine refusal,
 * an unknown route, a bug — leaves as one JSON shape:
 * `{ error: { code, message, fix, issues?: [{ path, message }] } }`, with the HTTP status and fix
 * line from ERROR_TABLE. Clients never see a stack trace; an unexpected error is logged in full and
 * answered with a generic 500.
 */
import type { FastifyError, FastifyInstance, FastifyReply, FastifyRequest } from 'fastify';
import { DrydigError, ERROR_TABLE, summariseIssues, type ErrorCode, type FieldIssue } from '../shared/schema';
import type { ErrorResponse } from './request-schemas';
import { redactTokens } from './security';
import { jsonNestingDepth, MAX_JSON_DEPTH } from './json-depth';

/** Longest request URL echoed back in a 404 message, characters. */
const MAX_ECHOED_URL_CHARS = 200;

/** The body for an error code; `fix` comes from the table so it stays one wording everywhere. */
export function buildErrorBody(code: ErrorCode, message: string, issues?: FieldIssue[]): ErrorResponse {
  const body: ErrorResponse = { error: { code, message, fix: ERROR_TABLE[code].fix } };
  if (issues && issues.length > 0) body.error.issues = issues;
  return body;
}

/** Escapes one property name for a JSON pointer (RFC 6901 section 3). */
function escapePointerToken(token: string): string {
  return token.replace(/~/g, '~0').replace(/\//g, '~1');
}

interface AjvLikeError {
  instancePath?: string;
  keyword?: string;
  params?: Record<string, unknown>;
  message?: string;
}

const TYPE_WORDS: Record<string, string> = {
  number: 'a number',
  integer: 'a whole number',
  string: 'a string',
  object: 'an object',
  array: 'an array',
  boolean: 'true or false',
  null: 'null',
};

/** Words for one schema violation, in the same voice as the scenario validator. */
function describeAjvError(e: AjvLikeError): string {
  const p = e.params ?? {};
  switch (e.keyword) {
    case 'required':
      return 'is required';
    case 'additionalProperties':
      return 'is not a known field (check spelling and the unit in the name)';
    case 'type':
      return `must be ${String(p.type).split(',').map((t) => TYPE_WORDS[t] ?? t).join(' or ')}`;
    case 'const':
      return `must be ${JSON.stringify(p.allowedValue)}`;
    case 'enum':
      return `must be one of ${(p.allowedValues as unknown[] | undefined)?.map((v) => JSON.stringify(v)).join(', ') ?? 'the listed values'}`;
    case 'maxItems':
      return `must have at most ${String(p.limit)} entries`;
    case 'minItems':
      return `must have at least ${String(p.limit)} ${p.limit === 1 ? 'entry' : 'entries'}`;
    default:
      return e.message ?? 'is not valid';
  }
}

/**
 * Turns ajv errors (paths like `body/points/3/0`, or a missing property named in params) into
 * JSON-pointer issues. ajv stops at the first failure (allErrors is off, a DoS guard), but a union
 * reports every branch it tried at one path; those are merged into one issue.
 */
export function issuesFromValidation(validation: AjvLikeError[], context?: string): FieldIssue[] {
  const byPath = new Map<string, string[]>();
  for (const e of validation) {
    let path = e.instancePath ?? '';
    if (e.keyword === 'required' && typeof e.params?.missingProperty === 'string') path += `/${escapePointerToken(e.params.missingProperty)}`;
    if (e.keyword === 'additionalProperties' && typeof e.params?.additionalProperty === 'string') path += `/${escapePointerToken(e.params.additionalProperty)}`;
    // "must match a schema in anyOf" only repeats what the branches said.
    if (e.keyword === 'anyOf' && (byPath.get(path)?.length ?? 0) > 0) continue;
    const words = describeAjvError(e);
    const list = byPath.get(path) ?? [];
    if (!list.includes(words)) list.push(words);
    byPath.set(path, list);
  }
  const where = context && context !== 'body' ? `${context} ` : '';
  return [...byPath].map(([path, words]) => ({ path, message: `${where}${joinAlternatives(words)}` }));
}

/** ["must be number", "must be null"] → "must be number or null". */
function joinAlternatives(words: string[]): string {
  if (words.length > 1 && words.every((w) => w.startsWith('must be '))) {
    return `must be ${words.map((w) => w.slice('must be '.length)).join(' or ')}`;
  }
  return words.join('; ');
}

/** Fastify's own errors, by code, mapped onto ours. */
const FASTIFY_CODES: Record<string, { code: ErrorCode; message: string }> = {
  FST_ERR_CTP_INVALID_JSON_BODY: { code: 'DRYDIG_ERR_MALFORMED_JSON', message: 'the body is not well-formed JSON' },
  FST_ERR_CTP_EMPTY_JSON_BODY: { code: 'DRYDIG_ERR_MALFORMED_JSON', message: 'the body is empty but Content-Type says JSON' },
  FST_ERR_CTP_BODY_TOO_LARGE: { code: 'DRYDIG_ERR_BODY_TOO_LARGE', message: 'the request body is larger than the limit' },
  FST_ERR_CTP_INVALID_MEDIA_TYPE: { code: 'DRYDIG_ERR_UNSUPPORTED_MEDIA_TYPE', message: 'the body must be JSON (Content-Type: application/json)' },
  FST_ERR_CTP_INVALID_CONTENT_LENGTH: { code: 'DRYDIG_ERR_INVALID_REQUEST', message: 'Content-Length does not match the body' },
  FST_ERR_BAD_URL: { code: 'DRYDIG_ERR_INVALID_REQUEST', message: 'the URL is not valid' },
};

/** Falls back on the HTTP status for errors from plugins (static files, rate limiting …). */
function codeForStatus(status: number): ErrorCode {
  if (status === 403 || status === 404) return 'DRYDIG_ERR_NO_ROUTE';
  if (status === 413) return 'DRYDIG_ERR_BODY_TOO_LARGE';
  if (status === 415) return 'DRYDIG_ERR_UNSUPPORTED_MEDIA_TYPE';
  if (status === 429) return 'DRYDIG_ERR_RATE_LIMITED';
  if (status >= 400 && status < 500) return 'DRYDIG_ERR_INVALID_REQUEST';
  return 'DRYDIG_ERR_INTERNAL';
}

const GENERIC_INTERNAL_MESSAGE = 'an unexpected error occurred; it has been logged. Nothing was stored.';

/** instanceof, and a shape check for a DrydigError from a second copy of the module (tsx vs vite). */
function isDrydigError(error: unknown): error is DrydigError {
  if (error instanceof DrydigError) return true;
  const e = error as { name?: unknown; code?: unknown; issues?: unknown; status?: unknown } | null;
  return !!e && e.name === 'DrydigError' && typeof e.code === 'string' && e.code in ERROR_TABLE && Array.isArray(e.issues) && typeof e.status === 'number';
}

/** Maps any thrown value onto a status and an error body. Exported for tests. */
export function classifyError(error: unknown): { status: number; body: ErrorResponse; internal: boolean } {
  if (isDrydigError(error)) {
    // A 500 may carry internals, so it leaves with the generic words. A damaged revision is named
    // (no secret in it), so the user knows which one to restore; the service's own refusals for
    // load or time (503: busy, time budget, cancelled) say what happened and when to come back.
    if (error.status === 500 && error.code !== 'DRYDIG_ERR_STORED_DATA_DAMAGED') return { status: error.status, body: buildErrorBody(error.code, GENERIC_INTERNAL_MESSAGE), internal: true };
    return { status: error.status, body: buildErrorBody(error.code, error.message, error.issues), internal: false };
  }
  const fe = error as Partial<FastifyError> & { validation?: AjvLikeError[]; validationContext?: string };
  if (Array.isArray(fe.validation)) {
    const issues = issuesFromValidation(fe.validation, fe.validationContext);
    return { status: 400, body: buildErrorBody('DRYDIG_ERR_INVALID_REQUEST', summariseIssues(issues), issues), internal: false };
  }
  const known = typeof fe.code === 'string' ? FASTIFY_CODES[fe.code] : undefined;
  if (known) return { status: ERROR_TABLE[known.code].status, body: buildErrorBody(known.code, known.message), internal: false };
  const status = typeof fe.statusCode === 'number' ? fe.statusCode : 500;
  const code = codeForStatus(status);
  if (code === 'DRYDIG_ERR_INTERNAL') return { status: 500, body: buildErrorBody(code, GENERIC_INTERNAL_MESSAGE), internal: true };
  // A plugin's 4xx: its message is meant for clients, but keep it to one short line.
  const message = typeof fe.message === 'string' && fe.message !== '' ? fe.message.split('\n')[0]!.slice(0, 300) : ERROR_TABLE[code].title;
  return { status: ERROR_TABLE[code].status, body: buildErrorBody(code, message), internal: false };
}

/** "GET /path" for messages and log lines: share tokens redacted, long URLs cut. */
function describeRequest(request: FastifyRequest): string {
  const redacted = redactTokens(request.url);
  const url = redacted.length > MAX_ECHOED_URL_CHARS ? `${redacted.slice(0, MAX_ECHOED_URL_CHARS)}…` : redacted;
  return `${request.method} ${url}`;
}

/**
 * Installs the error and not-found handlers on the root instance (before any plugin is
 * registered, so every plugin inherits them), and accepts only JSON bodies.
 */
export function installErrorHandling(app: FastifyInstance): void {
  // Fastify parses text/plain by default; a JSON API answers 415 instead of "body must be object".
  // A plugin that takes another type (CSV upload …) adds its own parser in its own scope.
  app.removeContentTypeParser('text/plain');
  // Fastify's own JSON parser (prototype-poisoning checks kept), behind a nesting-depth check.
  const parseJson = app.getDefaultJsonParser('error', 'error');
  app.removeContentTypeParser('application/json');
  app.addContentTypeParser('application/json', { parseAs: 'string' }, (request, body, done) => {
    const text = typeof body === 'string' ? body : body.toString('utf8');
    if (jsonNestingDepth(text, MAX_JSON_DEPTH) > MAX_JSON_DEPTH) {
      done(new DrydigError('DRYDIG_ERR_INVALID_REQUEST', `the body nests arrays and objects deeper than ${MAX_JSON_DEPTH} levels; no drydig document needs that many`), undefined);
      return;
    }
    parseJson(request, text, done);
  });

  app.setErrorHandler((error: unknown, request: FastifyRequest, reply: FastifyReply) => {
    const { status, body, internal } = classifyError(error);
    if (internal) request.log.error({ err: error }, `unexpected error on ${describeRequest(request)}`);
    // A refusal for load says when to come back (RFC 9110 section 10.2.3).
    const retryAfter_s = (error as { retryAfter_s?: unknown } | null)?.retryAfter_s;
    if (typeof retryAfter_s === 'number') void reply.header('retry-after', String(Math.ceil(retryAfter_s)));
    else request.log.info({ code: body.error.code, issues: body.error.issues?.length ?? 0 }, body.error.message);
    return reply.status(status).type('application/json; charset=utf-8').send(body);
  });

  app.setNotFoundHandler((request: FastifyRequest, reply: FastifyReply) => {
    const body = buildErrorBody('DRYDIG_ERR_NO_ROUTE', `there is no route ${describeRequest(request)}`);
    return reply.status(404).type('application/json; charset=utf-8').send(body);
  });
}
