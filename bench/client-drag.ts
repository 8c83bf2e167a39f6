/**
 * Responsiveness of the plan map: drag one of 200 wells with the mouse and measure, in the
 * browser, the time from each pointer input to the contours and shortfall flags drawn for it
 * (performance.measure 'dd-input-to-contours', taken for the oldest input each drawn result
 * reflects). Prints the median and 95th percentile. Target: within 150 ms on this machine.
 *
 * Run: npx tsx bench/client-drag.ts [--moves 120] [--interval 16]
 * It builds the client, starts the real server on 127.0.0.1 (random port) and drives
 * Debian's Chromium headless.
 */
import { execSync } from 'node:child_process';
import os from 'node:os';
import { chromium } from 'playwright-core';
import { buildApp } from '../server/app';
import demo from '../fixtures/demo-wellpoints-unconfined.json';
import type { Scenario } from '../shared/schema';
import { layoutWellRing } from '../client/layout';

const arg = (name: string, fallback: number) => {
  const i = process.argv.indexOf(`--${name}`);
  const v = i >= 0 ? Number(process.argv[i + 1]) : Number.NaN;
  return Number.isFinite(v) ? v : fallback;
};
const MOVES = arg('moves', 120);
const INTERVAL_MS = arg('interval', 16);
const WELLS = 200;

/** The demo site with a 100 m × 50 m pit ringed by 200 well points (invented, for the bench only). */
function benchScenario(): Scenario {
  const s = structuredClone(demo) as unknown as Scenario;
  s.name = 'Bench: 200 well points';
  s.excavations = [{ id: 'pit-A', outline: [[0, 0], [100, 0], [100, 50], [0, 50]], formationLevel_m: 7, margin_m: 0.5 }];
  const ring = layoutWellRing({ outline: s.excavations[0]!.outline, offset_m: 1.5, spacing_m: 312 / WELLS });
  s.wells = ring.positions.slice(0, WELLS).map(([x, y], k) => ({
    id: `WP${String(k + 1).padStart(3, '0')}`, x, y, radius_m: 0.05, kind: 'wellpoint', rate_m3_s: 0.0004,
  }));
  return s;
}

function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return Number.NaN;
  const i = Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1));
  return sorted[i]!;
}

async function main(): Promise<void> {
  execSync('npx vite build --config client/vite.config.ts --logLevel warn', { stdio: 'inherit' });
  const app = await buildApp({ clientDir: 'client/dist', dataDir: ':memory:' });
  await app.listen({ host: '127.0.0.1', port: 0 });
  const address = app.server.address();
  const port = typeof address === 'object' && address ? address.port : 0;
  const browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--no-first-run'],
  });
  try {
    const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
    const waitIdle = (after: number) => page.waitForFunction(
      (n) => {
        const h = (window as unknown as { __drydig?: { fieldsDrawn: number; busy(): boolean } }).__drydig;
        return !!h && h.fieldsDrawn > n && !h.busy();
      },
      after, { timeout: 60_000, polling: 20 },
    );
    const drawn = () => page.evaluate(() => (window as unknown as { __drydig: { fieldsDrawn: number } }).__drydig.fieldsDrawn);
    await page.goto(`http://127.0.0.1:${port}/`);
    await waitIdle(0);
    let before = await drawn();
    const scenario = benchScenario();
    await page.setInputFiles('input[name="open-scenario"]', { name: 'bench.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(scenario)) });
    const t0 = Date.now();
    await waitIdle(before);
    await page.waitForTimeout(400);
    await waitIdle(0);
    const idleMs = Date.now() - t0;
    const count = await page.locator('path.dd-well').count();
    if (count !== WELLS) throw new Error(`expected ${WELLS} wells on the map, found ${count}`);
    await page.evaluate(() => {
      (window as unknown as { __drydig: { latencies_ms: number[] } }).__drydig.latencies_ms.length = 0;
      performance.clearMeasures('dd-input-to-contours');
    });
    // Drag a well on the south side across the pit and back, as a designer trying positions.
    const target = scenario.wells[20]!;
    const at = (x: number, y: number) => page.evaluate(([a, b]) => (window as unknown as { __drydig: { pagePoint(x: number, y: number): { x: number; y: number } } }).__drydig.pagePoint(a!, b!), [x, y]);
    const start = await at(target.x, target.y);
    const end = await at(target.x + 15, target.y + 30);
    before = await drawn();
    await page.mouse.move(start.x, start.y);
    await page.mouse.down();
    for (let k = 1; k <= MOVES; k++) {
      const f = k <= MOVES / 2 ? (2 * k) / MOVES : 2 - (2 * k) / MOVES;
      await page.mouse.move(start.x + (end.x - start.x) * f, start.y + (end.y - start.y) * f);
      await page.waitForTimeout(INTERVAL_MS);
    }
    await page.mouse.up();
    await waitIdle(before);
    const latencies = await page.evaluate(() => performance.getEntriesByName('dd-input-to-contours').map((e) => e.duration));
    const computes = await page.evaluate(() => (window as unknown as { __drydig: { computes: Array<{ mode: string; compute_ms: number }> } }).__drydig.computes);
    const coarse = computes.filter((c) => c.mode === 'coarse').map((c) => c.compute_ms).sort((a, b) => a - b);
    if (process.argv.includes('--verbose')) console.log(JSON.stringify({ latencies: latencies.map((v) => Math.round(v)), computes: computes.map((c) => `${c.mode[0]}${Math.round(c.compute_ms)}`) }));
    const sorted = latencies.slice().sort((a, b) => a - b);
    const version = browser.version();
    const result = {
      wells: WELLS,
      moves: MOVES,
      interval_ms: INTERVAL_MS,
      frames_measured: sorted.length,
      median_ms: Number(percentile(sorted, 50).toFixed(1)),
      p95_ms: Number(percentile(sorted, 95).toFixed(1)),
      max_ms: Number((sorted[sorted.length - 1] ?? Number.NaN).toFixed(1)),
      within_150ms: sorted.filter((v) => v <= 150).length,
      worker_coarse_median_ms: Number(percentile(coarse, 50).toFixed(1)),
      worker_coarse_p95_ms: Number(percentile(coarse, 95).toFixed(1)),
      idle_fine_grid_after_open_ms: idleMs,
      chromium: version,
      cpus: os.cpus().length,
      // Other work on the machine skews the tail: report the load the figure was taken under.
      load_average_1min: Number(os.loadavg()[0]!.toFixed(2)),
      node: process.version,
    };
    console.log(JSON.stringify(result, null, 2));
    console.log(`input → contours while dragging 1 of ${WELLS} wells: median ${result.median_ms} ms, p95 ${result.p95_ms} ms (${result.frames_measured} frames; target ≤ 150 ms)`);
  } finally {
    await browser.close();
    await app.close();
  }
}

main().catch((error) => {
  console.error(`client-drag bench failed: ${(error as Error).message}`);
  process.exit(1);
});
