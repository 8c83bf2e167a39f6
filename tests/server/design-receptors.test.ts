/**
 * `POST /api/v1/design` with receptors through inject: the neighbours demo answers its receptors
 * block within the response schema, the pond's drawdown limit met with the recharge well; without
 * the recharge well the reason names the pond; a bad receptor is a 400 naming its JSON pointer.
 */
import { readFileSync } from 'node:fs';
import type { FastifyInstance } from 'fastify';
import { Value } from '@sinclair/typebox/value';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildApp } from '../../server/app';
import { DesignResultSchema } from '../../shared/design';
import type { Scenario } from '../../shared/schema';
import { postJson, type ErrorBody } from './helpers/inject-json';

const demo = (): Scenario => JSON.parse(readFileSync(new URL('../../fixtures/demo-neighbours-confined.json', import.meta.url), 'utf8')) as Scenario;

let app: FastifyInstance;
beforeAll(async () => {
  app = await buildApp({ dataDir: ':memory:', clientDir: false });
});
afterAll(async () => {
  await app.close();
});

describe('POST /api/v1/design with receptors', () => {
  it('answers the receptors block and meets the pond limit with the recharge well', async () => {
    const r = await postJson(app, '/api/v1/design', { scenario: demo(), mode: 'optimal' });
    expect(r.status).toBe(200);
    const json = r.json();
    expect(Value.Check(DesignResultSchema, json)).toBe(true);
    expect(json.feasible).toBe(true);
    const pond = (json.receptors as Array<{ id: string; maxDrawdownOverDig_m: number; status: string }>).find((x) => x.id === 'pond')!;
    expect(pond.status).toBe('ok');
    expect(pond.maxDrawdownOverDig_m).toBeLessThanOrEqual(2.5 + 1e-4);
    const rw1 = (json.wells as Array<{ id: string; rate_m3_s: number; injection?: boolean }>).find((w) => w.id === 'RW1')!;
    expect(rw1.injection).toBe(true);
    expect(rw1.rate_m3_s).toBeLessThan(0);
    expect(json.injectionRate_m3_s).toBeCloseTo(-rw1.rate_m3_s, 12);
  }, 60_000);

  it('names the pond when its limit cannot be kept without the recharge well', async () => {
    const s = demo();
    s.wells = s.wells.filter((w) => w.id !== 'RW1');
    const r = await postJson(app, '/api/v1/design', { scenario: s, mode: 'optimal' });
    expect(r.status).toBe(200);
    const json = r.json();
    expect(json.feasible).toBe(false);
    expect((json.reasons as Array<{ code: string; receptorId?: string }>).filter((x) => x.code === 'receptor-drawdown-limit').map((x) => x.receptorId)).toEqual(['pond']);
  }, 60_000);

  it('refuses a receptor without a compressibility with a 400 naming the field', async () => {
    const s = demo() as Scenario & { receptors: Array<Record<string, unknown>> };
    s.receptors[0]!.compressibleLayer = { thickness_m: 3 };
    const r = await postJson(app, '/api/v1/design', { scenario: s, mode: 'optimal' });
    expect(r.status).toBe(400);
    const { error } = r.json() as { error: ErrorBody };
    expect(error.code).toBe('DRYDIG_ERR_INVALID_SCENARIO');
    expect(error.message).toMatch(/^\/scenario\/receptors\/0\/compressibleLayer: give exactly one of mv_m2_kN/);
  });
});
