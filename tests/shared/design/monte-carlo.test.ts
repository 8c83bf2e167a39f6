/**
 * Monte Carlo analysis of a design (issue 11 item 2; design.md §8): seeded and reproducible, the
 * same answer however the realisations are chunked, and the flow percentiles against the
 * analytic values where the response is linear in K.
 */
import { describe, expect, it } from 'vitest';
import {
  createNormalSource,
  createUniformSource,
  kSpreadFromInterval,
  percentile,
  planMonteCarlo,
  runDesign,
  runMonteCarlo,
  type DesignBasis,
} from '../../../shared/design';
import { expectClose } from './design-test-helpers';
import { thiemRingScenario } from './uncertainty-fixtures';

describe('seeded random numbers', () => {
  it('repeat for the same seed and differ for another', () => {
    const a = createUniformSource(42);
    const b = createUniformSource(42);
    const c = createUniformSource(43);
    const xs = Array.from({ length: 5 }, () => a());
    expect(Array.from({ length: 5 }, () => b())).toEqual(xs);
    expect(Array.from({ length: 5 }, () => c())).not.toEqual(xs);
    expect(xs.every((x) => x >= 0 && x < 1)).toBe(true);
  });

  it('give normal deviates with mean 0 and standard deviation 1 (Box–Muller)', () => {
    const z = createNormalSource(createUniformSource(7));
    const n = 20_000;
    const xs = Array.from({ length: n }, () => z());
    const mean = xs.reduce((s, x) => s + x, 0) / n;
    const sd = Math.sqrt(xs.reduce((s, x) => s + (x - mean) ** 2, 0) / (n - 1));
    // Sampling error of the mean 1/√n = 0.007 and of the sd 1/√(2n) = 0.005: 4 standard errors allowed.
    expectClose(mean, 0, { abs: 0.03 }, 'mean');
    expectClose(sd, 1, { abs: 0.02 }, 'sd');
    // Share inside ±1.96: 0.95 (standard normal table), binomial error √(0.95·0.05/n) = 0.0015.
    expectClose(xs.filter((x) => Math.abs(x) < 1.959964).length / n, 0.95, { abs: 0.006 }, 'share within ±1.96');
  });
});

describe('planMonteCarlo', () => {
  it('takes the K spread from the pumping test’s interval when the scenario has one', () => {
    // ln(hi/lo) = 2·z·ln F with z = 1.959964 (95 %): F = e^(ln 4 / 3.919928) = 1.4243 for hi/lo = 4.
    expectClose(kSpreadFromInterval([1e-4, 4e-4], 0.95), Math.exp(Math.log(4) / (2 * 1.959964)), { rel: 1e-6 });
    const scenario = { ...thiemRingScenario(), pumpingTest: { method: 'theis' as const, conductivityInterval_m_s: [1e-4, 4e-4] as [number, number], confidence: 0.95 } };
    const plan = planMonteCarlo(scenario, { runs: 10 });
    expect(plan.kSpreadSource).toBe('pumping-test');
    expectClose(plan.kSpread, 1.4243, { rel: 1e-3 });
    expect(planMonteCarlo(scenario, { runs: 10, kSpread: 3 }).kSpreadSource).toBe('option');
    expect(planMonteCarlo(thiemRingScenario(), { runs: 10 })).toMatchObject({ kSpread: 2, kSpreadSource: 'default' });
  });

  it('draws the same factors for the same seed', () => {
    const a = planMonteCarlo(thiemRingScenario(), { runs: 50, seed: 9, kSpread: 2, sSpread: 1.5 });
    const b = planMonteCarlo(thiemRingScenario(), { runs: 50, seed: 9, kSpread: 2, sSpread: 1.5 });
    expect(b.kFactors).toEqual(a.kFactors);
    expect(b.sFactors).toEqual(a.sFactors);
    expect(planMonteCarlo(thiemRingScenario(), { runs: 50, seed: 10, kSpread: 2 }).kFactors).not.toEqual(a.kFactors);
  });
});

describe('percentile', () => {
  it('interpolates between order statistics and is null on an infinite one', () => {
    expect(percentile([1, 2, 3, 4], 0.5)).toBe(2.5);
    expect(percentile([1, 2, 3, 4, 5, 6, 7, 8, 9, 10], 0.9)).toBeCloseTo(9.1, 12);
    expect(percentile([1, 2, Infinity, Infinity], 0.9)).toBeNull();
  });
});

describe('runDesign with monteCarlo', () => {
  it('is reproducible by seed, independent of the chunking, and meets the Thiem analytic P50 and P90', async () => {
    const scenario = thiemRingScenario();
    const runs = 1000;
    const F = 1.5;
    let basis: DesignBasis | undefined;
    const a = await runDesign({ scenario, options: { monteCarlo: { runs, seed: 11, kSpread: F } }, onBasis: (b) => (basis = b) });
    const b = await runDesign({ scenario, options: { monteCarlo: { runs, seed: 11, kSpread: F } } });
    const u = a.uncertainty!;
    expect(b.uncertainty!.totalRate_m3_s).toEqual(u.totalRate_m3_s);
    expect(b.uncertainty!.probabilityMet).toBe(u.probabilityMet);
    expect(u).toMatchObject({ runs, seed: 11, kSpread: F, failedRuns: 0, feasibleShare: 1 });

    // The same realisations in chunks of 7 give the same outcomes.
    const plan = planMonteCarlo(scenario, { runs: 40, seed: 11, kSpread: F });
    const whole = await runMonteCarlo({ basis: basis!, plan, chunkSize: 40 });
    const chunked = await runMonteCarlo({ basis: basis!, plan, chunkSize: 7, concurrency: 3 });
    expect(chunked).toEqual(whole);

    // Confined steady flow with a fixed radius of influence (Thiem): s = Q/(2πT)·ln(R/r), so the
    // least flow meeting a fixed drawdown is Q(K) = Q(K₀)·K/K₀ exactly (T = K·b). With ln K normal
    // (median K₀, sd ln F) the flow is lognormal too: P50 = Q(K₀) and P90 = Q(K₀·F^z₀.₉), z₀.₉ =
    // 1.28155 (standard normal table). Sampling error for n = 1000 and ln F = 0.405: the median's
    // 1.2533·0.405/√1000 = 1.6 %, the P90's √(0.9·0.1)/(√1000·φ(1.2816))·0.405 = 2.2 %; allowed ≈ 3 of each.
    const q0 = a.totalRate_m3_s;
    expectClose(u.totalRate_m3_s.p50!, q0, { rel: 0.05 }, 'P50 vs Q(median K)');
    expectClose(u.totalRate_m3_s.p90!, q0 * F ** 1.28155, { rel: 0.07 }, 'P90 vs Q(K·F^1.2816)');
    // And exactly (the LP rows scale with 1/T): P50 = Q(K₀) × the sample median of the K factors.
    const sortedFactors = [...planMonteCarlo(scenario, { runs, seed: 11, kSpread: F }).kFactors].sort((x, y) => x - y);
    expectClose(u.totalRate_m3_s.p50!, q0 * percentile(sortedFactors, 0.5)!, { rel: 1e-4 }, 'P50 vs Q0 × median factor');
    // The chosen rates give drawdowns ∝ 1/T, so they meet the target exactly when K ≤ K₀ (about half the realisations).
    expectClose(u.probabilityMet, sortedFactors.filter((f) => f <= 1).length / runs, { abs: 0.002 }, 'probability met');
    expect(u.histogram.reduce((s, bin) => s + bin.count, 0)).toBe(runs);
  }, 240_000);

  it('prices the bid at the P90 flow when asked', async () => {
    const r = await runDesign({ scenario: thiemRingScenario(), options: { monteCarlo: { runs: 30, seed: 2, kSpread: 1.5, priceAtP90: true } } });
    const bid = r.uncertainty!.bidAtP90!;
    expectClose(bid.totalRate_m3_s, r.uncertainty!.totalRate_m3_s.p90!, { rel: 1e-12 });
    expectClose(bid.dischargeVolume_m3 / r.summary.dischargeVolume_m3, bid.totalRate_m3_s / r.totalRate_m3_s, { rel: 1e-9 });
    expect(bid.wellCost).toBe(r.summary.wellCost);
  }, 120_000);

  it('names the field of a bad Monte Carlo option', async () => {
    await expect(runDesign({ scenario: thiemRingScenario(), options: { monteCarlo: { runs: 0 } } })).rejects.toMatchObject({ issues: [expect.objectContaining({ path: '/options/monteCarlo/runs' })] });
    await expect(runDesign({ scenario: thiemRingScenario(), options: { monteCarlo: { runs: 5, kSpread: 0.5 } } })).rejects.toMatchObject({ issues: [expect.objectContaining({ path: '/options/monteCarlo/kSpread' })] });
  });
});
