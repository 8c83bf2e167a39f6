import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { drydigMessageOf as messageOf } from '../../helpers/drydig-error-of';
import { marksOnLayer, outlinesOnLayer, readDxfSitePlan, simplifyForDisplay } from '../../../shared/import';

const demo = readFileSync(new URL('../../../fixtures/imports/demo-site-plan.dxf', import.meta.url), 'utf8');

describe('readDxfSitePlan(text)', () => {
  const plan = readDxfSitePlan(demo);

  it('lists the layers with their entity counts and takes metres from $INSUNITS 6', () => {
    expect(plan.units).toMatchObject({ code: 6, toMetre: 1, fromHeader: true });
    expect(plan.layers.map((l) => [l.name, l.total])).toEqual([
      ['KERB', 2],
      ['NEIGHBOUR', 1],
      ['PIT', 1],
      ['SITE', 1],
      ['TEXT', 1],
      ['TREES', 1],
      ['WELLS', 3],
    ]);
  });

  it('gives the closed polyline of the PIT layer as an excavation outline', () => {
    expect(outlinesOnLayer(plan, 'PIT')).toEqual([
      [
        [389200, 5819400],
        [389230, 5819400],
        [389230, 5819430],
        [389200, 5819430],
      ],
    ]);
  });

  it('gives points and block inserts of the WELLS layer as marks', () => {
    expect(marksOnLayer(plan, 'WELLS').map((m) => [m.x, m.y, m.name])).toEqual([
      [389195, 5819395, 'point'],
      [389235, 5819435, 'point'],
      [389215, 5819445, 'WELLMARK'],
    ]);
  });

  it('draws a bulged segment as an arc: bulge tan(90°/4) is a quarter circle of radius chord/√2 (DXF bulge = tan(θ/4))', () => {
    const arc = plan.polylines.find((l) => l.layer === 'NEIGHBOUR')!.points;
    // From (389260, 5819440) to (389270, 5819450) counter-clockwise: centre (389260, 5819450), r = 10 m.
    for (const [x, y] of arc) expect(Math.hypot(x - 389260, y - 5819450)).toBeCloseTo(10, 9);
    expect(arc.at(-1)).toEqual([389270, 5819450]);
  });

  it('converts millimetre drawings to metres', () => {
    const mm = readDxfSitePlan(demo.replace('$INSUNITS\n70\n6', '$INSUNITS\n70\n4'));
    expect(outlinesOnLayer(mm, 'PIT')[0]![1]).toEqual([expect.closeTo(389.23, 9), expect.closeTo(5819.4, 9)]);
  });

  it('asks for the unit when the drawing does not state one', () => {
    expect(messageOf(() => readDxfSitePlan(demo.replace('$INSUNITS\n70\n6', '$INSUNITS\n70\n0'), { source: 'plan.dxf' }))).toMatch(/plan.dxf: the drawing's units are not stated.*choose the unit/);
    expect(readDxfSitePlan(demo.replace('$INSUNITS\n70\n6', '$INSUNITS\n70\n0'), { toMetre: 0.001 }).units.toMetre).toBe(0.001);
  });

  it.each([
    ['a text file', 'hello', /not an ASCII DXF file/],
    ['a binary DXF', 'AutoCAD Binary DXF\r\n\x1a\x00', /not an ASCII DXF file/],
  ])('refuses %s with a clear message', (_label, text, message) => {
    expect(messageOf(() => readDxfSitePlan(text))).toMatch(message);
  });
});

describe('simplifyForDisplay(lines, tolerance_m)', () => {
  it('drops vertices within the tolerance of a straight run and keeps corners (Douglas–Peucker)', () => {
    const zigzag: Array<[number, number]> = Array.from({ length: 101 }, (_, i) => [i, i % 2 === 0 ? 0 : 0.001]);
    zigzag.push([100, 50]);
    const [line] = simplifyForDisplay([{ layer: 'X', points: zigzag, closed: false }], 0.01);
    expect(line!.points).toEqual([
      [0, 0],
      [100, 0],
      [100, 50],
    ]);
  });
});
