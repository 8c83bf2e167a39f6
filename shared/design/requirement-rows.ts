/**
 * Stage 3 of a design run: the requirement rows of the LP, "level ≤ target − tolerance" at each
 * control point, i.e. Σ a_ij·Q_j ≥ variable(target − tolerance), and the rate problem they make
 * with the well-limit rows.
 */
import type { ControlPoint } from './control-points';
import type { DesignContext } from './design-context';
import type { RateProblem } from './rate-problem';
import type { WellLimitRows } from './well-limits';

/**
 * The design asks for the target less this, m, so the engine's evaluation lands at or below the
 * target despite the LP’s tolerances and between control points (1 mm: far inside the 1 cm acceptance).
 */
export const DESIGN_TOLERANCE_M = 1e-3;

/** The growing set of requirement rows (design points first, check points added by refinement). */
export class RequirementRows {
  readonly responses: Float64Array[] = [];
  readonly required: number[] = [];
  readonly points: ControlPoint[] = [];
  /** Indices of check points added to the rows. */
  readonly addedCheckPoints = new Set<number>();

  constructor(private readonly ctx: DesignContext) {}

  /** The variable the point's row asks for (Infinity when the target is below what wells can reach). */
  requiredFor(p: ControlPoint): number {
    return this.ctx.variableForLevel(p.targetLevel_m - DESIGN_TOLERANCE_M);
  }

  /** Adds a row unless the point needs no lowering or cannot be lowered to its target. */
  add(response: Float64Array, p: ControlPoint): void {
    const r = this.requiredFor(p);
    if (!Number.isFinite(r) || r <= 0) return;
    this.responses.push(response);
    this.required.push(r);
    this.points.push(p);
  }

  /** The rate problem of these rows and the well limits; `chosen` (layout) keeps only chosen wells. */
  toProblem(limitSet: WellLimitRows, chosen: Uint8Array | null): RateProblem {
    const nW = this.ctx.wells.length;
    const response = new Float64Array(this.responses.length * nW);
    this.responses.forEach((r, i) => response.set(r, i * nW));
    const keep = (j: number) => chosen === null || chosen[j] === 1;
    return {
      nWells: nW,
      response,
      required: Float64Array.from(this.required),
      limits: limitSet.limits.filter((l) => keep(l.wellIndex)),
      upper: limitSet.upper.map((u, j) => (keep(j) ? u : 0)),
      lower: limitSet.lower.map((v, j) => (keep(j) ? v : 0)),
      upperKind: limitSet.upperKind,
    };
  }
}
