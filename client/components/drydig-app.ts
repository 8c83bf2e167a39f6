/**
 * <drydig-app>: the plan-map page. Owns the scenario store (undo/redo), the engine worker client
 * and the view state, lays out the map and the panels, and turns map gestures into edits.
 * Results are recomputed off the main thread: while dragging, the fine grid updated well by well in
 * the worker (or a coarse grid where that cannot be done); a fine grid
 * shortly after the last change, stale jobs cancelled.
 */
import { html, nothing } from 'lit';
import { LightElement } from './light-element';
import demoWellpoints from '../../fixtures/demo-wellpoints-unconfined.json';
import demoDeepwells from '../../fixtures/demo-deepwells-confined.json';
import demoNeighbours from '../../fixtures/demo-neighbours-confined.json';
import demoClayPlug from '../../fixtures/demo-clay-plug-confined.json';
import { describeIssuePlainly, validateMonitoring, validateScenario, type FieldIssue, type Scenario, type Well, type WellKind } from '../../shared/schema';
import { logSpacedTimes } from '../../shared/field';
import { signedDistanceToRing } from '../../shared/contours';
import { coordinateUnit, formatQuantity, fromSi, resolveDisplayUnits, toSi, type DisplayUnits, type UnitSystem } from '../../shared/units';
import { ScenarioStore, designInputsKey, checkViewSettings, getViewSettings, setViewSettings, type ChangeKind, type ContourQuantity, type SectionLine } from '../state';
import { MAX_PIEZOMETERS, deletePiezometer, getPiezometers, placePiezometer } from '../state';
import { MAX_RECEPTORS, deleteReceptor, moveReceptor, placeReceptor } from '../state';
import { getReceptors } from '../../shared/schema/receptor-schema';
import type { ReceptorVerdict } from '../map/receptor-layer';
import './receptor-editor';
import { EngineClient, EngineError, type FieldResult, type InspectResult, type SectionResult } from '../worker';
import { resolveSiteProjection, formatLonLat, type ProjectionProblem, type SiteProjection } from '../crs';
import type { LeafletMapController, MapTool } from '../map';
import type { TileStatus } from '../map/projected-tile-layer';
import { nextWellIds, screenFields, screenOfKind, type WellScreen } from '../layout';
import { displayValue, parseDisplayNumber } from './unit-context';
import { formatDuration } from './time-format';
import { stepDecimals } from './step-decimals';
import { methodName } from './results-panel';
import './plan-map';
import './scenario-warnings';
import './map-legend';
import './shortfall-badges';
import './results-panel';
import './ground-panel';
import './pumping-test-panel';
import './well-editor';
import './ring-generator';
import './excavation-editor';
import './backdrop-panel';
import './time-chart';
import './section-chart';
import './caution-note';
import './monitoring-editor';
import './design-panel';
import './scenario-store-panel';
import './seepage-panel';
import './site-import-panel';
import type { PumpingTestPanel } from './pumping-test-panel';
import type { ScenarioStorePanel } from './scenario-store-panel';
import type { DesignFloorResult } from '../../shared/design/design-result';

const plainIssue = describeIssuePlainly;

type Tab = 'layout' | 'ground' | 'test' | 'results' | 'design' | 'section' | 'store' | 'backdrop' | 'import';
/** The side panel's tabs in order, with their labels (one line per tab keeps additions apart). */
const TABS: ReadonlyArray<readonly [Tab, string]> = [
  ['layout', 'Layout'],
  ['ground', 'Ground'],
  ['test', 'Test'],
  ['results', 'Results'],
  ['design', 'Design'],
  ['section', 'Section'],
  ['store', 'Store'],
  ['backdrop', 'Backdrop'],
  ['import', 'Import'],
];

const DEMOS: Record<string, { label: string; scenario: Scenario }> = {
  wellpoints: { label: 'Demo: well points, unconfined (Quarry Lane)', scenario: demoWellpoints as unknown as Scenario },
  deepwells: { label: 'Demo: deep wells, confined, river (Ferry Road)', scenario: demoDeepwells as unknown as Scenario },
  neighbours: { label: 'Demo: deep wells with neighbours and a recharge well (Ferry Road)', scenario: demoNeighbours as unknown as Scenario },
  clayplug: { label: 'Demo: clay plug over a confined sand, uplift governs (Mill Lane)', scenario: demoClayPlug as unknown as Scenario },
};

const TOOLS: Array<[MapTool, string, string]> = [
  ['select', 'Select', 'Select, drag and inspect (Esc)'],
  ['add-well', 'Well', 'Click to place wells (W)'],
  ['add-piezometer', 'Piezometer', 'Click to place piezometers for the monitoring plan (P)'],
  ['add-receptor', 'Neighbour', 'Click to place receptors — buildings, walls, services the drawdown may harm (N)'],
  ['draw-excavation', 'Outline', 'Click the corners of an excavation; double-click or Enter to finish (O)'],
  ['section', 'Section', 'Click A then B to draw a cross-section (X)'],
  ['boundary', 'Boundary', 'Click two points on a straight boundary line (B)'],
];

/** Grid nodes on the longer side of the view: coarse while dragging, fine when idle. */
const COARSE_NODES_START = 40;
const COARSE_NODES_MIN = 24;
const COARSE_NODES_MAX = 80;
/** Fine grid nodes on the longer side; `?gridNodes=N` (40–400) sets another (the drag bench uses 200). */
const FINE_NODES = urlNumber('gridNodes', 150, 40, 400);
/** Worker time a drag frame should take, ms: the coarse grid adapts to stay near it. */
const COARSE_TARGET_MS = 20;
/**
 * Drag frames draw the fine grid, kept in the worker and updated well by well (incremental
 * superposition); `?drag=coarse` brings back the old coarse full grid (the drag bench's "before").
 * A scenario that cannot be updated well by well (partially penetrating wells, say) falls back to
 * the coarse grid after two slow full frames.
 */
const DRAG_INCREMENTAL = typeof location === 'undefined' || new URLSearchParams(location.search).get('drag') !== 'coarse';

/** `?stripWorkers=off` computes the fine grid in the engine worker alone (the drag bench's "before"). */
const STRIP_WORKERS = typeof location === 'undefined' || new URLSearchParams(location.search).get('stripWorkers') !== 'off';

function urlNumber(name: string, fallback: number, min: number, max: number): number {
  if (typeof location === 'undefined') return fallback;
  const v = Number(new URLSearchParams(location.search).get(name));
  return Number.isFinite(v) && v >= min && v <= max ? Math.round(v) : fallback;
}

/** The read-only test hook (`window.__drydig`): counts and state, never a way to edit. */
export interface DrydigTestHook {
  scenario(): Scenario;
  result(): {
    id: number; levels: number; time_s: number | null; colourMax_m: number; drawdownMax_m: number;
    /** The grid the result was computed on. */
    grid: { origin: [number, number]; spacing_m: [number, number]; counts: [number, number] };
    shortfall: Array<{ id: string; met: boolean; kind: string; worstShortfall_m: number; area_m2: number; time_s: number | null }>;
  } | null;
  pagePoint(x: number, y: number): { x: number; y: number } | null;
  latencies_ms: number[];
  /** Worker compute time of each result drawn, ms, with its kind. */
  computes: Array<{ mode: 'coarse' | 'fine'; compute_ms: number; at: number; nodes: number; incremental: boolean; stripWorkers: number }>;
  fieldsDrawn: number;
  busy(): boolean;
  /** True while the plan shows a result that does not belong to the current inputs (greyed). */
  fieldStale(): boolean;
}

export class DrydigApp extends LightElement {
  static override properties = {
    scenario: { state: true }, tab: { state: true }, tool: { state: true }, wellId: { state: true }, excavationId: { state: true },
    result: { state: true }, computing: { state: true }, engineError: { state: true }, issues: { state: true },
    timeIndex: { state: true }, cursor: { state: true }, notice: { state: true }, inspect: { state: true },
    section: { state: true }, drawer: { state: true }, demo: { state: true }, newWell: { state: true },
    piezometerId: { state: true }, designFloors: { state: true }, newWellScreen: { state: true }, tileStatus: { state: true },
    receptorId: { state: true },
  };
  declare scenario: Scenario;
  declare tab: Tab;
  declare tool: MapTool;
  declare wellId: string | null;
  declare excavationId: string | null;
  declare result: FieldResult | null;
  declare computing: number;
  declare engineError: string;
  declare issues: FieldIssue[];
  declare timeIndex: number;
  declare cursor: string;
  declare notice: string;
  declare inspect: InspectResult | null;
  declare section: SectionResult | null;
  declare drawer: 'inspect' | 'section' | null;
  declare demo: string;
  declare newWell: { kind: WellKind; radius_m: number; rate_m3_s: number };
  /** Screen of new wells as the user set it; null: like the wells of that kind already placed. */
  declare newWellScreen: WellScreen | null;
  /** How the background map tiles load (the Backdrop tab explains failures). */
  declare tileStatus: TileStatus | null;
  /** Selected piezometer of the monitoring plan. */
  declare piezometerId: string | null;
  /** The last design's floor checks by excavation, with the key of the inputs it was made for. */
  declare designFloors: { key: string; byExcavation: Map<string, DesignFloorResult> } | null;
  /** Selected receptor (neighbour). */
  declare receptorId: string | null;
  /** The last design's verdict per receptor id (colours the map symbols). */
  private receptorVerdicts: ReadonlyMap<string, ReceptorVerdict> = new Map();

  private readonly store: ScenarioStore;
  private engine: EngineClient | null = null;
  /** The last design's total flow, m³/s, for the Section tab's comparison. */
  private designTotal_m3_s: number | null = null;
  private controller: LeafletMapController | null = null;
  private fineTimer = 0;
  private coarseFrame = 0;
  /** Times of drag inputs not yet reflected on screen (for the input-to-contours measure). */
  private unshownInputs: number[] = [];
  private lastDrawnId = 0;
  /** Counts whole-scenario swaps: a result computed for the scenario before a swap is never drawn. */
  private loadGeneration = 0;
  /** Current coarse-grid size, adapted to the measured worker time (machine speed, well count). */
  private coarseNodes = COARSE_NODES_START;
  /** Drag frames on the fine grid, well by well (off after two slow full frames, until the next commit). */
  private dragIncremental = DRAG_INCREMENTAL;
  private slowFullDragFrames = 0;
  private engineKey = '';
  private pickingRef: 0 | 1 | null = null;
  private projection: SiteProjection | ProjectionProblem | null = null;
  private readonly hook: DrydigTestHook;
  private noticeTimer = 0;

  constructor() {
    super();
    this.demo = 'wellpoints';
    this.store = new ScenarioStore(DEMOS.wellpoints!.scenario);
    this.scenario = this.store.scenario;
    this.tab = 'results';
    this.tool = 'select';
    this.wellId = null;
    this.excavationId = null;
    this.piezometerId = null;
    this.designFloors = null;
    this.receptorId = null;
    this.result = null;
    this.computing = -1;
    this.engineError = '';
    this.issues = [];
    this.timeIndex = Number.MAX_SAFE_INTEGER;
    this.cursor = '';
    this.notice = '';
    this.inspect = null;
    this.section = null;
    this.drawer = null;
    this.newWell = { kind: 'wellpoint', radius_m: 0.05, rate_m3_s: 0.0006 };
    this.newWellScreen = null;
    this.tileStatus = null;
    this.store.subscribe((s, kind) => this.onStoreChange(s, kind));
    this.hook = {
      scenario: () => structuredClone(this.store.scenario),
      result: () => this.result && {
        id: this.result.id, levels: this.result.levels.length, time_s: this.result.time_s,
        colourMax_m: this.result.colourMax_m, drawdownMax_m: this.result.drawdownRange.max,
        grid: { origin: [...this.result.grid.origin], spacing_m: [...this.result.grid.spacing_m], counts: [...this.result.grid.counts] },
        shortfall: this.result.shortfall.map((s) => ({ id: s.id, met: s.met, kind: s.kind, worstShortfall_m: s.worstShortfall_m, area_m2: s.area_m2, time_s: s.time_s })),
      },
      pagePoint: (x, y) => this.controller?.pagePoint(x, y) ?? null,
      latencies_ms: [],
      computes: [],
      fieldsDrawn: 0,
      busy: () => this.computing >= 0 || this.fineTimer !== 0,
      fieldStale: () => this.controller?.field.stale ?? false,
    };
    (window as unknown as { __drydig: DrydigTestHook }).__drydig = this.hook;
  }

  /**
   * The page's scenario store, for features that plug in (server storage, share links): load a
   * scenario with `store.load()`, watch edits with `store.subscribe()`. Every edit goes through it.
   */
  get scenarioStore(): ScenarioStore {
    return this.store;
  }

  // ————— derived —————

  private get units(): DisplayUnits {
    const u = getViewSettings(this.scenario).units ?? {};
    const units = resolveDisplayUnits(u.system === 'us' ? 'us' : 'si', { rate: u.rate, velocity: u.velocity });
    // Coordinates follow the site grid's unit: a projected CRS keeps its metres in US display too.
    return { ...units, coordinate: coordinateUnit({ crs: this.scenario.crs, proj4: this.scenario.proj4, units }).unit };
  }

  private get unitSystem(): UnitSystem {
    return getViewSettings(this.scenario).units?.system === 'us' ? 'us' : 'si';
  }

  private get quantity(): ContourQuantity {
    return getViewSettings(this.scenario).contour?.quantity === 'level' ? 'level' : 'drawdown';
  }

  private get times(): Array<number | null> {
    const T = this.scenario.design.time_s;
    if (T === null || !(T > 0)) return [null];
    return logSpacedTimes({ end_s: T, count: 16, start_s: T / 1000 });
  }

  private get time_s(): number | null {
    const times = this.times;
    return times[Math.min(this.timeIndex, times.length - 1)] ?? null;
  }

  // ————— lifecycle —————

  override connectedCallback(): void {
    super.connectedCallback();
    this.engine ??= new EngineClient();
    document.addEventListener('keydown', this.onKey);
  }

  override disconnectedCallback(): void {
    super.disconnectedCallback();
    document.removeEventListener('keydown', this.onKey);
    this.engine?.dispose();
    this.engine = null;
  }

  private onMapReady(controller: LeafletMapController): void {
    this.controller = controller;
    this.controller.onTileStatus((st) => {
      const first = st.failed === 1 && st.loaded === 0;
      this.tileStatus = st;
      if (first) this.say('Map tiles could not be loaded: see the Backdrop tab for how to allow the tile origin.');
    });
    // The Import tab draws its previews on the map: render once more to hand it over.
    this.requestUpdate();
    this.controller.fitScenario(this.scenario);
    this.syncMap();
    this.validate();
    this.scheduleField('fine', true);
  }

  private onStoreChange(s: Scenario, kind: ChangeKind): void {
    if (kind === 'preview') {
      // Mid-drag: only the map and the computation follow; the panels catch up on commit, so
      // a 200-well list is not re-rendered on every pointer move.
      this.unshownInputs.push(performance.now());
      performance.mark('dd-input');
      this.controller?.setScenario(s, { wellId: this.wellId, excavationId: this.excavationId });
      this.scheduleField('coarse');
      return;
    }
    this.scenario = s;
    this.cursor = '';
    this.dragIncremental = DRAG_INCREMENTAL;
    this.slowFullDragFrames = 0;
    if (kind === 'load') {
      this.loadGeneration++;
      this.newWellScreen = null;
      this.demo = Object.entries(DEMOS).find(([, d]) => d.scenario.name === s.name)?.[0] ?? '';
      this.wellId = null;
      this.excavationId = null;
      this.inspect = null;
      this.section = null;
      this.result = null;
      this.designFloors = null;
      this.timeIndex = Number.MAX_SAFE_INTEGER;
      this.controller?.setField(null, this.fieldStyle(null));
      this.controller?.setSection(null);
      this.controller?.setInspectPoint(null);
      this.controller?.setCriticalPoints([]);
      this.controller?.fitScenario(s);
    }
    if (this.wellId && !s.wells.some((w) => w.id === this.wellId)) this.wellId = null;
    if (this.excavationId && !s.excavations.some((e) => e.id === this.excavationId)) this.excavationId = null;
    if (kind === 'load' || (this.piezometerId && !getPiezometers(s).some((p) => p.id === this.piezometerId))) this.piezometerId = null;
    this.syncMap();
    this.validate();
    this.scheduleField('coarse');
    this.scheduleField('fine');
  }

  private validate(): void {
    const v = validateScenario(this.scenario);
    // The monitoring plan is checked too: the server refuses to store a scenario whose plan is bad.
    this.issues = v.ok ? validateMonitoring(this.scenario) : v.issues;
    // Results paused by a bad field: the last picture stays, greyed, so it is not read as current.
    this.controller?.setFieldStale(this.issues.length > 0);
  }

  private syncMap(): void {
    const c = this.controller;
    if (!c) return;
    const s = this.scenario;
    const view = getViewSettings(s);
    c.setSelectedPiezometer(this.piezometerId);
    if (this.receptorId && !getReceptors(s).some((r) => r.id === this.receptorId)) this.receptorId = null;
    c.setReceptorState(this.receptorId, this.receptorVerdicts);
    c.setScenario(s, { wellId: this.wellId, excavationId: this.excavationId });
    c.setImperialScale(this.unitSystem === 'us');
    const u = this.units;
    c.setGridUnit(toSi(1, u.length), (v) => formatQuantity(v, u.length, { decimals: 0 }));
    c.setUnderlay(view.underlay ?? null);
    this.projection = resolveSiteProjection({ crs: s.crs, proj4: s.proj4 });
    c.setTiles(view.tileUrl ?? null, this.projection.ok ? this.projection : null);
    const sec = view.sections?.[0];
    c.setSection(sec ?? null);
  }

  // ————— computing —————

  private scheduleField(mode: 'coarse' | 'fine', immediate = false): void {
    if (mode === 'coarse') {
      if (this.coarseFrame) return;
      this.coarseFrame = requestAnimationFrame(() => {
        this.coarseFrame = 0;
        void this.computeField('coarse');
      });
      return;
    }
    clearTimeout(this.fineTimer);
    this.fineTimer = window.setTimeout(() => {
      this.fineTimer = 0;
      void this.computeField('fine');
      void this.refreshInspections();
    }, immediate ? 0 : 180);
  }

  private fieldStyle(r: FieldResult | null) {
    const u = this.units;
    const step = r && r.levels.length > 1 ? Math.abs(r.levels[1]! - r.levels[0]!) / toSi(1, u.length) : 1;
    const decimals = stepDecimals(step);
    return {
      formatLevel: (v: number) => formatQuantity(v, u.length, { decimals, withUnit: false }),
      staticLevel_m: this.scenario.aquifer.staticLevel_m,
      maxDrawdown_m: r?.colourMax_m ?? r?.drawdownRange.max ?? 1,
    };
  }

  private async computeField(mode: 'coarse' | 'fine'): Promise<void> {
    const c = this.controller;
    const engine = this.engine;
    if (!c || !engine) return;
    if (this.issues.length > 0) {
      this.engineError = '';
      return;
    }
    const issuedAt = performance.now();
    const generation = this.loadGeneration;
    const incremental = mode === 'coarse' && this.dragIncremental;
    const coarse = mode === 'coarse' && !incremental;
    const grid = c.viewGrid(coarse ? this.coarseNodes : FINE_NODES);
    const view = getViewSettings(this.scenario);
    try {
      const res = await engine.field(
        {
          scenario: this.store.scenario, grid, time_s: this.time_s, quantity: this.quantity, step_m: view.contour?.step_m,
          levelUnit_m: toSi(1, this.units.length),
          pitNodes: coarse ? 17 : 41, strips: mode === 'coarse' ? 1 : 6,
          ...(incremental ? { incremental: true } : {}),
          ...(STRIP_WORKERS ? {} : { stripWorkers: false }),
          // One colour scale along the time slider: the design time's drawdown range.
          ...(this.times.length > 1 ? { scaleTime_s: this.scenario.design.time_s } : {}),
        },
        mode === 'fine' ? (f) => (this.computing = f < 1 ? f : -1) : undefined,
      );
      if (mode === 'fine') this.computing = -1;
      if (res && incremental) {
        this.slowFullDragFrames = res.incremental === false && res.compute_ms > 2 * COARSE_TARGET_MS ? this.slowFullDragFrames + 1 : 0;
        if (this.slowFullDragFrames >= 2) this.dragIncremental = false;
      }
      if (res && coarse) {
        // Work grows with nodes (∝ n²): scale n by √(target / measured), damped, within bounds.
        const factor = Math.sqrt(COARSE_TARGET_MS / Math.max(res.compute_ms, 1));
        const next = this.coarseNodes * Math.min(1.25, Math.max(0.7, factor));
        this.coarseNodes = Math.round(Math.min(COARSE_NODES_MAX, Math.max(COARSE_NODES_MIN, next)));
      }
      if (!res || res.id < this.lastDrawnId || generation !== this.loadGeneration) return;
      this.lastDrawnId = res.id;
      this.engineError = '';
      this.result = res;
      c.setField(res, this.fieldStyle(res));
      this.hook.fieldsDrawn++;
      this.hook.computes.push({ mode, compute_ms: res.compute_ms, at: performance.now(), nodes: res.grid.counts[0] * res.grid.counts[1], incremental: res.incremental === true, stripWorkers: res.stripWorkers ?? 1 });
      // Latency of the oldest input this result reflects (inputs before the request was issued);
      // inputs dropped with a superseded request are counted in the next result drawn.
      const reflected = this.unshownInputs.filter((t) => t <= issuedAt);
      if (reflected.length > 0) {
        const end = performance.now();
        const start = Math.min(...reflected);
        performance.measure('dd-input-to-contours', { start, end });
        this.hook.latencies_ms.push(end - start);
        this.unshownInputs = this.unshownInputs.filter((t) => t > issuedAt);
      }
    } catch (error) {
      this.computing = -1;
      this.engineError = error instanceof EngineError ? error.message : `The engine failed: ${(error as Error).message}`;
    }
  }

  private async refreshInspections(): Promise<void> {
    const engine = this.engine;
    if (!engine || this.issues.length > 0) return;
    const point = this.inspect?.point;
    const sec = getViewSettings(this.scenario).sections?.[0];
    try {
      if (point) await this.runInspect(point);
      if (sec) this.section = await engine.section({ scenario: this.scenario, from: sec.from, to: sec.to, samples: 240, time_s: this.time_s });
      else this.section = null;
    } catch (error) {
      this.engineError = (error as Error).message;
    }
  }

  private async runInspect(point: [number, number]): Promise<void> {
    const T = this.scenario.design.time_s;
    const times = T === null ? [] : logSpacedTimes({ end_s: T, count: 60, start_s: T / 1e4 });
    this.inspect = await this.engine!.inspect({ scenario: this.scenario, point, times_s: times, time_s: this.time_s });
    this.controller?.setInspectPoint(point);
  }

  // ————— map gestures —————

  private onMapEvent(e: CustomEvent<unknown[]>): void {
    const a = e.detail;
    switch (e.type) {
      case 'map-cursor': {
        const [x, y] = a as [number | null, number];
        if (x === null) return void (this.cursor = '');
        const u = this.units;
        const p = this.projection;
        const ll = p?.ok ? ` · ${formatLonLat(...p.toLonLat(x, y))}` : '';
        const cu = fromSi(1, u.coordinate) === 1 ? 'm' : 'ft';
        this.cursor = `E ${formatQuantity(x, u.coordinate, { decimals: 2, withUnit: false })} ${cu}   N ${formatQuantity(y, u.coordinate, { decimals: 2, withUnit: false })} ${cu}${ll}`;
        return;
      }
      case 'map-click': {
        const [tool, x, y] = a as [MapTool, number, number];
        if (tool === 'add-well') this.addWell(x, y);
        else if (tool === 'add-piezometer') this.addPiezometer(x, y);
        else if (tool === 'add-receptor') this.addReceptor(x, y);
        else if (tool === 'pick-point') this.pickUnderlayPoint(x, y);
        else if (tool === 'select') {
          this.drawer = 'inspect';
          void this.runInspect([x, y]).catch((err) => (this.engineError = (err as Error).message));
        }
        return;
      }
      case 'map-selectWell': {
        const [id] = a as [string | null];
        this.wellId = id;
        if (id) this.tab = 'layout';
        this.controller?.setScenario(this.scenario, { wellId: this.wellId, excavationId: this.excavationId });
        return;
      }
      case 'map-selectExcavation': {
        // A click inside a pit selects it (outline handles) and inspects the point; the side
        // panel stays where the user is (the pit's editor is one tab away, Layout).
        const [id] = a as [string | null];
        this.excavationId = id;
        this.controller?.setScenario(this.scenario, { wellId: this.wellId, excavationId: this.excavationId });
        return;
      }
      case 'map-dragWell': {
        const [id, x, y, phase] = a as [string, number, number, 'move' | 'end' | 'cancel'];
        if (phase === 'cancel') return this.store.cancelGesture();
        this.store.preview((d) => {
          const w = d.wells.find((k) => k.id === id);
          if (w) {
            w.x = x;
            w.y = y;
          }
        });
        if (phase === 'end') this.store.commit(`move ${id}`);
        return;
      }
      case 'map-selectPiezometer': {
        const [id] = a as [string | null];
        this.selectPiezometer(id);
        return;
      }
      case 'map-dragPiezometer': {
        const [id, x, y, phase] = a as [string, number, number, 'move' | 'end' | 'cancel'];
        if (phase === 'cancel') return this.store.cancelGesture();
        this.store.preview((d) => {
          const p = getPiezometers(d).find((k) => k.id === id);
          if (p) {
            p.x = x;
            p.y = y;
          }
        });
        if (phase === 'end') this.store.commit(`move ${id}`);
        return;
      }
      case 'map-selectReceptor': {
        const [id] = a as [string | null];
        this.selectReceptor(id);
        return;
      }
      case 'map-dragReceptor': {
        const [id, vertex, x, y, phase] = a as [string, number, number, number, 'move' | 'end' | 'cancel'];
        if (phase === 'cancel') return this.store.cancelGesture();
        this.store.preview((d) => moveReceptor(d, id, vertex, x, y));
        if (phase === 'end') this.store.commit(`move ${id}`);
        return;
      }
      case 'map-dragVertex': {
        const [id, i, x, y, phase] = a as [string, number, number, number, 'move' | 'end' | 'cancel'];
        if (phase === 'cancel') return this.store.cancelGesture();
        this.store.preview((d) => {
          const ex = d.excavations.find((k) => k.id === id);
          if (ex?.outline[i]) ex.outline[i] = [x, y];
        });
        if (phase === 'end') this.store.commit(`reshape ${id}`);
        return;
      }
      case 'map-insertVertex': {
        const [id, after, x, y] = a as [string, number, number, number];
        this.store.apply(`add corner to ${id}`, (d) => void d.excavations.find((k) => k.id === id)?.outline.splice(after + 1, 0, [x, y]));
        return;
      }
      case 'map-drawnOutline': {
        const [pts] = a as [Array<[number, number]>];
        const s = this.scenario;
        const taken = new Set(s.excavations.map((k) => k.id));
        let n = s.excavations.length + 1;
        while (taken.has(`pit-${n}`)) n++;
        const id = `pit-${n}`;
        const last = s.excavations[s.excavations.length - 1];
        this.store.apply(`draw ${id}`, (d) => void d.excavations.push({
          id, outline: pts, formationLevel_m: last?.formationLevel_m ?? s.groundLevel_m - 3, margin_m: last?.margin_m ?? 0.5,
        }));
        this.excavationId = id;
        this.tab = 'layout';
        this.setTool('select');
        this.say(`Drew ${id} (${pts.length} corners). Set its formation level in Layout.`);
        return;
      }
      case 'map-drawnLine': {
        const [tool, from, to] = a as ['section' | 'boundary', [number, number], [number, number]];
        if (tool === 'section') {
          this.store.apply('draw section', (d) => setViewSettings(d, { sections: [{ from, to } satisfies SectionLine] }));
          this.drawer = 'section';
        } else {
          if ((this.scenario.boundaries?.length ?? 0) >= 8) return this.say('The scenario holds at most 8 boundaries.');
          this.store.apply('draw boundary', (d) => {
            d.boundaries = [...(d.boundaries ?? []), { kind: 'constant-head', from, to }];
          });
          this.tab = 'ground';
          this.say('Boundary added as constant-head; change its kind in Ground.');
        }
        this.setTool('select');
        return;
      }
      case 'map-viewChanged':
        this.scheduleField('fine');
        return;
      case 'map-focusExcavation':
        this.focusExcavation((a as [string])[0]);
        return;
    }
  }

  private addWell(x: number, y: number): void {
    const s = this.scenario;
    if (s.wells.length >= 5000) return this.say('The scenario holds at most 5000 wells.');
    const prefix = this.newWell.kind === 'deep' ? 'DW' : this.newWell.kind === 'ejector' ? 'EJ' : 'WP';
    const [id] = nextWellIds(prefix, 1, new Set(s.wells.map((w) => w.id)));
    const well: Well = { id: id!, x, y, radius_m: this.newWell.radius_m, kind: this.newWell.kind, rate_m3_s: this.newWell.rate_m3_s, ...screenFields(this.newScreen) };
    this.store.apply(`place ${id}`, (d) => void d.wells.push(well));
    this.wellId = id!;
    this.controller?.setScenario(this.scenario, { wellId: this.wellId, excavationId: this.excavationId });
  }

  /** The screen new wells get: the user's, else that of the wells of the same kind already placed. */
  private get newScreen(): WellScreen {
    return this.newWellScreen ?? screenOfKind(this.scenario, this.newWell.kind);
  }

  private setNewScreen(key: keyof WellScreen, text: string): void {
    const next = { ...this.newScreen };
    if (text.trim() === '') delete next[key];
    else {
      const label = key === 'screenTop_m' ? 'screen top of new wells' : 'screen bottom of new wells';
      const p = parseDisplayNumber(text, this.units.length, label, label);
      if (!p.ok) return this.say(`The ${label} must be a number (an elevation); it was not changed.`);
      next[key] = p.value_si;
    }
    if (next.screenTop_m !== undefined && next.screenBottom_m !== undefined && next.screenTop_m <= next.screenBottom_m) {
      return this.say('The screen top of new wells must lie above their screen bottom; it was not changed.');
    }
    this.newWellScreen = next;
  }

  private deleteWell(id: string): void {
    this.store.apply(`delete ${id}`, (d) => void (d.wells = d.wells.filter((w) => w.id !== id)));
    this.wellId = null;
  }

  private addPiezometer(x: number, y: number): void {
    if (getPiezometers(this.scenario).length >= MAX_PIEZOMETERS) return this.say(`The monitoring plan holds at most ${MAX_PIEZOMETERS} piezometers.`);
    let id = '';
    this.store.apply('place piezometer', (d) => void (id = placePiezometer(d, x, y)));
    this.selectPiezometer(id);
    this.say(`Placed ${id}. Set its alert offset and action level under Layout → Monitoring.`);
  }

  private addReceptor(x: number, y: number): void {
    if (getReceptors(this.scenario).length >= MAX_RECEPTORS) return this.say(`A scenario holds at most ${MAX_RECEPTORS} receptors.`);
    let id = '';
    this.store.apply('place receptor', (d) => void (id = placeReceptor(d, x, y)));
    this.selectReceptor(id);
    this.say(`Placed receptor ${id}. Give the layer beneath it and its limits under Layout → Neighbours.`);
  }

  private selectReceptor(id: string | null): void {
    this.receptorId = id;
    if (id) {
      this.wellId = null;
      this.piezometerId = null;
      this.tab = 'layout';
    }
    this.controller?.setReceptorState(id, this.receptorVerdicts);
  }

  private removeReceptor(id: string): void {
    this.store.apply(`delete ${id}`, (d) => deleteReceptor(d, id));
    this.receptorId = null;
  }

  /** Selects a piezometer (null clears); a selected piezometer takes the Delete key from a well. */
  private selectPiezometer(id: string | null): void {
    this.piezometerId = id;
    if (id) {
      this.wellId = null;
      this.tab = 'layout';
      this.controller?.setScenario(this.scenario, { wellId: null, excavationId: this.excavationId });
    }
    this.controller?.setSelectedPiezometer(id);
  }

  private removePiezometer(id: string): void {
    this.store.apply(`delete ${id}`, (d) => deletePiezometer(d, id));
    this.piezometerId = null;
  }

  private focusExcavation(id: string): void {
    const s = this.result?.shortfall.find((k) => k.id === id);
    if (!s) return;
    this.excavationId = id;
    this.controller?.panTo(s.worst.x, s.worst.y);
    this.drawer = 'inspect';
    void this.runInspect([s.worst.x, s.worst.y]);
  }

  private pickUnderlayPoint(x: number, y: number): void {
    const k = this.pickingRef;
    this.pickingRef = null;
    this.setTool('select');
    const under = getViewSettings(this.scenario).underlay;
    if (k === null || !under) return;
    const next = structuredClone(under);
    next.refs[k].site = [x, y];
    this.store.apply('place underlay', (d) => setViewSettings(d, { underlay: next }));
    this.tab = 'backdrop';
  }

  private setTool(tool: MapTool): void {
    this.tool = tool;
    this.controller?.setTool(tool);
  }

  private say(text: string): void {
    this.notice = text;
    clearTimeout(this.noticeTimer);
    this.noticeTimer = window.setTimeout(() => (this.notice = ''), 6000);
  }

  private onKey = (e: KeyboardEvent): void => {
    const target = e.target as HTMLElement | null;
    const typing = target && (target.tagName === 'INPUT' || target.tagName === 'TEXTAREA' || target.tagName === 'SELECT' || target.isContentEditable);
    const mod = e.ctrlKey || e.metaKey;
    if (mod && e.key.toLowerCase() === 'z' && !typing) {
      e.preventDefault();
      if (e.shiftKey) this.store.redo();
      else this.store.undo();
      return;
    }
    if (mod && e.key.toLowerCase() === 'y' && !typing) {
      e.preventDefault();
      this.store.redo();
      return;
    }
    if (typing || mod) return;
    if (e.key === 'Escape') {
      this.controller?.clearDraft();
      this.setTool('select');
    } else if (e.key === 'Enter' && this.tool === 'draw-excavation') this.controller?.finishOutline();
    else if ((e.key === 'Delete' || e.key === 'Backspace') && this.wellId) this.deleteWell(this.wellId);
    else if ((e.key === 'Delete' || e.key === 'Backspace') && this.piezometerId) this.removePiezometer(this.piezometerId);
    else if ((e.key === 'Delete' || e.key === 'Backspace') && this.receptorId) this.removeReceptor(this.receptorId);
    else if (e.key === 'n' || e.key === 'N') this.setTool('add-receptor');
    else if (e.key === 'w' || e.key === 'W') this.setTool('add-well');
    else if (e.key === 'p' || e.key === 'P') this.setTool('add-piezometer');
    else if (e.key === 'o' || e.key === 'O') this.setTool('draw-excavation');
    else if (e.key === 'x' || e.key === 'X') this.setTool('section');
    else if (e.key === 'b' || e.key === 'B') this.setTool('boundary');
  };

  // ————— files —————

  private async openFile(e: Event): Promise<void> {
    const input = e.target as HTMLInputElement;
    const file = input.files?.[0];
    input.value = '';
    if (!file) return;
    let doc: unknown;
    try {
      doc = JSON.parse(await file.text());
    } catch (error) {
      return this.say(`${file.name} is not valid JSON: ${(error as Error).message}`);
    }
    const v = validateScenario(doc);
    if (!v.ok) {
      const first = v.issues.slice(0, 3).map(plainIssue).join('; ');
      return this.say(`${file.name} was not opened — ${first}${v.issues.length > 3 ? ` (+${v.issues.length - 3} more)` : ''}. Your current scenario is unchanged.`);
    }
    const monitoringIssue = validateMonitoring(v.scenario)[0];
    if (monitoringIssue) return this.say(`${file.name} was not opened — ${plainIssue(monitoringIssue)}. Your current scenario is unchanged.`);
    const viewIssues = checkViewSettings(v.scenario);
    const scenario = v.scenario as Scenario & { view?: unknown };
    if (viewIssues.length > 0) delete scenario.view;
    this.replaceScenario(scenario, `open ${file.name}`, viewIssues.length > 0
      ? `Opened ${file.name}; its view settings were ignored (${plainIssue(viewIssues[0]!)}) — the design data is intact.`
      : `Opened ${file.name}.`);
  }

  /**
   * Swaps in another scenario as one undo step: the one it replaces, unsaved edits and all,
   * comes back with Undo (the notice says so). `detach` unlinks the Store tab from the stored
   * scenario it was editing (not for a revision opened from the Store tab itself).
   */
  private replaceScenario(next: Scenario, label: string, said: string, detach = true): void {
    const name = this.store.scenario.name || 'the previous scenario';
    const previous = name.length > 40 ? `${name.slice(0, 38)}…` : name;
    const edited = this.store.canUndo && !this.store.undoIsReplace;
    if (detach) this.storePanel()?.detach();
    this.store.replace(next, label);
    this.say(`${said} Undo (Ctrl+Z) brings back “${previous}”${edited ? ' with your edits' : ''}.`);
  }

  private saveFile(): void {
    const blob = new Blob([JSON.stringify(this.store.scenario, null, 1)], { type: 'application/json' });
    const a = document.createElement('a');
    a.href = URL.createObjectURL(blob);
    a.download = `${(this.scenario.name || 'scenario').replace(/[^\w.-]+/g, '-').slice(0, 60)}.drydig.json`;
    a.click();
    setTimeout(() => URL.revokeObjectURL(a.href), 1000);
  }

  private setUnits(system: UnitSystem, rate?: string): void {
    this.store.apply('display units', (d) => setViewSettings(d, { units: { ...getViewSettings(d).units, system, ...(rate ? { rate } : { rate: undefined }) } }));
  }

  private onDesignResult(e: CustomEvent<{ apply?: boolean; wells?: Array<{ id: string; rate_m3_s: number }>; excavations?: Array<{ id: string; critical?: { x: number; y: number; level_m: number } }> }>): void {
    const d = e.detail ?? {};
    const receptors = (d as { receptors?: Array<{ id: string; status: ReceptorVerdict }> }).receptors;
    this.receptorVerdicts = new Map((receptors ?? []).map((r) => [r.id, r.status] as const));
    this.controller?.setReceptorState(this.receptorId, this.receptorVerdicts);
    const total = (d as { totalRate_m3_s?: unknown }).totalRate_m3_s;
    this.designTotal_m3_s = typeof total === 'number' && Number.isFinite(total) ? total : null;
    const u = this.units;
    const crit = (d.excavations ?? []).filter((x) => x.critical && Number.isFinite(x.critical.x) && Number.isFinite(x.critical.y))
      .map((x) => ({ x: x.critical!.x, y: x.critical!.y, label: `${x.id}: critical point, ${formatQuantity(x.critical!.level_m, u.length, { decimals: 2 })}` }));
    this.controller?.setCriticalPoints(crit);
    if (!d.apply) {
      const floors = (d.excavations ?? []).flatMap((x) => {
        const floor = (x as { floor?: DesignFloorResult }).floor;
        return floor ? [[x.id, floor] as const] : [];
      });
      this.designFloors = { key: designInputsKey(this.store.scenario), byExcavation: new Map(floors) };
    }
    if (d.apply && Array.isArray(d.wells)) {
      const rates = new Map(d.wells.filter((w) => typeof w.id === 'string' && Number.isFinite(w.rate_m3_s)).map((w) => [w.id, w.rate_m3_s]));
      this.store.apply('apply design rates', (draft) => {
        for (const w of draft.wells) {
          const r = rates.get(w.id);
          if (r === undefined) continue;
          w.rate_m3_s = r;
          delete w.schedule;
        }
      });
      this.say(`Applied design rates to ${rates.size} wells (undo with Ctrl+Z).`);
    }
  }

  // ————— render —————

  override render() {
    const s = this.scenario;
    const u = this.units;
    const view = getViewSettings(s);
    const times = this.times;
    const ti = Math.min(this.timeIndex, times.length - 1);
    // On the edge counts as inside: the worst point of a pit is often on its outline.
    const pitAtInspect = this.inspect ? s.excavations.find((e) => signedDistanceToRing(this.inspect!.point[0], this.inspect!.point[1], e.outline) >= -1e-6) : undefined;
    return html`
      <header class="dd-top">
        <div class="dd-brand"><span class="dd-logo" aria-hidden="true"></span><span>drydig</span></div>
        <input class="dd-name" type="text" aria-label="Scenario name" .value=${s.name} maxlength="200"
          @change=${(e: Event) => this.store.apply('rename scenario', (d) => void (d.name = (e.target as HTMLInputElement).value))} />
        <div class="dd-group">
          <select aria-label="Demo site" name="demo" @change=${(e: Event) => {
            const key = (e.target as HTMLSelectElement).value;
            const demo = DEMOS[key];
            if (!demo) return;
            this.replaceScenario(demo.scenario, `open ${demo.label}`, `Opened the ${/\(([^)]+)\)$/.exec(demo.label)?.[1] ?? ''} demo.`);
          }}>
            <option value="" ?selected=${this.demo === ''} disabled>Own scenario</option>
            ${Object.entries(DEMOS).map(([k, d]) => html`<option value=${k} ?selected=${this.demo === k}>${d.label}</option>`)}
          </select>
          <label class="dd-button-like">Open…<input type="file" name="open-scenario" accept=".json,application/json" hidden @change=${(e: Event) => void this.openFile(e)} /></label>
          <button type="button" name="save" title="Download the scenario as a .drydig.json file to this computer (the Store tab keeps revisions on the server)" @click=${() => this.saveFile()}>Download file</button>
        </div>
        <div class="dd-group">
          <button type="button" name="undo" ?disabled=${!this.store.canUndo} title=${this.store.undoLabel ? `Undo ${this.store.undoLabel} (Ctrl+Z)` : 'Nothing to undo'} @click=${() => this.store.undo()}>↶ Undo</button>
          <button type="button" name="redo" ?disabled=${!this.store.canRedo} title=${this.store.redoLabel ? `Redo ${this.store.redoLabel} (Ctrl+Shift+Z)` : 'Nothing to redo'} @click=${() => this.store.redo()}>↷ Redo</button>
        </div>
        <div class="dd-group dd-tools" role="toolbar" aria-label="Map tools">
          ${TOOLS.map(([t, label, tip]) => html`<button type="button" name=${`tool-${t}`} class=${this.tool === t ? 'dd-on' : ''} aria-pressed=${this.tool === t} title=${tip} @click=${() => this.setTool(t)}>${label}</button>`)}
        </div>
        <div class="dd-group dd-units" role="group" aria-label="Display units">
          <button type="button" name="units-si" class=${this.unitSystem === 'si' ? 'dd-on' : ''} aria-pressed=${this.unitSystem === 'si'} @click=${() => this.setUnits('si')}>SI</button>
          <button type="button" name="units-us" class=${this.unitSystem === 'us' ? 'dd-on' : ''} aria-pressed=${this.unitSystem === 'us'} @click=${() => this.setUnits('us')}>US</button>
          ${this.unitSystem === 'si' ? html`<select name="rate-unit" aria-label="Rate unit" @change=${(e: Event) => this.setUnits('si', (e.target as HTMLSelectElement).value)}>
            ${['m³/h', 'L/s', 'm³/d'].map((r) => html`<option ?selected=${u.rate === r}>${r}</option>`)}</select>
            <select name="velocity-unit" aria-label="Conductivity unit" @change=${(e: Event) => this.store.apply('display units', (d) => setViewSettings(d, { units: { ...getViewSettings(d).units, velocity: (e.target as HTMLSelectElement).value } }))}>
            ${['m/s', 'm/d'].map((r) => html`<option ?selected=${u.velocity === r}>${r}</option>`)}</select>` : nothing}
        </div>
      </header>
      <main class="dd-main">
        <section class="dd-map-area" aria-label="Plan">
          <plan-map @map-ready=${(e: CustomEvent<LeafletMapController>) => this.onMapReady(e.detail)}
            @map-cursor=${this.onMapEvent} @map-click=${this.onMapEvent} @map-selectWell=${this.onMapEvent} @map-selectExcavation=${this.onMapEvent}
            @map-dragWell=${this.onMapEvent} @map-selectPiezometer=${this.onMapEvent} @map-dragPiezometer=${this.onMapEvent} @map-selectReceptor=${this.onMapEvent} @map-dragReceptor=${this.onMapEvent} @map-dragVertex=${this.onMapEvent} @map-insertVertex=${this.onMapEvent} @map-drawnOutline=${this.onMapEvent}
            @map-drawnLine=${this.onMapEvent} @map-viewChanged=${this.onMapEvent} @map-focusExcavation=${this.onMapEvent}></plan-map>
          <div class="dd-map-top">
            ${this.result ? html`<shortfall-badges .shortfall=${this.result.shortfall} .units=${u} ?stale=${this.computing >= 0} ?paused=${this.issues.length > 0}
              .designTime_s=${s.design.time_s}
              @focus-excavation=${(e: CustomEvent<string>) => this.focusExcavation(e.detail)}></shortfall-badges>` : nothing}
            ${this.issues.length > 0 ? html`<div class="dd-issues" role="alert"><strong>Results paused — the scenario needs fixing:</strong>
              <ul>${this.issues.slice(0, 5).map((i) => html`<li title=${i.path || '/'}>${plainIssue(i)}</li>`)}</ul></div>` : nothing}
            ${this.engineError ? html`<div class="dd-issues" role="alert"><strong>Not computed:</strong> ${this.engineError}</div>` : nothing}
            ${this.tool !== 'select' ? html`<div class="dd-tool-hint" role="status">${TOOLS.find((t) => t[0] === this.tool)?.[2] ?? 'Click the map to pick the site point'} — Esc to stop</div>` : nothing}
          </div>
          <map-legend .result=${this.result} .units=${u} .staticLevel_m=${s.aquifer.staticLevel_m} .computing=${this.computing} ?paused=${this.issues.length > 0}></map-legend>
          <div class="dd-cursor" aria-live="off">${this.cursor || (this.projection && !this.projection.ok && s.crs ? this.projection.message : coordinateUnit({ crs: s.crs, proj4: s.proj4, units: u }).caption)}</div>
          ${this.notice ? html`<div class="dd-notice" role="status">${this.notice}</div>` : nothing}
          ${this.drawer ? this.renderDrawer(pitAtInspect ? pitAtInspect.formationLevel_m - pitAtInspect.margin_m : null) : nothing}
          <p class="dd-map-caution">Idealised model (homogeneous, isotropic, infinite except stated boundaries) — estimates for design; defer to site investigation, local codes and a licensed engineer.</p>
        </section>
        <aside class="dd-side" aria-label="Panels">
          <scenario-warnings .scenario=${s}></scenario-warnings>
          <nav class="dd-tabs" role="tablist">
            ${TABS.map(([t, label]) => html`<button type="button" role="tab" name=${`tab-${t}`} aria-selected=${this.tab === t} class=${this.tab === t ? 'dd-on' : ''} @click=${() => (this.tab = t)}>${label}</button>`)}
          </nav>
          <div class="dd-tab-body" role="tabpanel" ?hidden=${this.tab === 'store' || this.tab === 'test' || this.tab === 'import'}>${this.tab === 'store' || this.tab === 'test' || this.tab === 'import' ? nothing : this.renderTab(times, ti, view.contour?.step_m)}</div>
          <!-- Kept alive across tab switches: the readings and fits stay while the designer checks the ground model. -->
          <div class="dd-tab-body" role="tabpanel" ?hidden=${this.tab !== 'test'}>
            <pumping-test-panel .store=${this.store} .scenario=${s} .units=${this.units} .shown=${this.tab === 'test'}></pumping-test-panel>
          </div>
          <!-- Kept alive across tab switches: opened site files and their previews on the map stay. -->
          <div class="dd-tab-body" role="tabpanel" ?hidden=${this.tab !== 'import'}>
            <site-import-panel .store=${this.store} .scenario=${s} .units=${this.units} .map=${this.controller?.map ?? null} .shown=${this.tab === 'import'}
              .storedScenarioId=${this.storedScenarioId} @import-test-readings=${this.onImportedTestReadings}></site-import-panel>
          </div>
          <!-- Kept alive across tab switches: it remembers which stored scenario and revision the editor holds. -->
          <div class="dd-tab-body" role="tabpanel" ?hidden=${this.tab !== 'store'}>
            <scenario-store-panel .scenario=${s} @scenario-loaded=${(e: CustomEvent<Scenario>) => this.openStored(e.detail)}></scenario-store-panel>
            ${this.tab === 'store' ? html`<caution-note compact></caution-note>` : nothing}
          </div>
        </aside>
      </main>`;
  }

  private storePanel(): ScenarioStorePanel | null {
    return this.querySelector('scenario-store-panel');
  }

  private readonly storedScenarioId = (): string | null => this.storePanel()?.scenarioId ?? null;

  /** Logger readings from the Import tab become the Test tab's readings file. */
  private onImportedTestReadings = (e: CustomEvent<{ csv: string; name: string }>): void => {
    const panel = this.querySelector<PumpingTestPanel>('pumping-test-panel');
    if (!panel) return;
    panel.csv = e.detail.csv;
    panel.fileName = e.detail.name;
    panel.result = null;
    this.tab = 'test';
  };

  /** A scenario opened from the store (a revision, a restore, theirs after a conflict). */
  private openStored(scenario: Scenario): void {
    const v = validateScenario(scenario);
    if (!v.ok) return this.say(`The stored scenario could not be opened — ${v.issues[0] ? plainIssue(v.issues[0]) : 'it is not a drydig scenario'}. Your current scenario is unchanged.`);
    this.replaceScenario(v.scenario, `open stored “${v.scenario.name}”`, `Opened the stored scenario “${v.scenario.name}”.`, false);
  }

  private renderTab(times: Array<number | null>, ti: number, step: number | undefined) {
    const s = this.scenario;
    const u = this.units;
    switch (this.tab) {
      case 'results':
        return html`<results-panel .result=${this.result} .units=${u} .times=${times} .timeIndex=${ti} .quantity=${this.quantity} .step_m=${step} ?paused=${this.issues.length > 0}
          .error=${this.engineError}
          @quantity-change=${(e: CustomEvent<ContourQuantity>) => this.store.apply('contour quantity', (d) => setViewSettings(d, { contour: { ...getViewSettings(d).contour, quantity: e.detail } }))}
          @step-change=${(e: CustomEvent<number | undefined>) => this.store.apply('contour interval', (d) => setViewSettings(d, { contour: { ...getViewSettings(d).contour, step_m: e.detail } }))}
          @time-change=${(e: CustomEvent<number>) => {
            this.timeIndex = e.detail;
            this.scheduleField('coarse');
            this.scheduleField('fine');
          }}
          @focus-excavation=${(e: CustomEvent<string>) => this.focusExcavation(e.detail)}
          @notify=${(e: CustomEvent<string>) => this.say(e.detail)}></results-panel>`;
      case 'ground':
        return html`<ground-panel .store=${this.store} .scenario=${s} .units=${u} .excavationId=${this.excavationId} .section=${this.section}
          .floors=${this.designFloors && { byExcavation: this.designFloors.byExcavation, stale: this.designFloors.key !== designInputsKey(s) }}
          @choose-tool=${(e: CustomEvent<MapTool>) => this.setTool(e.detail)}></ground-panel>`;
      case 'design':
        return html`<design-panel .scenario=${s} .units=${u} @design-result=${this.onDesignResult}></design-panel>
          <caution-note .notes=${this.result?.model.notes ?? []} compact></caution-note>`;
      case 'section':
        return html`<seepage-panel .scenario=${s} .engine=${this.engine} .planTotal_m3_s=${this.designTotal_m3_s}></seepage-panel>`;
      case 'backdrop':
        return html`<backdrop-panel .store=${this.store} .scenario=${s} .units=${u} .projection=${this.projection} .tileStatus=${this.tileStatus}
          @pick-underlay-ref=${(e: CustomEvent<0 | 1>) => {
            this.pickingRef = e.detail;
            this.setTool('pick-point');
          }}></backdrop-panel>`;
      case 'layout':
      default:
        return this.renderLayout();
    }
  }

  private renderLayout() {
    const s = this.scenario;
    const u = this.units;
    const total = s.wells.reduce((sum, w) => sum + (w.active === false ? 0 : w.rate_m3_s ?? w.schedule?.[0]?.rate_m3_s ?? 0), 0);
    return html`<div class="dd-layout">
      <details open class="dd-section-block"><summary><h3>Wells <small>${s.wells.length} · total ${formatQuantity(total, u.rate)}</small></h3></summary>
        <well-editor .store=${this.store} .scenario=${s} .units=${u} .wellId=${this.wellId}
          @select-well=${(e: CustomEvent<string>) => (this.wellId = e.detail)} @delete-well=${(e: CustomEvent<string>) => this.deleteWell(e.detail)}></well-editor>
        <div class="dd-new-well"><span>New wells:</span>
          <select aria-label="Kind of new wells" @change=${(e: Event) => {
            const kind = (e.target as HTMLSelectElement).value as WellKind;
            this.newWell = { ...this.newWell, kind, radius_m: kind === 'deep' ? 0.15 : kind === 'ejector' ? 0.05 : 0.05, rate_m3_s: kind === 'deep' ? 0.01 : 0.0006 };
            this.newWellScreen = null;
          }}>
            <option value="wellpoint" ?selected=${this.newWell.kind === 'wellpoint'}>Well point</option>
            <option value="deep" ?selected=${this.newWell.kind === 'deep'}>Deep well</option>
            <option value="ejector" ?selected=${this.newWell.kind === 'ejector'}>Ejector</option></select>
          <small>${formatQuantity(this.newWell.rate_m3_s, u.rate)} each, r = ${formatQuantity(this.newWell.radius_m, u.length, { significant: 2 })}</small>
          <button type="button" class="dd-small" @click=${() => this.setTool('add-well')}>Place…</button>
          <div class="dd-form-row dd-new-well-screen">
            <label class="dd-field"><span>Screen top</span><span class="dd-input-unit"><input type="text" inputmode="decimal" name="new-screen-top" placeholder="full" aria-label="Screen top of new wells"
              .value=${displayValue(this.newScreen.screenTop_m, u.length)} @change=${(e: Event) => this.setNewScreen('screenTop_m', (e.target as HTMLInputElement).value)} /><em>${u.length}</em></span></label>
            <label class="dd-field"><span>Screen bottom</span><span class="dd-input-unit"><input type="text" inputmode="decimal" name="new-screen-bottom" placeholder="full" aria-label="Screen bottom of new wells"
              .value=${displayValue(this.newScreen.screenBottom_m, u.length)} @change=${(e: Event) => this.setNewScreen('screenBottom_m', (e.target as HTMLInputElement).value)} /><em>${u.length}</em></span></label>
          </div>
          <small class="dd-hint">${this.newWellScreen ? 'Screen as set here.' : Object.keys(this.newScreen).length ? 'Screen as the wells of this kind already placed (edit to change).' : 'No screen given: full thickness.'}</small></div>
        <ul class="dd-list dd-well-list" aria-label="Wells">${s.wells.slice(0, 400).map((w) => html`<li>
          <button type="button" class=${w.id === this.wellId ? 'dd-on' : ''} data-well=${w.id} @click=${() => {
            this.wellId = w.id;
            this.controller?.setScenario(this.scenario, { wellId: w.id, excavationId: this.excavationId });
          }}><strong>${w.id}</strong><span>${w.kind}</span><span>${w.active === false ? 'off' : w.schedule ? 'schedule' : formatQuantity(w.rate_m3_s ?? 0, u.rate)}</span></button></li>`)}
          ${s.wells.length > 400 ? html`<li class="dd-hint">… ${s.wells.length - 400} more (select them on the map)</li>` : nothing}</ul>
      </details>
      <details open class="dd-section-block dd-monitoring-block"><summary><h3>Monitoring <small>${getPiezometers(s).length} piezometers</small></h3></summary>
        <monitoring-editor .store=${this.store} .scenario=${s} .units=${u} .piezometerId=${this.piezometerId} .engine=${this.engine} ?paused=${this.issues.length > 0}
          @select-piezometer=${(e: CustomEvent<string>) => this.selectPiezometer(e.detail)} @delete-piezometer=${(e: CustomEvent<string>) => this.removePiezometer(e.detail)}
          @choose-tool=${(e: CustomEvent<MapTool>) => this.setTool(e.detail)}></monitoring-editor>
      </details>
      <details open class="dd-section-block dd-receptor-block"><summary><h3>Neighbours <small>${getReceptors(s).length} receptors</small></h3></summary>
        <receptor-editor .store=${this.store} .scenario=${s} .units=${u} .receptorId=${this.receptorId}
          @select-receptor=${(e: CustomEvent<string>) => this.selectReceptor(e.detail)} @delete-receptor=${(e: CustomEvent<string>) => this.removeReceptor(e.detail)}></receptor-editor>
      </details>
      <details open class="dd-section-block"><summary><h3>Ring of wells</h3></summary>
        <ring-generator .store=${this.store} .scenario=${s} .units=${u}
          @ring-preview=${(e: CustomEvent<{ positions: Array<[number, number]>; path: Array<[number, number]> } | null>) => this.controller?.setRingPreview(e.detail?.positions ?? null, e.detail?.path)}
          @ring-placed=${(e: CustomEvent<{ count: number; first: string; last: string; skipped: number }>) => this.say(`Placed ${e.detail.count} wells, ${e.detail.first} to ${e.detail.last}${e.detail.skipped ? `; skipped ${e.detail.skipped} positions next to existing wells` : ''}.`)}></ring-generator>
      </details>
      <details open class="dd-section-block"><summary><h3>Excavations <small>${s.excavations.length}</small></h3></summary>
        <excavation-editor .store=${this.store} .scenario=${s} .units=${u} .excavationId=${this.excavationId} .projection=${this.projection?.ok ? this.projection : null}
          @select-excavation=${(e: CustomEvent<string | null>) => {
            this.excavationId = e.detail;
            const ex = this.store.scenario.excavations.find((k) => k.id === e.detail);
            this.controller?.setScenario(this.store.scenario, { wellId: this.wellId, excavationId: e.detail });
            if (ex) this.controller?.ensureVisible(ex.outline);
          }}></excavation-editor>
      </details>
    </div>`;
  }

  private drawerFrame = 0;
  /**
   * After a render: the Point/Section drawer sits at the foot of the map unless that would hide
   * the inspected point or a section end while the top would not; then it moves up, under the
   * badges. The map itself never moves under the user. Measured on the next frame, once the
   * drawer's charts have rendered (they set its height).
   */
  protected override updated(): void {
    if (this.drawerFrame) return;
    this.drawerFrame = requestAnimationFrame(() => {
      this.drawerFrame = 0;
      const drawer = this.drawer ? this.querySelector<HTMLElement>('.dd-drawer') : null;
      const area = this.querySelector<HTMLElement>('.dd-map-area');
      const c = this.controller;
      if (!drawer || !area || !c) return;
      const sec = getViewSettings(this.scenario).sections?.[0];
      const pts = this.drawer === 'inspect' && this.inspect ? [this.inspect.point] : this.drawer === 'section' && sec ? [sec.from, sec.to] : [];
      const h = drawer.offsetHeight;
      const w = drawer.offsetWidth + 10;
      const topStart = (this.querySelector<HTMLElement>('.dd-map-top')?.offsetHeight ?? 0) + 20;
      const bottomStart = area.clientHeight - 82 - h;
      const hidden = (y0: number) => pts.some(([x, y]) => {
        const p = c.containerPoint(x, y);
        return p.x >= 0 && p.x <= w + 12 && p.y >= y0 - 12 && p.y <= y0 + h + 12;
      });
      const atTop = hidden(bottomStart) && !hidden(topStart);
      drawer.classList.toggle('dd-drawer-top', atTop);
      drawer.style.top = atTop ? `${topStart}px` : '';
    });
  }

  private renderDrawer(target_m: number | null) {
    const u = this.units;
    const i = this.inspect;
    return html`<div class="dd-drawer" role="region" aria-label="Inspect and section">
      <div class="dd-drawer-tabs">
        <button type="button" class=${this.drawer === 'inspect' ? 'dd-on' : ''} @click=${() => (this.drawer = 'inspect')}>Point</button>
        <button type="button" class=${this.drawer === 'section' ? 'dd-on' : ''} @click=${() => (this.drawer = 'section')}>Section</button>
        <button type="button" class="dd-icon dd-close" title="Close" @click=${() => (this.drawer = null)}>×</button>
      </div>
      ${this.drawer === 'inspect'
        ? i ? html`<div class="dd-inspect">
            <dl class="dd-readout">
              <div><dt>At</dt><dd>E ${formatQuantity(i.point[0], u.coordinate, { decimals: 2, withUnit: false })}, N ${formatQuantity(i.point[1], u.coordinate, { decimals: 2, withUnit: false })} ${fromSi(1, u.coordinate) === 1 ? 'm' : 'ft'}</dd></div>
              <div><dt>Time</dt><dd>${formatDuration(i.current.time_s)}</dd></div>
              <div><dt>${this.scenario.aquifer.kind === 'unconfined' ? 'Water table' : 'Piezometric level'}</dt><dd data-inspect="level">${formatQuantity(i.current.level_m, u.length, { decimals: 2 })}</dd></div>
              <div><dt>Drawdown</dt><dd data-inspect="drawdown">${formatQuantity(i.current.drawdown_m, u.length, { decimals: 2 })}</dd></div>
              ${target_m !== null ? html`<div><dt>Against target</dt><dd class=${i.current.level_m > target_m ? 'dd-bad' : 'dd-good'}>${i.current.level_m > target_m ? `${formatQuantity(i.current.level_m - target_m, u.length, { decimals: 2 })} above` : `${formatQuantity(target_m - i.current.level_m, u.length, { decimals: 2 })} below`}</dd></div>` : nothing}
              ${i.current.flags.length ? html`<div><dt>Flags</dt><dd class="dd-bad">${i.current.flags.join(', ')}</dd></div>` : nothing}
            </dl>
            <time-chart .series=${i.series} .units=${u} .staticLevel_m=${this.scenario.aquifer.staticLevel_m} .target_m=${target_m} .current_s=${i.current.time_s}></time-chart>
            <p class="dd-chart-note">${methodName(i.model.method)} · idealised model, estimates only.</p></div>`
          : html`<p class="dd-hint">Click the map (Select tool) to see the level there and how it develops with time.</p>`
        : html`<section-chart .section=${this.section} .scenario=${this.scenario} .units=${u}></section-chart>
          ${this.section ? html`<p class="dd-chart-note">${methodName(this.section.model.method)} at ${formatDuration(this.section.points[0]?.time_s ?? null)} · idealised model, estimates only.</p>` : nothing}`}
    </div>`;
  }
}
if (!customElements.get('drydig-app')) customElements.define('drydig-app', DrydigApp);
