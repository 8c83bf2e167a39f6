/**
 * <seepage-panel> (the Section tab) in a real browser against the real server: a sheet-pile
 * half-section across the deep-well demo's basement solved in the engine worker, the section drawn
 * with its flow net, the toe sweep as a chart and a table, the options compared, a bad level
 * refused naming its field, and the floor profile exported as CSV. Screenshots under
 * artifacts/browser/.
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

describe('<seepage-panel>', () => {
  it('solves the basement’s sheet-pile section and draws the flow net, the toe sweep and the comparison', async () => {
    await loadDemo(page, 'deepwells');
    await page.click('button[name="tab-section"]');
    await page.fill('seepage-panel input[name="seepage-toe"]', '1');
    await page.locator('seepage-panel input[name="seepage-toe"]').dispatchEvent('change');
    await page.click('seepage-panel button[name="seepage-solve"]');
    await page.waitForSelector('seepage-panel tr[data-sweep-row]', { timeout: 90_000 });
    const flowLines = await page.locator('seepage-panel path.dd-seepage-flowlines').getAttribute('d');
    const equipotentials = await page.locator('seepage-panel path.dd-seepage-equipotentials').getAttribute('d');
    expect((flowLines ?? '').split('M').length).toBeGreaterThan(50);
    expect((equipotentials ?? '').split('M').length).toBeGreaterThan(50);
    expect(await page.locator('seepage-panel line.dd-seepage-wall').count()).toBe(1);
    expect(await page.locator('seepage-panel [data-seepage="flow"]').innerText()).toMatch(/^[\d.]+ L\/s per m$/);
    expect(await page.locator('seepage-panel [data-seepage="exit"]').innerText()).toMatch(/FS [\d.]+/);
    expect(await page.locator('seepage-panel [data-seepage="heave"]').innerText()).toMatch(/FS [\d.]+/);
    expect(await page.locator('seepage-panel tr[data-sweep-row]').count()).toBe(5);
    expect(await page.locator('seepage-panel tr[data-compare-row]').count()).toBe(4);
    expect(await page.locator('seepage-panel svg.dd-seepage-sweep polyline').count()).toBe(2);
    // Deeper toes pass less water: the sweep's flows fall row by row.
    const flows = await page.locator('seepage-panel tr[data-sweep-row] td:nth-child(2)').allInnerTexts();
    for (let n = 1; n < flows.length; n++) expect(Number(flows[n])).toBeLessThan(Number(flows[n - 1]));
    expect(await page.locator('seepage-panel .dd-caution').innerText()).toMatch(/licensed/);
    await page.locator('seepage-panel seepage-drawing').scrollIntoViewIfNeeded();
    await s.screenshot('seepage-panel-section');
    await page.locator('seepage-panel table.dd-seepage-compare').scrollIntoViewIfNeeded();
    await s.screenshot('seepage-panel-sweep');
    expect(s.errors).toEqual([]);
  }, 120_000);

  it('refuses a level that is not a number, naming the field', async () => {
    await page.fill('seepage-panel input[name="seepage-outside"]', 'high');
    await page.locator('seepage-panel input[name="seepage-outside"]').dispatchEvent('change');
    await page.click('seepage-panel button[name="seepage-solve"]');
    expect(await page.locator('seepage-panel .dd-issues').innerText()).toMatch(/^Outside water level: must be a level/);
    await page.fill('seepage-panel input[name="seepage-outside"]', '');
    await page.locator('seepage-panel input[name="seepage-outside"]').dispatchEvent('change');
  });

  it('exports the floor profile as CSV', async () => {
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('seepage-panel button[name="seepage-csv"]')]);
    const stream = await download.createReadStream();
    let text = '';
    for await (const chunk of stream) text += String(chunk);
    expect(text.split('\r\n')[0]).toBe('x_m,floor_level_m,head_m,pressure_kPa,exit_gradient,critical_gradient,fs');
    expect(text).toMatch(/\r\ncaution,/);
  });
});
