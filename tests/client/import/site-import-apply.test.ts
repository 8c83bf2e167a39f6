import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { validateScenario, type Scenario } from '../../../shared/schema';
import { buildGroundFromBoreholes, parseAgs4, readBoreholes } from '../../../shared/import';
import { addMarksAsPiezometers, addMarksAsWells, addOutlinesAsExcavations, applyGroundProfile, loggerToTestCsv, recordImport } from '../../../client/import';

const demo = () => JSON.parse(readFileSync(new URL('../../../fixtures/demo-deepwells-confined.json', import.meta.url), 'utf8')) as Scenario;
const ags = readFileSync(new URL('../../../fixtures/imports/demo-site-investigation.ags', import.meta.url), 'utf8');
const boreholes = readBoreholes(parseAgs4(ags));
const square: Array<[number, number]> = [[0, 0], [10, 0], [10, 10], [0, 10]];

describe('addOutlinesAsExcavations(draft, options)', () => {
  it('adds outlines with free ids from the layer name, or replaces the excavations', () => {
    const d = demo();
    d.excavations.push({ id: 'PIT-1', outline: square, formationLevel_m: 7, margin_m: 0.5 });
    expect(addOutlinesAsExcavations(d, { outlines: [square, square], formationLevel_m: 6, margin_m: 0.3, replace: false, prefix: 'PIT' })).toEqual(['PIT-2', 'PIT-3']);
    expect(d.excavations).toHaveLength(4);
    expect(addOutlinesAsExcavations(d, { outlines: [square], formationLevel_m: 6, margin_m: 0.3, replace: true, prefix: 'site plan/pits' })).toEqual(['site-plan-pits-1']);
    expect(d.excavations).toEqual([{ id: 'site-plan-pits-1', outline: square, formationLevel_m: 6, margin_m: 0.3 }]);
    expect(validateScenario(d).ok).toBe(true);
  });
});

describe('addMarksAsWells / addMarksAsPiezometers', () => {
  const marks = [{ layer: 'WELLS', x: 389195, y: 5819395, name: 'point' }, { layer: 'WELLS', x: 389215, y: 5819445, name: 'WELLMARK' }];
  it('adds existing wells switched off, so the design does not change until the designer says', () => {
    const d = demo();
    const before = d.wells.length;
    expect(addMarksAsWells(d, marks, 'WELLS')).toEqual(['WELLS-1', 'WELLS-2']);
    expect(d.wells.slice(before).every((w) => w.active === false && w.rate_m3_s === 0)).toBe(true);
    expect(validateScenario(d).ok).toBe(true);
  });
  it('adds piezometers after the highest PZ number', () => {
    const d = demo();
    expect(addMarksAsPiezometers(d, marks)).toEqual(['PZ3', 'PZ4']);
  });
});

describe('applyGroundProfile(draft, options) with the invented Ferry Road AGS file', () => {
  it('sets the ground layers, the ground level, the static level from the strikes and the aquifer top, and the result validates', () => {
    const d = demo();
    const g = buildGroundFromBoreholes({ boreholes, ids: ['BH1'] });
    const changes = applyGroundProfile(d, { layers: g.layers, groundLevel_m: g.groundLevel_m, staticLevel_m: g.staticLevel_m, baseAtLogEnd: false });
    expect(changes).toEqual(['ground profile: 3 layers', 'ground level 14.2 m', 'static level 13 m', 'aquifer top 6.4 m (top of rtd-3)']);
    expect(d.ground!.layers.map((l) => [l.top_m, l.bottom_m, l.kind])).toEqual([[14.2, 13, 'granular'], [13, 6.4, 'plug'], [6.4, -10.8, 'granular']]);
    expect(d.aquifer.base_m).toBe(-15);
    expect(validateScenario(d).ok).toBe(true);
  });

  it('puts the aquifer base at the end of the log only when asked, and rounds interpolated levels to the millimetre', () => {
    const d = demo();
    const g = buildGroundFromBoreholes({ boreholes, ids: ['BH1', 'BH2'], at: [389215, 5819415] });
    applyGroundProfile(d, { layers: g.layers, groundLevel_m: g.groundLevel_m, staticLevel_m: g.staticLevel_m, baseAtLogEnd: true });
    expect(d.aquifer.base_m).toBe(d.ground!.layers[2]!.bottom_m);
    for (const l of d.ground!.layers) expect(Math.round(l.top_m * 1000) / 1000).toBe(l.top_m);
  });
});

describe('recordImport(draft, record) and scenario.imports', () => {
  const record = { kind: 'ags' as const, name: 'gi.ags', sha256: 'a'.repeat(64), importedAt: '2027-03-01T07:00:00Z', used: 'ground profile from BH1' };
  it('keeps one record per kind and hash, newest last', () => {
    const d = demo();
    recordImport(d, record);
    recordImport(d, { ...record, kind: 'dxf' });
    recordImport(d, { ...record, used: 'again' });
    expect((d as Scenario & { imports: unknown[] }).imports).toEqual([{ ...record, kind: 'dxf' }, { ...record, used: 'again' }]);
    expect(validateScenario(d).ok).toBe(true);
  });
  it('is refused with a JSON pointer when the hash is not 64 hex digits', () => {
    const v = validateScenario({ ...demo(), imports: [{ ...record, sha256: 'XYZ' }] });
    expect(v.ok).toBe(false);
    expect(!v.ok && v.issues[0]!.path).toBe('/imports/0/sha256');
  });
});

describe('loggerToTestCsv(readings, well, distance_m)', () => {
  it('writes the readings CSV the pumping-test analysis reads, leaving out t = 0 and rows without a drawdown', () => {
    const out = loggerToTestCsv([
      { line: 2, time_s: 0, at: null, level_m: 13, drawdown_m: 0 },
      { line: 3, time_s: 60, at: null, level_m: 12.9, drawdown_m: 0.1 },
      { line: 4, time_s: 120, at: null, level_m: 12.8, drawdown_m: null },
    ], 'PZ,A', 18);
    expect(out).toEqual({ csv: 'time_s,drawdown_m,distance_m,well\n60,0.1,18,PZ A\n', rows: 1, withoutDrawdown: 2 });
  });
});
