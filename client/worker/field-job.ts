/**
 * What the engine worker computes, as plain async functions (so tests run them in Node too).
 * All hydraulics come from `shared/field`; this file only samples, contours and summarises.
 */
import { evaluateGrid, evaluatePoints, evaluateSeries, IncrementalGrid } from '../../shared/field';
import { FLAG_BITS, type GridResult, type GridSpec, type PointFlag } from '../../shared/field/types';
import { contourExcess, contourGrid, contourMask, niceContourLevels } from '../../shared/contours';
import { getPolygonArea, isPointInPolygon, openRing } from '../../shared/geometry';
import type { Excavation, Scenario } from '../../shared/schema';
import { excavationFloor, heaveFactorOfSafety, requiredUpliftFactor, resolveFloorOptions, upliftFactorOfSafety } from '../../shared/floor';
import type {
  ExcavationShortfall, FieldRequest, FieldResult, InspectRequest, InspectResult, SectionRequest, SectionResult,
} from './engine-protocol';

/** Hooks a long job uses to report progress and to notice it is no longer wanted. */
export interface JobHooks {
  progress?: (fraction: number) => void;
  /** True when the job should stop (a newer request superseded it). */
  isCancelled?: () => boolean;
  /** Lets pending messages (a cancel) arrive between strips; default resolves at once. */
  pause?: () => Promise<void>;
  /** Strip workers for full grid evaluations: every strip sent at once, at least `strips` of them. */
  parallel?: { evaluate: StripEvaluator; strips: number };
}

/** Thrown out of a job that was cancelled part-way. */
export class JobCancelled extends Error {
  constructor() {
    super('cancelled');
  }
}

const FLAG_NAMES = Object.keys(FLAG_BITS) as PointFlag[];

/**
 * Evaluates one strip of rows elsewhere (a strip worker); resolves to the strip's grid result, or
 * to null when `skip` says, as the strip's turn comes, that the job is no longer wanted.
 */
export type StripEvaluator = (scenario: Scenario, grid: GridSpec, time_s: number | null, skip?: () => boolean) => Promise<GridResult | null>;

/** The row strips [j0, j1) of a grid with ny rows split n ways (empty strips left out). */
function rowStrips(ny: number, n: number): Array<[number, number]> {
  const out: Array<[number, number]> = [];
  for (let s = 0; s < n; s++) {
    const j0 = Math.floor((s * ny) / n);
    const j1 = Math.floor(((s + 1) * ny) / n);
    if (j1 > j0) out.push([j0, j1]);
  }
  return out;
}

/** The sub-grid of rows [j0, j1). */
function stripGrid(grid: GridSpec, j0: number, j1: number): GridSpec {
  return { origin: [grid.origin[0], grid.origin[1] + j0 * grid.spacing_m[1]], spacing_m: grid.spacing_m, counts: [grid.counts[0], j1 - j0] };
}

/** One grid result assembled from strip results (in any order), with the first strip's model. */
class StripAssembly {
  readonly drawdown: Float64Array;
  readonly level: Float64Array;
  readonly flags: Uint8Array;
  readonly flagCounts = Object.fromEntries(FLAG_NAMES.map((f) => [f, 0])) as Record<PointFlag, number>;
  private model: GridResult['model'] | undefined;
  constructor(private readonly grid: GridSpec, private readonly time_s: number | null) {
    const n = grid.counts[0] * grid.counts[1];
    this.drawdown = new Float64Array(n);
    this.level = new Float64Array(n);
    this.flags = new Uint8Array(n);
  }
  add(j0: number, r: GridResult, first: boolean): void {
    const at = j0 * this.grid.counts[0];
    this.drawdown.set(r.drawdown_m, at);
    this.level.set(r.level_m, at);
    this.flags.set(r.flags, at);
    for (const f of FLAG_NAMES) this.flagCounts[f] += r.flagCounts[f] ?? 0;
    if (first || !this.model) this.model = r.model;
  }
  result(): GridResult {
    return { grid: this.grid, time_s: this.time_s, drawdown_m: this.drawdown, level_m: this.level, flags: this.flags, flagCounts: this.flagCounts, model: this.model! };
  }
}

/**
 * Evaluates the grid in row strips (progress and a cancel check between strips). With
 * `hooks.parallel` (strip workers, one per core) every strip is sent at once and the strips arrive in
 * any order; each strip is the same sub-grid evaluation either way, so the result is bit for bit
 * the one computed here (test: tests/client/worker/field-job-parallel.test.ts).
 */
export async function evaluateGridInStrips(
  scenario: Scenario, grid: GridSpec, time_s: number | null, strips: number, hooks: JobHooks = {},
): Promise<GridResult> {
  const [, ny] = grid.counts;
  const parallel = hooks.parallel;
  const n = Math.max(1, Math.min(parallel ? Math.max(strips, parallel.strips) : strips, ny));
  if (n === 1 && !parallel) {
    const r = evaluateGrid({ scenario, grid, time_s });
    hooks.progress?.(1);
    return r;
  }
  const parts = rowStrips(ny, n);
  const out = new StripAssembly(grid, time_s);
  if (parallel) {
    let done = 0;
    let cancelled = false;
    await Promise.all(parts.map(async ([j0, j1], s) => {
      const r = await parallel.evaluate(scenario, stripGrid(grid, j0, j1), time_s, () => cancelled || (hooks.isCancelled?.() ?? false));
      if (!r || cancelled) {
        cancelled = true;
        return;
      }
      out.add(j0, r, s === 0);
      hooks.progress?.(++done / parts.length);
      if (done < parts.length && hooks.isCancelled?.()) cancelled = true;
    }));
    if (cancelled) throw new JobCancelled();
    return out.result();
  }
  for (let s = 0; s < parts.length; s++) {
    const [j0, j1] = parts[s]!;
    out.add(j0, evaluateGrid({ scenario, grid: stripGrid(grid, j0, j1), time_s }), s === 0);
    hooks.progress?.((s + 1) / parts.length);
    if (s < parts.length - 1) {
      await hooks.pause?.();
      if (hooks.isCancelled?.()) throw new JobCancelled();
    }
  }
  return out.result();
}

/** Grids kept for drag frames (view, colour scale, each excavation), most recent last. */
const keptGrids = new Map<string, IncrementalGrid>();
const KEPT_GRIDS = 12;

/** The kept grid for (grid, time), made on first use; the oldest is dropped past KEPT_GRIDS. */
function keptGrid(grid: GridSpec, time_s: number | null | undefined): IncrementalGrid {
  const key = JSON.stringify([grid.origin, grid.spacing_m, grid.counts, time_s === undefined ? 'design' : time_s]);
  let kept = keptGrids.get(key);
  if (kept) keptGrids.delete(key);
  else kept = new IncrementalGrid(grid, time_s);
  keptGrids.set(key, kept);
  while (keptGrids.size > KEPT_GRIDS) keptGrids.delete(keptGrids.keys().next().value!);
  return kept;
}

/** Evaluates grids for one job: in full, or (a drag frame) on kept grids well by well, noting whether every grid was incremental. */
class GridEvaluator {
  allIncremental = true;
  constructor(private readonly incremental: boolean) {}
  evaluate(scenario: Scenario, grid: GridSpec, time_s: number | null | undefined): GridResult {
    if (!this.incremental) return evaluateGrid({ scenario, grid, time_s });
    const kept = keptGrid(grid, time_s);
    const result = kept.evaluate(scenario);
    if (kept.stats.mode !== 'incremental') this.allIncremental = false;
    return result;
  }
}

function finiteRange(values: ArrayLike<number>): { min: number; max: number } {
  let min = Infinity;
  let max = -Infinity;
  for (let k = 0; k < values.length; k++) {
    const v = values[k]!;
    if (Number.isFinite(v)) {
      if (v < min) min = v;
      if (v > max) max = v;
    }
  }
  return { min, max };
}

/** Points along the outline edges, about `step_m` apart, vertices included. */
function edgeSamples(outline: ReadonlyArray<readonly [number, number]>, step_m: number): Array<[number, number]> {
  const pts = openRing(outline);
  const out: Array<[number, number]> = [];
  for (let i = 0; i < pts.length; i++) {
    const a = pts[i]!;
    const b = pts[(i + 1) % pts.length]!;
    const len = Math.hypot(b[0] - a[0], b[1] - a[1]);
    const k = Math.max(1, Math.ceil(len / step_m));
    for (let m = 0; m < k; m++) out.push([a[0] + ((b[0] - a[0]) * m) / k, a[1] + ((b[1] - a[1]) * m) / k]);
  }
  return out;
}

/**
 * How an excavation stands at `time_s` (default the design time): its own grid over the
 * outline's bounding box plus points along its edges, because the highest level inside a ring of
 * wells sits on the edge between wells or at the centre, and a coarse view grid would miss it.
 * The target is the governing one of the pit-floor check (shared/floor, as the design uses it):
 * the dry level, or the head the uplift / heave check allows under the floor.
 */
export function getExcavationShortfall(scenario: Scenario, excavation: Excavation, pitNodes = 41, time_s: number | null = scenario.design.time_s, grids: GridEvaluator = new GridEvaluator(false)): ExcavationShortfall {
  const floorOptions = resolveFloorOptions((scenario as { designOptions?: { floor?: Parameters<typeof resolveFloorOptions>[0] } }).designOptions?.floor);
  const floor = excavationFloor(scenario, excavation, floorOptions);
  const target = floor.target.targetLevel_m;
  const xs = excavation.outline.map((p) => p[0]);
  const ys = excavation.outline.map((p) => p[1]);
  const minX = Math.min(...xs);
  const minY = Math.min(...ys);
  const w = Math.max(...xs) - minX;
  const h = Math.max(...ys) - minY;
  const spacing = Math.max(w, h, 1e-3) / Math.max(2, pitNodes - 1);
  const grid: GridSpec = {
    origin: [minX, minY],
    spacing_m: [spacing, spacing],
    counts: [Math.max(2, Math.ceil(w / spacing) + 1), Math.max(2, Math.ceil(h / spacing) + 1)],
  };
  const g = grids.evaluate(scenario, grid, time_s);
  const excess = contourExcess({ values: g.level_m, grid, threshold: target, outline: excavation.outline });
  let worst = excess.peak ? { x: excess.peak.x, y: excess.peak.y, level_m: excess.peak.excess + target } : { x: minX, y: minY, level_m: -Infinity };
  const flagBits = new Set<PointFlag>();
  const [nx] = grid.counts;
  for (let k = 0; k < g.flags.length; k++) {
    const bits = g.flags[k]!;
    if (bits === 0) continue;
    const x = grid.origin[0] + (k % nx) * spacing;
    const y = grid.origin[1] + Math.floor(k / nx) * spacing;
    if (!isPointInPolygon(x, y, excavation.outline)) continue;
    for (const f of FLAG_NAMES) if (bits & FLAG_BITS[f]) flagBits.add(f);
  }
  const edge = evaluatePoints({ scenario, points: edgeSamples(excavation.outline, spacing / 2), time_s });
  for (const p of edge.points) {
    if (p.level_m > worst.level_m) worst = { x: p.x, y: p.y, level_m: p.level_m };
    for (const f of p.flags) if (f !== 'within-well-radius') flagBits.add(f);
  }
  flagBits.delete('within-well-radius');
  const shortfall = worst.level_m - target;
  const area = getPolygonArea(excavation.outline);
  const t = floor.target;
  const floorUnsafe = t.allowableLevel_m !== null && worst.level_m > t.allowableLevel_m;
  const kind: ExcavationShortfall['kind'] = floorUnsafe ? 'floor-unsafe' : shortfall > 0 ? 'above-target' : flagBits.has('dewatered') ? 'dewatered' : 'met';
  // A plug under the floor means uplift; an open granular floor means heave (shared/floor).
  const floorCheck = t.upliftLevel_m !== null ? 'uplift' : t.heaveLevel_m !== null ? 'heave' : null;
  let floorFS: ExcavationShortfall['floorFS'] = null;
  if (floorCheck === 'uplift' && floor.ground?.plug) floorFS = { check: 'uplift', fs: upliftFactorOfSafety(floor.ground.plug, worst.level_m), required: requiredUpliftFactor(floorOptions) };
  else if (floorCheck === 'heave' && floor.ground?.granular) floorFS = { check: 'heave', fs: heaveFactorOfSafety(floor.ground.granular, excavation.formationLevel_m, worst.level_m), required: floorOptions.heaveFactor };
  return {
    id: excavation.id,
    targetLevel_m: target,
    time_s,
    met: kind === 'met',
    kind,
    governing: t.governing,
    floorFS,
    worstShortfall_m: shortfall,
    worst,
    coordinates: excess.coordinates,
    area_m2: excess.area_m2,
    areaFraction: area > 0 ? Math.min(1, excess.area_m2 / area) : 0,
    flags: [...flagBits],
  };
}

/** Most contour levels drawn; a smaller interval is widened to a whole multiple of itself. */
const MAX_CONTOUR_LEVELS = 60;

/** Contours, flag outlines and shortfall for a FieldRequest. */
export async function runFieldJob(req: FieldRequest, hooks: JobHooks = {}): Promise<FieldResult> {
  const started = performance.now();
  const grids = new GridEvaluator(req.incremental === true);
  const g = req.incremental ? grids.evaluate(req.scenario, req.grid, req.time_s) : await evaluateGridInStrips(req.scenario, req.grid, req.time_s, req.strips ?? 1, hooks);
  const values = req.quantity === 'level' ? g.level_m : g.drawdown_m;
  const modelled = (arr: Float64Array) => (g.flagCounts['beyond-boundary'] > 0 ? arr.map((v, k) => (g.flags[k]! & FLAG_BITS['beyond-boundary'] ? Number.NaN : v)) : arr);
  const range = finiteRange(modelled(values));
  const drawdownRange = finiteRange(modelled(g.drawdown_m));
  // Automatic levels are round numbers in the user's length unit (0.5 ft, not 0.1524 m).
  const unit = req.step_m === undefined && req.levelUnit_m && req.levelUnit_m > 0 ? req.levelUnit_m : 1;
  // A tiny interval would need thousands of levels; widen it (a whole multiple) and say so.
  const wanted = req.step_m && req.step_m > 0 && Number.isFinite(range.max - range.min) ? Math.floor((range.max - range.min) / req.step_m) : 0;
  const step = wanted > MAX_CONTOUR_LEVELS ? req.step_m! * Math.ceil(wanted / MAX_CONTOUR_LEVELS) : req.step_m;
  const levels = niceContourLevels({ min: range.min / unit, max: range.max / unit, targetCount: 12, step, maxCount: MAX_CONTOUR_LEVELS + 1 }).map((v) => v * unit);
  // Ground beyond a boundary line is outside the modelled aquifer: no contours there.
  const beyond = FLAG_BITS['beyond-boundary'];
  const holes = g.flagCounts['beyond-boundary'] > 0 ? Uint8Array.from(g.flags, (f) => (f & beyond ? 1 : 0)) : undefined;
  const contours = contourGrid({ values, grid: req.grid, levels, holes });
  const flagAreas: FieldResult['flagAreas'] = [];
  for (const flag of FLAG_NAMES) {
    if (flag === 'within-well-radius' || !(g.flagCounts[flag] > 0)) continue;
    const m = contourMask({ flags: g.flags, grid: req.grid, bits: FLAG_BITS[flag] });
    if (m.count > 0) flagAreas.push({ flag, count: m.count, coordinates: m.coordinates });
  }
  if (hooks.isCancelled?.()) throw new JobCancelled();
  const shortfall = req.scenario.excavations.map((e) => getExcavationShortfall(req.scenario, e, req.pitNodes ?? 41, req.time_s, grids));
  // One colour scale across times: the drawdown range at the scale time (same grid).
  let colourMax_m = drawdownRange.max;
  const scaled = req.scaleTime_s !== undefined && req.scaleTime_s !== req.time_s;
  if (scaled) {
    const gs = grids.evaluate(req.scenario, req.grid, req.scaleTime_s!);
    colourMax_m = finiteRange(modelled(gs.drawdown_m)).max;
  }
  return {
    kind: 'field',
    id: req.id,
    quantity: req.quantity,
    time_s: req.time_s,
    grid: req.grid,
    contours,
    levels,
    range,
    drawdownRange,
    colourMax_m,
    ...(req.scaleTime_s !== undefined ? { colourTime_s: req.scaleTime_s } : {}),
    ...(wanted > MAX_CONTOUR_LEVELS ? { levelsWanted: wanted } : {}),
    flagAreas,
    flagCounts: { ...g.flagCounts },
    model: g.model,
    shortfall,
    compute_ms: performance.now() - started,
    ...(req.incremental ? { incremental: grids.allIncremental } : {}),
  };
}

/** Level and drawdown against time at one point. */
export function runInspectJob(req: InspectRequest): InspectResult {
  const { scenario, point } = req;
  const current = evaluatePoints({ scenario, points: [point], time_s: req.time_s });
  const series = evaluateSeries({ scenario, point, times_s: req.times_s.filter((t) => t > 0 && Number.isFinite(t)) }).samples;
  return { kind: 'inspect', id: req.id, point, current: current.points[0]!, series, model: current.model };
}

/** Level along a section line, `samples` points from `from` to `to`. */
export function runSectionJob(req: SectionRequest): SectionResult {
  const n = Math.max(2, Math.min(2000, Math.round(req.samples)));
  const [x0, y0] = req.from;
  const [x1, y1] = req.to;
  const length = Math.hypot(x1 - x0, y1 - y0);
  const pts: Array<[number, number]> = Array.from({ length: n }, (_, k) => [x0 + ((x1 - x0) * k) / (n - 1), y0 + ((y1 - y0) * k) / (n - 1)]);
  const r = evaluatePoints({ scenario: req.scenario, points: pts, time_s: req.time_s });
  return {
    kind: 'section',
    id: req.id,
    from: req.from,
    to: req.to,
    points: r.points.map((p, k) => ({ ...p, distance_m: (length * k) / (n - 1) })),
    model: r.model,
  };
}
