/**
 * The monitoring plan on the plan map in a real browser: the demo's piezometers are drawn with
 * their own symbol and listed, the Piezometer tool places PZ3, its alert offset is edited (one
 * undo step), bad input names its field and is refused, the expected-level chart shows the alert
 * and action lines, a drag moves it, and undo takes every step back until it is gone.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { clickSite, loadDemo, pagePoint, usePlanMap, type BrowserSession } from './browser-harness';

/** How long a poll waits for the page to catch up (the machine is shared; this bounds a wait, it times nothing). */
const WAIT = { timeout: 20_000 };

let s: BrowserSession;
let page: Page;

usePlanMap((session) => {
  s = session;
  page = session.page;
});

interface HookPiezometer { id: string; x: number; y: number; alertOffset_m?: number; actionLevel_m?: number; label?: string }

async function piezometers(p: Page): Promise<HookPiezometer[]> {
  return p.evaluate(() => {
    const sc = (window as unknown as { __drydig: { scenario(): { monitoring?: { piezometers: HookPiezometer[] } } } }).__drydig.scenario();
    return sc.monitoring?.piezometers ?? [];
  });
}

const demo = JSON.parse(readFileSync('fixtures/demo-wellpoints-unconfined.json', 'utf8')) as {
  excavations: Array<{ formationLevel_m: number; margin_m: number }>;
  monitoring: { piezometers: HookPiezometer[] };
};

describe('piezometers on the plan map', () => {
  it('draws the demo piezometers with their own symbol, in the key and in the Monitoring list', async () => {
    await expect.poll(() => page.locator('.dd-piezometer').count(), WAIT).toBe(demo.monitoring.piezometers.length);
    for (const p of demo.monitoring.piezometers) expect(await page.locator(`.dd-piezometer[data-piezometer-id="${p.id}"] .dd-pz-label`).innerText()).toBe(p.id);
    // Wells stay plain discs: no well carries the piezometer class.
    expect(await page.locator('path.dd-well.dd-piezometer').count()).toBe(0);
    expect(await page.locator('map-legend .dd-sym-piezometer').count()).toBe(1);
    await page.click('button[name="tab-layout"]');
    expect(await page.locator('monitoring-editor .dd-pz-list button[data-piezometer]').count()).toBe(demo.monitoring.piezometers.length);
    expect(await page.locator('monitoring-editor input[name="pumping-start"]').inputValue()).toBe('2027-03-01T07:00:00Z');
  });

  it('lets the Well tool place a well on top of a piezometer (placement tools click through it)', async () => {
    const wells = async () => page.evaluate(() => (window as unknown as { __drydig: { scenario(): { wells: unknown[] } } }).__drydig.scenario().wells.length);
    const n = await wells();
    const pz2 = demo.monitoring.piezometers[1]!;
    await page.click('button[name="tool-add-well"]');
    await clickSite(page, pz2.x, pz2.y);
    await expect.poll(wells, WAIT).toBe(n + 1);
    await page.click('button[name="undo"]');
    await expect.poll(wells, WAIT).toBe(n);
    await page.keyboard.press('Escape');
  });

  it('places PZ3 with the tool, edits its alert offset, shows the expected-level chart, and undo removes it', async () => {
    await page.click('button[name="tool-add-piezometer"]');
    // West of the pit, clear of the key in the lower right.
    await clickSite(page, -20, 10);
    await expect.poll(() => page.locator('.dd-piezometer[data-piezometer-id="PZ3"]').count(), WAIT).toBe(1);
    let list = await piezometers(page);
    expect(list.map((p) => p.id)).toEqual(['PZ1', 'PZ2', 'PZ3']);
    // Placed where clicked, to within a screen pixel (site metres are rounded to mm).
    const placed = list[2]!;
    expect(Object.keys(placed).sort()).toEqual(['id', 'x', 'y']);
    expect(Math.abs(placed.x - -20)).toBeLessThan(0.2);
    expect(Math.abs(placed.y - 10)).toBeLessThan(0.2);
    expect(await page.locator('monitoring-editor .dd-pz-list button[data-piezometer="PZ3"]').getAttribute('class')).toContain('dd-on');
    expect(await page.locator('.dd-piezometer[data-piezometer-id="PZ3"]').getAttribute('class')).toContain('dd-selected');

    // The alert offset: blank means 0.3 m (common practice); set 0.5 m.
    expect(await page.locator('monitoring-editor input[name="pz-alertOffset_m"]').getAttribute('placeholder')).toBe('0.3');
    await page.fill('monitoring-editor input[name="pz-alertOffset_m"]', '0.5');
    await page.locator('monitoring-editor input[name="pz-alertOffset_m"]').blur();
    await expect.poll(async () => (await piezometers(page))[2]?.alertOffset_m, WAIT).toBe(0.5);

    // The chart the site team will be given: expected curve, alert line, action level. PZ3 is
    // outside pit-A, the only excavation: it gets no default action level (issue 11.6 — the pit's
    // target would call a reading exactly as designed "action"), and the hint says so.
    const chart = page.locator('monitoring-editor piezometer-chart');
    await expect.poll(() => chart.locator('path.dd-pz-expected').count(), WAIT).toBe(1);
    expect(await chart.locator('path.dd-pz-alert').count()).toBe(1);
    expect(await chart.locator('line.dd-pz-action').count()).toBe(0);
    expect(await page.locator('monitoring-editor .dd-field small').allInnerTexts()).toContainEqual(expect.stringContaining('outside every excavation'));
    expect(await page.locator('monitoring-editor .dd-pz-clash').count()).toBe(0);
    let key = (await chart.locator('.dd-pz-key').innerText()).replace(/\s+/g, ' ');
    expect(key).toContain('alert: expected + 0.50 m');
    expect(key).not.toContain('action');
    // The alert line runs 0.5 m above the expected curve: the same shape, shifted up on screen.
    const firstY = async (cls: string) => Number(/^M[\d.]+,([\d.]+)/.exec((await chart.locator(`path.${cls}`).getAttribute('d'))!)![1]);
    expect(await firstY('dd-pz-alert')).toBeLessThan(await firstY('dd-pz-expected'));
    // The designer sets the pit's target as PZ3's action level: it applies from the design time
    // (the end of this table), faint before, drawn from then on; and since the design expects a
    // level above it outside the pit, the editor warns that a reading as designed calls for action.
    const target = demo.excavations[0]!.formationLevel_m - demo.excavations[0]!.margin_m;
    await page.fill('monitoring-editor input[name="pz-actionLevel_m"]', String(target));
    await page.locator('monitoring-editor input[name="pz-actionLevel_m"]').blur();
    await expect.poll(async () => (await piezometers(page))[2]?.actionLevel_m, WAIT).toBe(target);
    await expect.poll(() => chart.locator('line.dd-pz-action:not(.dd-pz-action-before)').count(), WAIT).toBe(1);
    expect(await chart.locator('line.dd-pz-action-before').count()).toBe(1);
    key = (await chart.locator('.dd-pz-key').innerText()).replace(/\s+/g, ' ');
    expect(key).toContain(`action ${target.toFixed(2)} m`);
    await expect.poll(() => page.locator('monitoring-editor .dd-pz-clash').count(), WAIT).toBe(1);
    expect(await page.locator('monitoring-editor .dd-pz-clash').innerText()).toMatch(/above the action level\s+6\.50\sm: a reading that matches the design would already call for action/);
    await chart.scrollIntoViewIfNeeded();
    await s.screenshot('30-monitoring-piezometer');

    // Bad input names the field and is refused; the scenario is unchanged.
    await page.fill('monitoring-editor input[name="pz-x"]', 'east');
    await page.locator('monitoring-editor input[name="pz-x"]').blur();
    expect(await page.locator('monitoring-editor .dd-pz-input-error').innerText()).toBe('/monitoring/piezometers/2/x: easting "east" is not a number');
    expect((await piezometers(page))[2]).toEqual({ ...placed, alertOffset_m: 0.5, actionLevel_m: target });
    // The input shows what the scenario holds again, not the refused text.
    await expect.poll(async () => Math.abs(Number(await page.locator('monitoring-editor input[name="pz-x"]').inputValue()) - placed.x), WAIT).toBeLessThan(0.01);
    // A duplicate id is refused by validateMonitoring with its pointer.
    await page.fill('monitoring-editor input[name="pz-id"]', 'PZ1');
    await page.locator('monitoring-editor input[name="pz-id"]').blur();
    expect(await page.locator('monitoring-editor .dd-pz-input-error').innerText()).toBe('/monitoring/piezometers/2/id: duplicate piezometer id "PZ1"');
    expect((await piezometers(page)).map((p) => p.id)).toEqual(['PZ1', 'PZ2', 'PZ3']);
    await page.fill('monitoring-editor input[name="pz-alertOffset_m"]', '-1');
    await page.locator('monitoring-editor input[name="pz-alertOffset_m"]').blur();
    expect(await page.locator('monitoring-editor .dd-pz-input-error').innerText()).toMatch(/^\/monitoring\/piezometers\/2\/alertOffset_m: /);
    expect((await piezometers(page))[2]?.alertOffset_m).toBe(0.5);
    await page.fill('monitoring-editor input[name="pumping-start"]', 'next Monday');
    await page.locator('monitoring-editor input[name="pumping-start"]').blur();
    expect(await page.locator('monitoring-editor .dd-pz-input-error').innerText()).toMatch(/^\/monitoring\/pumpingStart: "next Monday" must be an ISO 8601 date-time/);
    await expect.poll(() => page.locator('monitoring-editor input[name="pumping-start"]').inputValue(), WAIT).toBe('2027-03-01T07:00:00Z');

    // Drag PZ3 5 m west with the Select tool: one undo step.
    await page.keyboard.press('Escape');
    const from = await pagePoint(page, placed.x, placed.y);
    const to = await pagePoint(page, placed.x - 5, placed.y);
    await page.mouse.move(from.x, from.y);
    await page.mouse.down();
    await page.mouse.move((from.x + to.x) / 2, to.y, { steps: 4 });
    await page.mouse.move(to.x, to.y, { steps: 4 });
    await page.mouse.up();
    await expect.poll(async () => Math.abs(((await piezometers(page))[2]?.x ?? 0) - (placed.x - 5)), WAIT).toBeLessThan(0.2);

    // Undo: the drag, the action level, the alert offset, the placement — then PZ3 is gone from the plan and the list.
    await page.click('button[name="undo"]');
    await expect.poll(async () => (await piezometers(page))[2]?.x, WAIT).toBe(placed.x);
    await page.click('button[name="undo"]');
    await expect.poll(async () => (await piezometers(page))[2]?.actionLevel_m, WAIT).toBeUndefined();
    await page.click('button[name="undo"]');
    await expect.poll(async () => (await piezometers(page))[2]?.alertOffset_m, WAIT).toBeUndefined();
    await page.click('button[name="undo"]');
    await expect.poll(() => page.locator('.dd-piezometer[data-piezometer-id="PZ3"]').count(), WAIT).toBe(0);
    list = await piezometers(page);
    expect(list).toEqual(demo.monitoring.piezometers);
    expect(await page.locator('monitoring-editor .dd-pz-list button[data-piezometer="PZ3"]').count()).toBe(0);
    expect(s.errors).toEqual([]);
  });

  it('shows and takes lengths in the display units (US: feet) and stores them in metres', async () => {
    await page.click('button[name="units-us"]');
    await page.click('monitoring-editor .dd-pz-list button[data-piezometer="PZ1"]');
    // Blank alert offset: 0.3 m = 0.3 / 0.3048 ft = 0.9843 ft (NIST SP 811: 1 ft = 0.3048 m exactly).
    expect(await page.locator('monitoring-editor input[name="pz-alertOffset_m"]').getAttribute('placeholder')).toBe('0.9843');
    // PZ1's easting in feet, to the 4 significant figures the form shows (1 ft = 0.3048 m).
    const x_ft = Number(await page.locator('monitoring-editor input[name="pz-x"]').inputValue());
    expect(Math.abs(x_ft - demo.monitoring.piezometers[0]!.x / 0.3048)).toBeLessThan(0.01);
    await page.fill('monitoring-editor input[name="pz-alertOffset_m"]', '1');
    await page.locator('monitoring-editor input[name="pz-alertOffset_m"]').blur();
    await expect.poll(async () => (await piezometers(page))[0]?.alertOffset_m, WAIT).toBeCloseTo(0.3048, 12);
    const chart = page.locator('monitoring-editor piezometer-chart');
    await expect.poll(() => chart.locator('text.dd-axis').first().textContent(), WAIT).toBe('level (ft)');
    await page.click('button[name="undo"]');
    await expect.poll(async () => (await piezometers(page))[0]?.alertOffset_m, WAIT).toBeUndefined();
    await page.click('button[name="undo"]'); // the unit switch
    expect(await page.locator('button[name="units-si"]').getAttribute('aria-pressed')).toBe('true');
    expect(s.errors).toEqual([]);
  });

  it('deletes a selected piezometer with the Delete key and keeps the rest of the scenario', async () => {
    const before = await page.evaluate(() => (window as unknown as { __drydig: { scenario(): unknown } }).__drydig.scenario());
    await page.click('monitoring-editor .dd-pz-list button[data-piezometer="PZ2"]');
    await page.locator('.dd-tabs').click({ position: { x: 2, y: 2 } }); // focus off the inputs
    await page.keyboard.press('Delete');
    await expect.poll(() => page.locator('.dd-piezometer[data-piezometer-id="PZ2"]').count(), WAIT).toBe(0);
    const after = await page.evaluate(() => (window as unknown as { __drydig: { scenario(): Record<string, unknown> } }).__drydig.scenario());
    const { monitoring: m0, ...rest0 } = before as Record<string, unknown>;
    const { monitoring: m1, ...rest1 } = after;
    expect(rest1).toEqual(rest0);
    expect((m1 as { piezometers: HookPiezometer[]; pumpingStart: string }).piezometers.map((p) => p.id)).toEqual(['PZ1']);
    expect((m1 as { pumpingStart: string }).pumpingStart).toBe((m0 as { pumpingStart: string }).pumpingStart);
    await page.click('button[name="undo"]');
    await expect.poll(() => page.locator('.dd-piezometer').count(), WAIT).toBe(2);
    expect(s.errors).toEqual([]);
  });

  it('on the deep-well demo, whose design falls short of its target, warns that PZ1 expects a level above its action level', async () => {
    await loadDemo(page, 'deepwells');
    await page.click('button[name="tab-layout"]');
    await page.click('monitoring-editor .dd-pz-list button[data-piezometer="PZ1"]');
    const clash = page.locator('monitoring-editor .dd-pz-clash');
    await expect.poll(() => clash.count(), WAIT).toBe(1);
    expect(await clash.innerText()).toMatch(/above the action level\s+6\.50\sm/);
    // PZ2 has its own action level above what the design expects there: no warning.
    await page.click('monitoring-editor .dd-pz-list button[data-piezometer="PZ2"]');
    const key = async () => (await page.locator('monitoring-editor piezometer-chart .dd-pz-key').innerText()).replace(/\s+/g, ' ');
    await expect.poll(key, WAIT).toContain('action 10.00 m from day 7 (design time)');
    expect(await clash.count()).toBe(0);
    await page.locator('monitoring-editor piezometer-chart').scrollIntoViewIfNeeded();
    await s.screenshot('31-monitoring-deepwells-pz2');
    expect(s.errors).toEqual([]);
  });
});
