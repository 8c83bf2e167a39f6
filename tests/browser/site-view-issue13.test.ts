/**
 * The site view as the site team reads it, at 1440 × 900 and on a 390 × 844 phone (issue 13 items
 * 3, 11, 13, 14, 16 and issue 8 item 6): one rate set in the set-out table, the summary and the
 * report; the field's label instead of a JSON pointer; the one plan symbol set; "saved" until
 * someone records the revision as issued for construction; folded cautions, sticky well ids and a
 * zoomable plan with readable labels on the phone; and the pit-floor check with its cautions.
 * Screenshots: artifacts/browser/issue13-*.png and issue8-item6-*.png.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import type { FastifyInstance } from 'fastify';
import { ARTIFACTS_DIR, launchChromium, signInContext, startServer, watchPage } from './browser-harness';
import { signInApp } from '../helpers/sign-in';
import type { Scenario } from '../../shared/schema';

let app: FastifyInstance;
let browser: Browser;
let origin: string;

beforeAll(async () => {
  ({ app, origin } = await startServer({ clientDir: path.resolve('client/dist') }));
  await signInApp(app, 'designer');
  browser = await launchChromium();
});

afterAll(async () => {
  await browser?.close();
  await app?.close();
});

const SIZES = {
  desktop: { viewport: { width: 1440, height: 900 } },
  phone: { viewport: { width: 390, height: 844 }, deviceScaleFactor: 2, isMobile: true, hasTouch: true },
} as const;
type Size = keyof typeof SIZES;

function demo(file: string, withPiezometer = true): Scenario {
  const s = JSON.parse(readFileSync(`fixtures/${file}`, 'utf8')) as Scenario;
  const w = s.wells[0]!;
  return withPiezometer ? ({ ...s, monitoring: { pumpingStart: '2027-03-01T07:00:00Z', piezometers: [{ id: 'PZ1', x: w.x + 25, y: w.y - 10 }] } } as Scenario) : s;
}

/** Saves the scenario as the designer and makes a link; returns the site path and the scenario id. */
async function shareLink(scenario: Scenario, mode: 'view' | 'edit', pinned: boolean): Promise<{ sitePath: string; scenarioId: string; csrf: string; designer: BrowserContext }> {
  const designer = await browser.newContext();
  const csrf = await signInContext(app, designer, origin);
  const saved = await designer.request.post(`${origin}/api/v1/scenarios`, { data: { scenario, savedBy: 'designer' }, headers: { 'x-drydig-csrf': csrf } });
  expect(saved.status()).toBe(201);
  const { scenarioId } = (await saved.json()) as { scenarioId: string };
  const link = await designer.request.post(`${origin}/api/v1/scenarios/${scenarioId}/links`, { data: { mode, ...(pinned ? { revision: 1 } : {}) }, headers: { 'x-drydig-csrf': csrf } });
  const { sitePath } = (await link.json()) as { sitePath: string };
  return { sitePath, scenarioId, csrf, designer };
}

async function open(sitePath: string, size: Size): Promise<{ context: BrowserContext; page: Page; errors: string[] }> {
  const context = await browser.newContext({ ...SIZES[size] });
  const page = await context.newPage();
  const errors: string[] = [];
  await watchPage(page, errors);
  await page.goto(`${origin}${sitePath}`);
  await page.locator('site-view table[aria-label="Set-out table"]').waitFor();
  return { context, page, errors };
}

const shot = (page: Page, name: string) => page.screenshot({ path: path.join(ARTIFACTS_DIR, `${name}.png`), fullPage: true });
const litres = (text: string) => Number(/(-?[0-9]+(?:\.[0-9]+)?)/.exec(text)?.[1]);

describe('the site view shows one agreed rate set (issue 13 item 3)', () => {
  it.each(['desktop', 'phone'] as const)('at %s: the set-out rates, the summary total and the report total are the same numbers', async (size) => {
    // The demo's stored rates (6 × 12 L/s) are not the solver's optimum: the site sees the stored ones.
    const { sitePath, designer } = await shareLink(demo('demo-deepwells-confined.json'), 'view', true);
    await designer.close();
    const { context, page, errors } = await open(sitePath, size);
    const view = page.locator('site-view');
    const header = await view.locator('table[aria-label="Set-out table"] thead th').allInnerTexts();
    const rateColumn = header.findIndex((h) => h.startsWith('Rate'));
    const rows = view.locator('table[aria-label="Set-out table"] tbody tr');
    const rates: number[] = [];
    for (let i = 0; i < (await rows.count()); i++) rates.push(litres(await rows.nth(i).locator('th, td').nth(rateColumn).innerText()));
    expect(rates).toEqual([12, 12, 12, 12, 12, 12]);
    const sum = rates.reduce((a, b) => a + b, 0);
    const totalRow = view.locator('tr', { hasText: 'Total pumping rate' }).first();
    expect(litres(await totalRow.locator('td').innerText())).toBeCloseTo(sum, 1);
    // The design check is of these rates, so it says whether they meet the targets.
    expect(await view.locator('table[aria-label="Design summary"]').innerText()).toContain('Design check of these rates');
    // The printable report shows the same total and one rate column.
    const token = sitePath.split('/').pop()!;
    const report = await page.evaluate(async (t) => (await fetch(`/api/v1/links/${t}/export/report-html`)).text(), token);
    expect(report).toContain(`Total pumping rate (the revision’s rates)</th><td>${sum.toFixed(2)} L/s`);
    expect(report).not.toContain('<th>Design rate L/s</th>');
    await shot(page, `issue13-item3-${size}`);
    await page.locator('site-view table[aria-label="Set-out table"]').scrollIntoViewIfNeeded();
    await page.screenshot({ path: path.join(ARTIFACTS_DIR, `issue13-item3-${size}-tables.png`) });
    expect(errors).toEqual([]);
    await context.close();
  });
});

describe('the site view on a phone (issue 13 item 16)', () => {
  it('folds the cautions to a line that opens, keeps the well id in view and lets the plan zoom with readable labels', async () => {
    const { sitePath, designer } = await shareLink(demo('demo-deepwells-confined.json'), 'view', false);
    await designer.close();
    const { context, page, errors } = await open(sitePath, 'phone');
    const view = page.locator('site-view');
    const caution = view.locator('section.caution');
    const folded = await caution.boundingBox();
    expect(folded!.height).toBeLessThan(130);
    expect(await caution.innerText()).toContain('licensed engineer');
    // The plan starts on the first screen.
    const plan = view.locator('site-plan svg');
    expect((await plan.boundingBox())!.y).toBeLessThan(844);
    await shot(page, 'issue13-item16-phone');

    await caution.locator('summary').click();
    expect(await caution.locator('details').getAttribute('open')).not.toBeNull();
    expect((await caution.boundingBox())!.height).toBeGreaterThan(folded!.height + 100);
    await caution.locator('summary').click();

    // Labels on the plan: at least 11 px on screen (they were 6–8 px).
    const label = view.locator('site-plan g.well text').first();
    expect((await label.boundingBox())!.height).toBeGreaterThanOrEqual(11);
    await view.locator('site-plan button[name="zoom-in"]').click();
    await view.locator('site-plan button[name="zoom-in"]').click();
    expect(await plan.getAttribute('data-zoom')).toBe('4.00');
    expect((await label.boundingBox())!.height).toBeGreaterThanOrEqual(11);
    expect((await label.boundingBox())!.height).toBeLessThan(24);
    await plan.scrollIntoViewIfNeeded();
    await page.screenshot({ path: path.join(ARTIFACTS_DIR, 'issue13-item16-phone-plan-zoomed.png') });
    await view.locator('site-plan button[name="zoom-fit"]').click();
    expect(await plan.getAttribute('data-zoom')).toBe('1.00');

    // The set-out table scrolled fully sideways still shows the well id.
    const scroller = view.locator('.scroll', { has: page.locator('table[aria-label="Set-out table"]') });
    await scroller.evaluate((el) => { el.scrollLeft = el.scrollWidth; });
    const box = (await scroller.boundingBox())!;
    const firstCell = view.locator('table[aria-label="Set-out table"] tbody tr').first().locator('th, td').first();
    const cell = (await firstCell.boundingBox())!;
    expect(await scroller.evaluate((el) => el.scrollLeft)).toBeGreaterThan(50);
    expect(cell.x).toBeGreaterThanOrEqual(box.x - 1);
    expect(cell.x + cell.width).toBeLessThanOrEqual(box.x + box.width);
    expect(await firstCell.innerText()).toContain('DW1');
    await scroller.scrollIntoViewIfNeeded();
    await page.screenshot({ path: path.join(ARTIFACTS_DIR, 'issue13-item16-phone-table-scrolled.png') });
    expect(errors).toEqual([]);
    await context.close();
  });

  it('opens the cautions at once on a wide screen', async () => {
    const { sitePath, designer } = await shareLink(demo('demo-deepwells-confined.json'), 'view', false);
    await designer.close();
    const { context, page } = await open(sitePath, 'desktop');
    expect(await page.locator('site-view section.caution details').getAttribute('open')).not.toBeNull();
    await shot(page, 'issue13-item16-desktop');
    await context.close();
  });
});

describe('revision status, symbols and plain words (issue 13 items 14, 13, 11)', () => {
  it('says "saved" for a pinned revision until someone records it as issued for construction, then who and when', async () => {
    const { sitePath, scenarioId, csrf, designer } = await shareLink(demo('demo-deepwells-confined.json'), 'view', true);
    let { context, page } = await open(sitePath, 'phone');
    const badge = page.locator('site-view [data-revision-status]');
    expect(await badge.getAttribute('data-revision-status')).toBe('saved');
    expect(await badge.innerText()).not.toMatch(/agreed|issued/);
    expect(await page.locator('site-view header').innerText()).toContain('nobody has recorded it as issued for construction');
    await context.close();
    const issued = await designer.request.post(`${origin}/api/v1/scenarios/${scenarioId}/issued`, { data: { revision: 1 }, headers: { 'x-drydig-csrf': csrf } });
    expect(issued.status()).toBe(201);
    await designer.close();
    ({ context, page } = await open(sitePath, 'phone'));
    expect(await page.locator('site-view [data-revision-status]').getAttribute('data-revision-status')).toBe('issued');
    expect(await page.locator('site-view header').innerText()).toMatch(/issued for construction by \S+ on /);
    await shot(page, 'issue13-item14-phone');
    await context.close();
  });

  it('draws wells, pits and piezometers with the one symbol set, keyed beside the plan', async () => {
    const { sitePath, designer } = await shareLink(demo('demo-deepwells-confined.json'), 'view', false);
    await designer.close();
    const { context, page } = await open(sitePath, 'desktop');
    const plan = page.locator('site-view site-plan');
    // The piezometer is the designer map's ring with a dot (it was a green square), in the map's orange.
    expect(await plan.locator('g.piezometer circle.dd-pz-ring').getAttribute('stroke')).toBe('#e69f00');
    expect(await plan.locator('g.piezometer rect').count()).toBe(0);
    // Deep wells: filled ink discs, as on the designer map.
    expect(await plan.locator('g.well circle').first().getAttribute('fill')).toBe('#1d2730');
    const key = page.locator('site-view ul.plan-key li');
    expect(await key.evaluateAll((els) => els.map((e) => e.getAttribute('data-symbol')))).toEqual(expect.arrayContaining(['deep', 'piezometer', 'excavation']));
    // The design check of the stored rates is not met: the pit is hatched as water above target, and keyed.
    expect(await plan.locator('path[data-shortfall="above-target"]').count()).toBe(1);
    expect(await page.locator('site-view ul.plan-key li[data-symbol="shortfall-water"]').count()).toBe(1);
    await plan.scrollIntoViewIfNeeded();
    await page.screenshot({ path: path.join(ARTIFACTS_DIR, 'issue13-item13-desktop.png') });
    await context.close();
  });

  it('tells the site team what is wrong with a reading by the field’s label, without JSON pointers or API documents', async () => {
    const { sitePath, designer } = await shareLink(demo('demo-deepwells-confined.json'), 'edit', false);
    await designer.close();
    const { context, page } = await open(sitePath, 'phone');
    const form = page.locator('site-view form.reading');
    await form.locator('input[name="level_m"]').fill('99999');
    await form.getByRole('button', { name: 'Save reading' }).click();
    const note = form.locator('p.note');
    await note.waitFor();
    const text = await note.innerText();
    expect(text).toContain('Level:');
    expect(text).not.toContain('/level_m');
    expect(text).not.toContain('openapi');
    await form.scrollIntoViewIfNeeded();
    await page.screenshot({ path: path.join(ARTIFACTS_DIR, 'issue13-item11-phone.png') });
    await context.close();
  });
});

describe('the pit-floor check in the site view (issue 8 item 6)', () => {
  it.each(['desktop', 'phone'] as const)('at %s: the clay-plug demo shows the governing check, FS against required, allowable level, time to unsafe, the safe-dig table and the floor cautions', async (size) => {
    const { sitePath, designer } = await shareLink(demo('demo-clay-plug-confined.json', false), 'view', true);
    await designer.close();
    const { context, page, errors } = await open(sitePath, size);
    const floor = page.locator('site-view floor-check-view section.dd-floor-check');
    await floor.waitFor();
    expect(await floor.getAttribute('data-governing')).toBe('uplift');
    const text = await floor.innerText();
    expect(text).toContain('uplift of the plug (EN 1997-1 UPL)');
    expect(text).toMatch(/Uplift FS at the critical point\s*1\.\d{3} \(required 1\.111\)/);
    expect(text).toContain('Allowable head under the floor');
    expect(text).toContain('Power failure: floor unsafe after');
    expect(await floor.locator('table.dd-safe-dig-table tbody tr').count()).toBeGreaterThan(5);
    expect(await floor.locator('svg.dd-safe-dig-chart').count()).toBe(1);
    const cautions = page.locator('site-view section.caution');
    if (size === 'phone') await cautions.locator('summary').click();
    expect(await cautions.innerText()).toContain('uplift of the plug governs');
    expect(await cautions.innerText()).toContain('one-dimensional vertical equilibrium');
    await floor.scrollIntoViewIfNeeded();
    await shot(page, `issue8-item6-site-view-${size}`);
    await floor.screenshot({ path: path.join(ARTIFACTS_DIR, `issue8-item6-site-view-${size}-floor.png`) });
    await cautions.screenshot({ path: path.join(ARTIFACTS_DIR, `issue8-item6-site-view-${size}-cautions.png`) });
    expect(errors).toEqual([]);
    // The printable report of the same link carries the same floor check and cautions.
    await page.goto(`${origin}/api/v1/links/${sitePath.split('/').pop()}/export/report-html`);
    const report = page.locator('table.floor-check[data-excavation="basement"]');
    expect(await report.innerText()).toContain('uplift of the plug (EN 1997-1 UPL)');
    expect(await page.locator('table.safe-dig tbody tr').count()).toBeGreaterThan(5);
    expect(await page.locator('section.cautions').innerText()).toContain('uplift of the plug governs');
    await shot(page, `issue8-item6-report-${size}`);
    await report.scrollIntoViewIfNeeded();
    await page.screenshot({ path: path.join(ARTIFACTS_DIR, `issue8-item6-report-${size}-floor.png`) });
    await context.close();
  });
});
