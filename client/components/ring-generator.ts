/**
 * <ring-generator>: places wells along an offset of an excavation's perimeter at a chosen spacing,
 * previewed on the map (numbered in order) before anything is added. Positions within half the
 * spacing of a well already there are skipped and said (never stacked silently); new wells take
 * a screen (by default that of the wells of their kind already placed). Emits `ring-preview`
 * (detail: positions and path, or null) while the form changes.
 */
import { html, nothing } from 'lit';
import { LightElement } from './light-element';
import type { Scenario, WellKind } from '../../shared/schema';
import { formatQuantity, type DisplayUnits } from '../../shared/units';
import type { ScenarioStore } from '../state';
import { layoutWellRing, nextWellIds, screenFields, screenOfKind, splitByNearbyWells, type WellRingLayout, type WellScreen } from '../layout';
import { displayValue, parseDisplayNumber } from './unit-context';

export class RingGenerator extends LightElement {
  static override properties = {
    store: { attribute: false }, scenario: { attribute: false }, units: { attribute: false },
    excavationId: { state: true }, offset_m: { state: true }, spacing_m: { state: true }, kind: { state: true },
    radius_m: { state: true }, rate_m3_s: { state: true }, prefix: { state: true }, replace: { state: true },
    previewing: { state: true }, error: { state: true }, screen: { state: true },
  };
  declare store: ScenarioStore | undefined;
  declare scenario: Scenario | undefined;
  declare units: DisplayUnits;
  declare excavationId: string;
  declare offset_m: number;
  declare spacing_m: number;
  declare kind: WellKind;
  declare radius_m: number;
  declare rate_m3_s: number;
  declare prefix: string;
  declare replace: boolean;
  declare previewing: boolean;
  declare error: string;
  /** Screen the user set for the ring; null: like the wells of that kind already placed. */
  declare screen: WellScreen | null;

  constructor() {
    super();
    this.excavationId = '';
    // Defaults: well points 2 m apart, 1.5 m outside the dig edge — common practice, no single source.
    this.offset_m = 1.5;
    this.spacing_m = 2;
    this.kind = 'wellpoint';
    this.radius_m = 0.05;
    this.rate_m3_s = 0.0005;
    this.prefix = 'R';
    this.replace = false;
    this.previewing = false;
    this.error = '';
    this.screen = null;
  }

  private get effectiveScreen(): WellScreen {
    return this.screen ?? screenOfKind(this.scenario, this.kind);
  }

  /** Wells the ring must keep clear of (those a replace removes do not count). */
  private get keptWells(): Array<{ x: number; y: number }> {
    return (this.scenario?.wells ?? []).filter((w) => !(this.replace && w.id.startsWith(this.prefix)));
  }

  /** The ring's positions split into those to place and those next to an existing well. */
  private get placement(): { layout: WellRingLayout; free: Array<[number, number]>; taken: Array<[number, number]>; tolerance_m: number } | null {
    const l = this.layout;
    if (!l) return null;
    const tolerance_m = 0.5 * l.spacing_m;
    return { layout: l, tolerance_m, ...splitByNearbyWells(l.positions, this.keptWells, tolerance_m) };
  }

  private get layout(): WellRingLayout | null {
    const ex = this.scenario?.excavations.find((e) => e.id === this.excavationId) ?? this.scenario?.excavations[0];
    if (!ex || !(this.spacing_m > 0)) return null;
    try {
      return layoutWellRing({ outline: ex.outline, offset_m: this.offset_m, spacing_m: this.spacing_m });
    } catch {
      return null;
    }
  }

  override updated(changed: Map<string, unknown>): void {
    if (this.previewing) {
      const p = this.placement;
      this.emit('ring-preview', p ? { positions: p.free, path: p.layout.path } : null);
    } else if (changed.has('previewing')) this.emit('ring-preview', null);
  }

  private num(label: string, key: 'offset_m' | 'spacing_m' | 'radius_m' | 'rate_m3_s', unit: DisplayUnits[keyof DisplayUnits]) {
    return html`<label class="dd-field"><span>${label}</span><span class="dd-input-unit">
      <input type="text" inputmode="decimal" name=${`ring-${key}`} aria-label=${`Ring ${label.toLowerCase()}`} .value=${displayValue(this[key], unit)}
        @change=${(e: Event) => {
          const parsed = parseDisplayNumber((e.target as HTMLInputElement).value, unit, `ring/${key}`, label.toLowerCase());
          if (!parsed.ok) return void (this.error = parsed.message);
          if ((key === 'spacing_m' || key === 'radius_m') && parsed.value_si <= 0) return void (this.error = `${label} must be greater than 0`);
          this.error = '';
          this[key] = parsed.value_si;
        }} /><em>${unit}</em></span></label>`;
  }

  /** Kind change: radius and rate move to that kind's starting values (common practice; edit them). */
  private setKind(kind: WellKind): void {
    this.kind = kind;
    this.radius_m = kind === 'deep' ? 0.15 : 0.05;
    this.rate_m3_s = kind === 'deep' ? 0.005 : kind === 'ejector' ? 0.001 : 0.0005;
    this.screen = null;
  }

  private setScreen(key: keyof WellScreen, text: string): void {
    const next = { ...this.effectiveScreen };
    if (text.trim() === '') delete next[key];
    else {
      const label = key === 'screenTop_m' ? 'screen top' : 'screen bottom';
      const p = parseDisplayNumber(text, this.units.length, `ring/${key}`, label);
      if (!p.ok) return void (this.error = p.message);
      next[key] = p.value_si;
    }
    if (next.screenTop_m !== undefined && next.screenBottom_m !== undefined && next.screenTop_m <= next.screenBottom_m) {
      return void (this.error = 'Screen top must lie above screen bottom');
    }
    this.error = '';
    this.screen = next;
  }

  private place(): void {
    const p = this.placement;
    const s = this.scenario;
    if (!p || !s || !this.store || p.free.length === 0) return;
    const ex = s.excavations.find((e) => e.id === this.excavationId) ?? s.excavations[0]!;
    const removed = this.replace ? s.wells.filter((w) => w.id.startsWith(this.prefix)).map((w) => w.id) : [];
    const kept = new Set(s.wells.map((w) => w.id).filter((id) => !removed.includes(id)));
    if (kept.size + p.free.length > 5000) return void (this.error = `That would make ${kept.size + p.free.length} wells; the scenario limit is 5000.`);
    const ids = nextWellIds(this.prefix, p.free.length, kept);
    const screen = screenFields(this.effectiveScreen);
    this.store.apply(`ring of ${p.free.length} wells around ${ex.id}`, (d) => {
      if (this.replace) d.wells = d.wells.filter((w) => !removed.includes(w.id));
      p.free.forEach(([x, y], k) => d.wells.push({ id: ids[k]!, x, y, radius_m: this.radius_m, kind: this.kind, rate_m3_s: this.rate_m3_s, ...screen }));
    });
    this.previewing = false;
    this.emit('ring-placed', { count: p.free.length, first: ids[0], last: ids[ids.length - 1], skipped: p.taken.length });
  }

  override render() {
    const s = this.scenario;
    if (!s || s.excavations.length === 0) return html`<p class="dd-hint">Draw or import an excavation first; the ring follows its perimeter.</p>`;
    const u = this.units;
    const p = this.placement;
    const l = p?.layout ?? null;
    const count = p?.free.length ?? 0;
    const scr = this.effectiveScreen;
    return html`<div class="dd-form dd-ring-generator">
      <label class="dd-field"><span>Around</span><select name="ring-excavation" @change=${(e: Event) => (this.excavationId = (e.target as HTMLSelectElement).value)}>
        ${s.excavations.map((e) => html`<option value=${e.id} ?selected=${e.id === this.excavationId}>${e.id}</option>`)}</select></label>
      <div class="dd-form-row">${this.num('Offset', 'offset_m', u.length)}${this.num('Spacing', 'spacing_m', u.length)}</div>
      <div class="dd-form-row">
        <label class="dd-field"><span>Kind</span><select name="ring-kind" @change=${(e: Event) => this.setKind((e.target as HTMLSelectElement).value as WellKind)}>
          <option value="wellpoint" ?selected=${this.kind === 'wellpoint'}>Well point</option>
          <option value="deep" ?selected=${this.kind === 'deep'}>Deep well</option>
          <option value="ejector" ?selected=${this.kind === 'ejector'}>Ejector</option></select></label>
        ${this.num('Radius', 'radius_m', u.length)}
      </div>
      <div class="dd-form-row">${this.num('Rate each', 'rate_m3_s', u.rate)}
        <label class="dd-field"><span>Id prefix</span><input type="text" name="ring-prefix" maxlength="20" .value=${this.prefix} @change=${(e: Event) => (this.prefix = (e.target as HTMLInputElement).value.trim() || 'R')} /></label></div>
      <div class="dd-form-row">
        <label class="dd-field"><span>Screen top</span><span class="dd-input-unit"><input type="text" inputmode="decimal" name="ring-screenTop_m" placeholder="full" aria-label="Ring screen top"
          .value=${displayValue(scr.screenTop_m, u.length)} @change=${(e: Event) => this.setScreen('screenTop_m', (e.target as HTMLInputElement).value)} /><em>${u.length}</em></span></label>
        <label class="dd-field"><span>Screen bottom</span><span class="dd-input-unit"><input type="text" inputmode="decimal" name="ring-screenBottom_m" placeholder="full" aria-label="Ring screen bottom"
          .value=${displayValue(scr.screenBottom_m, u.length)} @change=${(e: Event) => this.setScreen('screenBottom_m', (e.target as HTMLInputElement).value)} /><em>${u.length}</em></span></label>
      </div>
      <label class="dd-check"><input type="checkbox" ?checked=${this.replace} @change=${(e: Event) => (this.replace = (e.target as HTMLInputElement).checked)} /> Replace wells whose id starts with “${this.prefix}”</label>
      ${l ? html`<p class="dd-ring-summary">${count} wells at ${formatQuantity(l.spacing_m, u.length, { significant: 3 })} along ${formatQuantity(l.perimeter_m, u.length, { significant: 4 })}; total ${formatQuantity(count * this.rate_m3_s, u.rate)}.</p>` : nothing}
      ${p && p.taken.length > 0 ? html`<p class="dd-warn dd-ring-skipped" role="status">${p.taken.length} of ${l!.positions.length} positions skipped: a well is already within ${formatQuantity(p.tolerance_m, u.length, { significant: 2 })} (half the spacing).
        ${count === 0 ? 'The ring is already there. ' : ''}To lay it again, tick Replace with the prefix of those wells.</p>` : nothing}
      ${this.error ? html`<p class="dd-error" role="alert">${this.error}</p>` : nothing}
      <div class="dd-actions">
        <button type="button" name="ring-preview" class=${this.previewing ? 'dd-on' : ''} @click=${() => (this.previewing = !this.previewing)}>${this.previewing ? 'Hide preview' : 'Preview ring'}</button>
        <button type="button" name="ring-place" class="dd-primary" ?disabled=${count === 0} @click=${() => this.place()}>Place ${count} wells</button>
      </div>
    </div>`;
  }
}
if (!customElements.get('ring-generator')) customElements.define('ring-generator', RingGenerator);
