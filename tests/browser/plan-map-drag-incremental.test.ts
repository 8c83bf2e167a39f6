/**
 * Dragging a well in a real browser: every frame during the drag is drawn on the fine grid,
 * updated well by well in the worker (issue 15, item 1), and after release the map is the full
 * evaluation of the new positions — checked against shared/field `evaluateGrid` run here in Node
 * on the same scenario and grid (drawdown range to 1e-9 m).
 */
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { evaluateGrid, type GridSpec } from '../../shared/field';
import type { Scenario } from '../../shared/schema';
import { stripWorkerCount } from '../../client/worker/strip-pool';
import { fieldsDrawn, loadDemo, pagePoint, settle, usePlanMap, type BrowserSession } from './browser-harness';

let s: BrowserSession;
let page: Page;

usePlanMap((session) => {
  s = session;
  page = session.page;
});

interface Hook {
  scenario(): Scenario;
  result(): { grid: GridSpec; drawdownMax_m: number; time_s: number | null } | null;
  computes: Array<{ mode: string; nodes: number; incremental: boolean; stripWorkers: number }>;
}
const hook = (p: Page) => p.evaluate(() => {
  const h = (window as unknown as { __drydig: Hook }).__drydig;
  return { scenario: h.scenario(), result: h.result(), computes: h.computes.slice() };
});

describe('dragging a well on the fine grid', () => {
  it('draws every drag frame on the fine grid well by well, and the full evaluation after release', async () => {
    await loadDemo(page, 'wellpoints');
    await page.click('button[name="tool-select"]');
    const start = await hook(page);
    const well = start.scenario.wells[5]!;
    const fineNodes = start.result!.grid.counts[0] * start.result!.grid.counts[1];
    const from = await pagePoint(page, well.x, well.y);
    const to = await pagePoint(page, well.x + 6, well.y - 4);
    const before = await fieldsDrawn(page);
    await page.evaluate(() => void ((window as unknown as { __drydig: Hook }).__drydig.computes.length = 0));
    await page.mouse.move(from.x, from.y);
    await page.mouse.down();
    for (let k = 1; k <= 24; k++) {
      await page.mouse.move(from.x + ((to.x - from.x) * k) / 24, from.y + ((to.y - from.y) * k) / 24);
      await page.waitForTimeout(20);
    }
    await s.screenshot('50-drag-fine-grid-mid-drag');
    await page.mouse.up();
    await settle(page, before);
    const after = await hook(page);
    const dragFrames = after.computes.filter((c) => c.mode === 'coarse');
    expect(dragFrames.length).toBeGreaterThan(3);
    // Fine grid on every drag frame; after the first (the kept grid is built), well by well.
    for (const f of dragFrames) expect(f.nodes).toBe(fineNodes);
    expect(dragFrames.slice(1).every((f) => f.incremental)).toBe(true);
    // The well moved, and the map after release is the full evaluation of where it now is.
    const moved = after.scenario.wells[5]!;
    expect(Math.hypot(moved.x - well.x, moved.y - well.y)).toBeGreaterThan(3);
    const r = after.result!;
    const full = evaluateGrid({ scenario: after.scenario, grid: r.grid, time_s: r.time_s });
    let max = -Infinity;
    for (let k = 0; k < full.drawdown_m.length; k++) if (!(full.flags[k]! & 1) && full.drawdown_m[k]! > max) max = full.drawdown_m[k]!;
    const fullMax = Math.max(...Array.from(full.drawdown_m));
    expect(Math.abs(r.drawdownMax_m - fullMax), `${r.drawdownMax_m} vs ${fullMax} (${max})`).toBeLessThanOrEqual(1e-9);
    // The fine map after release is split over one strip worker per core (issue 15 item 2).
    const cores = await page.evaluate(() => navigator.hardwareConcurrency);
    const fine = after.computes.filter((c) => c.mode === 'fine');
    expect(fine.length).toBeGreaterThan(0);
    expect(fine.at(-1)!.stripWorkers).toBe(stripWorkerCount(cores));
    expect(s.errors).toEqual([]);
  });
});
