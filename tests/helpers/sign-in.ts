/**
 * Signing in for tests of the storage routes: an account made in the app's store (argon2 hash,
 * as `drydig user add` makes it), a real POST /api/v1/auth/login, and the session cookie and CSRF
 * token sent on every later inject — the routes see exactly what a browser sends.
 */
import { expect } from 'vitest';
import type { FastifyInstance, InjectOptions } from 'fastify';
import { hashPassword } from '../../server/auth';
import type { Role } from '../../server/storage';

export const TEST_PASSWORD = 'correct-horse-battery-staple';

export interface TestSession {
  username: string;
  role: Role;
  cookie: string;
  csrf: string;
}

/** Makes an account in the app's store. */
export async function addAccount(app: FastifyInstance, username: string, role: Role, password = TEST_PASSWORD): Promise<void> {
  app.scenarioStore.accounts.addUser({ username, role, passwordHash: await hashPassword(password) });
}

/** The `name=value` part of a Set-Cookie header for the session cookie. */
export function sessionCookieOf(setCookie: string | string[] | undefined): string {
  const all = Array.isArray(setCookie) ? setCookie : setCookie ? [setCookie] : [];
  const found = all.find((c) => c.startsWith('drydig_session='));
  expect(found, 'a drydig_session cookie').toBeDefined();
  return found!.split(';')[0]!;
}

/** Signs in through the login route. */
export async function signIn(app: FastifyInstance, username: string, password = TEST_PASSWORD): Promise<TestSession> {
  const res = await app.inject({ method: 'POST', url: '/api/v1/auth/login', payload: { username, password } });
  expect(res.statusCode, res.body).toBe(200);
  const body = res.json() as { user: { role: Role }; csrfToken: string };
  return { username, role: body.user.role, cookie: sessionCookieOf(res.headers['set-cookie']), csrf: body.csrfToken };
}

/** Headers a signed-in browser sends. */
export function sessionHeaders(session: TestSession): Record<string, string> {
  return { cookie: session.cookie, 'x-drydig-csrf': session.csrf };
}

/** Makes an account, signs in and sends the session with every later `app.inject` (headers given in a call win). */
export async function signInApp(app: FastifyInstance, role: Role = 'designer', username = `test-${role}`): Promise<TestSession> {
  await addAccount(app, username, role);
  const session = await signIn(app, username);
  const raw = app.inject.bind(app) as (opts: InjectOptions) => ReturnType<FastifyInstance['inject']>;
  (app as unknown as { inject: (opts: InjectOptions | string) => unknown }).inject = (opts: InjectOptions | string) => {
    const o: InjectOptions = typeof opts === 'string' ? { url: opts } : opts;
    return raw({ ...o, headers: { ...sessionHeaders(session), ...(o.headers ?? {}) } });
  };
  return session;
}
