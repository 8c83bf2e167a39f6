/**
 * The computed picture an export shows: groundwater levels on a grid covering the site, their
 * contours, the flagged nodes, and per excavation the highest level inside against its target.
 */
import type { Scenario } from '../schema';
import { getReceptors } from '../schema/receptor-schema';
import type { GridResult, GridSpec, ModelInfo, PointFlag } from '../field/types';
import { FLAG_BITS } from '../field/types';
import { contourExcess, contourGrid, niceContourLevels, type ContourSet, type XY } from '../contours';
import type { FieldEngine } from './field-engine';

/** Excavation check drawn from the grid (the design solver's own check is exact; this is for the plan). */
export interface ExcavationLevelCheck {
  id: string;
  targetLevel_m: number;
  /** Highest gridded level inside the outline, m (null when no node falls inside). */
  highestLevel_m: number | null;
  /** highest − target, m (≤ 0: met at grid resolution). */
  shortfall_m: number | null;
  /** Where the highest level is. */
  at: XY | null;
  /** Area inside where the level stands above target, m². */
  wetArea_m2: number;
}

export interface PlanResults {
  grid: GridSpec;
  time_s: number | null;
  /** Contour levels drawn (groundwater level, m). */
  levels: number[];
  contours: ContourSet;
  model: ModelInfo;
  flagCounts: Record<PointFlag, number>;
  /** Up to `maxFlagNodes` flagged node positions per flag. */
  flaggedNodes: Partial<Record<PointFlag, XY[]>>;
  excavations: ExcavationLevelCheck[];
  /** Lowest and highest gridded level, m. */
  range_m: [number, number];
}

/** Options for `computePlanResults`. */
export interface PlanResultsOptions {
  scenario: Scenario;
  engine: Pick<FieldEngine, 'evaluateGrid'>;
  /** Nodes along the longer side of the grid. Default 81. */
  nodesAlongLongSide?: number;
  /** Time, s; default the scenario's design time (null = steady). */
  time_s?: number | null;
  /** Most flagged positions kept per flag. Default 2000. */
  maxFlagNodes?: number;
}

/** The plan's extent: wells, excavations and piezometers, padded by 40 % (at least 10 m) each side. */
export function planExtent(scenario: Scenario): { min: XY; max: XY } {
  const xs: number[] = [];
  const ys: number[] = [];
  for (const w of scenario.wells) { xs.push(w.x); ys.push(w.y); }
  for (const e of scenario.excavations) for (const [x, y] of e.outline) { xs.push(x); ys.push(y); }
  const monitoring = (scenario as Scenario & { monitoring?: { piezometers?: Array<{ x: number; y: number }> } }).monitoring;
  for (const p of monitoring?.piezometers ?? []) { xs.push(p.x); ys.push(p.y); }
  for (const r of getReceptors(scenario)) {
    const points = r.geometry.type === 'Point' ? [r.geometry.coordinates] : r.geometry.coordinates;
    for (const [x, y] of points) { xs.push(x); ys.push(y); }
  }
  if (xs.length === 0) return { min: [-50, -50], max: [50, 50] };
  const minX = Math.min(...xs), maxX = Math.max(...xs), minY = Math.min(...ys), maxY = Math.max(...ys);
  const pad = Math.max(10, 0.4 * Math.max(maxX - minX, maxY - minY));
  return { min: [minX - pad, minY - pad], max: [maxX + pad, maxY + pad] };
}

/** A square-celled grid over the plan extent. */
export function planGrid(scenario: Scenario, nodesAlongLongSide = 81): GridSpec {
  const { min, max } = planExtent(scenario);
  const long = Math.max(max[0] - min[0], max[1] - min[1]);
  const spacing = long / (Math.max(3, nodesAlongLongSide) - 1);
  const nx = Math.max(2, Math.round((max[0] - min[0]) / spacing) + 1);
  const ny = Math.max(2, Math.round((max[1] - min[1]) / spacing) + 1);
  return { origin: [min[0], min[1]], spacing_m: [spacing, spacing], counts: [nx, ny] };
}

/** Evaluates the grid and derives contours, flags and excavation checks. */
export function computePlanResults(options: PlanResultsOptions): PlanResults {
  const { scenario } = options;
  const grid = planGrid(scenario, options.nodesAlongLongSide ?? 81);
  const result: GridResult = options.engine.evaluateGrid({ scenario, grid, time_s: options.time_s });
  let lo = Infinity, hi = -Infinity;
  for (const v of result.level_m) if (Number.isFinite(v)) { lo = Math.min(lo, v); hi = Math.max(hi, v); }
  const levels = niceContourLevels({ min: lo, max: hi, targetCount: 12 });
  const contours = contourGrid({ values: result.level_m, grid, levels });

  const maxFlagNodes = options.maxFlagNodes ?? 2000;
  const flaggedNodes: Partial<Record<PointFlag, XY[]>> = {};
  const [nx] = grid.counts;
  for (let k = 0; k < result.flags.length; k++) {
    const mask = result.flags[k] ?? 0;
    if (mask === 0) continue;
    for (const [flag, bit] of Object.entries(FLAG_BITS) as Array<[PointFlag, number]>) {
      if ((mask & bit) === 0) continue;
      const list = (flaggedNodes[flag] ??= []);
      if (list.length < maxFlagNodes) list.push([grid.origin[0] + (k % nx) * grid.spacing_m[0], grid.origin[1] + Math.floor(k / nx) * grid.spacing_m[1]]);
    }
  }

  const excavations = scenario.excavations.map((e): ExcavationLevelCheck => {
    const target = e.formationLevel_m - e.margin_m;
    const excess = contourExcess({ values: result.level_m, grid, threshold: target, outline: e.outline });
    return {
      id: e.id,
      targetLevel_m: target,
      highestLevel_m: excess.peak ? target + excess.peak.excess : null,
      shortfall_m: excess.peak ? excess.peak.excess : null,
      at: excess.peak ? [excess.peak.x, excess.peak.y] : null,
      wetArea_m2: excess.area_m2,
    };
  });

  return {
    grid, time_s: result.time_s, levels, contours, model: result.model, flagCounts: result.flagCounts, flaggedNodes, excavations,
    range_m: [Number.isFinite(lo) ? lo : Number.NaN, Number.isFinite(hi) ? hi : Number.NaN],
  };
}
