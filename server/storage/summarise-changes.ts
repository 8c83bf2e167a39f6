/**
 * A short, plain-language summary of what changed between two revisions, written into the
 * history at save time ("2 wells added (W7, W8); W3 rate 2.0 → 2.5 L/s; design time 14 → 21 d").
 * Designer units (L/s, days) appear only here, in text; stored data stays SI.
 */
import type { Scenario, Well } from '../../shared/schema';

const MAX_NAMES = 4;

function listNames(ids: string[]): string {
  const shown = ids.slice(0, MAX_NAMES).join(', ');
  return ids.length > MAX_NAMES ? `${shown}, +${ids.length - MAX_NAMES} more` : shown;
}

function fmt(value: number): string {
  return Number.isInteger(value) ? String(value) : String(Number(value.toPrecision(4)));
}

function rateText(w: Well): string {
  if (w.schedule) return `schedule of ${w.schedule.length} step${w.schedule.length === 1 ? '' : 's'}`;
  return `${fmt((w.rate_m3_s ?? 0) * 1000)} L/s`;
}

function designTimeText(time_s: number | null): string {
  return time_s === null ? 'steady state' : `${fmt(time_s / 86400)} d`;
}

function sameJson(a: unknown, b: unknown): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}

/**
 * Summarises the change from `before` to `after`; `before` undefined means a first save.
 * Never empty: an unchanged document says "no change".
 */
export function summariseScenarioChanges(before: Scenario | undefined, after: Scenario): string {
  if (!before) return `first save: ${after.wells.length} well${after.wells.length === 1 ? '' : 's'}, ${after.excavations.length} excavation${after.excavations.length === 1 ? '' : 's'}`;
  const parts: string[] = [];

  if (before.name !== after.name) parts.push(`renamed "${before.name}" → "${after.name}"`);
  if (before.groundLevel_m !== after.groundLevel_m) parts.push(`ground level ${fmt(before.groundLevel_m)} → ${fmt(after.groundLevel_m)} m`);
  if (before.crs !== after.crs) parts.push(`CRS ${before.crs ?? 'local grid'} → ${after.crs ?? 'local grid'}`);

  const aquiferKeys = new Set([...Object.keys(before.aquifer), ...Object.keys(after.aquifer)]);
  for (const key of aquiferKeys) {
    const a = (before.aquifer as Record<string, unknown>)[key];
    const b = (after.aquifer as Record<string, unknown>)[key];
    if (!sameJson(a, b)) parts.push(`aquifer ${key} ${a === undefined ? '—' : String(a)} → ${b === undefined ? '—' : String(b)}`);
  }

  const beforeWells = new Map(before.wells.map((w) => [w.id, w]));
  const afterWells = new Map(after.wells.map((w) => [w.id, w]));
  const added = after.wells.filter((w) => !beforeWells.has(w.id)).map((w) => w.id);
  const removed = before.wells.filter((w) => !afterWells.has(w.id)).map((w) => w.id);
  if (added.length) parts.push(`${added.length} well${added.length === 1 ? '' : 's'} added (${listNames(added)})`);
  if (removed.length) parts.push(`${removed.length} well${removed.length === 1 ? '' : 's'} removed (${listNames(removed)})`);
  const moved: string[] = [];
  const rateChanges: string[] = [];
  const otherChanged: string[] = [];
  for (const w of after.wells) {
    const old = beforeWells.get(w.id);
    if (!old) continue;
    if (old.x !== w.x || old.y !== w.y) moved.push(w.id);
    if (old.rate_m3_s !== w.rate_m3_s || !sameJson(old.schedule, w.schedule)) rateChanges.push(`${w.id} ${rateText(old)} → ${rateText(w)}`);
    const { x: _x1, y: _y1, rate_m3_s: _r1, schedule: _s1, ...restOld } = old;
    const { x: _x2, y: _y2, rate_m3_s: _r2, schedule: _s2, ...restNew } = w;
    if (!sameJson(restOld, restNew)) otherChanged.push(w.id);
  }
  if (moved.length) parts.push(`${moved.length} well${moved.length === 1 ? '' : 's'} moved (${listNames(moved)})`);
  if (rateChanges.length === 1) parts.push(rateChanges[0] ?? '');
  else if (rateChanges.length > 1) parts.push(`${rateChanges.length} well rates changed`);
  if (otherChanged.length) parts.push(`details of ${listNames(otherChanged)} changed`);

  const beforeEx = new Map(before.excavations.map((e) => [e.id, e]));
  const afterEx = new Map(after.excavations.map((e) => [e.id, e]));
  for (const e of after.excavations) {
    const old = beforeEx.get(e.id);
    if (!old) parts.push(`excavation ${e.id} added`);
    else {
      if (old.formationLevel_m !== e.formationLevel_m) parts.push(`${e.id} formation ${fmt(old.formationLevel_m)} → ${fmt(e.formationLevel_m)} m`);
      if (old.margin_m !== e.margin_m) parts.push(`${e.id} margin ${fmt(old.margin_m)} → ${fmt(e.margin_m)} m`);
      if (!sameJson(old.outline, e.outline)) parts.push(`${e.id} outline changed`);
    }
  }
  for (const e of before.excavations) if (!afterEx.has(e.id)) parts.push(`excavation ${e.id} removed`);

  if (!sameJson(before.boundaries ?? [], after.boundaries ?? [])) parts.push('boundaries changed');
  if (before.design.time_s !== after.design.time_s)
    parts.push(`design time ${designTimeText(before.design.time_s)} → ${designTimeText(after.design.time_s)}`);
  else if (!sameJson(before.design, after.design)) parts.push('design options changed');

  const known = new Set(['format', 'version', 'name', 'crs', 'groundLevel_m', 'aquifer', 'wells', 'excavations', 'boundaries', 'design']);
  const extraKeys = new Set([...Object.keys(before), ...Object.keys(after)].filter((k) => !known.has(k)));
  for (const key of extraKeys) {
    if (!sameJson((before as Record<string, unknown>)[key], (after as Record<string, unknown>)[key])) parts.push(`${key} changed`);
  }
  return parts.length ? parts.join('; ') : 'no change';
}
