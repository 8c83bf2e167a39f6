/**
 * Edits of the scenario's optional `receptors` field on a store draft: place, extend, move,
 * delete. Every edit is checked with `validateScenario` by its caller before it is kept.
 */
import { getReceptors, type Receptor, type Scenario } from '../../shared/schema';

/** Most receptors the schema allows. */
export const MAX_RECEPTORS = 500;

/** The next id for a new receptor: N1, N2 … one past the highest Nn in use. */
export function nextReceptorId(receptors: readonly Pick<Receptor, 'id'>[]): string {
  let highest = 0;
  for (const r of receptors) {
    const m = /^N(\d+)$/.exec(r.id);
    if (m) highest = Math.max(highest, Number(m[1]));
  }
  return `N${highest + 1}`;
}

/** The receptors of a draft, the field created empty when missing. */
export function ensureReceptors(draft: Scenario): Receptor[] {
  const record = draft as Scenario & { receptors?: Receptor[] };
  if (!Array.isArray(record.receptors)) record.receptors = [];
  return record.receptors;
}

/** Adds a point receptor (a building, no soil data yet) at (x, y) m; returns its id. */
export function placeReceptor(draft: Scenario, x: number, y: number): string {
  const list = ensureReceptors(draft);
  const id = nextReceptorId(list);
  list.push({ id, kind: 'building', geometry: { type: 'Point', coordinates: [x, y] } });
  return id;
}

/** Adds a point `step_m` beyond the receptor's last one (a point becomes a two-point line). */
export function extendReceptor(draft: Scenario, id: string, step_m = 10): void {
  const r = ensureReceptors(draft).find((k) => k.id === id);
  if (!r) return;
  const pts = r.geometry.type === 'Point' ? [r.geometry.coordinates] : r.geometry.coordinates;
  const last = pts[pts.length - 1]!;
  const before = pts[pts.length - 2];
  const dx = before ? last[0] - before[0] : step_m;
  const dy = before ? last[1] - before[1] : 0;
  const len = Math.hypot(dx, dy) || 1;
  const next: [number, number] = [Math.round((last[0] + (dx / len) * step_m) * 1000) / 1000, Math.round((last[1] + (dy / len) * step_m) * 1000) / 1000];
  r.geometry = { type: 'LineString', coordinates: [...pts.map((p) => [p[0], p[1]] as [number, number]), next] };
}

/** Moves a point receptor (vertex −1) or one vertex of a polyline receptor. */
export function moveReceptor(draft: Scenario, id: string, vertex: number, x: number, y: number): void {
  const r = getReceptors(draft).find((k) => k.id === id);
  if (!r) return;
  if (r.geometry.type === 'Point') r.geometry.coordinates = [x, y];
  else if (r.geometry.coordinates[vertex]) r.geometry.coordinates[vertex] = [x, y];
}

/** Removes a receptor (the field is dropped when none is left, so the scenario reads as before). */
export function deleteReceptor(draft: Scenario, id: string): void {
  const record = draft as Scenario & { receptors?: Receptor[] };
  record.receptors = getReceptors(draft).filter((r) => r.id !== id);
  if (record.receptors.length === 0) delete record.receptors;
}
