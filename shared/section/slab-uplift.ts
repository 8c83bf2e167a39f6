/**
 * Uplift under an impermeable slab: the water pressure p = γw·(h − z) under the slab integrated
 * over its width (plane, kN per m run) or plan area (axisymmetric, kN), against the slab's weight.
 * The head just under the slab is the head of the floor cell below it (the slab is a no-flow
 * face, so the head's normal gradient there is zero).
 */
import { UNIT_WEIGHT_WATER_KN_M3, columnMeasure, columnsIn, type SectionContext } from './section-context';

export const SLAB_UPLIFT_METHOD = 'water pressure integrated under the slab against its weight (unfactored)';

export interface SlabUplift {
  method: typeof SLAB_UPLIFT_METHOD;
  /** Uplift force, kN per m run (plane) or kN (axisymmetric). */
  force: number;
  /** Slab weight in the same unit. */
  weight: number;
  /** weight / force; null when there is no uplift. */
  fs: number | null;
  /** Mean and largest pressure under the slab, kPa. */
  meanPressure_kPa: number;
  maxPressure_kPa: number;
}

/** The uplift on the document's slab, or null when it has none. */
export function computeSlabUplift(ctx: SectionContext): SlabUplift | null {
  const slab = ctx.doc.slab;
  if (!slab) return null;
  const { mesh, fields } = ctx;
  let force = 0;
  let measure = 0;
  let maxPressure_kPa = 0;
  for (const i of columnsIn(mesh, slab.x0_m, slab.x1_m)) {
    const h = fields.head_m[mesh.topRow[i]! * mesh.nx + i]!;
    if (!Number.isFinite(h)) continue;
    const p = UNIT_WEIGHT_WATER_KN_M3 * (h - mesh.surface[i]!);
    const a = columnMeasure(ctx, i);
    force += Math.max(0, p) * a;
    measure += a;
    maxPressure_kPa = Math.max(maxPressure_kPa, p);
  }
  const weight = slab.thickness_m * (slab.unitWeight_kN_m3 ?? 24) * measure;
  return { method: SLAB_UPLIFT_METHOD, force, weight, fs: force > 0 ? weight / force : null, meanPressure_kPa: measure > 0 ? force / measure : 0, maxPressure_kPa };
}
