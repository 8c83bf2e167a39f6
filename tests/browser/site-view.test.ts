/**
 * The site view in a real browser (Debian Chromium, headless, playwright-core): the designer's
 * context saves a scenario and creates a view link; a second browser context (the site team's
 * phone, 390 × 844) opens it and sees the read-only site view with the set-out table, cautions,
 * the monitoring chart and — with geolocation granted — its own position on the plan. An edit link
 * enters a reading. The server is the real app on 127.0.0.1, a random port, storage in memory.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import type { FastifyInstance } from 'fastify';
import { ARTIFACTS_DIR, launchChromium, signInContext, startServer, watchPage } from './browser-harness';
import { signInApp } from '../helpers/sign-in';
import type { Scenario } from '../../shared/schema';

const SCREENSHOTS = ARTIFACTS_DIR;

/** Newest modification time among the site view's sources, ms. */
function newestSourceTime(): number {
  const files = ['client/site.html', ...readdirSync('client/site').map((f) => `client/site/${f}`)];
  return Math.max(...files.map((f) => statSync(f).mtimeMs));
}

/** The built client: client/dist when it is newer than the site view's sources, else a fresh build under artifacts/. */
function builtClientDir(): string {
  const dist = path.resolve('client/dist');
  const page = path.join(dist, 'site.html');
  if (existsSync(page) && readFileSync(page, 'utf8').includes('<site-view>') && statSync(page).mtimeMs >= newestSourceTime()) return dist;
  const out = path.resolve('artifacts/site-view-dist');
  execFileSync('npx', ['vite', 'build', '--config', 'client/vite.config.ts', '--outDir', out, '--emptyOutDir', '--logLevel', 'warn'], { stdio: 'pipe' });
  return out;
}

let app: FastifyInstance;
let browser: Browser;
let origin: string;

beforeAll(async () => {
  ({ app, origin } = await startServer({ clientDir: builtClientDir() }));
  // Storing scenarios and making links needs a signed-in designer (the site team uses the links).
  await signInApp(app, 'designer');
  browser = await launchChromium();
  mkdirSync(SCREENSHOTS, { recursive: true });
});

afterAll(async () => {
  await browser?.close();
  await app?.close();
});

function demoWithMonitoring(): Scenario {
  const s = JSON.parse(readFileSync('fixtures/demo-deepwells-confined.json', 'utf8')) as Scenario;
  const w = s.wells[0]!;
  return { ...s, monitoring: { pumpingStart: '2027-03-01T07:00:00Z', piezometers: [{ id: 'PZ1', x: w.x + 25, y: w.y - 10, label: 'north-east corner' }] } } as Scenario;
}

/** A phone-sized context at the first well's position (WGS 84 from the set-out), watching for errors. */
async function phoneContext(geolocation?: { latitude: number; longitude: number }): Promise<{ context: BrowserContext; page: Page; errors: string[] }> {
  const context = await browser.newContext({
    viewport: { width: 390, height: 844 }, deviceScaleFactor: 2, isMobile: true, hasTouch: true,
    ...(geolocation ? { geolocation: { ...geolocation, accuracy: 4 }, permissions: ['geolocation'] } : {}),
  });
  const page = await context.newPage();
  const errors: string[] = [];
  await watchPage(page, errors);
  return { context, page, errors };
}

describe('the site view', () => {
  it('opens a view link in a second context: read-only, with the set-out table, cautions and GPS position', async () => {
    // The designer's context saves the scenario and makes the link through the API, as the editor does.
    const designer = await browser.newContext();
    const csrf = await signInContext(app, designer, origin);
    const api = designer.request;
    const saved = await api.post(`${origin}/api/v1/scenarios`, { data: { scenario: demoWithMonitoring(), savedBy: 'designer' }, headers: { 'x-drydig-csrf': csrf } });
    expect(saved.status()).toBe(201);
    const { scenarioId } = (await saved.json()) as { scenarioId: string };
    const link = await api.post(`${origin}/api/v1/scenarios/${scenarioId}/links`, { data: { mode: 'view', revision: 1 }, headers: { 'x-drydig-csrf': csrf } });
    const { sitePath } = (await link.json()) as { sitePath: string };
    const setout = (await (await api.get(`${origin}/api/v1/links/${sitePath.split('/').pop()}`)).json()) as { setout: Array<{ latitude_deg: number; longitude_deg: number }> };
    await designer.close();

    const first = setout.setout[0]!;
    const { context, page, errors } = await phoneContext({ latitude: first.latitude_deg, longitude: first.longitude_deg });
    await page.goto(`${origin}${sitePath}`);
    const view = page.locator('site-view');
    await view.locator('table[aria-label="Set-out table"]').waitFor();
    const rows = view.locator('table[aria-label="Set-out table"] tbody tr');
    expect(await rows.count()).toBe(6);
    expect(await rows.first().innerText()).toContain('DW1');
    expect(await rows.first().innerText()).toContain('389194.000');
    expect(await view.locator('.badge').first().innerText()).toContain('view only');
    expect(await view.locator('section.caution').innerText()).toContain('licensed');
    expect(await view.locator('form.reading').count()).toBe(0);
    expect(await view.locator('site-level-chart').count()).toBe(1);

    await view.getByRole('button', { name: 'Show my position' }).click();
    await view.getByText('Nearest well: no. 1 (DW1)').waitFor();
    const note = await view.getByText('Nearest well').innerText();
    const distance = Number(/DW1\), ([0-9.]+) m/.exec(note)?.[1]);
    // The GPS fix is the set-out latitude/longitude of DW1, so proj4's inverse must land within 5 cm.
    expect(distance).toBeLessThan(0.05);
    expect(await view.locator('site-plan').locator('g[aria-label="your position"]').count()).toBe(1);

    await page.screenshot({ path: path.join(SCREENSHOTS, 'site-view-phone.png'), fullPage: true });
    // Writing with this token is refused even if someone crafts the request by hand.
    const token = sitePath.split('/').pop();
    const forged = await page.evaluate(async (t) => (await fetch(`/api/v1/links/${t}/readings`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ piezometerId: 'PZ1', level_m: 1 }) })).status, token);
    expect(forged).toBe(403);
    expect(errors.filter((e) => !e.includes('403'))).toEqual([]);
    await context.close();
  });

  it('lets an edit link enter a reading, which is then plotted and listed', async () => {
    const res = await app.inject({ method: 'POST', url: '/api/v1/scenarios', payload: { scenario: demoWithMonitoring() } });
    const { scenarioId } = res.json() as { scenarioId: string };
    const link = await app.inject({ method: 'POST', url: `/api/v1/scenarios/${scenarioId}/links`, payload: { mode: 'edit' } });
    const { sitePath } = link.json() as { sitePath: string };
    const { context, page, errors } = await phoneContext();
    await page.goto(`${origin}${sitePath}`);
    const view = page.locator('site-view');
    const form = view.locator('form.reading');
    await form.waitFor();
    await form.locator('input[name="level_m"]').fill('7.85');
    await form.locator('input[name="measuredAt"]').fill('2027-03-04T09:30');
    await form.locator('input[name="enteredBy"]').fill('gauger');
    await form.getByRole('button', { name: 'Save reading' }).click();
    await view.getByText('Reading saved.').waitFor();
    const readings = view.locator('table[aria-label="Readings at PZ1"] tbody tr');
    await readings.first().waitFor();
    expect(await readings.count()).toBe(1);
    expect(await readings.first().innerText()).toContain('7.85');
    expect(await view.locator('site-level-chart').locator('circle').count()).toBe(1);
    await page.screenshot({ path: path.join(SCREENSHOTS, 'site-view-edit-reading.png'), fullPage: true });
    expect(errors).toEqual([]);
    await context.close();
  });

  it('explains a revoked or unknown link instead of showing a blank page', async () => {
    const { context, page } = await phoneContext();
    await page.goto(`${origin}/site/${'A'.repeat(43)}`);
    await page.locator('site-view .error').waitFor();
    expect(await page.locator('site-view .error').innerText()).toContain('no share link matches this address');
    await context.close();
  });
});
