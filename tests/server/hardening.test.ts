/**
 * Hardening, issue 16 items 1, 3, 4 and 6: the Host allow-list, physical ranges in the schema
 * (and saves checking designOptions), fair compute (rate limit, layout time cap), and limits on
 * slow or greedy connections.
 */
import { connect, type Socket } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../../server/app';
import { defaultHostNames, hostNameOf } from '../../server/security';
import type { Scenario } from '../../shared/schema';
import { loadFixture } from './helpers/demo-fixtures';
import { signInApp } from '../helpers/sign-in';

let app: FastifyInstance;
beforeAll(async () => {
  app = await buildApp({ dataDir: ':memory:', clientDir: false, compute: { threads: 2 } });
  // Saves are storage routes: a signed-in designer (accounts, issue 14.1).
  await signInApp(app, 'designer');
});
afterAll(() => app.close());

const post = (url: string, payload: unknown, headers: Record<string, string> = {}) => app.inject({ method: 'POST', url, payload: payload as object, headers });

describe('Host allow-list (16.1)', () => {
  it('answers 421 DRYDIG_ERR_HOST_NOT_ALLOWED to a request for another host name', async () => {
    const r = await app.inject({ method: 'GET', url: '/api/v1/scenarios', headers: { host: 'evil.example.com' } });
    expect(r.statusCode).toBe(421);
    expect(r.json().error.code).toBe('DRYDIG_ERR_HOST_NOT_ALLOWED');
  });

  it('answers localhost and the loopback addresses, with or without a port', async () => {
    for (const host of ['localhost', 'localhost:8080', '127.0.0.1:8080', '[::1]:8080', 'LOCALHOST']) {
      const r = await app.inject({ method: 'GET', url: '/api/v1/health', headers: { host } });
      expect([host, r.statusCode]).toEqual([host, 200]);
    }
  });

  it('answers configured names only', async () => {
    const named = await buildApp({ dataDir: ':memory:', clientDir: false, hostNames: ['drydig.site.example'] });
    try {
      expect((await named.inject({ method: 'GET', url: '/api/v1/health', headers: { host: 'drydig.site.example:443' } })).statusCode).toBe(200);
      expect((await named.inject({ method: 'GET', url: '/api/v1/health', headers: { host: 'localhost' } })).statusCode).toBe(421);
    } finally {
      await named.close();
    }
  });

  it('defaults to the bind address and localhost', () => {
    expect(defaultHostNames('192.0.2.7')).toEqual(expect.arrayContaining(['localhost', '127.0.0.1', '::1', '192.0.2.7']));
    expect(hostNameOf('[::1]:80')).toBe('::1');
    expect(hostNameOf('Example.org:8080')).toBe('example.org');
  });
});

describe('physical ranges (16.3)', () => {
  it.each([
    ['/scenario/aquifer/base_m', (s: Scenario) => ({ ...s, aquifer: { ...s.aquifer, base_m: -1e308 } }), /at least -20000 m and at most 20000 m/],
    ['/scenario/aquifer/conductivity_m_s', (s: Scenario) => ({ ...s, aquifer: { ...s.aquifer, conductivity_m_s: 1e-320 } }), /at least 1e-13 m\/s and at most 1 m\/s/],
    ['/scenario/groundLevel_m', (s: Scenario) => ({ ...s, groundLevel_m: 1e9 }), /20000 m/],
    ['/scenario/wells/0/x', (s: Scenario) => ({ ...s, wells: [{ ...s.wells[0]!, x: 1e300 }, ...s.wells.slice(1)] }), /100000000 m/],
    ['/scenario/design/time_s', (s: Scenario) => ({ ...s, design: { time_s: 1e300 } }), /10000000000/],
  ])('refuses %s out of range on save, naming the range', async (path, spoil, range) => {
    const r = await post('/api/v1/scenarios', { scenario: spoil(loadFixture('confined')) });
    expect(r.statusCode).toBe(400);
    const issue = r.json().error.issues.find((i: { path: string }) => i.path === path);
    expect(issue?.message).toMatch(range);
  });

  it('refuses a save whose designOptions the design route would refuse ({"mode":"nonsense"})', async () => {
    const r = await post('/api/v1/scenarios', { scenario: { ...loadFixture('confined'), designOptions: { mode: 'nonsense' } } });
    expect(r.statusCode).toBe(400);
    expect(r.json().error.issues[0].path).toBe('/scenario/designOptions/mode');
  });

  it('refuses a save whose monitoring is out of range', async () => {
    const r = await post('/api/v1/scenarios', { scenario: { ...loadFixture('confined'), monitoring: { piezometers: [{ id: 'P', x: 0, y: 1e200 }] } } });
    expect(r.statusCode).toBe(400);
    expect(r.json().error.issues[0].path).toBe('/scenario/monitoring/piezometers/0/y');
  });
});

describe('fair compute (16.4)', () => {
  it('caps the layout time limit at 60 s', async () => {
    const r = await post('/api/v1/design', { scenario: loadFixture('confined'), mode: 'layout', options: { layoutTimeLimit_s: 600 } });
    expect(r.statusCode).toBe(400);
    expect(r.json().error.issues[0].path).toBe('/options/layoutTimeLimit_s');
    expect(r.json().error.message).toMatch(/at most 60 s/);
  });

  it('rate-limits compute requests per client (429 DRYDIG_ERR_RATE_LIMITED)', async () => {
    const limited = await buildApp({ dataDir: ':memory:', clientDir: false, compute: { threads: 0 }, security: { computeMax: 3 } });
    try {
      const body = { scenario: loadFixture('confined'), points: [[0, 0]] };
      const codes: number[] = [];
      for (let k = 0; k < 5; k++) codes.push((await limited.inject({ method: 'POST', url: '/api/v1/evaluate', payload: body, remoteAddress: '10.1.1.1' })).statusCode);
      expect(codes).toEqual([200, 200, 200, 429, 429]);
      // Another client is not affected.
      expect((await limited.inject({ method: 'POST', url: '/api/v1/evaluate', payload: body, remoteAddress: '10.1.1.2' })).statusCode).toBe(200);
      const refused = await limited.inject({ method: 'POST', url: '/api/v1/design', payload: { scenario: loadFixture('confined') }, remoteAddress: '10.1.1.3' });
      expect(refused.statusCode).toBe(200);
    } finally {
      await limited.close();
    }
  });
});

describe('slow and greedy clients (16.6)', () => {
  let server: FastifyInstance;
  let port = 0;
  beforeAll(async () => {
    server = await buildApp({ dataDir: ':memory:', clientDir: false, connections: { headersTimeout_ms: 400, requestTimeout_ms: 400, maxPerAddress: 3 } });
    await server.listen({ host: '127.0.0.1', port: 0 });
    const address = server.server.address();
    port = typeof address === 'object' && address ? address.port : 0;
  });
  afterAll(() => server.close());

  const open = () => new Promise<Socket>((resolve, reject) => {
    const socket = connect(port, '127.0.0.1', () => resolve(socket));
    socket.on('error', reject);
  });
  const closed = (socket: Socket) => new Promise<string>((resolve) => {
    let data = '';
    socket.on('data', (d) => { data += d.toString(); });
    socket.on('error', () => undefined);
    socket.on('close', () => resolve(data));
  });

  it('closes a connection that never finishes its headers', async () => {
    const socket = await open();
    socket.write('GET /api/v1/health HTTP/1.1\r\nHost: 127.0.0.1\r\n');
    const answer = await closed(socket);
    expect(answer === '' || /^HTTP\/1\.1 408/.test(answer)).toBe(true);
  });

  it('holds at most the configured connections from one address; the next is closed at once', async () => {
    const held = [await open(), await open(), await open()];
    const extra = await open();
    const answer = await closed(extra);
    expect(answer).toBe('');
    for (const s of held) s.destroy();
    // Once they are gone, a new client is served.
    await new Promise((r) => setTimeout(r, 50));
    const res = await fetch(`http://127.0.0.1:${port}/api/v1/health`);
    expect(res.status).toBe(200);
  });
});
