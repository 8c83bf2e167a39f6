/**
 * The plan map tried as a new user would (issue 13, the designer's items): replacing a scenario
 * can be undone, paused results look stale, new wells get screens, the ring generator does not
 * stack wells, a dewatered pit is not a pass, floor-unsafe is told apart from water above target,
 * and the badges follow the time on the slider with one colour scale. Screenshots at 1440×900
 * and 390×844 under artifacts/browser/issue13-*.png.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { clickSite, fieldsDrawn, loadDemo, settle, usePlanMap, waitForField, type BrowserSession } from './browser-harness';

let s: BrowserSession;
let page: Page;

usePlanMap((session) => {
  s = session;
  page = session.page;
});

interface HookResult {
  time_s: number | null;
  colourMax_m: number;
  drawdownMax_m: number;
  shortfall: Array<{ id: string; met: boolean; kind: string; worstShortfall_m: number; area_m2: number; time_s: number | null }>;
}
interface HookScenario {
  name: string;
  wells: Array<{ id: string; x: number; y: number; kind: string; screenTop_m?: number; screenBottom_m?: number }>;
  groundLevel_m: number;
}

const hookResult = (p: Page) => p.evaluate(() => (window as unknown as { __drydig: { result(): unknown } }).__drydig.result() as HookResult);
const hookScenario = (p: Page) => p.evaluate(() => (window as unknown as { __drydig: { scenario(): unknown } }).__drydig.scenario() as HookScenario);
const badge = async (p: Page, id: string) => (await p.locator(`.dd-map-top .dd-badge[data-excavation="${id}"]`).innerText()).replace(/\s+/g, ' ');

/** Screenshot at 1440×900 and again at 390×844 (`-phone`), then back to the desktop size. */
async function shots(name: string): Promise<void> {
  await s.screenshot(`issue13-${name}`);
  await page.setViewportSize({ width: 390, height: 844 });
  await page.waitForTimeout(400);
  await waitForField(page, 0);
  await s.screenshot(`issue13-${name}-phone`);
  await page.setViewportSize({ width: 1440, height: 900 });
  await page.waitForTimeout(400);
  await waitForField(page, 0);
}

/** Opens a scenario through the header's Open… file input. */
async function openScenarioFile(name: string, scenario: unknown): Promise<void> {
  const before = await fieldsDrawn(page);
  await page.setInputFiles('input[name="open-scenario"]', { name, mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(scenario)) });
  await settle(page, before);
}

async function setTime(index: number): Promise<void> {
  const before = await fieldsDrawn(page);
  await page.locator('input[name="time"]').evaluate((el: HTMLInputElement, i) => {
    el.value = String(i);
    el.dispatchEvent(new Event('input', { bubbles: true }));
  }, index);
  await settle(page, before);
}

const wellpoints = JSON.parse(readFileSync('fixtures/demo-wellpoints-unconfined.json', 'utf8')) as { name: string; wells: Array<{ rate_m3_s?: number }> };
const deepwells = JSON.parse(readFileSync('fixtures/demo-deepwells-confined.json', 'utf8')) as { name: string };

describe('issue 13: the plan map as a new user finds it', () => {
  it('item 1: choosing a demo or opening a file over edits is one undo step that brings the edited scenario back', async () => {
    await loadDemo(page, 'wellpoints');
    await page.fill('input.dd-name', 'My edited pit');
    await page.locator('input.dd-name').press('Enter');
    await page.locator('input.dd-name').blur();
    await expect.poll(async () => (await hookScenario(page)).name).toBe('My edited pit');
    await loadDemo(page, 'deepwells');
    expect((await hookScenario(page)).name).toBe(deepwells.name);
    expect(await page.locator('.dd-notice').innerText()).toMatch(/Undo/);
    expect(await page.locator('button[name="undo"]').isEnabled()).toBe(true);
    await shots('item1-demo-replaced');
    let before = await fieldsDrawn(page);
    await page.click('button[name="undo"]');
    await settle(page, before);
    expect((await hookScenario(page)).name).toBe('My edited pit');
    expect((await hookScenario(page)).wells).toHaveLength(66);
    // Open… over the same edits: undoable too.
    await openScenarioFile('other.drydig.json', deepwells);
    expect((await hookScenario(page)).name).toBe(deepwells.name);
    before = await fieldsDrawn(page);
    await page.click('button[name="undo"]');
    await settle(page, before);
    expect((await hookScenario(page)).name).toBe('My edited pit');
    await shots('item1-undo-restored');
    expect(s.errors).toEqual([]);
  }, 120_000);

  it('item 2: results paused by an invalid field are greyed, and the badges say "not computed"', async () => {
    await loadDemo(page, 'wellpoints');
    expect(await page.locator('.dd-map-top .dd-badge[data-excavation="pit-A"]').getAttribute('data-kind')).toBe('met');
    await page.click('button[name="tab-ground"]');
    // Ground level below the pit's formation (7 m): the scenario is invalid, results pause.
    await page.fill('ground-panel input[name="groundLevel_m"]', '6');
    await page.locator('ground-panel input[name="groundLevel_m"]').blur();
    await expect.poll(() => page.locator('.dd-issues').count()).toBe(1);
    const b = page.locator('.dd-map-top .dd-badge[data-excavation="pit-A"]');
    await expect.poll(() => b.getAttribute('data-kind')).toBe('stale');
    expect(await b.getAttribute('data-met')).toBe('false');
    expect(await badge(page, 'pit-A')).toMatch(/Not computed/);
    expect(await badge(page, 'pit-A')).not.toMatch(/Target met/);
    expect(await page.locator('map-legend .dd-legend').getAttribute('class')).toMatch(/dd-stale/);
    expect(await page.locator('map-legend').innerText()).toMatch(/Not computed for the current inputs/);
    expect(await page.evaluate(() => (window as unknown as { __drydig: { fieldStale(): boolean } }).__drydig.fieldStale())).toBe(true);
    expect(await page.locator('canvas.dd-field-canvas').getAttribute('class')).toMatch(/dd-field-stale/);
    await shots('item2-stale');
    // Fixed again: current, not greyed.
    const before = await fieldsDrawn(page);
    await page.fill('ground-panel input[name="groundLevel_m"]', '12');
    await page.locator('ground-panel input[name="groundLevel_m"]').blur();
    await settle(page, before);
    await expect.poll(() => b.getAttribute('data-kind')).toBe('met');
    expect(await page.locator('canvas.dd-field-canvas').getAttribute('class')).not.toMatch(/dd-field-stale/);
    expect(s.errors).toEqual([]);
  }, 120_000);

  it('item 4: new wells, the well editor and the ring generator have screen levels (defaulting to those of the same kind)', async () => {
    await loadDemo(page, 'wellpoints');
    await page.click('button[name="tab-layout"]');
    // The demo's well points are screened 6 m to 3 m: new well points start with the same screen.
    expect(await page.inputValue('input[name="new-screen-top"]')).toBe('6');
    expect(await page.inputValue('input[name="new-screen-bottom"]')).toBe('3');
    await page.click('button[name="tool-add-well"]');
    const before = await fieldsDrawn(page);
    await clickSite(page, -20, 30);
    await settle(page, before);
    await page.keyboard.press('Escape');
    const added = (await hookScenario(page)).wells.find((w) => w.id === 'WP67');
    expect(added).toMatchObject({ kind: 'wellpoint', screenTop_m: 6, screenBottom_m: 3 });
    // The well editor edits them (selected after placing).
    expect(await page.inputValue('well-editor input[name="screenTop_m"]')).toBe('6');
    await page.fill('well-editor input[name="screenBottom_m"]', '1.5');
    await page.locator('well-editor input[name="screenBottom_m"]').blur();
    await expect.poll(async () => (await hookScenario(page)).wells.find((w) => w.id === 'WP67')?.screenBottom_m).toBe(1.5);
    // The ring generator too.
    expect(await page.inputValue('input[name="ring-screenTop_m"]')).toBe('6');
    expect(await page.inputValue('input[name="ring-screenBottom_m"]')).toBe('3');
    await page.locator('well-editor').scrollIntoViewIfNeeded();
    await shots('item4-screens');
    expect(s.errors).toEqual([]);
  }, 120_000);

  it('item 5: the ring generator skips positions on existing wells and says so', async () => {
    await loadDemo(page, 'wellpoints');
    await page.click('button[name="tab-layout"]');
    await page.click('button[name="ring-preview"]');
    // Default settings (1.5 m offset, 2 m spacing) lie on the demo's own ring of 66 well points.
    const skipped = page.locator('.dd-ring-skipped');
    await expect.poll(() => skipped.count()).toBe(1);
    expect(await skipped.innerText()).toMatch(/66 of 66 positions skipped/);
    expect(await page.locator('button[name="ring-place"]').isDisabled()).toBe(true);
    await page.locator('ring-generator').scrollIntoViewIfNeeded();
    await shots('item5-ring-skipped');
    // A second ring 4 m out is clear of them: all placed, with the demo's screens.
    await page.fill('input[name="ring-offset_m"]', '4');
    await page.locator('input[name="ring-offset_m"]').blur();
    await expect.poll(() => skipped.count()).toBe(0);
    const n = Number(/^(\d+) wells/.exec(await page.locator('.dd-ring-summary').innerText())![1]);
    const before = await fieldsDrawn(page);
    await page.click('button[name="ring-place"]');
    await settle(page, before);
    const wells = (await hookScenario(page)).wells;
    expect(wells).toHaveLength(66 + n);
    expect(wells.filter((w) => w.id.startsWith('R')).every((w) => w.screenTop_m === 6 && w.screenBottom_m === 3)).toBe(true);
    expect(s.errors).toEqual([]);
  }, 120_000);

  it('item 6: a pit drawn down to the aquifer base is not a pass', async () => {
    const over = structuredClone(wellpoints);
    over.name = 'Quarry Lane at three times the rates';
    for (const w of over.wells) if (w.rate_m3_s) w.rate_m3_s *= 3;
    await openScenarioFile('overpumped.drydig.json', over);
    expect((await hookScenario(page)).name, await page.locator('.dd-notice').innerText()).toBe(over.name);
    const b = page.locator('.dd-map-top .dd-badge[data-excavation="pit-A"]');
    await expect.poll(() => b.getAttribute('data-kind')).toBe('dewatered');
    expect(await b.getAttribute('data-met')).toBe('false');
    const text = await badge(page, 'pit-A');
    expect(text).toMatch(/Not verified/);
    expect(text).toMatch(/aquifer base/);
    expect(text).not.toMatch(/Target met|to spare/);
    expect(await page.locator('.dd-worst-dewatered').count()).toBe(1);
    expect((await hookResult(page)).shortfall[0]!.met).toBe(false);
    await shots('item6-dewatered');
    expect(s.errors).toEqual([]);
  }, 120_000);

  it('item 6 (issue 8.6): the clay plug shows "floor unsafe" with its own symbol, apart from "water above target", both in the key', async () => {
    await loadDemo(page, 'clayplug');
    await page.click('button[name="tab-results"]');
    const b = page.locator('.dd-map-top .dd-badge[data-excavation="basement"]');
    // At the design time (7 d) the uplift check holds: the demo's 6 × 14 L/s hold the head at 7.70 m,
    // FS = 39 / (9.81 · (7.70 − 5)) = 1.47 ≥ 1.111 (EN 1997-1 UPL by hand).
    expect(await b.getAttribute('data-kind')).toBe('met');
    expect(await badge(page, 'basement')).toMatch(/uplift FS 1\.4[67] \(required 1\.111\)/);
    // Ten minutes in, the head under the plug is too high: floor unsafe, not "water above target".
    await setTime(0);
    expect(await b.getAttribute('data-kind')).toBe('floor-unsafe');
    const text = await badge(page, 'basement');
    expect(text).toMatch(/Floor unsafe/);
    // Head 8.82 m under the plug: FS = 39 / (9.81 · 3.82) = 1.04 < 1.111.
    expect(text).toMatch(/uplift FS 1\.0[34] \(required 1\.111\)/);
    expect(await page.locator('.dd-worst-floor-unsafe').count()).toBe(1);
    const r = await hookResult(page);
    expect(r.shortfall[0]).toMatchObject({ kind: 'floor-unsafe', met: false });
    expect(r.shortfall[0]!.area_m2).toBeGreaterThan(0);
    // Both kinds in the key, with different symbols.
    const key = page.locator('map-legend');
    expect(await key.locator('li[data-key="above-target"]').innerText()).toMatch(/Water above target/);
    expect(await key.locator('li[data-key="floor-unsafe"]').innerText()).toMatch(/Floor unsafe/);
    const swatch = (k: string) => key.locator(`li[data-key="${k}"] .dd-sym`).evaluate((el) => getComputedStyle(el).backgroundImage + getComputedStyle(el).borderColor);
    expect(await swatch('floor-unsafe')).not.toBe(await swatch('above-target'));
    await shots('item6-floor-unsafe');
    expect(s.errors).toEqual([]);
  }, 120_000);

  it('item 7: the badge and hatch follow the time on the slider and say which time; one colour scale across times', async () => {
    await loadDemo(page, 'wellpoints');
    await page.click('button[name="tab-results"]');
    const atDesign = await hookResult(page);
    expect(atDesign.shortfall[0]!.kind).toBe('met');
    expect(await badge(page, 'pit-A')).toMatch(/at the design time 14 d/);
    // Index 4 of 16 log-spaced times from 20.2 min to 14 d: about 2 h.
    await setTime(4);
    expect(await page.locator('output[name="time-label"]').innerText()).toBe('2.1 h');
    await expect.poll(async () => (await hookResult(page)).shortfall[0]!.kind).toBe('above-target');
    const early = await hookResult(page);
    expect(early.shortfall[0]).toMatchObject({ kind: 'above-target', met: false });
    expect(early.shortfall[0]!.time_s).toBe(early.time_s);
    expect(early.shortfall[0]!.area_m2).toBeGreaterThan(0); // the hatch
    const text = await badge(page, 'pit-A');
    expect(text).toMatch(/Short by \d+\.\d\d\sm/);
    expect(text).toMatch(/at 2\.1 h \(time shown\)/);
    expect(await page.locator('results-panel h3').first().innerText()).toMatch(/time shown \(2\.1 h\)/i);
    // Colours keep the design time's scale (less drawdown now, same scale).
    expect(early.drawdownMax_m).toBeLessThan(atDesign.drawdownMax_m);
    // (the design-time range on this view's grid; the grid follows the view, so to within a few cm)
    expect(early.colourMax_m).toBeCloseTo(atDesign.colourMax_m, 1);
    expect(early.colourMax_m).toBeGreaterThan(early.drawdownMax_m + 0.5);
    expect(await page.locator('map-legend [data-note="colour-scale"]').innerText()).toMatch(/design time's scale \(14 d/);
    await shots('item7-time-shown');
    expect(s.errors).toEqual([]);
  }, 120_000);
});

describe('issue 13: the confusing parts', () => {
  it('item 8: the two save buttons are named for what they do', async () => {
    expect(await page.locator('button[name="save"]').innerText()).toBe('Download file');
    await page.click('button[name="tab-store"]');
    await expect.poll(() => page.locator('scenario-store-panel').getByRole('button', { name: 'Store on server', exact: true }).count()).toBe(1);
    expect(await page.locator('scenario-store-panel').getByRole('button', { name: 'Save', exact: true }).count()).toBe(0);
    await shots('item8-save-buttons');
  });

  it('item 9: the design\'s own "Apply rates" and a units switch do not mark the design out of date; a real edit does', async () => {
    await loadDemo(page, 'deepwells');
    await page.click('button[name="tab-design"]');
    await page.click('button[name="run-design"]');
    await page.waitForSelector('button[name="apply-rates"]', { timeout: 60_000 });
    const outOfDate = () => page.locator('design-panel .dd-warn', { hasText: 'The scenario has changed' }).count();
    const before = await fieldsDrawn(page);
    await page.click('button[name="apply-rates"]');
    await settle(page, before);
    expect(await outOfDate()).toBe(0);
    await page.click('button[name="units-us"]');
    await page.waitForTimeout(300);
    expect(await outOfDate()).toBe(0);
    await shots('item9-design-current');
    await page.click('button[name="units-si"]');
    // Any other edit still marks it (here the scenario's name, made while the Design tab is open).
    await page.fill('input.dd-name', 'Ferry Road, renamed');
    await page.locator('input.dd-name').blur();
    await expect.poll(outOfDate).toBe(1);
    expect(s.errors).toEqual([]);
  }, 120_000);

  it('item 10: a tiny contour interval is widened (at most 60 contours) and the map says so', async () => {
    await loadDemo(page, 'wellpoints');
    await page.click('button[name="tab-results"]');
    const before = await fieldsDrawn(page);
    await page.fill('input[name="contour-step"]', '0.0001');
    await page.locator('input[name="contour-step"]').blur();
    await settle(page, before);
    const levels = () => page.evaluate(() => (window as unknown as { __drydig: { result(): { levels: number } } }).__drydig.result().levels);
    await expect.poll(levels, { timeout: 30_000 }).toBeGreaterThan(20);
    const r = { levels: await levels() };
    expect(r.levels).toBeLessThanOrEqual(61);
    expect(await page.locator('map-legend [data-note="levels-capped"]').innerText()).toMatch(/needs \d+ contours; drawn every/);
    expect(await page.locator('results-panel [data-note="levels-capped"]').innerText()).toMatch(/at most 60/);
    await shots('item10-interval-capped');
    const b2 = await fieldsDrawn(page);
    await page.fill('input[name="contour-step"]', '');
    await page.locator('input[name="contour-step"]').blur();
    await settle(page, b2);
    // The key follows the redrawn field (a moment after the contours under load).
    await expect.poll(() => page.locator('map-legend [data-note="levels-capped"]').count(), { timeout: 15_000 }).toBe(0);
  }, 120_000);

  it('item 15: inspecting inside a pit keeps the side panel, and the drawer does not cover the point or section end A', async () => {
    await loadDemo(page, 'wellpoints');
    await page.click('button[name="tab-results"]');
    await clickSite(page, 20, 10);
    await expect.poll(() => page.locator('[data-inspect="level"]').count(), { timeout: 30_000 }).toBe(1);
    expect(await page.locator('button[name="tab-results"]').getAttribute('aria-selected')).toBe('true');
    const overlaps = (a: { x: number; y: number; width: number; height: number }, b: { x: number; y: number; width: number; height: number }) =>
      a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height;
    await page.waitForTimeout(300);
    const drawer = (await page.locator('.dd-drawer').boundingBox())!;
    const mark = (await page.locator('path.dd-inspect-mark').boundingBox())!;
    expect(overlaps(drawer, mark)).toBe(false);
    // A section drawn low on the map: the map pans so both ends stay clear of the drawer.
    await page.click('.dd-drawer .dd-close');
    await page.click('button[name="tool-section"]');
    await clickSite(page, -30, -25);
    await clickSite(page, 48, -25);
    await expect.poll(() => page.locator('section-chart svg').count(), { timeout: 30_000 }).toBeGreaterThan(0);
    await page.waitForTimeout(400);
    await page.waitForTimeout(400);
    const d2 = (await page.locator('.dd-drawer').boundingBox())!;
    for (const end of await page.locator('.dd-section-end').all()) expect(overlaps(d2, (await end.boundingBox())!)).toBe(false);
    await shots('item15-drawer-clear');
    expect(s.errors).toEqual([]);
  }, 120_000);

  it('item 12: map tiles that cannot load are explained in the Backdrop tab (the tile origin must be allowed)', async () => {
    await loadDemo(page, 'clayplug');
    await page.click('button[name="tab-backdrop"]');
    await page.fill('backdrop-panel input[name="tile-url"]', 'https://tiles.example.org/{z}/{x}/{y}.png');
    await page.locator('backdrop-panel input[name="tile-url"]').blur();
    const problem = page.locator('backdrop-panel .dd-tile-problem');
    await expect.poll(() => problem.count(), { timeout: 15_000 }).toBe(1);
    expect(await problem.innerText()).toMatch(/No map tiles could be loaded from https:\/\/tiles\.example\.org/);
    expect(await problem.innerText()).toMatch(/--tile-origin https:\/\/tiles\.example\.org/);
    await shots('item12-tiles-blocked');
    await page.fill('backdrop-panel input[name="tile-url"]', '');
    await page.locator('backdrop-panel input[name="tile-url"]').blur();
    // The harness blocks every request off 127.0.0.1 and records it: only those tile requests may be there.
    // (the page's Content-Security-Policy refuses them first: exactly the case the message explains).
    const unexpected = s.errors.map((e) => e.slice(0, 160)).filter((e) => !/https:\/\/tiles\.example\.org\//.test(e));
    expect(unexpected, unexpected.join('\n')).toEqual([]);
    s.errors.length = 0;
  }, 120_000);
});
