/**
 * Uplift of a low-permeability plug under the floor (vertical equilibrium, the UPL form of
 * EN 1997-1 §2.4.7.4 without partial factors): at the plug's base, the total vertical stress of
 * the soil (and slab, and any water standing on the floor) above it against the water pressure
 * there, FS = σ_v / u, checked column by column along the floor; the least governs.
 */
import { UNIT_WEIGHT_WATER_KN_M3, columnsIn, floorSpan, headOnLine, layerWeight, type SectionContext } from './section-context';

export const PLUG_UPLIFT_METHOD = 'vertical equilibrium of the plug: total stress / water pressure at its base (EN 1997-1 UPL form, unfactored)';

export interface PlugUplift {
  method: typeof PLUG_UPLIFT_METHOD;
  fs: number | null;
  x_m: number;
  /** Plug base, m. */
  base_m: number;
  stress_kPa: number;
  pressure_kPa: number;
}

/** The governing plug uplift along the floor, or null when no plug layer lies under it. */
export function checkPlugUplift(ctx: SectionContext): PlugUplift | null {
  const { doc, mesh } = ctx;
  const span = floorSpan(doc);
  let worst: PlugUplift | null = null;
  for (const i of columnsIn(mesh, span.x0_m, span.x1_m)) {
    const floor_m = mesh.surface[i]!;
    const start = doc.layers.findIndex((l) => l.bottom_m < floor_m);
    if (start < 0 || doc.layers[start]!.kind !== 'plug') continue;
    let last = start;
    while (doc.layers[last + 1]?.kind === 'plug') last++;
    const base_m = doc.layers[last]!.bottom_m;
    if (last === doc.layers.length - 1) continue; // nothing below the plug pushes on it
    const xc = 0.5 * (mesh.x[i]! + mesh.x[i + 1]!);
    const seg = doc.surface.find((s) => xc > s.x0_m && xc < s.x1_m);
    const ponded = seg?.head_m != null && seg.head_m > floor_m ? UNIT_WEIGHT_WATER_KN_M3 * (seg.head_m - floor_m) : 0;
    const slab = doc.slab && xc > doc.slab.x0_m && xc < doc.slab.x1_m ? doc.slab.thickness_m * (doc.slab.unitWeight_kN_m3 ?? 24) : 0;
    const stress_kPa = layerWeight(doc, base_m, floor_m, false) + ponded + slab;
    const h = headOnLine(ctx, i, base_m);
    if (!Number.isFinite(h)) continue;
    const pressure_kPa = UNIT_WEIGHT_WATER_KN_M3 * (h - base_m);
    const fs = pressure_kPa > 0 ? stress_kPa / pressure_kPa : null;
    const candidate: PlugUplift = { method: PLUG_UPLIFT_METHOD, fs, x_m: xc, base_m, stress_kPa, pressure_kPa };
    if (!worst || (fs !== null && (worst.fs === null || fs < worst.fs))) worst = candidate;
  }
  return worst;
}
