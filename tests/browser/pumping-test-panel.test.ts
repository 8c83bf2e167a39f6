/**
 * <pumping-test-panel> in a real browser against the real server (via the shared browser
 * harness): import the demo readings CSV, see the fits and the plots, apply the Theis fit to the
 * scenario (K = T / b), and undo it. Needs the built client (npm run build). Screenshots under
 * artifacts/browser/.
 */
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { loadDemo, usePlanMap, type BrowserSession } from './browser-harness';

let s: BrowserSession;
let page: Page;
const demoCsv = fileURLToPath(new URL('../../fixtures/pumping-tests/demo-constant-rate.csv', import.meta.url));

usePlanMap((session) => {
  s = session;
  page = session.page;
});

describe('<pumping-test-panel>', () => {
  it('imports a readings CSV, fits the methods and draws the readings against the fitted curve', async () => {
    await loadDemo(page, 'deepwells');
    await page.click('button[name="tab-test"]');
    await page.setInputFiles('pumping-test-panel input[name="test-file"]', demoCsv);
    await page.waitForSelector('pumping-test-panel [data-test="file-name"]');
    await page.fill('pumping-test-panel input[name="test-rate"]', '9');
    await page.locator('pumping-test-panel input[name="test-rate"]').dispatchEvent('change');
    await page.fill('pumping-test-panel input[name="test-stop"]', '48');
    await page.locator('pumping-test-panel input[name="test-stop"]').dispatchEvent('change');
    await page.click('pumping-test-panel button[name="test-analyse"]');
    await page.waitForSelector('pumping-test-panel [data-test="fits"]', { timeout: 30_000 });
    const methods = await page.locator('pumping-test-panel [data-test="fits"] tbody tr').evaluateAll((rows) => rows.map((r) => r.getAttribute('data-method')));
    expect(methods).toEqual(expect.arrayContaining(['theis', 'cooper-jacob', 'hantush', 'recovery']));
    // The invented demo test was made with T = 2.4e-3 m²/s: the Theis fit finds it within 2 %.
    const value = Number(await page.locator('pumping-test-panel tr[data-method="theis"] [data-test="T"]').getAttribute('data-value'));
    expect(Math.abs(value - 2.4e-3) / 2.4e-3).toBeLessThan(0.02);
    expect(await page.locator('pumping-test-panel svg.dd-test-chart path.dd-test-curve').count()).toBeGreaterThan(0);
    expect(await page.locator('pumping-test-panel svg.dd-test-chart .dd-test-mark').count()).toBeGreaterThan(50);
    expect(await page.locator('pumping-test-panel .dd-caution').innerText()).toMatch(/licensed engineer/);
    await s.screenshot('pumping-test-fits');
    await page.click('pumping-test-panel button[name="test-view-semi-log"]');
    await page.locator('pumping-test-panel input[name="test-fit"]').nth(1).check();
    await page.waitForSelector('pumping-test-panel svg.dd-test-chart path.dd-test-line');
    await s.screenshot('pumping-test-semi-log');
    await page.locator('pumping-test-panel tr[data-method="recovery"] input[name="test-fit"]').first().check();
    await page.waitForSelector('pumping-test-panel svg.dd-test-chart[data-view="recovery"] path.dd-test-line');
    await s.screenshot('pumping-test-recovery');
    expect(s.errors).toEqual([]);
  }, 90_000);

  it('applies the Theis fit to the scenario as K = T / b and undoes it', async () => {
    // The fits stay while the designer looks at another tab.
    await page.click('button[name="tab-ground"]');
    await page.click('button[name="tab-test"]');
    await page.locator('pumping-test-panel tr[data-method="theis"] button[name="test-apply"]').click();
    expect(await page.locator('pumping-test-panel [data-test="test-applied"]').innerText()).toMatch(/K = T \/ b = .* m\/s/);
    const applied = await page.evaluate(() => (document.querySelector('drydig-app') as unknown as { scenario: { aquifer: { conductivity_m_s: number }; pumpingTest?: { conductivityInterval_m_s?: number[] } } }).scenario);
    expect(applied.pumpingTest?.conductivityInterval_m_s).toHaveLength(2);
    await page.keyboard.press('Control+z');
    const undone = await page.evaluate(() => (document.querySelector('drydig-app') as unknown as { scenario: { pumpingTest?: unknown } }).scenario);
    expect(undone.pumpingTest).toBeUndefined();
    expect(s.errors).toEqual([]);
  }, 60_000);

  it('shows Hazen’s grain-size estimate of K beside the scenario’s K, with its constant', async () => {
    await page.click('pumping-test-panel details:has(h3:text("Grain-size estimate")) summary');
    await page.fill('pumping-test-panel input[name="hazen-d10"]', '0.2');
    // Hazen: K [cm/s] ≈ C·d10² [cm], C = 100 (the constant the engine names): 100 × 0.02² = 0.04 cm/s = 4×10⁻⁴ m/s.
    expect(await page.locator('pumping-test-panel [data-test="hazen"]').innerText()).toMatch(/^Hazen K ≈ C·d10² = 4(\.0)?\s*×\s*10⁻⁴\s*m\/s \(C = 100\) beside the scenario’s K = .+\sm\/s\.$/);
  }, 60_000);

  it('names the bad line of a broken readings file in plain words', async () => {
    await page.click('pumping-test-panel details summary');
    await page.fill('pumping-test-panel textarea[name="test-csv"]', 'time_s,drawdown_m\n60,0.1\n120,abc\n');
    await page.locator('pumping-test-panel textarea[name="test-csv"]').dispatchEvent('change');
    await page.fill('pumping-test-panel input[name="test-distance"]', '10');
    await page.locator('pumping-test-panel input[name="test-distance"]').dispatchEvent('change');
    await page.click('pumping-test-panel button[name="test-analyse"]');
    await page.waitForSelector('pumping-test-panel [data-test="test-error"]');
    expect(await page.locator('pumping-test-panel [data-test="test-error"]').innerText()).toMatch(/^Readings: 1 bad row\(s\): line 3: drawdown "abc" is not a number/);
  }, 60_000);
});
