/**
 * Health and a small evaluate while heavy work runs (issue 14 item 2), before and after the
 * compute pool: the service in its own process, once with `compute: { threads: 0 }` (the engine on
 * the event loop, as before the pool) and once with the pool (default threads). Four heavy
 * evaluates stay in flight from one client address (127.0.0.1) for a few seconds; meanwhile
 * another client (127.0.0.2, so the fair queue treats it as someone else) polls health every
 * 100 ms (open loop; a failed request counts with the time it took to fail) and asks for a small
 * evaluate 100 ms after each answer (closed loop). Prints p50 / p99 / max of both, side by side with the ratio.
 * `npx tsx bench/health-under-load.ts` prints the lines; `runHealthUnderLoadBench()` returns them.
 */
import { spawn } from 'node:child_process';
import { Agent, request } from 'node:http';
import { loadavg } from 'node:os';
import { fileURLToPath } from 'node:url';
import { heavyEvaluateBody, smallEvaluateBody } from '../tests/server/helpers/heavy-requests';

const SELF = fileURLToPath(import.meta.url);

/** Seconds the heavy requests are kept in flight per run. */
export const HEAVY_WINDOW_S = 8;
/** Heavy requests in flight at once. */
export const HEAVY_CONCURRENCY = 4;
/** The heavy case: wells on a ring, n × n grid nodes (tests/server/helpers/heavy-requests.ts). */
export const HEAVY_WELLS = 1000;
export const HEAVY_GRID_N = 150;
/** The other client asks for health every this many ms (open loop, as a monitor polls)… */
const HEALTH_EVERY_MS = 100;
/** …and for a small evaluate this many ms after the last one answered (closed loop, as a user works). */
const SMALL_PAUSE_MS = 100;

async function serve(threads: number | undefined): Promise<void> {
  const { buildApp } = await import('../server/app');
  const app = await buildApp({
    dataDir: ':memory:',
    clientDir: false,
    compute: threads === undefined ? {} : { threads },
    security: { computeMax: 1_000_000 },
  });
  await app.listen({ host: '127.0.0.1', port: 0 });
  const address = app.server.address();
  process.stdout.write(`LISTENING ${typeof address === 'object' && address ? address.port : 0} THREADS ${app.compute.threads}\n`);
}

interface Service {
  port: number;
  threads: number;
  stop: () => void;
}

function startService(threads: number | undefined): Promise<Service> {
  const args = ['--import', 'tsx', SELF, '--serve', ...(threads === undefined ? [] : ['--threads', String(threads)])];
  const child = spawn(process.execPath, args, { stdio: ['ignore', 'pipe', 'inherit'] });
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => { child.kill('SIGKILL'); reject(new Error('service did not start in 60 s')); }, 60_000);
    let out = '';
    child.stdout!.on('data', (d: Buffer) => {
      out += d.toString();
      const m = /LISTENING (\d+) THREADS (\d+)/.exec(out);
      if (m) {
        clearTimeout(timer);
        resolve({ port: Number(m[1]), threads: Number(m[2]), stop: () => child.kill('SIGTERM') });
      }
    });
    child.on('exit', (code) => { clearTimeout(timer); reject(new Error(`service exited (${code})`)); });
  });
}

/** One HTTP request from a given local address; resolves with the status once the body is read. */
function send(port: number, agent: Agent, method: string, path: string, body?: string): Promise<number> {
  return new Promise((resolve, reject) => {
    const req = request(
      { host: '127.0.0.1', port, method, path, agent, headers: body ? { 'content-type': 'application/json', 'content-length': Buffer.byteLength(body) } : {} },
      (res) => {
        res.on('data', () => undefined);
        res.on('end', () => resolve(res.statusCode ?? 0));
        res.on('error', reject);
      },
    );
    req.on('error', reject);
    req.end(body);
  });
}

function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return Number.NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]!;
}

interface Latencies {
  p50: number;
  p99: number;
  max: number;
  count: number;
  failed: number;
}

function summarise(samples: number[], failed: number): Latencies {
  const sorted = [...samples].sort((a, b) => a - b);
  return { p50: percentile(sorted, 50), p99: percentile(sorted, 99), max: sorted[sorted.length - 1] ?? Number.NaN, count: sorted.length, failed };
}

interface RunResult {
  threads: number;
  health: Latencies;
  small: Latencies;
  heavyDone: number;
  heavyFailed: number;
  heavyMean_s: number;
}

async function measure(threads: number | undefined): Promise<RunResult> {
  const service = await startService(threads);
  const heavyAgent = new Agent({ keepAlive: true, localAddress: '127.0.0.1', maxSockets: HEAVY_CONCURRENCY });
  const lightAgent = new Agent({ keepAlive: true, localAddress: '127.0.0.2' });
  try {
    const heavy = JSON.stringify(heavyEvaluateBody(HEAVY_WELLS, HEAVY_GRID_N));
    const small = JSON.stringify(smallEvaluateBody());
    // Warm up: the JIT, and (with the pool) the threads.
    await send(service.port, lightAgent, 'GET', '/api/v1/health');
    await Promise.all([0, 1].map(() => send(service.port, lightAgent, 'POST', '/api/v1/evaluate', small)));
    const end = performance.now() + HEAVY_WINDOW_S * 1000;
    let heavyDone = 0;
    let heavyFailed = 0;
    let heavyTime_ms = 0;
    const heavyLoop = async () => {
      while (performance.now() < end) {
        const t0 = performance.now();
        const status = await send(service.port, heavyAgent, 'POST', '/api/v1/evaluate', heavy).catch(() => 0);
        if (status === 200) { heavyDone++; heavyTime_ms += performance.now() - t0; } else heavyFailed++;
      }
    };
    const heavyRuns = Array.from({ length: HEAVY_CONCURRENCY }, heavyLoop);
    // Let the heavy requests reach the engine before the light client starts measuring.
    await new Promise((r) => setTimeout(r, 300));
    // Open loop, as a monitor polls: a request every interval whether or not the last one answered.
    const health: number[] = [];
    const smallTimes: number[] = [];
    let healthFailed = 0;
    let smallFailed = 0;
    const light: Array<Promise<void>> = [];
    const poll = (every_ms: number, method: string, path: string, body: string | undefined, times: number[], onFail: () => void) =>
      new Promise<void>((resolve) => {
        const tick = () => {
          if (performance.now() >= end) { resolve(); return; }
          const t0 = performance.now();
          // A failure (refused, timed out) counts with the time it took to fail.
          light.push(send(service.port, lightAgent, method, path, body).catch(() => 0).then((status) => { times.push(performance.now() - t0); if (status !== 200) onFail(); }));
          setTimeout(tick, every_ms);
        };
        tick();
      });
    // Closed loop, as a user works: the next small evaluate after the answer to the last one.
    const user = async () => {
      while (performance.now() < end) {
        const t0 = performance.now();
        const status = await send(service.port, lightAgent, 'POST', '/api/v1/evaluate', small).catch(() => 0);
        smallTimes.push(performance.now() - t0);
        if (status !== 200) smallFailed++;
        await new Promise((r) => setTimeout(r, SMALL_PAUSE_MS));
      }
    };
    await Promise.all([poll(HEALTH_EVERY_MS, 'GET', '/api/v1/health', undefined, health, () => healthFailed++), user()]);
    await Promise.all(light);
    await Promise.all(heavyRuns);
    return {
      threads: service.threads,
      health: summarise(health, healthFailed),
      small: summarise(smallTimes, smallFailed),
      heavyDone,
      heavyFailed,
      heavyMean_s: heavyDone > 0 ? heavyTime_ms / heavyDone / 1000 : Number.NaN,
    };
  } finally {
    heavyAgent.destroy();
    lightAgent.destroy();
    service.stop();
  }
}

const ms = (v: number) => (Number.isFinite(v) ? `${v < 10 ? v.toFixed(1) : v.toFixed(0)} ms` : 'n/a');
const ratio = (a: number, b: number) => (Number.isFinite(a) && Number.isFinite(b) && b > 0 ? `${(a / b).toFixed(1)}×` : 'n/a');

/** Runs both services and returns the lines: latencies before and after the pool, and their ratio. */
export async function runHealthUnderLoadBench(): Promise<string[]> {
  const load0 = loadavg();
  const before = await measure(0);
  const after = await measure(undefined);
  const load1 = loadavg();
  const row = (label: string, pick: (r: RunResult) => Latencies) => {
    const b = pick(before);
    const a = pick(after);
    return `  ${label.padEnd(22)} ${`${ms(b.p50)} / ${ms(b.p99)} / ${ms(b.max)}`.padEnd(30)} ${`${ms(a.p50)} / ${ms(a.p99)} / ${ms(a.max)}`.padEnd(30)} p99 ${ratio(b.p99, a.p99)}`;
  };
  return [
    `health and a small evaluate (another client) while ${HEAVY_CONCURRENCY} heavy evaluates run (${HEAVY_WELLS} wells × ${HEAVY_GRID_N}×${HEAVY_GRID_N} grid each, ${HEAVY_WINDOW_S} s window); load average ${load0.map((l) => l.toFixed(2)).join(' ')} at start, ${load1.map((l) => l.toFixed(2)).join(' ')} at end`,
    `  ${''.padEnd(22)} ${'before: engine on the event loop'.padEnd(30)} ${`after: pool of ${after.threads} threads + 1 quick`.padEnd(30)} before/after`,
    `  ${''.padEnd(22)} ${'p50 / p99 / max'.padEnd(30)} ${'p50 / p99 / max'.padEnd(30)}`,
    row('GET /api/v1/health', (r) => r.health),
    row('small POST evaluate', (r) => r.small),
    `  samples: health ${before.health.count} before (${before.health.failed} failed), ${after.health.count} after (${after.health.failed} failed); small evaluate ${before.small.count} before (${before.small.failed} failed), ${after.small.count} after (${after.small.failed} failed)`,
    `  heavy evaluates finished in the window: ${before.heavyDone} before (mean ${before.heavyMean_s.toFixed(1)} s, ${before.heavyFailed} failed), ${after.heavyDone} after (mean ${after.heavyMean_s.toFixed(1)} s, ${after.heavyFailed} failed)`,
  ];
}

if (process.argv[1] === SELF) {
  if (process.argv.includes('--serve')) {
    const i = process.argv.indexOf('--threads');
    await serve(i >= 0 ? Number(process.argv[i + 1]) : undefined);
  } else for (const line of await runHealthUnderLoadBench()) process.stdout.write(`${line}\n`);
}
