/**
 * `drydig evaluate` in-process through runCli with a captured CliIo: the output is the engine's
 * own answer, and every bad input ends in exit 2 with one line on stderr naming the problem.
 */
import { copyFileSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runCli } from '../../server/cli';
import { evaluateGrid, evaluatePoints } from '../../shared/field';
import type { Scenario } from '../../shared/schema';
import { loadFixture } from '../server/helpers/demo-fixtures';
import { captureIo } from './capture-io';

let dir: string;
beforeAll(() => {
  dir = mkdtempSync(path.join(tmpdir(), 'drydig-cli-'));
  copyFileSync(new URL('../../fixtures/demo-wellpoints-unconfined.json', import.meta.url), path.join(dir, 'unconfined.json'));
  copyFileSync(new URL('../../fixtures/demo-deepwells-confined.json', import.meta.url), path.join(dir, 'confined.json'));
  writeFileSync(path.join(dir, 'points.csv'), 'id,x,y\nA,20,10\nB,45,10\nC,120,-60\n');
  writeFileSync(path.join(dir, 'bare.csv'), '20,10\n45,10\n');
  writeFileSync(path.join(dir, 'broken.json'), '{\n  "format": "drydig.scenario",\n  "version": 1,\n  oops\n}');
  const noS = loadFixture('confined') as Scenario & { aquifer: Record<string, unknown> };
  delete noS.aquifer.storativity;
  writeFileSync(path.join(dir, 'no-storativity.json'), JSON.stringify(noS));
  writeFileSync(path.join(dir, 'bad-points.csv'), 'x,y\n1,2\n3,north\n');
  const threeLines = loadFixture('unconfined');
  threeLines.boundaries = [0, 1, 2].map((k) => ({ kind: 'no-flow' as const, from: [-100 - k * 10, -500] as [number, number], to: [-100 - k * 10, 500] as [number, number] }));
  writeFileSync(path.join(dir, 'three-boundaries.json'), JSON.stringify(threeLines));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

async function run(args: string[]) {
  const io = captureIo(dir);
  const code = await runCli(args, io);
  return { code, out: io.out(), err: io.err() };
}

describe('drydig evaluate (in-process)', () => {
  const scenario = () => loadFixture('unconfined');
  const cases: Array<{ name: string; args: string[]; points: Array<[number, number]>; times: Array<number | null | undefined> }> = [
    { name: 'inline points at the design time', args: ['--points', '20,10;45,10'], points: [[20, 10], [45, 10]], times: [undefined] },
    { name: 'a CSV with a header and an id column', args: ['--points', 'points.csv'], points: [[20, 10], [45, 10], [120, -60]], times: [undefined] },
    { name: 'a CSV of two bare columns', args: ['--points', 'bare.csv'], points: [[20, 10], [45, 10]], times: [undefined] },
    { name: '--time in seconds', args: ['--points', '20,10', '--time', '86400'], points: [[20, 10]], times: [86_400] },
    { name: '--time with a unit', args: ['--points=20,10', '--time=1d'], points: [[20, 10]], times: [86_400] },
    { name: '--time steady', args: ['--points', '20,10', '--time', 'steady'], points: [[20, 10]], times: [null] },
    { name: 'several times', args: ['--points', '20,10;45,10', '--time', '3600,steady'], points: [[20, 10], [45, 10]], times: [3600, null] },
  ];
  it.each(cases)('prints the engine\u2019s points for $name', async ({ args, points, times }) => {
    const { code, out, err } = await run(['evaluate', 'unconfined.json', ...args]);
    expect(err).toBe('');
    expect(code).toBe(0);
    const answer = JSON.parse(out) as { points: unknown[]; model: unknown; cautions: string[] };
    const expected = times.flatMap((time_s) => evaluatePoints({ scenario: scenario(), points, time_s }).points);
    expect(answer.points).toEqual(JSON.parse(JSON.stringify(expected)));
    expect(answer.cautions.length).toBeGreaterThan(0);
    expect(out.endsWith('\n')).toBe(true);
  });

  it('prints each point with x, y, time_s, level_m, drawdown_m and flags (design.md section 4)', async () => {
    const { out } = await run(['evaluate', 'confined.json', '--points', '389215,5819415']);
    const point = (JSON.parse(out) as { points: Array<Record<string, unknown>> }).points[0]!;
    expect(Object.keys(point).sort()).toEqual(['drawdown_m', 'flags', 'level_m', 'time_s', 'x', 'y']);
    expect(point.time_s).toBe(604_800);
  });

  it('adds a grid with --grid, rounded as the API rounds it', async () => {
    const { code, out } = await run(['evaluate', 'unconfined.json', '--grid', '0,0,10,10,5,3', '--time', 'steady']);
    expect(code).toBe(0);
    const grid = (JSON.parse(out) as { grids: Array<{ drawdown_m: number[] }> }).grids[0]!;
    const direct = evaluateGrid({ scenario: scenario(), grid: { origin: [0, 0], spacing_m: [10, 10], counts: [5, 3] }, time_s: null });
    grid.drawdown_m.forEach((d, k) => expect(Math.abs(d - direct.drawdown_m[k]!)).toBeLessThanOrEqual(0.5e-4 + 1e-12));
  });

  it('--csv writes the same numbers as CSV, which drydig reads back as points', async () => {
    const json = JSON.parse((await run(['evaluate', 'confined.json', '--points', '389215,5819415;389500,5819415', '--time', '1d,steady'])).out) as {
      points: Array<{ x: number; y: number; time_s: number | null; level_m: number; drawdown_m: number; flags: string[] }>;
    };
    const { code, out } = await run(['evaluate', 'confined.json', '--points', '389215,5819415;389500,5819415', '--time', '1d,steady', '--csv']);
    expect(code).toBe(0);
    const rows = out.trimEnd().split('\n').filter((l) => !l.startsWith('#'));
    expect(rows[0]).toBe('x,y,time_s,level_m,drawdown_m,flags');
    expect(rows.slice(1).map((r) => r.split(','))).toEqual(
      json.points.map((p) => [String(p.x), String(p.y), p.time_s === null ? 'steady' : String(p.time_s), String(p.level_m), String(p.drawdown_m), p.flags.join(' ')]),
    );
    expect(out).toContain('# Estimates from idealised models');
    writeFileSync(path.join(dir, 'roundtrip.csv'), out);
    const again = JSON.parse((await run(['evaluate', 'confined.json', '--points', 'roundtrip.csv', '--time', '1d'])).out) as { points: Array<{ x: number; y: number }> };
    expect(again.points.map((p) => [p.x, p.y])).toEqual([[389215, 5819415], [389500, 5819415], [389215, 5819415], [389500, 5819415]]);
  });

  const bad: Array<{ name: string; args: string[]; line: RegExp }> = [
    { name: 'a missing scenario file', args: ['evaluate', 'nowhere.json', '--points', '1,2'], line: /^DRYDIG_ERR_FILE: scenario file nowhere\.json does not exist$/ },
    { name: 'a folder for the scenario', args: ['evaluate', '.', '--points', '1,2'], line: /^DRYDIG_ERR_FILE: scenario file \. is a folder/ },
    { name: 'malformed JSON', args: ['evaluate', 'broken.json', '--points', '1,2'], line: /^DRYDIG_ERR_MALFORMED_JSON: broken\.json is not well-formed JSON \(line 4, column \d+\)$/ },
    { name: 'an invalid scenario', args: ['evaluate', 'no-storativity.json', '--points', '1,2'], line: /^DRYDIG_ERR_INVALID_SCENARIO: \/aquifer\/storativity: is required for a confined aquifer$/ },
    { name: 'boundaries the engine refuses', args: ['evaluate', 'three-boundaries.json', '--points', '1,2'], line: /^DRYDIG_ERR_UNSUPPORTED_BOUNDARIES: \/boundaries\/2: / },
    { name: 'bad inline points', args: ['evaluate', 'unconfined.json', '--points', '1,2;3'], line: /^DRYDIG_ERR_CLI_USAGE: --points: point 2/ },
    { name: 'a bad CSV cell', args: ['evaluate', 'unconfined.json', '--points', 'bad-points.csv'], line: /^DRYDIG_ERR_FILE: bad-points\.csv line 3, column y: "north" is not a finite number$/ },
    { name: 'a missing points file', args: ['evaluate', 'unconfined.json', '--points', 'none.csv'], line: /^DRYDIG_ERR_FILE: points file none\.csv does not exist$/ },
    { name: 'a zero time', args: ['evaluate', 'unconfined.json', '--points', '1,2', '--time', '0'], line: /^DRYDIG_ERR_CLI_USAGE: --time: 0 must be greater than 0/ },
    { name: 'a word for a time', args: ['evaluate', 'unconfined.json', '--points', '1,2', '--time', 'soon'], line: /^DRYDIG_ERR_CLI_USAGE: --time: "soon" is not a time/ },
    { name: 'no --points', args: ['evaluate', 'unconfined.json'], line: /^DRYDIG_ERR_CLI_USAGE: evaluate: --points is required/ },
    { name: 'no scenario', args: ['evaluate', '--points', '1,2'], line: /^DRYDIG_ERR_CLI_USAGE: evaluate: give a scenario file/ },
    { name: 'a misspelt option', args: ['evaluate', 'unconfined.json', '--point', '1,2'], line: /^DRYDIG_ERR_CLI_USAGE: evaluate: unknown option --point/ },
    { name: 'a bad grid', args: ['evaluate', 'unconfined.json', '--grid', '0,0,0,1,2,2'], line: /^DRYDIG_ERR_CLI_USAGE: --grid: spacings/ },
    { name: 'an unknown command', args: ['evalute', 'unconfined.json'], line: /^DRYDIG_ERR_CLI_USAGE: unknown command "evalute"/ },
    { name: '--csv with a grid', args: ['evaluate', 'unconfined.json', '--points', '1,2', '--grid', '0,0,1,1,2,2', '--csv'], line: /^DRYDIG_ERR_CLI_USAGE: evaluate: --csv writes points only/ },
  ];
  it.each(bad)('exits 2 with one stderr line for $name', async ({ args, line }) => {
    const { code, out, err } = await run(args);
    expect(code).toBe(2);
    expect(out).toBe('');
    expect(err.endsWith('\n')).toBe(true);
    expect(err.trimEnd().split('\n')).toHaveLength(1);
    expect(err.trimEnd()).toMatch(line);
  });
});

describe('drydig help', () => {
  it.each([['--help'], ['help'], ['-h']])('%s prints the usage on stdout and exits 0', async (arg) => {
    const { code, out } = await run([arg]);
    expect(code).toBe(0);
    expect(out).toContain('drydig evaluate SCENARIO.json');
    expect(out).toContain('drydig serve');
    expect(out).toContain('drydig design');
  });
  it('help evaluate and evaluate --help print the command\u2019s options', async () => {
    for (const args of [['help', 'evaluate'], ['evaluate', '--help']]) {
      const { code, out } = await run(args);
      expect(code).toBe(0);
      expect(out).toContain('--time T');
    }
  });
  it('no command prints the usage on stderr and exits 2', async () => {
    const { code, err } = await run([]);
    expect(code).toBe(2);
    expect(err).toContain('Usage:');
  });
  it('--version prints the package version', async () => {
    expect((await run(['--version'])).out).toMatch(/^drydig \d+\.\d+\.\d+\n$/);
  });
});
