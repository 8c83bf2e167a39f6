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

/** How one excavation stands against its target at the design time. */
export interface ExcavationShortfall {
  id: string;
  targetLevel_m: number;
  /** Design time used, s; null = steady state. */
  time_s: number | null;
  met: boolean;
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
  /** Outline of nodes with each flag (only flags present). */
  flagAreas: Array<{ flag: PointFlag; count: number; coordinates: XY[][][] }>;
  flagCounts: Record<string, number>;
  model: ModelInfo;
  shortfall: ExcavationShortfall[];
  /** Worker-side compute time, ms. */
  compute_ms: number;
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
