import { describe, expect, it } from 'vitest';
import { solveLayout, solveOptimalRates, solveUniformRate, type RateProblem } from '../../../shared/design';
import { expectClose } from './design-test-helpers';

/**
 * Brute force for small LPs: the optimum of min Σq over {A q ≥ r, 0 ≤ q ≤ u} lies at a vertex,
 * where n of the constraints hold with equality. Enumerate every n-subset, solve it by Gaussian
 * elimination, keep the feasible points, take the least Σq (Dantzig: the optimum of a bounded
 * feasible LP is attained at a basic feasible solution).
 */
function bruteForceLp(A: number[][], r: number[], u: number[]): number {
  const n = u.length;
  type Row = { a: number[]; b: number };
  const all: Row[] = [
    ...A.map((a, i) => ({ a, b: r[i]! })),
    ...u.map((_, j) => ({ a: u.map((_, k) => (k === j ? 1 : 0)), b: 0 })),
    ...u.map((uj, j) => ({ a: u.map((_, k) => (k === j ? 1 : 0)), b: uj })),
  ];
  let best = Infinity;
  const choose = (start: number, picked: Row[]) => {
    if (picked.length === n) {
      const M = picked.map((p) => [...p.a, p.b]);
      for (let c = 0; c < n; c++) {
        let piv = c;
        for (let k = c + 1; k < n; k++) if (Math.abs(M[k]![c]!) > Math.abs(M[piv]![c]!)) piv = k;
        if (Math.abs(M[piv]![c]!) < 1e-12) return;
        [M[c], M[piv]] = [M[piv]!, M[c]!];
        for (let k = 0; k < n; k++) {
          if (k === c) continue;
          const f = M[k]![c]! / M[c]![c]!;
          for (let m = c; m <= n; m++) M[k]![m]! -= f * M[c]![m]!;
        }
      }
      const q = M.map((row, c) => row[n]! / row[c]!);
      const ok = q.every((v, j) => v >= -1e-9 && v <= u[j]! + 1e-9) && A.every((a, i) => a.reduce((s, v, j) => s + v * q[j]!, 0) >= r[i]! - 1e-9);
      if (ok) best = Math.min(best, q.reduce((s, v) => s + v, 0));
      return;
    }
    for (let k = start; k < all.length; k++) choose(k + 1, [...picked, all[k]!]);
  };
  choose(0, []);
  return best;
}

const problem = (A: number[][], r: number[], u: number[]): RateProblem => ({
  nWells: u.length,
  response: Float64Array.from(A.flat()),
  required: Float64Array.from(r),
  limits: [],
  upper: Float64Array.from(u),
  upperKind: u.map(() => 'capacity' as const),
});

// Invented unit responses (m per m³/s), realistic in size: a few hundred metres per m³/s.
const cases = [
  { name: 'two wells, two points', A: [[300, 100], [120, 260]], r: [3, 3], u: [0.05, 0.05] },
  { name: 'three wells, four points', A: [[200, 80, 40], [90, 210, 70], [50, 100, 250], [140, 140, 60]], r: [4, 4.5, 3.5, 4], u: [0.03, 0.03, 0.03] },
  { name: 'three wells, one capped', A: [[200, 80, 40], [90, 210, 70], [50, 100, 250]], r: [4, 4.5, 3.5], u: [0.03, 0.005, 0.03] },
];

describe('solveOptimalRates', () => {
  it.each(cases)('equals the brute-force vertex optimum ($name)', async ({ A, r, u }) => {
    const s = await solveOptimalRates(problem(A, r, u));
    expect(s.status).toBe('optimal');
    expectClose(s.objective!, bruteForceLp(A, r, u), { rel: 1e-7 });
  });

  it('reports infeasible with the best achievable rates when the caps are too low', async () => {
    const s = await solveOptimalRates(problem([[300, 100], [120, 260]], [30, 30], [0.05, 0.05]));
    expect(s.status).toBe('infeasible');
    // Best achievable: both wells at their caps (every row gains from either well).
    expectClose(s.rates[0]!, 0.05, { rel: 1e-6 });
    expectClose(s.rates[1]!, 0.05, { rel: 1e-6 });
  });
});

describe('solveUniformRate', () => {
  it('is max_i r_i / Σ_j a_ij, and names that row as critical', () => {
    // Row sums 400 and 380: q = max(3/400, 3.8/380) = 0.01 at row 1.
    const s = solveUniformRate(problem([[300, 100], [120, 260]], [3, 3.8], [1, 1]));
    expect(s.status).toBe('optimal');
    expectClose(s.rates[0]!, 0.01, { rel: 1e-12 });
    expect(s.criticalRow).toBe(1);
  });
  it('is capped by the lowest well cap and then infeasible', () => {
    const s = solveUniformRate(problem([[300, 100], [120, 260]], [3, 3.8], [1, 0.004]));
    expect(s.status).toBe('infeasible');
    expectClose(s.rates[1]!, 0.004, { rel: 1e-12 });
  });
});

describe('solveLayout', () => {
  it('chooses the cheapest set of candidates, as brute force over every subset finds', async () => {
    const A = [[200, 80, 40, 150], [90, 210, 70, 120], [50, 100, 250, 60]];
    const r = [4, 4.5, 3.5];
    const u = [0.02, 0.02, 0.02, 0.02];
    const costs = { wellCost: 1000, pumpedVolumeCost_per_m3: 0.05, duration_s: 30 * 86400 };
    let best = Infinity;
    for (let mask = 1; mask < 16; mask++) {
      const uu = u.map((v, j) => (mask & (1 << j) ? v : 0));
      const lp = bruteForceLp(A, r, uu);
      if (!Number.isFinite(lp)) continue;
      const n = [0, 1, 2, 3].filter((j) => mask & (1 << j)).length;
      best = Math.min(best, n * costs.wellCost + lp * costs.pumpedVolumeCost_per_m3 * costs.duration_s);
    }
    const s = await solveLayout(problem(A, r, u), costs, 20, 1e-9);
    expect(s.status).toBe('optimal');
    expectClose(s.objective!, best, { rel: 1e-6 });
  });
});
