/**
 * Monte Carlo analysis of the design (design.md §8): K lognormal with median the scenario's K and
 * geometric standard deviation F (K/F … K·F holds 68 %), optionally S lognormal and independent.
 * Each realisation re-evaluates the chosen rates (are every target met?) and re-solves the least
 * total flow (`scaled-design.ts`). Results: the probability the chosen rates meet every target,
 * P50/P90 of the re-solved total flow, a histogram.
 *
 * Reproducible: every realisation's factors are drawn up front from one seeded stream
 * (`random-numbers.ts`), so splitting the realisations into chunks — over worker threads or in
 * process — never changes the answer.
 */
import type { PumpingTestRecord, Scenario } from '../schema';
import { DrydigError, type DesignOptions } from '../schema';
import { normalQuantile } from '../testing/student-t-quantile';
import type { PumpSummary } from './design-result';
import { createNormalSource, createUniformSource } from './random-numbers';
import { evaluateRates, prepareScaledCase, ratesFor, solveScaledCase, type DesignBasis } from './scaled-design';
import type { BidAtFlow, UncertaintyResult } from './uncertainty-result';

/** K spread when neither the options nor a pumping test give one: our own placeholder, no source. */
export const DEFAULT_K_SPREAD = 2;
export const DEFAULT_SEED = 1;
export const DEFAULT_HISTOGRAM_BINS = 20;

/** What a Monte Carlo run will do: its settings and every realisation's factors. */
export interface MonteCarloPlan {
  runs: number;
  seed: number;
  kSpread: number;
  kSpreadSource: UncertaintyResult['kSpreadSource'];
  sSpread: number;
  bins: number;
  priceAtP90: boolean;
  kFactors: number[];
  sFactors: number[];
}

/**
 * Geometric standard deviation of K from a pumping test's confidence interval [lo, hi] at level c:
 * ln K is taken as normal, so ln(hi/lo) = 2·z·ln F with z the (1 + c)/2 normal quantile.
 */
export function kSpreadFromInterval(interval: readonly [number, number], confidence: number): number {
  const z = normalQuantile((1 + confidence) / 2);
  return Math.exp(Math.log(interval[1] / interval[0]) / (2 * z));
}

/** The spread of K: the option, else the scenario's pumping-test interval, else the default. */
function chooseKSpread(scenario: Scenario, asked: number | undefined): { kSpread: number; source: MonteCarloPlan['kSpreadSource'] } {
  if (asked !== undefined) return { kSpread: asked, source: 'option' };
  const test = (scenario as { pumpingTest?: PumpingTestRecord }).pumpingTest;
  const interval = test?.conductivityInterval_m_s;
  if (interval && interval[0] > 0 && interval[1] > interval[0]) return { kSpread: kSpreadFromInterval(interval, test.confidence ?? 0.95), source: 'pumping-test' };
  return { kSpread: DEFAULT_K_SPREAD, source: 'default' };
}

/** The plan of a Monte Carlo run: defaults filled, factors drawn (K first, then S, per realisation). */
export function planMonteCarlo(scenario: Scenario, asked: NonNullable<DesignOptions['monteCarlo']>): MonteCarloPlan {
  const seed = asked.seed ?? DEFAULT_SEED;
  const { kSpread, source } = chooseKSpread(scenario, asked.kSpread);
  const sSpread = asked.sSpread ?? 1;
  const normal = createNormalSource(createUniformSource(seed));
  const kFactors: number[] = [];
  const sFactors: number[] = [];
  const lnK = Math.log(kSpread);
  const lnS = Math.log(sSpread);
  for (let i = 0; i < asked.runs; i++) {
    kFactors.push(Math.exp(lnK * normal()));
    sFactors.push(sSpread > 1 ? Math.exp(lnS * normal()) : 1);
  }
  return { runs: asked.runs, seed, kSpread, kSpreadSource: source, sSpread, bins: asked.bins ?? DEFAULT_HISTOGRAM_BINS, priceAtP90: asked.priceAtP90 ?? false, kFactors, sFactors };
}

/** A slice of the realisations (plain data: it is sent to a worker thread). */
export interface RealisationChunk {
  basis: DesignBasis;
  kFactors: number[];
  sFactors: number[];
}

/** One realisation's answer. */
export interface RealisationOutcome {
  /** Re-solved least total flow, m³/s; null: no rates within the well limits meet every target. */
  total_m3_s: number | null;
  /** The chosen rates meet every target. */
  met: boolean;
  /** The scaled values left the physical range (not computed). */
  failed: boolean;
}

/** Runs a chunk of realisations in this thread; `onEach` after each one (progress). */
export async function runRealisationChunk(chunk: RealisationChunk, onEach: () => void = () => undefined): Promise<RealisationOutcome[]> {
  const out: RealisationOutcome[] = [];
  for (let i = 0; i < chunk.kFactors.length; i++) {
    try {
      const c = prepareScaledCase(chunk.basis, chunk.kFactors[i]!, chunk.sFactors[i]!);
      const met = evaluateRates(c, chunk.basis.checkPoints, ratesFor(c.ctx, chunk.basis.rates)).met;
      const solved = await solveScaledCase(chunk.basis, c);
      out.push({ total_m3_s: solved.totalRate_m3_s, met, failed: false });
    } catch (error) {
      if (!(error instanceof DrydigError)) throw error;
      out.push({ total_m3_s: null, met: false, failed: true });
    }
    onEach();
  }
  return out;
}

/** Runs a chunk somewhere (a worker thread of the pool, or in process). */
export type RealisationChunkRunner = (chunk: RealisationChunk) => Promise<RealisationOutcome[]>;

export interface RunMonteCarloOptions {
  basis: DesignBasis;
  plan: MonteCarloPlan;
  /** Default: in process, one chunk after another. */
  runChunk?: RealisationChunkRunner;
  /** Chunks in flight at once. Default 1. */
  concurrency?: number;
  /**
   * Realisations per chunk, fixed. Default: adaptive — the first chunks are small, later ones sized
   * from the time per realisation measured so far to take about `chunkTarget_ms` each (so a chunk
   * stays well inside a worker's time budget and progress moves steadily).
   */
  chunkSize?: number;
  /** Adaptive chunks: wall-clock time one chunk should take, ms. Default 2000. */
  chunkTarget_ms?: number;
  /** Realisations done so far, and the total. */
  onProgress?: (done: number, runs: number) => void;
  /** Stops handing out chunks (the ones running finish or are cancelled by their runner). */
  signal?: AbortSignal;
}

/** Most realisations in one adaptive chunk. */
const MAX_CHUNK = 200;
/** Realisations in each of the first adaptive chunks (before any time is measured). */
const FIRST_CHUNK = 4;

/**
 * Every realisation of the plan, in order, chunked over the runner. The factors were drawn up front,
 * so the chunking never changes the answer. Throws DRYDIG_ERR_CANCELLED when the signal aborts.
 */
export async function runMonteCarlo({ basis, plan, runChunk, concurrency = 1, chunkSize, chunkTarget_ms = 2000, onProgress, signal }: RunMonteCarloOptions): Promise<RealisationOutcome[]> {
  const results: Array<{ start: number; outcomes: RealisationOutcome[] }> = [];
  let done = 0;
  let next = 0;
  let measured_ms = 0;
  let measuredRuns = 0;
  const runner = runChunk ?? ((chunk: RealisationChunk) => runRealisationChunk(chunk));
  const sizeOfNext = () => {
    if (chunkSize !== undefined) return Math.max(1, Math.floor(chunkSize));
    if (measuredRuns === 0) return FIRST_CHUNK;
    return Math.max(1, Math.min(MAX_CHUNK, Math.round(chunkTarget_ms / Math.max(1e-3, measured_ms / measuredRuns))));
  };
  const cancelled = () => new DrydigError('DRYDIG_ERR_CANCELLED', 'the Monte Carlo run was cancelled before it finished');
  const worker = async () => {
    while (next < plan.runs) {
      if (signal?.aborted) throw cancelled();
      const s = next;
      const e = Math.min(plan.runs, s + sizeOfNext());
      next = e;
      const t0 = Date.now();
      const outcomes = await runner({ basis, kFactors: plan.kFactors.slice(s, e), sFactors: plan.sFactors.slice(s, e) });
      measured_ms += Date.now() - t0;
      measuredRuns += e - s;
      results.push({ start: s, outcomes });
      done += e - s;
      onProgress?.(done, plan.runs);
    }
  };
  await Promise.all(Array.from({ length: Math.max(1, Math.min(concurrency, plan.runs)) }, worker));
  if (signal?.aborted) throw cancelled();
  return results.sort((a, b) => a.start - b.start).flatMap((r) => r.outcomes);
}

/** Percentile p (0–1) of ascending values by linear interpolation between order statistics (Hyndman & Fan 1996, type 7); null when it falls on an infinite value. */
export function percentile(sorted: readonly number[], p: number): number | null {
  if (sorted.length === 0) return null;
  const h = (sorted.length - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.min(sorted.length - 1, lo + 1);
  const a = sorted[lo]!;
  const b = sorted[hi]!;
  if (!Number.isFinite(a) || !Number.isFinite(b)) return null;
  return a + (h - lo) * (b - a);
}

/** The bid's flow-dependent figures scaled to another total flow (heads, wells and quantities held). */
export function priceAtTotalFlow(summary: PumpSummary, total_m3_s: number): BidAtFlow {
  const ratio = summary.totalRate_m3_s > 0 ? total_m3_s / summary.totalRate_m3_s : 0;
  const energyCost = summary.energyCost * ratio;
  const pumpedVolumeCost = summary.pumpedVolumeCost * ratio;
  return {
    totalRate_m3_s: total_m3_s,
    designFlow_m3_s: summary.designFlow_m3_s * ratio,
    inputPower_kW: summary.inputPower_kW * ratio,
    installedPower_kW: summary.installedPower_kW * ratio,
    energy_kWh: summary.energy_kWh * ratio,
    dischargeVolume_m3: summary.dischargeVolume_m3 * ratio,
    energyCost,
    pumpedVolumeCost,
    wellCost: summary.wellCost,
    totalCost: energyCost + pumpedVolumeCost + summary.wellCost,
    currency: summary.currency,
    note: 'Flow-dependent figures (power, energy, volume, their costs) scaled from the design by P90 / design total; pump heads, wells and quantities held at the design’s. Size pumps on the P90 flow only after checking their heads.',
  };
}

export interface SummariseMonteCarloOptions {
  plan: MonteCarloPlan;
  outcomes: readonly RealisationOutcome[];
  elapsed_ms: number;
  workers: number;
  /** The design's bid summary (for the P90 price, when asked). */
  summary: PumpSummary;
}

/** The `uncertainty` block of the result. */
export function summariseMonteCarlo({ plan, outcomes, elapsed_ms, workers, summary }: SummariseMonteCarloOptions): UncertaintyResult {
  const n = outcomes.length;
  const totals = outcomes.map((o) => o.total_m3_s ?? Infinity).sort((a, b) => a - b);
  const feasible = totals.filter((t) => Number.isFinite(t));
  const p50 = percentile(totals, 0.5);
  const p90 = percentile(totals, 0.9);
  const histogram: UncertaintyResult['histogram'] = [];
  if (feasible.length > 0) {
    const lo = feasible[0]!;
    const hi = feasible[feasible.length - 1]!;
    const width = hi > lo ? (hi - lo) / plan.bins : Math.max(lo * 1e-3, 1e-9);
    const bins = hi > lo ? plan.bins : 1;
    for (let b = 0; b < bins; b++) histogram.push({ from_m3_s: lo + b * width, to_m3_s: lo + (b + 1) * width, count: 0 });
    for (const t of feasible) histogram[Math.min(bins - 1, Math.floor((t - lo) / width))]!.count++;
  }
  return {
    runs: n,
    seed: plan.seed,
    kSpread: plan.kSpread,
    kSpreadSource: plan.kSpreadSource,
    sSpread: plan.sSpread,
    probabilityMet: n > 0 ? outcomes.filter((o) => o.met).length / n : 0,
    feasibleShare: n > 0 ? feasible.length / n : 0,
    totalRate_m3_s: { p50, p90, mean: feasible.length > 0 ? feasible.reduce((s, t) => s + t, 0) / feasible.length : null },
    histogram,
    ...(plan.priceAtP90 && p90 !== null ? { bidAtP90: priceAtTotalFlow(summary, p90) } : {}),
    failedRuns: outcomes.filter((o) => o.failed).length,
    elapsed_ms,
    workers,
    note:
      `K lognormal, median the scenario’s K, geometric standard deviation ${plan.kSpread.toPrecision(3)} (${plan.kSpreadSource === 'pumping-test' ? 'from the pumping test’s K interval: that is the fit’s statistical interval, narrower than the scatter of K over a site' : plan.kSpreadSource === 'default' ? 'a placeholder of our own, no source: set kSpread from the site’s data' : 'as given'})`
      + (plan.sSpread > 1 ? `; S lognormal, independent, spread ${plan.sSpread.toPrecision(3)}` : '; S held')
      + '. The flow percentiles are of the re-solved least total flow; a realisation with no feasible design counts as needing more than any finite flow. One homogeneous K per realisation: it does not model K varying across the site.',
  };
}
