/**
 * `POST /api/v1/design` through inject: the same answer as the shared solver, the response
 * schema in the OpenAPI document, and 400s that name the field for bad input.
 */
import type { FastifyInstance } from 'fastify';
import { Value } from '@sinclair/typebox/value';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildApp } from '../../server/app';
import { DesignResultSchema, runDesign } from '../../shared/design';
import { makeDesignBenchScenario } from '../../bench/design';
import { loadFixture } from './helpers/demo-fixtures';
import { postJson, type ErrorBody } from './helpers/inject-json';

let app: FastifyInstance;
beforeAll(async () => {
  app = await buildApp({ dataDir: ':memory:', clientDir: false });
});
afterAll(async () => {
  await app.close();
});

describe('POST /api/v1/design', () => {
  it('answers the design contract, equal to the shared solver’s result', async () => {
    const scenario = loadFixture('confined');
    const r = await postJson(app, '/api/v1/design', { scenario, mode: 'optimal' });
    expect(r.status).toBe(200);
    const json = r.json();
    expect(Value.Check(DesignResultSchema, json)).toBe(true);
    const direct = await runDesign({ scenario, mode: 'optimal' });
    expect(json.feasible).toBe(true);
    expect(json.totalRate_m3_s).toBeCloseTo(direct.totalRate_m3_s, 10);
    expect((json.wells as Array<{ id: string }>).map((w) => w.id)).toEqual(direct.wells.map((w) => w.id));
    expect(json.cautions).toEqual(direct.cautions);
  }, 60_000);

  it('answers feasible:false with reasons (not an error) when the target cannot be met', async () => {
    // Header at ground (12 m): the common-practice 5.5 m suction lift stops the well points at the target.
    const scenario = { ...loadFixture('unconfined'), designOptions: { headerLevel_m: 12 } };
    const r = await postJson(app, '/api/v1/design', { scenario, mode: 'uniform' });
    expect(r.status).toBe(200);
    const json = r.json() as { feasible: boolean; reasons: Array<{ code: string }> };
    expect(json.feasible).toBe(false);
    expect(json.reasons.map((x) => x.code)).toContain('suction-lift');
  }, 60_000);

  it('takes options from the body over the scenario’s designOptions', async () => {
    const scenario = { ...loadFixture('confined'), designOptions: { safetyFactor: 1.5, pumpEfficiency: 0.5 } };
    const r = await postJson(app, '/api/v1/design', { scenario, mode: 'uniform', options: { safetyFactor: 2 } });
    expect(r.status).toBe(200);
    const s = (r.json() as { summary: { safetyFactor: number; inputPower_kW: number; hydraulicPower_kW: number } }).summary;
    expect(s.safetyFactor).toBe(2);
    expect(s.inputPower_kW).toBeCloseTo(s.hydraulicPower_kW / 0.5, 9);
  }, 60_000);

  const bad = [
    { name: 'a scenario field', body: () => ({ scenario: { ...loadFixture('confined'), aquifer: { ...loadFixture('confined').aquifer, storativity: undefined } } }), path: '/scenario/aquifer/storativity' },
    { name: 'an unknown mode', body: () => ({ scenario: loadFixture('confined'), mode: 'fastest' }), path: '/mode' },
    { name: 'an unknown option', body: () => ({ scenario: loadFixture('confined'), options: { pumpEfficency: 0.6 } }), path: '/options/pumpEfficency' },
    { name: 'an efficiency over 1', body: () => ({ scenario: loadFixture('confined'), options: { pumpEfficiency: 3 } }), path: '/options/pumpEfficiency' },
    { name: 'a stored option', body: () => ({ scenario: { ...loadFixture('confined'), designOptions: { standbyRatio: -1 } } }), path: '/scenario/designOptions/standbyRatio' },
    { name: 'a stage naming no well', body: () => ({ scenario: loadFixture('confined'), options: { stages: [{ wellIds: ['X'], start_s: 10 }] } }), path: '/options/stages/0/wellIds/0' },
    { name: 'a missing scenario', body: () => ({ mode: 'optimal' }), path: '/scenario' },
  ];
  it.each(bad)('answers 400 naming the field for $name', async ({ body, path }) => {
    const r = await postJson(app, '/api/v1/design', body());
    expect(r.status).toBe(400);
    const error = (r.json() as { error: ErrorBody }).error;
    expect(error.code).toMatch(/^DRYDIG_ERR_INVALID_(SCENARIO|REQUEST)$/);
    expect(error.issues?.map((i) => i.path) ?? [error.message]).toContain(path);
    expect(r.text).not.toMatch(/at .*\.ts:\d+/);
  });

  it('solves off the event loop: a health check sent during a layout search answers first', async () => {
    // 60 candidates, a search of up to 4 s in the solver's worker thread (invented bench site); the
    // timer below can only fire while the main thread is idle, i.e. while the solve runs elsewhere.
    const order: string[] = [];
    const design = postJson(app, '/api/v1/design', { scenario: makeDesignBenchScenario(60), mode: 'layout', options: { layoutTimeLimit_s: 4, wellCost: 20000 } }).then((r) => {
      order.push('design');
      return r;
    });
    // Let the request reach the solver before asking for health.
    await new Promise((resolve) => setTimeout(resolve, 1500));
    const health = await app.inject({ method: 'GET', url: '/api/v1/health' });
    order.push('health');
    expect(health.statusCode).toBe(200);
    const r = await design;
    expect(r.status).toBe(200);
    expect(order).toEqual(['health', 'design']);
    expect((r.json() as { chosenWellIds: string[] }).chosenWellIds.length).toBeGreaterThan(0);
  }, 60_000);

  it('is listed in the OpenAPI document with its request and response schemas', async () => {
    const r = await app.inject({ method: 'GET', url: '/api/v1/openapi.json' });
    expect(r.statusCode).toBe(200);
    const doc = JSON.parse(r.body) as { paths: Record<string, { post?: { requestBody?: unknown; responses?: Record<string, unknown> } }> };
    const post = doc.paths['/api/v1/design']?.post;
    expect(post).toBeDefined();
    expect(JSON.stringify(post)).toContain('worstShortfall_m');
  });
});
