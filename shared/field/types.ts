/**
 * Result types of the field engine (superposition of wells, image wells and rate schedules).
 * These shapes are what the server, the CLI, the worker and the design solver consume.
 */
import type { Scenario } from '../schema';

/**
 * Validity flags on a computed point. A flagged result is still a number (never NaN) but lies
 * outside the method's comfortable validity, and the UI / API must show the flag.
 * - `dewatered`: unconfined aquifer drawn down to its base at this point (level reported = base).
 * - `large-drawdown`: unconfined drawdown beyond ~25 % of saturated thickness (Dupuit/Jacob degrade).
 * - `beyond-influence-radius`: steady run, point farther than R from every source (drawdown 0 by assumption).
 * - `confined-to-unconfined`: confined/leaky head drawn below the aquifer top (aquifer turns unconfined).
 * - `within-well-radius`: point closer than r_w to a well; evaluated at r_w.
 * - `beyond-boundary`: point on the far side of a straight boundary, outside the modelled aquifer
 *   (reported at the static level, drawdown 0: the image method says nothing about that side).
 */
export type PointFlag =
  | 'dewatered'
  | 'large-drawdown'
  | 'beyond-influence-radius'
  | 'confined-to-unconfined'
  | 'within-well-radius'
  | 'beyond-boundary';

/** Bit of each flag in grid flag masks (`GridResult.flags`). */
export const FLAG_BITS: Readonly<Record<PointFlag, number>> = {
  dewatered: 1,
  'large-drawdown': 2,
  'beyond-influence-radius': 4,
  'confined-to-unconfined': 8,
  'within-well-radius': 16,
  'beyond-boundary': 32,
};

/** The published method the engine applied, and the assumptions it used. */
export interface ModelInfo {
  method: 'theis' | 'thiem' | 'theis-unconfined' | 'dupuit-thiem' | 'hantush-jacob' | 'de-glee';
  /** Steady confined/unconfined runs: the radius of influence used, m. */
  influenceRadius_m?: number;
  /** Where R came from. */
  influenceRadiusSource?: 'scenario' | 'sichardt';
  /** Transmissivity used, m²/s (unconfined: K·H with H the static saturated thickness). */
  transmissivity_m2_s: number;
  /** Number of image wells added per real well for the boundaries. */
  imagesPerWell: number;
  /** Two parallel boundaries: bound on the head error from truncating the image series, m. */
  truncationBound_m?: number;
  /** Plain-language notes on assumptions and limits (shown beside results). */
  notes: string[];
}

/** One evaluated point (CLI / API contract: design.md section 4). */
export interface PointResult {
  x: number;
  y: number;
  /** Time since pumping started, s; null for steady state. */
  time_s: number | null;
  /** Groundwater level (unconfined) or piezometric level (confined/leaky), m. */
  level_m: number;
  /** Drawdown below the static level, m (positive down). */
  drawdown_m: number;
  flags: PointFlag[];
}

/** Options of `evaluatePoints`. */
export interface EvaluatePointsOptions {
  scenario: Scenario;
  points: ReadonlyArray<readonly [number, number]>;
  /** Time since pumping started, s. Undefined: the scenario's design time. Null: steady state. */
  time_s?: number | null;
}

/** Result of `evaluatePoints`: one PointResult per input point, in order, and the model used. */
export interface EvaluatePointsResult {
  points: PointResult[];
  model: ModelInfo;
}

/** A regular grid of nodes: node (i, j) is at (origin[0] + i·spacing[0], origin[1] + j·spacing[1]). */
export interface GridSpec {
  origin: readonly [number, number];
  spacing_m: readonly [number, number];
  counts: readonly [number, number];
}

/** Options of `evaluateGrid`. */
export interface EvaluateGridOptions {
  scenario: Scenario;
  grid: GridSpec;
  /** As in EvaluatePointsOptions. */
  time_s?: number | null;
  /** Bench only: 'pairwise' runs the previous Theis kernel (one logarithm per pair) for the side-by-side figure. */
  kernel?: 'grouped' | 'pairwise';
}

/** Grid values row-major: index = j·nx + i (j along y). */
export interface GridResult {
  grid: GridSpec;
  time_s: number | null;
  drawdown_m: Float64Array;
  level_m: Float64Array;
  /** Bit mask of FLAG_BITS per node. */
  flags: Uint8Array;
  /** How many nodes carry each flag. */
  flagCounts: Record<PointFlag, number>;
  model: ModelInfo;
}

/** Level in and around each pumping well (for capacity, suction lift and pump head). */
export interface WellLevel {
  id: string;
  rate_m3_s: number;
  /** Aquifer level at the well face (r = r_w), all wells and images included, m. */
  aquiferLevel_m: number;
  /** Well loss C·Q², m. */
  wellLoss_m: number;
  /** Pumping level inside the well = aquifer level at r_w − C·Q², m. */
  pumpingLevel_m: number;
  flags: PointFlag[];
}
