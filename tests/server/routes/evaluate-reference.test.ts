/**
 * POST /api/v1/evaluate end to end against closed-form single-well solutions computed outside the
 * project with mpmath 1.3.0 at 30 digits (tests/server/reference/evaluate-reference.py; its output
 * and versions in evaluate-reference.json). Each method the engine offers is reached through HTTP.
 */
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../../../server/app';
import type { Scenario } from '../../../shared/schema';
import { singleWellScenario } from '../helpers/demo-fixtures';
import { expectClose } from '../helpers/expect-close';
import { postJson } from '../helpers/inject-json';

interface Reference {
  versions: Record<string, string>;
  parameters: {
    rate_m3_s: number;
    conductivity_m_s: number;
    top_m: number;
    base_m: number;
    storativity: number;
    specificYield: number;
    confinedStaticLevel_m: number;
    unconfinedStaticLevel_m: number;
    influenceRadius_m: number;
    leakageFactor_m: number;
    time_s: number;
    leakyTime_s: number;
    radii_m: number[];
    constantHeadLineX_m: number;
    imagePoints: Array<[number, number]>;
  };
  drawdown_m: Record<string, number[]>;
}

const reference = JSON.parse(readFileSync(new URL('../reference/evaluate-reference.json', import.meta.url), 'utf8')) as Reference;
const p = reference.parameters;

const confined: Scenario['aquifer'] = {
  kind: 'confined', conductivity_m_s: p.conductivity_m_s, base_m: p.base_m, top_m: p.top_m,
  staticLevel_m: p.confinedStaticLevel_m, storativity: p.storativity, influenceRadius_m: p.influenceRadius_m,
};
const unconfined: Scenario['aquifer'] = {
  kind: 'unconfined', conductivity_m_s: p.conductivity_m_s, base_m: p.base_m,
  staticLevel_m: p.unconfinedStaticLevel_m, specificYield: p.specificYield, influenceRadius_m: p.influenceRadius_m,
};
const leaky: Scenario['aquifer'] = {
  kind: 'leaky', conductivity_m_s: p.conductivity_m_s, base_m: p.base_m, top_m: p.top_m,
  staticLevel_m: p.confinedStaticLevel_m, storativity: p.storativity, leakageFactor_m: p.leakageFactor_m,
};
const onAxis = p.radii_m.map((r): [number, number] => [r, 0]);
const withLine = (s: Scenario): Scenario => ({
  ...s,
  boundaries: [{ kind: 'constant-head', from: [p.constantHeadLineX_m, -1000], to: [p.constantHeadLineX_m, 1000] }],
});

// 1e-9 relative (plus 1 nm): the engine agrees with the 30-digit reference to ~1e-12 or better, so
// this leaves room for platform rounding while any wrong sign, factor or argument fails.
const TOL = { abs: 1e-9, rel: 1e-9 };

const cases: Array<{ name: string; key: string; scenario: Scenario; time_s: number | null; points: Array<[number, number]>; method: string }> = [
  { name: 'Theis (1935), confined transient', key: 'theis', scenario: singleWellScenario(confined, p.rate_m3_s), time_s: p.time_s, points: onAxis, method: 'theis' },
  { name: 'Thiem (1906), confined steady', key: 'thiem', scenario: singleWellScenario(confined, p.rate_m3_s), time_s: null, points: onAxis, method: 'thiem' },
  { name: 'Dupuit–Thiem, unconfined steady', key: 'dupuit_thiem', scenario: singleWellScenario(unconfined, p.rate_m3_s), time_s: null, points: onAxis, method: 'dupuit-thiem' },
  { name: 'Theis on the discharge potential, unconfined transient', key: 'theis_unconfined', scenario: singleWellScenario(unconfined, p.rate_m3_s), time_s: p.time_s, points: onAxis, method: 'theis-unconfined' },
  { name: 'Hantush & Jacob (1955), leaky transient', key: 'hantush_jacob', scenario: singleWellScenario(leaky, p.rate_m3_s), time_s: p.leakyTime_s, points: onAxis, method: 'hantush-jacob' },
  { name: 'de Glee (1930), leaky steady', key: 'de_glee', scenario: singleWellScenario(leaky, p.rate_m3_s), time_s: null, points: onAxis, method: 'de-glee' },
  { name: 'Theis with a constant-head line by an image well (Ferris et al. 1962)', key: 'theis_constant_head_line', scenario: withLine(singleWellScenario(confined, p.rate_m3_s)), time_s: p.time_s, points: p.imagePoints, method: 'theis' },
];

let app: FastifyInstance;
beforeAll(async () => {
  app = await buildApp({ clientDir: false, dataDir: ':memory:' });
});
afterAll(async () => {
  await app.close();
});

describe('POST /api/v1/evaluate reproduces closed-form single-well drawdowns (mpmath reference)', () => {
  it('records the reference library versions beside its output', () => {
    expect(reference.versions.mpmath).toBe('1.3.0');
  });

  it.each(cases)('$name', async ({ key, scenario, time_s, points, method }) => {
    const response = await postJson(app, '/api/v1/evaluate', { scenario, points, times_s: [time_s] });
    expect(response.status).toBe(200);
    const answer = response.json() as { points: Array<{ drawdown_m: number; level_m: number; flags: string[] }>; model: { method: string } };
    expect(answer.model.method).toBe(method);
    const expected = reference.drawdown_m[key]!;
    expect(answer.points).toHaveLength(expected.length);
    answer.points.forEach((point, k) => {
      expectClose(point.drawdown_m, expected[k]!, TOL, `${key} point ${k}`);
      expect(point.level_m).toBeCloseTo(scenario.aquifer.staticLevel_m - point.drawdown_m, 12);
    });
  });
});
