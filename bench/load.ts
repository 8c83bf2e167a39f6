/**
 * Load bench of the service on loopback (autocannon): the evaluate endpoint and the share-link
 * endpoints the site team hits (view, set-out CSV). The service runs in its own process (this file
 * with `--serve`), so the load generator does not share its event loop. Bounded: a few seconds per
 * endpoint, 10 connections. `npx tsx bench/load.ts` prints the lines; `runLoadBench()` returns them.
 */
import { spawn } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';
import type { Scenario } from '../shared/schema';

interface AutocannonResult {
  requests: { average: number; total: number };
  latency: { p50: number; p99: number; average: number };
  non2xx: number;
  errors: number;
  timeouts: number;
}
type Autocannon = (options: {
  url: string;
  method?: string;
  headers?: Record<string, string>;
  body?: string;
  connections?: number;
  duration?: number;
  pipelining?: number;
}) => Promise<AutocannonResult>;

const SELF = fileURLToPath(import.meta.url);
const FIXTURES = fileURLToPath(new URL('../fixtures/', import.meta.url));

const BENCH_USER = 'load-bench';
const BENCH_PASSWORD = 'load-bench-password (in-memory service only)';

/** Seconds of load per endpoint. */
export const LOAD_DURATION_S = 5;
/** Concurrent connections. */
export const LOAD_CONNECTIONS = 10;

async function serve(): Promise<void> {
  const { buildApp } = await import('../server/app');
  const { hashPassword } = await import('../server/auth');
  // One client with 10 connections: its rate limits and per-client queue are opened, so the bench
  // measures what the service serves, not how fast it refuses.
  const app = await buildApp({ dataDir: ':memory:', clientDir: false, security: { writeMax: 1_000_000, computeMax: 1_000_000 }, compute: { maxQueuedPerClient: 64, maxQueued: 64 } });
  // The storage routes need an account: the bench signs in as this one to store its scenario.
  app.scenarioStore.accounts.addUser({ username: BENCH_USER, role: 'designer', passwordHash: await hashPassword(BENCH_PASSWORD) });
  await app.listen({ host: '127.0.0.1', port: 0 });
  const address = app.server.address();
  process.stdout.write(`LISTENING ${typeof address === 'object' && address ? address.port : 0}\n`);
}

function startService(): Promise<{ origin: string; stop: () => void }> {
  const child = spawn(process.execPath, ['--import', 'tsx', SELF, '--serve'], { stdio: ['ignore', 'pipe', 'inherit'] });
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => { child.kill('SIGKILL'); reject(new Error('service did not start in 30 s')); }, 30_000);
    let out = '';
    child.stdout!.on('data', (d: Buffer) => {
      out += d.toString();
      const m = /LISTENING (\d+)/.exec(out);
      if (m) {
        clearTimeout(timer);
        resolve({ origin: `http://127.0.0.1:${m[1]}`, stop: () => child.kill('SIGTERM') });
      }
    });
    child.on('exit', (code) => { clearTimeout(timer); reject(new Error(`service exited (${code})`)); });
  });
}

async function post(url: string, body: unknown, headers: Record<string, string> = {}): Promise<Record<string, unknown>> {
  const res = await fetch(url, { method: 'POST', headers: { 'content-type': 'application/json', ...headers }, body: JSON.stringify(body) });
  if (!res.ok) throw new Error(`${url}: ${res.status} ${await res.text()}`);
  return (await res.json()) as Record<string, unknown>;
}

/** Runs the load bench and returns one line per endpoint (requests/s, p50 and p99 latency). */
export async function runLoadBench(): Promise<string[]> {
  const autocannon = createRequire(import.meta.url)('autocannon') as Autocannon;
  const scenario = JSON.parse(readFileSync(`${FIXTURES}demo-wellpoints-unconfined.json`, 'utf8')) as Scenario;
  const service = await startService();
  try {
    const login = await fetch(`${service.origin}/api/v1/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ username: BENCH_USER, password: BENCH_PASSWORD }) });
    if (!login.ok) throw new Error(`sign-in: ${login.status} ${await login.text()}`);
    const session = { cookie: login.headers.getSetCookie().map((c) => c.split(';')[0]).join('; '), 'x-drydig-csrf': String(((await login.json()) as { csrfToken: string }).csrfToken) };
    const saved = await post(`${service.origin}/api/v1/scenarios`, { scenario, savedBy: 'load bench' }, session);
    const link = await post(`${service.origin}/api/v1/scenarios/${String(saved.scenarioId)}/links`, { mode: 'view' }, session);
    const token = String(link.token);
    const points: Array<[number, number]> = [];
    for (let i = 0; i < 10; i++) for (let j = 0; j < 10; j++) points.push([-10 + 6 * i, -10 + 4 * j]);
    const cases: Array<{ name: string; options: Parameters<Autocannon>[0] }> = [
      {
        name: `POST /api/v1/evaluate (66 well points, 100 points, design time)`,
        options: { url: `${service.origin}/api/v1/evaluate`, method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ scenario, points }) },
      },
      { name: 'GET /api/v1/links/:token (site view data)', options: { url: `${service.origin}/api/v1/links/${token}` } },
      { name: 'GET /api/v1/links/:token/export/setout-csv', options: { url: `${service.origin}/api/v1/links/${token}/export/setout-csv` } },
      { name: 'GET /api/v1/links/:token/monitoring', options: { url: `${service.origin}/api/v1/links/${token}/monitoring` } },
    ];
    const lines: string[] = [];
    for (const c of cases) {
      // Warm the caches and the JIT before measuring.
      await fetch(c.options.url, { method: c.options.method ?? 'GET', headers: c.options.headers, body: c.options.body });
      const r = await autocannon({ ...c.options, connections: LOAD_CONNECTIONS, duration: LOAD_DURATION_S });
      lines.push(
        `${c.name}: ${r.requests.average.toFixed(0)} req/s, latency p50 ${r.latency.p50} ms, p99 ${r.latency.p99} ms ` +
          `(${r.requests.total} requests, ${LOAD_CONNECTIONS} connections, ${LOAD_DURATION_S} s, non-2xx ${r.non2xx}, errors ${r.errors})`,
      );
    }
    return lines;
  } finally {
    service.stop();
  }
}

if (process.argv[1] === SELF) {
  if (process.argv.includes('--serve')) await serve();
  else for (const line of await runLoadBench()) process.stdout.write(`${line}\n`);
}
