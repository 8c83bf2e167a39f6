/**
 * The printable design report: one self-contained HTML page (no scripts, styles inline) with a
 * print stylesheet, so any browser prints it to PDF. Sections: the job, the plan with contours,
 * the well schedule, the design and bid summary, checks, the monitoring plan, assumptions with
 * method references, and the cautions (at the top and on every printed page).
 */
import type { Scenario } from '../schema';
import type { DesignResult } from '../design';
import { describeRecovery } from '../design';
import { DESIGN_CAUTIONS } from './design-cautions';
import { escapeHtml as e } from './escape-html';
import { METHOD_REFERENCES, SUPPORTING_REFERENCES } from './method-references';
import type { MonitoringPlan } from './monitoring-plan';
import type { PlanResults } from './plan-results';
import { renderPlanSvg } from './plan-svg';
import { excavationShortfalls, planKeyHtml, planSymbolKeys, receptorVerdicts } from './plan-symbols';
import { getReceptors } from '../schema/receptor-schema';
import { buildSetoutRows } from './setout-csv';
import type { SiteProjection } from '../crs';
import { designFloorCautions, writeFloorReportHtml } from './floor-report-html';
import { writeReceptorTableHtml } from './receptor-report-html';
import { describeRevisionStatus, type RevisionIssueRecord } from './revision-status';

/** Options for `writeReportHtml`. */
export interface ReportOptions {
  scenario: Scenario;
  /** Revision metadata of what is reported. */
  revision?: { revision: number; savedAt: string; savedBy: string; sha256?: string; issued?: RevisionIssueRecord | null };
  results?: PlanResults;
  /** Why the field could not be computed, when it could not (shown instead of the plan's levels). */
  resultsError?: string | null;
  /** Design solver result, when one was run. */
  design?: DesignResult | null;
  /** Why the design solver gave no result, when it failed. */
  designError?: string | null;
  monitoring?: MonitoringPlan;
  projection: SiteProjection | null;
  /** When the report was made, ISO 8601. Default now. */
  generatedAt?: string;
  /** Program and version that computed the levels and design, e.g. "drydig 0.1.0". */
  computedBy?: string;
}

const f = (v: number | null | undefined, decimals = 2) => (v === null || v === undefined || !Number.isFinite(v) ? '—' : v.toFixed(decimals));
const ls = (q: number | null | undefined) => (q === null || q === undefined || !Number.isFinite(q) ? '—' : (q * 1000).toFixed(2));
const days = (t: number | null | undefined) => (t === null || t === undefined ? 'steady state' : `${(t / 86400).toFixed(1)} d`);

function totalVolume_m3(scenario: Scenario, until_s: number): number {
  let total = 0;
  for (const w of scenario.wells) {
    if (w.active === false) continue;
    const steps = w.schedule ?? [{ from_s: 0, rate_m3_s: w.rate_m3_s ?? 0 }];
    steps.forEach((s, i) => {
      const end = Math.min(until_s, steps[i + 1]?.from_s ?? until_s);
      if (end > s.from_s && s.rate_m3_s > 0) total += s.rate_m3_s * (end - s.from_s);
    });
  }
  return total;
}

function designSection(scenario: Scenario, design: DesignResult | null | undefined, designError?: string | null): string {
  const active = scenario.wells.filter((w) => w.active !== false);
  const startRate = active.reduce((sum, w) => sum + (w.rate_m3_s ?? w.schedule?.[0]?.rate_m3_s ?? 0), 0);
  const byKind = (k: string) => active.filter((w) => w.kind === k).length;
  const rows = [
    ['Wells in the scenario', `${active.length} active (${byKind('wellpoint')} well points, ${byKind('deep')} deep wells, ${byKind('ejector')} ejectors)`],
    ['Scenario pumping rate at start', `${ls(startRate)} L/s`],
  ];
  if (scenario.design.time_s !== null) rows.push([`Volume pumped to the design time (${days(scenario.design.time_s)})`, `${f(totalVolume_m3(scenario, scenario.design.time_s), 0)} m³`]);
  let html = `<table class="kv">${rows.map(([k, v]) => `<tr><th>${e(k ?? '')}</th><td>${e(v ?? '')}</td></tr>`).join('')}</table>`;
  if (!design)
    return `${html}<p class="note">No design run is attached to this revision${designError ? ` (the solver reported: ${e(designError)})` : ''}: the numbers above are the scenario's own rates. Run the design to size pumps and price the bid.</p>`;
  const s = design.summary;
  const checked = design.rateSource === 'scenario';
  html += checked
    ? `<h3>Design check of these rates — ${design.feasible ? '<span class="ok">targets met</span>' : '<span class="bad">targets NOT met</span>'}</h3>`
    : `<h3>Design (${e(design.mode)}) — ${design.feasible ? '<span class="ok">feasible</span>' : '<span class="bad">NOT feasible</span>'}</h3>`;
  html += '<table class="kv">';
  const kv: Array<[string, string]> = [
    [checked ? 'Total pumping rate (the revision’s rates)' : 'Total design rate', `${ls(design.totalRate_m3_s)} L/s`],
    ['Design flow (× safety factor ' + f(s.safetyFactor, 2) + ')', `${ls(s.designFlow_m3_s)} L/s`],
    ['Duty / standby pumps', `${s.dutyPumps} / ${s.standbyPumps}`],
    ['Installed power', `${f(s.installedPower_kW, 1)} kW`],
    ['Energy over the duration', `${f(s.energy_kWh, 0)} kWh over ${days(s.duration_s)}`],
    ['Discharge volume', `${f(s.dischargeVolume_m3, 0)} m³`],
    ['Wells / screen / header', `${s.quantities.wells} wells, ${f(s.quantities.screen_m, 1)} m screen, ${f(s.quantities.header_m, 1)} m header`],
    ['Cost estimate (energy + discharge + wells)', `${f(s.energyCost, 0)} + ${f(s.pumpedVolumeCost, 0)} + ${f(s.wellCost, 0)} = ${f(s.totalCost, 0)}`],
  ];
  html += kv.map(([k, v]) => `<tr><th>${e(k)}</th><td>${e(v)}</td></tr>`).join('') + '</table>';
  if (s.undersizedPumpWellIds.length) html += `<p class="bad">Pumps undersized at: ${e(s.undersizedPumpWellIds.join(', '))}</p>`;
  html += '<table><thead><tr><th>Excavation</th><th>Target m</th><th>Met</th><th>Worst shortfall m</th><th>Critical point</th><th>Time to target</th><th>Power failure</th></tr></thead><tbody>';
  for (const x of design.excavations)
    html += `<tr><td>${e(x.id)}</td><td>${f(x.targetLevel_m)}</td><td>${x.met ? '<span class="ok">yes</span>' : '<span class="bad">no</span>'}</td><td>${f(x.worstShortfall_m)}</td><td>${f(x.critical.x, 1)}, ${f(x.critical.y, 1)} (${f(x.critical.level_m)} m)</td><td>${e(x.timeToTarget_s === null ? '—' : days(x.timeToTarget_s))}</td><td>${e(describeRecovery(x))}</td></tr>`;
  html += '</tbody></table>';
  if (design.reasons.length) html += `<ul class="bad">${design.reasons.map((r) => `<li>${e(r.message)}</li>`).join('')}</ul>`;
  if (design.outOfService)
    html += `<p>One well out of service (${e(design.outOfService.wellId)}): targets ${design.outOfService.met ? 'still met' : '<strong>not met</strong>'}, worst shortfall ${f(design.outOfService.worstShortfall_m)} m.</p>`;
  return html + writeFloorReportHtml(design) + writeReceptorTableHtml(design);
}

function checksSection(results: PlanResults | undefined, design: DesignResult | null | undefined, resultsError?: string | null): string {
  if (!results) return resultsError ? `<p class="bad">Levels could not be computed: ${e(resultsError)}. No check of the excavations is possible.</p>` : '<p class="note">No field computation attached.</p>';
  let html = '<table><thead><tr><th>Excavation</th><th>Target m</th><th>Highest level inside m (grid)</th><th>Above target m</th><th>Wet area m²</th></tr></thead><tbody>';
  for (const x of results.excavations)
    html += `<tr><td>${e(x.id)}</td><td>${f(x.targetLevel_m)}</td><td>${f(x.highestLevel_m)}</td><td class="${(x.shortfall_m ?? 0) > 0 ? 'bad' : 'ok'}">${f(x.shortfall_m)}</td><td>${f(x.wetArea_m2, 1)}</td></tr>`;
  html += '</tbody></table><p class="note">Grid check at the plan resolution; the design solver checks control points exactly.</p>';
  const flagged = Object.entries(results.flagCounts).filter(([, n]) => n > 0);
  html += flagged.length
    ? `<p class="bad">Results outside a method's comfortable validity: ${flagged.map(([k, n]) => `${e(k)} at ${n} grid nodes`).join('; ')}. Treat those areas with particular care.</p>`
    : '<p>No grid node carries a validity flag.</p>';
  if (design) {
    const flaggedWells = design.wells.filter((w) => w.flags.length > 0 || (w.utilisation ?? 0) > 1);
    if (flaggedWells.length) html += `<p class="bad">Wells over capacity or flagged: ${flaggedWells.map((w) => `${e(w.id)} (${e([...w.flags, (w.utilisation ?? 0) > 1 ? `utilisation ${f(w.utilisation)}` : ''].filter(Boolean).join(', '))})`).join('; ')}</p>`;
  }
  return html;
}

function monitoringSection(plan: MonitoringPlan | undefined): string {
  if (!plan || !plan.present) return '<p class="note">No monitoring piezometers in this scenario.</p>';
  let html = '<table><thead><tr><th>Piezometer</th><th>E / N</th><th>Alert offset m</th><th>Action level m</th><th>Expected at design time m</th></tr></thead><tbody>';
  for (const p of plan.piezometers) {
    const last = p.series.at(-1);
    html += `<tr><td>${e(p.id)}</td><td>${f(p.x, 2)} / ${f(p.y, 2)}</td><td>${f(p.alertOffset_m)}</td><td>${f(p.actionLevel_m)}${p.actionSource === 'excavation-target' ? ` (target of ${e(p.excavationId ?? '')})` : ''}</td><td>${f(last?.expectedLevel_m)}</td></tr>`;
  }
  return `${html}</tbody></table>${plan.notes.map((n) => `<p class="note">${e(n)}</p>`).join('')}`;
}

const piezometerCount = (s: Scenario) => (s as Scenario & { monitoring?: { piezometers: unknown[] } }).monitoring?.piezometers.length ?? 0;

/** The report as one HTML document. */
export function writeReportHtml(options: ReportOptions): string {
  const { scenario, results, design, projection } = options;
  const a = scenario.aquifer;
  const generatedAt = options.generatedAt ?? new Date().toISOString();
  const setout = buildSetoutRows(scenario, projection);
  // The floor cautions stand with the general ones wherever the design is shown.
  const cautions = [...DESIGN_CAUTIONS, ...(design ? designFloorCautions(design) : [])].map((c) => `<li>${e(c)}</li>`).join('');
  const method = results ? METHOD_REFERENCES[results.model.method] : undefined;
  // A check of the revision's own rates has one rate set; only a separately solved design gets its own column.
  const solvedRates = design && design.rateSource !== 'scenario' ? design : null;
  const designRate = new Map(solvedRates?.wells.map((w) => [w.id, w.rate_m3_s]) ?? []);
  const wellRows = setout
    .map((r) => `<tr><td>${r.number}</td><td>${e(r.id)}</td><td>${e(r.kind)}</td><td>${f(r.easting_m, 3)}</td><td>${f(r.northing_m, 3)}</td>${projection ? `<td>${f(r.latitude_deg, 7)}</td><td>${f(r.longitude_deg, 7)}</td>` : ''}<td>${ls(r.rate_m3_s)}${r.scheduled ? ' (sched.)' : ''}</td>${solvedRates ? `<td>${ls(designRate.get(r.id))}</td>` : ''}<td>${f(r.screenTop_m)} / ${f(r.screenBottom_m)}</td><td>${r.active ? 'yes' : 'no'}</td></tr>`)
    .join('');
  const rev = options.revision;
  const shortfall = excavationShortfalls(design, results?.excavations ?? []);
  const floorWords = new Set(design ? designFloorCautions(design) : []);
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${e(scenario.name)} — dewatering design report</title>
<style>
body{font:13px/1.4 system-ui,-apple-system,"Segoe UI",sans-serif;color:#111;margin:24px auto;max-width:900px;padding:0 12px}
h1{font-size:22px;margin:0 0 4px}h2{font-size:16px;border-bottom:2px solid #124;margin:22px 0 8px;padding-bottom:2px}h3{font-size:14px}
table{border-collapse:collapse;width:100%;margin:6px 0}th,td{border:1px solid #bbb;padding:3px 6px;text-align:left;vertical-align:top}
thead th{background:#e8edf3}table.kv th{width:45%;background:#f4f6f8;font-weight:600}
.cautions{border:2px solid #b60;background:#fff6e8;padding:8px 12px}.cautions h2{border:0;margin:0 0 4px}
.ok{color:#060;font-weight:600}.bad{color:#a00;font-weight:600}.note{color:#444;font-size:12px}
.meta{color:#333}.plan{border:1px solid #999;margin:6px 0}
.plan-key{list-style:none;padding:0;margin:4px 0;display:flex;flex-wrap:wrap;gap:4px 14px;font-size:12px}.plan-key svg{vertical-align:middle}
footer.print-caution{display:none}
@media print{
 @page{size:A4;margin:14mm 12mm 18mm}
 body{margin:0;max-width:none;font-size:10.5pt}
 h2{break-after:avoid}tr,li,.plan,.cautions{break-inside:avoid}
 thead{display:table-header-group}
 footer.print-caution{display:block;position:fixed;bottom:0;left:0;right:0;font-size:8pt;color:#555;border-top:1px solid #999;padding-top:2px}
 a{color:inherit;text-decoration:none}
}
</style></head><body>
<header><h1>${e(scenario.name)}</h1>
<p class="meta">Dewatering design report${rev ? ` — revision ${rev.revision}, saved ${e(rev.savedAt)}${rev.savedBy ? ` by ${e(rev.savedBy)}` : ''}` : ''} — generated ${e(generatedAt)}${options.computedBy ? ` by ${e(options.computedBy)}` : ''}.<br>
Coordinates: ${e(scenario.crs ?? 'local site grid (not georeferenced)')}; levels in m above site datum; rates in L/s.${rev?.sha256 ? `<br>Scenario checksum (SHA-256): <code>${e(rev.sha256)}</code>` : ''}${rev?.issued !== undefined ? `<br>${e(describeRevisionStatus({ revision: rev.revision, issued: rev.issued }))}` : ''}</p></header>
<section class="cautions"><h2>Cautions</h2><ul>${cautions}</ul></section>
<h2>1. The job</h2>
<table class="kv">
<tr><th>Ground level</th><td>${f(scenario.groundLevel_m)} m</td></tr>
<tr><th>Aquifer</th><td>${e(a.kind)}; K = ${e(a.conductivity_m_s.toExponential(2))} m/s; base ${f(a.base_m)} m${a.top_m !== undefined ? `; top ${f(a.top_m)} m` : ''}</td></tr>
<tr><th>Static groundwater level</th><td>${f(a.staticLevel_m)} m</td></tr>
<tr><th>Storage</th><td>${a.storativity !== undefined ? `S = ${e(a.storativity.toExponential(2))}` : ''}${a.specificYield !== undefined ? `Sy = ${f(a.specificYield, 3)}` : ''}${a.leakageFactor_m !== undefined ? `; B = ${f(a.leakageFactor_m, 0)} m` : ''}</td></tr>
<tr><th>Design time</th><td>${e(days(scenario.design.time_s))}</td></tr>
${scenario.excavations.map((x) => `<tr><th>Excavation ${e(x.id)}</th><td>formation ${f(x.formationLevel_m)} m, margin ${f(x.margin_m)} m → target ${f(x.formationLevel_m - x.margin_m)} m</td></tr>`).join('')}
${(scenario.boundaries ?? []).map((b, i) => `<tr><th>Boundary ${i + 1}</th><td>${e(b.kind)}${b.label ? ` (${e(b.label)})` : ''}, treated as an infinite straight line</td></tr>`).join('')}
</table>
<h2>2. Plan</h2>
<div class="plan">${renderPlanSvg({ scenario, results, shortfall, receptorVerdicts: receptorVerdicts(design) })}</div>
${planKeyHtml(planSymbolKeys({ wells: scenario.wells, piezometerCount: piezometerCount(scenario), excavationCount: scenario.excavations.length, boundaryKinds: (scenario.boundaries ?? []).map((b) => b.kind), shortfallKinds: Object.values(shortfall), receptorTypes: getReceptors(scenario).map((r) => r.geometry.type) }))}
<p class="note">Blue lines: computed groundwater level (m) at ${e(days(results?.time_s ?? scenario.design.time_s))}${results ? `, levels ${f(results.range_m[0])} to ${f(results.range_m[1])} m` : ''}. Wells are numbered as in the schedule.</p>
<h2>3. Well schedule</h2>
<table><thead><tr><th>No.</th><th>Id</th><th>Kind</th><th>Easting m</th><th>Northing m</th>${projection ? '<th>Latitude °</th><th>Longitude °</th>' : ''}<th>${solvedRates ? 'Scenario rate' : 'Rate'} L/s</th>${solvedRates ? '<th>Design rate L/s</th>' : ''}<th>Screen top / bottom m</th><th>Active</th></tr></thead><tbody>${wellRows}</tbody></table>
<h2>4. Design and bid summary</h2>
${designSection(scenario, design, options.designError)}
<h2>5. Checks</h2>
${checksSection(results, design, options.resultsError)}
<h2>6. Monitoring plan</h2>
${monitoringSection(options.monitoring)}
<h2>7. Assumptions and methods</h2>
<ul>
${method ? `<li>Field method: ${e(method.name)} — ${e(method.reference)}.</li>` : ''}
${results ? `<li>Transmissivity used ${e(results.model.transmissivity_m2_s.toExponential(3))} m²/s${results.model.influenceRadius_m !== undefined ? `; radius of influence ${f(results.model.influenceRadius_m, 0)} m (${e(results.model.influenceRadiusSource ?? '')})` : ''}; ${results.model.imagesPerWell} image wells per well.</li>` : ''}
${(results?.model.notes ?? []).map((n) => `<li>${e(n)}</li>`).join('')}
${(design?.modelNotes ?? []).map((n) => `<li>${e(n)}</li>`).join('')}
${SUPPORTING_REFERENCES.map((r) => `<li>${e(r)}.</li>`).join('')}
</ul>
<h2>8. Cautions</h2>
<ul>${cautions}${(design?.cautions ?? []).filter((c) => !floorWords.has(c)).map((c) => `<li>${e(c)}</li>`).join('')}</ul>
<footer class="print-caution">${e(scenario.name)}${rev ? `, rev. ${rev.revision}` : ''} — idealised-model estimate; verify against site investigation and local codes; a licensed engineer must review before use.</footer>
</body></html>
`;
}
