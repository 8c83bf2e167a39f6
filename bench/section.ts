/**
 * Speed of the section solver: assembly + MIC(0)-preconditioned CG against the number of unknowns
 * (about 10⁴ to 10⁵), on a two-layer sheet-pile cofferdam (invented), and against a dense Cholesky
 * solve of the same system at a size where a dense solve is feasible. CPU time is given beside
 * wall time: on a shared machine the wall time includes waiting for a core.
 *
 * Run: npx tsx bench/section.ts   (or import runSectionBench from bench/run.ts)
 */
import { pathToFileURL } from 'node:url';
import { assembleSection, buildSectionMesh, solveFivePointPcg, type FivePointSystem } from '../shared/section';
import { parseSection, type SectionDocument } from '../shared/schema';

function benchSection(maxSize_m: number, minSize_m: number): SectionDocument {
  return parseSection({
    format: 'drydig.section',
    version: 1,
    geometry: 'plane',
    extent: { x0_m: 0, x1_m: 60 },
    layers: [
      { top_m: 10, bottom_m: -2, kh_m_s: 2e-4, kv_m_s: 1e-4 },
      { top_m: -2, bottom_m: -10, kh_m_s: 5e-4, kv_m_s: 2.5e-4 },
    ],
    surface: [
      { x0_m: 0, x1_m: 8, level_m: 5, head_m: 5 },
      { x0_m: 8, x1_m: 60, level_m: 10, head_m: 9.5 },
    ],
    walls: [{ x_m: 8, top_m: 10.5, toe_m: 1 }],
    floor: { x0_m: 0, x1_m: 8 },
    mesh: { maxSize_m, minSize_m, growth: 1.1 },
  });
}

function timed<T>(run: () => T): { value: T; wall_s: number; cpu_s: number } {
  const t0 = performance.now();
  const c0 = process.cpuUsage();
  const value = run();
  const c = process.cpuUsage(c0);
  return { value, wall_s: (performance.now() - t0) / 1000, cpu_s: (c.user + c.system) / 1e6 };
}

/** Dense Cholesky solve of the five-point system (the baseline a direct solver gives). */
function solveDense(s: FivePointSystem): Float64Array {
  const n = s.diag.length;
  const a = new Float64Array(n * n);
  for (let k = 0; k < n; k++) {
    a[k * n + k] = s.diag[k]!;
    if (k + 1 < n && s.east[k]! !== 0) {
      a[k * n + k + 1] = -s.east[k]!;
      a[(k + 1) * n + k] = -s.east[k]!;
    }
    if (k + s.nx < n && s.north[k]! !== 0) {
      a[k * n + k + s.nx] = -s.north[k]!;
      a[(k + s.nx) * n + k] = -s.north[k]!;
    }
  }
  for (let j = 0; j < n; j++) {
    let d = a[j * n + j]!;
    for (let k = 0; k < j; k++) d -= a[j * n + k]! ** 2;
    const ljj = Math.sqrt(d);
    a[j * n + j] = ljj;
    for (let i = j + 1; i < n; i++) {
      let v = a[i * n + j]!;
      for (let k = 0; k < j; k++) v -= a[i * n + k]! * a[j * n + k]!;
      a[i * n + j] = v / ljj;
    }
  }
  const y = Float64Array.from(s.rhs);
  for (let i = 0; i < n; i++) {
    for (let k = 0; k < i; k++) y[i] = y[i]! - a[i * n + k]! * y[k]!;
    y[i] = y[i]! / a[i * n + i]!;
  }
  for (let i = n - 1; i >= 0; i--) {
    for (let k = i + 1; k < n; k++) y[i] = y[i]! - a[k * n + i]! * y[k]!;
    y[i] = y[i]! / a[i * n + i]!;
  }
  return y;
}

const f = (v: number, d = 3) => Number(v.toPrecision(d)).toLocaleString('en-US');

/** Runs the section benchmarks; returns one line per measurement. */
export function runSectionBench(): string[] {
  const lines: string[] = ['section: solve time against unknowns (assembly + MIC(0)-PCG to a relative residual of 1e-12; best of 2)'];
  for (const [maxSize, minSize] of [[0.9, 0.05], [0.45, 0.025], [0.25, 0.014], [0.145, 0.009]] as const) {
    const doc = benchSection(maxSize, minSize);
    let best = { wall_s: Infinity, cpu_s: Infinity, iterations: 0, unknowns: 0 };
    for (let r = 0; r < 2; r++) {
      const t = timed(() => {
        const mesh = buildSectionMesh(doc);
        const system = assembleSection(doc, mesh);
        return { mesh, pcg: solveFivePointPcg(system, { tolerance: 1e-12 }) };
      });
      if (t.cpu_s < best.cpu_s) best = { wall_s: t.wall_s, cpu_s: t.cpu_s, iterations: t.value.pcg.iterations, unknowns: t.value.mesh.activeCount };
    }
    lines.push(`  ${f(best.unknowns)} unknowns: CPU ${f(best.cpu_s)} s, wall ${f(best.wall_s)} s, ${best.iterations} CG iterations`);
  }
  // Dense baseline at a size where it fits (n ≈ 2 000: the dense factor is 30 MB).
  const small = benchSection(2, 0.25);
  const mesh = buildSectionMesh(small);
  const system = assembleSection(small, mesh);
  const n = system.diag.length;
  const iterative = timed(() => solveFivePointPcg(system, { tolerance: 1e-12 }));
  const dense = timed(() => solveDense(system));
  let diff = 0;
  for (let k = 0; k < n; k++) diff = Math.max(diff, Math.abs(dense.value[k]! - iterative.value.x[k]!));
  lines.push(`  dense Cholesky baseline at ${f(n)} unknowns: CPU ${f(dense.cpu_s)} s vs PCG ${f(iterative.cpu_s)} s — ratio dense/PCG ${f(dense.cpu_s / Math.max(iterative.cpu_s, 1e-6))}×; max |Δh| ${diff.toExponential(1)} m`);
  lines.push(`  (dense cost grows as n³: at 10⁵ unknowns it would take about ${f(dense.cpu_s * (1e5 / n) ** 3 / 3600 / 24)} days on this machine)`);
  return lines;
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) for (const line of runSectionBench()) console.log(line);
