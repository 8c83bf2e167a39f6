/**
 * GeoJSON (RFC 7946) and DXF exports of the plan, checked for structure a GIS or CAD program
 * relies on: closed counter-clockwise rings in lon/lat, one feature per well, contours at the
 * computed levels; DXF in metres with one circle per well and closed outlines.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { buildGeoJson, computePlanResults, createSiteProjection, DXF_LAYERS, writeDxf } from '../../../shared/exports';
import type { Scenario } from '../../../shared/schema';
import { engine } from './export-test-helpers';

const demo = (file: string) => JSON.parse(readFileSync(new URL(`../../../fixtures/${file}`, import.meta.url), 'utf8')) as Scenario;
const confined = demo('demo-deepwells-confined.json');
const unconfined = demo('demo-wellpoints-unconfined.json');
const confinedResults = computePlanResults({ scenario: confined, engine });

function ringArea(ring: number[][]): number {
  let a = 0;
  for (let i = 0; i + 1 < ring.length; i++) a += ring[i]![0]! * ring[i + 1]![1]! - ring[i + 1]![0]! * ring[i]![1]!;
  return a / 2;
}

describe('buildGeoJson({ scenario, results, projection })', () => {
  const gj = buildGeoJson({ scenario: confined, results: confinedResults, projection: createSiteProjection(confined), revision: 3 });

  it('writes RFC 7946 lon/lat for a georeferenced scenario, with one Point per well', () => {
    expect(gj.type).toBe('FeatureCollection');
    expect(gj['drydig:coordinates']).toBe('lonlat');
    const wells = gj.features.filter((f) => f.properties.kind === 'well');
    expect(wells).toHaveLength(confined.wells.length);
    for (const w of wells) {
      const [lon, lat] = w.geometry.coordinates as number[];
      expect(lon).toBeGreaterThan(13);
      expect(lon).toBeLessThan(14);
      expect(lat).toBeGreaterThan(52);
      expect(lat).toBeLessThan(53);
    }
    expect(wells[0]!.properties).toMatchObject({ number: 1, id: 'DW1', easting_m: 389194, northing_m: 5819394 });
  });

  it('closes each excavation ring and winds it counter-clockwise (RFC 7946 §3.1.6)', () => {
    const pits = gj.features.filter((f) => f.properties.kind === 'excavation');
    expect(pits).toHaveLength(confined.excavations.length);
    for (const p of pits) {
      const ring = (p.geometry.coordinates as number[][][])[0]!;
      expect(ring[0]).toEqual(ring.at(-1));
      expect(ringArea(ring)).toBeGreaterThan(0);
    }
  });

  it('carries contour lines at the computed levels and the cautions', () => {
    const contours = gj.features.filter((f) => f.properties.kind === 'contour');
    expect(contours.length).toBe(confinedResults.contours.lines.length);
    expect(contours.length).toBeGreaterThan(0);
    for (const c of contours) expect(typeof c.properties.level_m).toBe('number');
    expect(String(gj['drydig:cautions'])).toContain('licensed');
  });

  it('keeps site metres on a local grid and says so', () => {
    const local = buildGeoJson({ scenario: unconfined, projection: null });
    expect(local['drydig:coordinates']).toBe('site-metres');
    const w = local.features.find((f) => f.properties.kind === 'well')!;
    expect(w.geometry.coordinates).toEqual([-1.5, -1.5]);
  });

  it('adds a flag feature for grid nodes outside a method’s validity', () => {
    const heavy = demo('demo-wellpoints-unconfined.json');
    for (const w of heavy.wells) w.rate_m3_s = 0.004;
    const results = computePlanResults({ scenario: heavy, engine });
    const flagged = Object.entries(results.flagCounts).filter(([, n]) => n > 0);
    expect(flagged.length).toBeGreaterThan(0);
    const features = buildGeoJson({ scenario: heavy, results, projection: null }).features.filter((f) => f.properties.kind === 'flag');
    expect(features.map((f) => f.properties.flag).sort()).toEqual(flagged.map(([k]) => k).sort());
  });
});

/** Group-code / value pairs of a DXF text. */
function dxfPairs(text: string): Array<[string, string]> {
  const lines = text.split(/\r?\n/);
  const pairs: Array<[string, string]> = [];
  for (let i = 0; i + 1 < lines.length; i += 2) pairs.push([lines[i]!.trim(), lines[i + 1]!.trim()]);
  return pairs;
}

describe('writeDxf({ scenario, results })', () => {
  const text = writeDxf({ scenario: confined, results: confinedResults });
  const pairs = dxfPairs(text);
  const entities = (type: string) => pairs.filter(([c, v]) => c === '0' && v === type).length;

  it('declares metres ($INSUNITS 6) and ends with EOF', () => {
    const i = pairs.findIndex(([c, v]) => c === '9' && v === '$INSUNITS');
    expect(pairs[i + 1]).toEqual(['70', '6']);
    expect(pairs.at(-1)).toEqual(['0', 'EOF']);
  });

  it('draws one circle and one point per well, on the wells layer', () => {
    expect(entities('CIRCLE')).toBe(confined.wells.length);
    expect(entities('POINT')).toBe(confined.wells.length);
    const layerNames = pairs.filter(([c]) => c === '2').map(([, v]) => v);
    for (const layer of Object.values(DXF_LAYERS)) expect(layerNames).toContain(layer);
  });

  it('draws excavation outlines as closed polylines and contours as 3D polylines at their level', () => {
    expect(entities('LWPOLYLINE')).toBeGreaterThanOrEqual(confined.excavations.length);
    expect(entities('POLYLINE')).toBeGreaterThan(0);
    const firstLevel = confinedResults.contours.lines.find((l) => l.coordinates.length > 0)!.level;
    const zs = pairs.filter(([c]) => c === '30').map(([, v]) => Number(v));
    expect(zs.some((z) => Math.abs(z - firstLevel) < 1e-9)).toBe(true);
  });

  it('labels wells "number id"', () => {
    expect(text).toContain('\n1 DW1\n');
  });
});
