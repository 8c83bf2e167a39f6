/** The real field engine, packaged for the pure export writers. */
import { evaluateGrid, evaluatePoints } from '../../shared/field';
import type { FieldEngine } from '../../shared/exports';

export const fieldEngine: FieldEngine = { evaluateGrid, evaluatePoints };
