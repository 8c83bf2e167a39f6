/**
 * The drawn boundaries in the equivalent-well quick estimate: the equivalent well of radius r_e
 * at the excavation's centroid, with its image wells (Ferris et al. 1962), needs the target
 * variable at its face from Q·(F(r_e) + Σ sign_i·F(d_i)), F the unit response of the aquifer's
 * method. The boundary factor F(r_e) / (F(r_e) + Σ sign_i·F(d_i)) scales the unbounded estimate:
 * above 1 beside a no-flow line (the images add drawdown … less inflow), below 1 beside a
 * constant-head line (a river feeds the wells).
 */
import type { Scenario } from '../schema';
import { getPolygonArea, getPolygonCentroid } from '../geometry';
import { resolveBoundaryGeometry, isInsideBoundaries } from './image-wells';
import { unitResponseMatrix } from './unit-response-matrix';

/** Options of {@link equivalentWellBoundaryFactor}. */
export interface EquivalentWellBoundaryFactorOptions {
  scenario: Scenario;
  excavationId: string;
  /** Undefined: the design time; null: steady state. */
  time_s?: number | null;
  /** Steady confined/unconfined: R0 measured from the centroid, m (the estimate's own). */
  influenceRadius_m?: number;
}

/** The boundary factor and what limits its meaning. */
export interface EquivalentWellBoundaryFactor {
  /** Factor on the unbounded equivalent-well rate (1 without boundaries). */
  factor: number;
  /** Distance from the centroid to the nearest boundary line, m (null without boundaries). */
  nearestBoundary_m: number | null;
  /** The equivalent circle crosses a boundary line (or the centroid lies across one). */
  crossesBoundary: boolean;
}

/** Boundary factor of the equivalent well of one excavation (see the file comment). */
export function equivalentWellBoundaryFactor({ scenario, excavationId, time_s, influenceRadius_m }: EquivalentWellBoundaryFactorOptions): EquivalentWellBoundaryFactor {
  const excavation = scenario.excavations.find((e) => e.id === excavationId)!;
  const boundaries = scenario.boundaries ?? [];
  if (boundaries.length === 0) return { factor: 1, nearestBoundary_m: null, crossesBoundary: false };
  const re = Math.sqrt(getPolygonArea(excavation.outline) / Math.PI);
  const [cx, cy] = getPolygonCentroid(excavation.outline);
  const nearest = Math.min(
    ...boundaries.map((b) => {
      const [x1, y1] = b.from;
      const [x2, y2] = b.to;
      return Math.abs((x2 - x1) * (y1 - cy) - (x1 - cx) * (y2 - y1)) / Math.hypot(x2 - x1, y2 - y1);
    }),
  );
  const single = (withBoundaries: boolean): number => {
    const s: Scenario = {
      ...scenario,
      aquifer: { ...scenario.aquifer, ...(influenceRadius_m !== undefined ? { influenceRadius_m } : {}) },
      boundaries: withBoundaries ? boundaries : [],
      // The equivalent well penetrates fully; its face is read at the centroid (r = r_e).
      wells: [{ id: 'equivalent', x: cx, y: cy, radius_m: re, kind: 'deep' }],
    };
    return unitResponseMatrix({ scenario: s, points: [[cx, cy]], time_s }).values[0]!;
  };
  const geometry = resolveBoundaryGeometry({ ...scenario, wells: [{ id: 'equivalent', x: cx, y: cy, radius_m: re, kind: 'deep' }] });
  const crossesBoundary = nearest < re || !isInsideBoundaries(geometry, cx, cy);
  const free = single(false);
  const bounded = single(true);
  return { factor: bounded > 0 ? free / bounded : Infinity, nearestBoundary_m: nearest, crossesBoundary };
}
