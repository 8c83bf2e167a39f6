/**
 * <logger-import-section>: logger readings into drydig. The designer opens a CSV, maps its
 * columns (time as ISO 8601 or elapsed; level, drawdown or pressure with the stated γw) with the
 * first rows in view, reads it — every bad line named — and sends the readings on: to the Test
 * tab as a pumping-test readings file, or to the stored scenario as a piezometer's site readings.
 */
import { html, nothing } from 'lit';
import { LightElement } from './light-element';
import type { Scenario } from '../../shared/schema';
import { DEFAULT_WATER_UNIT_WEIGHT_kN_m3, parseLoggerReadings, previewLoggerFile, sha256Hex, type LoggerColumnMapping, type LoggerReading } from '../../shared/import';
import { formatNumber, type DisplayUnits } from '../../shared/units';
import { getPiezometers } from '../state';
import { loggerToSiteReadings, loggerToTestCsv } from '../import';
import { parseDisplayNumber } from './unit-context';
import { IMPORT_WORDS } from './site-import-words';

/** Largest logger file opened, bytes. */
const MAX_LOGGER_BYTES = 8 * 1024 * 1024;
/** Most readings entered into the site record in one go (each is one request). */
const MAX_SITE_READINGS = 500;

type TimeFormat = LoggerColumnMapping['timeFormat'];
type ValueKind = LoggerColumnMapping['valueKind'];

export class LoggerImportSection extends LightElement {
  static override properties = {
    scenario: { attribute: false }, units: { attribute: false }, storedScenarioId: { attribute: false }, apiBase: { type: String },
    fileName: { state: true }, headers: { state: true }, sample: { state: true }, timeColumn: { state: true }, timeFormat: { state: true },
    valueColumn: { state: true }, valueKind: { state: true }, pressureUnit: { state: true }, sensorText: { state: true }, gammaText: { state: true },
    staticText: { state: true }, readings: { state: true }, distanceText: { state: true }, wellName: { state: true }, piezometer: { state: true },
    error: { state: true }, message: { state: true }, busy: { state: true },
  };
  declare scenario: Scenario | undefined;
  declare units: DisplayUnits;
  /** The stored scenario's id, when the editor holds one (site readings belong to it). */
  declare storedScenarioId: (() => string | null) | undefined;
  declare apiBase: string;
  declare fileName: string;
  declare headers: string[];
  declare sample: string[][];
  declare timeColumn: string;
  declare timeFormat: TimeFormat;
  declare valueColumn: string;
  declare valueKind: ValueKind;
  declare pressureUnit: NonNullable<LoggerColumnMapping['pressureUnit']>;
  declare sensorText: string;
  declare gammaText: string;
  declare staticText: string;
  declare readings: LoggerReading[] | null;
  declare distanceText: string;
  declare wellName: string;
  declare piezometer: string;
  declare error: string;
  declare message: string;
  declare busy: boolean;
  private text = '';

  constructor() {
    super();
    this.apiBase = '/api/v1';
    this.fileName = '';
    this.headers = [];
    this.sample = [];
    this.timeColumn = '';
    this.timeFormat = 'iso';
    this.valueColumn = '';
    this.valueKind = 'level';
    this.pressureUnit = 'kPa';
    this.sensorText = '';
    this.gammaText = String(DEFAULT_WATER_UNIT_WEIGHT_kN_m3);
    this.staticText = '';
    this.readings = null;
    this.distanceText = '';
    this.wellName = '';
    this.piezometer = '';
    this.error = '';
    this.message = '';
    this.busy = false;
  }

  private async open(input: HTMLInputElement): Promise<void> {
    const file = input.files?.[0];
    if (!file) return;
    if (file.size > MAX_LOGGER_BYTES) return void (this.error = `Logger file: ${file.name} is larger than 8 MB; thin the readings or split the file.`);
    this.text = await file.text();
    this.fileName = file.name;
    const { headers, sample } = previewLoggerFile(this.text, 6);
    this.headers = headers;
    this.sample = sample;
    this.readings = null;
    this.message = '';
    this.error = headers.length < 2 ? 'Logger file: it needs a header row naming at least a time and a value column.' : '';
    // First guesses from the header names; the designer checks them in the mapping.
    this.timeColumn = headers.find((h) => /time|date/i.test(h)) ?? headers[0] ?? '';
    const first = sample[0]?.[headers.indexOf(this.timeColumn)] ?? '';
    const suffix = /_(s|min|h|d)$/.exec(this.timeColumn)?.[1] as TimeFormat | undefined;
    this.timeFormat = /^\d{4}-\d{2}-\d{2}T/.test(first.trim()) ? 'iso' : suffix ?? 's';
    this.valueColumn = headers.find((h) => /level|drawdown|press|kpa/i.test(h)) ?? headers[1] ?? '';
    this.valueKind = /press|kpa/i.test(this.valueColumn) ? 'pressure' : /drawdown/i.test(this.valueColumn) ? 'drawdown' : 'level';
    this.wellName ||= file.name.replace(/\.[^.]+$/, '').slice(0, 30);
    if (this.staticText === '' && this.scenario) this.staticText = String(this.scenario.aquifer.staticLevel_m);
  }

  private mapping(): LoggerColumnMapping | string {
    const u = this.units.length;
    const m: LoggerColumnMapping = { time: this.timeColumn, timeFormat: this.timeFormat, value: this.valueColumn, valueKind: this.valueKind };
    if (this.valueKind === 'pressure') {
      const sensor = parseDisplayNumber(this.sensorText, u, 'sensor', 'Sensor level');
      if (!sensor.ok) return 'Sensor level: give the elevation of the transducer (a pressure column needs it).';
      m.sensorLevel_m = sensor.value_si;
      m.pressureUnit = this.pressureUnit;
      const g = Number(this.gammaText.replace(',', '.'));
      if (!Number.isFinite(g)) return `γw: "${this.gammaText}" is not a number.`;
      m.waterUnitWeight_kN_m3 = g;
    }
    if (this.valueKind !== 'drawdown' && this.staticText.trim() !== '') {
      const st = parseDisplayNumber(this.staticText, u, 'static', 'Static level');
      if (!st.ok) return `Static level: "${this.staticText}" is not a level.`;
      m.staticLevel_m = st.value_si;
    }
    return m;
  }

  private read(): void {
    const m = this.mapping();
    if (typeof m === 'string') return void (this.error = m);
    try {
      this.readings = parseLoggerReadings(this.text, m);
      this.error = '';
    } catch (error) {
      this.readings = null;
      this.error = (error as Error).message.replace(/^logger file: /, 'Logger file: ');
    }
  }

  private toTest(): void {
    const r = this.readings;
    if (!r) return;
    const d = parseDisplayNumber(this.distanceText, this.units.length, 'distance', 'Distance');
    if (!d.ok || !(d.value_si > 0)) return void (this.error = 'Distance from the pumped well: give a distance above 0.');
    const { csv, rows, withoutDrawdown } = loggerToTestCsv(r, this.wellName, d.value_si);
    if (rows === 0) return void (this.error = 'No reading has a drawdown: give the static level (levels become drawdowns below it), or map a drawdown column.');
    this.error = '';
    this.emit('import-test-readings', { csv, name: `${this.fileName} (${this.wellName})` });
    this.message = `Sent ${rows} readings to the Test tab${withoutDrawdown ? ` (${withoutDrawdown} at t = 0 or without a drawdown left out)` : ''}.`;
  }

  private async toSite(): Promise<void> {
    const r = this.readings;
    const id = this.storedScenarioId?.() ?? null;
    if (!r) return;
    if (id === null) return void (this.error = 'Site readings belong to a stored scenario: save the scenario in the Store tab (signed in) first.');
    if (!this.piezometer) return void (this.error = 'Piezometer: choose which piezometer the logger sat in.');
    const rows = loggerToSiteReadings(r, this.piezometer).slice(0, MAX_SITE_READINGS);
    if (rows.length === 0) return void (this.error = 'No reading has a level: map a level or pressure column.');
    this.busy = true;
    this.error = '';
    try {
      const session = await fetch(`${this.apiBase}/auth/session`);
      const csrf = ((await session.json().catch(() => ({}))) as { csrfToken?: string }).csrfToken ?? '';
      const note = `logger ${this.fileName} sha256 ${sha256Hex(this.text).slice(0, 16)}`;
      let sent = 0;
      for (const row of rows) {
        const res = await fetch(`${this.apiBase}/scenarios/${id}/readings`, { method: 'POST', headers: { 'content-type': 'application/json', 'x-drydig-csrf': csrf }, body: JSON.stringify({ ...row, note }) });
        if (!res.ok) {
          const body = (await res.json().catch(() => ({}))) as { error?: { message?: string } };
          throw new Error(`reading ${sent + 1} was refused (${res.status}): ${body.error?.message ?? 'no message'}`);
        }
        sent++;
      }
      this.message = `Entered ${sent} readings for ${this.piezometer}${r.length > MAX_SITE_READINGS ? ` (the first ${MAX_SITE_READINGS}; thin the file for the rest)` : ''}.`;
    } catch (error) {
      this.error = `Site readings: ${(error as Error).message}.`;
    } finally {
      this.busy = false;
    }
  }

  override render() {
    const u = this.units;
    const r = this.readings;
    const select = (name: string, value: string, set: (v: string) => void) => html`<select name=${name} @change=${(e: Event) => ((set((e.target as HTMLSelectElement).value)), (this.readings = null))}>
      ${this.headers.map((h) => html`<option ?selected=${h === value}>${h}</option>`)}</select>`;
    const piezometers = this.scenario ? getPiezometers(this.scenario) : [];
    return html`<section class="dd-import-block" data-import="logger">
      <h3>Logger readings (CSV)</h3>
      <p class="dd-hint">${IMPORT_WORDS.loggerHint}</p>
      <label>Logger file <input type="file" name="import-logger" accept=".csv,.txt,text/csv" @change=${(e: Event) => this.open(e.target as HTMLInputElement)} /></label>
      ${this.headers.length > 0 ? html`
        <table class="dd-import-table" data-test="logger-preview"><thead><tr>${this.headers.map((h) => html`<th>${h}</th>`)}</tr></thead>
          <tbody>${this.sample.map((row) => html`<tr>${row.map((c) => html`<td>${c}</td>`)}</tr>`)}</tbody></table>
        <div class="dd-import-grid">
          <label>Time column ${select('logger-time', this.timeColumn, (v) => (this.timeColumn = v))}</label>
          <label>Time is <select name="logger-time-format" @change=${(e: Event) => ((this.timeFormat = (e.target as HTMLSelectElement).value as TimeFormat), (this.readings = null))}>
            ${(['iso', 's', 'min', 'h', 'd'] as const).map((f) => html`<option value=${f} ?selected=${f === this.timeFormat}>${f === 'iso' ? 'ISO 8601 date-time' : `elapsed, ${f}`}</option>`)}</select></label>
          <label>Value column ${select('logger-value', this.valueColumn, (v) => (this.valueColumn = v))}</label>
          <label>Value is <select name="logger-kind" @change=${(e: Event) => ((this.valueKind = (e.target as HTMLSelectElement).value as ValueKind), (this.readings = null))}>
            ${(['level', 'drawdown', 'pressure'] as const).map((k) => html`<option value=${k} ?selected=${k === this.valueKind}>${k === 'level' ? 'water level (m)' : k === 'drawdown' ? 'drawdown (m)' : 'pressure on a submerged sensor'}</option>`)}</select></label>
          ${this.valueKind === 'pressure' ? html`
            <label>Pressure unit <select name="logger-pressure-unit" @change=${(e: Event) => (this.pressureUnit = (e.target as HTMLSelectElement).value as typeof this.pressureUnit)}>
              ${(['kPa', 'Pa', 'bar', 'mH2O'] as const).map((p) => html`<option ?selected=${p === this.pressureUnit}>${p}</option>`)}</select></label>
            <label>Sensor level (${u.length}) <input name="logger-sensor" inputmode="decimal" .value=${this.sensorText} @change=${(e: Event) => (this.sensorText = (e.target as HTMLInputElement).value)} /></label>
            <label title="Unit weight of water for pressure → head; 9.81 kN/m³ is fresh water (common practice)">γw (kN/m³) <input name="logger-gamma" inputmode="decimal" .value=${this.gammaText} @change=${(e: Event) => (this.gammaText = (e.target as HTMLInputElement).value)} /></label>` : nothing}
          ${this.valueKind !== 'drawdown' ? html`<label>Static level (${u.length}) <input name="logger-static" inputmode="decimal" .value=${this.staticText} @change=${(e: Event) => (this.staticText = (e.target as HTMLInputElement).value)} /></label>` : nothing}
        </div>
        <div class="dd-actions"><button type="button" name="logger-read" @click=${() => this.read()}>Read with this mapping</button></div>` : nothing}
      ${this.error ? html`<p class="dd-error" role="alert" data-test="logger-error">${this.error}</p>` : nothing}
      ${r ? html`<div class="dd-import-preview" data-test="logger-readings">
        <p>${r.length} readings from ${formatNumber(r[0]?.time_s ?? 0, { significant: 4 })} s to ${formatNumber(r[r.length - 1]?.time_s ?? 0, { significant: 4 })} s${r[0]?.at ? ` (${r[0].at} to ${r[r.length - 1]!.at})` : ''};
          ${r.filter((x) => x.drawdown_m !== null).length} with a drawdown, ${r.filter((x) => x.level_m !== null).length} with a level.</p>
        <div class="dd-import-grid">
          <label>Observation well <input name="logger-well" .value=${this.wellName} @change=${(e: Event) => (this.wellName = (e.target as HTMLInputElement).value)} /></label>
          <label>Distance from the pumped well (${u.length}) <input name="logger-distance" inputmode="decimal" .value=${this.distanceText} @change=${(e: Event) => (this.distanceText = (e.target as HTMLInputElement).value)} /></label>
        </div>
        <div class="dd-actions"><button type="button" name="logger-to-test" @click=${() => this.toTest()}>Send to the Test tab</button></div>
        <div class="dd-import-grid">
          <label>Piezometer <select name="logger-piezometer" @change=${(e: Event) => (this.piezometer = (e.target as HTMLSelectElement).value)}>
            <option value="">choose…</option>${piezometers.map((p) => html`<option ?selected=${p.id === this.piezometer}>${p.id}</option>`)}</select></label>
        </div>
        <div class="dd-actions"><button type="button" name="logger-to-site" ?disabled=${this.busy} @click=${() => this.toSite()}>Enter as site readings</button></div>
      </div>` : nothing}
      ${this.message ? html`<p class="dd-ok" role="status" data-test="logger-sent">${this.message}</p>` : nothing}
    </section>`;
  }
}
if (!customElements.get('logger-import-section')) customElements.define('logger-import-section', LoggerImportSection);
