/**
 * <scenario-store-panel> in a real browser: two tabs edit one stored scenario; the second save is
 * refused with the conflict shown (who saved what, when), and "load theirs" brings the newer
 * revision into the editor. A small test page (site-view-panel-page/) stands in for the editor.
 */
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { build } from 'vite';
import type { Browser, Page } from 'playwright-core';
import type { FastifyInstance } from 'fastify';
import { ARTIFACTS_DIR, launchChromium, signInContext, startServer } from './browser-harness';

const PAGE_DIR = path.resolve('tests/browser/site-view-panel-page');
const OUT_DIR = path.resolve('artifacts/site-view-panel-dist');
const SCREENSHOTS = ARTIFACTS_DIR;

let app: FastifyInstance;
let browser: Browser;
let origin: string;

beforeAll(async () => {
  await build({ root: PAGE_DIR, base: './', logLevel: 'warn', configFile: false, build: { outDir: OUT_DIR, emptyOutDir: true, assetsInlineLimit: 0 } });
  ({ app, origin } = await startServer({ clientDir: OUT_DIR }));
  browser = await launchChromium();
  mkdirSync(SCREENSHOTS, { recursive: true });
});

afterAll(async () => {
  await browser?.close();
  await app?.close();
});

async function rename(page: Page, name: string): Promise<void> {
  await page.locator('#name').fill(name);
  await page.locator('#apply').click();
}

describe('<scenario-store-panel> in two tabs', () => {
  it('shows the conflict when the second tab saves on an old revision, and loads the newer one', async () => {
    const context = await browser.newContext({ viewport: { width: 900, height: 900 } });
    await signInContext(app, context, origin);
    const errors: string[] = [];
    const tabA = await context.newPage();
    const tabB = await context.newPage();
    for (const tab of [tabA, tabB]) {
      tab.on('pageerror', (e) => errors.push(e.message));
      tab.on('console', (m) => { if (m.type() === 'error' && !m.text().includes('409')) errors.push(m.text()); });
      await tab.goto(`${origin}/`);
    }
    const panelA = tabA.locator('scenario-store-panel');
    const panelB = tabB.locator('scenario-store-panel');

    await panelA.locator('input[name="savedBy"]').fill('tab A');
    await panelA.getByRole('button', { name: 'Store on server', exact: true }).click();
    await panelA.getByText('Saved as revision 1').waitFor();

    await panelB.getByRole('button', { name: 'List' }).click();
    await panelB.getByRole('button', { name: 'Open' }).first().click();
    await panelB.getByText('Opened revision 1').waitFor();

    await rename(tabA, 'Ferry Road basement — tab A layout');
    await panelA.getByRole('button', { name: 'Store new revision' }).click();
    await panelA.getByText('Saved as revision 2').waitFor();

    await rename(tabB, 'Ferry Road basement — tab B layout');
    await panelB.locator('input[name="savedBy"]').fill('tab B');
    await panelB.getByRole('button', { name: 'Store new revision' }).click();
    const conflict = panelB.locator('.conflict');
    await conflict.waitFor();
    const text = await conflict.innerText();
    expect(text).toContain('Not saved: someone saved first.');
    expect(text).toContain('Revision 2 was saved');
    expect(text).toContain('by tab A');
    expect(text).toContain('renamed');
    expect(text).toContain('Your edit started from revision 1');
    await tabB.screenshot({ path: path.join(SCREENSHOTS, 'site-view-store-panel-conflict.png') });

    await conflict.getByRole('button', { name: 'Load revision 2 (theirs)' }).click();
    await tabB.locator('#loaded', { hasText: 'tab A layout' }).waitFor();
    expect(await panelB.locator('.conflict').count()).toBe(0);

    const stored = (await (await tabB.request.get(`${origin}/api/v1/scenarios`)).json()) as { scenarios: Array<{ latestRevision: number; name: string }> };
    expect(stored.scenarios).toEqual([expect.objectContaining({ latestRevision: 2, name: 'Ferry Road basement — tab A layout' })]);
    expect(errors).toEqual([]);
    await context.close();
  });
});
