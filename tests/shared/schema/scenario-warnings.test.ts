import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { findScenarioWarnings, type Scenario } from '../../../shared/schema';
import { runDesign } from '../../../shared/design';
import { buildApp } from '../../../server/app';
import { runCli } from '../../../server/cli';
import { captureIo } from '../../cli/capture-io';
import { postJson } from '../../server/helpers/inject-json';
import { loadFixture } from '../../server/helpers/demo-fixtures';

/** The review's four cases on the invented deep-well demo: W2 moved onto W1, a screen above water, water above ground, a 4.9 m radius. */
function troubledScenario(): Scenario {
  const s = loadFixture('confined');
  const [w0, w1, w2, w3] = s.wells;
  s.wells[1] = { ...w1!, x: w0!.x, y: w0!.y };
  s.wells[3] = { ...w3!, radius_m: 4.9 };
  s.aquifer = { ...s.aquifer, staticLevel_m: s.groundLevel_m + 0.5 };
  s.wells[2] = { ...w2!, screenTop_m: s.aquifer.staticLevel_m + 3, screenBottom_m: s.aquifer.staticLevel_m + 1 };
  return s;
}

const EXPECTED = [
  { code: 'water-above-ground', path: '/aquifer/staticLevel_m' },
  { code: 'screen-above-water', path: '/wells/2/screenBottom_m' },
  { code: 'well-radius-large', path: '/wells/3/radius_m' },
  { code: 'wells-coincide', path: '/wells/1/x' },
];

let app: FastifyInstance;
let dir: string;
beforeAll(async () => {
  app = await buildApp({ dataDir: ':memory:', clientDir: false });
  dir = mkdtempSync(path.join(tmpdir(), 'drydig-warnings-'));
  writeFileSync(path.join(dir, 'troubled.json'), JSON.stringify(troubledScenario()));
});
afterAll(async () => {
  await app.close();
  rmSync(dir, { recursive: true, force: true });
});

const codesAndPaths = (ws: Array<{ code: string; path: string }>) => ws.map(({ code, path: p }) => ({ code, path: p })).sort((a, b) => a.path.localeCompare(b.path));
const expectedAt = (prefix: string) => codesAndPaths(EXPECTED.map((e) => ({ ...e, path: `${prefix}${e.path}` })));

describe('scenario warnings', () => {
  it('findScenarioWarnings names each accepted-but-doubtful field by JSON pointer, and none on the demo', () => {
    expect(findScenarioWarnings(loadFixture('confined'))).toEqual([]);
    expect(findScenarioWarnings(loadFixture('unconfined'))).toEqual([]);
    const warnings = findScenarioWarnings(troubledScenario());
    expect(codesAndPaths(warnings)).toEqual(expectedAt(''));
    expect(warnings.find((w) => w.code === 'wells-coincide')!.message).toMatch(/same spot as well "DW1"/);
  });

  it('POST /api/v1/validate and /evaluate answer them under /scenario; the design result carries them', async () => {
    const scenario = troubledScenario();
    const v = await postJson(app, '/api/v1/validate', { scenario });
    expect(v.status).toBe(200);
    expect(codesAndPaths((v.json() as { warnings: Array<{ code: string; path: string }> }).warnings)).toEqual(expectedAt('/scenario'));
    const e = await postJson(app, '/api/v1/evaluate', { scenario, points: [[0, 0]] });
    expect(e.status).toBe(200);
    expect(codesAndPaths((e.json() as { warnings: Array<{ code: string; path: string }> }).warnings)).toEqual(expectedAt('/scenario'));
    const d = await runDesign({ scenario, mode: 'uniform', scenarioPath: '/scenario' });
    expect(codesAndPaths(d.warnings)).toEqual(expectedAt('/scenario'));
    const bad = await postJson(app, '/api/v1/validate', { scenario: { ...scenario, groundLevel_m: 'high' } });
    expect(bad.status).toBe(400);
  });

  it('drydig validate prints them; drydig evaluate --csv writes them to stderr', async () => {
    const io = captureIo(dir);
    expect(await runCli(['validate', 'troubled.json'], io)).toBe(0);
    const out = JSON.parse(io.out()) as { ok: boolean; warnings: Array<{ code: string; path: string }> };
    expect(out.ok).toBe(true);
    expect(codesAndPaths(out.warnings)).toEqual(expectedAt(''));
    const csv = captureIo(dir);
    expect(await runCli(['evaluate', 'troubled.json', '--points', '0,0', '--csv'], csv)).toBe(0);
    expect(csv.err()).toMatch(/^warning: \/wells\/3\/radius_m: well radius 4.9 m/m);
  });
});
