/**
 * Speed of the Monte Carlo analysis (issue 11): 1000 realisations of the Ferry Road deep-well demo
 * (K lognormal, spread 2, seed 1), each re-evaluating the chosen rates and re-solving the least
 * total flow, on 1 and on 2 worker threads of the compute pool. Prints the time, the speed-up, the
 * cores and the load average (the machine may be shared). Threads are started and warmed (tsx,
 * the engine, HiGHS loaded) before the clock starts; the warm-up is printed apart.
 *
 * Run: npx tsx bench/monte-carlo.ts [RUNS]   (also picked up by npm run bench)
 */
import { readFileSync } from 'node:fs';
import { availableParallelism, cpus, loadavg } from 'node:os';
import { pathToFileURL } from 'node:url';
import { planMonteCarlo, runDesign, runMonteCarlo, type DesignBasis } from '../shared/design';
import { createComputePool } from '../server/compute';

const s = (ms: number) => `${(ms / 1000).toFixed(2)} s`;

/** Runs the bench; returns one line per measurement. */
export async function runMonteCarloBench(runs = 1000): Promise<string[]> {
  const scenario = JSON.parse(readFileSync(new URL('../fixtures/demo-deepwells-confined.json', import.meta.url), 'utf8')) as unknown;
  let basis: DesignBasis | undefined;
  await runDesign({ scenario, onBasis: (b) => (basis = b) });
  const plan = planMonteCarlo(basis!.scenario, { runs, seed: 1, kSpread: 2 });
  const lines = [`monte carlo: ${runs} realisations of the Ferry Road demo (6 deep wells, ${basis!.checkPoints.length} check points), cores ${availableParallelism()} (${cpus()[0]?.model ?? '?'}), load average before ${loadavg().map((v) => v.toFixed(1)).join(' ')}`];
  const times = new Map<number, number>();
  let reference: string | null = null;
  for (const threads of [1, 2]) {
    const pool = createComputePool({ threads, perClientSlots: threads, timeout_ms: 600_000 });
    try {
      let t0 = performance.now();
      // Warm every thread: one realisation each, at once.
      await Promise.all(Array.from({ length: threads }, () => pool.run('realisations', { basis: basis!, kFactors: [1], sFactors: [1] })));
      const warm = performance.now() - t0;
      t0 = performance.now();
      const cpu0 = process.cpuUsage();
      const outcomes = await runMonteCarlo({ basis: basis!, plan, concurrency: threads, runChunk: (chunk) => pool.run('realisations', chunk) });
      const ms = performance.now() - t0;
      // CPU time of the whole process, worker threads included: on a shared machine it says what the work costs.
      const cpu = process.cpuUsage(cpu0);
      const cpu_ms = (cpu.user + cpu.system) / 1000;
      times.set(threads, ms);
      const key = JSON.stringify(outcomes);
      if (reference === null) reference = key;
      lines.push(
        `monte carlo: ${threads} worker(s): ${s(ms)} wall (${(ms / runs).toFixed(1)} ms per realisation), CPU ${s(cpu_ms)} (${(cpu_ms / runs).toFixed(1)} ms per realisation; ` +
          `idle-machine estimate ${s(cpu_ms / threads)}); thread start and warm-up ${s(warm)} before; same outcomes as 1 worker: ${key === reference}`,
      );
    } finally {
      await pool.close();
    }
  }
  lines.push(`monte carlo: speed-up 1 → 2 workers ${(times.get(1)! / times.get(2)!).toFixed(2)}×; goal ≤ 5 s for ${runs}: ${times.get(2)! <= 5000 ? 'met' : 'not met'} on this machine; load average after ${loadavg().map((v) => v.toFixed(1)).join(' ')}`);
  return lines;
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const runs = Number(process.argv[2] ?? 1000);
  for (const line of await runMonteCarloBench(runs)) console.log(line);
}
