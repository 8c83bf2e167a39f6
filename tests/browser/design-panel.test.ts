/**
 * <design-panel> in a real browser against the real server (own server on a random 127.0.0.1
 * port, Debian's Chromium headless, via the shared browser harness): run a design, see the
 * verdict, badges, flow, pumps, quick check and the time chart, export CSV, and apply the rates.
 * Needs the built client (npm run build). Screenshots under artifacts/browser/.
 */
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { fieldsDrawn, loadDemo, settle, usePlanMap, type BrowserSession } from './browser-harness';

let s: BrowserSession;
let page: Page;

usePlanMap((session) => {
  s = session;
  page = session.page;
});

describe('<design-panel>', () => {
  it('runs a design for the deep-well demo and shows the summary, the chart and the critical point', async () => {
    await loadDemo(page, 'deepwells');
    await page.click('button[name="tab-design"]');
    await page.click('design-panel input[name="design-mode"][value="optimal"]');
    await page.click('design-panel button[name="run-design"]');
    await page.waitForSelector('design-panel .dd-design-verdict', { timeout: 60_000 });
    expect(await page.locator('design-panel .dd-design-verdict').getAttribute('data-feasible')).toBe('true');
    expect(await page.locator('design-panel .dd-badge[data-excavation="basement"]').innerText()).toMatch(/met, highest level 6\.50 m vs target 6\.50 m/);
    expect(await page.locator('design-panel [data-total]').innerText()).toMatch(/L\/s \(.* m³\/h\)/);
    expect(await page.locator('design-panel [data-quick-check]').first().innerText()).toMatch(/ratio \d/);
    expect(await page.locator('design-panel svg.dd-chart path.dd-curve').count()).toBe(1);
    expect(await page.locator('design-panel svg.dd-chart path.dd-recovery').count()).toBe(1);
    expect(await page.locator('design-panel .dd-chart-note').innerText()).toMatch(/Back at formation level after \d/);
    expect(await page.locator('design-panel .dd-caution').innerText()).toMatch(/licensed engineer/);
    await s.screenshot('design-panel-result');
    await page.locator('design-panel svg.dd-chart').last().scrollIntoViewIfNeeded();
    await s.screenshot('design-panel-chart');
    expect(s.errors).toEqual([]);
  }, 90_000);

  it('exports the design as CSV', async () => {
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('design-panel button[name="export-design-csv"]')]);
    const stream = await download.createReadStream();
    let text = '';
    for await (const chunk of stream) text += String(chunk);
    expect(text.split('\r\n')[0]).toBe('quantity,value,unit');
    expect(text).toMatch(/\r\nfeasible,yes,\r\n/);
  });

  it('shows the design total in gpm after switching to US units, the same flow as in L/s', async () => {
    const si = await page.locator('design-panel [data-total]').innerText();
    const litres_s = Number(/^([\d.]+) L\/s/.exec(si)![1]);
    const before = await fieldsDrawn(page);
    await page.click('button[name="units-us"]');
    await settle(page, before);
    await page.click('button[name="tab-design"]');
    const us = await page.locator('design-panel [data-total]').innerText();
    expect(us).toMatch(/^[\d.]+ gpm$/);
    // 1 US gallon = 3.785411784 L exactly (NIST SP 811); both figures carry 3 significant digits.
    const gpm = Number(/^([\d.]+) gpm/.exec(us)![1]);
    expect(Math.abs(gpm * 3.785411784 / 60 - litres_s) / litres_s).toBeLessThan(0.01);
    expect(await page.locator('design-panel .dd-badge[data-excavation="basement"]').innerText()).toMatch(/highest level \d+\.\d\d ft vs target \d+\.\d\d ft/);
    await s.screenshot('design-panel-us-units');
    const back = await fieldsDrawn(page);
    await page.click('button[name="units-si"]');
    await settle(page, back);
    await page.click('button[name="tab-design"]');
    expect(await page.locator('design-panel [data-total]').innerText()).toMatch(/L\/s \(.* m³\/h\)/);
  });

  it('applies the solved rates to the wells', async () => {
    await page.click('design-panel button[name="apply-rates"]');
    await expect.poll(() => page.locator('.dd-notice').innerText()).toMatch(/Applied design rates to 6 wells/);
  });

  it('shows the reasons when the target cannot be met', async () => {
    await loadDemo(page, 'wellpoints');
    await page.click('button[name="tab-design"]');
    await page.click('design-panel input[name="design-mode"][value="uniform"]');
    // The demo's header sits on a platform at 10.8 m; put it at ground (12 m), where the
    // common-practice 5.5 m suction lift stops the well points at the target itself.
    await page.click('design-panel details.dd-section-block summary');
    expect(await page.locator('design-panel input[name="design-headerLevel_m"]').getAttribute('placeholder')).toBe('10.8 (scenario)');
    await page.fill('design-panel input[name="design-headerLevel_m"]', '12');
    await page.press('design-panel input[name="design-headerLevel_m"]', 'Tab');
    await page.click('design-panel button[name="run-design"]');
    await page.waitForSelector('design-panel .dd-design-verdict[data-feasible="false"]', { timeout: 60_000 });
    expect(await page.locator('design-panel .dd-flag[data-code="suction-lift"]').count()).toBeGreaterThan(0);
    await s.screenshot('design-panel-infeasible');
  }, 90_000);
});
