/**
 * <design-panel>: runs the design solver (POST /api/v1/design) for the scenario and shows the
 * answer: feasible / met badges, total flow, per-well rates and limits, pumps, power, energy,
 * discharge volume, quantities, the equivalent-well quick check, times to target, the recovery
 * after a power failure, a one-well-out check, a level-against-time chart at the critical point,
 * and the reasons and cautions. Exports CSV. Dispatches `design-result` (bubbles, composed;
 * detail = the result JSON) after each run, and again with `apply: true` from "Apply rates" — the
 * map marks the critical points and the app applies the rates.
 *
 * The solver runs on the server: its LP/MIP engine is a 3.5 MB WebAssembly module that the
 * browser bundle need not carry. CSV comes from the shared writer so it matches `drydig design --csv`.
 */
import { html, nothing, svg } from 'lit';
import { LightElement } from './light-element';
import type { DesignMode, Scenario } from '../../shared/schema';
// Deep imports on purpose: the design folder's index also exports the solver (and HiGHS).
import type { DesignResult } from '../../shared/design/design-result';
import { designResultToCsv } from '../../shared/design/design-csv';
import { linearScale, niceTicks } from './chart-axes';
import { formatDuration } from './time-format';
import { describeRecovery, RECOVERY_STANDBY_NOTE } from '../../shared/design/design-wording';
import './floor-check-view';
import './uncertainty-view';
import { CAUTION_TEXT } from './caution-note';
import { defaultDisplayUnits, formatQuantity, fromSi, toSi, type DisplayUnits, type FormatQuantityOptions, type UnitId } from '../../shared/units';

/** First letter upper case (a shared phrase opening a sentence). */
const capitalise = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);

/** The options the panel edits, in display units (converted to SI when the request is built). */
interface PanelOptions {
  controlSpacing_m: string;
  suctionLiftLimit_m: string;
  headerLevel_m: string;
  pumpEfficiency: string;
  safetyFactor: string;
  /** In the app's display rate unit, the unit flows are typed in everywhere else (well rates). */
  pumpCapacity_rate: string;
  energyPrice_per_kWh: string;
  wellCost: string;
  pumpedVolumeCost_per_m3: string;
  duration_d: string;
  outOfServiceWell: string;
}

const EMPTY_OPTIONS: PanelOptions = {
  controlSpacing_m: '', suctionLiftLimit_m: '', headerLevel_m: '', pumpEfficiency: '', safetyFactor: '', pumpCapacity_rate: '',
  energyPrice_per_kWh: '', wellCost: '', pumpedVolumeCost_per_m3: '', duration_d: '', outOfServiceWell: '',
};

/** The uncertainty settings the panel edits (design.md §8; blank = off or default). */
interface UnknownsOptions {
  sensitivity: boolean;
  /** Comma-separated factors; blank = 1/3, 1/2, 1, 2, 3. */
  sensitivityFactors: string;
  /** Monte Carlo realisations; blank = no Monte Carlo. */
  runs: string;
  seed: string;
  kSpread: string;
  priceAtP90: boolean;
  oneWellOut: boolean;
  kFactor: string;
}

const EMPTY_UNKNOWNS: UnknownsOptions = { sensitivity: false, sensitivityFactors: '', runs: '', seed: '', kSpread: '', priceAtP90: false, oneWellOut: false, kFactor: '' };

/** Polling interval of a design job's progress, ms. */
const JOB_POLL_MS = 400;

const MODE_TEXT: Record<DesignMode, string> = {
  uniform: 'One rate for every active well',
  optimal: 'Least total pumping, rate per well',
  layout: 'Choose wells to install (least cost)',
};

const STYLE = `
design-panel .dd-design-run { display: flex; gap: 8px; align-items: center; flex-wrap: wrap; margin: 8px 0; }
design-panel .dd-design-progress { display: inline-flex; gap: 6px; align-items: center; color: var(--ink-2); }
design-panel .dd-design-progress progress { width: 90px; }
design-panel .dd-design-verdict { font-weight: 700; padding: 6px 10px; border-radius: var(--radius); margin: 8px 0 4px; }
design-panel .dd-design-verdict.dd-yes { background: #eef8f4; color: #00604c; border-left: 5px solid var(--met); }
design-panel .dd-design-verdict.dd-no { background: #fff4ec; color: #a33b00; border-left: 5px solid var(--short); }
design-panel .dd-design-kv { display: grid; grid-template-columns: minmax(120px, 1fr) minmax(0, 1.4fr); gap: 2px 10px; margin: 4px 0; font-variant-numeric: tabular-nums; }
design-panel .dd-design-kv dt { color: var(--ink-2); }
design-panel .dd-design-kv dd { margin: 0; text-align: right; font-weight: 600; }
design-panel .dd-design-table { width: 100%; border-collapse: collapse; font-size: 12px; font-variant-numeric: tabular-nums; }
design-panel .dd-design-table th { text-align: right; font-weight: 500; color: var(--ink-2); border-bottom: 1px solid var(--rule); }
design-panel .dd-design-table td { text-align: right; border-bottom: 1px dotted var(--rule); padding: 1px 3px; }
design-panel .dd-design-table th:first-child, design-panel .dd-design-table td:first-child { text-align: left; }
design-panel .dd-design-wells { max-height: 260px; overflow: auto; border: 1px solid var(--rule); border-radius: var(--radius); background: #fff; }
design-panel .dd-chart .dd-recovery { fill: none; stroke: var(--short); stroke-width: 1.8; stroke-dasharray: 6 3; }
design-panel .dd-chart .dd-formation { stroke: #6b4f2a; stroke-dasharray: 2 3; stroke-width: 1.2; }
design-panel .dd-k-recovery { border-top-style: dashed; border-color: var(--short); }
design-panel .dd-k-formation { border-top-style: dotted; border-color: #6b4f2a; }
design-panel .dd-design-options { display: grid; grid-template-columns: 1fr 1fr; gap: 6px 8px; }
design-panel .dd-design-progress progress[value] { width: 140px; }
design-panel .dd-sens-conductivity { stroke: #0b5cad; fill: #0b5cad; stroke-width: 1.8; }
design-panel path.dd-sens-conductivity, design-panel path.dd-sens-storage { fill: none; }
design-panel .dd-sens-storage { stroke: #8a4f00; fill: #8a4f00; stroke-width: 1.8; stroke-dasharray: 5 3; }
design-panel circle.dd-sens-short { fill: #fff; }
design-panel .dd-sens-none { fill: var(--short); font-size: 11px; }
design-panel .dd-k-sens-conductivity { border-color: #0b5cad; }
design-panel .dd-k-sens-storage { border-color: #8a4f00; border-top-style: dashed; }
design-panel .dd-hist-bar { fill: #7fa9d6; }
design-panel .dd-hist-mark { stroke: #22313f; stroke-dasharray: 3 2; stroke-width: 1.2; }
design-panel .dd-hist-design { stroke: var(--met); stroke-dasharray: none; }
`;

const num = (v: number | null | undefined, digits = 3) => (v === null || v === undefined || !Number.isFinite(v) ? '—' : String(Number(v.toPrecision(digits))));
const fixed = (v: number | null | undefined, decimals = 2) => (v === null || v === undefined || !Number.isFinite(v) ? '—' : v.toFixed(decimals));
const money = (v: number) => (Number.isFinite(v) ? Math.round(v).toLocaleString('en-GB') : '—');

/** An SI value in a display unit, '—' when absent; a plain space before the unit, as the panel's other figures. */
function inUnit(value_si: number | null | undefined, unit: UnitId, options: Pick<FormatQuantityOptions, 'significant' | 'decimals'> = {}): string {
  if (value_si === null || value_si === undefined) return `— ${unit}`;
  return `${formatQuantity(value_si, unit, { ...options, withUnit: false })} ${unit}`;
}

/**
 * Whether two scenarios pose the same design problem: identical but for `view` (display units,
 * contour settings), compared by reference so any doubt counts as a change and marks the result stale.
 */
function sameDesignInput(a: Scenario | undefined, b: Scenario | undefined): boolean {
  if (a === b) return true;
  if (!a || !b) return false;
  const ra = a as Record<string, unknown>;
  const rb = b as Record<string, unknown>;
  const keys = new Set([...Object.keys(ra), ...Object.keys(rb)]);
  keys.delete('view');
  for (const k of keys) if (ra[k] !== rb[k]) return false;
  return true;
}

/** True when the display rate unit is metric: the panel then gives L/s with m³/h, the two units pumps are sized in. */
const isMetricRate = (units: DisplayUnits) => units.rate !== 'gpm';

export class DesignPanel extends LightElement {
  static override properties = {
    scenario: { attribute: false },
    units: { attribute: false },
    apiBase: { type: String },
    mode: { state: true },
    options: { state: true },
    running: { state: true },
    elapsed_s: { state: true },
    result: { state: true },
    error: { state: true },
    stale: { state: true },
    unknowns: { state: true },
    progressFraction: { state: true },
    progressStage: { state: true },
  };
  declare scenario: Scenario | undefined;
  /** Display units for flows, heads, levels and lengths (the app's choice). Default SI. */
  declare units: DisplayUnits;
  /** Prefix of the HTTP API (same origin by default). */
  declare apiBase: string;
  declare mode: DesignMode;
  declare options: PanelOptions;
  declare running: boolean;
  declare elapsed_s: number;
  declare result: DesignResult | null;
  declare error: string;
  /** The scenario changed since the result was computed. */
  declare stale: boolean;
  declare unknowns: UnknownsOptions;
  /** Progress of a design job (null: a plain run, no measured progress). */
  declare progressFraction: number | null;
  declare progressStage: string;
  private jobId: string | null = null;
  private abort: AbortController | null = null;
  private timer: ReturnType<typeof setInterval> | null = null;
  private resultFor: Scenario | undefined;

  constructor() {
    super();
    this.scenario = undefined;
    this.units = defaultDisplayUnits('si');
    this.apiBase = '';
    this.mode = 'optimal';
    this.options = { ...EMPTY_OPTIONS };
    this.running = false;
    this.elapsed_s = 0;
    this.result = null;
    this.error = '';
    this.stale = false;
    this.unknowns = { ...EMPTY_UNKNOWNS };
    this.progressFraction = null;
    this.progressStage = '';
  }

  override disconnectedCallback(): void {
    super.disconnectedCallback();
    this.abort?.abort();
    if (this.timer !== null) clearInterval(this.timer);
    this.timer = null;
  }

  /** A flow: L/s (m³/h) in metric units, else the display rate unit (gpm). */
  private flow(q_m3_s: number): string {
    return isMetricRate(this.units) ? `${inUnit(q_m3_s, 'L/s')} (${inUnit(q_m3_s, 'm³/h')})` : inUnit(q_m3_s, this.units.rate);
  }

  /** A level or head in the display length unit, to `decimals` places. */
  private length(value_m: number | null | undefined, decimals: number): string {
    return inUnit(value_m, this.units.length, { decimals });
  }

  /** A site coordinate in the site grid's unit (a CRS keeps its own), as the map's read-out gives it (no unit label). */
  private coordinate(value_m: number): string {
    return fixed(fromSi(value_m, this.units.coordinate), 1);
  }

  /** A small signed level difference: centimetres in metric units, else the display length unit. */
  private shortfall(value_m: number, signed: boolean): string {
    const sign = signed && value_m > 0 ? '+' : '';
    return this.units.length === 'm' ? `${sign}${fixed(value_m * 100, 1)} cm` : `${sign}${inUnit(value_m, this.units.length, { decimals: 2 })}`;
  }

  protected override willUpdate(changed: Map<string, unknown>): void {
    if (changed.has('scenario') && this.result !== null) this.stale = !sameDesignInput(this.scenario, this.resultFor);
  }

  /** Options to send: only the fields the user filled in, converted to SI; a bad entry is reported, not guessed. */
  private buildOptions(): { ok: true; options: Record<string, unknown> } | { ok: false; message: string } {
    const o = this.options;
    const out: Record<string, unknown> = {};
    const fields: Array<[keyof PanelOptions, string, number, string]> = [
      ['controlSpacing_m', 'controlSpacing_m', 1, 'control spacing'],
      ['suctionLiftLimit_m', 'suctionLiftLimit_m', 1, 'suction-lift limit'],
      ['headerLevel_m', 'headerLevel_m', 1, 'header level'],
      ['pumpEfficiency', 'pumpEfficiency', 1, 'pump efficiency'],
      ['safetyFactor', 'safetyFactor', 1, 'safety factor'],
      ['pumpCapacity_rate', 'pumpCapacity_m3_s', toSi(1, this.units.rate), 'pump capacity'],
      ['energyPrice_per_kWh', 'energyPrice_per_kWh', 1, 'energy price'],
      ['wellCost', 'wellCost', 1, 'cost per well'],
      ['pumpedVolumeCost_per_m3', 'pumpedVolumeCost_per_m3', 1, 'cost per m³'],
      ['duration_d', 'duration_s', 86400, 'duration'],
    ];
    for (const [key, name, factor, words] of fields) {
      const text = o[key].trim();
      if (text === '') continue;
      const v = Number(text.replace(',', '.'));
      if (!Number.isFinite(v)) return { ok: false, message: `The ${words} "${text}" is not a number.` };
      out[name] = v * factor;
    }
    if (o.outOfServiceWell) out.outOfServiceWell = o.outOfServiceWell;
    const unknowns = this.buildUnknowns();
    if (!unknowns.ok) return unknowns;
    return { ok: true, options: { ...out, ...unknowns.options } };
  }

  /** The sensitivity, Monte Carlo and robust options from the panel's fields; a bad entry is reported by its label. */
  private buildUnknowns(): { ok: true; options: Record<string, unknown> } | { ok: false; message: string } {
    const u = this.unknowns;
    const out: Record<string, unknown> = {};
    const number = (text: string) => Number(text.trim().replace(',', '.'));
    if (u.sensitivity) {
      const text = u.sensitivityFactors.trim();
      if (text === '') out.sensitivity = {};
      else {
        // A list: commas, semicolons or spaces between factors; a fraction such as 1/3 is taken as one.
        const factors = text.split(/[;,\s]+/).filter(Boolean).map((t) => (t.includes('/') ? Number(t.split('/')[0]) / Number(t.split('/')[1]) : Number(t)));
        if (factors.some((f) => !(f > 0))) return { ok: false, message: `The sensitivity factors "${text}" must be positive numbers (e.g. 1/3, 0.5, 1, 2, 3).` };
        out.sensitivity = { factors };
      }
    }
    if (u.runs.trim() !== '') {
      const runs = number(u.runs);
      if (!Number.isInteger(runs) || runs < 1) return { ok: false, message: `The Monte Carlo runs "${u.runs}" must be a whole number of at least 1.` };
      const mc: Record<string, unknown> = { runs };
      if (u.seed.trim() !== '') {
        const seed = number(u.seed);
        if (!Number.isInteger(seed) || seed < 0) return { ok: false, message: `The seed "${u.seed}" must be a whole number of 0 or more.` };
        mc.seed = seed;
      }
      if (u.kSpread.trim() !== '') {
        const f = number(u.kSpread);
        if (!(f >= 1)) return { ok: false, message: `The K spread "${u.kSpread}" must be a number of 1 or more (a factor).` };
        mc.kSpread = f;
      }
      if (u.priceAtP90) mc.priceAtP90 = true;
      out.monteCarlo = mc;
    }
    const robust: Record<string, unknown> = {};
    if (u.oneWellOut) robust.oneWellOut = true;
    if (u.kFactor.trim() !== '') {
      const f = number(u.kFactor);
      if (!(f >= 1)) return { ok: false, message: `The robust K factor "${u.kFactor}" must be a number of 1 or more.` };
      robust.conductivityFactor = f;
    }
    if (Object.keys(robust).length > 0) out.robust = robust;
    return { ok: true, options: out };
  }

  private async run(): Promise<void> {
    const scenario = this.scenario;
    if (!scenario || this.running) return;
    const built = this.buildOptions();
    if (!built.ok) {
      this.error = built.message;
      return;
    }
    this.error = '';
    this.running = true;
    this.elapsed_s = 0;
    const started = Date.now();
    this.timer = setInterval(() => (this.elapsed_s = Math.round((Date.now() - started) / 1000)), 500);
    this.abort = new AbortController();
    this.progressFraction = null;
    this.progressStage = '';
    const request = { scenario, mode: this.mode, ...(Object.keys(built.options).length > 0 ? { options: built.options } : {}) };
    try {
      // A Monte Carlo run is long: it runs as a job whose progress is polled and which Cancel stops on the server.
      const answer = built.options.monteCarlo ? await this.runJob(request, this.abort.signal) : await this.postJson('/api/v1/design', request, this.abort.signal);
      if (!answer.ok) {
        this.error = answer.message;
        return;
      }
      this.result = answer.body as DesignResult;
      this.resultFor = scenario;
      this.stale = false;
      this.emit('design-result', this.result);
    } catch (error) {
      this.error = (error as Error).name === 'AbortError' ? 'Design run cancelled.' : `The design service could not be reached (${(error as Error).message}).`;
    } finally {
      this.running = false;
      if (this.timer !== null) clearInterval(this.timer);
      this.timer = null;
      this.abort = null;
      this.jobId = null;
      this.progressFraction = null;
    }
  }

  /** POST (or another method) with JSON; the error body's message and fix in words when not ok. */
  private async postJson(path: string, body: unknown, signal: AbortSignal, method = 'POST'): Promise<{ ok: true; body: unknown } | { ok: false; message: string }> {
    const res = await fetch(`${this.apiBase}${path}`, {
      method,
      ...(body !== undefined ? { headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) } : {}),
      signal,
    });
    const text = await res.text();
    const parsed = text ? (JSON.parse(text) as unknown) : null;
    if (!res.ok) {
      const e = (parsed as { error?: { message?: string; fix?: string } } | null)?.error;
      return { ok: false, message: e?.message ? `${e.message}${e.fix ? `. ${e.fix}` : ''}` : `The design service answered ${res.status}.` };
    }
    return { ok: true, body: parsed };
  }

  /** Runs the design as a job: start it, poll its progress until it is done, failed or cancelled. */
  private async runJob(request: unknown, signal: AbortSignal): Promise<{ ok: true; body: unknown } | { ok: false; message: string }> {
    const started = await this.postJson('/api/v1/design/jobs', request, signal);
    if (!started.ok) return started;
    type JobView = { id: string; state: string; stage: string; fraction: number; result?: unknown; error?: { message: string; fix?: string } };
    let job = started.body as JobView;
    this.jobId = job.id;
    this.progressFraction = job.fraction;
    this.progressStage = job.stage;
    while (job.state === 'running') {
      await new Promise((resolve) => setTimeout(resolve, JOB_POLL_MS));
      if (signal.aborted) throw Object.assign(new Error('cancelled'), { name: 'AbortError' });
      const polled = await this.postJson(`/api/v1/design/jobs/${encodeURIComponent(job.id)}`, undefined, signal, 'GET');
      if (!polled.ok) return polled;
      job = polled.body as JobView;
      this.progressFraction = job.fraction;
      this.progressStage = job.stage;
    }
    if (job.state === 'done') return { ok: true, body: job.result };
    if (job.state === 'cancelled') return { ok: false, message: 'Design run cancelled.' };
    return { ok: false, message: job.error ? `${job.error.message}${job.error.fix ? `. ${job.error.fix}` : ''}` : 'The design job failed.' };
  }

  /** Cancel: stops the fetch, and a running job on the server too. */
  private cancel(): void {
    const id = this.jobId;
    if (id !== null) void fetch(`${this.apiBase}/api/v1/design/jobs/${encodeURIComponent(id)}`, { method: 'DELETE' }).catch(() => undefined);
    this.abort?.abort();
  }

  private setUnknown<K extends keyof UnknownsOptions>(key: K, value: UnknownsOptions[K]): void {
    this.unknowns = { ...this.unknowns, [key]: value };
  }

  /** The uncertainty settings: sensitivity table, Monte Carlo, robust designs. */
  private renderUnknowns() {
    const u = this.unknowns;
    const text = (key: 'sensitivityFactors' | 'runs' | 'seed' | 'kSpread' | 'kFactor', label: string, placeholder: string, unit = '') =>
      html`<label class="dd-field"><span>${label}</span><span class="dd-input-unit"><input type="text" inputmode="decimal" name=${`design-${key}`} placeholder=${placeholder} .value=${u[key]}
        @change=${(e: Event) => this.setUnknown(key, (e.target as HTMLInputElement).value)} /><em>${unit}</em></span></label>`;
    const check = (key: 'sensitivity' | 'priceAtP90' | 'oneWellOut', label: string) =>
      html`<label class="dd-check"><input type="checkbox" name=${`design-${key}`} .checked=${u[key]} @change=${(e: Event) => this.setUnknown(key, (e.target as HTMLInputElement).checked)} /> ${label}</label>`;
    const hasTest = (this.scenario as { pumpingTest?: { conductivityInterval_m_s?: unknown } } | undefined)?.pumpingTest?.conductivityInterval_m_s !== undefined;
    return html`<details class="dd-section-block" data-block="design-unknowns"><summary><h3>Unknowns <small>sensitivity, Monte Carlo, robust designs</small></h3></summary>
      <div class="dd-design-options">
        ${check('sensitivity', 'Sensitivity table (K and S scaled)')}
        ${text('sensitivityFactors', 'Factors', '1/3, 1/2, 1, 2, 3')}
        ${text('runs', 'Monte Carlo runs', 'off (e.g. 1000)')}
        ${text('seed', 'Seed', '1')}
        ${text('kSpread', 'K spread (geometric sd)', hasTest ? 'from the pumping test' : '2', '×')}
        ${check('priceAtP90', 'Price the bid at P90')}
        ${check('oneWellOut', 'Robust: any one well out')}
        ${text('kFactor', 'Robust: K ÷/× factor', 'off (e.g. 2)', '×')}
      </div>
      <p class="dd-hint">K lognormal around the scenario's K; a spread F puts 68 % of realisations between K/F and K·F. The default spread 2 is a placeholder of our own.</p>
    </details>`;
  }

  private applyRates(): void {
    if (!this.result) return;
    this.emit('design-result', { ...this.result, apply: true });
  }

  private exportCsv(): void {
    if (!this.result) return;
    const blob = new Blob([designResultToCsv(this.result)], { type: 'text/csv' });
    const a = document.createElement('a');
    a.href = URL.createObjectURL(blob);
    a.download = `${(this.scenario?.name ?? 'design').replace(/[^\w.-]+/g, '-').slice(0, 60)}-design.csv`;
    a.click();
    setTimeout(() => URL.revokeObjectURL(a.href), 1000);
  }

  private setOption(key: keyof PanelOptions, value: string): void {
    this.options = { ...this.options, [key]: value };
  }

  /** A blank field shows what the run will use: the scenario's stored designOptions value, else the default. */
  private field(key: keyof PanelOptions, label: string, unit: string, defaultText: string) {
    const stored = (this.scenario as { designOptions?: Record<string, unknown> } | undefined)?.designOptions?.[key];
    const placeholder = typeof stored === 'number' ? `${stored} (scenario)` : defaultText;
    return html`<label class="dd-field"><span>${label}</span><span class="dd-input-unit">
      <input type="text" inputmode="decimal" name=${`design-${key}`} placeholder=${placeholder} .value=${this.options[key]}
        @change=${(e: Event) => this.setOption(key, (e.target as HTMLInputElement).value)} /><em>${unit}</em></span></label>`;
  }

  override render() {
    const s = this.scenario;
    const r = this.result;
    return html`<div class="dd-design">
      <fieldset aria-label="Solve mode"><legend>Solve for</legend>
        ${(['uniform', 'optimal', 'layout'] as DesignMode[]).map(
          (m) => html`<label class="dd-check"><input type="radio" name="design-mode" value=${m} ?checked=${this.mode === m} @change=${() => (this.mode = m)} /> ${MODE_TEXT[m]}</label>`,
        )}
        ${this.mode === 'layout' ? html`<p class="dd-hint">Every well, active or not, is a candidate; the result says which to install.</p>` : nothing}
      </fieldset>
      <details class="dd-section-block"><summary><h3>Options <small>blank = default</small></h3></summary>
        <div class="dd-design-options">
          ${this.field('controlSpacing_m', 'Control spacing', 'm', 'auto')}
          ${this.field('suctionLiftLimit_m', 'Suction-lift limit', 'm', '5.5')}
          ${this.field('headerLevel_m', 'Header level', 'm', s ? String(s.groundLevel_m) : 'ground')}
          ${this.field('pumpEfficiency', 'Pump efficiency', '−', '0.6')}
          ${this.field('safetyFactor', 'Safety factor', '−', '1.25')}
          ${this.field('pumpCapacity_rate', 'Pump capacity', this.units.rate, formatQuantity(0.02, this.units.rate, { withUnit: false }))}
          ${this.field('duration_d', 'Duration', 'd', '90')}
          ${this.field('energyPrice_per_kWh', 'Energy price', '/kWh', '0.2')}
          ${this.field('wellCost', 'Cost per well', '', '5000')}
          ${this.field('pumpedVolumeCost_per_m3', 'Cost per m³', '/m³', '0.1')}
          <label class="dd-field"><span>Well out of service</span>
            <select name="design-out-of-service" @change=${(e: Event) => this.setOption('outOfServiceWell', (e.target as HTMLSelectElement).value)}>
              <option value="" ?selected=${this.options.outOfServiceWell === ''}>worst case</option>
              ${(s?.wells ?? []).filter((w) => w.active !== false).map((w) => html`<option value=${w.id} ?selected=${this.options.outOfServiceWell === w.id}>${w.id}</option>`)}
            </select></label>
        </div>
        <p class="dd-hint">Suction lift 5.5 m is common practice; prices and costs are placeholders until you enter your own.</p>
      </details>
      ${this.renderUnknowns()}
      <div class="dd-design-run">
        <button type="button" class="dd-primary" name="run-design" ?disabled=${!s || this.running} @click=${() => void this.run()}>${this.running ? 'Designing…' : 'Run design'}</button>
        ${this.running
          ? html`<span class="dd-design-progress" role="status">${this.progressFraction === null
                ? html`<progress aria-label="Design running"></progress>`
                : html`<progress aria-label="Design progress" max="1" .value=${this.progressFraction}></progress> <span data-progress-stage>${this.progressStage} (${Math.round(this.progressFraction * 100)} %)</span>`} ${this.elapsed_s} s
              <button type="button" class="dd-small" name="cancel-design" @click=${() => this.cancel()}>Cancel</button></span>`
          : nothing}
        ${r ? html`<button type="button" name="apply-rates" ?disabled=${this.running} @click=${() => this.applyRates()} title="Set each well's rate to the design rate (undo with Ctrl+Z)">Apply rates</button>
          <button type="button" name="export-design-csv" @click=${() => this.exportCsv()}>Export CSV</button>` : nothing}
      </div>
      ${this.error ? html`<p class="dd-error" role="alert">${this.error}</p>` : nothing}
      ${r ? this.renderResult(r) : html`<p class="dd-hint">Runs the design on the server: rates that bring every control point in each excavation to its target level at the design time, within each well's capacity and suction lift.</p>`}
      <div class="dd-caution" role="note"><strong>Caution.</strong> ${CAUTION_TEXT}</div>
    </div>`;
  }

  private renderResult(r: DesignResult) {
    const sm = r.summary;
    // Per-well rates stay in L/s with metric units: the figure a well point's pump is chosen by.
    const rateUnit: UnitId = isMetricRate(this.units) ? 'L/s' : this.units.rate;
    const lengthUnit = this.units.length;
    return html`
      ${this.stale ? html`<p class="dd-warn">The scenario has changed since this design was run: run it again before using the numbers.</p>` : nothing}
      <div class=${`dd-design-verdict ${r.feasible ? 'dd-yes' : 'dd-no'}`} role="status" data-feasible=${String(r.feasible)}>
        ${r.feasible ? '✓ Feasible: every target met' : '✗ Not feasible: see the reasons below'} <small>(${r.mode})</small>
      </div>
      <div class="dd-badges">
        ${r.excavations.map(
          (e) => html`<div class=${`dd-badge ${e.met ? 'dd-met' : 'dd-short'}`} data-excavation=${e.id}>
            <span class="dd-badge-icon" aria-hidden="true">${e.met ? '✓' : '!'}</span>
            <span class="dd-badge-text"><strong>${e.id}</strong>
              <span class="dd-badge-value">${e.met ? 'met' : 'not met'}, highest level ${this.length(e.critical.level_m, 2)} vs target ${this.length(e.targetLevel_m, 2)} (${this.shortfall(e.worstShortfall_m, true)})</span>
              <small>critical point (${this.coordinate(e.critical.x)}, ${this.coordinate(e.critical.y)}), ${e.critical.kind};
                ${e.timeToTarget_s !== null ? `target reached after ${formatDuration(e.timeToTarget_s)}` : r.designTime_s === null ? 'steady design' : 'target not reached by the design time'};
                <span data-recovery>power failure: ${describeRecovery(e, formatDuration)}</span></small></span>
          </div>`,
        )}
      </div>
      <floor-check-view .excavations=${r.excavations} .formatLength=${(v: number) => this.length(v, 2)}></floor-check-view>
      ${r.reasons.length > 0 ? html`<h3>Why not</h3><ul class="dd-flags">${r.reasons.map((x) => html`<li class="dd-flag" data-code=${x.code}><strong>${x.code}</strong> ${x.message}</li>`)}</ul>` : nothing}
      <h3>Flow and pumps</h3>
      <dl class="dd-design-kv">
        <dt>Total flow</dt><dd data-total>${this.flow(r.totalRate_m3_s)}</dd>
        <dt>Design flow (× ${num(sm.safetyFactor)})</dt><dd>${this.flow(sm.designFlow_m3_s)}</dd>
        ${sm.initialRate_m3_s !== null ? html`<dt>First ${formatDuration(sm.initialPeriod_s)} (storage draining)</dt><dd>${this.flow(sm.initialRate_m3_s)}</dd>` : nothing}
        ${sm.maxWellHead_m !== null ? html`<dt>Deep-well head (largest)</dt><dd>${this.length(sm.maxWellHead_m, 1)}</dd>` : nothing}
        ${sm.headerSystemHead_m !== null ? html`<dt>Header pump head</dt><dd>${this.length(sm.headerSystemHead_m, 1)}</dd>` : nothing}
        <dt>Hydraulic / input power</dt><dd>${num(sm.hydraulicPower_kW)} / ${num(sm.inputPower_kW)} kW</dd>
        <dt>Installed power (× safety factor)</dt><dd>${num(sm.installedPower_kW)} kW</dd>
        <dt>Pumps (${inUnit(sm.pumpCapacity_m3_s, this.units.rate)} each)</dt><dd>${sm.dutyPumps} duty + ${sm.standbyPumps} standby</dd>
        ${sm.undersizedPumpWellIds.length > 0 ? html`<dt class="dd-bad">Need a larger pump</dt><dd class="dd-bad">${sm.undersizedPumpWellIds.slice(0, 6).join(', ')}${sm.undersizedPumpWellIds.length > 6 ? '…' : ''}</dd>` : nothing}
        <dt>Energy over ${formatDuration(sm.duration_s)}</dt><dd>${money(sm.energy_kWh)} kWh</dd>
        <dt>Discharge volume (permit)</dt><dd data-volume>${money(fromSi(sm.dischargeVolume_m3, this.units.volume))} ${this.units.volume}</dd>
        <dt>Cost (${sm.currency}): energy + volume + wells</dt><dd data-cost>${money(sm.energyCost)} + ${money(sm.pumpedVolumeCost)} + ${money(sm.wellCost)} = ${money(sm.totalCost)} ${sm.currency}</dd>
        ${sm.idleWellIds.length > 0 ? html`<dt>Idle wells (may be omitted)</dt><dd data-idle-count>${sm.idleWellIds.length}: not in quantities or cost</dd>` : nothing}
        <dt>Quantities</dt><dd>${sm.quantities.wells} wells (${sm.quantities.wellsByKind.wellpoint} well points, ${sm.quantities.wellsByKind.deep} deep, ${sm.quantities.wellsByKind.ejector} ejectors), ${inUnit(sm.quantities.screen_m, this.units.length)} screen, ${inUnit(sm.quantities.header_m, this.units.length)} header</dd>
      </dl>
      <h3>Checks</h3>
      <dl class="dd-design-kv">
        ${r.quickCheck.map(
          (q) => html`<dt title=${q.note}>Equivalent well, ${q.excavationId}</dt><dd data-quick-check>${q.equivalentWellInflow_m3_s === null ? '—' : this.flow(q.equivalentWellInflow_m3_s)}; ratio ${num(q.ratio, 2)}</dd>`,
        )}
        ${r.outOfService
          ? html`<dt>${r.outOfService.wellId} out of service</dt><dd class=${r.outOfService.met ? 'dd-good' : 'dd-bad'}>${r.outOfService.met ? 'target still met' : `short by ${this.shortfall(r.outOfService.worstShortfall_m, false)}`}</dd>
            ${r.outOfService.chosenBy === 'option' ? html`<dt>Worst single well out</dt><dd>${r.outOfService.worstWellId}: ${this.shortfall(r.outOfService.worstWellShortfall_m, false)}</dd>` : nothing}`
          : nothing}
        ${r.chosenWellIds ? html`<dt>Chosen to install</dt><dd>${r.chosenWellIds.length} of ${r.wells.length}</dd>` : nothing}
      </dl>
      <uncertainty-view .result=${r} .formatFlow=${(q: number) => this.flow(q)} .formatShortfall=${(v: number) => this.shortfall(v, true)}></uncertainty-view>
      ${r.timeSeries ? this.renderChart(r) : nothing}
      <details class="dd-section-block"><summary><h3>Wells <small>${r.wells.filter((w) => w.rate_m3_s > 0).length} pumping</small></h3></summary>
        <div class="dd-design-wells"><table class="dd-design-table">
          <thead><tr><th>Well</th><th>${rateUnit}</th><th>cap. ${rateUnit}</th><th>use</th><th>pumping level ${lengthUnit}</th><th>limit</th></tr></thead>
          <tbody>${r.wells.map(
            (w) => html`<tr data-well=${w.id}><td>${w.id}${w.idle ? html` <small class="dd-idle" data-idle>${w.note ?? 'idle'}</small>` : w.installed ? '' : ' ·'}</td><td>${fixed(fromSi(w.rate_m3_s, rateUnit), 3)}</td><td>${fixed(fromSi(w.capacity_m3_s, rateUnit), 3)}</td>
              <td>${w.utilisation === null ? '—' : `${Math.round(w.utilisation * 100)} %`}</td><td>${fixed(fromSi(w.pumpingLevel_m, lengthUnit))}</td><td>${w.limit ?? ''}</td></tr>`,
          )}</tbody></table></div>
      </details>
      ${r.cautions.length > 0 ? html`<ul class="dd-flags">${r.cautions.map((c) => html`<li class="dd-flag">${c}</li>`)}</ul>` : nothing}
      <details class="dd-model-notes"><summary>Model assumptions (${r.modelNotes.length})</summary><ul>${r.modelNotes.map((n) => html`<li>${n}</li>`)}</ul></details>`;
  }

  /** Level against log time at the critical point: pumping on; then, on its own time axis, recovery after every pump stops. */
  private renderChart(r: DesignResult) {
    const ts = r.timeSeries!;
    const pumping = ts.pumping.filter((p) => p.time_s > 0);
    const stop_s = ts.stop_s ?? 0;
    const recovery = ts.recovery.filter((p) => p.time_s > stop_s).map((p) => ({ time_s: p.time_s - stop_s, level_m: p.level_m }));
    const excavation = r.excavations.find((e) => e.id === ts.excavationId);
    const recoveryAt = excavation?.recoveryToFormation_s ?? null;
    return html`<h3>Level at the critical point <small>${ts.excavationId} (${this.coordinate(ts.x)}, ${this.coordinate(ts.y)})</small></h3>
      ${this.logChart(pumping, 'dd-curve', 'time since pumping started (log)', ts, r.designTime_s, 'Level against time at the critical point, pumping on')}
      <ul class="dd-section-key">
        <li><span class="dd-k dd-k-water"></span>pumping on</li>
        <li><span class="dd-k dd-k-target"></span>target</li>
        <li><span class="dd-k dd-k-formation"></span>formation level</li>
      </ul>
      ${recovery.length > 1
        ? html`<h3>Power failure <small>every pump stops at ${ts.stop_s === null ? 'the steady state' : formatDuration(ts.stop_s)}</small></h3>
          ${this.logChart(recovery, 'dd-recovery', 'time since the pumps stopped (log)', ts, recoveryAt, 'Recovery of the level at the critical point after every pump stops')}
          <p class="dd-chart-note">${capitalise(describeRecovery(excavation ?? { recoveryToFormation_s: null, recoveryNote: null }, formatDuration))}${recoveryAt !== null ? `: ${RECOVERY_STANDBY_NOTE}` : '.'}</p>`
        : nothing}`;
  }

  private logChart(pts: Array<{ time_s: number; level_m: number }>, curveClass: string, xLabel: string, ts: NonNullable<DesignResult['timeSeries']>, mark_s: number | null, label: string) {
    if (pts.length < 2) return nothing;
    const W = 420, H = 190, L = 46, R = 10, T = 12, B = 30;
    const t0 = Math.log10(pts[0]!.time_s);
    const t1 = Math.log10(pts[pts.length - 1]!.time_s);
    const unit = this.units.length;
    const levels = pts.map((p) => p.level_m).concat([ts.targetLevel_m, ts.formationLevel_m]).map((v) => fromSi(v, unit));
    const lo = Math.min(...levels);
    const hi = Math.max(...levels);
    const pad = Math.max((hi - lo) * 0.08, 0.05);
    const x = linearScale(t0, t1, L, W - R);
    const y = linearScale(lo - pad, hi + pad, H - B, T);
    const path = pts.map((p, i) => `${i ? 'L' : 'M'}${x(Math.log10(p.time_s)).toFixed(1)},${y(fromSi(p.level_m, unit)).toFixed(1)}`).join('');
    const targetY = y(fromSi(ts.targetLevel_m, unit));
    const formationY = y(fromSi(ts.formationLevel_m, unit));
    const decades: number[] = [];
    for (let d = Math.ceil(t0); d <= Math.floor(t1); d++) decades.push(d);
    const yTicks = niceTicks(lo - pad, hi + pad, 5);
    const mark = mark_s !== null && mark_s > 0 ? Math.log10(mark_s) : null;
    return html`<svg class="dd-chart" viewBox="0 0 ${W} ${H}" role="img" aria-label=${label}>
      ${yTicks.map((v) => svg`<line class="dd-grid" x1=${L} x2=${W - R} y1=${y(v)} y2=${y(v)}></line><text class="dd-tick" x=${L - 4} y=${y(v) + 3} text-anchor="end">${num(v, 4)}</text>`)}
      ${decades.map((d) => svg`<line class="dd-grid" x1=${x(d)} x2=${x(d)} y1=${T} y2=${H - B}></line><text class="dd-tick" x=${x(d)} y=${H - B + 13} text-anchor="middle">${formatDuration(10 ** d)}</text>`)}
      <line class="dd-target" x1=${L} x2=${W - R} y1=${targetY} y2=${targetY}></line>
      <line class="dd-formation" x1=${L} x2=${W - R} y1=${formationY} y2=${formationY}></line>
      ${mark !== null && mark >= t0 && mark <= t1 ? svg`<line class="dd-now" x1=${x(mark)} x2=${x(mark)} y1=${T} y2=${H - B}></line>` : nothing}
      <path class=${curveClass} d=${path}></path>
      <text class="dd-axis" x=${12} y=${T + (H - B - T) / 2} transform="rotate(-90 12 ${T + (H - B - T) / 2})" text-anchor="middle">level (${unit})</text>
      <text class="dd-axis" x=${L + (W - R - L) / 2} y=${H - 3} text-anchor="middle">${xLabel}</text>
    </svg>`;
  }
}
/** The panel's few styles of its own, added once to the page (elements render without shadow roots). */
function installStyle(): void {
  if (typeof document === 'undefined' || document.getElementById('dd-design-panel-style')) return;
  const style = document.createElement('style');
  style.id = 'dd-design-panel-style';
  style.textContent = STYLE;
  document.head.append(style);
}
installStyle();
if (!customElements.get('design-panel')) customElements.define('design-panel', DesignPanel);
