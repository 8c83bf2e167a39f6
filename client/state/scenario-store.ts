/**
 * The one place the client keeps the scenario being edited, with undo/redo. Every edit goes
 * through `apply` (one undo step) or a gesture (`preview` many times while dragging, then
 * `commit` once), so a later storage/share feature can subscribe here and see every change.
 */
import type { Scenario } from '../../shared/schema';

/** Why the scenario changed, for listeners that care (e.g. a coarse grid while `preview`). */
export type ChangeKind = 'edit' | 'preview' | 'undo' | 'redo' | 'load';

/** A listener of store changes. */
export type StoreListener = (scenario: Scenario, kind: ChangeKind) => void;

/** Options for `ScenarioStore`. */
export interface ScenarioStoreOptions {
  /** Most undo steps kept (default 200; older ones are dropped). */
  historyLimit?: number;
}

interface HistoryEntry {
  scenario: Scenario;
  label: string;
  /** The step swapped the whole scenario (`replace`): undo and redo report it as a 'load'. */
  whole?: boolean;
}

/** Scenario state with bounded undo/redo history. Snapshots are deep copies, never shared. */
export class ScenarioStore {
  private current: Scenario;
  private past: HistoryEntry[] = [];
  private future: HistoryEntry[] = [];
  private gestureStart: Scenario | null = null;
  private readonly listeners = new Set<StoreListener>();
  private readonly historyLimit: number;

  constructor(initial: Scenario, options: ScenarioStoreOptions = {}) {
    this.current = structuredClone(initial);
    this.historyLimit = options.historyLimit ?? 200;
  }

  /** The current scenario. Treat as read-only; change it through `apply`. */
  get scenario(): Scenario {
    return this.current;
  }

  get canUndo(): boolean {
    return this.past.length > 0;
  }

  get canRedo(): boolean {
    return this.future.length > 0;
  }

  /** Label of the step `undo` would revert (for the button's tooltip). */
  get undoLabel(): string | undefined {
    return this.past[this.past.length - 1]?.label;
  }

  /** True when the step `undo` would revert swapped the whole scenario (`replace`). */
  get undoIsReplace(): boolean {
    return this.past[this.past.length - 1]?.whole === true;
  }

  get redoLabel(): string | undefined {
    return this.future[this.future.length - 1]?.label;
  }

  /** Subscribes; returns the unsubscribe function. */
  subscribe(listener: StoreListener): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  /**
   * Applies one edit as one undo step. `mutate` gets a deep copy to change in place (or returns
   * a replacement). An edit that changes nothing records no step.
   */
  apply(label: string, mutate: (draft: Scenario) => Scenario | void): void {
    this.finishGesture();
    const before = this.current;
    const draft = structuredClone(before);
    const next = mutate(draft) ?? draft;
    if (JSON.stringify(next) === JSON.stringify(before)) return;
    this.pushPast({ scenario: before, label });
    this.future = [];
    this.current = next;
    this.emit('edit');
  }

  /** Shows an intermediate state of a gesture (a drag) without recording an undo step. */
  preview(mutate: (draft: Scenario) => Scenario | void): void {
    if (!this.gestureStart) this.gestureStart = this.current;
    const draft = structuredClone(this.current);
    this.current = mutate(draft) ?? draft;
    this.emit('preview');
  }

  /** Ends a gesture: one undo step from where it began to where it ended. */
  commit(label: string): void {
    const start = this.gestureStart;
    this.gestureStart = null;
    if (!start) return;
    if (JSON.stringify(start) === JSON.stringify(this.current)) {
      this.emit('edit');
      return;
    }
    this.pushPast({ scenario: start, label });
    this.future = [];
    this.emit('edit');
  }

  /** Abandons a gesture and restores its starting state (Escape during a drag). */
  cancelGesture(): void {
    if (!this.gestureStart) return;
    this.current = this.gestureStart;
    this.gestureStart = null;
    this.emit('edit');
  }

  undo(): void {
    this.finishGesture();
    const entry = this.past.pop();
    if (!entry) return;
    this.future.push({ scenario: this.current, label: entry.label, whole: entry.whole });
    this.current = entry.scenario;
    this.emit(entry.whole ? 'load' : 'undo');
  }

  redo(): void {
    this.finishGesture();
    const entry = this.future.pop();
    if (!entry) return;
    this.past.push({ scenario: this.current, label: entry.label, whole: entry.whole });
    this.current = entry.scenario;
    this.emit(entry.whole ? 'load' : 'redo');
  }

  /** Replaces the whole scenario (open a file, switch demo) and clears the history. */
  load(scenario: Scenario): void {
    this.gestureStart = null;
    this.current = structuredClone(scenario);
    this.past = [];
    this.future = [];
    this.emit('load');
  }

  /**
   * Replaces the whole scenario (choose a demo, open a file or a stored revision) as one undo
   * step, so the scenario it replaced, edits and all, comes back with `undo`. Listeners see a
   * 'load' (also on its undo and redo: a different site may be shown).
   */
  replace(scenario: Scenario, label: string): void {
    this.finishGesture();
    this.pushPast({ scenario: this.current, label, whole: true });
    this.future = [];
    this.current = structuredClone(scenario);
    this.emit('load');
  }

  private finishGesture(): void {
    if (this.gestureStart) this.commit('move');
  }

  private pushPast(entry: HistoryEntry): void {
    this.past.push(entry);
    if (this.past.length > this.historyLimit) this.past.splice(0, this.past.length - this.historyLimit);
  }

  private emit(kind: ChangeKind): void {
    for (const listener of this.listeners) listener(this.current, kind);
  }
}
