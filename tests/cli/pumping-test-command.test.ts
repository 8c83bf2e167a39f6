/**
 * `node bin/drydig.js pumping-test …` as a process: the design.md §8 output, units at the edge
 * (a bare number is SI), and one-line errors with exit code 2.
 */
import { execFile } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

const repo = fileURLToPath(new URL('../..', import.meta.url));
const bin = path.join(repo, 'bin', 'drydig.js');
const demo = path.join(repo, 'fixtures/pumping-tests/demo-constant-rate.csv');
let dir: string;

beforeAll(() => {
  dir = mkdtempSync(path.join(tmpdir(), 'drydig-pt-'));
  // Cooper–Jacob straight line by hand: Δs = 0.2 m per log cycle, Q = 0.01 m³/s →
  // T = 2.303·Q/(4π·Δs) = 2.303·0.01/(4π·0.2) = 9.1636e-3 m²/s; the line crosses s = 0 at t = 10 s,
  // so with r = 10 m, S = 2.25·T·t0/r² = 2.25·9.1636e-3·10/100 = 2.0618e-3.
  const rows = [1000, 2000, 5000, 10_000, 20_000, 50_000].map((t) => `${t},${(0.2 * Math.log10(t / 10)).toFixed(9)}`);
  writeFileSync(path.join(dir, 'line.csv'), ['time_s,drawdown_m', ...rows].join('\n'));
  writeFileSync(path.join(dir, 'bad.csv'), 'time_s,drawdown_m\n60,0.1\n120,oops\n');
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function drydig(args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  return new Promise((resolve) => {
    execFile(process.execPath, [bin, ...args], { cwd: dir, timeout: 60_000 }, (error, stdout, stderr) => {
      resolve({ code: error ? (typeof error.code === 'number' ? error.code : 1) : 0, stdout, stderr });
    });
  });
}

describe('node bin/drydig.js pumping-test', () => {
  it('prints the Cooper–Jacob T and S of a hand-made straight line (design.md §8 output)', async () => {
    const r = await drydig(['pumping-test', 'line.csv', '--rate', '0.01', '--distance', '10', '--method', 'cooper-jacob']);
    expect(r.code).toBe(0);
    const fit = JSON.parse(r.stdout).fits[0];
    expect(fit.method).toBe('cooper-jacob');
    expect(fit.transmissivity_m2_s).toBeCloseTo((2.303 * 0.01) / (4 * Math.PI * 0.2), 9);
    expect(fit.storativity).toBeCloseTo((2.25 * ((2.303 * 0.01) / (4 * Math.PI * 0.2)) * 10) / 100, 9);
    expect(fit.rmse_m).toBeLessThan(1e-8);
  }, 60_000);

  it('reads the rate with a unit: 36 m3/h is 0.01 m³/s', async () => {
    const r = await drydig(['pumping-test', 'line.csv', '--rate', '36m3/h', '--distance', '10', '--method', 'cooper-jacob']);
    expect(JSON.parse(r.stdout).fits[0].transmissivity_m2_s).toBeCloseTo((2.303 * 0.01) / (4 * Math.PI * 0.2), 9);
  }, 60_000);

  it('fits the demo test with recovery after --stop 2d', async () => {
    const r = await drydig(['pumping-test', demo, '--rate', '9L/s', '--stop', '2d']);
    expect(r.code).toBe(0);
    const methods = JSON.parse(r.stdout).fits.map((f: { method: string }) => f.method);
    expect(methods).toEqual(expect.arrayContaining(['theis', 'cooper-jacob', 'hantush', 'recovery']));
  }, 60_000);

  it.each([
    [['pumping-test', 'bad.csv', '--rate', '0.01', '--distance', '5'], /DRYDIG_ERR_INVALID_READINGS: bad.csv: 1 bad row\(s\): line 3: drawdown "oops" is not a number/],
    [['pumping-test', 'line.csv', '--rate', '7furlongs', '--distance', '5'], /--rate: unit "furlongs" is not a rate unit/],
    [['pumping-test', 'line.csv', '--rate', '0.01', '--distance', '5', '--method', 'magic'], /--method must be among/],
    [['pumping-test', 'line.csv', '--distance', '5'], /no pumping rate given/],
  ])('answers %j with one line on stderr and exit code 2', async (args, message) => {
    const r = await drydig(args);
    expect(r.code).toBe(2);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(message);
  }, 60_000);
});
