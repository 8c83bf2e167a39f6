/**
 * Security of the service: headers (helmet) with a CSP the client can run under, write rate
 * limits answered in the error format, body-size limits, and static serving that cannot leave
 * its folder.
 */
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildApp } from '../../server/app';
import { redactTokens } from '../../server/security';
import { createStored, demoScenario, memoryApp, signedInMemoryApp } from './scenarios-helpers';
import { signInApp } from '../helpers/sign-in';

describe('security headers', () => {
  it('send a CSP allowing only same-origin scripts and workers, inline styles, data:/blob: images', async () => {
    const app = await memoryApp();
    const res = await app.inject({ method: 'GET', url: '/api/v1/scenarios' });
    const csp = String(res.headers['content-security-policy']);
    const directives = Object.fromEntries(csp.split(';').map((d) => { const [k, ...v] = d.trim().split(/\s+/); return [k, v]; }));
    expect(directives['default-src']).toEqual(["'self'"]);
    expect(directives['script-src']).toEqual(["'self'"]);
    expect(directives['worker-src']).toEqual(["'self'", 'blob:']);
    expect(directives['style-src']).toEqual(["'self'", "'unsafe-inline'"]);
    expect(directives['img-src']).toEqual(["'self'", 'data:', 'blob:']);
    expect(directives['object-src']).toEqual(["'none'"]);
    expect(directives['frame-ancestors']).toEqual(["'none'"]);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['referrer-policy']).toBe('no-referrer');
    await app.close();
  });

  it('allow a configured tile origin for images and connections only', async () => {
    const app = await memoryApp({ security: { tileOrigin: 'https://tiles.example.org' } });
    const csp = String((await app.inject({ method: 'GET', url: '/api/v1/scenarios' })).headers['content-security-policy']);
    expect(csp).toContain("img-src 'self' data: blob: https://tiles.example.org");
    expect(csp).toContain("connect-src 'self' https://tiles.example.org");
    expect(csp).toContain("script-src 'self';");
    await app.close();
  });

  it('take the tile origin from buildApp({ tileOrigin }) as well', async () => {
    const app = await memoryApp({ tileOrigin: 'https://Tiles.Example.org:8443/' });
    const csp = String((await app.inject({ method: 'GET', url: '/api/v1/scenarios' })).headers['content-security-policy']);
    expect(csp).toContain("img-src 'self' data: blob: https://tiles.example.org:8443;");
    expect(csp).toContain("connect-src 'self' https://tiles.example.org:8443;");
    await app.close();
  });

  it.each([
    ['http://tiles.example.org'],
    ['https://tiles.example.org/{z}/{x}/{y}.png'],
    ["https://tiles.example.org; script-src *"],
    ['tiles.example.org'],
  ])('refuse tileOrigin %j, naming the option', async (tileOrigin) => {
    await expect(memoryApp({ tileOrigin })).rejects.toThrow(/^tileOrigin: ".*" is not an https origin/);
  });
});

describe('write rate limit', () => {
  it('answers 429 DRYDIG_ERR_RATE_LIMITED past the limit, on writes only', async () => {
    const app = await buildApp({ dataDir: ':memory:', clientDir: false, security: { writeMax: 5, writeWindow_ms: 60_000 } });
    await signInApp(app);
    const statuses: number[] = [];
    for (let i = 0; i < 7; i++) statuses.push((await app.inject({ method: 'POST', url: '/api/v1/scenarios', payload: { scenario: demoScenario('confined') } })).statusCode);
    expect(statuses).toEqual([201, 201, 201, 201, 201, 429, 429]);
    const limited = await app.inject({ method: 'POST', url: '/api/v1/scenarios', payload: { scenario: demoScenario('confined') } });
    expect(limited.json().error.code).toBe('DRYDIG_ERR_RATE_LIMITED');
    expect(limited.json().error.message).toContain('at most 5');
    for (let i = 0; i < 10; i++) expect((await app.inject({ method: 'GET', url: '/api/v1/scenarios' })).statusCode).toBe(200);
    const list = (await app.inject({ method: 'GET', url: '/api/v1/scenarios' })).json().scenarios;
    expect(list).toHaveLength(5);
    await app.close();
  });
});

describe('body size limit', () => {
  it('refuses an oversize save with 413 before storing anything', async () => {
    const app = await signedInMemoryApp({ bodyLimit_bytes: 20_000 });
    const big = demoScenario('confined');
    big.name = 'x'.repeat(150);
    (big as unknown as Record<string, unknown>).padding = 'y'.repeat(30_000);
    const res = await app.inject({ method: 'POST', url: '/api/v1/scenarios', payload: { scenario: big } });
    expect(res.statusCode).toBe(413);
    expect(res.json().error.code).toBe('DRYDIG_ERR_BODY_TOO_LARGE');
    expect((await app.inject({ method: 'GET', url: '/api/v1/scenarios' })).json().scenarios).toEqual([]);
    await app.close();
  });
});

describe('small-body routes', () => {
  it('refuse a reading or link request over 16 KiB with 413, whatever the service limit', async () => {
    const app = await signedInMemoryApp();
    const id = await createStored(app, demoScenario('confined'));
    const link = await app.inject({ method: 'POST', url: `/api/v1/scenarios/${id}/links`, payload: { mode: 'view', label: 'x'.repeat(17 * 1024) } });
    expect(link.statusCode).toBe(413);
    expect(link.json().error.code).toBe('DRYDIG_ERR_BODY_TOO_LARGE');
    const reading = await app.inject({ method: 'POST', url: `/api/v1/scenarios/${id}/readings`, payload: { piezometerId: 'P', level_m: 1, note: 'n'.repeat(17 * 1024) } });
    expect(reading.statusCode).toBe(413);
    expect((await app.inject({ method: 'GET', url: `/api/v1/scenarios/${id}/links` })).json().links).toEqual([]);
    await app.close();
  });
});

describe('static serving', () => {
  let root: string;
  let clientDir: string;
  beforeAll(() => {
    root = mkdtempSync(join(tmpdir(), 'drydig-static-'));
    clientDir = join(root, 'dist');
    mkdirSync(join(clientDir, 'assets'), { recursive: true });
    writeFileSync(join(clientDir, 'index.html'), '<!doctype html><title>editor</title>');
    writeFileSync(join(clientDir, 'site.html'), '<!doctype html><title>site view page</title>');
    writeFileSync(join(clientDir, 'assets', 'a.js'), 'console.log(1)');
    writeFileSync(join(root, 'secret.txt'), 'TOP-SECRET-OUTSIDE');
    writeFileSync(join(clientDir, '.env'), 'TOP-SECRET-DOTFILE');
  });
  afterAll(() => rmSync(root, { recursive: true, force: true }));

  it('serves site.html for /site/<token> paths', async () => {
    const app = await memoryApp({ clientDir });
    const res = await app.inject({ method: 'GET', url: `/site/${'A'.repeat(43)}` });
    expect(res.statusCode).toBe(200);
    expect(res.body).toContain('site view page');
    await app.close();
  });

  it.each([
    '/../secret.txt', '/%2e%2e/secret.txt', '/assets/../../secret.txt', '/assets/%2e%2e%2f%2e%2e%2fsecret.txt',
    '/..%5csecret.txt', '/.env', '/assets/..%2f.env', '/%00/secret.txt', '/site/..%2f..%2fsecret.txt',
  ])('never serves a file outside the client folder or a dotfile for %s', async (url) => {
    const app = await memoryApp({ clientDir });
    const res = await app.inject({ method: 'GET', url });
    expect(res.statusCode).toBeLessThan(500);
    expect(res.body).not.toContain('TOP-SECRET');
    await app.close();
  });
});

describe('redactTokens(url)', () => {
  it.each([
    ['/api/v1/links/abcDEF_-123/readings?x=1', '/api/v1/links/[token]/readings?x=1'],
    ['/site/abcDEF_-123', '/site/[token]'],
    ['/api/v1/scenarios/abc', '/api/v1/scenarios/abc'],
  ])('rewrites %s as %s', (input, expected) => {
    expect(redactTokens(input)).toBe(expected);
  });
});

describe('stored data', () => {
  it('is untouched by a request carrying prototype-pollution keys', async () => {
    const app = await signedInMemoryApp();
    const id = await createStored(app, demoScenario('confined'));
    const res = await app.inject({
      method: 'PUT', url: `/api/v1/scenarios/${id}`,
      headers: { 'content-type': 'application/json' },
      payload: `{"__proto__":{"polluted":true},"scenario":${JSON.stringify(demoScenario('confined'))},"baseRevision":1}`,
    });
    expect(res.statusCode).toBeGreaterThanOrEqual(400);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    await app.close();
  });
});
