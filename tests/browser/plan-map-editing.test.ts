/**
 * More of the plan map in a real browser: the time control, drawing an outline and a boundary,
 * deleting a well by keyboard, the design panel's result (critical points, applying rates with
 * undo) and the site-plan underlay. Each file runs its own server on a random 127.0.0.1 port.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { clickSite, fieldsDrawn, loadDemo, pagePoint, settle, usePlanMap, type BrowserSession } from './browser-harness';

let s: BrowserSession;
let page: Page;

async function badge(p: Page, id: string): Promise<string> {
  return (await p.locator(`.dd-map-top .dd-badge[data-excavation="${id}"]`).innerText()).replace(/\s+/g, ' ');
}

usePlanMap((session) => {
  s = session;
  page = session.page;
});

describe('editing on the plan map', () => {
  it('the time control steps through log-spaced times up to the design time', async () => {
    await page.click('button[name="tab-results"]');
    expect(await page.locator('output[name="time-label"]').innerText()).toBe('14 d');
    const range0 = await page.locator('results-panel .dd-facts').first().innerText();
    const before = await fieldsDrawn(page);
    // Earliest time: design time / 1000 = 1 209 600 s / 1000 = 20.2 min.
    await page.locator('input[name="time"]').evaluate((el: HTMLInputElement) => {
      el.value = '0';
      el.dispatchEvent(new Event('input', { bubbles: true }));
    });
    await settle(page, before);
    expect(await page.locator('output[name="time-label"]').innerText()).toBe('20.2 min');
    expect(await page.locator('map-legend .dd-legend-head span').innerText()).toBe('20.2 min');
    const range1 = await page.locator('results-panel .dd-facts').first().innerText();
    expect(range1).not.toBe(range0);
    // Less drawdown after 20 minutes than after 14 days (Theis: s grows with t).
    const maxOf = (t: string) => Number(/to (\d+\.\d\d)/.exec(t)![1]);
    expect(maxOf(range1)).toBeLessThan(maxOf(range0));
    // The badges follow the time the contours show, and say so (issue 13 item 7).
    expect(await badge(page, 'pit-A')).toMatch(/at 20\.2 min \(time shown\)/);
    await s.screenshot('12-early-time');
  });

  it('draws an excavation outline corner by corner and gives it a badge', async () => {
    await loadDemo(page, 'wellpoints');
    await page.click('button[name="tool-draw-excavation"]');
    // West of the pit, clear of the legend in the lower right.
    for (const [x, y] of [[-45, -5], [-30, -5], [-30, 10], [-45, 10]] as const) await clickSite(page, x, y);
    const before = await fieldsDrawn(page);
    await clickSite(page, -45, -5); // back on the first corner closes it
    await settle(page, before);
    expect(await page.locator('path.dd-excavation').count()).toBe(2);
    await expect.poll(() => page.locator('.dd-map-top .dd-badge[data-excavation="pit-2"]').count()).toBe(1);
    // It starts with the last excavation's levels; set its formation deeper and see the badge follow.
    await page.click('button[name="tab-layout"]');
    const b0 = await badge(page, 'pit-2');
    await page.fill('excavation-editor input[name="formationLevel_m"]', '5');
    const before2 = await fieldsDrawn(page);
    await page.locator('excavation-editor input[name="formationLevel_m"]').blur();
    await settle(page, before2);
    expect(await page.locator('excavation-editor .dd-facts').innerText()).toMatch(/Target level 4\.50\sm/);
    expect(await badge(page, 'pit-2')).not.toBe(b0);
    await s.screenshot('13-outline-drawn');
  });

  it('draws a boundary, switches it to no-flow, and the results change', async () => {
    await loadDemo(page, 'wellpoints');
    const b0 = await badge(page, 'pit-A');
    await page.click('button[name="tool-boundary"]');
    await clickSite(page, -12, -20);
    const before = await fieldsDrawn(page);
    await clickSite(page, -12, 40);
    await settle(page, before);
    expect(await page.locator('path.dd-boundary-constant-head').count()).toBe(1);
    expect(await page.locator('ground-panel .dd-boundary-row').count()).toBe(1);
    const b1 = await badge(page, 'pit-A');
    expect(b1).not.toBe(b0); // a river 10 m from the pit feeds it
    const before2 = await fieldsDrawn(page);
    await page.selectOption('ground-panel .dd-boundary-row select', 'no-flow');
    await settle(page, before2);
    expect(await page.locator('path.dd-boundary-no-flow').count()).toBe(1);
    expect(await badge(page, 'pit-A')).not.toBe(b1);
    await s.screenshot('14-boundary');
  });

  it('shows the ground model in the chosen units and refuses an impossible value', async () => {
    await page.click('button[name="tab-ground"]');
    await page.fill('ground-panel input[name="specificYield"]', '1.5');
    await page.locator('ground-panel input[name="specificYield"]').blur();
    await expect.poll(() => page.locator('ground-panel .dd-error').innerText()).toMatch(/\/aquifer\/specificYield: Specific yield Sy is a fraction below 1/);
    expect(await page.locator('ground-panel .dd-facts').innerText()).toMatch(/Transmissivity T = K·H = 0\.0037\sm²\/s/);
  });

  it('pauses results with the field named when an edit makes the scenario invalid, and resumes on undo', async () => {
    await loadDemo(page, 'wellpoints');
    await page.click('button[name="tab-ground"]');
    await page.fill('ground-panel input[name="base_m"]', '20');
    await page.locator('ground-panel input[name="base_m"]').blur();
    await expect.poll(() => page.locator('.dd-issues').first().innerText()).toMatch(/Results paused[\s\S]*Aquifer, base:/);
    // Plain words in the banner (issue 13 item 11); the pointer stays in the tooltip.
    expect(await page.locator('.dd-issues li').first().getAttribute('title')).toBe('/aquifer/base_m');
    expect(await page.locator('.dd-issues').first().innerText()).not.toMatch(/\/aquifer\/base_m/);
    const before = await fieldsDrawn(page);
    await page.click('button[name="undo"]');
    await settle(page, before);
    expect(await page.locator('.dd-issues').count()).toBe(0);
  });

  it('says why when the engine cannot use the boundaries drawn', async () => {
    // Two boundaries meeting at 60°: the image-well method handles one line, a right angle, or parallels.
    await page.click('button[name="tool-boundary"]');
    await clickSite(page, -20, -30);
    await clickSite(page, -20, 50);
    await page.click('button[name="tool-boundary"]');
    await clickSite(page, -20, -30);
    await clickSite(page, 20, 39.282);
    await expect.poll(() => page.locator('.dd-issues').first().innerText(), { timeout: 10_000 }).toMatch(/Not computed:.*boundar/i);
    expect(s.errors).toEqual([]);
    await page.click('button[name="undo"]');
    await page.click('button[name="undo"]');
    await expect.poll(() => page.locator('.dd-issues').count()).toBe(0);
  });

  it('deletes the selected well with the Delete key, undoably', async () => {
    await loadDemo(page, 'deepwells');
    await page.click('button[name="tab-layout"]');
    await page.click('.dd-well-list button[data-well="DW6"]');
    await page.locator('plan-map').hover({ position: { x: 40, y: 300 } });
    await page.keyboard.press('Delete');
    await expect.poll(() => page.locator('path.dd-well').count()).toBe(5);
    await page.keyboard.press('Control+z');
    await expect.poll(() => page.locator('path.dd-well').count()).toBe(6);
  });

  it('marks the design critical points and applies the solved rates as one undo step', async () => {
    await page.click('button[name="tab-design"]');
    expect(await page.locator('.dd-tab-body caution-note').innerText()).toMatch(/licensed engineer/);
    const detail = {
      mode: 'uniform', feasible: true, totalRate_m3_s: 0.12,
      wells: ['DW1', 'DW2', 'DW3', 'DW4', 'DW5', 'DW6'].map((id) => ({ id, rate_m3_s: 0.02 })),
      excavations: [{ id: 'basement', targetLevel_m: 6.5, met: true, worstShortfall_m: -0.1, critical: { x: 389230, y: 5819415, level_m: 6.4 } }],
      reasons: [], apply: true,
    };
    const before = await fieldsDrawn(page);
    await page.locator('design-panel').evaluate((el, d) => el.dispatchEvent(new CustomEvent('design-result', { detail: d, bubbles: true, composed: true })), detail);
    await settle(page, before);
    expect(await page.locator('path.dd-critical').count()).toBe(1);
    await expect.poll(() => page.locator('.dd-notice').innerText()).toMatch(/Applied design rates to 6 wells/);
    await page.click('button[name="tab-layout"]');
    expect(await page.locator('.dd-well-list button[data-well="DW1"]').innerText()).toMatch(/72\s*m³\/h/); // 0.02 m³/s × 3600
    await page.click('button[name="undo"]');
    await expect.poll(() => page.locator('.dd-well-list button[data-well="DW1"]').innerText()).toMatch(/43\.2\s*m³\/h/);
  });

  it('runs the design panel against the server, marks its critical point and applies its rates', async () => {
    await loadDemo(page, 'deepwells');
    expect(await badge(page, 'basement')).toMatch(/Short by/);
    await page.click('button[name="tab-design"]');
    await page.click('button[name="run-design"]');
    await page.waitForSelector('button[name="apply-rates"]', { timeout: 30_000 });
    await expect.poll(() => page.locator('path.dd-critical').count()).toBe(1);
    const before = await fieldsDrawn(page);
    await page.click('button[name="apply-rates"]');
    await settle(page, before);
    // The optimal rates meet the target; the map's own check agrees (to the centimetre it prints).
    await expect.poll(() => badge(page, 'basement')).toMatch(/Target met/);
    await s.screenshot('17-design-applied');
    await page.click('button[name="undo"]');
    await expect.poll(() => badge(page, 'basement')).toMatch(/Short by 1\.96/);
  });

  it('clicking a shortfall badge goes to the worst point and inspects it', async () => {
    await loadDemo(page, 'deepwells');
    const text = await badge(page, 'basement');
    const short = Number(/Short by (\d+\.\d\d)/.exec(text)![1]);
    await page.click('.dd-map-top .dd-badge[data-excavation="basement"]');
    await expect.poll(() => page.locator('[data-inspect="level"]').count()).toBe(1);
    const [, e, n] = /worst at (\d+\.\d), (\d+\.\d)/.exec(text)!;
    await expect.poll(() => page.locator('.dd-readout').innerText()).toContain(`E ${Number(e).toFixed(2)}`);
    expect(await page.locator('.dd-readout').innerText()).toContain(`N ${Number(n).toFixed(2)}`);
    // The level there is the target (7.0 − 0.5 = 6.5 m) plus the shortfall (both rounded to 0.01 m).
    const level = Number.parseFloat(await page.locator('[data-inspect="level"]').innerText());
    expect(Math.abs(level - (6.5 + short))).toBeLessThanOrEqual(0.011);
    expect(await page.locator('.dd-readout .dd-bad').first().innerText()).toMatch(/above/);
  });

  it('contours groundwater level instead of drawdown on request', async () => {
    await page.click('.dd-drawer .dd-close');
    await page.click('button[name="tab-results"]');
    const before = await fieldsDrawn(page);
    await page.check('input[name="quantity"][value="level"]');
    await settle(page, before);
    expect(await page.locator('map-legend .dd-legend-head strong').innerText()).toBe('Groundwater level');
    const values = (await page.locator('map-legend .dd-scale li').allInnerTexts()).map((t) => Number.parseFloat(t));
    // Levels lie between the lowest computed level and the static level of 13 m.
    for (const v of values) {
      expect(v).toBeLessThanOrEqual(13);
      expect(v).toBeGreaterThan(5);
    }
    await s.screenshot('16-level-contours');
    const before2 = await fieldsDrawn(page);
    await page.check('input[name="quantity"][value="drawdown"]');
    await settle(page, before2);
  });

  it('reshapes an excavation by dragging a corner handle', async () => {
    await loadDemo(page, 'wellpoints');
    await page.click('button[name="tool-select"]');
    await clickSite(page, 20, 10); // selects pit-A
    await expect.poll(() => page.locator('path.dd-vertex').count()).toBe(4);
    const from = await pagePoint(page, 40, 20);
    const to = await pagePoint(page, 45, 25);
    const before = await fieldsDrawn(page);
    await page.mouse.move(from.x, from.y);
    await page.mouse.down();
    for (let k = 1; k <= 8; k++) await page.mouse.move(from.x + ((to.x - from.x) * k) / 8, from.y + ((to.y - from.y) * k) / 8);
    await page.mouse.up();
    await settle(page, before);
    await page.click('button[name="tab-layout"]');
    // Shoelace area of (0,0), (40,0), (45,25), (0,20) = 950 m² (to the pixel the corner landed on).
    const area = Number(/area (\d+(?:\.\d+)?)\sm²/.exec(await page.locator('excavation-editor .dd-facts').innerText())![1]);
    expect(Math.abs(area - 950)).toBeLessThan(5);
    await page.click('button[name="undo"]');
    await expect.poll(() => page.locator('excavation-editor .dd-facts').innerText()).toMatch(/area 800\sm²/);
  });

  it('opens a file whose view settings are malformed, keeping the design data and saying what was ignored', async () => {
    const scenario = { ...(await page.evaluate(() => (window as unknown as { __drydig: { scenario(): object } }).__drydig.scenario())), name: 'with bad view', view: { underlay: { refs: 5 } } };
    await page.setInputFiles('input[name="open-scenario"]', { name: 'odd.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(scenario)) });
    await expect.poll(() => page.locator('.dd-notice').innerText()).toMatch(/Opened odd\.json; its view settings were ignored \(View, underlay/);
    // The field in words, not its JSON pointer (issue 13 item 11).
    expect(await page.locator('.dd-notice').innerText()).not.toMatch(/\/view\/underlay/);
    expect(await page.locator('input.dd-name').inputValue()).toBe('with bad view');
    expect(s.errors).toEqual([]);
  });

  it('edits a rate schedule for a well (pump stops after 5 days)', async () => {
    await loadDemo(page, 'deepwells');
    await page.click('button[name="tab-layout"]');
    await page.click('.dd-well-list button[data-well="DW1"]');
    await page.check('well-editor input[name="mode"] >> nth=1');
    await expect.poll(() => page.locator('well-editor table.dd-schedule tbody tr').count()).toBe(1);
    await page.click('well-editor button:has-text("Add step")');
    await expect.poll(() => page.locator('well-editor table.dd-schedule tbody tr').count()).toBe(2);
    const start = page.locator('well-editor input[aria-label="schedule step 2 start"]');
    await start.fill('5');
    const before = await fieldsDrawn(page);
    await start.blur();
    await settle(page, before);
    expect(await page.locator('.dd-well-list button[data-well="DW1"]').innerText()).toMatch(/schedule/);
    const kept = await page.evaluate(() => (window as unknown as { __drydig: { scenario(): { wells: Array<{ id: string; schedule?: unknown }> } } }).__drydig.scenario().wells[0]!.schedule);
    // 5 d = 432 000 s, rate 0 from then on; the first step keeps the well's rate (0.012 m³/s).
    expect(kept).toEqual([{ from_s: 0, rate_m3_s: 0.012 }, { from_s: 432000, rate_m3_s: 0 }]);
  });

  it('saves the scenario as a JSON file that validates and keeps the view settings', async () => {
    const [download] = await Promise.all([page.waitForEvent('download'), page.click('button[name="save"]')]);
    expect(download.suggestedFilename()).toMatch(/\.drydig\.json$/);
    const path = await download.path();
    const saved = JSON.parse(readFileSync(path!, 'utf8'));
    const { validateScenario } = await import('../../shared/schema');
    expect(validateScenario(saved).ok).toBe(true);
    expect(saved.wells[0].schedule).toEqual([{ from_s: 0, rate_m3_s: 0.012 }, { from_s: 432000, rate_m3_s: 0 }]);
  });

  it('shows a steady-state scenario without a time control', async () => {
    const steady = { ...(await page.evaluate(() => (window as unknown as { __drydig: { scenario(): object } }).__drydig.scenario())), name: 'steady', design: { time_s: null } };
    const before = await fieldsDrawn(page);
    await page.setInputFiles('input[name="open-scenario"]', { name: 'steady.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(steady)) });
    await settle(page, before);
    await page.click('button[name="tab-results"]');
    expect(await page.locator('output[name="time-label"]').innerText()).toBe('steady state');
    expect(await page.locator('input[name="time"]').count()).toBe(0);
    expect(await badge(page, 'basement')).toMatch(/steady state/);
    expect(await page.locator('results-panel .dd-facts').first().innerText()).toMatch(/Thiem \(1906\), R = \d+/);
  });

  it('places a site-plan image by two reference points', async () => {
    await page.click('button[name="tab-backdrop"]');
    const png = readFileSync('node_modules/leaflet/dist/images/layers-2x.png'); // any PNG will do: 52 × 52 px
    await page.setInputFiles('backdrop-panel input[name="underlay-file"]', { name: 'plan.png', mimeType: 'image/png', buffer: png });
    await expect.poll(() => page.locator('img.dd-underlay').count()).toBe(1);
    await expect.poll(() => page.locator('backdrop-panel .dd-facts').innerText()).toMatch(/Scale 0\.1 m\/px · rotation 0\.00°/);
    // Second reference: the image's top-right corner 10 m north of the first → 52 px over 10 m, turned 90°.
    const refs = page.locator('backdrop-panel fieldset.dd-ref').nth(1).locator('input');
    const e0 = Number(await page.locator('backdrop-panel fieldset.dd-ref').nth(0).locator('input').nth(2).inputValue());
    const n0 = Number(await page.locator('backdrop-panel fieldset.dd-ref').nth(0).locator('input').nth(3).inputValue());
    // Northing first: each edit must leave two distinct points, or it is refused.
    await refs.nth(3).fill(String(n0 + 10));
    await refs.nth(3).blur();
    await refs.nth(2).fill(String(e0));
    await refs.nth(2).blur();
    await expect.poll(() => page.locator('backdrop-panel .dd-facts').innerText()).toMatch(/rotation 90\.00°/);
    const transform = await page.locator('img.dd-underlay').evaluate((el) => (el as HTMLElement).style.transform);
    expect(transform).toMatch(/^matrix\(/);
    expect(await page.locator('img.dd-underlay').evaluate((el) => getComputedStyle(el).display)).toBe('block');
    // Kept in the scenario under "view" (so it travels with the saved file).
    const kept = await page.evaluate(() => (window as unknown as { __drydig: { scenario(): { view?: { underlay?: { width_px: number } } } } }).__drydig.scenario().view?.underlay?.width_px);
    expect(kept).toBe(52);
    await s.screenshot('15-underlay');
    expect(s.errors).toEqual([]);
  });
});
