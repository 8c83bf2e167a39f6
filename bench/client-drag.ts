/**
 * Responsiveness of the plan map: drag one well with the mouse and measure, in the browser, the
 * time from each pointer input to the contours and shortfall flags drawn for it
 * (performance.measure 'dd-input-to-contours', taken for the oldest input each drawn result
 * reflects). Prints p50 / p90 / p95 for 66 wells (the well-point demo) and 500 wells on a
 * 200 × 200 grid, BEFORE (`?drag=coarse`: a coarse grid evaluated in full per frame) and AFTER
 * (the fine grid kept in the worker and updated well by well), side by side. Goal: p90 ≤ 16 ms
 * for 500 wells. Also the fine map after release (worker time, contours and shortfall included):
 * before in the engine worker alone (`?stripWorkers=off`), after split over one strip worker per
 * core.
 *
 * Run: npx tsx bench/client-drag.ts [--moves 120] [--interval 16] [--verbose]  (also part of
 * `npm run bench`). It builds the client, starts the real server on 127.0.0.1 (random port) and
 * drives Debian's Chromium headless.
 */
import { execSync } from 'node:child_process';
import os from 'node:os';
import { pathToFileURL } from 'node:url';
import { chromium, type Browser } from 'playwright-core';
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
/** Fine grid nodes on the longer side of the view (the 200 × 200). */
const GRID_NODES = 200;

/** The demo site, or its pit ringed by `wells` well points (invented, for the bench only). */
function benchScenario(wells: number | null): Scenario {
  const s = structuredClone(demo) as unknown as Scenario;
  if (wells === null) return s;
  s.name = `Bench: ${wells} well points`;
  s.excavations = [{ id: 'pit-A', outline: [[0, 0], [100, 0], [100, 50], [0, 50]], formationLevel_m: 7, margin_m: 0.5 }];
  const ring = layoutWellRing({ outline: s.excavations[0]!.outline, offset_m: 1.5, spacing_m: 312 / wells });
  s.wells = ring.positions.slice(0, wells).map(([x, y], k) => ({
    id: `WP${String(k + 1).padStart(3, '0')}`, x, y, radius_m: 0.05, kind: 'wellpoint', rate_m3_s: 0.0004 * 200 / wells,
  }));
  return s;
}

function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return Number.NaN;
  const i = Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1));
  return sorted[i]!;
}

interface DragFigures { frames: number; p50_ms: number; p90_ms: number; p95_ms: number; worker_median_ms: number; incremental_frames: number; fine_ms: number; strip_workers: number }

/** One drag of one well across the pit and back, `MOVES` pointer moves `INTERVAL_MS` apart. */
async function measureDrag(browser: Browser, port: number, scenario: Scenario, drag: 'coarse' | 'incremental'): Promise<DragFigures> {
  const page = await browser.newPage({ viewport: { width: 1440, height: 900 } });
  try {
    const waitIdle = (after: number) => page.waitForFunction(
      (n) => {
        const h = (window as unknown as { __drydig?: { fieldsDrawn: number; busy(): boolean } }).__drydig;
        return !!h && h.fieldsDrawn > n && !h.busy();
      },
      after, { timeout: 120_000, polling: 20 },
    );
    const drawn = () => page.evaluate(() => (window as unknown as { __drydig: { fieldsDrawn: number } }).__drydig.fieldsDrawn);
    await page.goto(`http://127.0.0.1:${port}/?gridNodes=${GRID_NODES}${drag === 'coarse' ? '&drag=coarse&stripWorkers=off' : ''}`);
    await waitIdle(0);
    let before = await drawn();
    await page.setInputFiles('input[name="open-scenario"]', { name: 'bench.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify(scenario)) });
    await waitIdle(before);
    await page.waitForTimeout(400);
    await waitIdle(0);
    const count = await page.locator('path.dd-well').count();
    if (count !== scenario.wells.length) throw new Error(`expected ${scenario.wells.length} wells on the map, found ${count}`);
    await page.evaluate(() => {
      (window as unknown as { __drydig: { latencies_ms: number[]; computes: unknown[] } }).__drydig.latencies_ms.length = 0;
      (window as unknown as { __drydig: { computes: unknown[] } }).__drydig.computes.length = 0;
      performance.clearMeasures('dd-input-to-contours');
    });
    // Drag a well on the south side across the pit and back, as a designer trying positions.
    const target = scenario.wells[Math.min(20, scenario.wells.length - 1)]!;
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
    const computes = await page.evaluate(() => (window as unknown as { __drydig: { computes: Array<{ mode: string; compute_ms: number; stripWorkers: number }> } }).__drydig.computes);
    const fine = computes.filter((c) => c.mode === 'fine').at(-1);
    const dragComputes = computes.filter((c) => c.mode === 'coarse').map((c) => c.compute_ms).sort((a, b) => a - b);
    if (process.argv.includes('--verbose')) console.log(JSON.stringify({ drag, latencies: latencies.map((v) => Math.round(v)), computes: computes.map((c) => `${c.mode[0]}${Math.round(c.compute_ms)}`) }));
    const sorted = latencies.slice().sort((a, b) => a - b);
    const round = (v: number) => Number(v.toFixed(1));
    return {
      frames: sorted.length, p50_ms: round(percentile(sorted, 50)), p90_ms: round(percentile(sorted, 90)), p95_ms: round(percentile(sorted, 95)),
      worker_median_ms: round(percentile(dragComputes, 50)), incremental_frames: dragComputes.length,
      fine_ms: round(fine?.compute_ms ?? Number.NaN), strip_workers: fine?.stripWorkers ?? 1,
    };
  } finally {
    await page.close();
  }
}

/** Runs the drag bench; returns its lines (for `npm run bench`). */
export async function runClientDragBench(): Promise<string[]> {
  execSync('npx vite build --config client/vite.config.ts --logLevel error', { stdio: 'ignore' });
  const app = await buildApp({ clientDir: 'client/dist', dataDir: ':memory:' });
  await app.listen({ host: '127.0.0.1', port: 0 });
  const address = app.server.address();
  const port = typeof address === 'object' && address ? address.port : 0;
  const browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--no-first-run'],
  });
  const lines: string[] = [];
  try {
    lines.push(`client drag (Chromium ${browser.version()}, ${os.cpus().length} cores, load ${os.loadavg()[0]!.toFixed(2)}): input → contours and shortfall flags, ${MOVES} moves ${INTERVAL_MS} ms apart; view grid ${GRID_NODES} nodes on the long side`);
    lines.push('  case                         before (coarse grid, full per frame)   after (fine grid, well by well)   p90 ratio');
    const fineRows: Array<[string, DragFigures, DragFigures]> = [];
    for (const [label, wells] of [['66 wells (well-point demo)', null], ['500 wells', 500]] as const) {
      const scenario = benchScenario(wells);
      const b = await measureDrag(browser, port, scenario, 'coarse');
      const a = await measureDrag(browser, port, scenario, 'incremental');
      const fmt = (f: DragFigures) => `p50 ${f.p50_ms} / p90 ${f.p90_ms} ms (worker ${f.worker_median_ms} ms, ${f.frames} frames)`;
      lines.push(`  ${label.padEnd(28)} ${fmt(b).padEnd(38)} ${fmt(a).padEnd(33)} ${(b.p90_ms / a.p90_ms).toFixed(2)}×`);
      fineRows.push([label, b, a]);
    }
    for (const [label, b, a] of fineRows) {
      lines.push(`  ${label.padEnd(28)} fine map after release: ${b.fine_ms} ms in ${b.strip_workers} worker → ${a.fine_ms} ms over ${a.strip_workers} strip workers (${(b.fine_ms / a.fine_ms).toFixed(2)}×)`);
    }
    lines.push('  goal: p90 ≤ 16 ms for 500 wells on a 200 × 200 grid');
  } finally {
    await browser.close();
    await app.close();
  }
  return lines;
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  runClientDragBench().then((lines) => {
    for (const line of lines) console.log(line);
  }, (error: unknown) => {
    console.error(`client-drag bench failed: ${(error as Error).message}`);
    process.exit(1);
  });
}
