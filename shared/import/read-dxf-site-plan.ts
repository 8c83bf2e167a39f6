/**
 * A DXF site plan (ASCII DXF, R12 … 2018) read with the kept `dxf-parser` library: its layers with
 * entity counts, and its geometry in site metres — closed polylines (excavation outlines), points,
 * block inserts and circle centres (existing wells, receptors), and lines, polylines, arcs and
 * text for a vector backdrop. Units come from the header's $INSUNITS (or are chosen when the file
 * has none). Nothing enters the scenario here: the caller previews, the designer picks layers.
 */
import DxfParser from 'dxf-parser';
import { DrydigError } from '../schema';

/** $INSUNITS codes drydig converts, with metres per drawing unit (DXF reference, header variables). */
export const DXF_UNITS: Record<number, { name: string; toMetre: number }> = {
  1: { name: 'inches', toMetre: 0.0254 },
  2: { name: 'feet', toMetre: 0.3048 },
  4: { name: 'millimetres', toMetre: 0.001 },
  5: { name: 'centimetres', toMetre: 0.01 },
  6: { name: 'metres', toMetre: 1 },
  10: { name: 'yards', toMetre: 0.9144 },
};

/** Largest DXF read, characters. */
export const MAX_DXF_CHARS = 64 * 1024 * 1024;
/** Arc segments per full circle when arcs are drawn as polylines. */
const ARC_SEGMENTS = 48;

export interface DxfLayerSummary {
  name: string;
  /** Entity counts by DXF type (LINE, LWPOLYLINE, …). */
  counts: Record<string, number>;
  total: number;
  closedPolylines: number;
  points: number;
}

export interface DxfPolyline {
  layer: string;
  points: Array<[number, number]>;
  closed: boolean;
}

export interface DxfMark {
  layer: string;
  x: number;
  y: number;
  /** Block name (inserts) or 'point' / 'circle'. */
  name: string;
}

export interface DxfText {
  layer: string;
  x: number;
  y: number;
  text: string;
  height_m: number;
}

export interface DxfSitePlan {
  units: { code: number | null; name: string; toMetre: number; fromHeader: boolean };
  layers: DxfLayerSummary[];
  polylines: DxfPolyline[];
  marks: DxfMark[];
  texts: DxfText[];
  /** Entities of types not used (3DFACE, SOLID, SPLINE…), by type. */
  skipped: Record<string, number>;
}

export interface ReadDxfOptions {
  /** Metres per drawing unit when the header has no $INSUNITS (or to override it). */
  toMetre?: number;
  /** Name for messages. Default 'dxf'. */
  source?: string;
}

type AnyEntity = { type: string; layer?: string; [key: string]: unknown };
type Vertex = { x: number; y: number; bulge?: number };

function arcPoints(cx: number, cy: number, r: number, a0: number, a1: number): Array<[number, number]> {
  let sweep = a1 - a0;
  while (sweep <= 0) sweep += 2 * Math.PI;
  const n = Math.max(2, Math.ceil((ARC_SEGMENTS * sweep) / (2 * Math.PI)));
  return Array.from({ length: n + 1 }, (_, k) => {
    const a = a0 + (sweep * k) / n;
    return [cx + r * Math.cos(a), cy + r * Math.sin(a)] as [number, number];
  });
}

/** Polyline vertices with bulges (arc segments) expanded, in drawing units. */
function expandBulges(vertices: Vertex[], closed: boolean): Array<[number, number]> {
  const out: Array<[number, number]> = [];
  const n = vertices.length;
  for (let i = 0; i < n; i++) {
    const a = vertices[i]!;
    out.push([a.x, a.y]);
    const b = vertices[(i + 1) % n]!;
    if (!closed && i === n - 1) break;
    const bulge = a.bulge ?? 0;
    if (Math.abs(bulge) > 1e-9) {
      // Bulge = tan(θ/4), θ the included angle; the arc's centre lies off the chord's midpoint.
      const theta = 4 * Math.atan(bulge);
      const chord = Math.hypot(b.x - a.x, b.y - a.y);
      const r = chord / (2 * Math.sin(Math.abs(theta) / 2));
      const mx = (a.x + b.x) / 2;
      const my = (a.y + b.y) / 2;
      const d = Math.sqrt(Math.max(0, r * r - (chord / 2) ** 2)) * Math.sign(bulge) * (Math.abs(theta) > Math.PI ? -1 : 1);
      const ux = -(b.y - a.y) / chord;
      const uy = (b.x - a.x) / chord;
      const cx = mx + d * ux;
      const cy = my + d * uy;
      const a0 = Math.atan2(a.y - cy, a.x - cx);
      const pts = arcPoints(cx, cy, r, bulge > 0 ? a0 : a0 + theta, bulge > 0 ? a0 + theta : a0);
      const inner = bulge > 0 ? pts.slice(1, -1) : pts.slice(1, -1).reverse();
      out.push(...inner);
    }
  }
  return out;
}

/** Parses the DXF text; throws DRYDIG_ERR_INVALID_IMPORT with what is wrong. */
export function readDxfSitePlan(text: string, options: ReadDxfOptions = {}): DxfSitePlan {
  const source = options.source ?? 'dxf';
  if (text.length > MAX_DXF_CHARS) throw new DrydigError('DRYDIG_ERR_INVALID_IMPORT', `${source}: the file is larger than ${MAX_DXF_CHARS / 1024 / 1024} MB`);
  if (!/^\s*0\s*[\r\n]+\s*SECTION/.test(text)) throw new DrydigError('DRYDIG_ERR_INVALID_IMPORT', `${source}: not an ASCII DXF file (it must start with a SECTION; binary DXF is not read — save it as ASCII DXF)`);
  let dxf: { header?: Record<string, unknown>; entities?: AnyEntity[] } | null;
  try {
    dxf = new DxfParser().parseSync(text) as unknown as typeof dxf;
  } catch (error) {
    throw new DrydigError('DRYDIG_ERR_INVALID_IMPORT', `${source}: the DXF cannot be read (${error instanceof Error ? error.message.slice(0, 200) : String(error)})`);
  }
  if (!dxf || !Array.isArray(dxf.entities)) throw new DrydigError('DRYDIG_ERR_INVALID_IMPORT', `${source}: the DXF has no ENTITIES section`);
  const code = typeof dxf.header?.$INSUNITS === 'number' ? (dxf.header.$INSUNITS as number) : null;
  const known = code !== null ? DXF_UNITS[code] : undefined;
  if (options.toMetre === undefined && known === undefined)
    throw new DrydigError(
      'DRYDIG_ERR_INVALID_IMPORT',
      `${source}: the drawing's units are ${code === null || code === 0 ? 'not stated ($INSUNITS missing or unitless)' : `$INSUNITS ${code}, which drydig does not convert`}: choose the unit (metres, millimetres, feet …)`,
    );
  if (options.toMetre !== undefined && !(options.toMetre > 0 && options.toMetre <= 1000)) throw new DrydigError('DRYDIG_ERR_INVALID_REQUEST', `${source}: the unit must be > 0 and at most 1000 m per drawing unit`);
  const k = options.toMetre ?? known!.toMetre;
  const units = { code, name: options.toMetre !== undefined ? `${options.toMetre} m per unit` : known!.name, toMetre: k, fromHeader: options.toMetre === undefined };
  const p = (x: unknown, y: unknown): [number, number] => [Number(x) * k, Number(y) * k];
  const layers = new Map<string, DxfLayerSummary>();
  const polylines: DxfPolyline[] = [];
  const marks: DxfMark[] = [];
  const texts: DxfText[] = [];
  const skipped: Record<string, number> = {};
  for (const e of dxf.entities) {
    const layer = String(e.layer ?? '0');
    const summary = layers.get(layer) ?? { name: layer, counts: {}, total: 0, closedPolylines: 0, points: 0 };
    layers.set(layer, summary);
    summary.counts[e.type] = (summary.counts[e.type] ?? 0) + 1;
    summary.total++;
    switch (e.type) {
      case 'LINE': {
        const v = e.vertices as Vertex[] | undefined;
        if (v && v.length >= 2) polylines.push({ layer, points: [p(v[0]!.x, v[0]!.y), p(v[1]!.x, v[1]!.y)], closed: false });
        break;
      }
      case 'LWPOLYLINE':
      case 'POLYLINE': {
        const v = (e.vertices as Vertex[] | undefined) ?? [];
        const closed = e.shape === true || (v.length > 2 && v[0]!.x === v[v.length - 1]!.x && v[0]!.y === v[v.length - 1]!.y);
        const pts = expandBulges(v, closed).map(([x, y]) => p(x, y));
        if (closed && pts.length > 2 && pts[0]![0] === pts[pts.length - 1]![0] && pts[0]![1] === pts[pts.length - 1]![1]) pts.pop();
        if (pts.length >= 2) polylines.push({ layer, points: pts, closed });
        if (closed && pts.length >= 3) summary.closedPolylines++;
        break;
      }
      case 'ARC': {
        const c = e.center as Vertex;
        const pts = arcPoints(Number(c.x), Number(c.y), Number(e.radius), Number(e.startAngle), Number(e.endAngle)).map(([x, y]) => p(x, y));
        polylines.push({ layer, points: pts, closed: false });
        break;
      }
      case 'CIRCLE': {
        const c = e.center as Vertex;
        marks.push({ layer, x: Number(c.x) * k, y: Number(c.y) * k, name: 'circle' });
        summary.points++;
        polylines.push({ layer, points: arcPoints(Number(c.x), Number(c.y), Number(e.radius), 0, 2 * Math.PI).slice(0, -1).map(([x, y]) => p(x, y)), closed: true });
        break;
      }
      case 'POINT':
      case 'INSERT': {
        const c = (e.position ?? e.center) as Vertex | undefined;
        if (c) {
          marks.push({ layer, x: Number(c.x) * k, y: Number(c.y) * k, name: e.type === 'INSERT' ? String(e.name ?? 'block') : 'point' });
          summary.points++;
        }
        break;
      }
      case 'TEXT':
      case 'MTEXT': {
        const c = (e.startPoint ?? e.position) as Vertex | undefined;
        const t = String(e.text ?? '').replace(/\\P/g, ' ').replace(/\{\\[^;]*;|\}/g, '');
        if (c && t.trim() !== '') texts.push({ layer, x: Number(c.x) * k, y: Number(c.y) * k, text: t.slice(0, 200), height_m: Number(e.textHeight ?? e.height ?? 1) * k });
        break;
      }
      default:
        skipped[e.type] = (skipped[e.type] ?? 0) + 1;
    }
  }
  const bad = [...polylines.flatMap((l) => l.points), ...marks.map((m) => [m.x, m.y] as [number, number])].find(([x, y]) => !Number.isFinite(x) || !Number.isFinite(y));
  if (bad) throw new DrydigError('DRYDIG_ERR_INVALID_IMPORT', `${source}: an entity has a coordinate that is not a number`);
  return { units, layers: [...layers.values()].sort((a, b) => a.name.localeCompare(b.name)), polylines, marks, texts, skipped };
}

/** Closed polylines of a layer, as excavation outlines (site metres). */
export function outlinesOnLayer(plan: DxfSitePlan, layer: string): Array<Array<[number, number]>> {
  return plan.polylines.filter((l) => l.layer === layer && l.closed && l.points.length >= 3).map((l) => l.points);
}

/** Points, inserts and circle centres of a layer (existing wells, receptors). */
export function marksOnLayer(plan: DxfSitePlan, layer: string): DxfMark[] {
  return plan.marks.filter((m) => m.layer === layer);
}

/**
 * The backdrop's polylines simplified for display (Douglas–Peucker, tolerance in m), so 10⁵
 * entities stay quick to draw; vertices are dropped only where they lie within the tolerance of
 * the simplified line.
 */
export function simplifyForDisplay(lines: readonly DxfPolyline[], tolerance_m: number): DxfPolyline[] {
  const simplify = (pts: Array<[number, number]>): Array<[number, number]> => {
    if (pts.length <= 2) return pts;
    const keep = new Uint8Array(pts.length);
    keep[0] = 1;
    keep[pts.length - 1] = 1;
    const stack: Array<[number, number]> = [[0, pts.length - 1]];
    while (stack.length > 0) {
      const [i0, i1] = stack.pop()!;
      const [ax, ay] = pts[i0]!;
      const [bx, by] = pts[i1]!;
      const len = Math.hypot(bx - ax, by - ay) || 1e-12;
      let worst = -1;
      let at = -1;
      for (let i = i0 + 1; i < i1; i++) {
        const [px, py] = pts[i]!;
        const d = Math.abs((bx - ax) * (ay - py) - (ax - px) * (by - ay)) / len;
        if (d > worst) {
          worst = d;
          at = i;
        }
      }
      if (worst > tolerance_m && at > 0) {
        keep[at] = 1;
        stack.push([i0, at], [at, i1]);
      }
    }
    return pts.filter((_, i) => keep[i] === 1);
  };
  return lines.map((l) => ({ ...l, points: simplify(l.points) }));
}
