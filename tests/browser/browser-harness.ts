/**
 * Shared set-up of the browser tests: the real server in-process (`buildApp` serving the built
 * client from `client/dist`, storage in memory) on 127.0.0.1 and a random port, and Debian's
 * Chromium driven by playwright-core, headless. Screenshots go under `artifacts/browser/`.
 */
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import type { FastifyInstance } from 'fastify';
import { afterAll, beforeAll } from 'vitest';
import { buildApp } from '../../server/app';
import { hashPassword } from '../../server/auth';

export const ARTIFACTS_DIR = path.resolve('artifacts/browser');

/** A running server and browser page. */
export interface BrowserSession {
  url: string;
  page: Page;
  browser: Browser;
  app: FastifyInstance;
  /** Page errors and console errors seen so far (a test asserts there are none). */
  errors: string[];
  screenshot(name: string): Promise<string>;
  close(): Promise<void>;
}

/** Chromium flags for a quiet, sandbox-free headless run in CI (no GPU, no background traffic). */
const CHROMIUM_ARGS = ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--no-first-run'];

/** Launches Debian's Chromium headless with the flags every browser test uses. */
export function launchChromium(): Promise<Browser> {
  return chromium.launch({ executablePath: '/usr/bin/chromium', headless: true, args: CHROMIUM_ARGS });
}

/** The real app listening on 127.0.0.1 and a random port. */
export interface TestServer {
  app: FastifyInstance;
  /** `http://127.0.0.1:<port>` without a trailing slash. */
  origin: string;
}

/** Starts `buildApp` with storage in memory, serving the built client from `clientDir`. */
export async function startServer(options: { clientDir: string }): Promise<TestServer> {
  const app = await buildApp({ clientDir: options.clientDir, dataDir: ':memory:' });
  await app.listen({ host: '127.0.0.1', port: 0 });
  const address = app.server.address();
  const port = typeof address === 'object' && address ? address.port : 0;
  return { app, origin: `http://127.0.0.1:${port}` };
}

/**
 * Records page errors and console errors into `errors`, and aborts (and records) any request
 * leaving 127.0.0.1: there is no internet, so everything must be bundled.
 */
export async function watchPage(page: Page, errors: string[]): Promise<void> {
  page.on('pageerror', (e) => errors.push(`pageerror: ${e.message}`));
  page.on('console', (m) => {
    if (m.type() === 'error') errors.push(`console: ${m.text()}`);
  });
  await page.route('**/*', (route) => {
    const u = new URL(route.request().url());
    if (u.hostname === '127.0.0.1' || u.protocol === 'data:' || u.protocol === 'blob:') return route.continue();
    errors.push(`external request: ${u.href}`);
    return route.abort();
  });
}

/** The password of the designer accounts the browser tests sign in with. */
export const BROWSER_TEST_PASSWORD = 'correct-horse-battery-staple';
let browserAccounts = 0;

/**
 * Makes a designer account in the app's store and signs a browser context in through the real
 * login route, so the Store tab and every storage call carry the session cookie. Returns the
 * CSRF token that writes made with `context.request` must send as `x-drydig-csrf`.
 */
export async function signInContext(app: FastifyInstance, context: BrowserContext, origin: string): Promise<string> {
  const username = `browser-designer-${++browserAccounts}`;
  app.scenarioStore.accounts.addUser({ username, role: 'designer', passwordHash: await hashPassword(BROWSER_TEST_PASSWORD) });
  const res = await context.request.post(`${origin}/api/v1/auth/login`, { data: { username, password: BROWSER_TEST_PASSWORD } });
  if (!res.ok()) throw new Error(`browser test sign-in failed: ${res.status()} ${await res.text()}`);
  return ((await res.json()) as { csrfToken: string }).csrfToken;
}

/** Signs the page's browser context in (see `signInContext`). */
export async function signInBrowser(app: FastifyInstance, page: Page, origin: string): Promise<string> {
  return signInContext(app, page.context(), origin);
}

/** Starts the server and a page at `/`, waiting until the first field is on the map. */
export async function openPlanMap(options: { viewport?: { width: number; height: number } } = {}): Promise<BrowserSession> {
  const { app, origin } = await startServer({ clientDir: 'client/dist' });
  const url = `${origin}/`;
  const browser = await launchChromium();
  const page = await browser.newPage({ viewport: options.viewport ?? { width: 1440, height: 900 }, deviceScaleFactor: 1 });
  const errors: string[] = [];
  await watchPage(page, errors);
  await signInBrowser(app, page, origin);
  await page.goto(url);
  await waitForField(page);
  mkdirSync(ARTIFACTS_DIR, { recursive: true });
  return {
    url, page, browser, app, errors,
    async screenshot(name) {
      const file = path.join(ARTIFACTS_DIR, `${name}.png`);
      await page.screenshot({ path: file });
      return file;
    },
    async close() {
      await browser.close();
      await app.close();
    },
  };
}

/**
 * Registers `beforeAll`/`afterAll` hooks that open the plan map once for the test file (hook
 * timeout from vitest.config.ts) and close it afterwards; `onOpen` receives the session.
 */
export function usePlanMap(onOpen: (session: BrowserSession) => void): void {
  let session: BrowserSession | undefined;
  beforeAll(async () => {
    session = await openPlanMap();
    onOpen(session);
  });
  afterAll(async () => {
    await session?.close();
  });
}

/** Selects a demo in the header and waits until its field has settled. */
export async function loadDemo(page: Page, key: 'wellpoints' | 'deepwells' | 'clayplug' | 'neighbours'): Promise<void> {
  const before = await fieldsDrawn(page);
  await page.selectOption('select[name="demo"]', key);
  await settle(page, before);
}

/** Clicks the map at a site point (site coordinates, m). */
export async function clickSite(page: Page, x: number, y: number): Promise<void> {
  const q = await pagePoint(page, x, y);
  await page.mouse.click(q.x, q.y);
}

/** Waits until a field result has been drawn and no fine computation is pending. */
export async function waitForField(page: Page, afterCount = 0, timeout_ms = 30_000): Promise<void> {
  await page.waitForFunction(
    (n) => {
      const h = (window as unknown as { __drydig?: { fieldsDrawn: number; busy(): boolean } }).__drydig;
      return !!h && h.fieldsDrawn > n && !h.busy();
    },
    afterCount,
    { timeout: timeout_ms, polling: 50 },
  );
}

/** Number of field results drawn so far. */
export async function fieldsDrawn(page: Page): Promise<number> {
  return page.evaluate(() => (window as unknown as { __drydig: { fieldsDrawn: number } }).__drydig.fieldsDrawn);
}

/** Page position of a site point (from the read-only test hook). */
export async function pagePoint(page: Page, x: number, y: number): Promise<{ x: number; y: number }> {
  const p = await page.evaluate(([a, b]) => (window as unknown as { __drydig: { pagePoint(x: number, y: number): { x: number; y: number } | null } }).__drydig.pagePoint(a!, b!), [x, y]);
  if (!p) throw new Error('map not ready');
  return p;
}

/** Waits until the computation settles after an action (a new fine field is drawn). */
export async function settle(page: Page, before: number): Promise<void> {
  await waitForField(page, before);
  // One more quiet period: a coarse result may be followed by the fine one.
  await page.waitForTimeout(250);
  await waitForField(page, 0);
}
