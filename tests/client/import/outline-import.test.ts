import { describe, expect, it } from 'vitest';
import proj4 from 'proj4';
import { parseCsvOutline, parseGeoJsonOutlines } from '../../../client/import';

const utm33 = proj4('+proj=utm +zone=33 +datum=WGS84 +units=m +no_defs', 'EPSG:4326');
const fromLonLat = (lon: number, lat: number) => utm33.inverse([lon, lat]) as [number, number];

describe('parseGeoJsonOutlines({text, fromLonLat}) reads RFC 7946 polygons into site metres', () => {
  const corners: Array<[number, number]> = [[389300, 5819500], [389320, 5819500], [389320, 5819520], [389300, 5819520]];
  const ring = [...corners, corners[0]!].map((c) => utm33.forward(c));
  it('round-trips a Polygon Feature to the millimetre and drops the closing position', () => {
    const r = parseGeoJsonOutlines({ text: JSON.stringify({ type: 'Feature', properties: { name: 'shaft' }, geometry: { type: 'Polygon', coordinates: [ring] } }), fromLonLat });
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.outlines).toHaveLength(1);
    expect(r.outlines[0]!.name).toBe('shaft');
    r.outlines[0]!.outline.forEach(([x, y], i) => {
      expect(Math.abs(x - corners[i]![0])).toBeLessThanOrEqual(0.001);
      expect(Math.abs(y - corners[i]![1])).toBeLessThanOrEqual(0.001);
    });
  });
  it('reads every polygon of a FeatureCollection and MultiPolygon, noting dropped holes', () => {
    const fc = {
      type: 'FeatureCollection',
      features: [
        { type: 'Feature', properties: {}, geometry: { type: 'MultiPolygon', coordinates: [[ring], [ring, ring]] } },
        { type: 'Feature', properties: {}, geometry: { type: 'Point', coordinates: [13, 52] } },
      ],
    };
    const r = parseGeoJsonOutlines({ text: JSON.stringify(fc), fromLonLat });
    expect(r.ok && r.outlines.length).toBe(2);
    expect(r.ok && r.notes.join(' ')).toMatch(/holes dropped.*Point skipped/);
  });
  it('refuses when there is no CRS to place longitude/latitude in', () => {
    const r = parseGeoJsonOutlines({ text: JSON.stringify({ type: 'Polygon', coordinates: [ring] }) });
    expect(r).toEqual({ ok: false, message: expect.stringMatching(/no coordinate system/) });
  });
  it('names the position that is not longitude/latitude (projected metres by mistake)', () => {
    const bad = { type: 'Polygon', coordinates: [[[389300, 5819500], [389320, 5819500], [389320, 5819520], [389300, 5819500]]] };
    const r = parseGeoJsonOutlines({ text: JSON.stringify(bad), fromLonLat });
    expect(r.ok).toBe(false);
    expect(!r.ok && r.message).toMatch(/\/coordinates\/0\/0 = \[389300, 5819500\] is outside longitude\/latitude range/);
  });
  it.each([
    ['not json', /not valid JSON/],
    ['{"hello": 1}', /not GeoJSON/],
    ['{"type":"Polygon","coordinates":[[[13,52],[13.1,52]]]}', /fewer than 3 distinct positions/],
    ['{"type":"FeatureCollection","features":[]}', /no Polygon/],
  ])('rejects %s with a message', (text, message) => {
    const r = parseGeoJsonOutlines({ text, fromLonLat });
    expect(r.ok).toBe(false);
    expect(!r.ok && r.message).toMatch(message);
  });
});

describe('parseCsvOutline({text}) reads easting/northing rows', () => {
  it.each([
    ['easting,northing\n0,0\n10,0\n10,5\n', [[0, 0], [10, 0], [10, 5]]],
    ['N;E\n0;0\n5,5;10\n0;10\n', [[0, 0], [10, 5.5], [10, 0]]], // header order and decimal comma
    ['# survey\n1\t2\n3\t4\n5\t7\n1\t2\n', [[1, 2], [3, 4], [5, 7]]], // no header, tab, closing row repeated
  ])('parses %j', (text, expected) => {
    const r = parseCsvOutline({ text });
    expect(r.ok && r.outlines[0]!.outline).toEqual(expected);
  });
  it('converts feet to metres exactly (1 ft = 0.3048 m, NIST SP 811)', () => {
    const r = parseCsvOutline({ text: 'x,y\n0,0\n100,0\n100,100\n', toMetres: 0.3048 });
    expect(r.ok && r.outlines[0]!.outline[2]).toEqual([30.48, 30.48]);
  });
  it('names the line that is not two numbers', () => {
    const r = parseCsvOutline({ text: 'easting,northing\n0,0\n10,abc\n10,5\n' });
    expect(!r.ok && r.message).toMatch(/^Line 3: expected easting and northing numbers/);
  });
  it('says when too few vertices remain', () => {
    expect(parseCsvOutline({ text: '0,0\n1,1\n' })).toEqual({ ok: false, message: expect.stringMatching(/at least 3 vertices/) });
  });
});
