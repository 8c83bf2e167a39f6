// Micro-benchmark of the well functions: evaluations per second over representative arguments.
// Run alone with `npx tsx bench/well-functions.ts`; bench/run.ts calls runWellFunctionBench().
import { pathToFileURL } from 'node:url';
import { besselK0, hantushWellFunction, theisWellFunction } from '../shared/wells';

/** Deterministic log-uniform arguments in [lo, hi] (a small LCG, so runs are comparable). */
function logUniform(n: number, lo: number, hi: number, seed: number): Float64Array {
  const out = new Float64Array(n);
  let state = seed >>> 0;
  const span = Math.log(hi / lo);
  for (let i = 0; i < n; i++) {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    out[i] = lo * Math.exp((state / 4294967296) * span);
  }
  return out;
}

interface Case {
  readonly label: string;
  /** Evaluates the function over all prepared arguments once; returns a checksum. */
  readonly run: () => number;
  readonly count: number;
}

function measure(c: Case, minTime_ms: number): number {
  c.run(); // warm-up: let the JIT specialise the code paths
  c.run();
  let best = 0;
  for (let trial = 0; trial < 3; trial++) {
    let evaluations = 0;
    const start = performance.now();
    let elapsed = 0;
    let sink = 0;
    while (elapsed < minTime_ms) {
      sink += c.run();
      evaluations += c.count;
      elapsed = performance.now() - start;
    }
    if (!Number.isFinite(sink)) throw new Error(`${c.label}: non-finite checksum`);
    best = Math.max(best, evaluations / (elapsed / 1000));
  }
  return best;
}

/**
 * Runs the well-function micro-benchmark and returns lines to print: evaluations per second
 * (best of three timed runs of at least 200 ms each) for W(u), K0(x) and W(u, r/B).
 */
export async function runWellFunctionBench(): Promise<string[]> {
  const n = 100_000;
  const uTheis = logUniform(n, 1e-8, 100, 1);
  const uSmall = logUniform(n, 1e-8, 1, 2);
  const xK0 = logUniform(n, 1e-4, 50, 3);
  const uLeaky = logUniform(n, 1e-8, 20, 4);
  const bLeaky = logUniform(n, 1e-4, 10, 5);
  const bLarge = logUniform(n, 4, 10, 6);
  const sum1 = (f: (a: number) => number, a: Float64Array) => () => {
    let s = 0;
    for (let i = 0; i < a.length; i++) s += f(a[i]!);
    return s;
  };
  const sum2 = (a: Float64Array, b: Float64Array) => () => {
    let s = 0;
    for (let i = 0; i < a.length; i++) s += hantushWellFunction(a[i]!, b[i]!);
    return s;
  };
  const cases: Case[] = [
    { label: 'W(u) = E1(u), u log-uniform in [1e-8, 100]', run: sum1(theisWellFunction, uTheis), count: n },
    { label: 'W(u) = E1(u), u log-uniform in [1e-8, 1]', run: sum1(theisWellFunction, uSmall), count: n },
    { label: 'K0(x), x log-uniform in [1e-4, 50]', run: sum1(besselK0, xK0), count: n },
    { label: 'W(u, r/B), u in [1e-8, 20], r/B in [1e-4, 10]', run: sum2(uLeaky, bLeaky), count: n },
    { label: 'W(u, r/B), u in [1e-8, 20], r/B in [4, 10] (quadrature)', run: sum2(uLeaky, bLarge), count: n },
  ];
  const lines = ['well functions (evaluations per second, single thread):'];
  for (const c of cases) {
    const rate = measure(c, 200);
    lines.push(`  ${c.label.padEnd(60)} ${(rate / 1e6).toFixed(2).padStart(8)} M/s`);
  }
  return lines;
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  for (const line of await runWellFunctionBench()) console.log(line);
}
