/**
 * The pit-floor check in a real browser: the clay-plug demo's design shows that uplift of the
 * plug governs, its factor of safety (1.29, with the pit's margin kept below the allowable level) against the required 1.111, the time from a power failure
 * until the floor is unsafe, and the safe-dig chart and table. Screenshot under artifacts/browser/.
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

describe('<floor-check-view>', () => {
  it('shows the governing uplift check, its factor of safety and the safe-dig chart for the clay-plug demo', async () => {
    await loadDemo(page, 'clayplug');
    await page.click('button[name="tab-design"]');
    await page.click('design-panel input[name="design-mode"][value="optimal"]');
    await page.click('design-panel button[name="run-design"]');
    await page.waitForSelector('design-panel .dd-design-verdict', { timeout: 90_000 });
    const section = page.locator('floor-check-view .dd-floor-check[data-excavation="basement"]');
    expect(await section.getAttribute('data-governing')).toBe('uplift');
    expect(await section.locator('h4').first().innerText()).toMatch(/uplift of the plug/);
    // The 0.5 m margin is kept below the allowable level 8.578 m: FS = 39 / (9.81 · (8.078 − 5)) = 1.292 (hand).
    expect(await section.locator('[data-fs]').first().innerText()).toMatch(/^1\.29\d$/);
    expect(await section.innerText()).toMatch(/required 1\.111/);
    expect(await section.locator('[data-time-to-unsafe]').innerText()).toMatch(/\d/);
    expect(await section.locator('svg.dd-safe-dig-chart path.dd-safe-dig-line').count()).toBe(1);
    expect(await section.locator('.dd-safe-dig-table tbody tr').count()).toBeGreaterThan(5);
    expect(await page.locator('design-panel .dd-caution').innerText()).toMatch(/licensed engineer/);
    await section.scrollIntoViewIfNeeded();
    await s.screenshot('floor-check-clay-plug');
    expect(s.errors).toEqual([]);
  }, 120_000);

  it('gives no "back at formation" figure where the design holds the head above formation, and says why', async () => {
    // Before: "back at formation level after 0 s … standby pumps and power must take over".
    const badge = page.locator('design-panel .dd-badge[data-excavation="basement"] [data-recovery]');
    expect(await badge.innerText()).toMatch(/no figure — the design holds the head above formation/);
    const note = await page.locator('design-panel .dd-chart-note').innerText();
    expect(note).toMatch(/^Back at formation level: no figure/);
    expect(note).not.toMatch(/after 0 s|must take over/);
    await page.locator('design-panel .dd-chart-note').scrollIntoViewIfNeeded();
    await s.screenshot('floor-check-clay-plug-recovery');
  });
});
