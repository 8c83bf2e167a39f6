/**
 * `drydig design --monte-carlo N [--seed S] [--k-spread F] [--workers W]` (design.md §8),
 * `--sensitivity`, `--one-well-out`, `--k-factor F` as a process: the realisations split over
 * worker threads give the same answer as in process and for the same seed; bad flags exit 2 with
 * one line naming the flag.
 */
import { execFile } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { thiemRingScenario } from '../shared/design/uncertainty-fixtures';

const repo = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const bin = path.join(repo, 'bin', 'drydig.js');
let dir: string;

beforeAll(() => {
  dir = mkdtempSync(path.join(tmpdir(), 'drydig-mc-'));
  writeFileSync(path.join(dir, 'ring.json'), JSON.stringify(thiemRingScenario()));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function drydig(args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  return new Promise((resolve) => {
    execFile(process.execPath, [bin, ...args], { cwd: dir, timeout: 240_000, maxBuffer: 64 << 20, env: { ...process.env, DRYDIG_DEBUG: '' } }, (error, stdout, stderr) => {
      resolve({ code: error ? (typeof error.code === 'number' ? error.code : 1) : 0, stdout, stderr });
    });
  });
}

describe('drydig design with the uncertainty flags', () => {
  it('prints the uncertainty block of design.md §8, the same on 2 workers, in process, and for the same seed again', async () => {
    const args = ['design', 'ring.json', '--monte-carlo', '30', '--seed', '4', '--k-spread', '1.5'];
    const two = await drydig([...args, '--workers', '2']);
    expect(two.stderr).toBe('');
    expect(two.code).toBe(0);
    const a = JSON.parse(two.stdout) as { uncertainty: Record<string, unknown> & { totalRate_m3_s: { p50: number; p90: number } } };
    expect(a.uncertainty).toMatchObject({ runs: 30, seed: 4, workers: 2 });
    expect(typeof a.uncertainty.probabilityMet).toBe('number');
    expect(a.uncertainty.totalRate_m3_s.p90).toBeGreaterThan(a.uncertainty.totalRate_m3_s.p50);
    const inProcess = JSON.parse((await drydig([...args, '--workers', '0'])).stdout) as typeof a;
    expect(inProcess.uncertainty.totalRate_m3_s).toEqual(a.uncertainty.totalRate_m3_s);
    expect(inProcess.uncertainty.probabilityMet).toBe(a.uncertainty.probabilityMet);
    const again = JSON.parse((await drydig([...args, '--workers', '2'])).stdout) as typeof a;
    expect(again.uncertainty.histogram).toEqual(a.uncertainty.histogram);
  }, 240_000);

  it('adds the sensitivity table and the robust designs', async () => {
    const r = await drydig(['design', 'ring.json', '--sensitivity-factors', '0.5,1,2', '--one-well-out', '--k-factor', '2']);
    expect(r.code).toBe(0);
    const json = JSON.parse(r.stdout) as { sensitivity: { rows: unknown[] }; robust: Array<{ kind: string; extraRate_m3_s: number }> };
    expect(json.sensitivity.rows).toHaveLength(3);
    expect(json.robust.map((d) => d.kind)).toEqual(['one-well-out', 'conductivity-range']);
    expect(json.robust.every((d) => d.extraRate_m3_s > 0)).toBe(true);
  }, 120_000);

  it.each([
    [['--monte-carlo', 'many'], /--monte-carlo must be a whole number/],
    [['--seed', '3'], /need --monte-carlo N/],
    [['--k-spread', '-2', '--monte-carlo', '5'], /--k-spread must be a positive number/],
    [['--sensitivity-factors', '0.5,x'], /--sensitivity-factors must be positive numbers/],
    [['--monte-carlo', '5', '--k-spread', '0.5'], /\/options\/monteCarlo\/kSpread/],
  ])('exits 2 with one line naming the problem for %j', async (flags, message) => {
    const r = await drydig(['design', 'ring.json', ...flags]);
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(message);
  }, 60_000);
});
