/**
 * <site-view>: the read-only, phone-friendly page a share link opens. It shows exactly the
 * revision the link pins (or the latest), the plan with numbered wells, the set-out table, the
 * design summary and cautions, the monitoring plan with readings, and — only when the user taps
 * "Show my position" and the browser allows it — the device's GPS position on the plan, transformed
 * into the site CRS by proj4. Edit links also get a form to enter piezometer readings.
 *
 * One rate set: the set-out table, the summary and the design check (pumps, pit floor) are all the
 * stored revision's own rates (the server checks them as they stand; it does not re-solve).
 * On a phone the cautions fold to one line that opens, tables keep the well id in view, and the
 * plan zooms and pans with labels at a readable size.
 */
import { LitElement, css, html, nothing } from 'lit';
import { unsafeHTML } from 'lit/directives/unsafe-html.js';
import { unsafeSVG } from 'lit/directives/unsafe-svg.js';
import { writeReceptorTableHtml } from '../../shared/exports/receptor-report-html';
import type { MonitoringPlan } from '../../shared/exports';
import { excavationShortfalls, planSymbolKeys, planSymbolSwatchSvg, PLAN_SYMBOL_LABELS, receptorVerdicts, type ShortfallAreaKind } from '../../shared/exports/plan-symbols';
import { getReceptors } from '../../shared/schema/receptor-schema';
import { describeRevisionStatus, revisionBadge } from '../../shared/exports/revision-status';
import '../components/floor-check-view';
import { resolveSiteProjection } from '../crs';
import { findNearestWell } from './nearest-well';
import { SiteApi, tokenFromLocation, type LinkView } from './site-api';
import type { PlanPosition } from './site-plan';
import './site-plan';
import './site-level-chart';

const f = (v: number | null | undefined, d = 2) => (v === null || v === undefined || !Number.isFinite(v) ? '—' : v.toFixed(d));
const days = (t: number | null | undefined) => (t === null || t === undefined ? 'steady state' : `${f(t / 86400, 1)} d`);

export class SiteView extends LitElement {
  static override properties = {
    token: { type: String },
    view: { state: true },
    monitoring: { state: true },
    error: { state: true },
    position: { state: true },
    positionNote: { state: true },
    selected: { state: true },
    readingNote: { state: true },
    busy: { state: true },
  };
  declare token: string | null;
  declare view: LinkView | null;
  declare monitoring: (MonitoringPlan & { error?: string }) | null;
  declare error: string;
  declare position: PlanPosition | null;
  declare positionNote: string;
  declare selected: number;
  declare readingNote: string;
  declare busy: boolean;
  private watchId: number | null = null;
  /** A wide screen opens the cautions at first; a phone shows their one-line summary. */
  private readonly wide = typeof window !== 'undefined' && window.matchMedia?.('(min-width: 46rem)').matches === true;

  static override styles = css`
    :host { display: block; font: 16px/1.45 system-ui, -apple-system, 'Segoe UI', sans-serif; color: #111; max-width: 60rem; margin: 0 auto; padding: 0.6rem 0.7rem 3rem; }
    h1 { font-size: 1.3rem; margin: 0.2rem 0; line-height: 1.2; }
    h2 { font-size: 1.08rem; margin: 1.3rem 0 0.4rem; border-bottom: 2px solid #124; padding-bottom: 0.15rem; }
    h3 { font-size: 1rem; margin: 0.9rem 0 0.3rem; }
    .meta { color: #333; font-size: 0.88rem; }
    .badge { display: inline-block; border-radius: 0.8rem; padding: 0.05rem 0.55rem; font-size: 0.8rem; font-weight: 600; background: #e6ecf2; color: #124; margin-right: 0.3rem; }
    .badge.edit { background: #fdecc8; color: #6a4200; }
    .caution { border: 2px solid #b60; background: #fff6e8; border-radius: 6px; padding: 0.5rem 0.7rem; margin: 0.7rem 0; font-size: 0.9rem; }
    .caution summary { cursor: pointer; list-style-position: outside; margin-left: 1rem; }
    .caution summary .more { color: #6a4200; text-decoration: underline; white-space: nowrap; }
    .caution ul { margin: 0.4rem 0 0; padding-left: 1.1rem; }
    .scroll { overflow-x: auto; -webkit-overflow-scrolling: touch; }
    /* The well id stays in view while a wide table scrolls sideways. */
    .sticky { position: sticky; left: 0; z-index: 1; background: #fff; box-shadow: 1px 0 0 #d5dbe1; }
    thead th { z-index: 1; }
    thead th.sticky { background: #eef2f6; z-index: 3; }
    table.kv th, table.kv td { white-space: normal; }
    tr.selected .sticky { background: #ffe8c8; }
    .plan-key { list-style: none; margin: 0.4rem 0; padding: 0; display: flex; flex-wrap: wrap; gap: 0.2rem 0.9rem; font-size: 0.85rem; }
    .plan-key li { display: flex; align-items: center; gap: 0.3rem; }
    .plan-key svg { width: 22px; height: 14px; flex: none; }
    .dd-floor-check { margin: 0.5rem 0 1rem; }
    .dd-floor-check h4 { margin: 0.6rem 0 0.3rem; font-size: 0.98rem; }
    .dd-design-kv { display: grid; grid-template-columns: minmax(8rem, 45%) 1fr; gap: 0.2rem 0.6rem; margin: 0.3rem 0; font-size: 0.9rem; }
    .dd-design-kv dt { font-weight: 600; } .dd-design-kv dd { margin: 0; }
    .dd-yes { color: #060; font-weight: 600; } .dd-no { color: #a00; font-weight: 600; } .dd-warn { color: #b60; font-weight: 600; }
    .dd-safe-dig-chart { width: 100%; max-width: 26rem; height: auto; display: block; }
    .dd-safe-dig-chart .dd-grid { stroke: #e3e6ea; } .dd-safe-dig-chart .dd-tick { font-size: 10px; fill: #444; }
    .dd-safe-dig-chart .dd-formation-line { stroke: #8a5a00; } .dd-safe-dig-chart .dd-safe-dig-line { stroke: #1f5fa8; stroke-width: 2; }
    .dd-safe-dig-table { max-width: 26rem; }
    table { border-collapse: collapse; width: 100%; font-size: 0.88rem; font-variant-numeric: tabular-nums; }
    th, td { border-bottom: 1px solid #d5dbe1; padding: 0.35rem 0.4rem; text-align: left; white-space: nowrap; }
    thead th { background: #eef2f6; position: sticky; top: 0; }
    tr.selected td { background: #ffe8c8; }
    button, select, input { font: inherit; min-height: 2.6rem; }
    button { border: 1px solid #124; background: #124; color: #fff; border-radius: 6px; padding: 0 0.9rem; cursor: pointer; }
    button.secondary { background: #fff; color: #124; }
    .row { display: flex; flex-wrap: wrap; gap: 0.5rem; align-items: center; margin: 0.5rem 0; }
    .ok { color: #060; font-weight: 600; } .bad { color: #a00; font-weight: 600; } .alert { color: #b60; font-weight: 600; }
    .note { font-size: 0.85rem; color: #444; }
    .downloads a { display: inline-block; margin: 0.2rem 0.6rem 0.2rem 0; color: #124; }
    form.reading { display: grid; gap: 0.5rem; grid-template-columns: 1fr; max-width: 28rem; background: #f4f6f8; padding: 0.7rem; border-radius: 6px; }
    form.reading label { display: grid; gap: 0.15rem; font-size: 0.88rem; }
    .error { border: 2px solid #a00; background: #fdeeee; padding: 0.7rem; border-radius: 6px; }
    @media (min-width: 46rem) { form.reading { grid-template-columns: 1fr 1fr; } }
  `;

  constructor() {
    super();
    this.token = null;
    this.view = null;
    this.monitoring = null;
    this.error = '';
    this.position = null;
    this.positionNote = '';
    this.selected = -1;
    this.readingNote = '';
    this.busy = false;
  }

  override connectedCallback(): void {
    super.connectedCallback();
    this.token ??= tokenFromLocation(window.location);
    void this.load();
  }

  override disconnectedCallback(): void {
    super.disconnectedCallback();
    if (this.watchId !== null) navigator.geolocation.clearWatch(this.watchId);
    this.watchId = null;
  }

  private get api(): SiteApi | null {
    return this.token ? new SiteApi(this.token) : null;
  }

  private async load(): Promise<void> {
    const api = this.api;
    if (!api) {
      this.error = 'This address does not contain a share link. Ask the designer for the link to this site.';
      return;
    }
    try {
      const [view, monitoring] = await Promise.all([api.view(), api.monitoring()]);
      this.view = view;
      this.monitoring = monitoring;
      this.error = '';
      document.title = `${view.scenario.name} — site view`;
    } catch (e) {
      this.error = (e as Error).message;
    }
  }

  private togglePosition(): void {
    if (this.watchId !== null) {
      navigator.geolocation.clearWatch(this.watchId);
      this.watchId = null;
      this.position = null;
      this.positionNote = '';
      return;
    }
    const v = this.view;
    if (!v) return;
    const projection = resolveSiteProjection({ crs: v.scenario.crs, proj4: v.scenario.proj4 });
    if (!projection.ok) {
      this.positionNote = `Your position cannot be shown: ${projection.message}`;
      return;
    }
    if (!('geolocation' in navigator)) {
      this.positionNote = 'This browser does not give a position.';
      return;
    }
    this.positionNote = 'Waiting for a position…';
    this.watchId = navigator.geolocation.watchPosition(
      (p) => {
        const [x, y] = projection.fromLonLat(p.coords.longitude, p.coords.latitude);
        this.position = { x, y, accuracy_m: p.coords.accuracy };
        const nearest = findNearestWell(x, y, v.scenario.wells);
        this.positionNote = `You: E ${f(x, 1)}, N ${f(y, 1)} (± ${f(p.coords.accuracy, 0)} m, phone GPS — not survey accuracy).` +
          (nearest ? ` Nearest well: no. ${nearest.index + 1} (${nearest.id}), ${f(nearest.distance_m, 1)} m at grid bearing ${f(nearest.bearing_deg, 0)}°.` : '');
      },
      (err) => {
        this.positionNote = `No position: ${err.message || 'permission refused'}.`;
        if (this.watchId !== null) navigator.geolocation.clearWatch(this.watchId);
        this.watchId = null;
      },
      { enableHighAccuracy: true, maximumAge: 5000, timeout: 30000 },
    );
  }

  private async submitReading(event: Event): Promise<void> {
    event.preventDefault();
    const api = this.api;
    const form = event.target as HTMLFormElement;
    const data = new FormData(form);
    const level = Number(String(data.get('level_m') ?? '').replace(',', '.'));
    const when = String(data.get('measuredAt') ?? '');
    if (!api) return;
    if (!Number.isFinite(level)) {
      this.readingNote = 'Enter the level as a number in metres above site datum (e.g. 6.42).';
      return;
    }
    const measured = when ? new Date(when) : new Date();
    if (!Number.isFinite(measured.getTime())) {
      this.readingNote = 'Enter when the reading was taken.';
      return;
    }
    this.busy = true;
    try {
      await api.addReading({
        piezometerId: String(data.get('piezometerId') ?? ''),
        level_m: level,
        measuredAt: measured.toISOString(),
        enteredBy: String(data.get('enteredBy') ?? '').slice(0, 200) || undefined,
      });
      form.reset();
      // Say "saved" only once the reading is in the table and on the chart.
      this.monitoring = await api.monitoring();
      this.readingNote = 'Reading saved.';
    } catch (e) {
      this.readingNote = `Not saved: ${(e as Error).message}`;
    } finally {
      this.busy = false;
    }
  }

  override render() {
    if (this.error) return html`<div class="error" role="alert"><strong>Cannot open this site view.</strong><br />${this.error}</div>`;
    const v = this.view;
    if (!v) return html`<p>Loading the site plan…</p>`;
    const s = v.scenario;
    const pinned = v.link.pinnedRevision !== null;
    const shortfall = excavationShortfalls(v.design, v.excavationChecks);
    return html`
      <header>
        <h1>${s.name}</h1>
        <div class="meta">
          <span class="badge ${v.canEdit ? 'edit' : ''}">${v.canEdit ? 'edit link — readings allowed' : 'view only'}</span>
          <span class="badge ${v.issued ? 'issued' : ''}" data-revision-status=${v.issued ? 'issued' : 'saved'}>${revisionBadge({ revision: v.revision.revision, issued: v.issued, pinned })}</span><br />
          Saved ${new Date(v.revision.savedAt).toLocaleString()}${v.revision.savedBy ? ` by ${v.revision.savedBy}` : ''}.
          ${describeRevisionStatus({ revision: v.revision.revision, issued: v.issued, formatTime: (t) => new Date(t).toLocaleString() })}
          Coordinates: ${v.crs ?? 'local site grid'}; levels m above site datum.
        </div>
      </header>
      <section class="caution" role="note" aria-label="Cautions"><details ?open=${this.wide}>
        <summary><strong>Cautions (${v.cautions.length}):</strong> estimates from idealised models; a licensed engineer must review. <span class="more">Read all</span></summary>
        <ul>${v.cautions.map((c) => html`<li>${c}</li>`)}</ul></details></section>

      <h2>Plan</h2>
      <div class="row">
        <button class="secondary" @click=${() => this.togglePosition()} aria-pressed=${this.watchId !== null ? 'true' : 'false'}>
          ${this.watchId !== null ? 'Hide my position' : 'Show my position'}</button>
        ${!v.georeferenced ? html`<span class="note">Local grid: the plan has no georeference, so a GPS position cannot be placed.</span>` : nothing}
      </div>
      ${this.positionNote ? html`<p class="note" aria-live="polite">${this.positionNote}</p>` : nothing}
      <site-plan .scenario=${s} .contours=${v.contours} .position=${this.position} .selected=${this.selected} .shortfall=${shortfall} .receptorVerdicts=${receptorVerdicts(v.design)}
        @well-picked=${(e: CustomEvent<{ index: number }>) => this.pickWell(e.detail.index)}></site-plan>
      ${this.renderKey(v, shortfall)}
      <p class="note">Wells are numbered as in the set-out table. Zoom with + / − or two fingers; drag to move a zoomed plan.
        ${v.contours ? html`Blue lines: computed groundwater level at ${days(v.contours.time_s)}.` : nothing}</p>

      <h2>Set-out table</h2>
      <div class="scroll"><table aria-label="Set-out table">
        <thead><tr><th class="sticky">No. · well</th><th>Kind</th><th>Easting m</th><th>Northing m</th>
          ${v.georeferenced ? html`<th>Latitude °</th><th>Longitude °</th>` : nothing}<th>Rate L/s</th><th>Screen top / bottom m</th></tr></thead>
        <tbody>${v.setout.map((r, i) => html`<tr class=${i === this.selected ? 'selected' : ''} id="well-row-${i}" @click=${() => this.pickWell(i)}>
          <th scope="row" class="sticky" data-well-id=${r.id}>${r.number} · ${r.id}</th><td>${r.kind}${r.active ? '' : ' (not pumped)'}</td><td>${f(r.easting_m, 3)}</td><td>${f(r.northing_m, 3)}</td>
          ${v.georeferenced ? html`<td>${f(r.latitude_deg, 7)}</td><td>${f(r.longitude_deg, 7)}</td>` : nothing}
          <td data-rate>${f(r.active ? r.rate_m3_s * 1000 : 0, 2)}${r.scheduled ? ' *' : ''}</td><td>${f(r.screenTop_m)} / ${f(r.screenBottom_m)}</td></tr>`)}</tbody>
      </table></div>
      <p class="note">Rates are this revision’s own, the same in the summary, the design check and the report.</p>
      ${v.setout.some((r) => r.scheduled) ? html`<p class="note">* rate changes over time; the first rate is shown and checked.</p>` : nothing}

      <h2>Design summary</h2>
      ${this.renderDesign(v)}

      <h2>Monitoring</h2>
      ${this.renderMonitoring(v)}

      <h2>Downloads</h2>
      <div class="downloads">
        <a href=${this.api?.exportUrl('setout-csv') ?? '#'} download>Set-out CSV</a>
        <a href=${this.api?.exportUrl('monitoring-csv') ?? '#'} download>Monitoring CSV</a>
        <a href=${this.api?.exportUrl('report-html') ?? '#'} target="_blank" rel="noopener">Printable report</a>
        <a href=${this.api?.exportUrl('geojson') ?? '#'} download>GeoJSON</a>
        <a href=${this.api?.exportUrl('dxf') ?? '#'} download>DXF</a>
      </div>
      <p class="note">Scenario checksum ${v.revision.sha256.slice(0, 16)}… — the same number on the designer's copy means the same plan.
        Levels and design computed by ${v.computedBy}${v.frozenAt ? `, fixed ${new Date(v.frozenAt).toLocaleString()} with this revision` : ''}.</p>`;
  }

  private pickWell(index: number): void {
    this.selected = index;
    this.renderRoot.querySelector(`#well-row-${index}`)?.scrollIntoView({ block: 'nearest' });
  }

  private renderDesign(v: LinkView) {
    const s = v.scenario;
    // The one agreed set: the revision's rates, as in the set-out table.
    const total = v.setout.filter((r) => r.active).reduce((sum, r) => sum + r.rate_m3_s, 0);
    const d = v.design;
    return html`
      <table class="kv" aria-label="Design summary">
        <tr><th>Wells</th><td>${s.wells.length} (${s.wells.filter((w) => w.active !== false).length} pumping)</td></tr>
        <tr><th>Total pumping rate</th><td data-total-rate>${f(total * 1000, 1)} L/s (this revision’s rates)</td></tr>
        <tr><th>Design time</th><td>${days(s.design.time_s)}</td></tr>
        ${d ? html`<tr><th>Design check of these rates</th><td class=${d.feasible ? 'ok' : 'bad'}>${d.feasible ? 'targets met' : 'targets NOT met'}</td></tr>
          <tr><th>Pumps</th><td>${d.summary.dutyPumps} duty + ${d.summary.standbyPumps} standby</td></tr>` : nothing}
      </table>
      <h3>Excavations</h3>
      <div class="scroll"><table>
        <thead><tr><th class="sticky">Excavation</th><th>Formation m</th><th>Target m</th><th>Highest level inside m</th><th>Check</th></tr></thead>
        <tbody>${s.excavations.map((e) => {
          const designed = d?.excavations.find((x) => x.id === e.id);
          const grid = v.excavationChecks.find((x) => x.id === e.id);
          const over = designed ? designed.worstShortfall_m : grid?.shortfall_m ?? null;
          const highest = designed ? designed.critical.level_m : grid?.highestLevel_m ?? null;
          const target = designed ? designed.targetLevel_m : e.formationLevel_m - e.margin_m;
          return html`<tr><th scope="row" class="sticky">${e.id}</th><td>${f(e.formationLevel_m)}</td><td>${f(target)}</td><td>${f(highest)}</td>
            <td class=${over === null ? '' : over > 0 ? 'bad' : 'ok'}>${over === null ? '—' : over > 0 ? `${f(over)} m above target` : 'below target'}</td></tr>`;
        })}</tbody></table></div>
      ${d?.reasons.length ? html`<ul class="bad">${d.reasons.map((r) => html`<li>${r.message}</li>`)}</ul>` : nothing}
      ${d ? html`<floor-check-view .excavations=${d.excavations}></floor-check-view>` : nothing}
      ${d?.receptors?.length ? unsafeHTML(writeReceptorTableHtml(d)) : nothing}
      ${v.computeError ? html`<p class="bad">Levels could not be computed: ${v.computeError}</p>` : nothing}
      ${!d ? html`<p class="note">No design check is available${v.designError ? `: ${v.designError}` : ''}; the rates shown are the plan's own.</p>` : nothing}
      ${v.flagCounts && Object.values(v.flagCounts).some((n) => n > 0)
        ? html`<p class="alert">Parts of the plan lie outside a method's comfortable validity (${Object.entries(v.flagCounts).filter(([, n]) => n > 0).map(([k]) => k).join(', ')}); treat levels there with care.</p>`
        : nothing}
      ${v.modelNotes.length ? html`<details><summary>Model assumptions (${v.modelNotes.length})</summary><ul class="note">${v.modelNotes.map((n) => html`<li>${n}</li>`)}</ul></details>` : nothing}`;
  }

  /** The key: the symbols this plan shows, drawn from the one plan symbol set. */
  private renderKey(v: LinkView, shortfall: Record<string, ShortfallAreaKind>) {
    const s = v.scenario;
    const keys = planSymbolKeys({
      wells: s.wells, piezometerCount: (s as { monitoring?: { piezometers: unknown[] } }).monitoring?.piezometers.length ?? 0,
      excavationCount: s.excavations.length, boundaryKinds: (s.boundaries ?? []).map((b) => b.kind), shortfallKinds: Object.values(shortfall),
      receptorTypes: getReceptors(s).map((r) => r.geometry.type),
    });
    return html`<ul class="plan-key" aria-label="Key">${keys.map((k) => html`<li data-symbol=${k}>${unsafeSVG(planSymbolSwatchSvg(k))}${PLAN_SYMBOL_LABELS[k]}</li>`)}</ul>`;
  }

  private renderMonitoring(v: LinkView) {
    const m = this.monitoring;
    if (!m) return html`<p>Loading…</p>`;
    if (m.error) return html`<p class="bad">Expected levels could not be computed: ${m.error}</p>`;
    if (!m.present) return html`<p class="note">The designer has not placed monitoring piezometers in this plan.</p>`;
    return html`
      ${m.notes.map((n) => html`<p class="note">${n}</p>`)}
      ${m.piezometers.map((p) => html`
        <h3>${p.id}${p.label ? ` — ${p.label}` : ''}</h3>
        <p class="note">E ${f(p.x, 2)}, N ${f(p.y, 2)}. Alert above expected + ${f(p.alertOffset_m)} m;
          action above ${p.actionLevel_m === null ? '— (none set)' : `${f(p.actionLevel_m)} m`}${p.actionSource === 'excavation-target' ? ` (target of ${p.excavationId})` : ''}
          ${p.actionFrom_s > 0 ? ` from day ${f(p.actionFrom_s / 86400, 0)}` : ''}.</p>
        <site-level-chart .piezometer=${p}></site-level-chart>
        <details><summary>Expected levels (${p.series.length} rows)</summary><div class="scroll"><table>
          <thead><tr><th>Day</th><th>Date</th><th>Expected m</th><th>Alert m</th><th>Action m</th></tr></thead>
          <tbody>${p.series.map((r) => html`<tr><td>${r.time_s === null ? 'steady' : f(r.time_s / 86400, 1)}</td><td>${r.at ? new Date(r.at).toLocaleDateString() : '—'}</td>
            <td>${f(r.expectedLevel_m)}</td><td>${f(r.alertLevel_m)}</td><td>${f(r.actionLevel_m)}</td></tr>`)}</tbody></table></div></details>
        ${p.readings.length ? html`<div class="scroll"><table aria-label="Readings at ${p.id}">
          <thead><tr><th>Read</th><th>Level m</th><th>Expected m</th><th>Difference m</th><th>Status</th></tr></thead>
          <tbody>${p.readings.map((r) => html`<tr><td>${new Date(r.measuredAt).toLocaleString()}</td><td>${f(r.level_m)}</td><td>${f(r.expectedLevel_m)}</td>
            <td>${r.departure_m >= 0 ? '+' : ''}${f(r.departure_m)}</td><td class=${r.status === 'ok' ? 'ok' : r.status === 'alert' ? 'alert' : 'bad'}>${r.status.toUpperCase()}</td></tr>`)}</tbody></table></div>` : nothing}`)}
      ${v.canEdit ? this.renderReadingForm(m) : html`<p class="note">Readings are entered through an edit link.</p>`}`;
  }

  private renderReadingForm(m: MonitoringPlan) {
    const local = new Date(Date.now() - new Date().getTimezoneOffset() * 60000).toISOString().slice(0, 16);
    return html`<h3>Enter a reading</h3>
      <form class="reading" @submit=${(e: Event) => this.submitReading(e)}>
        <label>Piezometer<select name="piezometerId" required>${m.piezometers.map((p) => html`<option value=${p.id}>${p.id}</option>`)}</select></label>
        <label>Level (m above site datum)<input name="level_m" inputmode="decimal" required autocomplete="off" /></label>
        <label>Read at<input name="measuredAt" type="datetime-local" .value=${local} required /></label>
        <label>Your name<input name="enteredBy" maxlength="200" autocomplete="name" /></label>
        <div><button type="submit" ?disabled=${this.busy}>Save reading</button></div>
        ${this.readingNote ? html`<p class="note" aria-live="polite">${this.readingNote}</p>` : nothing}
      </form>`;
  }
}
if (!customElements.get('site-view')) customElements.define('site-view', SiteView);
