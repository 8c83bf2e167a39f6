/**
 * `node bin/drydig.js …` as a real process: exit codes, stdout JSON, one-line stderr, no stack
 * traces — what a shell script or a CI job sees.
 */
import { execFile, spawn } from 'node:child_process';
import { copyFileSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { evaluatePoints } from '../../shared/field';
import { loadFixture } from '../server/helpers/demo-fixtures';

const repo = fileURLToPath(new URL('../..', import.meta.url));
const bin = path.join(repo, 'bin', 'drydig.js');
let dir: string;

beforeAll(() => {
  dir = mkdtempSync(path.join(tmpdir(), 'drydig-proc-'));
  copyFileSync(path.join(repo, 'fixtures/demo-wellpoints-unconfined.json'), path.join(dir, 'site.json'));
  writeFileSync(path.join(dir, 'points.csv'), 'x,y\n20,10\n45,10\n');
  writeFileSync(path.join(dir, 'bad.json'), '{"format": ');
  writeFileSync(path.join(dir, 'invalid.json'), JSON.stringify({ ...loadFixture('unconfined'), aquifer: { ...loadFixture('unconfined').aquifer, specificYield: undefined } }));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function drydig(args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  return new Promise((resolve) => {
    execFile(process.execPath, [bin, ...args], { cwd: dir, timeout: 30_000, env: { ...process.env, DRYDIG_DEBUG: '' } }, (error, stdout, stderr) => {
      const code = error ? (typeof error.code === 'number' ? error.code : 1) : 0;
      resolve({ code, stdout, stderr });
    });
  });
}

const STACK = /\n\s+at |\.ts:\d+:\d+|node:internal/;

describe('node bin/drydig.js evaluate', () => {
  const scenario = () => loadFixture('unconfined');
  const cases: Array<{ name: string; args: string[]; points: Array<[number, number]>; times: Array<number | null | undefined> }> = [
    { name: 'inline points', args: ['--points', '20,10;45,10'], points: [[20, 10], [45, 10]], times: [undefined] },
    { name: 'CSV points', args: ['--points', 'points.csv'], points: [[20, 10], [45, 10]], times: [undefined] },
    { name: '--time 86400', args: ['--points', '20,10', '--time', '86400'], points: [[20, 10]], times: [86_400] },
    { name: '--time steady', args: ['--points', '20,10', '--time', 'steady'], points: [[20, 10]], times: [null] },
  ];
  it.each(cases)('prints JSON for $name and exits 0', async ({ args, points, times }) => {
    const { code, stdout, stderr } = await drydig(['evaluate', 'site.json', ...args]);
    expect(stderr).toBe('');
    expect(code).toBe(0);
    const answer = JSON.parse(stdout) as { points: unknown[] };
    const expected = times.flatMap((time_s) => evaluatePoints({ scenario: scenario(), points, time_s }).points);
    expect(answer.points).toEqual(JSON.parse(JSON.stringify(expected)));
  });

  const bad: Array<{ name: string; args: string[]; code: string }> = [
    { name: 'a missing file', args: ['evaluate', 'missing.json', '--points', '1,2'], code: 'DRYDIG_ERR_FILE' },
    { name: 'bad JSON', args: ['evaluate', 'bad.json', '--points', '1,2'], code: 'DRYDIG_ERR_MALFORMED_JSON' },
    { name: 'an invalid scenario', args: ['evaluate', 'invalid.json', '--points', '1,2'], code: 'DRYDIG_ERR_INVALID_SCENARIO' },
    { name: 'bad points', args: ['evaluate', 'site.json', '--points', '1;2'], code: 'DRYDIG_ERR_CLI_USAGE' },
    { name: 'a bad time', args: ['evaluate', 'site.json', '--points', '1,2', '--time', '-60'], code: 'DRYDIG_ERR_CLI_USAGE' },
    { name: 'an unknown command', args: ['frobnicate'], code: 'DRYDIG_ERR_CLI_USAGE' },
  ];
  it.each(bad)('exits 2 for $name with one stderr line and no stack trace', async ({ args, code }) => {
    const result = await drydig(args);
    expect(result.code).toBe(2);
    expect(result.stdout).toBe('');
    const lines = result.stderr.trimEnd().split('\n');
    expect(lines).toHaveLength(1);
    expect(lines[0]!.startsWith(`${code}: `)).toBe(true);
    expect(result.stderr).not.toMatch(STACK);
  });

  it('names the field for an invalid scenario, as the contract example shows', async () => {
    const { stderr } = await drydig(['evaluate', 'invalid.json', '--points', '1,2']);
    expect(stderr.trim()).toBe('DRYDIG_ERR_INVALID_SCENARIO: /aquifer/specificYield: is required for an unconfined aquifer');
  });

  it('stops quietly when the reader closes the pipe early (drydig evaluate … | head)', async () => {
    const child = spawn(process.execPath, [bin, 'evaluate', 'site.json', '--points', '20,10', '--grid', '0,0,1,1,400,400'], { cwd: dir, stdio: ['ignore', 'pipe', 'pipe'] });
    let stderr = '';
    child.stderr.on('data', (c: Buffer) => (stderr += c.toString()));
    child.stdout.once('data', () => child.stdout.destroy());
    const code = await new Promise<number | null>((resolve) => child.once('exit', resolve));
    expect(stderr).toBe('');
    expect(code).toBe(0);
  });

  it('--threads splits a large grid over worker threads and prints the same answer to the last byte', async () => {
    // 66 well points × 250 × 250 nodes: over the split threshold (server/evaluation/evaluation-in-bands.ts).
    const grid = ['--grid', '-60,-60,0.7,0.6,250,250'];
    const one = await drydig(['evaluate', 'site.json', ...grid, '--threads', '1']);
    const two = await drydig(['evaluate', 'site.json', ...grid, '--threads', '2']);
    const three = await drydig(['evaluate', 'site.json', ...grid, '--threads', '3']);
    expect(one.code, one.stderr).toBe(0);
    expect(two.code, two.stderr).toBe(0);
    expect(JSON.parse(one.stdout).grids[0].drawdown_m).toHaveLength(250 * 250);
    expect(two.stdout).toBe(one.stdout);
    expect(three.stdout).toBe(one.stdout);
    const bad = await drydig(['evaluate', 'site.json', ...grid, '--threads', '0']);
    expect(bad.code).toBe(2);
    expect(bad.stderr.trim()).toBe('DRYDIG_ERR_CLI_USAGE: --threads must be a whole number from 1 to 256 (got "0")');
  }, 120_000);

  it('runs the same from the TypeScript sources as from the build (DRYDIG_CLI=source)', async () => {
    const args = ['evaluate', 'site.json', '--points', '20,10;45,10', '--grid', '-60,-60,5,5,30,30'];
    const built = await drydig(args);
    const source = await new Promise<{ code: number; stdout: string }>((resolve) => {
      execFile(process.execPath, [bin, ...args], { cwd: dir, timeout: 60_000, env: { ...process.env, DRYDIG_CLI: 'source' } }, (error, stdout) =>
        resolve({ code: error ? 1 : 0, stdout }));
    });
    expect(source.code).toBe(0);
    expect(source.stdout).toBe(built.stdout);
  }, 120_000);

  it('--help exits 0 with the usage on stdout', async () => {
    const { code, stdout } = await drydig(['--help']);
    expect(code).toBe(0);
    expect(stdout).toContain('Usage:');
  });
});

/** Starts a server process and waits for its "serving http://…" line on stderr. */
function startServe(command: string[], env: Record<string, string> = {}): Promise<{ url: string; stop: () => Promise<number | null> }> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, command, { cwd: dir, env: { ...process.env, DRYDIG_LOG_LEVEL: 'warn', ...env }, stdio: ['ignore', 'pipe', 'pipe'] });
    let stderr = '';
    const timer = setTimeout(() => {
      child.kill('SIGKILL');
      reject(new Error(`server did not start: ${stderr}`));
    }, 30_000);
    child.stderr.on('data', (chunk: Buffer) => {
      stderr += chunk.toString();
      const match = /serving (http:\/\/127\.0\.0\.1:\d+)/.exec(stderr);
      if (match) {
        clearTimeout(timer);
        resolve({
          url: match[1]!,
          stop: () =>
            new Promise((done) => {
              child.once('exit', (code) => done(code));
              child.kill('SIGTERM');
            }),
        });
      }
    });
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`server exited with ${code}: ${stderr}`));
    });
  });
}

describe('starting the service', () => {
  it('drydig serve --port 0 listens on 127.0.0.1, answers health, and stops cleanly on SIGTERM', async () => {
    const server = await startServe([bin, 'serve', '--port', '0', '--data', path.join(dir, 'data-a')]);
    const health = (await (await fetch(`${server.url}/api/v1/health`)).json()) as { status: string };
    expect(health.status).toBe('ok');
    expect(await server.stop()).toBe(0);
  });

  it('server/main.ts takes PORT and DRYDIG_DATA from the environment', async () => {
    const tsx = path.join(repo, 'node_modules', 'tsx', 'dist', 'cli.mjs');
    const server = await startServe([tsx, path.join(repo, 'server', 'main.ts')], { PORT: '0', DRYDIG_DATA: path.join(dir, 'data-b') });
    const response = await fetch(`${server.url}/api/v1/evaluate`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ scenario: loadFixture('unconfined'), points: [[20, 10]] }),
    });
    expect(response.status).toBe(200);
    await server.stop();
  });

  it('server/main.ts takes DRYDIG_TILE_ORIGIN into the Content-Security-Policy', async () => {
    const tsx = path.join(repo, 'node_modules', 'tsx', 'dist', 'cli.mjs');
    const server = await startServe([tsx, path.join(repo, 'server', 'main.ts')], { PORT: '0', DRYDIG_DATA: ':memory:', DRYDIG_TILE_ORIGIN: 'https://tiles.example.org' });
    const csp = (await fetch(`${server.url}/api/v1/health`)).headers.get('content-security-policy') ?? '';
    expect(csp).toContain("img-src 'self' data: blob: https://tiles.example.org;");
    await server.stop();
  });

  it('drydig serve with an http tile origin exits 2 with one line naming the option', async () => {
    const result = await drydig(['serve', '--port', '0', '--tile-origin', 'http://tiles.example.org']);
    expect(result.code).toBe(2);
    expect(result.stderr.trim()).toBe('DRYDIG_ERR_CLI_USAGE: --tile-origin: "http://tiles.example.org" is not an https origin; give scheme, host and optional port only, e.g. https://tiles.example.org');
  });

  it('drydig serve with a bad port exits 2 with one line', async () => {
    const result = await drydig(['serve', '--port', 'eighty']);
    expect(result.code).toBe(2);
    expect(result.stderr.trim()).toBe('DRYDIG_ERR_CLI_USAGE: --port: "eighty" is not a port number (0–65535)');
  });
});
