/**
 * `npm run bench`: speed of the field engine's hot path (evaluateGrid) against a vectorised
 * numpy/scipy evaluation of the same sums, then the other parts' benches when present.
 *
 * Case: a 250 × 250 grid, 400 wells on the perimeter of a 120 m × 80 m pit, Theis transient at
 * 30 days, one no-flow boundary (400 images → 800 point sources). Invented numbers.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, dirname } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { Scenario } from '../shared/schema';
import { evaluateGrid, prepareField, type GridSpec, type SourceSet } from '../shared/field';
import { pointsAroundRectangle } from './points-around-rectangle';

const here = dirname(fileURLToPath(import.meta.url));

/** The benchmark scenario: confined aquifer, 400 wells, one no-flow line 150 m east of the pit. */
export function makeBenchScenario(): Scenario {
  const wells: Scenario['wells'] = pointsAroundRectangle(120, 80, 400).map(([x, y], k) => (
    { id: `B${k}`, x: x - 60, y: y - 40, radius_m: 0.1, kind: 'deep', rate_m3_s: 0.00015 }));
  return {
    format: 'drydig.scenario',
    version: 1,
    name: 'benchmark (invented)',
    groundLevel_m: 10,
    aquifer: { kind: 'confined', conductivity_m_s: 2e-4, base_m: -20, top_m: 0, staticLevel_m: 8, storativity: 2e-4 },
    boundaries: [{ kind: 'no-flow', from: [210, -500], to: [210, 500] }],
    excavations: [],
    wells,
    design: { time_s: 30 * 86400 },
  };
}

export const BENCH_GRID: GridSpec = { origin: [-200, -200], spacing_m: [1.6, 1.6], counts: [250, 250] };

function fmt(n: number, digits = 3): string {
  return Number(n.toPrecision(digits)).toLocaleString('en-US');
}

/** Other parts' benches: file in bench/ and the exported function that runs it (returns lines or prints them). */
const OTHER_BENCHES: ReadonlyArray<readonly [string, string]> = [
  ['well-functions.ts', 'runWellFunctionBench'],
  ['design.ts', 'runDesignBench'],
  ['load.ts', 'runLoadBench'],
  ['section.ts', 'runSectionBench'],
  ['monte-carlo.ts', 'runMonteCarloBench'],
  ['health-under-load.ts', 'runHealthUnderLoadBench'],
];

async function runOptionalBench(file: string, entry: string): Promise<void> {
  const path = join(here, file);
  if (!existsSync(path)) {
    console.log(`${file}: not present; skipped`);
    return;
  }
  try {
    const mod = (await import(pathToFileURL(path).href)) as Record<string, unknown>;
    const run = mod[entry];
    if (typeof run !== 'function') {
      console.log(`${file}: no ${entry}() export; skipped`);
      return;
    }
    const lines: unknown = await (run as () => unknown)();
    if (Array.isArray(lines)) for (const line of lines) console.log(String(line));
  } catch (error) {
    // One part's bench failing must not hide the others' figures.
    console.log(`${file}: ${entry}() failed: ${error instanceof Error ? error.message : String(error)}`);
  }
}

/** Runs bench/grid_numpy.py on the same sources and prints its time, the ratio and the agreement. */
function compareWithNumpy(sources: SourceSet, drawdown: Float64Array, nodes: number, evaluations: number, best: number, bestCpu: number): void {
  const dir = mkdtempSync(join(tmpdir(), 'drydig-bench-'));
  try {
    const input = join(dir, 'sources.json');
    const output = join(dir, 'drawdown.f64');
    writeFileSync(
      input,
      JSON.stringify({
        origin: BENCH_GRID.origin,
        spacing_m: BENCH_GRID.spacing_m,
        counts: BENCH_GRID.counts,
        x: Array.from(sources.x),
        y: Array.from(sources.y),
        amp: Array.from(sources.amp),
        coef: Array.from(sources.coef),
        r2min: Array.from(sources.r2min),
      }),
    );
    let stdout: string;
    try {
      stdout = execFileSync('python3', [join(here, 'grid_numpy.py'), input, output], {
        env: { ...process.env, OMP_NUM_THREADS: '1', OPENBLAS_NUM_THREADS: '1', MKL_NUM_THREADS: '1' },
        encoding: 'utf8',
        stdio: ['ignore', 'pipe', 'pipe'],
        timeout: 600_000,
      });
    } catch (error) {
      const reason = (error as { code?: string; stderr?: string }).code === 'ENOENT' ? 'python3 not found' : ((error as { stderr?: string }).stderr ?? String(error)).trim().split('\n').pop();
      console.log(`  numpy/scipy comparison skipped: ${reason}`);
      return;
    }
    const info = JSON.parse(stdout.trim().split('\n').pop()!) as { seconds: number; cpuSeconds: number; numpy: string; scipy: string };
    const buf = readFileSync(output);
    const ref = new Float64Array(buf.buffer, buf.byteOffset, buf.byteLength / 8);
    let maxDiff = 0;
    let maxAbs = 0;
    for (let i = 0; i < nodes; i++) {
      maxDiff = Math.max(maxDiff, Math.abs(ref[i]! - drawdown[i]!));
      maxAbs = Math.max(maxAbs, Math.abs(ref[i]!));
    }
    console.log(`  numpy ${info.numpy} / scipy ${info.scipy} (exp1, 1 thread): wall ${fmt(info.seconds)} s, CPU ${fmt(info.cpuSeconds)} s (best of 3); ${fmt(evaluations / info.seconds)} evaluations/s (wall)`);
    // CPU time is the fairer figure on a shared machine: wall time includes waiting for a core.
    console.log(`  speed ratio numpy time / TypeScript time: ${fmt(info.cpuSeconds / bestCpu)}× on CPU time, ${fmt(info.seconds / best)}× on wall time (above 1 = TypeScript faster)`);
    console.log(`  agreement: max |Δ drawdown| = ${maxDiff.toExponential(2)} m over the grid (max drawdown ${fmt(maxAbs)} m)`);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

async function main(): Promise<void> {
  const scenario = makeBenchScenario();
  const field = prepareField({ scenario });
  const sources = field.sources;
  const nodes = BENCH_GRID.counts[0] * BENCH_GRID.counts[1];
  const evaluations = sources.count * nodes;

  evaluateGrid({ scenario, grid: BENCH_GRID }); // warm-up: JIT compiles the inner loops
  const runs = 3;
  let best = Number.POSITIVE_INFINITY;
  let bestCpu = Number.POSITIVE_INFINITY;
  let result = evaluateGrid({ scenario, grid: BENCH_GRID });
  for (let r = 0; r < runs; r++) {
    const t0 = performance.now();
    const c0 = process.cpuUsage();
    result = evaluateGrid({ scenario, grid: BENCH_GRID });
    const c1 = process.cpuUsage(c0);
    best = Math.min(best, (performance.now() - t0) / 1000);
    bestCpu = Math.min(bestCpu, (c1.user + c1.system) / 1e6);
  }
  console.log(`field engine: ${BENCH_GRID.counts[0]}×${BENCH_GRID.counts[1]} grid × ${sources.count} sources (${scenario.wells.length} wells + ${field.info.imagesPerWell} image each), Theis transient`);
  console.log(`  TypeScript evaluateGrid: wall ${fmt(best)} s, CPU ${fmt(bestCpu)} s (best of ${runs}); ${fmt(evaluations / best)} point-source evaluations/s (wall), ${fmt(evaluations / bestCpu)}/s (CPU)`);

  compareWithNumpy(sources, result.drawdown_m, nodes, evaluations, best, bestCpu);

  // Benches of the other parts, each optional: run when the file and its entry point exist.
  for (const [file, entry] of OTHER_BENCHES) await runOptionalBench(file, entry);
}

await main();
