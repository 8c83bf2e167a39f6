/**
 * The pit-floor check of a design as report HTML: per excavation the governing check, the factors
 * of safety against the required ones, the allowable head, the time from a power failure until the
 * floor is unsafe, and the safe-dig table; then the floor cautions. Words from `shared/floor`.
 */
import type { DesignExcavationResult, DesignResult } from '../design';
import { FLOOR_SHORTFALL_LABELS, GOVERNING_CHECK_LABELS, floorCautions, formatFloorDuration } from '../floor';
import { escapeHtml as e } from './escape-html';

const f = (v: number | null | undefined, d = 2) => (v === null || v === undefined || !Number.isFinite(v) ? '—' : v.toFixed(d));

function fsCell(value: number | null, required: number | null, none: string): string {
  if (required === null) return '';
  if (value === null) return e(none);
  const ok = value >= required * (1 - 1e-6);
  return `<span class="${ok ? 'ok' : 'bad'}">${f(value, 3)}</span> (required ${f(required, 3)})`;
}

/** Time from a power failure until the floor is unsafe, in words. */
export function describeTimeToUnsafe(x: DesignExcavationResult): string {
  const t = x.floor?.timeToUnsafe_s ?? null;
  if (t !== null) return formatFloorDuration(t);
  return x.met ? 'more than the checked span' : 'already unsafe';
}

/** The floor cautions of a design (the same words the design result carries). */
export function designFloorCautions(design: DesignResult): string[] {
  return floorCautions(design.excavations.flatMap((x) => (x.floor ? [{ excavationId: x.id, ...x.floor }] : [])));
}

function excavationFloorHtml(x: DesignExcavationResult): string {
  const fl = x.floor!;
  const rows: Array<[string, string]> = [
    ['Governing check', e(GOVERNING_CHECK_LABELS[fl.governing])],
    ['Target (governing)', `${f(x.targetLevel_m)} m — ${x.met ? '<span class="ok">met</span>' : `<span class="bad">${e(fl.governing === 'dry' ? FLOOR_SHORTFALL_LABELS.water : FLOOR_SHORTFALL_LABELS.floor)}</span>`}`],
  ];
  if (fl.profileSource === null) rows.push(['Ground profile', '<span class="bad">none given: only the dry check was made (uplift and heave not checked)</span>']);
  if (fl.allowableLevel_m !== null) rows.push(['Allowable head under the floor', `${f(fl.allowableLevel_m)} m`]);
  if (fl.requiredUpliftFS !== null) rows.push(['Uplift FS at the critical point', fsCell(fl.upliftFS, fl.requiredUpliftFS, 'no pressure under the plug')]);
  if (fl.requiredHeaveFS !== null) rows.push(['Heave FS (i_c / i)', fsCell(fl.heaveFS, fl.requiredHeaveFS, 'no upward gradient')]);
  rows.push(['Head at the critical point', `${f(fl.critical.level_m)} m at ${f(fl.critical.x, 1)}, ${f(fl.critical.y, 1)} (margin ${f(fl.margin_m)} m)`]);
  if (fl.allowableLevel_m !== null) rows.push(['Power failure: floor unsafe after', e(describeTimeToUnsafe(x))]);
  let html = `<h3>Pit floor: ${e(x.id)}</h3><table class="kv floor-check" data-excavation="${e(x.id)}">${rows.map(([k, v]) => `<tr><th>${e(k)}</th><td>${v}</td></tr>`).join('')}</table>`;
  if (fl.safeDig.length > 0)
    html += `<table class="safe-dig"><thead><tr><th>Safe-dig sequence (${e(x.id)}): after</th><th>dig to (deepest safe formation) m</th></tr></thead><tbody>${fl.safeDig
      .map((s) => `<tr><td>${e(formatFloorDuration(s.time_s))}</td><td>${f(s.safeFormationLevel_m)}</td></tr>`)
      .join('')}</tbody></table>`;
  return html;
}

/** The floor section of a design ('' when no excavation carries a floor block). */
export function writeFloorReportHtml(design: DesignResult): string {
  const floors = design.excavations.filter((x) => x.floor);
  if (floors.length === 0) return '';
  const cautions = designFloorCautions(design);
  return floors.map(excavationFloorHtml).join('') + (cautions.length ? `<ul class="floor-cautions">${cautions.map((c) => `<li>${e(c)}</li>`).join('')}</ul>` : '');
}
