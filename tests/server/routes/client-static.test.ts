/**
 * clientStatic: the built client at /, site.html for /site/*, nothing outside its folder, and the
 * API always ahead of the files. Traversal is tried both through inject and over a real socket
 * (a raw request line, so no client library tidies the path first).
 */
import { mkdtempSync, mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { request } from 'node:http';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../../../server/app';
import { isSafeClientPath } from '../../../server/routes/client-static';

let dir: string;
let app: FastifyInstance;
let port: number;

beforeAll(async () => {
  // The client folder sits inside a parent that holds a secret, so an escape would be visible.
  const parent = mkdtempSync(path.join(tmpdir(), 'drydig-static-'));
  writeFileSync(path.join(parent, 'secret.txt'), 'TOP-SECRET-OUTSIDE');
  dir = path.join(parent, 'dist');
  mkdirSync(path.join(dir, 'assets'), { recursive: true });
  writeFileSync(path.join(dir, 'index.html'), '<!doctype html><title>plan</title>PLAN-PAGE');
  writeFileSync(path.join(dir, 'site.html'), '<!doctype html><title>site</title>SITE-PAGE');
  writeFileSync(path.join(dir, 'assets', 'app-1234.js'), 'console.log("APP-JS")');
  writeFileSync(path.join(dir, '.env'), 'DOTFILE-CONTENT');
  app = await buildApp({ clientDir: dir, dataDir: ':memory:' });
  await app.listen({ port: 0, host: '127.0.0.1' });
  const address = app.server.address();
  port = typeof address === 'object' && address ? address.port : 0;
});
afterAll(async () => {
  await app.close();
  rmSync(path.dirname(dir), { recursive: true, force: true });
});

/** GET over a real socket with the path sent exactly as given. */
function rawGet(rawPath: string): Promise<{ status: number; body: string; type: string }> {
  return new Promise((resolve, reject) => {
    const req = request({ host: '127.0.0.1', port, path: rawPath, method: 'GET' }, (res) => {
      let body = '';
      res.setEncoding('utf8');
      res.on('data', (c: string) => (body += c));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, body, type: String(res.headers['content-type'] ?? '') }));
    });
    req.on('error', reject);
    req.end();
  });
}

describe('clientStatic serves the built client', () => {
  const cases = [
    { url: '/', says: 'PLAN-PAGE', type: /text\/html/ },
    { url: '/index.html', says: 'PLAN-PAGE', type: /text\/html/ },
    { url: '/site', says: 'SITE-PAGE', type: /text\/html/ },
    { url: '/site/abc123', says: 'SITE-PAGE', type: /text\/html/ },
    { url: '/site/abc123/wells', says: 'SITE-PAGE', type: /text\/html/ },
    { url: '/assets/app-1234.js', says: 'APP-JS', type: /javascript/ },
    // vite's relative base: the site page at /site/abc123 asks for /site/abc123/assets/….
    { url: '/site/abc123/assets/app-1234.js', says: 'APP-JS', type: /javascript/ },
  ];
  it.each(cases)('GET $url answers the right file', async ({ url, says, type }) => {
    const response = await app.inject({ method: 'GET', url });
    expect(response.statusCode).toBe(200);
    expect(response.body).toContain(says);
    expect(String(response.headers['content-type'])).toMatch(type);
  });

  it('lets fingerprinted assets be cached for good and pages revalidate', async () => {
    expect((await app.inject({ method: 'GET', url: '/assets/app-1234.js' })).headers['cache-control']).toContain('immutable');
    expect((await app.inject({ method: 'GET', url: '/' })).headers['cache-control']).toBe('no-cache');
  });

  it('keeps the API ahead of the files: health is JSON and an unknown API path is a JSON 404', async () => {
    const health = await app.inject({ method: 'GET', url: '/api/v1/health' });
    expect(JSON.parse(health.body).status).toBe('ok');
    const missing = await app.inject({ method: 'GET', url: '/api/v1/no-such-thing' });
    expect(missing.statusCode).toBe(404);
    expect(JSON.parse(missing.body).error.code).toBe('DRYDIG_ERR_NO_ROUTE');
  });

  it('answers a missing file with the JSON 404', async () => {
    const response = await app.inject({ method: 'GET', url: '/nothing-here.js' });
    expect(response.statusCode).toBe(404);
    expect(JSON.parse(response.body).error.code).toBe('DRYDIG_ERR_NO_ROUTE');
  });
});

describe('clientStatic cannot escape its folder', () => {
  const attempts = [
    '/../secret.txt',
    '/../package.json',
    '/%2e%2e/secret.txt',
    '/%2E%2E/secret.txt',
    '/%2e%2e%2fsecret.txt',
    '/assets/../../secret.txt',
    '/assets/%2e%2e/%2e%2e/secret.txt',
    '/assets/..%2f..%2fsecret.txt',
    '/site/..%2f..%2fsecret.txt',
    '/site/x/assets/..%2f..%2f..%2fsecret.txt',
    '/site/x/assets/%2e%2e/%2e%2e/secret.txt',
    '/..%5csecret.txt',
    '/%00/secret.txt',
    '/.env',
    '/%2eenv',
    '//etc/passwd',
  ];
  it.each(attempts)('refuses %s over a real socket', async (attempt) => {
    const response = await rawGet(attempt);
    expect(response.body).not.toContain('TOP-SECRET-OUTSIDE');
    expect(response.body).not.toContain('DOTFILE-CONTENT');
    expect(response.body).not.toContain('"devDependencies"');
    expect(response.body).not.toContain('root:');
    // Either refused outright or (for /site/… paths) answered with the site page itself.
    if (response.status === 200) expect(response.body).toContain('SITE-PAGE');
    else expect([400, 404]).toContain(response.status);
  });

  it.each(attempts)('refuses %s through inject', async (attempt) => {
    const response = await app.inject({ method: 'GET', url: attempt });
    expect(response.body).not.toContain('TOP-SECRET-OUTSIDE');
    expect(response.body).not.toContain('DOTFILE-CONTENT');
    if (response.statusCode === 200) expect(response.body).toContain('SITE-PAGE');
    else expect([400, 404]).toContain(response.statusCode);
  });

  const paths: Array<[string, boolean]> = [
    ['/assets/app.js', true],
    ['/index.html', true],
    ['/../x', false],
    ['/%2e%2e/x', false],
    ['/a/..%2fx', false],
    ['/.env', false],
    ['/a\\b', false],
    ['/%00', false],
    ['/%E0%A4%A', false],
  ];
  it.each(paths)('isSafeClientPath(%s) is %s', (p, safe) => {
    expect(isSafeClientPath(p)).toBe(safe);
  });
});

describe('clientStatic without a build', () => {
  it('answers / and /site/* with a page saying to run npm run build', async () => {
    const local = await buildApp({ clientDir: path.join(tmpdir(), 'drydig-no-such-dist-folder'), dataDir: ':memory:' });
    for (const url of ['/', '/site/abc']) {
      const response = await local.inject({ method: 'GET', url });
      expect(response.statusCode).toBe(200);
      expect(String(response.headers['content-type'])).toMatch(/text\/html/);
      expect(response.body).toContain('npm run build');
    }
    expect(JSON.parse((await local.inject({ method: 'GET', url: '/api/v1/health' })).body).status).toBe('ok');
    await local.close();
  });
});
