/**
 * What the result stages share: the document, the mesh, the assembled system and the solved
 * fields, plus small look-ups (the floor span, unit weights, the head on a grid line).
 */
import type { SectionDocument } from '../schema';
import { DEFAULT_UNIT_WEIGHT_SAT_KN_M3, type SectionMesh } from './section-mesh';
import type { SectionSystem } from './assemble-section';
import type { SectionFields } from './section-fields';
import { findLine } from './graded-axis';

/** Unit weight of water, kN/m³ (ρ = 1000 kg/m³, g = 9.81 m/s²; common practice). */
export const UNIT_WEIGHT_WATER_KN_M3 = 9.81;

/** Factor on the critical gradient and on heave when the document gives none (a global 1.5; common practice, national annexes differ). */
export const DEFAULT_REQUIRED_FS = 1.5;

export interface SectionContext {
  doc: SectionDocument;
  mesh: SectionMesh;
  system: SectionSystem;
  fields: SectionFields;
  axi: boolean;
}

/** The floor span [x0, x1]: the document's, else the run of surface segments at the lowest level. */
export function floorSpan(doc: SectionDocument): { x0_m: number; x1_m: number } {
  if (doc.floor) return doc.floor;
  const lowest = Math.min(...doc.surface.map((s) => s.level_m));
  const at = doc.surface.filter((s) => s.level_m === lowest);
  return { x0_m: Math.min(...at.map((s) => s.x0_m)), x1_m: Math.max(...at.map((s) => s.x1_m)) };
}

/** Columns whose centre lies in [x0, x1]. */
export function columnsIn(mesh: SectionMesh, x0_m: number, x1_m: number): number[] {
  const out: number[] = [];
  for (let i = 0; i < mesh.nx; i++) {
    const xc = 0.5 * (mesh.x[i]! + mesh.x[i + 1]!);
    if (xc > x0_m && xc < x1_m && mesh.topRow[i]! >= 0) out.push(i);
  }
  return out;
}

/** Saturated unit weight of layer li, kN/m³, and whether it was assumed. */
export function unitWeightSat(doc: SectionDocument, li: number): { value: number; assumed: boolean } {
  const given = doc.layers[li]?.unitWeightSat_kN_m3;
  return given !== undefined ? { value: given, assumed: false } : { value: DEFAULT_UNIT_WEIGHT_SAT_KN_M3, assumed: true };
}

/** Σ γ·t between two levels (bottom < top) through the layers, kN/m² — with γ′ = γsat − γw when submerged is true. */
export function layerWeight(doc: SectionDocument, bottom_m: number, top_m: number, submerged: boolean): number {
  let sum = 0;
  doc.layers.forEach((l, li) => {
    const t = Math.min(l.top_m, top_m) - Math.max(l.bottom_m, bottom_m);
    if (t <= 0) return;
    const g = unitWeightSat(doc, li).value - (submerged ? UNIT_WEIGHT_WATER_KN_M3 : 0);
    sum += g * t;
  });
  return sum;
}

/** Head on horizontal grid line z (interpolated between the cell centres above and below) in column i. */
export function headOnLine(ctx: SectionContext, i: number, z_m: number): number {
  const { mesh, fields } = ctx;
  const { z, nx } = mesh;
  const j = findLine(z, z_m);
  if (j < 0) return Number.NaN;
  const below = j > 0 ? fields.head_m[(j - 1) * nx + i]! : Number.NaN;
  const above = j < mesh.nz ? fields.head_m[j * nx + i]! : Number.NaN;
  if (!Number.isFinite(below)) return above;
  if (!Number.isFinite(above)) return below;
  const zb = 0.5 * (z[j - 1]! + z[j]!);
  const za = 0.5 * (z[j]! + z[j + 1]!);
  return below + ((above - below) * (z_m - zb)) / (za - zb);
}

/** Width (plane, m) or plan area (axisymmetric, m²) of column i. */
export function columnMeasure(ctx: SectionContext, i: number): number {
  const a = ctx.mesh.x[i]!;
  const b = ctx.mesh.x[i + 1]!;
  return ctx.axi ? Math.PI * (b * b - a * a) : b - a;
}
