/** Test sections: a single sheet pile in a layer (Harr's case) and a flat floor, built by options. */
import type { SectionDocument } from '../../../shared/schema';

export interface SheetPileOptions {
  /** Layer thickness T, m. */
  thickness_m: number;
  /** Penetration d below the surface, m. */
  depth_m: number;
  /** Head difference H, m. */
  head_m: number;
  /** Extent each side of the pile, m. */
  halfWidth_m: number;
  kh_m_s?: number;
  kv_m_s?: number;
  mesh?: SectionDocument['mesh'];
}

/** Surface at 0, pile at x = 0, head H on the left, 0 on the right (the floor). */
export function sheetPileSection(o: SheetPileOptions): SectionDocument {
  const L = o.halfWidth_m;
  return {
    format: 'drydig.section',
    version: 1,
    geometry: 'plane',
    extent: { x0_m: -L, x1_m: L },
    layers: [{ top_m: 0, bottom_m: -o.thickness_m, kh_m_s: o.kh_m_s ?? 1e-4, kv_m_s: o.kv_m_s ?? 1e-4 }],
    surface: [
      { x0_m: -L, x1_m: 0, level_m: 0, head_m: o.head_m },
      { x0_m: 0, x1_m: L, level_m: 0, head_m: 0 },
    ],
    walls: [{ x_m: 0, top_m: 1, toe_m: -o.depth_m }],
    floor: { x0_m: 0, x1_m: L },
    ...(o.mesh ? { mesh: o.mesh } : {}),
  };
}

/** A flat impervious floor (slab) of width b centred on x = 0, heads H left and 0 right. */
export function flatFloorSection(o: { width_m: number; thickness_m: number; head_m: number; halfWidth_m: number; mesh?: SectionDocument['mesh'] }): SectionDocument {
  const L = o.halfWidth_m;
  const b = o.width_m / 2;
  return {
    format: 'drydig.section',
    version: 1,
    geometry: 'plane',
    extent: { x0_m: -L, x1_m: L },
    layers: [{ top_m: 0, bottom_m: -o.thickness_m, kh_m_s: 1e-5, kv_m_s: 1e-5 }],
    surface: [
      { x0_m: -L, x1_m: -b, level_m: 0, head_m: o.head_m },
      { x0_m: -b, x1_m: b, level_m: 0, head_m: null },
      { x0_m: b, x1_m: L, level_m: 0, head_m: 0 },
    ],
    slab: { x0_m: -b, x1_m: b, thickness_m: 0.5 },
    floor: { x0_m: -b, x1_m: b },
    ...(o.mesh ? { mesh: o.mesh } : {}),
  };
}
