import { describe, expect, it } from 'vitest';
import { ScenarioStore, checkViewSettings, getViewSettings, setViewSettings } from '../../../client/state';
import demo from '../../../fixtures/demo-wellpoints-unconfined.json';
import type { Scenario } from '../../../shared/schema';

const base = demo as unknown as Scenario;

describe('ScenarioStore keeps one scenario with undo and redo', () => {
  it('apply() records one undo step per edit and undo()/redo() walk it', () => {
    const store = new ScenarioStore(base);
    store.apply('move WP01', (d) => void (d.wells[0]!.x = 5));
    store.apply('rename', (d) => void (d.name = 'B'));
    expect(store.scenario.name).toBe('B');
    expect(store.undoLabel).toBe('rename');
    store.undo();
    expect(store.scenario.name).toBe(base.name);
    expect(store.scenario.wells[0]!.x).toBe(5);
    store.undo();
    expect(store.scenario.wells[0]!.x).toBe(-1.5);
    expect(store.canUndo).toBe(false);
    store.redo();
    store.redo();
    expect(store.scenario.name).toBe('B');
    expect(store.canRedo).toBe(false);
  });

  it('replace() swaps the whole scenario as one undo step, reported as a load both ways', () => {
    const store = new ScenarioStore(base);
    const kinds: string[] = [];
    store.subscribe((_, k) => kinds.push(k));
    store.apply('rename', (d) => void (d.name = 'edited'));
    store.replace({ ...base, name: 'other site' }, 'open other');
    expect(store.scenario.name).toBe('other site');
    expect(store.undoIsReplace).toBe(true);
    store.undo();
    expect(store.scenario.name).toBe('edited');
    expect(store.undoIsReplace).toBe(false);
    store.redo();
    expect(store.scenario.name).toBe('other site');
    expect(kinds).toEqual(['edit', 'load', 'load', 'load']);
  });

  it('an edit after an undo clears the redo history', () => {
    const store = new ScenarioStore(base);
    store.apply('a', (d) => void (d.name = 'A'));
    store.undo();
    store.apply('b', (d) => void (d.name = 'B'));
    expect(store.canRedo).toBe(false);
  });

  it('an edit that changes nothing records no step', () => {
    const store = new ScenarioStore(base);
    store.apply('nothing', () => undefined);
    expect(store.canUndo).toBe(false);
  });

  it('preview() then commit() makes a whole drag one undo step', () => {
    const store = new ScenarioStore(base);
    const kinds: string[] = [];
    store.subscribe((_, kind) => kinds.push(kind));
    for (let k = 1; k <= 5; k++) store.preview((d) => void (d.wells[0]!.x = k));
    store.commit('move WP01');
    expect(store.scenario.wells[0]!.x).toBe(5);
    expect(kinds).toEqual(['preview', 'preview', 'preview', 'preview', 'preview', 'edit']);
    store.undo();
    expect(store.scenario.wells[0]!.x).toBe(-1.5);
    expect(store.canUndo).toBe(false);
  });

  it('cancelGesture() restores the state before the drag', () => {
    const store = new ScenarioStore(base);
    store.preview((d) => void (d.wells[0]!.x = 99));
    store.cancelGesture();
    expect(store.scenario.wells[0]!.x).toBe(-1.5);
    expect(store.canUndo).toBe(false);
  });

  it('snapshots are deep copies: changing a returned scenario does not change history', () => {
    const store = new ScenarioStore(base);
    store.apply('a', (d) => void (d.wells[0]!.x = 1));
    store.undo();
    expect(base.wells[0]!.x).toBe(-1.5);
    expect(store.scenario).not.toBe(base);
  });

  it('keeps at most historyLimit steps', () => {
    const store = new ScenarioStore(base, { historyLimit: 3 });
    for (let k = 0; k < 10; k++) store.apply(`n${k}`, (d) => void (d.name = `n${k}`));
    let undos = 0;
    while (store.canUndo) {
      store.undo();
      undos++;
    }
    expect(undos).toBe(3);
    expect(store.scenario.name).toBe('n6');
  });

  it('load() replaces the scenario and clears history', () => {
    const store = new ScenarioStore(base);
    store.apply('a', (d) => void (d.name = 'A'));
    store.load({ ...base, name: 'other' });
    expect(store.scenario.name).toBe('other');
    expect(store.canUndo).toBe(false);
  });
});

describe('view settings live in the optional top-level "view" object', () => {
  it('getViewSettings returns {} for a scenario without one, and for a malformed one', () => {
    expect(getViewSettings(base)).toEqual({});
    expect(getViewSettings({ ...base, view: 'nonsense' } as unknown as Scenario)).toEqual({});
  });
  it('setViewSettings merges into the draft without touching contract fields', () => {
    const draft = structuredClone(base);
    setViewSettings(draft, { units: { system: 'us' } });
    setViewSettings(draft, { contour: { quantity: 'level' } });
    expect(getViewSettings(draft)).toEqual({ units: { system: 'us' }, contour: { quantity: 'level' } });
    expect(draft.wells).toEqual(base.wells);
  });
});

describe('checkViewSettings(scenario) validates the view section against ViewSchema', () => {
  it('accepts what the client writes', () => {
    const s = { ...base, view: { units: { system: 'us' }, contour: { quantity: 'level', step_m: 0.5 }, sections: [{ from: [0, 0], to: [10, 0] }] } } as unknown as Scenario;
    expect(checkViewSettings(s)).toEqual([]);
    expect(getViewSettings(s).contour?.quantity).toBe('level');
  });
  it('names the bad field and getViewSettings ignores a malformed view rather than failing later', () => {
    const s = { ...base, view: { underlay: { imageDataUrl: 'data:image/png;base64,AAAA', width_px: 10, height_px: 10, refs: 5 } } } as unknown as Scenario;
    const issues = checkViewSettings(s);
    expect(issues[0]!.path).toBe('/view/underlay/refs');
    expect(getViewSettings(s)).toEqual({});
  });
  it('refuses a tile URL that is not https', () => {
    const s = { ...base, view: { tileUrl: 'http://tiles.example/{z}/{x}/{y}.png' } } as unknown as Scenario;
    expect(checkViewSettings(s)[0]!.path).toBe('/view/tileUrl');
  });
});
