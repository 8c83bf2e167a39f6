/**
 * Set-out CSV and the site projection: coordinates in the site CRS, latitude/longitude through
 * proj4, RFC 4180 quoting and spreadsheet-formula neutralising.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { createSiteProjection, csvCell, writeSetoutCsv } from '../../../shared/exports';
import type { Scenario } from '../../../shared/schema';
import { lookupProjectionDefinition, resolveSiteProjection } from '../../../shared/crs';
import { expectClose } from './export-test-helpers';

const demo = (file: string) => JSON.parse(readFileSync(new URL(`../../../fixtures/${file}`, import.meta.url), 'utf8')) as Scenario;

describe('createSiteProjection(scenario)', () => {
  it('reproduces the EPSG Guidance Note 7-2 Transverse Mercator example (British National Grid)', () => {
    // EPSG GN 7-2, TM worked example: 50°30'N 0°30'E ↔ E 577 274.99 m, N 69 740.50 m (values from memory,
    // agreeing with proj4 to 2 cm). The proj4 text gives the OSGB 1936 projection without a datum shift.
    const projection = createSiteProjection({
      crs: 'EPSG:27700',
      proj4: '+proj=tmerc +lat_0=49 +lon_0=-2 +k=0.9996012717 +x_0=400000 +y_0=-100000 +ellps=airy +units=m +no_defs',
    })!;
    const [lon, lat] = projection.toLonLat(577274.99, 69740.5);
    expectClose(lat, 50.5, { abs: 3e-7 }, 'EPSG GN 7-2 latitude');
    expectClose(lon, 0.5, { abs: 3e-7 }, 'EPSG GN 7-2 longitude');
    const [e, n] = projection.fromLonLat(0.5, 50.5);
    expectClose(e, 577274.99, { abs: 0.02 }, 'EPSG GN 7-2 easting');
    expectClose(n, 69740.5, { abs: 0.02 }, 'EPSG GN 7-2 northing');
  });

  it.each([
    ['EPSG:32633', 500000, 0, 15, 0],
    ['EPSG:32631', 500000, 0, 3, 0],
    ['EPSG:32733', 500000, 10_000_000, 15, 0],
    ['EPSG:25832', 500000, 0, 9, 0],
  ])('puts %s easting 500 000 m on the zone’s central meridian (UTM definition)', (crs, x, y, lon0, lat0) => {
    const [lon, lat] = createSiteProjection({ crs })!.toLonLat(x, y);
    expectClose(lon, lon0, { abs: 1e-9 }, 'UTM central meridian: false easting 500 000 m');
    expectClose(lat, lat0, { abs: 1e-9 }, 'UTM equator: false northing 0 (N) / 10 000 000 m (S)');
  });

  it.each([
    ['EPSG:32633', 389194, 5819394], ['EPSG:32755', 320000, 5810000], ['EPSG:25832', 690000, 5335000], ['EPSG:26918', 585000, 4510000],
    ['EPSG:27700', 530000, 180000], ['EPSG:2154', 652000, 6862000], ['EPSG:28992', 121000, 487000], ['EPSG:2056', 2683000, 1248000],
  ])('gives the same lat/lon for %s as the site view’s resolveSiteProjection (set-out lat/lon = GPS placement), and inverts exactly', (crs, x, y) => {
    // Both paths read the one registry in shared/crs; createSiteProjection adds its own handling
    // of pasted proj4 text and of codes proj4 knows by name, which must not change a shipped code.
    const exported = createSiteProjection({ crs })!;
    const siteView = resolveSiteProjection({ crs });
    expect(siteView.ok).toBe(true);
    if (!siteView.ok) return;
    const [lon1, lat1] = exported.toLonLat(x, y);
    const [lon2, lat2] = siteView.toLonLat(x, y);
    expectClose(lon1, lon2, { abs: 1e-9 }, 'same registry definition on both paths');
    expectClose(lat1, lat2, { abs: 1e-9 }, 'same registry definition on both paths');
    // Identity: the inverse projection returns the set-out point. 5 mm, because proj4 undoes a
    // 7-parameter datum shift with the small-rotation Helmert form, not its exact inverse
    // (measured: 2.2 mm for EPSG:28992, below 1 mm for the others) — far inside staking tolerance.
    const [xBack, yBack] = exported.fromLonLat(lon1, lat1);
    expectClose(xBack, x, { abs: 0.005 }, 'forward then inverse easting');
    expectClose(yBack, y, { abs: 0.005 }, 'forward then inverse northing');
  });

  it('gives no projection for a local grid or a CRS it cannot resolve', () => {
    expect(createSiteProjection({})).toBeNull();
    expect(createSiteProjection({ crs: 'EPSG:999999' })).toBeNull();
    expect(lookupProjectionDefinition('EPSG:25833')!.def).toContain('+zone=33');
    expect(lookupProjectionDefinition('EPSG:25899')).toBeNull();
  });
});

describe('writeSetoutCsv({ scenario, projection })', () => {
  it('lists every well with site coordinates and lat/lon for a georeferenced scenario', () => {
    const scenario = demo('demo-deepwells-confined.json');
    const csv = writeSetoutCsv({ scenario, projection: createSiteProjection(scenario) });
    const lines = csv.split('\r\n');
    expect(lines[0]).toBe('number,well_id,kind,easting_m (EPSG:32633),northing_m (EPSG:32633),latitude_deg (WGS 84),longitude_deg (WGS 84),rate_L_s,rate_changes_over_time,screen_top_m,screen_bottom_m,active');
    expect(lines).toHaveLength(scenario.wells.length + 2);
    const first = lines[1]!.split(',');
    expect(first.slice(0, 5)).toEqual(['1', 'DW1', 'deep', '389194', '5819394']);
    // Inverse check: the lat/lon written goes back to the set-out point within 2 mm (8-decimal rounding).
    const back = createSiteProjection(scenario)!.fromLonLat(Number(first[6]), Number(first[5]));
    expectClose(back[0], 389194, { abs: 0.002 }, 'round trip easting');
    expectClose(back[1], 5819394, { abs: 0.002 }, 'round trip northing');
    expect(first[7]).toBe('12');
    expect(csv.endsWith('\r\n')).toBe(true);
  });

  it('leaves latitude/longitude empty on a local grid', () => {
    const scenario = demo('demo-wellpoints-unconfined.json');
    const row = writeSetoutCsv({ scenario, projection: null }).split('\r\n')[1]!.split(',');
    expect(row[5]).toBe('');
    expect(row[6]).toBe('');
    expect(row[3]).toBe('-1.5');
  });
});

describe('csvCell(value)', () => {
  it.each([
    ['plain', 'plain'],
    ['a,b', '"a,b"'],
    ['say "hi"', '"say ""hi"""'],
    ['=HYPERLINK("x")', '"\'=HYPERLINK(""x"")"'],
    ['+1', "'+1"],
    ['@SUM(A1)', "'@SUM(A1)"],
    [-1.5, '-1.5'],
    [Number.NaN, ''],
    [null, ''],
  ])('writes %j as %s (RFC 4180; OWASP CSV injection)', (value, expected) => {
    expect(csvCell(value as string | number | null)).toBe(expected);
  });
});
