/**
 * Terzaghi's heave check in front of a wall (Terzaghi 1943, Theoretical Soil Mechanics): a prism
 * of soil of depth d (from the floor down to the toe) and width d/2 beside the wall on the
 * excavation side is lifted by the excess head h_a averaged along its base (at the toe level);
 * FS = W′ / U with W′ = Σ γ′·t · d/2 (plus a slab's weight over the prism) and U = γw · h_a · d/2.
 * The excess head is measured from the water level held on the floor (its fixed head, or the
 * floor level where the floor holds none). In an axisymmetric section the prism is taken per unit
 * length of the wall's circumference (flagged).
 */
import { findLine } from './graded-axis';
import { UNIT_WEIGHT_WATER_KN_M3, columnsIn, floorSpan, headOnLine, layerWeight, type SectionContext } from './section-context';

export const HEAVE_METHOD = 'Terzaghi prism';

export interface HeaveCheck {
  method: typeof HEAVE_METHOD;
  /** W′/U; null when the prism carries no excess head. */
  fs: number | null;
  /** Wall index in the document. */
  wall: number;
  x_m: number;
  /** Embedment below the floor, m. */
  depth_m: number;
  width_m: number;
  /** Mean excess head at the prism's base, m. */
  excessHead_m: number;
  /** Submerged weight of the prism (and slab), kN per m of wall. */
  weight_kN_per_m: number;
  /** Uplift on the prism's base, kN per m of wall. */
  uplift_kN_per_m: number;
  requiredFS: number;
}

/** Heave checks for every wall with the floor beside it and its toe below the floor. */
export function checkTerzaghiHeave(ctx: SectionContext, requiredFS: number): HeaveCheck[] {
  const { doc, mesh } = ctx;
  const span = floorSpan(doc);
  const out: HeaveCheck[] = [];
  (doc.walls ?? []).forEach((w, wi) => {
    const right = w.x_m >= span.x0_m - 1e-9 && w.x_m < span.x1_m - 1e-9;
    const left = w.x_m <= span.x1_m + 1e-9 && w.x_m > span.x0_m + 1e-9;
    if (!right && !left) return;
    const iw = findLine(mesh.x, w.x_m);
    const floorColumn = right ? iw : iw - 1;
    const floor_m = mesh.surface[floorColumn]!;
    const depth_m = floor_m - w.toe_m;
    if (!(depth_m > 0)) return;
    const width_m = depth_m / 2;
    const [a, b] = right ? [w.x_m, Math.min(w.x_m + width_m, span.x1_m)] : [Math.max(w.x_m - width_m, span.x0_m), w.x_m];
    const cols = columnsIn(mesh, a, b);
    const floorSegment = doc.surface.find((s) => s.level_m === floor_m && (right ? s.x0_m <= w.x_m + 1e-9 && s.x1_m > w.x_m : s.x1_m >= w.x_m - 1e-9 && s.x0_m < w.x_m));
    const floorWater_m = floorSegment?.head_m ?? floor_m;
    let sum = 0;
    let width = 0;
    for (const i of cols) {
      const dx = mesh.x[i + 1]! - mesh.x[i]!;
      const h = headOnLine(ctx, i, w.toe_m);
      if (!Number.isFinite(h)) continue;
      sum += (h - floorWater_m) * dx;
      width += dx;
    }
    const excessHead_m = width > 0 ? sum / width : 0;
    const slab = doc.slab ? doc.slab.thickness_m * (doc.slab.unitWeight_kN_m3 ?? 24) : 0;
    const weight_kN_per_m = (layerWeight(doc, w.toe_m, floor_m, true) + slab) * width_m;
    const uplift_kN_per_m = UNIT_WEIGHT_WATER_KN_M3 * excessHead_m * width_m;
    out.push({
      method: HEAVE_METHOD,
      fs: uplift_kN_per_m > 0 ? weight_kN_per_m / uplift_kN_per_m : null,
      wall: wi,
      x_m: w.x_m,
      depth_m,
      width_m,
      excessHead_m,
      weight_kN_per_m,
      uplift_kN_per_m,
      requiredFS,
    });
  });
  return out;
}
