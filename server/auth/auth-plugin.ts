/**
 * Accounts on the service: opens the store (shared as `scenarioStore`), a session cookie
 * (@fastify/cookie + @fastify/session, sessions kept in the SQLite store; HttpOnly, SameSite=Strict,
 * Secure when DRYDIG_SECURE_COOKIE=1, i.e. behind TLS), the sign-in routes under /api/v1/auth and `requireAccount`, the guard the
 * storage routes install. Writes with a session need the session's CSRF token in `x-drydig-csrf`.
 */
import type { FastifyInstance, FastifyRequest } from 'fastify';
import fp from 'fastify-plugin';
import fastifyCookie from '@fastify/cookie';
import fastifySession from '@fastify/session';
import { Type, type Static } from '@sinclair/typebox';
import { randomBytes, timingSafeEqual } from 'node:crypto';
import { DrydigError } from '../../shared/schema';
import { hashShareToken, isTokenShaped, openScenarioStore, type ScenarioStore, type UserRecord } from '../storage';
import { hashPassword, MIN_PASSWORD_LENGTH, verifyPassword } from './passwords';
import { canWrite } from './roles';

declare module 'fastify' {
  interface Session {
    userId?: number;
    csrf?: string;
  }
  interface FastifyRequest {
    /** The signed-in user, set by `requireAccount`. */
    drydigUser?: UserRecord;
  }
  interface FastifyInstance {
    scenarioStore: ScenarioStore;
  }
}

export const SESSION_COOKIE = 'drydig_session';
export const CSRF_HEADER = 'x-drydig-csrf';
/** Sessions last 12 hours (a working day), then sign in again. */
export const SESSION_MAX_AGE_MS = 12 * 3600 * 1000;
/** Sign-in attempts per client address per minute. */
export const LOGIN_MAX_PER_MINUTE = 10;

export interface AuthOptions {
  dataDir: string;
  /** An already-open store (tests). */
  store?: ScenarioStore;
  /** Mark the cookie Secure (sent over https only): set when served behind TLS. Default: DRYDIG_SECURE_COOKIE=1. */
  secureCookie?: boolean;
}

const Username = Type.String({ minLength: 1, maxLength: 64, pattern: '^[A-Za-z0-9._@-]+$' });
const LoginBody = Type.Object({ username: Username, password: Type.String({ minLength: 1, maxLength: 1024 }) }, { additionalProperties: false });
const SetupBody = Type.Object(
  { token: Type.String({ maxLength: 100 }), username: Username, password: Type.String({ minLength: MIN_PASSWORD_LENGTH, maxLength: 1024 }) },
  { additionalProperties: false },
);

function sameText(a: string, b: string): boolean {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && timingSafeEqual(x, y);
}

const signInRequired = () => new DrydigError('DRYDIG_ERR_SIGN_IN_REQUIRED', 'this route needs a signed-in account; sign in first (POST /api/v1/auth/login)');

/** The user of the request's session, or undefined (disabled accounts count as signed out). */
function sessionUser(request: FastifyRequest, store: ScenarioStore): UserRecord | undefined {
  const userId = request.session?.userId;
  if (userId === undefined) return undefined;
  const user = store.accounts.getUser(userId);
  return user && user.disabledAt === null ? user : undefined;
}

/** Guard of the storage routes: a session (401), a role that may write (403), the CSRF token (403). */
export function requireAccount(store: ScenarioStore) {
  return async (request: FastifyRequest): Promise<void> => {
    const user = sessionUser(request, store);
    if (!user) throw signInRequired();
    request.drydigUser = user;
    if (request.method === 'GET' || request.method === 'HEAD') return;
    if (!canWrite(user.role))
      throw new DrydigError('DRYDIG_ERR_ROLE_FORBIDDEN', `the account "${user.username}" has the ${user.role} role, which can read but not change stored data`);
    const sent = request.headers[CSRF_HEADER];
    if (typeof sent !== 'string' || !request.session.csrf || !sameText(sent, request.session.csrf))
      throw new DrydigError('DRYDIG_ERR_CSRF', `writes need the ${CSRF_HEADER} header of your session (from GET /api/v1/auth/session)`);
  };
}

/** Who did it, for the audit trail. */
export function actorOf(request: FastifyRequest): string {
  return request.drydigUser?.username ?? 'unknown';
}

function sessionAnswer(user: UserRecord, csrf: string) {
  return { user: { username: user.username, role: user.role }, csrfToken: csrf };
}

async function startSession(request: FastifyRequest, user: UserRecord): Promise<string> {
  await request.session.regenerate();
  const csrf = randomBytes(32).toString('base64url');
  request.session.userId = user.userId;
  request.session.csrf = csrf;
  return csrf;
}

const authRoutes = async (app: FastifyInstance, opts: { store: ScenarioStore }) => {
  const { store } = opts;
  app.post<{ Body: Static<typeof LoginBody> }>(
    '/auth/login',
    { bodyLimit: 8 * 1024, schema: { summary: 'Sign in', description: `User name and password; sets the HttpOnly session cookie and answers the CSRF token for writes. ${LOGIN_MAX_PER_MINUTE} attempts per minute per client; every attempt is logged.`, tags: ['auth'], body: LoginBody }, config: { rateLimit: { max: LOGIN_MAX_PER_MINUTE, timeWindow: 60_000 } } },
    async (request) => {
      const found = store.accounts.findUser(request.body.username);
      const ok = (await verifyPassword(found?.passwordHash, request.body.password)) && found !== undefined && found.disabledAt === null;
      request.log.info({ event: 'sign-in', username: request.body.username, ok, ip: request.ip }, ok ? 'sign-in succeeded' : 'sign-in refused');
      if (!ok || !found) throw new DrydigError('DRYDIG_ERR_SIGN_IN_FAILED', 'user name or password is wrong, or the account is disabled');
      const { passwordHash: _h, ...user } = found;
      return sessionAnswer(user, await startSession(request, user));
    },
  );
  app.post('/auth/logout', { schema: { summary: 'Sign out', description: 'Ends the session.', tags: ['auth'] } }, async (request, reply) => {
    if (request.session.userId !== undefined && request.session.csrf && !sameText(String(request.headers[CSRF_HEADER] ?? ''), request.session.csrf))
      throw new DrydigError('DRYDIG_ERR_CSRF', `sign-out needs the ${CSRF_HEADER} header of your session`);
    await request.session.destroy();
    return reply.code(204).send();
  });
  app.get('/auth/session', { schema: { summary: 'The signed-in account', description: 'User, role and the CSRF token for writes; 401 when signed out. `setupOpen` tells a client that no account exists yet.', tags: ['auth'] } }, async (request, reply) => {
    const user = sessionUser(request, store);
    if (!user || !request.session.csrf) {
      const row = { error: { code: 'DRYDIG_ERR_SIGN_IN_REQUIRED', message: 'not signed in' }, setupOpen: store.accounts.countUsers() === 0 };
      return reply.code(401).send(row);
    }
    return sessionAnswer(user, request.session.csrf);
  });
  app.post<{ Body: Static<typeof SetupBody> }>(
    '/auth/setup',
    { bodyLimit: 8 * 1024, schema: { summary: 'Make the first admin account (one-time setup link)', description: 'Works once, with the token the service printed on its console at first start, and only while no account exists.', tags: ['auth'], body: SetupBody }, config: { rateLimit: { max: LOGIN_MAX_PER_MINUTE, timeWindow: 60_000 } } },
    async (request, reply) => {
      const { token, username, password } = request.body;
      const ok = isTokenShaped(token) && store.accounts.consumeSetupToken(hashShareToken(token));
      request.log.info({ event: 'setup', username, ok, ip: request.ip }, ok ? 'first admin account made' : 'setup link refused');
      if (!ok) throw new DrydigError('DRYDIG_ERR_SETUP_LINK_INVALID', 'this setup link was already used or is not valid');
      const user = store.accounts.addUser({ username, role: 'admin', passwordHash: await hashPassword(password) });
      store.accounts.appendAudit({ actor: username, action: 'account-made', scenarioId: null, revision: null, detail: 'first admin, through the setup link' });
      return reply.code(201).send(sessionAnswer(user, await startSession(request, user)));
    },
  );
};

/** Opens the store, installs cookie + session and the /auth routes. Register before the storage routes. */
export const authPlugin = fp<AuthOptions & { prefix?: string }>(
  async (app, opts) => {
    const store = opts.store ?? openScenarioStore(opts.dataDir);
    app.decorate('scenarioStore', store);
    app.addHook('onClose', async () => {
      if (!opts.store) await store.close();
    });
    await app.register(fastifyCookie);
    await app.register(fastifySession, {
      secret: store.accounts.sessionSecret(),
      cookieName: SESSION_COOKIE,
      saveUninitialized: false,
      cookie: { httpOnly: true, sameSite: 'strict', secure: opts.secureCookie ?? process.env.DRYDIG_SECURE_COOKIE === '1', path: '/', maxAge: SESSION_MAX_AGE_MS },
      store: {
        get(sid, callback) {
          try {
            const data = store.accounts.getSession(sid);
            callback(null, data === undefined ? null : JSON.parse(data));
          } catch (error) {
            callback(error as Error);
          }
        },
        set(sid, session, callback) {
          try {
            store.accounts.setSession(sid, JSON.stringify(session), Date.now() + SESSION_MAX_AGE_MS);
            callback();
          } catch (error) {
            callback(error as Error);
          }
        },
        destroy(sid, callback) {
          try {
            store.accounts.destroySession(sid);
            callback();
          } catch (error) {
            callback(error as Error);
          }
        },
      },
    });
    await app.register(authRoutes, { prefix: opts.prefix ?? '', store });
  },
  { name: 'drydig-auth', fastify: '5.x' },
);

