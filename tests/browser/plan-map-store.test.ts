/**
 * The Store tab of the plan map in a real browser (own server on 127.0.0.1, Debian's Chromium):
 * save the scenario being edited, keep the stored revision across tab switches, make a view link
 * and open it in a second browser context as the site team would, and let go of the stored
 * scenario when another document is opened.
 */
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { loadDemo, usePlanMap, type BrowserSession } from './browser-harness';

let s: BrowserSession;
let page: Page;

usePlanMap((session) => {
  s = session;
  page = session.page;
});

const panel = () => page.locator('scenario-store-panel');

describe('the Store tab', () => {
  it('saves the scenario as revision 1 and still knows it after a tab switch', async () => {
    await page.click('button[name="tab-store"]');
    await panel().locator('input[name="savedBy"]').fill('desk designer');
    await panel().locator('input[name="note"]').fill('first issue for pricing');
    await panel().getByRole('button', { name: 'Store on server', exact: true }).click();
    await expect.poll(() => panel().locator('.status').first().innerText()).toMatch(/Stored, showing revision 1/);
    expect(await page.locator('caution-note').last().innerText()).toMatch(/licensed engineer/);
    await s.screenshot('store-saved');
    await page.click('button[name="tab-design"]');
    await page.click('button[name="tab-store"]');
    expect(await panel().locator('.status').first().innerText()).toMatch(/Stored, showing revision 1/);
  });

  it('makes a view link that opens the read-only site view with the set-out table in a second context', async () => {
    await panel().getByRole('button', { name: 'Make link' }).click();
    const code = panel().locator('code').first();
    await code.waitFor();
    const url = await code.innerText();
    expect(url).toMatch(/\/site\/[A-Za-z0-9_-]{43}$/);
    const context = await s.browser.newContext({ viewport: { width: 390, height: 844 } });
    try {
      const site = await context.newPage();
      await site.goto(new URL(url, s.url).href);
      const view = site.locator('site-view');
      await view.locator('table[aria-label="Set-out table"]').waitFor({ timeout: 30_000 });
      const rows = view.locator('table[aria-label="Set-out table"] tbody tr');
      expect(await rows.count()).toBe(66); // the well-point demo's 66 well points
      expect(await rows.first().innerText()).toContain('WP01');
      expect(await view.locator('form.reading').count()).toBe(0); // a view link cannot enter readings
      expect(await view.locator('section.caution').innerText()).toContain('licensed');
    } finally {
      await context.close();
    }
  }, 60_000);

  it('lets go of the stored scenario when another demo is opened, so the next save stores it anew', async () => {
    await loadDemo(page, 'deepwells');
    await page.click('button[name="tab-store"]');
    expect(await panel().locator('.status').first().innerText()).toMatch(/Not stored yet/);
    expect(s.errors).toEqual([]);
  }, 60_000);
});
