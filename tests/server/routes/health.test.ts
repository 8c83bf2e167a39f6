/** GET /api/v1/health: status, version, engine capabilities and the limits the app was built with. */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { buildApp } from '../../../server/app';
import { FLAG_BITS } from '../../../shared/field';

const packageVersion = (JSON.parse(readFileSync(new URL('../../../package.json', import.meta.url), 'utf8')) as { version: string }).version;

describe('GET /api/v1/health', () => {
  it('answers status ok with the package version, the engine\u2019s methods and flags', async () => {
    const app = await buildApp({ clientDir: false, dataDir: ':memory:' });
    const response = await app.inject({ method: 'GET', url: '/api/v1/health' });
    await app.close();
    expect(response.statusCode).toBe(200);
    const body = JSON.parse(response.body);
    expect(body.status).toBe('ok');
    expect(body.version).toBe(packageVersion);
    expect(body.engine.scenarioFormat).toBe('drydig.scenario');
    expect(body.engine.scenarioVersion).toBe(1);
    expect(body.engine.methods).toEqual(expect.arrayContaining(['theis', 'thiem', 'dupuit-thiem', 'theis-unconfined', 'hantush-jacob', 'de-glee']));
    expect(body.engine.flags).toEqual(Object.keys(FLAG_BITS));
  });

  it('reports the limits the app was built with', async () => {
    const app = await buildApp({ clientDir: false, dataDir: ':memory:', bodyLimit_bytes: 123_456, maxGridNodes: 789, maxPoints: 42 });
    const body = JSON.parse((await app.inject({ method: 'GET', url: '/api/v1/health' })).body);
    await app.close();
    expect(body.limits).toEqual({ bodyLimit_bytes: 123_456, maxGridNodes: 789, maxPoints: 42 });
  });
});
