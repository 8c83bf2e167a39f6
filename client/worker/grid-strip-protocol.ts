/** Messages between the engine worker and its strip workers (one per core, full grids only). */
import type { GridResult, GridSpec } from '../../shared/field/types';
import type { DrydigError, Scenario } from '../../shared/schema';

/** Evaluate the grid (a strip of the view's rows) for the scenario at time_s. */
export interface StripRequest {
  id: number;
  scenario: Scenario;
  grid: GridSpec;
  time_s: number | null;
}

/** The strip's result, or the engine's message when it could not be computed. */
export type StripResponse =
  | { id: number; result: GridResult }
  | { id: number; error: string; drydig?: { code: DrydigError['code']; issues: DrydigError['issues'] } };
