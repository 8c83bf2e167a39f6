/**
 * Fields that follow from the solved heads: face fluxes, the flow through each fixed-head
 * connection, and the stream function ψ at the grid nodes. ψ is zero along the impermeable
 * base and is integrated up each vertical grid line from the horizontal fluxes crossing it, so
 * walls, the base and no-flow sides are streamlines and ψ differences are flows (m³/s per m in
 * plane flow; in axisymmetric flow the Stokes stream function, flow through the ring, m³/s).
 * Where a well or drain inside the section takes water, ψ jumps across the vertical line above
 * it (a branch cut); flow lines are drawn from ψ as it is.
 */
import type { SectionDocument } from '../schema';
import { findLine } from './graded-axis';
import type { SectionMesh } from './section-mesh';
import type { SectionSystem } from './assemble-section';

export interface SectionFields {
  /** Head per cell, m (NaN where the cell is not soil or is cut off from every fixed head). */
  head_m: Float64Array;
  /** Flux through the east face of cell k, +x, m³/s (per m in plane flow). */
  xFlux: Float64Array;
  /** Flux through the top face of cell k into k + nx, upward. */
  zFlux: Float64Array;
  /** Outflow through each head connection (parallel to system.connections), + = out of the soil. */
  connectionOutflow: Float64Array;
  /** Stream function at the nodes, index j·(nx + 1) + i. */
  psi: Float64Array;
}

/** Cells not reached from any fixed head through open faces (their head is undetermined). */
export function findIsolatedCells(mesh: SectionMesh, system: SectionSystem): Uint8Array {
  const { nx, active } = mesh;
  const n = active.length;
  const reached = new Uint8Array(n);
  const stack: number[] = [];
  for (const k of system.connections.cell) if (!reached[k]) { reached[k] = 1; stack.push(k); }
  while (stack.length > 0) {
    const k = stack.pop()!;
    const i = k % nx;
    if (i < nx - 1 && system.east[k]! > 0 && !reached[k + 1]) { reached[k + 1] = 1; stack.push(k + 1); }
    if (i > 0 && system.east[k - 1]! > 0 && !reached[k - 1]) { reached[k - 1] = 1; stack.push(k - 1); }
    if (k + nx < n && system.north[k]! > 0 && !reached[k + nx]) { reached[k + nx] = 1; stack.push(k + nx); }
    if (k >= nx && system.north[k - nx]! > 0 && !reached[k - nx]) { reached[k - nx] = 1; stack.push(k - nx); }
  }
  const isolated = new Uint8Array(n);
  for (let k = 0; k < n; k++) if (active[k] && !reached[k]) isolated[k] = 1;
  return isolated;
}

function streamFunction(doc: SectionDocument, mesh: SectionMesh, system: SectionSystem, xFlux: Float64Array, outflow: Float64Array): Float64Array {
  const { nx, nz, x } = mesh;
  const stride = nx + 1;
  // Flux crossing each vertical grid line in +x, per row: interior lines from the faces, the two
  // side lines from wells standing on them.
  const side = new Float64Array((nx + 1) * nz);
  for (let j = 0; j < nz; j++) for (let i = 1; i < nx; i++) side[j * stride + i] = xFlux[j * nx + i - 1]!;
  const c = system.connections;
  c.cell.forEach((k, m) => {
    if (c.kind[m] !== 'well') return;
    const line = findLine(x, doc.wells![c.source[m]!]!.x_m);
    const i = k % nx;
    const j = (k - i) / nx;
    if (line === 0 && i === 0) side[j * stride] = side[j * stride]! - outflow[m]!;
    if (line === nx && i === nx - 1) side[j * stride + nx] = side[j * stride + nx]! + outflow[m]!;
  });
  const psi = new Float64Array(stride * (nz + 1));
  for (let j = 0; j < nz; j++) for (let i = 0; i <= nx; i++) psi[(j + 1) * stride + i] = psi[j * stride + i]! - side[j * stride + i]!;
  return psi;
}

/** Heads, fluxes, connection flows and the stream function from the solution u = h − reference. */
export function computeSectionFields(doc: SectionDocument, mesh: SectionMesh, system: SectionSystem, u: Float64Array, isolated: Uint8Array): SectionFields {
  const { nx, active } = mesh;
  const n = active.length;
  const head_m = new Float64Array(n);
  for (let k = 0; k < n; k++) head_m[k] = active[k] && !isolated[k] ? u[k]! + system.reference_m : Number.NaN;
  const xFlux = new Float64Array(n);
  const zFlux = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    // Differences of u, not of h: fewer digits lost to the reference head.
    if (system.east[k]! > 0) xFlux[k] = system.east[k]! * (u[k]! - u[k + 1]!);
    if (system.north[k]! > 0) zFlux[k] = system.north[k]! * (u[k]! - u[k + nx]!);
  }
  const c = system.connections;
  const connectionOutflow = Float64Array.from(c.cell, (k, m) => c.conductance[m]! * (u[k]! - (c.head_m[m]! - system.reference_m)));
  const psi = streamFunction(doc, mesh, system, xFlux, connectionOutflow);
  return { head_m, xFlux, zFlux, connectionOutflow, psi };
}

/** Head at node (i, j): the mean of the soil cells around it (NaN when none). */
export function nodeHeads(mesh: SectionMesh, head_m: Float64Array): Float64Array {
  const { nx, nz } = mesh;
  const stride = nx + 1;
  const out = new Float64Array(stride * (nz + 1));
  for (let j = 0; j <= nz; j++) {
    for (let i = 0; i <= nx; i++) {
      let sum = 0;
      let count = 0;
      for (const [ci, cj] of [[i - 1, j - 1], [i, j - 1], [i - 1, j], [i, j]] as const) {
        if (ci < 0 || cj < 0 || ci >= nx || cj >= nz) continue;
        const h = head_m[cj * nx + ci]!;
        if (Number.isFinite(h)) { sum += h; count++; }
      }
      out[j * stride + i] = count > 0 ? sum / count : Number.NaN;
    }
  }
  return out;
}
