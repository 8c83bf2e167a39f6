/** Starting and stopping service processes for the reliability tests (loopback only, bounded). */
import { spawn, type ChildProcess } from 'node:child_process';
import { fileURLToPath } from 'node:url';

const SERVER_SCRIPT = fileURLToPath(new URL('./reliability-server.ts', import.meta.url));

export interface ServerProcess {
  child: ChildProcess;
  origin: string;
  stderr: () => string;
}

/** Spawns the service on `dataDir`; resolves when it listens (or rejects after `timeout_ms`). */
export function startServer(dataDir: string, timeout_ms = 20_000): Promise<ServerProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', SERVER_SCRIPT, dataDir], { stdio: ['ignore', 'pipe', 'pipe'] });
  let err = '';
  child.stderr!.on('data', (d: Buffer) => { err += d.toString(); });
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => { child.kill('SIGKILL'); reject(new Error(`server did not start in ${timeout_ms} ms: ${err}`)); }, timeout_ms);
    let out = '';
    child.stdout!.on('data', (d: Buffer) => {
      out += d.toString();
      const m = /LISTENING (\d+)/.exec(out);
      if (m) {
        clearTimeout(timer);
        resolve({ child, origin: `http://127.0.0.1:${m[1]}`, stderr: () => err });
      }
    });
    child.on('exit', (code) => { clearTimeout(timer); reject(new Error(`server exited (${code}) before listening: ${err}`)); });
  });
}

/** Stops a server: SIGKILL for the crash test, SIGTERM otherwise; resolves when it has exited. */
export function stopServer(server: ServerProcess, signal: NodeJS.Signals = 'SIGTERM'): Promise<void> {
  return new Promise((resolve) => {
    if (server.child.exitCode !== null || server.child.signalCode !== null) return resolve();
    server.child.once('exit', () => resolve());
    server.child.kill(signal);
  });
}

/** The account reliability-server.ts makes; the harness signs in once per server origin. */
export const RELIABILITY_USER = { username: 'reliability', password: 'reliability-test-password' };
const sessions = new Map<string, Promise<Record<string, string>>>();

/** Session cookie and CSRF token for a server, from a real sign-in (once per origin). */
function sessionHeadersFor(origin: string): Promise<Record<string, string>> {
  let found = sessions.get(origin);
  if (!found) {
    found = (async () => {
      const res = await fetch(`${origin}/api/v1/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(RELIABILITY_USER) });
      if (res.status !== 200) throw new Error(`sign-in to ${origin} answered ${res.status}`);
      const cookie = (res.headers.get('set-cookie') ?? '').split(';')[0]!;
      const { csrfToken } = (await res.json()) as { csrfToken: string };
      return { cookie, 'x-drydig-csrf': csrfToken };
    })();
    sessions.set(origin, found);
  }
  return found;
}

/** JSON request with a timeout, signed in; never throws for HTTP errors, only for network failure. */
// The answers are read loosely, field by field, as a client would.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function request(origin: string, method: string, path: string, body?: unknown, timeout_ms = 10_000): Promise<{ status: number; json: any }> {
  const res = await fetch(`${origin}${path}`, {
    method,
    headers: { ...(await sessionHeadersFor(origin)), ...(body === undefined ? {} : { 'content-type': 'application/json' }) },
    body: body === undefined ? undefined : JSON.stringify(body),
    signal: AbortSignal.timeout(timeout_ms),
  });
  const text = await res.text();
  let json: unknown = null;
  try { json = JSON.parse(text); } catch { json = text; }
  return { status: res.status, json };
}
