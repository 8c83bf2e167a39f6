import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { drydigMessageOf as messageOf } from '../../helpers/drydig-error-of';
import { buildGroundFromBoreholes, parseAgs4, readBoreholes } from '../../../shared/import';

const demo = readFileSync(new URL('../../../fixtures/imports/demo-site-investigation.ags', import.meta.url), 'utf8');

describe('parseAgs4(text)', () => {
  it('reads the groups, headings, units and data rows of the invented demo file', () => {
    const groups = parseAgs4(demo);
    expect([...groups.keys()]).toEqual(['PROJ', 'LOCA', 'GEOL', 'WSTG', 'WSTD']);
    expect(groups.get('GEOL')!.rows).toHaveLength(6);
    expect(groups.get('LOCA')!.units[groups.get('LOCA')!.headings.indexOf('LOCA_GL')]).toBe('m');
  });

  it.each([
    ['"GROUP","LOCA"\n"DATA","BH1"\n', /line 2: a DATA row before the HEADING row of group LOCA/],
    ['"GROUP","LOCA"\n"HEADING","LOCA_ID","LOCA_GL"\n"DATA","BH1"\n', /line 3: group LOCA has 2 headings but this DATA row has 1 fields/],
    ['"GROUP","LOCA"\n"HEADING","LOCA_ID\n', /line 2: a quoted field is not closed/],
    ['GROUP,LOCA\n', /line 1: fields must be in double quotes/],
    ['\n\n', /no AGS groups found/],
  ])('refuses a malformed file, naming the line: %j', (text, message) => {
    expect(messageOf(() => parseAgs4(text, 'site.ags'))).toMatch(message);
  });
});

describe('readBoreholes(groups)', () => {
  it('gives each hole its position, ground level, strata as levels and water strikes with the level the water rose to', () => {
    const holes = readBoreholes(parseAgs4(demo));
    expect(holes.map((h) => h.id)).toEqual(['BH1', 'BH2']);
    const bh1 = holes[0]!;
    expect(bh1).toMatchObject({ x: 389205, y: 5819430, groundLevel_m: 14.2 });
    expect(bh1.strata.map((s) => [s.topLevel_m, s.baseLevel_m])).toEqual([
      [14.2, expect.closeTo(13.0, 12)],
      [expect.closeTo(13.0, 12), expect.closeTo(6.4, 12)],
      [expect.closeTo(6.4, 12), expect.closeTo(-10.8, 12)],
    ]);
    // Strike at 7.80 m rose to 1.20 m after 20 min (the later WSTD row): level 14.2 − 1.2 = 13.0 m.
    expect(bh1.waterStrikes[0]).toMatchObject({ depth_m: 7.8, restDepth_m: 1.2, minutes: 20 });
    expect(bh1.waterStrikes[0]!.restLevel_m).toBeCloseTo(13.0, 12);
  });

  it('names a GEOL row for a hole LOCA does not locate', () => {
    const text = demo.replace('"DATA","BH2","0.00","1.00"', '"DATA","BH9","0.00","1.00"');
    expect(messageOf(() => readBoreholes(parseAgs4(text, 'site.ags'), 'site.ags'))).toMatch(/site.ags: line \d+: GEOL names borehole "BH9", which LOCA does not locate/);
  });

  it('names a gap between strata', () => {
    const text = demo.replace('"DATA","BH1","1.20","7.80"', '"DATA","BH1","1.50","7.80"');
    expect(messageOf(() => readBoreholes(parseAgs4(text)))).toMatch(/stratum from 1.5 m does not follow on from the one above, which ends at 1.2 m/);
  });
});

describe('buildGroundFromBoreholes({ boreholes, ids, at })', () => {
  const holes = readBoreholes(parseAgs4(demo));

  it('turns one hole into ground layers: made ground, a clay plug and the gravel aquifer, with suggested weights', () => {
    const g = buildGroundFromBoreholes({ boreholes: holes, ids: ['BH1'] });
    expect(g.layers.map((l) => [l.kind, l.top_m, l.bottom_m])).toEqual([
      ['granular', 14.2, expect.closeTo(13.0, 12)],
      ['plug', expect.closeTo(13.0, 12), expect.closeTo(6.4, 12)],
      ['granular', expect.closeTo(6.4, 12), expect.closeTo(-10.8, 12)],
    ]);
    expect(g.layers[1]!.basis).toMatch(/clay.*confirm/);
    expect(g.staticLevel_m).toBeCloseTo(13.0, 12);
  });

  it('interpolates layer boundaries between two holes by inverse-distance weighting (power 2)', () => {
    // At the midpoint both holes weigh ½: clay base = (6.4 + 6.6)/2 = 6.5 m.
    const mid: [number, number] = [(389205 + 389240) / 2, (5819430 + 5819400) / 2];
    const g = buildGroundFromBoreholes({ boreholes: holes, ids: ['BH1', 'BH2'], at: mid });
    expect(g.layers[1]!.bottom_m).toBeCloseTo(6.5, 12);
    expect(g.groundLevel_m).toBeCloseTo(14.1, 12);
    // Nearer BH2 (a quarter of the way from it): weights 1/d² → 9/10 for BH2, 1/10 for BH1.
    const near: [number, number] = [389240 - 35 / 4, 5819400 + 30 / 4];
    expect(buildGroundFromBoreholes({ boreholes: holes, ids: ['BH1', 'BH2'], at: near }).layers[1]!.bottom_m).toBeCloseTo(0.1 * 6.4 + 0.9 * 6.6, 12);
  });

  it('refuses to interpolate between holes that log different strata', () => {
    const text = demo.replace('"Firm to stiff grey silty CLAY","201","ALV"', '"Loose grey SAND","301","SND"');
    const other = readBoreholes(parseAgs4(text));
    expect(messageOf(() => buildGroundFromBoreholes({ boreholes: other, ids: ['BH1', 'BH2'], at: [0, 0] }))).toMatch(/BH1 and BH2 log different strata/);
  });
});
