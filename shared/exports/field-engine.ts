/**
 * The part of the field engine the export writers call. Writers take it as a parameter so they
 * stay small and testable; the server and client pass the real `shared/field` functions.
 */
import type { EvaluateGridOptions, EvaluatePointsOptions, EvaluatePointsResult, GridResult } from '../field/types';

export interface FieldEngine {
  evaluatePoints(options: EvaluatePointsOptions): EvaluatePointsResult;
  evaluateGrid(options: EvaluateGridOptions): GridResult;
}
