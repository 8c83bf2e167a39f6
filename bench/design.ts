/**
 * Speed of the design solver: the per-well optimum (LP) for 300 wells and about 600 control
 * points (before and after this change side by side), plus the uniform and layout modes (60 and 218 candidates). Invented site, for the bench only.
 *
 * Run: npx tsx bench/design.ts   (or import runDesignBench from bench/run.ts)
 */
import { pathToFileURL } from 'node:url';
import { generateControlPoints, runDesign, solveOptimalRates, type RateProblem } from '../shared/design';
import { loadLinearSolver, setLinearProgramSolver, solveWithHighs } from '../shared/design/linear-program';
import { unitResponseMatrix } from '../shared/field';
import type { Scenario } from '../shared/schema';
import { pointsAroundRectangle } from './points-around-rectangle';

/** 150 m × 100 m pit, `n` deep wells on a ring 3 m outside it; confined, Theis at 30 days. */
export function makeDesignBenchScenario(n: number): Scenario {
  const [w, h, offset] = [150, 100, 3];
  const wells: Scenario['wells'] = pointsAroundRectangle(w + 2 * offset, h + 2 * offset, n).map(([x, y], k) => (
    { id: `D${k + 1}`, x: x - offset, y: y - offset, radius_m: 0.15, kind: 'deep', rate_m3_s: 0.001, wellLoss_s2_m5: 200 }));
  return {
    format: 'drydig.scenario',
    version: 1,
    name: 'design bench (invented)',
    groundLevel_m: 10,
    aquifer: { kind: 'confined', conductivity_m_s: 3e-4, base_m: -25, top_m: 0, staticLevel_m: 8, storativity: 2e-4 },
    boundaries: [{ kind: 'constant-head', from: [260, -500], to: [260, 500], label: 'canal (invented)' }],
    excavations: [{ id: 'pit', outline: [[0, 0], [w, 0], [w, h], [0, h]], formationLevel_m: 2, margin_m: 0.5 }],
    wells,
    design: { time_s: 30 * 86400 },
  };
}

const ms = (t0: number) => performance.now() - t0;
const fmt = (v: number) => v.toFixed(0);

/** Before this change: HiGHS presolve on for every LP (it is now off for the dense design LPs). */
export async function withPresolveOn<T>(fn: () => Promise<T>): Promise<T> {
  const highs = await loadLinearSolver();
  const previous = setLinearProgramSolver(async (p) => solveWithHighs(highs, { ...p, presolve: 'on' }));
  try {
    return await fn();
  } finally {
    setLinearProgramSolver(previous);
  }
}

/** Best of `runs` wall times of `fn`, with its last value. */
async function timed<T>(runs: number, fn: () => Promise<T>): Promise<{ ms: number; value: T }> {
  let best = Number.POSITIVE_INFINITY;
  let value: T | undefined;
  for (let k = 0; k < runs; k++) {
    const t0 = performance.now();
    value = await fn();
    best = Math.min(best, ms(t0));
  }
  return { ms: best, value: value! };
}

/** Runs the design benchmarks; returns one line per measurement for the bench note. */
export async function runDesignBench(): Promise<string[]> {
  const lines: string[] = [];
  const scenario = makeDesignBenchScenario(300);
  const spacing_m = 5.4;
  const points = generateControlPoints({ excavations: scenario.excavations, spacing_m });

  // Warm-up: loads the HiGHS WebAssembly once (not part of a design's cost in a running service).
  let t0 = performance.now();
  await solveOptimalRates({ nWells: 1, response: Float64Array.from([1]), required: Float64Array.from([1]), limits: [], upper: Float64Array.from([10]), upperKind: ['capacity'] });
  lines.push(`design: HiGHS load (once per process) ${fmt(ms(t0))} ms; before = presolve on for every LP, after = off for the dense design LPs (on for the layout MIP in both)`);

  // The LP alone on the engine's unit responses: 300 columns × ${points.length} rows.
  t0 = performance.now();
  const m = unitResponseMatrix({ scenario: { ...scenario, wells: scenario.wells.map((w) => ({ ...w, active: false })) }, points: points.map((p) => [p.x, p.y] as const), wellIds: scenario.wells.map((w) => w.id) });
  const matrixMs = ms(t0);
  const problem: RateProblem = {
    nWells: 300,
    response: m.values,
    required: Float64Array.from(points, (p) => scenario.aquifer.staticLevel_m - p.targetLevel_m),
    limits: [],
    upper: new Float64Array(300).fill(0.05),
    upperKind: new Array(300).fill('capacity'),
  };
  const total = (s: { rates: Float64Array }) => s.rates.reduce((a, q) => a + q, 0);
  const lpBefore = await withPresolveOn(() => timed(3, () => solveOptimalRates(problem)));
  const lpAfter = await timed(3, () => solveOptimalRates(problem));
  lines.push(`design: unit-response matrix ${points.length} points × 300 wells ${fmt(matrixMs)} ms; LP alone (rates only, best of 3): before ${fmt(lpBefore.ms)} ms, after ${fmt(lpAfter.ms)} ms (${(lpBefore.ms / lpAfter.ms).toFixed(2)}×); total ${(total(lpBefore.value) * 1000).toFixed(4)} → ${(total(lpAfter.value) * 1000).toFixed(4)} L/s`);

  // The full per-well optimum: limits, check-grid refinement, verification, times, standby, summary.
  const optimal = () => runDesign({ scenario, mode: 'optimal', options: { controlSpacing_m: spacing_m } });
  const ob = await withPresolveOn(() => timed(2, optimal));
  const oa = await timed(2, optimal);
  const r = oa.value;
  lines.push(
    `design: runDesign optimal, 300 wells, ${points.length} control points (${r.excavations[0]!.checkPointCount} check points), best of 2: before ${fmt(ob.ms)} ms (${fmt(ob.value.solver.solveTime_ms)} ms in HiGHS), ` +
      `after ${fmt(oa.ms)} ms (${fmt(r.solver.solveTime_ms)} ms in HiGHS over ${r.solver.rounds} round(s)), ${(ob.ms / oa.ms).toFixed(2)}×; feasible ${r.feasible}, total ${(ob.value.totalRate_m3_s * 1000).toFixed(4)} → ${(r.totalRate_m3_s * 1000).toFixed(4)} L/s, ` +
      `worst shortfall ${(r.excavations[0]!.worstShortfall_m * 1000).toFixed(2)} mm; goal ≤ 500 ms`,
  );

  const uniform = () => runDesign({ scenario, mode: 'uniform', options: { controlSpacing_m: spacing_m } });
  const u = await timed(1, uniform);
  lines.push(`design: runDesign uniform, same case: ${fmt(u.ms)} ms; total ${(u.value.totalRate_m3_s * 1000).toFixed(1)} L/s (optimum saves ${(100 * (1 - r.totalRate_m3_s / u.value.totalRate_m3_s)).toFixed(1)} %)`);

  for (const n of [60, 218]) {
    const small = makeDesignBenchScenario(n);
    t0 = performance.now();
    const l = await runDesign({ scenario: small, mode: 'layout', options: { wellCost: 20000 } });
    lines.push(
      `design: runDesign layout, ${n} candidates: ${fmt(ms(t0))} ms; chose ${l.chosenWellIds?.length ?? 0} wells, search ${l.solver.layoutStatus ?? '?'} at gap ${((l.solver.mipGap ?? 0) * 100).toFixed(2)} %${n === 218 ? ' (goal: within 2 % in ≤ 5 s)' : ''}`,
    );
  }
  return lines;
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  for (const line of await runDesignBench()) console.log(line);
}
