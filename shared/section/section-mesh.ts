/**
 * The section mesh: a rectilinear grid of cells (finite volumes) graded towards wall toes, the
 * floor, wells and drains, with a grid line through every interface so each cell lies in one
 * layer and every wall, screen and segment end sits on a cell face.
 */
import { DrydigError, surfaceLevelAt, type SectionDocument } from '../schema';
import { buildGradedAxis, type RefinePoint } from './graded-axis';

/** Most cells a section may have (the solve stays within a few seconds). */
export const MAX_SECTION_CELLS = 400_000;

/** Unit weight assumed where a layer gives none, kN/m³ (common practice for saturated sand). */
export const DEFAULT_UNIT_WEIGHT_SAT_KN_M3 = 20;

export interface SectionMesh {
  /** Vertical grid lines (x, m), nx + 1 of them. */
  x: Float64Array;
  /** Horizontal grid lines (z, m), bottom up, nz + 1 of them. */
  z: Float64Array;
  nx: number;
  nz: number;
  /** 1 where the cell is soil (below the surface), per cell k = j·nx + i. */
  active: Uint8Array;
  /** Layer index of each cell (−1 above the surface). */
  layer: Int16Array;
  kh: Float64Array;
  kv: Float64Array;
  /** Ground level above column i, m. */
  surface: Float64Array;
  /** Row index of the top active cell of column i. */
  topRow: Int32Array;
  /** Number of active cells (the unknowns). */
  activeCount: number;
  /** Sizes the mesh was built with. */
  sizes: { maxSize_m: number; minSize_m: number; growth: number; subdivide: number };
}

/** Default largest and smallest cell sides for a document (see SectionMeshSchema). */
export function defaultMeshSizes(doc: SectionDocument): { maxSize_m: number; minSize_m: number } {
  const top = Math.max(...doc.surface.map((s) => s.level_m));
  const base = doc.layers[doc.layers.length - 1]!.bottom_m;
  const maxSize_m = doc.mesh?.maxSize_m ?? Math.min(doc.extent.x1_m - doc.extent.x0_m, top - base) / 30;
  return { maxSize_m, minSize_m: Math.min(doc.mesh?.minSize_m ?? maxSize_m / 25, maxSize_m) };
}

function xAxis(doc: SectionDocument, minSize: number): { keys: number[]; refine: RefinePoint[] } {
  const keys = [doc.extent.x0_m, doc.extent.x1_m];
  const refine: RefinePoint[] = [];
  const fine = (at_m: number, size_m = minSize) => refine.push({ at_m, size_m });
  for (const s of doc.surface) keys.push(s.x0_m, s.x1_m);
  doc.surface.forEach((s, i) => {
    const next = doc.surface[i + 1];
    if (next && (next.level_m !== s.level_m || next.head_m !== s.head_m)) fine(s.x1_m);
  });
  for (const w of doc.walls ?? []) { keys.push(w.x_m); fine(w.x_m); }
  for (const w of doc.wells ?? []) { keys.push(w.x_m); fine(w.x_m); }
  for (const d of doc.drains ?? []) { keys.push(d.x_m); fine(d.x_m, Math.min(minSize, 2 * (d.radius_m ?? 0.05))); }
  if (doc.slab) keys.push(doc.slab.x0_m, doc.slab.x1_m);
  if (doc.floor) { keys.push(doc.floor.x0_m, doc.floor.x1_m); fine(doc.floor.x0_m); fine(doc.floor.x1_m); }
  return { keys, refine };
}

function zAxis(doc: SectionDocument, minSize: number, base: number, top: number): { keys: number[]; refine: RefinePoint[] } {
  const keys = [base, top];
  const refine: RefinePoint[] = [];
  const add = (v: number, size_m?: number) => {
    if (v < base || v > top) return;
    keys.push(v);
    if (size_m !== undefined) refine.push({ at_m: v, size_m });
  };
  for (const l of doc.layers) add(l.bottom_m, 4 * minSize);
  for (const s of doc.surface) add(s.level_m, s.head_m !== null ? minSize : 2 * minSize);
  for (const w of doc.walls ?? []) { add(w.toe_m, minSize); add(w.top_m); }
  for (const w of doc.wells ?? []) { add(w.screenTop_m, minSize); add(w.screenBottom_m, minSize); }
  for (const d of doc.drains ?? []) add(d.level_m, Math.min(minSize, 2 * (d.radius_m ?? 0.05)));
  return { keys, refine };
}

/**
 * The solve's cost is cells × iterations, and the preconditioned CG iterations grow about in
 * proportion to the mesh's longest side (measured on the cofferdam fixture made deeper: 193
 * iterations at 570 cells deep, 438 at 1 566, the same 71 wide). A long, thin mesh — a 60 m wide
 * section over a layer 10 km deep — therefore costs far more than its cell count says. The limit
 * is the cost of the square mesh at the cell limit: cells × longest side ≤ maxCells^1.5.
 */
function checkSolveWork(nx: number, nz: number, maxCells: number): void {
  const work = nx * nz * Math.max(nx, nz);
  const limit = maxCells ** 1.5;
  if (work <= limit) return;
  const [longSide, cells] = nz >= nx ? ['deep', nz] : ['wide', nx];
  throw new DrydigError(
    'DRYDIG_ERR_SECTION_TOO_LARGE',
    `/mesh: the mesh would be ${nx} × ${nz} cells, ${cells} cells ${longSide}; so long and thin a mesh takes as long to solve as a square one of ${Math.round(work ** (2 / 3))} cells, more than the limit of ${maxCells} (the solver's iterations grow with the longest side). Give a larger mesh.maxSize_m, or end the section at a shallower base or a nearer edge`,
    [{ path: '/mesh', message: `cells × cells along the longest side must not exceed ${maxCells}^1.5` }],
  );
}

/** Builds the mesh of a validated section document; throws DRYDIG_ERR_SECTION_TOO_LARGE past the limits. */
export function buildSectionMesh(doc: SectionDocument, maxCells = MAX_SECTION_CELLS): SectionMesh {
  const { maxSize_m, minSize_m } = defaultMeshSizes(doc);
  const growth = doc.mesh?.growth ?? 1.15;
  const subdivide = doc.mesh?.subdivide ?? 1;
  const base = doc.layers[doc.layers.length - 1]!.bottom_m;
  const top = Math.max(...doc.surface.map((s) => s.level_m));
  const xa = xAxis(doc, minSize_m);
  const za = zAxis(doc, minSize_m, base, top);
  const x = buildGradedAxis({ keys_m: xa.keys, refine: xa.refine, maxSize_m, growth, subdivide });
  const z = buildGradedAxis({ keys_m: za.keys, refine: za.refine, maxSize_m, growth, subdivide });
  const nx = x.length - 1;
  const nz = z.length - 1;
  if (nx * nz > maxCells) {
    throw new DrydigError('DRYDIG_ERR_SECTION_TOO_LARGE', `/mesh: the mesh would have ${nx} × ${nz} = ${nx * nz} cells, more than the limit of ${maxCells}`, [
      { path: '/mesh', message: `cells must not exceed ${maxCells}` },
    ]);
  }
  checkSolveWork(nx, nz, maxCells);
  const n = nx * nz;
  const active = new Uint8Array(n);
  const layer = new Int16Array(n).fill(-1);
  const kh = new Float64Array(n);
  const kv = new Float64Array(n);
  const surface = new Float64Array(nx);
  const topRow = new Int32Array(nx).fill(-1);
  let activeCount = 0;
  for (let i = 0; i < nx; i++) surface[i] = surfaceLevelAt(doc, 0.5 * (x[i]! + x[i + 1]!));
  for (let j = 0; j < nz; j++) {
    const zc = 0.5 * (z[j]! + z[j + 1]!);
    const li = doc.layers.findIndex((l) => zc < l.top_m && zc > l.bottom_m);
    for (let i = 0; i < nx; i++) {
      if (zc >= surface[i]! || li < 0) continue;
      const k = j * nx + i;
      const L = doc.layers[li]!;
      active[k] = 1;
      layer[k] = li;
      kh[k] = L.kh_m_s;
      kv[k] = L.kv_m_s;
      topRow[i] = j;
      activeCount++;
    }
  }
  return { x, z, nx, nz, active, layer, kh, kv, surface, topRow, activeCount, sizes: { maxSize_m, minSize_m, growth, subdivide } };
}
