/**
 * `POST /api/v1/section` through inject: the engine's answer (solved in the worker thread), a
 * section built from a scenario with the options compared, 400s naming the field, the time
 * budget, and the route in the OpenAPI document.
 */
import { readFileSync } from 'node:fs';
import type { FastifyInstance } from 'fastify';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildApp } from '../../server/app';
import { solveSection } from '../../shared/section';
import { loadFixture } from './helpers/demo-fixtures';
import { postJson, type ErrorBody } from './helpers/inject-json';

const section = () => JSON.parse(readFileSync(new URL('../../fixtures/sections/sheet-pile-cofferdam.json', import.meta.url), 'utf8')) as Record<string, unknown>;

let app: FastifyInstance;
beforeAll(async () => {
  app = await buildApp({ dataDir: ':memory:', clientDir: false });
});
afterAll(async () => {
  await app.close();
});

describe('POST /api/v1/section', () => {
  it('answers flow, exit gradient, floor, heave and the flow net as the engine computes them', async () => {
    const r = await postJson(app, '/api/v1/section', { section: section() });
    expect(r.status).toBe(200);
    const json = r.json() as { flow_m3_s_per_m: number; exitGradient: unknown; heave: { method: string }; flowNet: { tubes: number }; cautions: string[]; floor: unknown[] };
    const direct = solveSection(section());
    expect(json.flow_m3_s_per_m).toBe(direct.flow_m3_s_per_m);
    expect(json.exitGradient).toEqual(direct.exitGradient);
    expect(json.heave.method).toBe('Terzaghi prism');
    expect(json.flowNet.tubes).toBe(direct.flowNet!.tubes);
    expect(json.floor).toHaveLength(direct.floor.length);
    expect(json.cautions.length).toBeGreaterThan(0);
  });

  it('builds the section from a scenario with the plan head outside and compares the options', async () => {
    const r = await postJson(app, '/api/v1/section', { scenario: loadFixture('confined'), fromScenario: { outsideHead_m: 12.1 }, compare: { toeLevels_m: [1, -5] }, flowNet: false, planTotalRate_m3_s: 0.05 });
    expect(r.status).toBe(200);
    const json = r.json() as { fromScenario: { perimeter_m: number; flowTimesPerimeter_m3_s: number; planTotalRate_m3_s: number }; flow_m3_s_per_m: number; comparison: { sweep: Array<{ toe_m: number }>; rows: unknown[] }; flowNet: null };
    expect(json.fromScenario.planTotalRate_m3_s).toBe(0.05);
    expect(json.fromScenario.flowTimesPerimeter_m3_s).toBeCloseTo(json.flow_m3_s_per_m * json.fromScenario.perimeter_m, 12);
    expect(json.comparison.sweep.map((s) => s.toe_m)).toEqual([1, -5]);
    expect(json.comparison.rows).toHaveLength(4);
    expect(json.flowNet).toBeNull();
  });

  it.each([
    [{ section: { ...section(), walls: [{ x_m: 8, top_m: 10.5, toe_m: 12 }] } }, 'DRYDIG_ERR_INVALID_SECTION', '/section/walls/0/toe_m'],
    [{ section: { ...section(), layers: 'sand' } }, 'DRYDIG_ERR_INVALID_SECTION', '/section/layers'],
    [{ section: section(), compare: 'yes' }, 'DRYDIG_ERR_INVALID_REQUEST', '/compare'],
    [{}, 'DRYDIG_ERR_INVALID_REQUEST', '/section'],
    [{ section: section(), scenario: loadFixture('confined') }, 'DRYDIG_ERR_INVALID_REQUEST', '/scenario'],
    [{ scenario: { ...loadFixture('confined'), groundLevel_m: 'high' } }, 'DRYDIG_ERR_INVALID_SCENARIO', '/scenario/groundLevel_m'],
    [{ scenario: loadFixture('confined'), fromScenario: { excavationId: 'nope' } }, 'DRYDIG_ERR_INVALID_REQUEST', '/fromScenario/excavationId'],
    [{ section: { ...section(), mesh: { maxSize_m: 0.01, minSize_m: 0.005 } } }, 'DRYDIG_ERR_SECTION_TOO_LARGE', '/mesh'],
  ])('answers 400 naming the field (%#)', async (body, code, path) => {
    const r = await postJson(app, '/api/v1/section', body);
    expect(r.status).toBe(400);
    const json = r.json() as { error: ErrorBody };
    expect(json.error.code).toBe(code);
    expect(json.error.message.startsWith(path)).toBe(true);
  });

  it('stops a solve past its time budget with 503 DRYDIG_ERR_COMPUTE_TIMEOUT and keeps serving', async () => {
    const quick = await buildApp({ dataDir: ':memory:', clientDir: false, section: { timeout_ms: 1 } });
    try {
      const r = await postJson(quick, '/api/v1/section', { section: section() });
      expect(r.status).toBe(503);
      expect((r.json() as { error: ErrorBody }).error.code).toBe('DRYDIG_ERR_COMPUTE_TIMEOUT');
      const health = await quick.inject({ method: 'GET', url: '/api/v1/health' });
      expect(health.statusCode).toBe(200);
    } finally {
      await quick.close();
    }
  });

  it('is described in the OpenAPI document', async () => {
    const r = await app.inject({ method: 'GET', url: '/api/v1/openapi.json' });
    const doc = r.json() as { paths: Record<string, Record<string, unknown>> };
    expect(doc.paths['/api/v1/section']?.post).toBeDefined();
  });
});
