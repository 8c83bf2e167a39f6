/**
 * The flow net: equipotentials at equal head drops between the highest and lowest fixed heads,
 * and flow lines at equal steps of the stream function, so each tube between neighbouring flow
 * lines carries the same flow (Cedergren 1989; Harr 1962 ch. 2). In isotropic plane flow the
 * number of tubes is chosen so the net's fields are near squares (N_f ≈ N_d·q/(k·H)).
 */
import { nodeHeads } from './section-fields';
import { contourRectilinear, type ContourSegments } from './rectilinear-contours';
import type { SectionContext } from './section-context';

export interface FlowNet {
  /** Head drops between equipotentials (N_d). */
  drops: number;
  /** Flow tubes (N_f); each carries flowPerTube. */
  tubes: number;
  /** Flow of one tube (m³/s per m, or m³/s axisymmetric). */
  flowPerTube: number;
  equipotentials: Array<{ head_m: number; segments: ContourSegments }>;
  flowLines: Array<{ psi: number; segments: ContourSegments }>;
}

export interface FlowNetOptions {
  /** Head drops. Default 12. */
  drops?: number;
  /** Flow tubes; default chosen for near-square fields (3 … 30). */
  tubes?: number;
}

/** Equipotentials and flow lines of a solved section. */
export function buildFlowNet(ctx: SectionContext, options: FlowNetOptions = {}): FlowNet {
  const { mesh, system, fields } = ctx;
  const heads = system.connections.head_m;
  const hMax = Math.max(...heads);
  const hMin = Math.min(...heads);
  const drops = options.drops ?? 12;
  const mask = new Uint8Array(mesh.active.length);
  for (let k = 0; k < mask.length; k++) mask[k] = Number.isFinite(fields.head_m[k]!) ? 1 : 0;
  let psiMin = Number.POSITIVE_INFINITY;
  let psiMax = Number.NEGATIVE_INFINITY;
  for (const v of fields.psi) { psiMin = Math.min(psiMin, v); psiMax = Math.max(psiMax, v); }
  const range = psiMax - psiMin;
  const topLayer = ctx.doc.layers.find((l) => l.bottom_m < Math.min(...ctx.doc.surface.map((s) => s.level_m))) ?? ctx.doc.layers[0]!;
  const kRef = Math.sqrt(topLayer.kh_m_s * topLayer.kv_m_s);
  const squares = hMax > hMin && !ctx.axi ? Math.round((drops * range) / (kRef * (hMax - hMin))) : 10;
  const tubes = options.tubes ?? Math.min(30, Math.max(3, squares));
  const headLevels = Array.from({ length: Math.max(0, drops - 1) }, (_v, n) => hMin + ((hMax - hMin) * (n + 1)) / drops);
  const psiLevels = Array.from({ length: tubes - 1 }, (_v, n) => psiMin + (range * (n + 1)) / tubes);
  const hSegments = hMax > hMin ? contourRectilinear({ x: mesh.x, z: mesh.z, values: nodeHeads(mesh, fields.head_m), mask, levels: headLevels }) : [];
  const psiSegments = range > 0 ? contourRectilinear({ x: mesh.x, z: mesh.z, values: fields.psi, mask, levels: psiLevels }) : [];
  return {
    drops,
    tubes,
    flowPerTube: range / tubes,
    equipotentials: headLevels.map((head_m, n) => ({ head_m, segments: hSegments[n] ?? [] })),
    flowLines: psiLevels.map((psi, n) => ({ psi, segments: psiSegments[n] ?? [] })),
  };
}
