/**
 * Finite-volume discretisation of steady anisotropic Darcy flow, ∇·(K ∇h) = 0, on the section
 * mesh: two-point fluxes between cell centres with the conductances of the two half-cells in
 * series (harmonic averaging across layer interfaces). Plane sections use face areas per metre
 * run; axisymmetric sections use ring areas 2πr·dz and the radial half-cell resistance
 * ln(r_face/r_centre)/(2πK·dz), exact for the logarithmic (Thiem) head of radial flow.
 * Walls are faces with no conductance; fixed heads (surface segments, wells, drains) connect
 * a cell to the head through its half-cell; fixed-rate wells are sources.
 */
import type { SectionDocument } from '../schema';
import type { SectionMesh } from './section-mesh';
import { findLine } from './graded-axis';
import type { FivePointSystem } from './five-point-pcg';

/** Where a fixed head or a rate enters the section. */
export type BoundaryKind = 'surface' | 'well' | 'drain';

/** The connections of cells to fixed heads (parallel arrays). */
export interface HeadConnections {
  cell: number[];
  conductance: number[];
  head_m: number[];
  kind: BoundaryKind[];
  /** Index of the surface segment, well or drain in the document. */
  source: number[];
  /** Horizontal (x-face) or vertical (z-face) connection: the flux direction at the boundary. */
  vertical: boolean[];
}

export interface SectionSystem extends FivePointSystem {
  /** Head the unknowns are measured from, m (the lowest fixed head: keeps round-off small). */
  reference_m: number;
  connections: HeadConnections;
  /** Fixed-rate well sources: cell, rate into the cell (m³/s or m³/s per m), well index. */
  rates: { cell: number[]; inflow: number[]; source: number[] };
  /** Conductance of each x-face (k ↔ k+1) and z-face (k ↔ k+nx), the same as east/north. */
  wallFaces: number;
}

/** Whether the section is axisymmetric (x = radius). */
function isAxi(doc: SectionDocument): boolean {
  return doc.geometry === 'axisymmetric';
}

/** Conductance from a cell centre (xc) to a vertical line at xf through a row of height dz. */
export function radialHalfConductance(axi: boolean, k: number, xc: number, xf: number, dz: number): number {
  if (!axi) return (k * dz) / Math.abs(xf - xc);
  const ratio = Math.log(Math.max(xf, xc) / Math.min(xf, xc));
  return xf <= 0 ? 0 : (2 * Math.PI * k * dz) / ratio;
}

/** Plan area of column i's horizontal faces (per metre run, or the ring's area). */
export function columnArea(axi: boolean, x: Float64Array, i: number): number {
  const a = x[i]!;
  const b = x[i + 1]!;
  return axi ? Math.PI * (b * b - a * a) : b - a;
}

function interiorCoefficients(doc: SectionDocument, mesh: SectionMesh, east: Float64Array, north: Float64Array): void {
  const { x, z, nx, nz, active, kh, kv } = mesh;
  const axi = isAxi(doc);
  for (let j = 0; j < nz; j++) {
    const dz = z[j + 1]! - z[j]!;
    for (let i = 0; i + 1 < nx; i++) {
      const k = j * nx + i;
      if (!active[k] || !active[k + 1]) continue;
      const xf = x[i + 1]!;
      const a = radialHalfConductance(axi, kh[k]!, 0.5 * (x[i]! + xf), xf, dz);
      const b = radialHalfConductance(axi, kh[k + 1]!, 0.5 * (xf + x[i + 2]!), xf, dz);
      east[k] = a > 0 && b > 0 ? (a * b) / (a + b) : 0;
    }
  }
  for (let j = 0; j + 1 < nz; j++) {
    const dz0 = z[j + 1]! - z[j]!;
    const dz1 = z[j + 2]! - z[j + 1]!;
    for (let i = 0; i < nx; i++) {
      const k = j * nx + i;
      if (!active[k] || !active[k + nx]) continue;
      const area = columnArea(axi, x, i);
      north[k] = area / (0.5 * dz0 / kv[k]! + 0.5 * dz1 / kv[k + nx]!);
    }
  }
}

/** Cuts the x-faces along each wall; returns how many faces were cut. */
function cutWalls(doc: SectionDocument, mesh: SectionMesh, east: Float64Array): number {
  const { x, z, nx, nz } = mesh;
  let cut = 0;
  const tol = 1e-9 * Math.max(1, z[nz]! - z[0]!);
  for (const w of doc.walls ?? []) {
    const iw = findLine(x, w.x_m);
    if (iw <= 0 || iw >= nx) continue;
    for (let j = 0; j < nz; j++) {
      if (z[j]! < w.toe_m - tol || z[j + 1]! > w.top_m + tol) continue;
      const k = j * nx + iw - 1;
      if (east[k]! > 0) cut++;
      east[k] = 0;
    }
  }
  return cut;
}

function surfaceConnections(doc: SectionDocument, mesh: SectionMesh, c: HeadConnections): void {
  const { x, z, nx, kv, topRow } = mesh;
  const axi = isAxi(doc);
  for (let i = 0; i < nx; i++) {
    const j = topRow[i]!;
    if (j < 0) continue;
    const xc = 0.5 * (x[i]! + x[i + 1]!);
    if (doc.slab && xc > doc.slab.x0_m && xc < doc.slab.x1_m) continue;
    const si = doc.surface.findIndex((s) => xc > s.x0_m && xc < s.x1_m);
    const seg = doc.surface[si];
    if (!seg || seg.head_m === null) continue;
    const k = j * nx + i;
    c.cell.push(k);
    c.conductance.push((kv[k]! * columnArea(axi, x, i)) / (0.5 * (z[j + 1]! - z[j]!)));
    c.head_m.push(seg.head_m);
    c.kind.push('surface');
    c.source.push(si);
    c.vertical.push(true);
  }
}

/** Cells beside a well's line within its screen, with their half-cell conductances to the line. */
export function wellContacts(doc: SectionDocument, mesh: SectionMesh, wi: number): Array<{ cell: number; conductance: number }> {
  const w = doc.wells![wi]!;
  const { x, z, nx, nz, active, kh } = mesh;
  const axi = isAxi(doc);
  const iw = findLine(x, w.x_m);
  const out: Array<{ cell: number; conductance: number }> = [];
  const tol = 1e-9 * Math.max(1, z[nz]! - z[0]!);
  for (let j = 0; j < nz; j++) {
    if (z[j]! < w.screenBottom_m - tol || z[j + 1]! > w.screenTop_m + tol) continue;
    const dz = z[j + 1]! - z[j]!;
    for (const i of [iw - 1, iw]) {
      if (i < 0 || i >= nx) continue;
      const k = j * nx + i;
      if (!active[k]) continue;
      const g = radialHalfConductance(axi, kh[k]!, 0.5 * (x[i]! + x[i + 1]!), x[iw]!, dz);
      if (g > 0) out.push({ cell: k, conductance: g });
    }
  }
  return out;
}

function wellConnections(doc: SectionDocument, mesh: SectionMesh, c: HeadConnections, rates: SectionSystem['rates'], east: Float64Array): void {
  (doc.wells ?? []).forEach((w, wi) => {
    const contacts = wellContacts(doc, mesh, wi);
    const rate = doc.geometry === 'plane' ? w.rate_m3_s_per_m : w.rate_m3_s;
    if (w.head_m !== undefined) {
      // The screen holds its head on the line between the two columns: they connect through it, not past it.
      const iw = findLine(mesh.x, w.x_m);
      for (const t of contacts) if (t.cell % mesh.nx === iw) east[t.cell - 1] = 0;
      for (const t of contacts) {
        c.cell.push(t.cell);
        c.conductance.push(t.conductance);
        c.head_m.push(w.head_m);
        c.kind.push('well');
        c.source.push(wi);
        c.vertical.push(false);
      }
    } else if (rate !== undefined) {
      // A pumped well draws from each layer in proportion to its conductance (equal head in the screen, approximately).
      const total = contacts.reduce((s, t) => s + t.conductance, 0);
      for (const t of contacts) {
        rates.cell.push(t.cell);
        rates.inflow.push((-rate * t.conductance) / total);
        rates.source.push(wi);
      }
    }
  });
}

function drainConnections(doc: SectionDocument, mesh: SectionMesh, c: HeadConnections): void {
  const { x, z, nx, nz, active, kh, kv } = mesh;
  const axi = isAxi(doc);
  (doc.drains ?? []).forEach((d, di) => {
    const ix = findLine(x, d.x_m);
    const jz = findLine(z, d.level_m);
    for (const j of [jz - 1, jz]) {
      for (const i of [ix - 1, ix]) {
        if (i < 0 || i >= nx || j < 0 || j >= nz) continue;
        const k = j * nx + i;
        if (!active[k]) continue;
        // The drain acts over the cells touching it: half-cell conductances to the drain's point,
        // horizontally and vertically (the mesh is refined to the drain's size there).
        const dz = z[j + 1]! - z[j]!;
        const g = radialHalfConductance(axi, kh[k]!, 0.5 * (x[i]! + x[i + 1]!), x[ix]!, dz) * 0.5
          + ((kv[k]! * columnArea(axi, x, i)) / (0.5 * dz)) * 0.5;
        c.cell.push(k);
        c.conductance.push(g);
        c.head_m.push(d.head_m);
        c.kind.push('drain');
        c.source.push(di);
        c.vertical.push(false);
      }
    }
  });
}

/** Assembles the five-point system of a section on its mesh. */
export function assembleSection(doc: SectionDocument, mesh: SectionMesh): SectionSystem {
  const n = mesh.nx * mesh.nz;
  const east = new Float64Array(n);
  const north = new Float64Array(n);
  interiorCoefficients(doc, mesh, east, north);
  const wallFaces = cutWalls(doc, mesh, east);
  const connections: HeadConnections = { cell: [], conductance: [], head_m: [], kind: [], source: [], vertical: [] };
  const rates = { cell: [] as number[], inflow: [] as number[], source: [] as number[] };
  surfaceConnections(doc, mesh, connections);
  wellConnections(doc, mesh, connections, rates, east);
  drainConnections(doc, mesh, connections);
  const reference_m = connections.head_m.length > 0 ? Math.min(...connections.head_m) : 0;
  const diag = new Float64Array(n);
  const rhs = new Float64Array(n);
  const { nx } = mesh;
  for (let k = 0; k < n; k++) {
    if (!mesh.active[k]) {
      diag[k] = 1;
      continue;
    }
    let d = east[k]! + north[k]!;
    if (k % nx > 0) d += east[k - 1]!;
    if (k >= nx) d += north[k - nx]!;
    diag[k] = d;
  }
  connections.cell.forEach((k, m) => {
    diag[k] = diag[k]! + connections.conductance[m]!;
    rhs[k] = rhs[k]! + connections.conductance[m]! * (connections.head_m[m]! - reference_m);
  });
  rates.cell.forEach((k, m) => (rhs[k] = rhs[k]! + rates.inflow[m]!));
  return { nx, diag, east, north, rhs, reference_m, connections, rates, wallFaces };
}
