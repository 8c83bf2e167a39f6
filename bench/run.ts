/**
 * `npm run bench`: speed of the field engine's hot path (evaluateGrid) against a vectorised
 * numpy/scipy evaluation of the same sums, then the other parts' benches when present.
 *
 * Case: a 250 × 250 grid, 400 wells on the perimeter of a 120 m × 80 m pit, Theis transient at
 * 30 days, one no-flow boundary (400 images → 800 point sources). Invented numbers.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { availableParallelism, loadavg } from 'node:os';
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
  ['client-drag.ts', 'runClientDragBench'],
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
/** Rows of the ratio table: label, wall s, CPU s (null: wall only, e.g. several threads). */
type TimedRun = readonly [string, number, number | null];

function compareWithNumpy(sources: SourceSet, drawdown: Float64Array, nodes: number, evaluations: number, runs: readonly TimedRun[]): void {
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
    for (const [label, wall, cpu] of runs)
      console.log(`  speed ratio numpy time / TypeScript time, ${label}: ${fmt(info.seconds / wall)}× on wall time${cpu !== null ? `, ${fmt(info.cpuSeconds / cpu)}× on CPU time` : ''} (above 1 = TypeScript faster)`);
    console.log(`  agreement: max |Δ drawdown| = ${maxDiff.toExponential(2)} m over the grid (max drawdown ${fmt(maxAbs)} m)`);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** The commit before the speed work of issue 15: the whole-process "before" runs its CLI. */
const BEFORE_COMMIT = '8c4e732';
const root = join(here, '..');

function bestOf<T>(runs: number, fn: () => T): { value: T; wall_s: number; cpu_s: number } {
  let wall_s = Number.POSITIVE_INFINITY;
  let cpu_s = Number.POSITIVE_INFINITY;
  let value = fn(); // warm-up: JIT compiles the inner loops
  for (let r = 0; r < runs; r++) {
    const t0 = performance.now();
    const c0 = process.cpuUsage();
    value = fn();
    const c1 = process.cpuUsage(c0);
    wall_s = Math.min(wall_s, (performance.now() - t0) / 1000);
    cpu_s = Math.min(cpu_s, (c1.user + c1.system) / 1e6);
  }
  return { value, wall_s, cpu_s };
}

/** Grid bands on warm worker threads (the CLI's own band threads), best of `runs` wall times. */
async function threadedGrid(scenario: Scenario, threads: number, runs: number): Promise<{ wall_s: number; drawdown: Float64Array }> {
  const { startBandThreads } = await import('../server/cli/band-threads');
  const { joinGridBands, splitRows } = await import('../server/evaluation');
  const pool = startBandThreads(threads);
  try {
    const once = async () => {
      const bands = await Promise.all(splitRows(BENCH_GRID.counts[1], threads).map((rows) =>
        pool.runBand({ scenario, grid: BENCH_GRID, time_s: scenario.design.time_s, rows })));
      return joinGridBands(BENCH_GRID, bands).drawdown_m;
    };
    let drawdown = await once(); // warm-up: threads start and compile
    let wall_s = Number.POSITIVE_INFINITY;
    for (let r = 0; r < runs; r++) {
      const t0 = performance.now();
      drawdown = await once();
      wall_s = Math.min(wall_s, (performance.now() - t0) / 1000);
    }
    return { wall_s, drawdown };
  } finally {
    await pool.close();
  }
}

/** Wall time of a whole process, best of `runs`, stdout to a file. */
function processTime(command: string, args: string[], cwd: string, runs: number, env: NodeJS.ProcessEnv = process.env): number {
  let best = Number.POSITIVE_INFINITY;
  for (let r = 0; r < runs; r++) {
    const t0 = performance.now();
    execFileSync(command, args, { cwd, env, stdio: ['ignore', 'ignore', 'pipe'], timeout: 600_000 });
    best = Math.min(best, (performance.now() - t0) / 1000);
  }
  return best;
}

/** The whole `drydig evaluate --grid` process before (the CLI of BEFORE_COMMIT) and after, against a whole numpy process. */
function compareWholeProcess(scenario: Scenario, sources: SourceSet, threads: number): void {
  const dir = mkdtempSync(join(tmpdir(), 'drydig-bench-process-'));
  const before = join(dir, 'before');
  try {
    const file = join(dir, 'scenario.json');
    writeFileSync(file, JSON.stringify(scenario));
    const g = BENCH_GRID;
    const gridArg = `${g.origin[0]},${g.origin[1]},${g.spacing_m[0]},${g.spacing_m[1]},${g.counts[0]},${g.counts[1]}`;
    const input = join(dir, 'sources.json');
    writeFileSync(input, JSON.stringify({ origin: g.origin, spacing_m: g.spacing_m, counts: g.counts, x: Array.from(sources.x), y: Array.from(sources.y), amp: Array.from(sources.amp), coef: Array.from(sources.coef), r2min: Array.from(sources.r2min) }));
    const runs = 3;
    const numpyEnv = { ...process.env, OMP_NUM_THREADS: '1', OPENBLAS_NUM_THREADS: '1', MKL_NUM_THREADS: '1' };
    let python: number;
    try {
      python = processTime('python3', [join(here, 'grid_numpy.py'), input, join(dir, 'out.f64'), '--once'], root, runs, numpyEnv);
    } catch {
      console.log('  whole process: numpy/scipy comparison skipped (python3 with numpy and scipy not found)');
      return;
    }
    const builtCli = existsSync(join(root, 'dist', 'cli', 'drydig.mjs'));
    const after = builtCli ? processTime('node', [join(root, 'bin', 'drydig.js'), 'evaluate', file, '--grid', gridArg, '--threads', String(threads)], root, runs) : Number.NaN;
    let beforeTime = Number.NaN;
    try {
      execFileSync('git', ['worktree', 'add', '--detach', before, BEFORE_COMMIT], { cwd: root, stdio: 'ignore' });
      symlinkSync(join(root, 'node_modules'), join(before, 'node_modules'));
      beforeTime = processTime('node', [join(before, 'bin', 'drydig.js'), 'evaluate', file, '--grid', gridArg], before, runs);
    } catch (error) {
      console.log(`  whole process before: the CLI of ${BEFORE_COMMIT} could not be run (${error instanceof Error ? error.message.split('\n')[0] : String(error)})`);
    }
    console.log(`  whole process, \`drydig evaluate --grid\` against \`python3 bench/grid_numpy.py --once\` (start-up, reading, writing; best of ${runs} wall):`);
    console.log(`    numpy/scipy process ${fmt(python)} s`);
    console.log(`    before (${BEFORE_COMMIT}: TypeScript compiled at start, pairwise kernel, 1 thread) ${fmt(beforeTime)} s → ratio ${fmt(python / beforeTime)}×`);
    console.log(`    after (built CLI, grouped kernel, --threads ${threads}) ${builtCli ? `${fmt(after)} s → ratio ${fmt(python / after)}×` : 'not built: run `npm run build` first'}`);
  } finally {
    try {
      execFileSync('git', ['worktree', 'remove', '--force', before], { cwd: root, stdio: 'ignore' });
    } catch {
      // Not created: nothing to remove.
    }
    rmSync(dir, { recursive: true, force: true });
  }
}

async function main(): Promise<void> {
  const scenario = makeBenchScenario();
  const field = prepareField({ scenario });
  const sources = field.sources;
  const nodes = BENCH_GRID.counts[0] * BENCH_GRID.counts[1];
  const evaluations = sources.count * nodes;
  const threads = Math.max(1, availableParallelism());
  const [l1, l5] = loadavg();

  const before = bestOf(3, () => evaluateGrid({ scenario, grid: BENCH_GRID, kernel: 'pairwise' }));
  const after = bestOf(3, () => evaluateGrid({ scenario, grid: BENCH_GRID }));
  const threaded = await threadedGrid(scenario, threads, 3);
  let bandDiff = 0;
  for (let i = 0; i < nodes; i++) bandDiff = Math.max(bandDiff, Math.abs(threaded.drawdown[i]! - after.value.drawdown_m[i]!));
  console.log(`field engine: ${BENCH_GRID.counts[0]}×${BENCH_GRID.counts[1]} grid × ${sources.count} sources (${scenario.wells.length} wells + ${field.info.imagesPerWell} image each), Theis transient; load average ${l1!.toFixed(2)} ${l5!.toFixed(2)}, ${threads} cores`);
  console.log(`  before: pairwise kernel (one logarithm per pair), 1 thread: wall ${fmt(before.wall_s)} s, CPU ${fmt(before.cpu_s)} s (best of 3); ${fmt(evaluations / before.wall_s)} evaluations/s`);
  console.log(`  after: grouped kernel (one logarithm per node per chunk of equal-|amp| sources), 1 thread: wall ${fmt(after.wall_s)} s, CPU ${fmt(after.cpu_s)} s; ${fmt(before.wall_s / after.wall_s)}× before`);
  console.log(`  after: grouped kernel, ${threads} worker threads by rows: wall ${fmt(threaded.wall_s)} s; ${fmt(before.wall_s / threaded.wall_s)}× before; bands equal the whole grid ${bandDiff === 0 ? 'bit for bit' : `to ${bandDiff.toExponential(2)} m`}`);

  compareWithNumpy(sources, after.value.drawdown_m, nodes, evaluations, [
    ['before, 1 thread', before.wall_s, before.cpu_s],
    ['after, 1 thread', after.wall_s, after.cpu_s],
    [`after, ${threads} threads`, threaded.wall_s, null],
  ]);
  compareWholeProcess(scenario, sources, threads);

  // Benches of the other parts, each optional: run when the file and its entry point exist.
  // `npm run bench -- --grid-only` stops here.
  if (process.argv.includes('--grid-only')) return;
  for (const [file, entry] of OTHER_BENCHES) await runOptionalBench(file, entry);
}

await main();
