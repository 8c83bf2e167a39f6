import { describe, expect, it } from 'vitest';
import {
  ScenarioStore, deletePiezometer, getPiezometers, monitoringIssues, nextPiezometerId, placePiezometer, setViewSettings,
} from '../../../client/state';
import { validateMonitoring, validateScenario, type Scenario } from '../../../shared/schema';
import wellpoints from '../../../fixtures/demo-wellpoints-unconfined.json';
import deepwells from '../../../fixtures/demo-deepwells-confined.json';

const base = wellpoints as unknown as Scenario;
type Extra = Scenario & { monitoring?: { piezometers: Array<{ id: string; x: number; y: number }>; pumpingStart?: string }; futureSection?: unknown };

describe('nextPiezometerId(piezometers) numbers new piezometers PZ1, PZ2 …', () => {
  it.each([
    [[], 'PZ1'],
    [['PZ1'], 'PZ2'],
    [['PZ1', 'PZ2'], 'PZ3'],
    // A deleted number is not reused: readings taken at the old PZ2 must not attach to a new one.
    [['PZ1', 'PZ3'], 'PZ4'],
    [['north', 'PZ7', 'PZ10'], 'PZ11'],
    [['P1', 'pz2', 'PZ01'], 'PZ2'],
  ] as const)('after %j gives %s', (ids, next) => {
    expect(nextPiezometerId(ids.map((id) => ({ id })))).toBe(next);
  });
});

describe('monitoring edits on a store draft', () => {
  it('placePiezometer() creates the section on a scenario without one and keeps every other field', () => {
    const bare = structuredClone(base) as Extra;
    delete bare.monitoring;
    bare.futureSection = { kept: true };
    const store = new ScenarioStore(bare);
    let id = '';
    store.apply('place piezometer', (d) => void (id = placePiezometer(d, 12.5, -3)));
    expect(id).toBe('PZ1');
    expect((store.scenario as Extra).monitoring).toEqual({ piezometers: [{ id: 'PZ1', x: 12.5, y: -3 }] });
    expect((store.scenario as Extra).futureSection).toEqual({ kept: true });
    store.undo();
    expect((store.scenario as Extra).monitoring).toBeUndefined();
  });

  it('deletePiezometer() keeps the pumping start and the other piezometers', () => {
    const store = new ScenarioStore(base);
    store.apply('delete PZ1', (d) => deletePiezometer(d, 'PZ1'));
    const m = (store.scenario as Extra).monitoring!;
    expect(m.piezometers.map((p) => p.id)).toEqual(['PZ2']);
    expect(m.pumpingStart).toBe('2027-03-01T07:00:00Z');
  });

  it('the store keeps monitoring and unknown top-level fields through edits, drags, undo and redo', () => {
    const start = { ...structuredClone(base), futureSection: { a: [1, 2] } } as Extra;
    const store = new ScenarioStore(start);
    store.apply('move WP01', (d) => void (d.wells[0]!.x = 3));
    store.apply('display units', (d) => setViewSettings(d, { units: { system: 'us' } }));
    store.preview((d) => void (getPiezometers(d)[0]!.x = 21));
    store.commit('move PZ1');
    store.undo();
    store.redo();
    const s = store.scenario as Extra;
    expect(s.futureSection).toEqual({ a: [1, 2] });
    expect(s.monitoring!.pumpingStart).toBe('2027-03-01T07:00:00Z');
    expect(getPiezometers(s).map((p) => [p.id, p.x])).toEqual([['PZ1', 21], ['PZ2', getPiezometers(base)[1]!.x]]);
    expect(s.wells[0]!.x).toBe(3);
  });

  it('monitoringIssues() names the JSON pointer of a bad field', () => {
    const d = structuredClone(base) as Extra;
    (d.monitoring!.piezometers[1] as Record<string, unknown>).x = 'east';
    expect(monitoringIssues(d)[0]?.path).toBe('/monitoring/piezometers/1/x');
    d.monitoring!.piezometers[1]!.x = 1;
    d.monitoring!.piezometers[1]!.id = 'PZ1';
    expect(monitoringIssues(d)[0]).toEqual({ path: '/monitoring/piezometers/1/id', message: 'duplicate piezometer id "PZ1"' });
  });
});

describe('the demo scenarios with their monitoring plans', () => {
  it.each([['well points', wellpoints], ['deep wells', deepwells]] as const)('the %s demo validates as a scenario and as a monitoring plan, with two piezometers', (_name, doc) => {
    expect(validateScenario(doc).ok).toBe(true);
    expect(validateMonitoring(doc)).toEqual([]);
    expect(getPiezometers(doc as unknown as Scenario).map((p) => p.id)).toEqual(['PZ1', 'PZ2']);
  });
});
