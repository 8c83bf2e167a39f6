/**
 * Robustness: more than 1000 malformed or hostile requests — fuzzed JSON, wrong types, huge
 * numbers, NaN/Infinity strings, deep nesting, oversize bodies, path traversal, unknown and forged
 * tokens, wrong methods and media types — against a separate service process on loopback. Every
 * answer must be a 4xx with a clear message; the service must stay up; stored data must not change.
 * The random generator is seeded, so a failure can be replayed.
 */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { connect } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Scenario } from '../../shared/schema';
import { request, startServer, stopServer, type ServerProcess } from './reliability-harness';
import { seededRandom as seeded } from '../helpers/seeded-random';

const dir = mkdtempSync(join(tmpdir(), 'drydig-fuzz-'));
let server: ServerProcess;
const base = JSON.parse(readFileSync('fixtures/demo-deepwells-confined.json', 'utf8')) as Scenario;
const withMonitoring = { ...base, monitoring: { piezometers: [{ id: 'PZ1', x: 389200, y: 5819400 }], pumpingStart: '2027-03-01T07:00:00Z' } };

let scenarioId = '';
let viewToken = '';
let editToken = '';

beforeAll(async () => {
  server = await startServer(dir);
  const created = await request(server.origin, 'POST', '/api/v1/scenarios', { scenario: withMonitoring, savedBy: 'fuzz set-up' });
  scenarioId = created.json.scenarioId;
  viewToken = (await request(server.origin, 'POST', `/api/v1/scenarios/${scenarioId}/links`, { mode: 'view' })).json.token;
  const edit = (await request(server.origin, 'POST', `/api/v1/scenarios/${scenarioId}/links`, { mode: 'edit', revision: 1 })).json;
  editToken = edit.token;
  await request(server.origin, 'POST', `/api/v1/links/${editToken}/readings`, { piezometerId: 'PZ1', level_m: 5, time_s: 3600 });
});
afterAll(async () => {
  if (server) await stopServer(server, 'SIGKILL');
  rmSync(dir, { recursive: true, force: true });
});

const rand = seeded(20270301);
const pick = <T>(items: readonly T[]): T => items[Math.floor(rand() * items.length)]!;

interface Hostile { method: string; path: string; body?: string; contentType?: string; label: string }

const HOSTILE_VALUES: unknown[] = [
  'NaN', 'Infinity', '-Infinity', '1e999', null, true, [], {}, '', ' ', '\u0000', '𝕏'.repeat(50), -1, 0, 1e308, -1e308, 5e-324,
  '<script>alert(1)</script>', "' OR 1=1 --", '../../etc/passwd', { $ne: null }, [1, 2, 3], 'x'.repeat(5000),
];
const RAW_NUMBERS = ['1e999', '-1e999', 'NaN', 'Infinity', '0x10', '01', '1.', '.5', '+1', '1e-400'];

/** Sets a random leaf (or a random field) of a JSON value to a hostile value. */
function spoil(value: unknown, depth = 0): unknown {
  if (Array.isArray(value) && value.length > 0 && depth < 6) {
    const copy = [...value];
    const i = Math.floor(rand() * copy.length);
    copy[i] = rand() < 0.3 ? pick(HOSTILE_VALUES) : spoil(copy[i], depth + 1);
    return copy;
  }
  if (value && typeof value === 'object' && depth < 6) {
    const copy = { ...(value as Record<string, unknown>) };
    const keys = Object.keys(copy);
    const key = pick(keys);
    if (rand() < 0.1) delete copy[key];
    else copy[key] = rand() < 0.35 ? pick(HOSTILE_VALUES) : spoil(copy[key], depth + 1);
    return copy;
  }
  return pick(HOSTILE_VALUES);
}

/** Text-level damage to a JSON document: truncation, stray characters, raw non-JSON numbers. */
function mangle(text: string): string {
  const r = rand();
  if (r < 0.25) return text.slice(0, Math.floor(rand() * text.length));
  if (r < 0.5) {
    const i = Math.floor(rand() * text.length);
    return text.slice(0, i) + pick(['{', '}', '[', ']', '"', ',', ':', '\\', '\u0000', 'undefined']) + text.slice(i + 1);
  }
  if (r < 0.75) return text.replace(/-?\d+(\.\d+)?/, pick(RAW_NUMBERS));
  return text.replace(/"(\w+)":/, '"$1":,');
}

function deepNesting(levels: number, open = '[', close = ']'): string {
  return `{"scenario":${open.repeat(levels)}${close.repeat(levels)},"baseRevision":1}`;
}

function buildRequests(): Hostile[] {
  const out: Hostile[] = [];
  const saveBody = () => ({ scenario: structuredClone(withMonitoring), baseRevision: 1, savedBy: 'fuzz' });
  const forgedToken = () => Array.from({ length: 43 }, () => pick([...'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789-_'])).join('');
  // Structural fuzz of scenario bodies (wrong types, missing fields, hostile values).
  for (let i = 0; i < 400; i++) {
    const target = pick(['POST /api/v1/scenarios', `PUT /api/v1/scenarios/${scenarioId}`, `PUT /api/v1/links/${editToken}/scenario`, `POST /api/v1/scenarios/${scenarioId}/restore`]);
    const [method, path] = target.split(' ') as [string, string];
    let body: unknown = saveBody();
    for (let k = 0, n = 1 + Math.floor(rand() * 3); k < n; k++) body = spoil(body);
    // A body that still validates would be a real save and change stored data; make it stale instead.
    if (body && typeof body === 'object' && 'baseRevision' in (body as object) && (body as { baseRevision: unknown }).baseRevision === 1) (body as { baseRevision: unknown }).baseRevision = 999;
    if (method === 'POST' && path === '/api/v1/scenarios') (body as Record<string, unknown>).scenario = spoil((body as Record<string, unknown>).scenario);
    out.push({ method, path, body: JSON.stringify(body), label: 'spoiled body' });
  }
  // Text-level JSON damage.
  for (let i = 0; i < 200; i++) {
    const path = pick(['/api/v1/scenarios', `/api/v1/scenarios/${scenarioId}/links`, `/api/v1/links/${editToken}/readings`, '/api/v1/evaluate']);
    out.push({ method: 'POST', path, body: mangle(JSON.stringify(saveBody())), label: 'mangled JSON' });
  }
  // Readings with hostile fields, on the view link (must be 403) and the edit link (must be 400).
  const BAD_LEVELS: unknown[] = ['NaN', 'Infinity', '5.2 m', null, true, [], {}, '', 1e308, -1e308, 1e6, -99999];
  for (let i = 0; i < 120; i++) {
    // On the view link any reading must be refused (403); on the edit link only broken ones are sent.
    const body = i % 2
      ? spoil({ piezometerId: 'PZ1', level_m: 5.5, measuredAt: '2027-03-02T07:00:00Z' })
      : { piezometerId: pick(['PZ1', 'PZ9', '', 'x'.repeat(100)]), level_m: pick(BAD_LEVELS), measuredAt: pick(['2027-03-02T07:00:00Z', 'tomorrow', '2027-02-01T00:00:00Z']) };
    out.push({ method: 'POST', path: `/api/v1/links/${i % 2 ? viewToken : editToken}/readings`, body: JSON.stringify(body), label: 'reading' });
  }
  // Unknown, forged and malformed tokens and ids; traversal in every parameter position.
  const traversal = ['..%2F..%2Fetc%2Fpasswd', '..', '%2e%2e', '....//', '%00', '%252e%252e%252f', 'A'.repeat(5000), "'%20OR%201%3D1--", '%F0%9F%92%A9', '%ZZ'];
  for (let i = 0; i < 150; i++) {
    const bad = rand() < 0.5 ? forgedToken() : pick(traversal);
    const path = pick([
      `/api/v1/links/${bad}`, `/api/v1/links/${bad}/export/setout-csv`, `/api/v1/links/${bad}/monitoring`, `/api/v1/scenarios/${bad}`,
      `/api/v1/scenarios/${bad}/revisions/1`, `/api/v1/scenarios/${scenarioId}/revisions/${bad}`, `/api/v1/scenarios/${scenarioId}/export/${bad}`,
      `/site/${bad}/../../package.json`, `/${bad}/../server/app.ts`, `/api/v1/scenarios/${scenarioId}/links/${bad}`,
    ]);
    const method = path.includes('/links/') && path.startsWith(`/api/v1/scenarios/${scenarioId}/links/`) ? 'DELETE' : 'GET';
    out.push({ method, path, label: 'token/path' });
  }
  // Deep nesting and oversize bodies.
  for (const levels of [100, 1000, 10_000, 100_000]) out.push({ method: 'PUT', path: `/api/v1/scenarios/${scenarioId}`, body: deepNesting(levels), label: `nesting ${levels}` });
  for (const levels of [1000, 50_000]) out.push({ method: 'POST', path: '/api/v1/scenarios', body: deepNesting(levels, '{"a":', '}'), label: `object nesting ${levels}` });
  for (const mb of [9, 12]) out.push({ method: 'POST', path: '/api/v1/scenarios', body: `{"scenario":"${'x'.repeat(mb * 1024 * 1024)}"}`, label: `oversize ${mb} MiB` });
  // Wrong methods, media types, empty bodies, query junk.
  for (let i = 0; i < 120; i++) {
    const r = rand();
    if (r < 0.25) out.push({ method: pick(['PATCH', 'DELETE', 'PUT']), path: pick(['/api/v1/scenarios', `/api/v1/links/${viewToken}`, `/api/v1/scenarios/${scenarioId}/revisions`]), body: '{}', label: 'wrong method' });
    else if (r < 0.5) out.push({ method: 'POST', path: '/api/v1/scenarios', body: 'scenario=1&x=2', contentType: pick(['application/x-www-form-urlencoded', 'text/plain', 'application/xml', 'multipart/form-data; boundary=x']), label: 'media type' });
    else if (r < 0.75) out.push({ method: 'POST', path: pick(['/api/v1/scenarios', `/api/v1/scenarios/${scenarioId}/links`]), body: '', label: 'empty body' });
    else out.push({ method: 'GET', path: `/api/v1/scenarios/${scenarioId}/export/setout-csv?revision=${pick(['0', '-1', '1e3', 'NaN', 'abc', '99999999999'])}`, label: 'bad query' });
  }
  // Prototype pollution and duplicate keys.
  for (let i = 0; i < 20; i++) {
    out.push({ method: 'POST', path: '/api/v1/scenarios', body: `{"__proto__":{"admin":true},"scenario":${JSON.stringify(base)}}`, label: '__proto__' });
    out.push({ method: 'POST', path: `/api/v1/scenarios/${scenarioId}/links`, body: '{"mode":"view","constructor":{"prototype":{"x":1}}}', label: 'constructor.prototype' });
  }
  return out;
}

async function snapshot(): Promise<string> {
  const list = await request(server.origin, 'GET', '/api/v1/scenarios');
  const history = await request(server.origin, 'GET', `/api/v1/scenarios/${scenarioId}/revisions`);
  const latest = await request(server.origin, 'GET', `/api/v1/scenarios/${scenarioId}`);
  const links = await request(server.origin, 'GET', `/api/v1/scenarios/${scenarioId}/links`);
  const readings = await request(server.origin, 'GET', `/api/v1/scenarios/${scenarioId}/readings`);
  return JSON.stringify([list.json, history.json, latest.json, links.json, readings.json]);
}

/** Raw bytes that are not valid HTTP at all. */
function rawExchange(port: number, payload: string): Promise<string> {
  return new Promise((resolve) => {
    const socket = connect(port, '127.0.0.1');
    let data = '';
    socket.setTimeout(3000, () => socket.destroy());
    socket.on('data', (d) => { data += d.toString(); });
    socket.on('close', () => resolve(data));
    socket.on('error', () => resolve(data));
    socket.write(payload);
    setTimeout(() => socket.end(), 200);
  });
}

describe('more than 1000 hostile requests', () => {
  it('each get a 4xx with a clear message; the service stays up; stored data is unchanged', async () => {
    const before = await snapshot();
    const requests = buildRequests();
    expect(requests.length).toBeGreaterThanOrEqual(1000);
    const failures: string[] = [];
    const byStatus = new Map<number, number>();
    const queue = [...requests];
    const worker = async () => {
      for (let item = queue.shift(); item; item = queue.shift()) {
        let status = 0;
        let text = '';
        try {
          const res = await fetch(`${server.origin}${item.path}`, {
            method: item.method,
            headers: item.body === undefined ? {} : { 'content-type': item.contentType ?? 'application/json' },
            body: item.body,
            signal: AbortSignal.timeout(15_000),
          });
          status = res.status;
          text = await res.text();
        } catch (e) {
          // An oversize body may be cut off by the server mid-upload; that is a refusal, not a crash.
          if (item.label.startsWith('oversize')) { byStatus.set(413, (byStatus.get(413) ?? 0) + 1); continue; }
          failures.push(`${item.label} ${item.method} ${item.path.slice(0, 80)}: network error ${(e as Error).message}`);
          continue;
        }
        byStatus.set(status, (byStatus.get(status) ?? 0) + 1);
        let message = '';
        try { message = JSON.parse(text).error?.message ?? ''; } catch { message = ''; }
        if (status < 400 || status >= 500) failures.push(`${item.label} ${item.method} ${item.path.slice(0, 80)} → ${status} ${text.slice(0, 120)}`);
        else if (message.length < 8) failures.push(`${item.label} ${item.method} ${item.path.slice(0, 80)} → ${status} without a clear message: ${text.slice(0, 120)}`);
        if (/\n\s+at |node_modules|\.ts:\d+/.test(text)) failures.push(`${item.label}: stack trace leaked: ${text.slice(0, 200)}`);
      }
    };
    await Promise.all(Array.from({ length: 8 }, worker));
    const port = Number(new URL(server.origin).port);
    for (const raw of ['GARBAGE\r\n\r\n', 'GET / HTTP/9.9\r\n\r\n', 'POST /api/v1/scenarios HTTP/1.1\r\nContent-Length: -5\r\n\r\n', `GET /${'a'.repeat(70_000)} HTTP/1.1\r\nHost: x\r\n\r\n`]) {
      const answer = await rawExchange(port, raw);
      if (answer && !/^HTTP\/1\.1 4\d\d/.test(answer)) failures.push(`raw ${raw.slice(0, 30)} → ${answer.slice(0, 60)}`);
    }
    expect(failures.slice(0, 20)).toEqual([]);
    const health = await request(server.origin, 'GET', '/api/v1/health');
    expect(health.status).toBe(200);
    expect(server.child.exitCode).toBeNull();
    expect(await snapshot()).toBe(before);
    console.info(`hostile requests: ${requests.length + 4} sent; statuses ${JSON.stringify(Object.fromEntries([...byStatus].sort()))}; service up; data unchanged`);
  });
});
