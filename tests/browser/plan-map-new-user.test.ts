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
    // At the design time (7 d) the uplift check holds (FS 1.15 ≥ 1.111).
    expect(await b.getAttribute('data-kind')).toBe('met');
    expect(await badge(page, 'basement')).toMatch(/uplift FS 1\.1[45] \(required 1\.111\)/);
    // Ten minutes in, the head under the plug is too high: floor unsafe, not "water above target".
    await setTime(0);
    expect(await b.getAttribute('data-kind')).toBe('floor-unsafe');
    const text = await badge(page, 'basement');
    expect(text).toMatch(/Floor unsafe/);
    expect(text).toMatch(/uplift FS 0\.9\d \(required 1\.111\)/);
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
    const early = await hookResult(page);
    expect(early.shortfall[0]).toMatchObject({ kind: 'above-target', met: false });
    expect(early.shortfall[0]!.time_s).toBe(early.time_s);
    expect(early.shortfall[0]!.area_m2).toBeGreaterThan(0); // the hatch
    const text = await badge(page, 'pit-A');
    expect(text).toMatch(/Short by \d+\.\d\d\sm/);
    expect(text).toMatch(/at 2\.1 h \(time shown\)/);
    expect(await page.locator('results-panel h3').first().innerText()).toMatch(/time shown \(2\.1 h\)/);
    // Colours keep the design time's scale (less drawdown now, same scale).
    expect(early.drawdownMax_m).toBeLessThan(atDesign.drawdownMax_m);
    expect(early.colourMax_m).toBeCloseTo(atDesign.colourMax_m, 6);
    expect(await page.locator('map-legend [data-note="colour-scale"]').innerText()).toMatch(/design time's scale \(14 d/);
    await shots('item7-time-shown');
    expect(s.errors).toEqual([]);
  }, 120_000);
});
