/**
 * What a DXF site plan gives the scenario, once the designer has picked the layers: closed
 * polylines as excavations (with the formation level and margin the designer states), and
 * points or blocks as existing wells (switched off until the designer puts them to work) or as
 * piezometers of the monitoring plan. Ids never clash with those already there.
 */
import type { Excavation, Scenario, Well } from '../../shared/schema';
import type { DxfMark } from '../../shared/import';
import { ensureMonitoring, nextPiezometerId } from '../state';

/** Largest number of outlines or marks one import adds (the scenario's own limits are 100 and 5000). */
export const MAX_IMPORTED_OUTLINES = 100;

/** The first free id `PREFIX-n` among `taken`. */
function freeId(prefix: string, taken: Set<string>): string {
  let n = 1;
  while (taken.has(`${prefix}-${n}`)) n++;
  const id = `${prefix}-${n}`;
  taken.add(id);
  return id;
}

export interface AddOutlinesOptions {
  outlines: ReadonlyArray<ReadonlyArray<readonly [number, number]>>;
  /** Formation (dig) level of the new excavations, m. */
  formationLevel_m: number;
  /** Margin below formation, m. */
  margin_m: number;
  /** Replace the scenario's excavations instead of adding to them. */
  replace: boolean;
  /** Id prefix, e.g. the layer name. */
  prefix: string;
}

/** Adds the outlines as excavations to a draft; returns the new ids. */
export function addOutlinesAsExcavations(draft: Scenario, options: AddOutlinesOptions): string[] {
  if (options.replace) draft.excavations = [];
  const taken = new Set(draft.excavations.map((e) => e.id));
  const prefix = options.prefix.replace(/[^A-Za-z0-9_-]+/g, '-').slice(0, 40) || 'DXF';
  const added: Excavation[] = options.outlines.slice(0, MAX_IMPORTED_OUTLINES).map((outline) => ({
    id: freeId(prefix, taken),
    outline: outline.map(([x, y]) => [x, y] as [number, number]),
    formationLevel_m: options.formationLevel_m,
    margin_m: options.margin_m,
  }));
  draft.excavations.push(...added);
  return added.map((e) => e.id);
}

/** Adds marks as existing wells, switched off (active: false) so no design changes until the designer says. */
export function addMarksAsWells(draft: Scenario, marks: readonly DxfMark[], prefix: string): string[] {
  const taken = new Set(draft.wells.map((w) => w.id));
  const clean = prefix.replace(/[^A-Za-z0-9_-]+/g, '-').slice(0, 40) || 'EX';
  const added: Well[] = marks.slice(0, 5000 - draft.wells.length).map((m) => ({
    id: freeId(clean, taken), x: m.x, y: m.y, radius_m: 0.15, kind: 'deep', rate_m3_s: 0, active: false,
  }));
  draft.wells.push(...added);
  return added.map((w) => w.id);
}

/** Adds marks as piezometers of the monitoring plan (receptors to watch). */
export function addMarksAsPiezometers(draft: Scenario, marks: readonly DxfMark[]): string[] {
  const monitoring = ensureMonitoring(draft);
  const ids: string[] = [];
  for (const m of marks.slice(0, Math.max(0, 500 - monitoring.piezometers.length))) {
    const id = nextPiezometerId(monitoring.piezometers);
    monitoring.piezometers.push({ id, x: m.x, y: m.y, label: `from DXF (${m.name})` });
    ids.push(id);
  }
  return ids;
}
