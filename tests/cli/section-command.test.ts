/**
 * `drydig section` in-process through runCli and as a process: the design.md §8 output on stdout
 * (the engine's answer), the floor profile as CSV, a section built from a scenario, and exit 2
 * with one line naming the field for bad input.
 */
import { execFile } from 'node:child_process';
import { copyFileSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runCli } from '../../server/cli';
import { solveSection } from '../../shared/section';
import { captureIo } from './capture-io';

const repo = fileURLToPath(new URL('../..', import.meta.url));
let dir: string;
const section = () => JSON.parse(readFileSync(path.join(repo, 'fixtures/sections/sheet-pile-cofferdam.json'), 'utf8')) as Record<string, unknown>;
beforeAll(() => {
  dir = mkdtempSync(path.join(tmpdir(), 'drydig-section-cli-'));
  copyFileSync(path.join(repo, 'fixtures/sections/sheet-pile-cofferdam.json'), path.join(dir, 'cofferdam.json'));
  copyFileSync(path.join(repo, 'fixtures/demo-deepwells-confined.json'), path.join(dir, 'site.json'));
  writeFileSync(path.join(dir, 'bad-wall.json'), JSON.stringify({ ...section(), walls: [{ x_m: 8, top_m: 10.5, toe_m: -20 }] }));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

async function run(...args: string[]) {
  const io = captureIo(dir);
  const code = await runCli(['section', ...args], io);
  return { code, out: io.out(), err: io.err() };
}

describe('drydig section', () => {
  it('prints flow per metre, the exit gradient, the floor profile and the heave check as the engine computes them', async () => {
    const { code, out, err } = await run('cofferdam.json');
    expect([code, err]).toEqual([0, '']);
    const printed = JSON.parse(out) as Record<string, unknown>;
    const engine = solveSection(section(), { flowNet: false });
    expect(printed.flow_m3_s_per_m).toBe(engine.flow_m3_s_per_m);
    expect(printed.exitGradient).toEqual(engine.exitGradient);
    expect(Object.keys(printed.exitGradient as object)).toEqual(expect.arrayContaining(['max', 'x_m', 'criticalGradient', 'fs']));
    expect((printed.floor as unknown[]).length).toBe(engine.floor.length);
    expect(printed.heave).toMatchObject({ method: 'Terzaghi prism' });
    expect(printed.flowNet).toBeNull();
    expect(printed.cautions).toEqual(engine.cautions);
  });

  it('writes the floor profile as CSV with the checks and cautions', async () => {
    const { code, out } = await run('cofferdam.json', '--csv');
    expect(code).toBe(0);
    const lines = out.split('\r\n');
    expect(lines[0]).toBe('x_m,floor_level_m,head_m,pressure_kPa,exit_gradient,critical_gradient,fs');
    expect(out).toMatch(/\r\nflow_m3_s_per_m,/);
    expect(out).toMatch(/\r\ncaution,/);
  });

  it('builds a half-section from a scenario, with flow × perimeter and the options compared', async () => {
    const { code, out } = await run('site.json', '--outside-head', '12.4', '--toe', '0', '--compare');
    expect(code).toBe(0);
    const printed = JSON.parse(out) as { fromScenario: { perimeter_m: number; flowTimesPerimeter_m3_s: number }; flow_m3_s_per_m: number; section: { surface: Array<{ head_m: number }> }; comparison: { rows: Array<{ kind: string }>; sweep: unknown[] } };
    expect(printed.section.surface[1]!.head_m).toBe(12.4);
    expect(printed.fromScenario.flowTimesPerimeter_m3_s).toBeCloseTo(printed.flow_m3_s_per_m * 120, 12);
    expect(printed.comparison.rows.map((r) => r.kind)).toEqual(['as drawn', 'deeper toe', 'relief wells', 'lower inside level']);
    expect(printed.comparison.sweep.length).toBe(5);
  });

  it.each([
    [['bad-wall.json'], /^DRYDIG_ERR_INVALID_SECTION: \/walls\/0\/toe_m: .*below the impermeable base/],
    [['missing.json'], /^DRYDIG_ERR_FILE: section file missing.json does not exist/],
    [['cofferdam.json', '--toe', '3'], /^DRYDIG_ERR_CLI_USAGE: section: --excavation, --toe/],
    [['site.json', '--toe', 'deep'], /^DRYDIG_ERR_CLI_USAGE: section: --toe must be a level/],
    [['site.json', '--toe', '-40'], /^DRYDIG_ERR_INVALID_REQUEST: \/fromScenario\/toe_m: /],
    [[], /^DRYDIG_ERR_CLI_USAGE: section: give a section/],
  ])('exits 2 with one line naming the problem for %j', async (args, message) => {
    const { code, out, err } = await run(...args);
    expect([code, out]).toEqual([2, '']);
    expect(err).toMatch(message);
    expect(err.trim().split('\n')).toHaveLength(1);
  });

  it('runs as a process: node bin/drydig.js section FILE.json', async () => {
    const result = await new Promise<{ code: number; stdout: string; stderr: string }>((resolve) => {
      execFile(process.execPath, [path.join(repo, 'bin', 'drydig.js'), 'section', 'cofferdam.json'], { cwd: dir, timeout: 60_000 }, (error, stdout, stderr) => {
        resolve({ code: error ? (typeof error.code === 'number' ? error.code : 1) : 0, stdout, stderr });
      });
    });
    expect([result.code, result.stderr]).toEqual([0, '']);
    expect((JSON.parse(result.stdout) as { flow_m3_s_per_m: number }).flow_m3_s_per_m).toBeGreaterThan(0);
  });
});
