/**
 * The plan points at which a receptor is evaluated: its own points (where settlement and the
 * angular distortion are reported) and, for a polyline, points in between at most
 * `spacing_m` apart, so the drawdown limit also holds between the given points.
 */
import type { Receptor } from '../schema';

/** Largest spacing of the points between a polyline's own points, m. */
export const RECEPTOR_SAMPLE_SPACING_M = 5;
/** Most points added between two of a polyline's own points. */
const MAX_PER_SEGMENT = 50;

/** The receptor's own points. */
export function receptorVertices(r: Receptor): Array<[number, number]> {
  return r.geometry.type === 'Point' ? [[...r.geometry.coordinates]] : r.geometry.coordinates.map((c) => [c[0], c[1]]);
}

/** Own points and the points between them (own points first, in order; then the rest). */
export function receptorSamplePoints(r: Receptor, spacing_m = RECEPTOR_SAMPLE_SPACING_M): Array<[number, number]> {
  const vertices = receptorVertices(r);
  const between: Array<[number, number]> = [];
  for (let k = 0; k + 1 < vertices.length; k++) {
    const [x0, y0] = vertices[k]!;
    const [x1, y1] = vertices[k + 1]!;
    const n = Math.min(MAX_PER_SEGMENT, Math.ceil(Math.hypot(x1 - x0, y1 - y0) / spacing_m));
    for (let i = 1; i < n; i++) between.push([x0 + ((x1 - x0) * i) / n, y0 + ((y1 - y0) * i) / n]);
  }
  return [...vertices, ...between];
}
