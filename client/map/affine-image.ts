/**
 * Placing an image on the map by an affine map from its pixels to the screen: used for the
 * site-plan underlay (two reference points fix scale, rotation and offset) and for web tiles
 * reprojected into site metres (each tile's corners placed through the projection).
 */
import type L from 'leaflet';

/** A similarity transform image pixel (u right, v down) → site metres, from two reference points. */
export interface Similarity {
  /** x = a·u + b·v + c, y = d·u + e·v + f. */
  a: number; b: number; c: number; d: number; e: number; f: number;
  /** Metres per image pixel. */
  scale_m_px: number;
  /** Rotation of the image's up direction from site north, radians counter-clockwise. */
  rotation_rad: number;
}

/**
 * The similarity through two reference points (scale, rotation, offset; no shear or mirror).
 * Image v runs down, so the image is first flipped to a y-up frame: w = u − i·v, z = A·w + B.
 * Returns null when the two points coincide in the image or on site.
 */
export function similarityFromRefs(
  p1: readonly [number, number], s1: readonly [number, number],
  p2: readonly [number, number], s2: readonly [number, number],
): Similarity | null {
  const wr = p2[0] - p1[0];
  const wi = -(p2[1] - p1[1]);
  const zr = s2[0] - s1[0];
  const zi = s2[1] - s1[1];
  const den = wr * wr + wi * wi;
  if (den < 1e-12 || zr * zr + zi * zi < 1e-12) return null;
  // A = z / w (complex division).
  const ar = (zr * wr + zi * wi) / den;
  const ai = (zi * wr - zr * wi) / den;
  // z = A·(u − i v) + B → x = ar·u + ai·v + Bx, y = ai·u − ar·v + By.
  const bx = s1[0] - (ar * p1[0] + ai * p1[1]);
  const by = s1[1] - (ai * p1[0] - ar * p1[1]);
  return { a: ar, b: ai, c: bx, d: ai, e: -ar, f: by, scale_m_px: Math.hypot(ar, ai), rotation_rad: Math.atan2(ai, ar) };
}

/** Site position of an image pixel. */
export function applySimilarity(t: Similarity, u: number, v: number): [number, number] {
  return [t.a * u + t.b * v + t.c, t.d * u + t.e * v + t.f];
}

/**
 * Positions `img` (natural size w × h) so its corners (0,0), (w,0), (0,h) land on the given
 * layer points: a CSS matrix, origin top-left.
 */
export function placeImage(img: HTMLElement, w: number, h: number, p00: L.Point, pw0: L.Point, p0h: L.Point): void {
  const a = (pw0.x - p00.x) / w;
  const b = (pw0.y - p00.y) / w;
  const c = (p0h.x - p00.x) / h;
  const d = (p0h.y - p00.y) / h;
  img.style.transformOrigin = '0 0';
  img.style.transform = `matrix(${a}, ${b}, ${c}, ${d}, ${p00.x}, ${p00.y})`;
}
