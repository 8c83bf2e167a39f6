/**
 * The ground-profile editor on the Ground tab in a real browser, on the clay-plug demo (Mill
 * Lane): the borehole column shows the layers hatched by kind and the basement's formation; a
 * unit weight no soil has is refused with a message naming the layer and the field; a bottom
 * level above the top is kept but listed in plain words, and undo mends it; a valid edit goes
 * into the scenario as one undo step; after the design run the governing check is uplift with the
 * safe-dig chart, and the column draws the computed head and the allowable uplift level.
 * Screenshots at 1440 × 900 and 390 × 844 under artifacts/browser/.
 */
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import type { Scenario } from '../../shared/schema';
import { clickSite, loadDemo, usePlanMap, type BrowserSession } from './browser-harness';

let s: BrowserSession;
let page: Page;

usePlanMap((session) => {
  s = session;
  page = session.page;
});

const scenario = (): Promise<Scenario> => page.evaluate(() => (window as unknown as { __drydig: { scenario(): Scenario } }).__drydig.scenario());

/**
 * Types into a profile field and commits it (a text input commits on change). Renders pending
 * from the last action finish first, and the value is set and committed in one task: the fields
 * show what the scenario holds, so a render in between would put the old value back.
 */
async function typeInto(name: string, text: string): Promise<void> {
  await page.evaluate(() => new Promise((done) => requestAnimationFrame(() => requestAnimationFrame(done))));
  await page.locator(`ground-profile-editor input[name="${name}"]`).evaluate((el, value) => {
    const input = el as HTMLInputElement;
    input.focus();
    input.value = value;
    input.dispatchEvent(new Event('input', { bubbles: true }));
    input.dispatchEvent(new Event('change', { bubbles: true }));
  }, text);
}

describe('<ground-profile-editor>', () => {
  it('draws the clay-plug demo as a borehole column with the layers hatched by kind and the formation level', async () => {
    await loadDemo(page, 'clayplug');
    await page.click('button[name="tab-ground"]');
    const column = page.locator('ground-profile-editor borehole-column svg.dd-borehole-column');
    await column.waitFor();
    expect(await column.locator('rect[data-layer]').count()).toBe(3);
    expect(await column.locator('rect[data-layer="clay"]').getAttribute('data-kind')).toBe('plug');
    expect(await column.locator('rect[data-layer="sand"]').getAttribute('data-kind')).toBe('granular');
    // Plug and granular ground are filled with different hatches.
    const fills = await column.locator('rect[data-layer]').evaluateAll((rects) => rects.map((r) => r.getAttribute('fill')));
    expect(new Set(fills).size).toBe(2);
    expect(await column.locator('[data-line="formation"] text').textContent()).toMatch(/formation basement 7\.00\sm/);
    expect(await page.locator('ground-profile-editor fieldset.dd-layer').count()).toBe(3);
  });

  it('refuses a unit weight no soil has, naming the layer and the field, and leaves the scenario as it was', async () => {
    await typeInto('layer-1-unitWeightSat_kN_m3', '40');
    const message = await page.locator('ground-profile-editor [data-field-error]').innerText();
    expect(message).toMatch(/Layer 2 “clay”, saturated unit weight γsat: 40 kN\/m³ is outside 10–26 kN\/m³/);
    expect(message).not.toMatch(/\/ground|layers\/\d|Error|at \w+ \(/);
    expect((await scenario()).ground!.layers[1]!.unitWeightSat_kN_m3).toBe(19.5);
    // The field shows the value kept, not the refused one.
    expect(await page.locator('ground-profile-editor input[name="layer-1-unitWeightSat_kN_m3"]').inputValue()).toBe('19.5');
  });

  it('shows levels in feet in US units and takes typed feet back to metres', async () => {
    await page.click('button[name="units-us"]');
    const top = page.locator('ground-profile-editor input[name="layer-1-top_m"]');
    expect(await top.inputValue()).toBe('41.01');
    expect(await page.locator('ground-profile-editor borehole-column [data-line="formation"] text').textContent()).toMatch(/22\.97\sft/);
    await typeInto('layer-1-top_m', '41');
    expect((await scenario()).ground!.layers[1]!.top_m).toBeCloseTo(12.4968, 6);
    expect((await scenario()).ground!.layers[0]!.bottom_m).toBeCloseTo(12.4968, 6);
    await page.click('button[name="undo"]');
    await page.click('button[name="undo"]');
    expect(await page.locator('button[name="units-si"]').getAttribute('aria-pressed')).toBe('true');
    expect((await scenario()).ground!.layers[1]!.top_m).toBe(12.5);
  });

  it('keeps a bottom level above the top but lists it in plain words, and undo mends it', async () => {
    await typeInto('layer-1-bottom_m', '13');
    const issues = page.locator('ground-profile-editor [data-profile-issues]');
    expect(await issues.innerText()).toMatch(/Layer 2 “clay”, bottom level: 13\.00\sm must lie below the layer's top level \(12\.50\sm\)/);
    // The boundary moved with it: the sand below now starts at 13 m.
    expect((await scenario()).ground!.layers[2]!.top_m).toBe(13);
    await issues.evaluate((el) => el.scrollIntoView({ block: 'start' }));
    await s.screenshot('ground-profile-editor-issue');
    await page.click('button[name="undo"]');
    await expect.poll(() => issues.count()).toBe(0);
    expect((await scenario()).ground!.layers[1]!.bottom_m).toBe(5);
  });

  it('puts a valid unit weight into the scenario as one undo step', async () => {
    await typeInto('layer-1-unitWeightSat_kN_m3', '20.5');
    expect(await page.locator('ground-profile-editor [data-field-error]').count()).toBe(0);
    expect((await scenario()).ground!.layers[1]!.unitWeightSat_kN_m3).toBe(20.5);
    expect(await page.locator('button[name="undo"]').getAttribute('title')).toMatch(/saturated unit weight γsat of layer clay/);
  });

  it('gives an excavation its own profile (a copy of the site one) and takes it away again, each one undo step', async () => {
    await page.selectOption('ground-profile-editor select[name="profile-owner"]', 'basement');
    expect(await page.locator('ground-profile-editor').innerText()).toMatch(/Excavation basement has no profile of its own and uses the site profile/);
    await page.click('ground-profile-editor button[name="profile-copy-site"]');
    expect((await scenario()).excavations[0]!.ground!.layers.map((l) => l.id)).toEqual(['made-ground', 'clay', 'sand']);
    expect(await page.locator('ground-profile-editor borehole-column figcaption').innerText()).toMatch(/excavation basement/);
    await page.click('ground-profile-editor button[name="layer-2-add-below"]');
    expect((await scenario()).excavations[0]!.ground!.layers.map((l) => [l.id, l.top_m, l.bottom_m])).toEqual([['made-ground', 15, 12.5], ['clay', 12.5, 5], ['sand', 5, -5], ['sand-2', -5, -15]]);
    expect((await scenario()).ground!.layers).toHaveLength(3); // the site profile is untouched
    await page.click('ground-profile-editor button[name="profile-drop-own"]');
    expect((await scenario()).excavations[0]!.ground).toBeUndefined();
    await page.selectOption('ground-profile-editor select[name="profile-owner"]', '');
    expect(await page.locator('ground-profile-editor borehole-column figcaption').innerText()).toMatch(/site$/);
  });

  it('runs the design: uplift governs, the safe-dig chart is drawn, and the column shows the head and the allowable uplift level', async () => {
    await page.click('button[name="tab-design"]');
    await page.click('design-panel input[name="design-mode"][value="optimal"]');
    await page.click('design-panel button[name="run-design"]');
    await page.waitForSelector('design-panel .dd-design-verdict', { timeout: 90_000 });
    const floor = page.locator('floor-check-view .dd-floor-check[data-excavation="basement"]');
    expect(await floor.getAttribute('data-governing')).toBe('uplift');
    expect(await floor.locator('svg.dd-safe-dig-chart path.dd-safe-dig-line').count()).toBe(1);

    await page.click('button[name="tab-ground"]');
    const column = page.locator('ground-profile-editor borehole-column');
    await column.locator('[data-line="allowable"]').waitFor();
    const allowable = await column.locator('[data-line="allowable"] text').textContent();
    const head = await column.locator('[data-line="head"] text').textContent();
    // Plug of 2 m at 20.5 kN/m³ under formation 7 m over its base at 5 m, required FS 1.111:
    // allowable ≈ 5 + 41 / (9.81 · 1.111) ≈ 8.76 m (hand calculation, EN 1997-1 UPL); the design holds the head at or below it.
    expect(allowable).toMatch(/allowable \(uplift\) 8\.7\d\sm/);
    const level = (text: string | null) => Number(/(-?\d+\.\d+)\sm/.exec(text ?? '')?.[1]);
    expect(level(head)).toBeLessThanOrEqual(level(allowable) + 0.005);
    expect(level(head)).toBeGreaterThan(7); // pressure relief: the head stays above formation
    expect(await column.locator('.dd-bh-note').count()).toBe(0);
    // A section line across the basement: its chart is drawn beside the column.
    await page.click('button[name="tool-section"]');
    await clickSite(page, 389170, 5819415);
    await clickSite(page, 389260, 5819415);
    await expect.poll(() => page.locator('ground-profile-editor section-chart path.dd-water').count(), { timeout: 20_000 }).toBe(1);
    if (await page.locator('.dd-drawer .dd-close').count()) await page.click('.dd-drawer .dd-close');
    expect(await column.locator('.dd-bh-note').count()).toBe(0); // the view is not a design input
    await column.evaluate((el) => el.scrollIntoView({ block: 'start' }));
    await s.screenshot('ground-profile-editor');

    // An edit afterwards marks the drawn head as from an earlier design.
    await typeInto('layer-1-unitWeight_kN_m3', '18');
    expect(await column.locator('.dd-bh-note').innerText()).toMatch(/before later edits/);
    await page.click('button[name="undo"]');
    await expect.poll(() => column.locator('.dd-bh-note').count()).toBe(0);

    await page.setViewportSize({ width: 390, height: 844 });
    await page.waitForTimeout(400);
    await column.evaluate((el) => el.scrollIntoView({ block: 'center' }));
    await s.screenshot('ground-profile-editor-phone');
    const box = await column.locator('svg').boundingBox();
    expect(box!.width).toBeLessThanOrEqual(390);
    expect(box!.width).toBeGreaterThan(200);
    await page.setViewportSize({ width: 1440, height: 900 });
    expect(s.errors).toEqual([]);
  }, 120_000);
});
