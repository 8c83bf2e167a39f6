/**
 * installErrorHandling: one error envelope for every failure; internal details only in the log.
 */
import { Writable } from 'node:stream';
import Fastify from 'fastify';
import { describe, expect, it } from 'vitest';
import { buildErrorBody, classifyError, installErrorHandling, issuesFromValidation } from '../../server/error-handling';
import { DrydigError, ERROR_TABLE } from '../../shared/schema';
import { withRedactedLogging } from '../../server/security';

describe('issuesFromValidation(errors) turns ajv errors into JSON-pointer issues', () => {
  const cases = [
    {
      name: 'a nested item path stays a pointer',
      errors: [{ instancePath: '/points/3/0', keyword: 'type', params: { type: 'number' }, message: 'must be number' }],
      expected: [{ path: '/points/3/0', message: 'must be a number' }],
    },
    {
      name: 'a missing property is appended to the parent path',
      errors: [{ instancePath: '/grid', keyword: 'required', params: { missingProperty: 'origin' }, message: "must have required property 'origin'" }],
      expected: [{ path: '/grid/origin', message: 'is required' }],
    },
    {
      name: 'an unknown property is named, escaped per RFC 6901',
      errors: [{ instancePath: '', keyword: 'additionalProperties', params: { additionalProperty: 'a/b~c' }, message: 'must NOT have additional properties' }],
      expected: [{ path: '/a~1b~0c', message: 'is not a known field (check spelling and the unit in the name)' }],
    },
    {
      name: 'the branches of a union merge into one issue',
      errors: [
        { instancePath: '/times_s/0', keyword: 'type', params: { type: 'number' }, message: 'must be number' },
        { instancePath: '/times_s/0', keyword: 'type', params: { type: 'null' }, message: 'must be null' },
        { instancePath: '/times_s/0', keyword: 'anyOf', params: {}, message: 'must match a schema in anyOf' },
      ],
      expected: [{ path: '/times_s/0', message: 'must be a number or null' }],
    },
    {
      name: 'a length limit reads as a count',
      errors: [{ instancePath: '/points', keyword: 'maxItems', params: { limit: 10 }, message: 'must NOT have more than 10 items' }],
      expected: [{ path: '/points', message: 'must have at most 10 entries' }],
    },
  ];
  it.each(cases)('$name', ({ errors, expected }) => {
    expect(issuesFromValidation(errors, 'body')).toEqual(expected);
  });

  it('names the request part when it is not the body', () => {
    expect(issuesFromValidation([{ instancePath: '/limit', keyword: 'type', params: { type: 'integer' } }], 'querystring')).toEqual([
      { path: '/limit', message: 'querystring must be a whole number' },
    ]);
  });
});

describe('classifyError(error) maps every failure onto the error table', () => {
  const cases: Array<{ name: string; error: unknown; status: number; code: string }> = [
    { name: 'a DrydigError keeps its code and status', error: new DrydigError('DRYDIG_ERR_UNSUPPORTED_BOUNDARIES', '/boundaries/2: too many'), status: 400, code: 'DRYDIG_ERR_UNSUPPORTED_BOUNDARIES' },
    { name: 'a plain Error is an internal 500', error: new Error('secret detail'), status: 500, code: 'DRYDIG_ERR_INTERNAL' },
    { name: 'a thrown string is an internal 500', error: 'oops', status: 500, code: 'DRYDIG_ERR_INTERNAL' },
    { name: 'a plugin 429 is rate limiting', error: Object.assign(new Error('Rate limit exceeded'), { statusCode: 429 }), status: 429, code: 'DRYDIG_ERR_RATE_LIMITED' },
    { name: 'a plugin 403 on a file reads as not found', error: Object.assign(new Error('Forbidden'), { statusCode: 403 }), status: 404, code: 'DRYDIG_ERR_NO_ROUTE' },
    { name: 'a Fastify body-size error is 413', error: Object.assign(new Error('too large'), { code: 'FST_ERR_CTP_BODY_TOO_LARGE', statusCode: 413 }), status: 413, code: 'DRYDIG_ERR_BODY_TOO_LARGE' },
    { name: 'an internal DrydigError stays generic', error: new DrydigError('DRYDIG_ERR_INTERNAL', 'engine returned NaN at (1, 2)'), status: 500, code: 'DRYDIG_ERR_INTERNAL' },
  ];
  it.each(cases)('$name', ({ error, status, code }) => {
    const result = classifyError(error);
    expect(result.status).toBe(status);
    expect(result.body.error.code).toBe(code);
    expect(result.body.error.fix).toBe(ERROR_TABLE[code as keyof typeof ERROR_TABLE].fix);
    if (status === 500) {
      expect(result.internal).toBe(true);
      expect(JSON.stringify(result.body)).not.toMatch(/secret|NaN|oops/);
    }
  });

  it('buildErrorBody leaves out an empty issues list', () => {
    expect(buildErrorBody('DRYDIG_ERR_NO_ROUTE', 'x', [])).toEqual({ error: { code: 'DRYDIG_ERR_NO_ROUTE', message: 'x', fix: ERROR_TABLE.DRYDIG_ERR_NO_ROUTE.fix } });
  });
});

describe('installErrorHandling(app)', () => {
  it('answers an unexpected error with a generic 500 and logs the detail with its stack', async () => {
    const lines: string[] = [];
    const stream = new Writable({ write(chunk, _enc, done) { lines.push(String(chunk)); done(); } });
    const app = Fastify({ logger: { level: 'info', stream } });
    installErrorHandling(app);
    app.get('/boom', async () => {
      throw new Error('database password is hunter2');
    });
    const response = await app.inject({ method: 'GET', url: '/boom' });
    await app.close();
    expect(response.statusCode).toBe(500);
    expect(response.body).not.toContain('hunter2');
    expect(response.body).not.toMatch(/\bat\b.*\.ts/);
    expect(JSON.parse(response.body).error.code).toBe('DRYDIG_ERR_INTERNAL');
    const logged = lines.join('');
    expect(logged).toContain('hunter2');
    expect(logged).toContain('unexpected error on GET /boom');
  });

  it('keeps share tokens out of the log line and the 404 message', async () => {
    const lines: string[] = [];
    const stream = new Writable({ write(chunk, _enc, done) { lines.push(String(chunk)); done(); } });
    // As buildApp logs: Fastify's own request lines go through the redacting serializers.
    const app = Fastify({ logger: withRedactedLogging({ level: 'info', stream }) });
    installErrorHandling(app);
    app.get('/api/v1/links/:token/boom', async () => {
      throw new Error('broken');
    });
    await app.inject({ method: 'GET', url: '/api/v1/links/SECRETTOKEN123/boom' });
    const missing = await app.inject({ method: 'GET', url: '/api/v1/links/SECRETTOKEN456/nothing' });
    await app.close();
    expect(lines.join('')).toContain('unexpected error on GET /api/v1/links/[token]/boom');
    expect(lines.join('')).not.toContain('SECRETTOKEN123');
    expect(missing.body).not.toContain('SECRETTOKEN456');
  });

  it('answers 500 for a response that does not fit its own schema, without leaking the value', async () => {
    const app = Fastify();
    installErrorHandling(app);
    app.get('/bad', { schema: { response: { 200: { type: 'object', properties: { n: { type: 'integer' } }, required: ['n'] } } } }, async () => ({ m: 'private-value' }));
    const response = await app.inject({ method: 'GET', url: '/bad' });
    await app.close();
    expect(response.statusCode).toBe(500);
    expect(response.body).not.toContain('private-value');
  });
});
