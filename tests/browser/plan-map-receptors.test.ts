/**
 * Receptors (neighbours) in a real browser: the Neighbour tool places one on the plan with our
 * own symbol, its compressible layer and allowable settlement are entered under Layout →
 * Neighbours, a design is run, and the Design tab's table shows its drawdown and settlement —
 * checked against s = m_v·γw·Δh·H (Craig, one-dimensional consolidation) on the shown drawdown.
 * The neighbours demo draws its three receptors and its design uses the recharge well.
 */
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

interface HookReceptor { id: string; kind: string; geometry: { type: string; coordinates: unknown }; compressibleLayer?: { thickness_m: number; mv_m2_kN?: number }; allowableSettlement_m?: number }

async function receptors(p: Page): Promise<HookReceptor[]> {
  return p.evaluate(() => (window as unknown as { __drydig: { scenario(): { receptors?: HookReceptor[] } } }).__drydig.scenario().receptors ?? []);
}

async function fill(p: Page, name: string, value: string): Promise<void> {
  await p.fill(`receptor-editor input[name="${name}"]`, value);
  await p.locator(`receptor-editor input[name="${name}"]`).blur();
}

describe('receptors on the plan map', () => {
  it('places a receptor with the Neighbour tool, takes its layer, and shows its settlement after a design', async () => {
    await loadDemo(page, 'deepwells');
    await page.click('button[name="tool-add-receptor"]');
    // 40 m west of the basement (x 389200–389230), level with its middle.
    await clickSite(page, 389160, 5819415);
    await expect.poll(() => page.locator('.dd-receptor-point[data-receptor-id="N1"]').count(), WAIT).toBe(1);
    const placed = (await receptors(page))[0]!;
    expect(placed).toMatchObject({ id: 'N1', kind: 'building', geometry: { type: 'Point' } });
    const [x, y] = placed.geometry.coordinates as [number, number];
    expect(Math.abs(x - 389160)).toBeLessThan(0.5);
    expect(Math.abs(y - 5819415)).toBeLessThan(0.5);
    await page.keyboard.press('Escape');

    // Layer beneath it: 3 m thick, m_v = 2e-4 m²/kN; allowable settlement 25 mm.
    await expect.poll(() => page.locator('receptor-editor form.dd-receptor-editor').count(), WAIT).toBe(1);
    await fill(page, 'receptor-thickness_m', '3');
    await fill(page, 'receptor-mv_m2_kN', '0.0002');
    await fill(page, 'receptor-allowableSettlement_m', '0.025');
    await expect.poll(async () => (await receptors(page))[0]?.allowableSettlement_m, WAIT).toBe(0.025);
    expect((await receptors(page))[0]!.compressibleLayer).toEqual({ thickness_m: 3, mv_m2_kN: 0.0002 });
    // A bad value names its field and is not kept.
    await fill(page, 'receptor-mv_m2_kN', '7');
    // In plain words, naming the field by its label (issue 13, item 11), never by JSON pointer.
    const refusal = await page.locator('receptor-editor .dd-receptor-input-error').innerText();
    expect(refusal).toMatch(/^Receptor 1, compressible layer, coefficient of volume compressibility m_v: /);
    expect(refusal).not.toContain('/receptors');
    expect((await receptors(page))[0]!.compressibleLayer!.mv_m2_kN).toBe(0.0002);
    await page.locator('receptor-editor').scrollIntoViewIfNeeded();
    await s.screenshot('40-receptor-placed');

    await page.click('button[name="tab-design"]');
    await page.click('design-panel input[name="design-mode"][value="optimal"]');
    await page.click('design-panel button[name="run-design"]');
    await page.waitForSelector('design-panel .dd-receptor-table tr[data-receptor="N1"]', { timeout: 60_000 });
    const row = page.locator('design-panel .dd-receptor-table tr[data-receptor="N1"]');
    const drawdown_m = Number(/([\d.]+)/.exec(await row.locator('[data-drawdown]').innerText())![1]);
    const settlement_mm = Number(/([\d.]+) mm/.exec(await row.locator('[data-settlement]').innerText())![1]);
    expect(drawdown_m).toBeGreaterThan(1);
    // s = m_v·γw·Δh·H = 2e-4 × 9.81 × Δh × 3 m (hand calculation on the shown drawdown, 2 decimals).
    const expected_mm = 2e-4 * 9.81 * drawdown_m * 3 * 1000;
    expect(Math.abs(settlement_mm - expected_mm)).toBeLessThan(0.1);
    expect(await row.locator('[data-status]').getAttribute('data-status')).toBe(settlement_mm > 25 ? 'exceeds' : 'ok');
    await row.scrollIntoViewIfNeeded();
    await s.screenshot('41-receptor-design-table');
    // The map symbol takes the design's verdict colour (within limits: the met colour).
    const stroke = await page.locator('.dd-receptor-point[data-receptor-id="N1"] svg path').first().getAttribute('stroke');
    expect(stroke).toBe(settlement_mm > 25 ? '#d55e00' : '#009e73');
    expect(s.errors).toEqual([]);
  }, 120_000);

  it('drags the receptor with the Select tool (one undo step)', async () => {
    const before = (await receptors(page))[0]!.geometry.coordinates as [number, number];
    const from = await pagePoint(page, before[0], before[1]);
    const to = await pagePoint(page, before[0] - 5, before[1]);
    await page.mouse.move(from.x, from.y);
    await page.mouse.down();
    await page.mouse.move((from.x + to.x) / 2, to.y, { steps: 4 });
    await page.mouse.move(to.x, to.y, { steps: 4 });
    await page.mouse.up();
    await expect.poll(async () => Math.abs(((await receptors(page))[0]!.geometry.coordinates as [number, number])[0] - (before[0] - 5)), WAIT).toBeLessThan(0.3);
    await page.click('button[name="undo"]');
    await expect.poll(async () => ((await receptors(page))[0]!.geometry.coordinates as [number, number])[0], WAIT).toBe(before[0]);
  });

  it('draws the neighbours demo’s receptors and meets its pond limit with the recharge well', async () => {
    await loadDemo(page, 'neighbours');
    await expect.poll(() => page.locator('.dd-receptor-point').count(), WAIT).toBe(1);
    expect(await page.locator('.dd-receptor-vertex').count()).toBe(7);
    await page.click('button[name="tab-design"]');
    await page.click('design-panel input[name="design-mode"][value="optimal"]');
    await page.click('design-panel button[name="run-design"]');
    await page.waitForSelector('design-panel .dd-receptor-table tr[data-receptor="pond"]', { timeout: 60_000 });
    expect(await page.locator('design-panel .dd-design-verdict').getAttribute('data-feasible')).toBe('true');
    expect(await page.locator('design-panel .dd-receptor-table tr[data-receptor="pond"] [data-status]').getAttribute('data-status')).toBe('ok');
    // The recharge well's row (in a closed <details>, so its text rather than what is drawn) shows a rate below zero.
    expect(await page.locator('design-panel .dd-design-table tr[data-well="RW1"]').textContent()).toMatch(/[−-]\d/);
    await s.screenshot('42-neighbours-demo-design');
    expect(s.errors).toEqual([]);
  }, 120_000);
});
