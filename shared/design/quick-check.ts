/**
 * The equivalent-well quick check of each excavation beside the superposition total, with the
 * image wells of the drawn boundaries, its range of validity, and flags where it is outside it.
 */
import { equivalentWellBoundaryFactor, equivalentWellInflow } from '../field';
import { getPolygonArea, getPolygonPerimeter } from '../geometry';
import type { DesignContext } from './design-context';
import type { QuickCheck } from './design-result';
import { formatFigure } from './design-wording';

/** Plans less compact than 4πA/P² = 0.6 (about a 3:1 rectangle) are long trenches, not equivalent wells. */
export const QUICK_CHECK_MIN_COMPACTNESS = 0.6;
/** Transient: beyond u = r_e²S/(4Tt) = 1 the drawdown has barely reached r_e by the design time. */
export const QUICK_CHECK_MAX_U = 1;
/** Total rates above this (m³/s) are not a dewatering estimate but a sign the target is out of reach. */
export const QUICK_CHECK_MAX_RATE_M3_S = 10;
/** A ratio outside [1/2, 2] is flagged for a second look (our own screening band, not a published one). */
export const QUICK_CHECK_RATIO_BAND = 2;

export const QUICK_CHECK_VALIDITY =
  `Valid for a compact plan (4πA/P² ≥ ${QUICK_CHECK_MIN_COMPACTNESS}, about 3:1 or squatter) whose equivalent circle is clear of every boundary line; transient runs need u = r_e²S/(4Tt) ≤ ${QUICK_CHECK_MAX_U} at the design time. Boundaries enter by image wells of the equivalent well at the centroid (Ferris et al. 1962).`;

/** One quick check per excavation: equivalent-well inflow with boundary images, r_e, the ratio and flags. */
export function buildQuickChecks(ctx: DesignContext, total_m3_s: number): QuickCheck[] {
  const { scenario } = ctx;
  return scenario.excavations.map((e) => {
    const shared = scenario.excavations.length > 1 ? ' The superposition total serves every excavation.' : '';
    try {
      const c = equivalentWellInflow({ scenario, excavationId: e.id, time_s: ctx.designTime_s });
      const b = equivalentWellBoundaryFactor({ scenario, excavationId: e.id, time_s: ctx.designTime_s, ...(c.influenceRadius_m !== undefined ? { influenceRadius_m: c.influenceRadius_m } : {}) });
      const rate = c.rate_m3_s * b.factor;
      const flags: string[] = [];
      const words: string[] = [];
      const compactness = (4 * Math.PI * getPolygonArea(e.outline)) / getPolygonPerimeter(e.outline) ** 2;
      if (compactness < QUICK_CHECK_MIN_COMPACTNESS) {
        flags.push('elongated-plan');
        words.push(`the plan is long for an equivalent well (4πA/P² = ${formatFigure(compactness, 2)})`);
      }
      if (b.crossesBoundary) {
        flags.push('boundary-crosses-equivalent-well');
        words.push(`a boundary line passes within r_e = ${formatFigure(c.equivalentRadius_m, 3)} m of the centroid`);
      }
      if (c.u !== undefined && c.u > QUICK_CHECK_MAX_U) {
        flags.push('not-developed-by-design-time');
        words.push(`u = ${c.u.toPrecision(3)} at the design time: the drawdown has barely reached the excavation edge`);
      }
      const plausible = Number.isFinite(rate) && rate >= 0 && rate <= QUICK_CHECK_MAX_RATE_M3_S;
      if (!plausible) {
        flags.push('implausible-rate');
        words.push(`the equivalent well would need ${Number.isFinite(rate) ? `${rate.toPrecision(2)} m³/s` : 'an unbounded rate (the estimate is not a finite number here)'}, more than ${QUICK_CHECK_MAX_RATE_M3_S} m³/s: the target is out of reach of any well field here, not a figure to price`);
      }
      const ratio = plausible && rate > 0 ? total_m3_s / rate : null;
      if (ratio !== null && (ratio > QUICK_CHECK_RATIO_BAND || ratio < 1 / QUICK_CHECK_RATIO_BAND)) flags.push('ratio-far-from-one');
      const boundaryWords = b.nearestBoundary_m === null ? 'no boundaries drawn' : `boundary images included (factor ${formatFigure(b.factor, 3)} on the unbounded ${formatFigure(c.rate_m3_s * 1000, 3)} L/s)`;
      return {
        excavationId: e.id,
        equivalentWellInflow_m3_s: plausible ? rate : null,
        equivalentRadius_m: c.equivalentRadius_m,
        superpositionTotal_m3_s: total_m3_s,
        ratio,
        boundaryFactor: Number.isFinite(b.factor) ? b.factor : null,
        flags,
        validity: QUICK_CHECK_VALIDITY,
        note: `Equivalent well (r_e = sqrt(A/π), ${c.method}), ${boundaryWords}: a rough figure; a ratio far from 1 deserves a second look.${words.length > 0 ? ` Outside its validity: ${words.join('; ')}.` : ''}${shared}`,
      };
    } catch (error) {
      return {
        excavationId: e.id,
        equivalentWellInflow_m3_s: null,
        equivalentRadius_m: null,
        superpositionTotal_m3_s: total_m3_s,
        ratio: null,
        boundaryFactor: null,
        flags: ['not-applicable'],
        validity: QUICK_CHECK_VALIDITY,
        note: `No equivalent-well estimate: ${error instanceof Error ? error.message : String(error)}`,
      };
    }
  });
}
