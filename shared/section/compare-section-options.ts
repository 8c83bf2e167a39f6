/**
 * The same section with options side by side: the wall toe driven deeper (a sweep of toe level
 * against flow, exit-gradient FS and heave FS), a row of relief wells in the floor, and a lower
 * inside level held by pumped wells. Each option is a full solve of an edited copy of the document.
 */
import type { SectionDocument } from '../schema';
import { floorSpan } from './section-context';
import { sectionFlow, solveSectionDocument, type SectionResult } from './solve-section';

export type SectionOptionKind = 'as drawn' | 'deeper toe' | 'relief wells' | 'lower inside level';

export interface SectionOptionRow {
  kind: SectionOptionKind;
  /** In words: what changed. */
  label: string;
  toe_m: number | null;
  /** Total flow (m³/s per m plane, m³/s axisymmetric). */
  flow: number;
  exitGradient: number;
  exitFS: number | null;
  heaveFS: number | null;
  plugFS: number | null;
  upliftFS: number | null;
}

export interface CompareSectionOptions {
  /** Toe levels for the sweep, m. Default five levels from the drawn toe down towards the base. */
  toeLevels_m?: number[];
  /** Relief wells: head held in them, m. Default the floor's water level. */
  reliefHead_m?: number;
  /** Lower inside level, m. Default 1 m below the floor. */
  insideLevel_m?: number;
}

export interface SectionComparison {
  rows: SectionOptionRow[];
  sweep: SectionOptionRow[];
  /** The wall swept (document index), or null when the section has none. */
  wall: number | null;
}

function row(kind: SectionOptionKind, label: string, toe_m: number | null, r: SectionResult): SectionOptionRow {
  return {
    kind,
    label,
    toe_m,
    flow: sectionFlow(r),
    exitGradient: r.exitGradient.max,
    exitFS: r.exitGradient.fs,
    heaveFS: r.heave?.fs ?? null,
    plugFS: r.plug?.fs ?? null,
    upliftFS: r.uplift?.fs ?? null,
  };
}

const copy = (doc: SectionDocument): SectionDocument => JSON.parse(JSON.stringify(doc)) as SectionDocument;

/** Toe levels from the drawn toe down towards the base, evenly. */
export function defaultToeLevels(doc: SectionDocument, wall: number): number[] {
  const w = doc.walls![wall]!;
  const base = doc.layers[doc.layers.length - 1]!.bottom_m;
  const span = w.toe_m - base;
  if (span <= 0.01) return [w.toe_m];
  return [0, 0.2, 0.4, 0.6, 0.8].map((f) => Math.round((w.toe_m - f * span) * 100) / 100);
}

/** The floor's centre, its level and held head, and where the wall toe stands below it. */
function floorFacts(doc: SectionDocument): { x0: number; x1: number; level: number; head: number | null; deepest: number } {
  const span = floorSpan(doc);
  const seg = doc.surface.find((s) => s.x0_m < span.x1_m && s.x1_m > span.x0_m)!;
  const toes = (doc.walls ?? []).map((w) => w.toe_m);
  const base = doc.layers[doc.layers.length - 1]!.bottom_m;
  return { x0: span.x0_m, x1: span.x1_m, level: seg.level_m, head: seg.head_m, deepest: toes.length ? Math.min(...toes) : base + 0.25 * (seg.level_m - base) };
}

/** Solves the document and its options; one row each, plus the toe sweep. */
export function compareSectionOptions(doc: SectionDocument, options: CompareSectionOptions = {}): SectionComparison {
  const solve = (d: SectionDocument) => solveSectionDocument(d, { flowNet: false });
  const wall = (doc.walls?.length ?? 0) > 0 ? 0 : null;
  const drawnToe = wall === null ? null : doc.walls![wall]!.toe_m;
  const rows: SectionOptionRow[] = [row('as drawn', 'as drawn', drawnToe, solve(doc))];
  const sweep: SectionOptionRow[] = [];
  if (wall !== null) {
    for (const toe of options.toeLevels_m ?? defaultToeLevels(doc, wall)) {
      const d = copy(doc);
      d.walls![wall]!.toe_m = toe;
      sweep.push(row('deeper toe', `toe at ${toe} m`, toe, toe === drawnToe ? solve(doc) : solve(d)));
    }
    const deepest = sweep[sweep.length - 1];
    if (deepest && deepest.toe_m !== drawnToe) rows.push({ ...deepest, label: `toe driven to ${deepest.toe_m} m` });
  }
  const f = floorFacts(doc);
  const screenTop = f.level - 0.25;
  const screenBottom = Math.max(f.deepest, doc.layers[doc.layers.length - 1]!.bottom_m + 0.1);
  if (screenBottom < screenTop) {
    const xWell = Math.round((f.x0 + 0.5 * (f.x1 - f.x0)) * 1000) / 1000;
    const reliefHead = options.reliefHead_m ?? f.head ?? f.level;
    const relief = copy(doc);
    relief.wells = [...(relief.wells ?? []), { x_m: xWell, screenTop_m: screenTop, screenBottom_m: screenBottom, head_m: reliefHead }];
    rows.push(row('relief wells', `relief wells at x = ${xWell} m, screen ${screenTop}…${Math.round(screenBottom * 100) / 100} m, head ${reliefHead} m`, drawnToe, solve(relief)));
    const insideLevel = options.insideLevel_m ?? f.level - 1;
    const lower = copy(doc);
    // Pumped below the floor, the floor no longer holds water: no flow through it; wells hold the level.
    lower.surface = lower.surface.map((s) => (s.x0_m < f.x1 && s.x1_m > f.x0 ? { ...s, head_m: null } : s));
    lower.wells = [...(lower.wells ?? []), { x_m: xWell, screenTop_m: screenTop, screenBottom_m: screenBottom, head_m: insideLevel }];
    rows.push(row('lower inside level', `inside level pumped to ${insideLevel} m by wells at x = ${xWell} m`, drawnToe, solve(lower)));
  }
  return { rows, sweep, wall };
}
