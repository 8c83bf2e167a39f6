/**
 * Helpers for the scenario, link and security tests: an in-memory app, the demo scenarios, a
 * tolerance check. Demo data is invented (fixtures/README.md).
 */
import { readFileSync } from 'node:fs';
import { expect } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { buildApp, type AppOptions } from '../../server/app';
import type { Scenario } from '../../shared/schema';
import { signInApp } from '../helpers/sign-in';

export const DEMO_FILES = {
  unconfined: 'fixtures/demo-wellpoints-unconfined.json',
  confined: 'fixtures/demo-deepwells-confined.json',
} as const;

/** A fresh copy of a demo scenario. */
export function demoScenario(name: keyof typeof DEMO_FILES): Scenario {
  return JSON.parse(readFileSync(new URL(`../../${DEMO_FILES[name]}`, import.meta.url), 'utf8')) as Scenario;
}

/** An app on an in-memory database without the web client; write limit high unless given. */
export function memoryApp(options: AppOptions = {}): Promise<FastifyInstance> {
  return buildApp({ dataDir: ':memory:', clientDir: false, security: { writeMax: 100_000 }, ...options });
}

/** memoryApp with a signed-in designer (or `role`): every inject carries the session cookie and CSRF token. */
export async function signedInMemoryApp(options: AppOptions = {}, role: 'admin' | 'designer' | 'viewer' = 'designer'): Promise<FastifyInstance> {
  const app = await memoryApp(options);
  await signInApp(app, role);
  return app;
}

/** |actual − expected| ≤ abs + rel·|expected|, with the source named in the failure message. */
export function expectClose(actual: number, expected: number, tolerance: { abs?: number; rel?: number }, label: string): void {
  const allowed = (tolerance.abs ?? 0) + (tolerance.rel ?? 0) * Math.abs(expected);
  expect(Math.abs(actual - expected), `${label}: got ${actual}, expected ${expected} ± ${allowed}`).toBeLessThanOrEqual(allowed);
}

/** Saves a scenario as a new entry and returns its id. */
export async function createStored(app: FastifyInstance, scenario: Scenario, savedBy = 'test'): Promise<string> {
  const res = await app.inject({ method: 'POST', url: '/api/v1/scenarios', payload: { scenario, savedBy } });
  expect(res.statusCode, res.body).toBe(201);
  return (res.json() as { scenarioId: string }).scenarioId;
}

/** Creates a share link and returns its token. */
export async function createLink(app: FastifyInstance, scenarioId: string, mode: 'view' | 'edit', revision: number | null = null): Promise<string> {
  const res = await app.inject({ method: 'POST', url: `/api/v1/scenarios/${scenarioId}/links`, payload: { mode, revision } });
  expect(res.statusCode, res.body).toBe(201);
  return (res.json() as { token: string }).token;
}
