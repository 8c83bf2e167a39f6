/**
 * The flow through the section and where it goes: total inflow from every fixed head (and any
 * injecting well), the outflow to the floor, to each drain and to each well, the flow passing
 * under each wall's toe, and the mass-balance error of the solve.
 */
import { findLine } from './graded-axis';
import { floorSpan, type SectionContext } from './section-context';

/** Flows in m³/s per metre run (plane) or m³/s (axisymmetric). */
export interface SectionFlowSplit {
  /** Water entering the soil (net per surface segment, drain and well taking in water): the flow to handle. */
  inflow: number;
  /** Out through the floor surface (fixed-head segments within the floor span). */
  floor: number;
  /** Out through other fixed-head surface segments. */
  otherSurfaces: number;
  /** Out to each drain (document order). */
  drains: number[];
  /** Out to each well (document order; fixed-head and fixed-rate). */
  wells: number[];
  /** Under each wall's toe, + = in the +x direction (document order). */
  underWalls: number[];
  /** |inflow − outflow| / inflow. */
  balanceError: number;
}

function underWall(ctx: SectionContext, wi: number): number {
  const w = ctx.doc.walls![wi]!;
  const { x, z, nx, nz } = ctx.mesh;
  const iw = findLine(x, w.x_m);
  let q = 0;
  for (let j = 0; j < nz && z[j + 1]! <= w.toe_m + 1e-9; j++) q += ctx.fields.xFlux[j * nx + iw - 1]!;
  return q;
}

/** The flow split of a solved section. */
export function computeFlowSplit(ctx: SectionContext): SectionFlowSplit {
  const { doc, system, fields, mesh } = ctx;
  const span = floorSpan(doc);
  const c = system.connections;
  let inflow = 0;
  let outflow = 0;
  let floor = 0;
  let otherSurfaces = 0;
  const drains = new Array<number>(doc.drains?.length ?? 0).fill(0);
  const wells = new Array<number>(doc.wells?.length ?? 0).fill(0);
  const surfaces = new Array<number>(doc.surface.length).fill(0);
  c.cell.forEach((k, m) => {
    const q = fields.connectionOutflow[m]!;
    if (c.kind[m] === 'drain') drains[c.source[m]!]! += q;
    else if (c.kind[m] === 'well') wells[c.source[m]!]! += q;
    else {
      surfaces[c.source[m]!]! += q;
      const i = k % mesh.nx;
      const xc = 0.5 * (mesh.x[i]! + mesh.x[i + 1]!);
      if (xc > span.x0_m && xc < span.x1_m) floor += q;
      else otherSurfaces += q;
    }
  });
  system.rates.cell.forEach((_k, m) => (wells[system.rates.source[m]!]! -= system.rates.inflow[m]!));
  // Net per segment, well and drain: a screen the water passes through is neither in nor out.
  for (const q of [...surfaces, ...drains, ...wells]) {
    if (q < 0) inflow -= q;
    else outflow += q;
  }
  const underWalls = (doc.walls ?? []).map((_w, wi) => underWall(ctx, wi));
  const balanceError = inflow > 0 ? Math.abs(inflow - outflow) / inflow : 0;
  return { inflow, floor, otherSurfaces, drains, wells, underWalls, balanceError };
}
