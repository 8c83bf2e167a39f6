/**
 * Messages between the page and the engine worker. Plain structured-clone data only.
 * Every request carries an `id`; the worker answers with the same id, and may send `progress`
 * messages before the answer for long jobs.
 */
import type { Scenario } from '../../shared/schema';
import type { GridSpec, ModelInfo, PointFlag, PointResult } from '../../shared/field/types';
import type { SeriesSample } from '../../shared/field';
import type { ContourSet, XY } from '../../shared/contours';
import type { PiezometerPlan } from '../../shared/exports';
import type { SectionJob, SectionJobAnswer } from '../../shared/section';

/** Which field the contours show. */
export type FieldQuantity = 'drawdown' | 'level';

/** Contours, flag outlines and shortfall for one view of the plan. */
export interface FieldRequest {
  kind: 'field';
  id: number;
  scenario: Scenario;
  grid: GridSpec;
  /** Time for the contours, s; null = steady state. */
  time_s: number | null;
  quantity: FieldQuantity;
  /** Contour interval, m; absent = a round step for about 12 levels. */
  step_m?: number;
  /** Metres per display length unit (1, or 0.3048 for feet): automatic levels are round in it. Default 1. */
  levelUnit_m?: number;
  /** Nodes per side of each excavation's own grid for the shortfall (default 41). */
  pitNodes?: number;
  /** Row strips to compute in, with a progress message and a cancel check after each (default 1). */
  strips?: number;
  /**
   * Time whose drawdown range sets the colour scale, s (the design time), so colours mean the
   * same at every time on the slider. Absent: the result's own range.
   */
  scaleTime_s?: number | null;
  /**
   * A drag frame: keep each grid (view, colour-scale, excavations) in the worker and replace only
   * the changed wells' shares (shared/field/incremental-grid.ts). Default false: a full evaluation.
   */
  incremental?: boolean;
  /**
   * Split a full grid over the strip workers (one per core). Default true; false computes it in
   * the engine worker alone (`?stripWorkers=off`, the drag bench's "before").
   */
  stripWorkers?: boolean;
}

/** Level and drawdown against time at one point. */
export interface InspectRequest {
  kind: 'inspect';
  id: number;
  scenario: Scenario;
  point: XY;
  /** Times for the curve, s (positive). */
  times_s: number[];
  /** Time for the headline value, s; null = steady state. */
  time_s: number | null;
}

/** Level along a section line. */
export interface SectionRequest {
  kind: 'section';
  id: number;
  scenario: Scenario;
  from: XY;
  to: XY;
  samples: number;
  time_s: number | null;
}

/** One piezometer's expected, alert and action levels over time, as the site team will get them. */
export interface MonitoringRequest {
  kind: 'monitoring';
  id: number;
  scenario: Scenario;
  piezometerId: string;
}

/** Seepage in a vertical section (shared/section): a section document or one built from the scenario. */
export interface SeepageRequest {
  kind: 'seepage';
  id: number;
  job: SectionJob;
}

/** Answer to a SeepageRequest. */
export interface SeepageResult {
  kind: 'seepage';
  id: number;
  answer: SectionJobAnswer;
  compute_ms: number;
}

/** Stop a running or queued job (its answer, if any, is `cancelled`). */
export interface CancelRequest {
  kind: 'cancel';
  id: number;
}

export type EngineRequest = FieldRequest | InspectRequest | SectionRequest | MonitoringRequest | SeepageRequest | CancelRequest;

/** How one excavation stands against its governing target at the time shown. */
export interface ExcavationShortfall {
  id: string;
  /** The governing target (as the design uses it): dry level, or the uplift / heave allowable level, m. */
  targetLevel_m: number;
  /** Time used (the time shown on the map), s; null = steady state. */
  time_s: number | null;
  /** True only for a pass: at or below target and not drawn down to the aquifer base. */
  met: boolean;
  /** How it stands (see `ShortfallKind` in client/map/shortfall-symbols.ts). */
  kind: 'met' | 'above-target' | 'floor-unsafe' | 'dewatered';
  /** Which check sets the target (shared/floor). */
  governing: 'dry' | 'uplift' | 'heave';
  /** Factor of safety of the governing floor check at the highest head inside, with the one required; null for a dry floor. */
  floorFS: { check: 'uplift' | 'heave'; fs: number | null; required: number } | null;
  /** Highest computed level inside minus target, m (≤ 0 when met). */
  worstShortfall_m: number;
  /** Where that highest level is. */
  worst: { x: number; y: number; level_m: number };
  /** The region above target (MultiPolygon, site metres). */
  coordinates: XY[][][];
  area_m2: number;
  /** Fraction of the excavation's area above target. */
  areaFraction: number;
  /** Flags met at the sampled points inside (e.g. dewatered). */
  flags: PointFlag[];
}

/** Answer to a FieldRequest. */
export interface FieldResult {
  kind: 'field';
  id: number;
  quantity: FieldQuantity;
  time_s: number | null;
  grid: GridSpec;
  contours: ContourSet;
  levels: number[];
  /** Range of the contoured quantity over the grid (finite nodes), m. */
  range: { min: number; max: number };
  /** Range of drawdown over the grid, m (legend colours are by drawdown in both modes). */
  drawdownRange: { min: number; max: number };
  /** Largest drawdown the colours stretch to, m: the range at `scaleTime_s` when asked, else `drawdownRange.max`. */
  colourMax_m: number;
  /** Time the colour scale belongs to, s (null: steady state); undefined: the result's own time. */
  colourTime_s?: number | null;
  /** Contour levels the interval asked for, when more than could be drawn (the interval was widened). */
  levelsWanted?: number;
  /** Outline of nodes with each flag (only flags present). */
  flagAreas: Array<{ flag: PointFlag; count: number; coordinates: XY[][][] }>;
  flagCounts: Record<string, number>;
  model: ModelInfo;
  shortfall: ExcavationShortfall[];
  /** Worker-side compute time, ms. */
  compute_ms: number;
  /** A drag frame whose grids were all updated well by well (false: at least one in full). */
  incremental?: boolean;
  /** Strip workers the view grid was split over (absent: computed in the engine worker alone). */
  stripWorkers?: number;
}

export interface InspectResult {
  kind: 'inspect';
  id: number;
  point: XY;
  /** At the headline time. */
  current: PointResult;
  series: SeriesSample[];
  model: ModelInfo;
}

export interface SectionResult {
  kind: 'section';
  id: number;
  from: XY;
  to: XY;
  points: Array<PointResult & { distance_m: number }>;
  model: ModelInfo;
}

/** Answer to a MonitoringRequest: the plan row of `buildMonitoringPlan` for that piezometer. */
export interface MonitoringResult {
  kind: 'monitoring';
  id: number;
  /** Null when the scenario has no piezometer of that id. */
  piezometer: PiezometerPlan | null;
  pumpingStart: string | null;
  /** Interval of the expected-level table, s (null: steady state). */
  interval_s: number | null;
  staticLevel_m: number;
  notes: string[];
}

export interface ProgressMessage {
  kind: 'progress';
  id: number;
  /** 0–1. */
  fraction: number;
}

export interface ErrorMessage {
  kind: 'error';
  id: number;
  message: string;
  issues?: Array<{ path: string; message: string }>;
}

export interface CancelledMessage {
  kind: 'cancelled';
  id: number;
}

export type EngineResponse = FieldResult | InspectResult | SectionResult | MonitoringResult | SeepageResult | ProgressMessage | ErrorMessage | CancelledMessage;
