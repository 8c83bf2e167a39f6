/**
 * A small dense linear / mixed-integer program solved by HiGHS (the `highs` package, a WebAssembly
 * build of the HiGHS solver; Huangfu & Hall (2018) "Parallelizing the dual revised simplex
 * method", Math. Prog. Comp. 10). The runtime is loaded once and reused: loading compiles 3.5 MB
 * of WebAssembly, a solve takes milliseconds to seconds.
 */
import loadHighs, { type Highs, type InitOptions } from 'highs';

let runtime: Promise<Highs> | null = null;

/**
 * Loads the HiGHS runtime once (later calls return the same promise). In a browser pass
 * `locateFile` or `wasmBinary` on the first call if the bundler does not serve `highs.wasm`
 * beside the loader.
 */
export function loadLinearSolver(options?: InitOptions): Promise<Highs> {
  if (!runtime) {
    runtime = loadHighs(options).catch((error: unknown) => {
      runtime = null;
      throw error;
    });
  }
  return runtime;
}

/** One constraint row `lower ≤ Σ coefficients[k]·x[columns[k]] ≤ upper`. */
export interface LinearRow {
  columns: number[];
  coefficients: number[];
  /** −Infinity for none. */
  lower: number;
  /** +Infinity for none. */
  upper: number;
}

export interface LinearProgram {
  /** Objective coefficients (minimised), one per column. */
  cost: number[];
  /** Column bounds; +Infinity for none. */
  lower: number[];
  upper: number[];
  rows: LinearRow[];
  /** Columns that must be integer (binary when bounded by [0, 1]). */
  integer?: number[];
  /** Wall-clock limit for the solver, s. Default 120. */
  timeLimit_s?: number;
  /** MIP: relative optimality gap at which to stop. Default 1e-6. */
  mipRelativeGap?: number;
  /** A known feasible point (one value per column) to start the MIP search from. */
  start?: number[];
  /**
   * HiGHS presolve. Default: on for a MIP, off for an LP — the design LPs are dense (every well
   * acts on every row), presolve finds nothing to remove and took 40 % of a solve (300 wells ×
   * 626 rows: 250 → 145 ms, the same optimum to the last printed digit; bench/design.ts).
   */
  presolve?: 'on' | 'off';
}

export type LinearProgramStatus = 'optimal' | 'infeasible' | 'unbounded' | 'time-limit' | 'error';

export interface LinearProgramSolution {
  status: LinearProgramStatus;
  /** Column values (empty unless a solution was found). */
  x: Float64Array;
  objective: number;
  /** Solver's words for the status (for notes when it is not optimal). */
  detail: string;
  /** MIP only: relative gap between the solution and the best bound when stopped. */
  mipGap?: number;
}

/** Something that solves a LinearProgram (in process, or elsewhere: see `setLinearProgramSolver`). */
export type LinearProgramSolver = (problem: LinearProgram) => Promise<LinearProgramSolution>;

let external: LinearProgramSolver | null = null;

/**
 * Sends every later solve to `solver` (the server runs HiGHS in a worker thread so a long layout
 * search does not hold its event loop); null solves in process again. Returns the previous one.
 */
export function setLinearProgramSolver(solver: LinearProgramSolver | null): LinearProgramSolver | null {
  const previous = external;
  external = solver;
  return previous;
}

/**
 * Solves `min cost·x` subject to the rows and bounds, in process or by the solver set with
 * `setLinearProgramSolver`. Rows are passed to HiGHS as a CSR matrix; the caller scales them
 * (each row's largest coefficient near 1) so HiGHS's tolerances mean the same thing in every row.
 */
export async function solveLinearProgram(problem: LinearProgram): Promise<LinearProgramSolution> {
  if (external) return external(problem);
  const highs = await loadLinearSolver();
  try {
    return solveWithHighs(highs, problem);
  } catch (error) {
    // HiGHS refuses a model it cannot take (a coefficient out of its range: passModel status −1)
    // or stops (its WebAssembly aborted). That is the solver's answer about this problem, so it
    // comes back as status 'error' with its words, and the design says why; a runtime that
    // aborted is loaded afresh for the next solve.
    if (error instanceof WebAssembly.RuntimeError) runtime = null;
    return { status: 'error', x: new Float64Array(0), objective: NaN, detail: `the LP solver could not take this problem (${error instanceof Error ? error.message : String(error)})` };
  }
}

/**
 * One solve with a loaded HiGHS runtime. Self-contained on purpose (it uses nothing but its
 * arguments), so a worker thread can run the same code from its source text.
 */
export function solveWithHighs(highs: Highs, problem: LinearProgram): LinearProgramSolution {
  const inf = highs.infinity;
  const nCols = problem.cost.length;
  const starts = new Int32Array(problem.rows.length + 1);
  let nnz = 0;
  for (const row of problem.rows) nnz += row.columns.length;
  const indices = new Int32Array(nnz);
  const values = new Float64Array(nnz);
  let k = 0;
  problem.rows.forEach((row, r) => {
    for (let i = 0; i < row.columns.length; i++) {
      indices[k] = row.columns[i]!;
      values[k] = row.coefficients[i]!;
      k++;
    }
    starts[r + 1] = k;
  });
  const clampInf = (v: number) => (v === Infinity ? inf : v === -Infinity ? -inf : v);
  let integrality: Int32Array | undefined;
  if (problem.integer && problem.integer.length > 0) {
    integrality = new Int32Array(nCols);
    for (const j of problem.integer) integrality[j] = highs.constants.variableType.integer;
  }
  const model = highs.createModel({
    numCols: nCols,
    numRows: problem.rows.length,
    colCost: Float64Array.from(problem.cost),
    colLower: Float64Array.from(problem.lower, clampInf),
    colUpper: Float64Array.from(problem.upper, clampInf),
    rowLower: Float64Array.from(problem.rows, (r) => clampInf(r.lower)),
    rowUpper: Float64Array.from(problem.rows, (r) => clampInf(r.upper)),
    matrix: { format: 'csr', numRows: problem.rows.length, numCols: nCols, starts, indices, values },
    ...(integrality ? { integrality } : {}),
  });
  try {
    model.options.set({
      output_flag: false,
      time_limit: problem.timeLimit_s ?? 120,
      presolve: problem.presolve ?? (integrality ? 'on' : 'off'),
      ...(integrality ? { mip_rel_gap: problem.mipRelativeGap ?? 1e-6 } : {}),
    });
    if (problem.start && problem.start.length === nCols) model.setSolution({ colValue: Float64Array.from(problem.start) });
    model.run();
    const s = model.getModelStatus();
    const ms = highs.constants.modelStatus;
    const names = Object.entries(ms).find(([, v]) => v === s)?.[0] ?? String(s);
    const solution = model.getSolution();
    const x = Float64Array.from(solution.colValue);
    const hasSolution = x.length === nCols && x.every((v) => Number.isFinite(v));
    const mipGap = integrality ? Number(model.info.get('mip_gap')) : undefined;
    if (s === ms.optimal) return { status: 'optimal', x, objective: model.getObjectiveValue(), detail: names, ...(mipGap !== undefined ? { mipGap } : {}) };
    if (s === ms.infeasible) return { status: 'infeasible', x: new Float64Array(0), objective: NaN, detail: names };
    if (s === ms.unbounded || s === ms.unboundedOrInfeasible) return { status: 'unbounded', x: new Float64Array(0), objective: NaN, detail: names };
    if (s === ms.timeLimit && hasSolution)
      return { status: 'time-limit', x, objective: model.getObjectiveValue(), detail: names, ...(mipGap !== undefined ? { mipGap } : {}) };
    return { status: 'error', x: new Float64Array(0), objective: NaN, detail: names };
  } finally {
    model.dispose();
  }
}
