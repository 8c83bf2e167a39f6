/**
 * A grid kept up to date one well at a time: the sum on every node is linear in the sources, so
 * when a drag moves one well (or a rate edit, an added or a deleted well changes one well's
 * sources) the sum loses that well's old share and gains its new one — its images included —
 * and only the per-node interpretation (level, drawdown, flags) is redone. A frame costs one
 * well's worth of superposition instead of every well's.
 *
 * What is incremental: changes confined to wells' own sources (position, rate or schedule,
 * radius, kind, active, adding or deleting wells) while the model stays the same. Everything else
 * — any other scenario field (aquifer, boundaries, design time, excavations …), a different model
 * (method, T, S, R, B), a different image count (parallel boundaries take more terms when the total
 * rate grows), a change in the partial-penetration tables (a screen, or where the tables start)
 * — is detected by comparing the new field with the cached one, and the grid is evaluated in full and the cache rebuilt. The comparison is of the
 * engine's own source lists, so a dependence not listed here is caught too: every source of every
 * unchanged well must be identical, number for number.
 *
 * Exactness: subtracting and adding shares rounds at about 1e-16 of the largest share per step;
 * after at most MAX_STEPS steps the grid is re-evaluated in full, and `evaluate(scenario, 'full')`
 * (the caller does this when a drag ends) always is. Test: tests/shared/field/incremental-grid.test.ts
 * checks random drags, rate edits, additions and deletions against `evaluateGrid` to 1e-9 m.
 */
import { prepareField, type PreparedField } from './prepare-field';
import type { SourceSet } from './source-set';
import { superposeOnGrid, visitNodesWithinWell } from './superpose';
import { addPartialPenetrationOnGrid, penetrationTableStart } from './partial-penetration-sum';
import { evaluateGrid, interpretGridBand } from './evaluate-grid';
import type { GridResult, GridSpec } from './types';
import type { Scenario } from '../schema';

/** Incremental steps before a full re-evaluation bounds the rounding drift. */
const MAX_STEPS = 400;

/** How the last evaluation was made. */
export interface IncrementalGridStats {
  mode: 'full' | 'incremental';
  /** Wells whose share was replaced (incremental only). */
  wellsChanged: number;
  /** Why the grid was evaluated in full (full only). */
  reason?: string;
}

/** One well's sources, as the engine built them. */
interface WellSources {
  indices: number[];
  /** The well's screen as the partial-penetration table holds it (null: full penetration). */
  screen: readonly [number, number] | null;
}

interface CachedState {
  key: string;
  field: PreparedField;
  byId: Map<string, WellSources>;
  value: Float64Array;
  within: Int32Array;
  reached: Int32Array;
  steps: number;
  /** Where the partial-penetration tables start, m (NaN without partially penetrating wells). */
  penetrationStart_m: number;
}

/** The scenario without its wells (and without fields the field engine never reads), as a key. */
function scenarioKey(scenario: Scenario, time_s: number | null | undefined): string {
  const { wells: _wells, name: _name, imports: _imports, monitoring: _monitoring, ...rest } = scenario as Scenario & { imports?: unknown; monitoring?: unknown };
  return JSON.stringify([rest, time_s === undefined ? 'design' : time_s]);
}

function sourcesById(scenario: Scenario, field: PreparedField): Map<string, WellSources> | null {
  const set = field.sources;
  const byId = new Map<string, WellSources>();
  for (let k = 0; k < set.count; k++) {
    const index = set.well[k]!;
    const id = scenario.wells[index]?.id;
    if (id === undefined) return null;
    let w = byId.get(id);
    if (!w) byId.set(id, (w = { indices: [], screen: field.penetration?.screens[index] ?? null }));
    w.indices.push(k);
  }
  // Ids must be unique for a well's share to be found again.
  return new Set(scenario.wells.map((w) => w.id)).size === scenario.wells.length ? byId : null;
}

function sameShare(a: SourceSet, wa: WellSources, b: SourceSet, wb: WellSources): boolean {
  const ia = wa.indices;
  const ib = wb.indices;
  if (ia.length !== ib.length) return false;
  if ((wa.screen === null) !== (wb.screen === null) || (wa.screen && (wa.screen[0] !== wb.screen![0] || wa.screen[1] !== wb.screen![1]))) return false;
  for (let n = 0; n < ia.length; n++) {
    const p = ia[n]!;
    const q = ib[n]!;
    if (a.x[p] !== b.x[q] || a.y[p] !== b.y[q] || a.amp[p] !== b.amp[q] || a.coef[p] !== b.coef[q] || a.r2min[p] !== b.r2min[q] || a.r2cut[p] !== b.r2cut[q] || a.real[p] !== b.real[q]) return false;
  }
  return true;
}

/** The sources at `indices` of `set`, as a set of their own. */
function subset(set: SourceSet, indices: readonly number[]): SourceSet {
  const n = indices.length;
  const out: SourceSet = {
    kind: set.kind, count: n, invB: set.invB,
    x: new Float64Array(n), y: new Float64Array(n), amp: new Float64Array(n), coef: new Float64Array(n),
    r2min: new Float64Array(n), r2cut: new Float64Array(n), well: new Int32Array(n), real: new Uint8Array(n),
  };
  indices.forEach((k, m) => {
    out.x[m] = set.x[k]!;
    out.y[m] = set.y[k]!;
    out.amp[m] = set.amp[k]!;
    out.coef[m] = set.coef[k]!;
    out.r2min[m] = set.r2min[k]!;
    out.r2cut[m] = set.r2cut[k]!;
    out.well[m] = set.well[k]!;
    out.real[m] = set.real[k]!;
  });
  return out;
}

/**
 * Adds `sign` per source to `within` where a real source's well face covers the node (as the
 * kernel's markWithinWell tests it) and, for Thiem sources, to `reached` where r² < R² (as its
 * thiemRow tests it).
 */
function countFlags(set: SourceSet, grid: GridSpec, within: Int32Array, reached: Int32Array, sign: 1 | -1): void {
  const [nx, ny] = grid.counts;
  const [ox, oy] = grid.origin;
  const [hx, hy] = grid.spacing_m;
  visitNodesWithinWell(set, grid, (node) => (within[node]! += sign));
  if (set.kind !== 'thiem') return;
  for (let k = 0; k < set.count; k++) {
    const sx = set.x[k]!;
    const sy = set.y[k]!;
    const r2cut = set.r2cut[k]!;
    for (let j = 0; j < ny; j++) {
      const dy = oy + j * hy - sy;
      const dy2 = dy * dy;
      const rest = r2cut - dy2;
      if (!(rest > 0)) continue;
      const half = Math.sqrt(rest);
      const i0 = Math.max(0, Math.ceil((sx - half - ox) / hx));
      const i1 = Math.min(nx - 1, Math.floor((sx + half - ox) / hx));
      for (let i = i0; i <= i1; i++) {
        const dx = ox + i * hx - sx;
        if (dx * dx + dy2 < r2cut) reached[j * nx + i]! += sign;
      }
    }
  }
}

/** The partial-penetration tables of the cached field and the new one would be the same (start, reach, scale, aquifer). */
function samePenetrationTables(s: CachedState, field: PreparedField): boolean {
  const a = s.field.penetration;
  const b = field.penetration;
  if (!a || !b) return a === b;
  if (a.thickness_m !== b.thickness_m || a.anisotropyKhKv !== b.anisotropyKhKv || a.leakageFactor_m !== b.leakageFactor_m || a.reach2_m2 !== b.reach2_m2 || a.ampScale !== b.ampScale) return false;
  return penetrationTableStart(b, field.sources) === s.penetrationStart_m;
}

/** A grid at one time kept up to date well by well. */
export class IncrementalGrid {
  private state: CachedState | null = null;
  stats: IncrementalGridStats = { mode: 'full', wellsChanged: 0, reason: 'first evaluation' };

  constructor(readonly grid: GridSpec, readonly time_s?: number | null) {}

  /** The grid for `scenario`: incremental where only some wells' sources changed, else in full. */
  evaluate(scenario: Scenario, mode: 'incremental' | 'full' = 'incremental'): GridResult {
    const key = scenarioKey(scenario, this.time_s);
    const field = prepareField({ scenario, time_s: this.time_s });
    const byId = sourcesById(scenario, field);
    const why = mode === 'full' ? 'full evaluation asked for' : this.whyNotIncremental(key, field, byId);
    if (why !== null || !byId) return this.evaluateInFull(scenario, key, field, byId, why ?? 'well ids repeat');
    const s = this.state!;
    let changed = 0;
    for (const [id, old] of s.byId) {
      const now = byId.get(id);
      if (now && sameShare(s.field.sources, old, field.sources, now)) continue;
      this.addShare(s.field, old.indices, -1);
      changed++;
    }
    for (const [id, now] of byId) {
      const old = s.byId.get(id);
      if (old && sameShare(s.field.sources, old, field.sources, now)) continue;
      this.addShare(field, now.indices, +1);
      if (!old) changed++;
    }
    s.field = field;
    s.byId = byId;
    s.key = key;
    s.steps += changed;
    this.stats = { mode: 'incremental', wellsChanged: changed };
    return this.interpret(field);
  }

  private whyNotIncremental(key: string, field: PreparedField, byId: Map<string, WellSources> | null): string | null {
    const s = this.state;
    if (!s) return 'first evaluation';
    if (!byId) return 'well ids repeat';
    if (s.key !== key) return 'the scenario changed beyond its wells';
    if (!samePenetrationTables(s, field)) return 'the partial-penetration tables changed';
    if (field.sources.kind !== s.field.sources.kind || field.sources.invB !== s.field.sources.invB || field.terms !== s.field.terms) return 'the model changed';
    if (JSON.stringify(field.model) !== JSON.stringify(s.field.model)) return 'the model changed';
    if (s.steps >= MAX_STEPS) return 'refresh after many steps';
    return null;
  }

  private evaluateInFull(scenario: Scenario, key: string, field: PreparedField, byId: Map<string, WellSources> | null, reason: string): GridResult {
    this.stats = { mode: 'full', wellsChanged: 0, reason };
    if (!byId) {
      this.state = null;
      return evaluateGrid({ scenario, grid: this.grid, time_s: this.time_s });
    }
    const sums = superposeOnGrid(field.sources, this.grid);
    const penetrationStart_m = field.penetration ? penetrationTableStart(field.penetration, field.sources) : Number.NaN;
    if (field.penetration) addPartialPenetrationOnGrid(field.penetration, field.sources, this.grid, sums.value, [0, this.grid.counts[1]], penetrationStart_m);
    const n = this.grid.counts[0] * this.grid.counts[1];
    this.state = { key, field, byId, steps: 0, value: sums.value, within: new Int32Array(n), reached: new Int32Array(n), penetrationStart_m };
    // Per-node counts (not the kernel's yes/no) so a well's share can be taken out again.
    countFlags(field.sources, this.grid, this.state.within, this.state.reached, +1);
    return this.interpret(field);
  }

  private addShare(field: PreparedField, indices: readonly number[], sign: 1 | -1): void {
    const s = this.state!;
    const share = subset(field.sources, indices);
    const { value } = superposeOnGrid(share, this.grid);
    if (field.penetration) addPartialPenetrationOnGrid(field.penetration, share, this.grid, value, [0, this.grid.counts[1]], s.penetrationStart_m);
    for (let k = 0; k < value.length; k++) s.value[k]! += sign * value[k]!;
    countFlags(share, this.grid, s.within, s.reached, sign);
  }

  private interpret(field: PreparedField): GridResult {
    const s = this.state!;
    const grid = this.grid;
    const band = interpretGridBand({ field, grid, rows: [0, grid.counts[1]], value: s.value, withinWell: s.within, reached: s.reached });
    return { grid, time_s: band.time_s, drawdown_m: band.drawdown_m, level_m: band.level_m, flags: band.flags, flagCounts: band.flagCounts, model: band.model };
  }
}
