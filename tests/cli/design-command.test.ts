/**
 * `drydig design` in-process through runCli: the JSON contract of design.md section 4 on stdout,
 * the same answer as the engine, and exit 2 with one line naming the problem for bad input.
 */
import { copyFileSync, mkdtempSync, rmSync, writeFileSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runCli } from '../../server/cli';
import { runDesign } from '../../shared/design';
import { captureIo } from './capture-io';

let dir: string;
const fixture = (name: string) => new URL(`../../fixtures/${name}.json`, import.meta.url);
beforeAll(() => {
  dir = mkdtempSync(path.join(tmpdir(), 'drydig-design-cli-'));
  copyFileSync(fixture('demo-deepwells-confined'), path.join(dir, 'confined.json'));
  copyFileSync(fixture('demo-wellpoints-unconfined'), path.join(dir, 'unconfined.json'));
  writeFileSync(path.join(dir, 'options.json'), JSON.stringify({ stages: [{ wellIds: ['DW5', 'DW6'], start_s: 172800 }], pumpEfficiency: 0.7 }));
  writeFileSync(path.join(dir, 'bad-options.json'), JSON.stringify({ pumpEfficiency: 7 }));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

async function run(...args: string[]) {
  const io = captureIo(dir);
  const code = await runCli(['design', ...args], io);
  return { code, out: io.out(), err: io.err() };
}

describe('drydig design', () => {
  it('drydig help design prints the design options, as design --help does', async () => {
    const viaHelp = captureIo(dir);
    expect(await runCli(['help', 'design'], viaHelp)).toBe(0);
    const viaFlag = await run('--help');
    expect(viaFlag.code).toBe(0);
    expect(viaHelp.out()).toBe(viaFlag.out);
    expect(viaHelp.out()).toMatch(/--suction-lift M/);
  });

  it('prints the design contract for each mode, as the engine computes it', async () => {
    for (const mode of ['uniform', 'optimal', 'layout']) {
      const { code, out, err } = await run('confined.json', '--mode', mode);
      expect(err).toBe('');
      expect(code).toBe(0);
      const json = JSON.parse(out);
      expect(json).toMatchObject({ mode, feasible: true, reasons: [] });
      expect(json.wells[0]).toHaveProperty('id');
      expect(json.wells[0]).toHaveProperty('rate_m3_s');
      expect(json.excavations[0]).toMatchObject({ id: 'basement', targetLevel_m: 6.5, met: true });
      expect(json.excavations[0].worstShortfall_m).toBeLessThanOrEqual(0);
      expect(Object.keys(json.excavations[0].critical)).toEqual(expect.arrayContaining(['x', 'y', 'level_m']));
      const engine = await runDesign({ scenario: JSON.parse(readFileSync(fixture('demo-deepwells-confined'), 'utf8')), mode: mode as 'uniform' });
      expect(json.totalRate_m3_s).toBeCloseTo(engine.totalRate_m3_s, 10);
    }
  }, 120_000);

  it('says feasible:false with reasons when the target cannot be met, and still exits 0', async () => {
    // Header at ground (12 m): with the common-practice 5.5 m suction lift the well points cannot
    // draw the pit down to its target (the demo's own header sits on a platform at 10.8 m).
    const { code, out } = await run('unconfined.json', '--mode', 'uniform', '--header-level', '12');
    expect(code).toBe(0);
    const json = JSON.parse(out);
    expect(json.feasible).toBe(false);
    expect(json.reasons.map((r: { code: string }) => r.code)).toContain('suction-lift');
    expect(json.excavations[0].worstShortfall_m).toBeGreaterThan(0);
  });

  it('applies flags over an options file over the scenario', async () => {
    const { code, out } = await run('confined.json', '--options', 'options.json', '--efficiency', '0.5', '--duration', '30d', '--out-of-service', 'DW3');
    expect(code).toBe(0);
    const json = JSON.parse(out);
    expect(json.wells.find((w: { id: string }) => w.id === 'DW5').start_s).toBe(172800);
    expect(json.summary.duration_s).toBe(30 * 86400);
    expect(json.outOfService).toMatchObject({ wellId: 'DW3', chosenBy: 'option' });
    // Efficiency 0.5: input power = hydraulic / 0.5.
    expect(json.summary.inputPower_kW).toBeCloseTo(json.summary.hydraulicPower_kW / 0.5, 9);
  });

  it('writes CSV with --csv', async () => {
    const { code, out } = await run('confined.json', '--csv');
    expect(code).toBe(0);
    expect(out.split('\r\n')[0]).toBe('quantity,value,unit');
  });

  const bad = [
    { args: [], match: /give a scenario file/ },
    { args: ['confined.json', '--mode', 'fastest'], match: /--mode must be one of uniform, optimal, layout/ },
    { args: ['confined.json', '--efficiency', 'high'], match: /--efficiency must be a number/ },
    { args: ['confined.json', '--efficiency', '1.5'], match: /\/options\/pumpEfficiency/ },
    { args: ['confined.json', '--options', 'bad-options.json'], match: /\/options\/pumpEfficiency/ },
    { args: ['confined.json', '--out-of-service', 'DW99'], match: /\/options\/outOfServiceWell/ },
    { args: ['missing.json'], match: /DRYDIG_ERR_FILE: scenario file missing.json does not exist/ },
    { args: ['confined.json', '--speed'], match: /unknown option --speed/ },
    { args: ['confined.json', '--duration', 'steady'], match: /--duration must be a time/ },
  ];
  it.each(bad)('exits 2 with one line naming the problem for $args', async ({ args, match }) => {
    const { code, out, err } = await run(...args);
    expect(code).toBe(2);
    expect(out).toBe('');
    expect(err).toMatch(match);
    expect(err.trim().split('\n')).toHaveLength(1);
  });
});
