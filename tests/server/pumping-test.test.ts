/**
 * `POST /api/v1/pumping-test` through inject: the same analysis as the shared engine, the
 * response schema, and 400s that name the field or the line for bad input.
 */
import { readFileSync } from 'node:fs';
import type { FastifyInstance } from 'fastify';
import { Value } from '@sinclair/typebox/value';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildApp } from '../../server/app';
import { PumpingTestResultSchema, analysePumpingTest, parseReadingsCsv, type PumpingTestResult } from '../../shared/testing';
import { postJson, type ErrorBody } from './helpers/inject-json';

const csv = readFileSync(new URL('../../fixtures/pumping-tests/demo-constant-rate.csv', import.meta.url), 'utf8');
let app: FastifyInstance;
beforeAll(async () => {
  app = await buildApp({ dataDir: ':memory:', clientDir: false });
});
afterAll(async () => {
  await app.close();
});

describe('POST /api/v1/pumping-test', () => {
  it('answers the fits of the demo test, equal to the shared analysis and valid against its schema', async () => {
    const r = await postJson(app, '/api/v1/pumping-test', { csv, rate_m3_s: 0.009, stop_s: 172_800 });
    expect(r.status).toBe(200);
    const json = r.json() as unknown as PumpingTestResult;
    expect(Value.Check(PumpingTestResultSchema, json)).toBe(true);
    const direct = analysePumpingTest({ readings: parseReadingsCsv(csv, { rate_m3_s: 0.009, stop_s: 172_800 }), stop_s: 172_800 });
    expect(json.fits.map((f) => f.method)).toEqual(direct.fits.map((f) => f.method));
    expect(json.fits[0]!.transmissivity_m2_s).toBeCloseTo(direct.fits[0]!.transmissivity_m2_s!, 12);
  });

  it('takes readings as rows with one distance for all', async () => {
    const readings = [60, 120, 240, 480, 960, 1920].map((t) => ({ time_s: t, drawdown_m: 0.1 * Math.log10(t) }));
    const r = await postJson(app, '/api/v1/pumping-test', { readings, rate_m3_s: 0.01, distance_m: 10, methods: ['cooper-jacob'] });
    expect(r.status).toBe(200);
    expect((r.json() as unknown as PumpingTestResult).fits[0]!.line!.slope_m_per_log_cycle).toBeCloseTo(0.1, 9);
  });

  it.each([
    ['a bad number in line 2', { csv: 'time_s,drawdown_m\n60,x\n', rate_m3_s: 0.01, distance_m: 5 }, 'DRYDIG_ERR_INVALID_READINGS', /line 2: drawdown "x" is not a number/],
    ['no readings at all', { rate_m3_s: 0.01 }, 'DRYDIG_ERR_INVALID_REQUEST', /\/csv/],
    ['a negative rate', { csv, rate_m3_s: -1 }, 'DRYDIG_ERR_INVALID_REQUEST', /rate_m3_s/],
    ['an unknown method', { csv, rate_m3_s: 0.01, methods: ['guess'] }, 'DRYDIG_ERR_INVALID_REQUEST', /methods/],
    ['a row without a distance', { readings: [{ time_s: 60, drawdown_m: 0.1 }], rate_m3_s: 0.01 }, 'DRYDIG_ERR_INVALID_REQUEST', /\/readings\/0\/distance_m/],
  ])('answers 400 naming the field or line for %s', async (_label, body, code, message) => {
    const r = await postJson(app, '/api/v1/pumping-test', body);
    expect(r.status).toBe(400);
    const e = r.json().error as ErrorBody;
    expect(e.code).toBe(code);
    expect(e.message).toMatch(message);
  });
});
