/**
 * Polylines packed into typed arrays, so a drawing of 10⁵ lines crosses from the import worker to
 * the page as a few transferred buffers instead of 10⁵ cloned objects (which would block the
 * page while they are copied). Line k has vertices offsets[k] … offsets[k+1]−1, each two numbers
 * (x, y in site metres) in `coords`.
 */
import type { DxfPolyline } from '../../shared/import';

export interface PackedLines {
  /** Layer names; `layerOf[k]` indexes them. */
  layers: string[];
  layerOf: Uint16Array;
  closed: Uint8Array;
  /** Vertex offsets, length = lines + 1. */
  offsets: Uint32Array;
  coords: Float64Array;
}

/** Packs polylines (layers beyond 65 535 distinct names share the last index). */
export function packLines(lines: readonly DxfPolyline[]): PackedLines {
  const layers: string[] = [];
  const index = new Map<string, number>();
  const layerOf = new Uint16Array(lines.length);
  const closed = new Uint8Array(lines.length);
  const offsets = new Uint32Array(lines.length + 1);
  let vertices = 0;
  lines.forEach((l, k) => {
    let i = index.get(l.layer);
    if (i === undefined) {
      i = Math.min(layers.length, 65_535);
      if (i === layers.length) layers.push(l.layer);
      index.set(l.layer, i);
    }
    layerOf[k] = i;
    closed[k] = l.closed ? 1 : 0;
    offsets[k] = vertices;
    vertices += l.points.length;
  });
  offsets[lines.length] = vertices;
  const coords = new Float64Array(vertices * 2);
  let j = 0;
  for (const l of lines)
    for (const [x, y] of l.points) {
      coords[j++] = x;
      coords[j++] = y;
    }
  return { layers, layerOf, closed, offsets, coords };
}

/** Number of packed lines. */
export const packedCount = (p: PackedLines): number => p.offsets.length - 1;

/** Indices of the lines whose layer is in `visible`. */
export function linesOnLayers(p: PackedLines, visible: ReadonlySet<string>): number[] {
  const on = p.layers.map((name) => visible.has(name));
  const out: number[] = [];
  for (let k = 0; k < packedCount(p); k++) if (on[p.layerOf[k]!]) out.push(k);
  return out;
}

/** Mean vertex of the chosen lines, [x, y] m (null when they have none). */
export function meanVertex(p: PackedLines, lines: readonly number[]): [number, number] | null {
  let sx = 0;
  let sy = 0;
  let n = 0;
  for (const k of lines)
    for (let v = p.offsets[k]!; v < p.offsets[k + 1]!; v++) {
      sx += p.coords[2 * v]!;
      sy += p.coords[2 * v + 1]!;
      n++;
    }
  return n > 0 ? [sx / n, sy / n] : null;
}

/** The buffers to transfer with a message. */
export const packedBuffers = (p: PackedLines): ArrayBuffer[] => [p.layerOf.buffer, p.closed.buffer, p.offsets.buffer, p.coords.buffer] as ArrayBuffer[];
