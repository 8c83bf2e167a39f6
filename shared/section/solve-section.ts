/**
 * Solves a section document: mesh → assemble → preconditioned CG → fields → results (flow and
 * its split, the floor profile and exit gradient, Terzaghi heave, slab and plug uplift, the flow
 * net). Pure and synchronous, so it runs the same in a browser worker, a worker thread and a test.
 */
import { DrydigError, parseSection, type SectionDocument } from '../schema';
import { assembleSection } from './assemble-section';
import { solveFivePointPcg } from './five-point-pcg';
import { buildSectionMesh, MAX_SECTION_CELLS, type SectionMesh } from './section-mesh';
import { computeSectionFields, findIsolatedCells, type SectionFields } from './section-fields';
import { DEFAULT_REQUIRED_FS, type SectionContext } from './section-context';
import { computeFlowSplit } from './section-flow-split';
import { checkExitGradient, computeFloorProfile, type ExitGradientCheck, type FloorPoint } from './floor-profile';
import { checkTerzaghiHeave, type HeaveCheck } from './terzaghi-heave';
import { computeSlabUplift, type SlabUplift } from './slab-uplift';
import { checkPlugUplift, type PlugUplift } from './plug-uplift';
import { buildFlowNet, type FlowNet, type FlowNetOptions } from './flow-net';
import { SECTION_CAUTIONS } from './section-cautions';

export const SECTION_METHOD = 'steady anisotropic Darcy flow, cell-centred finite volumes (two-point fluxes, harmonic means) on a graded rectilinear mesh';
export const SOLVER_METHOD = 'conjugate gradients preconditioned by modified incomplete Cholesky MIC(0)';

export interface SolveSectionOptions {
  /** Draw the flow net (equipotentials and flow lines). Default true. */
  flowNet?: boolean | FlowNetOptions;
  /** Cell limit. Default MAX_SECTION_CELLS. */
  maxCells?: number;
  /** Keep the mesh and fields on the result (for tests and drawing). Default false. */
  keepFields?: boolean;
}

/** Flows of the split, in the geometry's unit (m³/s per m plane, m³/s axisymmetric). */
export interface SectionSplit {
  floor: number;
  otherSurfaces: number;
  drains: Array<{ x_m: number; flow: number }>;
  wells: Array<{ x_m: number; flow: number }>;
  underWalls: Array<{ x_m: number; toe_m: number; flow: number }>;
}

export interface SectionResult {
  format: 'drydig.section-result';
  version: 1;
  geometry: SectionDocument['geometry'];
  method: string;
  /** Plane: total flow per metre run, m³/s/m. */
  flow_m3_s_per_m?: number;
  /** Axisymmetric: total flow, m³/s. */
  flow_m3_s?: number;
  /** Unit of every flow in `split` and `flowNet`. */
  flowUnit: 'm3/s per m' | 'm3/s';
  split: SectionSplit;
  exitGradient: ExitGradientCheck;
  floor: FloorPoint[];
  heave: HeaveCheck | null;
  heaveByWall: HeaveCheck[];
  uplift: SlabUplift | null;
  plug: PlugUplift | null;
  mesh: { nx: number; nz: number; cells: number; unknowns: number; minSize_m: number; maxSize_m: number; growth: number; subdivide: number };
  solver: { method: string; tolerance: number; iterations: number; relativeResidual: number; converged: boolean; balanceError: number };
  flowNet: FlowNet | null;
  flags: string[];
  cautions: readonly string[];
  /** Present with keepFields. */
  internal?: { mesh: SectionMesh; fields: SectionFields };
}

function round3(segments: number[]): number[] {
  return segments.map((v) => Math.round(v * 1000) / 1000);
}

function collectFlags(doc: SectionDocument, ctx: SectionContext, isolated: number, solver: SectionResult['solver']): string[] {
  const flags: string[] = [];
  if (!solver.converged) flags.push(`the iterative solve stopped at a relative residual of ${solver.relativeResidual.toExponential(1)} (asked ${solver.tolerance.toExponential(0)}): results are approximate`);
  if (solver.balanceError > 1e-6) flags.push(`water balance closes to ${(solver.balanceError * 100).toPrecision(2)} % only`);
  if (isolated > 0) flags.push(`${isolated} cells are cut off from every fixed head by walls; their head is undetermined and left out`);
  if (doc.layers.some((l) => l.unitWeightSat_kN_m3 === undefined)) flags.push('saturated unit weight not given for every layer: 20 kN/m³ assumed (common practice) in the critical gradient and heave');
  doc.surface.forEach((s, i) => {
    if (s.head_m !== null && s.head_m < s.level_m - 1e-9) flags.push(`surface segment ${i}: head ${s.head_m} m is below its ground (${s.level_m} m): that water level is held on the segment as if at the ground surface (outside: the water table idealised there; on a floor: a surface drained to that head)`);
  });
  if (ctx.axi && (doc.walls?.length ?? 0) > 0) flags.push('axisymmetric: the heave prism is taken per unit length of the wall’s circumference');
  return flags;
}

/** Solves a validated section document. */
export function solveSectionDocument(doc: SectionDocument, options: SolveSectionOptions = {}): SectionResult {
  const mesh = buildSectionMesh(doc, options.maxCells ?? MAX_SECTION_CELLS);
  const system = assembleSection(doc, mesh);
  const isolated = findIsolatedCells(mesh, system);
  let isolatedCount = 0;
  for (let k = 0; k < isolated.length; k++) {
    if (!isolated[k]) continue;
    isolatedCount++;
    if (system.rhs[k] !== 0) throw new DrydigError('DRYDIG_ERR_INVALID_SECTION', '/wells: a well with a fixed rate stands in a part of the section cut off from every fixed head by walls: steady flow has no solution', [{ path: '/wells', message: 'a fixed-rate well is cut off from every fixed head' }]);
    // Pin the cut-off cells: their block of the matrix is singular.
    system.diag[k] = 1;
    system.east[k] = 0;
    system.north[k] = 0;
    if (k % mesh.nx > 0) system.east[k - 1] = 0;
    if (k >= mesh.nx) system.north[k - mesh.nx] = 0;
  }
  const tolerance = doc.mesh?.tolerance ?? 1e-12;
  const pcg = solveFivePointPcg(system, { tolerance });
  const fields = computeSectionFields(doc, mesh, system, pcg.x, isolated);
  const ctx: SectionContext = { doc, mesh, system, fields, axi: doc.geometry === 'axisymmetric' };
  const split = computeFlowSplit(ctx);
  const floor = computeFloorProfile(ctx);
  const exitGradient = checkExitGradient(ctx, floor);
  const requiredFS = doc.requiredFS ?? DEFAULT_REQUIRED_FS;
  const heaveByWall = checkTerzaghiHeave(ctx, requiredFS);
  const heave = heaveByWall.reduce<HeaveCheck | null>((w, h) => (w === null || (h.fs !== null && (w.fs === null || h.fs < w.fs)) ? h : w), null);
  const solver = { method: SOLVER_METHOD, tolerance, iterations: pcg.iterations, relativeResidual: pcg.relativeResidual, converged: pcg.converged, balanceError: split.balanceError };
  const wantNet = options.flowNet ?? true;
  const net = wantNet ? buildFlowNet(ctx, typeof wantNet === 'object' ? wantNet : {}) : null;
  const flowNet = net && {
    ...net,
    equipotentials: net.equipotentials.map((e) => ({ ...e, segments: round3(e.segments) })),
    flowLines: net.flowLines.map((f) => ({ ...f, segments: round3(f.segments) })),
  };
  const result: SectionResult = {
    format: 'drydig.section-result',
    version: 1,
    geometry: doc.geometry,
    method: SECTION_METHOD,
    ...(ctx.axi ? { flow_m3_s: split.inflow } : { flow_m3_s_per_m: split.inflow }),
    flowUnit: ctx.axi ? 'm3/s' : 'm3/s per m',
    split: {
      floor: split.floor,
      otherSurfaces: split.otherSurfaces,
      drains: split.drains.map((flow, i) => ({ x_m: doc.drains![i]!.x_m, flow })),
      wells: split.wells.map((flow, i) => ({ x_m: doc.wells![i]!.x_m, flow })),
      underWalls: split.underWalls.map((flow, i) => ({ x_m: doc.walls![i]!.x_m, toe_m: doc.walls![i]!.toe_m, flow })),
    },
    exitGradient,
    floor,
    heave,
    heaveByWall,
    uplift: computeSlabUplift(ctx),
    plug: checkPlugUplift(ctx),
    mesh: { nx: mesh.nx, nz: mesh.nz, cells: mesh.nx * mesh.nz, unknowns: mesh.activeCount, ...mesh.sizes },
    solver,
    flowNet,
    flags: collectFlags(doc, ctx, isolatedCount, solver),
    cautions: SECTION_CAUTIONS,
  };
  if (options.keepFields) result.internal = { mesh, fields };
  return result;
}

/** Validates (DRYDIG_ERR_INVALID_SECTION naming the field) and solves a section document. */
export function solveSection(input: unknown, options: SolveSectionOptions = {}): SectionResult {
  return solveSectionDocument(parseSection(input), options);
}

/** The section's total flow (m³/s per m plane, m³/s axisymmetric). */
export function sectionFlow(result: Pick<SectionResult, 'flow_m3_s_per_m' | 'flow_m3_s'>): number {
  return result.flow_m3_s_per_m ?? result.flow_m3_s ?? 0;
}
