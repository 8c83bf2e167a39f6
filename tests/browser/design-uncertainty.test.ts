/**
 * The Design tab's Unknowns (issue 11 items 1–3) in a real browser against the real server: the
 * sensitivity table and its chart, a Monte Carlo run as a job with its progress bar (and the
 * histogram when done), the robust one-well-out design, and Cancel stopping a long run. Needs the
 * built client (npm run build). Screenshots under artifacts/browser/.
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

async function openUnknowns(): Promise<void> {
  await page.click('button[name="tab-design"]');
  const open = await page.locator('design-panel details[data-block="design-unknowns"]').evaluate((d) => (d as HTMLDetailsElement).open);
  if (!open) await page.click('design-panel details[data-block="design-unknowns"] summary');
}

async function fill(name: string, value: string): Promise<void> {
  await page.fill(`design-panel input[name="${name}"]`, value);
  await page.press(`design-panel input[name="${name}"]`, 'Tab');
}

describe('<design-panel> unknowns', () => {
  it('runs the clay-plug demo with a sensitivity table, a Monte Carlo run with progress, and a one-well-out design', async () => {
    await loadDemo(page, 'clayplug');
    await openUnknowns();
    await page.check('design-panel input[name="design-sensitivity"]');
    await fill('design-sensitivityFactors', '1/2, 1, 2');
    await fill('design-runs', '120');
    await fill('design-seed', '7');
    await page.check('design-panel input[name="design-oneWellOut"]');
    await page.click('design-panel button[name="run-design"]');
    // The job's progress: a determinate bar and the stage, e.g. "monte carlo 40/120".
    await page.waitForSelector('design-panel [data-progress-stage]', { timeout: 60_000 });
    await expect.poll(() => page.locator('design-panel [data-progress-stage]').innerText().catch(() => 'monte carlo'), { timeout: 120_000 }).toMatch(/monte carlo \d+\/120/);
    await s.screenshot('design-uncertainty-progress');
    await page.waitForSelector('design-panel .dd-design-verdict', { timeout: 180_000 });

    const rows = page.locator('design-panel table[data-sensitivity] tbody tr');
    expect(await rows.count()).toBe(6); // K and S, three factors each (the demo is transient)
    expect(await page.locator('design-panel tr[data-parameter="conductivity"][data-factor="1"]').innerText()).toMatch(/×1\s+[\d.]+ L\/s.*\syes\s/s);
    // The clay plug's uplift factor of safety is shown for each row.
    expect(await page.locator('design-panel tr[data-parameter="conductivity"][data-factor="2"] td').last().innerText()).toMatch(/^\d\.\d{3}$/);
    expect(await page.locator('design-panel svg.dd-sensitivity-chart circle').count()).toBeGreaterThan(3);
    expect(await page.locator('design-panel [data-probability-met]').innerText()).toMatch(/^\d+\.\d % of realisations$/);
    expect(await page.locator('design-panel [data-p50-p90]').innerText()).toMatch(/L\/s/);
    expect(await page.locator('design-panel svg.dd-histogram rect.dd-hist-bar').count()).toBeGreaterThan(3);
    expect(await page.locator('design-panel table[data-robust] tr[data-kind="one-well-out"]').innerText()).toMatch(/\+[\d.]+ L\/s/);
    await page.locator('design-panel table[data-sensitivity]').scrollIntoViewIfNeeded();
    await s.screenshot('design-uncertainty-sensitivity');
    await page.locator('design-panel svg.dd-histogram').scrollIntoViewIfNeeded();
    await s.screenshot('design-uncertainty-monte-carlo');
    expect(s.errors).toEqual([]);
  }, 300_000);

  it('cancels a long Monte Carlo run from the progress bar', async () => {
    await openUnknowns();
    await page.uncheck('design-panel input[name="design-sensitivity"]');
    await page.uncheck('design-panel input[name="design-oneWellOut"]');
    await fill('design-runs', '5000');
    await page.click('design-panel button[name="run-design"]');
    await page.waitForSelector('design-panel [data-progress-stage]', { timeout: 60_000 });
    await page.click('design-panel button[name="cancel-design"]');
    await expect.poll(() => page.locator('design-panel .dd-error').innerText().catch(() => ''), { timeout: 30_000 }).toMatch(/cancelled/);
    expect(await page.locator('design-panel button[name="run-design"]').isEnabled()).toBe(true);
  }, 120_000);
});
