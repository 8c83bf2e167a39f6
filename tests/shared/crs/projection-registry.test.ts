import { describe, expect, it } from 'vitest';
import proj4 from 'proj4';
import { lookupProjectionDefinition, resolveSiteProjection } from '../../../shared/crs';

function expectNear(a: number, b: number, tol: number) {
  expect(Math.abs(a - b), `${a} vs ${b}`).toBeLessThanOrEqual(tol);
}

describe('lookupProjectionDefinition(code) builds UTM zones by formula and knows a few national grids', () => {
  it.each([
    ['EPSG:32633', /\+zone=33 .*WGS84/, 'WGS 84 / UTM zone 33N'],
    ['EPSG:32756', /\+zone=56 \+south/, 'WGS 84 / UTM zone 56S'],
    ['EPSG:25832', /\+zone=32 \+ellps=GRS80/, 'ETRS89 / UTM zone 32N'],
    ['EPSG:26915', /\+zone=15 .*NAD83/, 'NAD83 / UTM zone 15N'],
    ['EPSG:27700', /\+proj=tmerc \+lat_0=49 \+lon_0=-2/, 'OSGB 1936 / British National Grid'],
  ])('%s → %s', (code, def, label) => {
    const d = lookupProjectionDefinition(code)!;
    expect(d.def).toMatch(def);
    expect(d.label).toBe(label);
  });
  it('returns null for codes it does not ship', () => {
    expect(lookupProjectionDefinition('EPSG:99999')).toBeNull();
    expect(lookupProjectionDefinition('EPSG:32661')).toBeNull();
    expect(lookupProjectionDefinition('nonsense')).toBeNull();
  });
});

describe('resolveSiteProjection({crs, proj4}) converts site metres to latitude/longitude', () => {
  // UTM definition (identity, exact): the central meridian at the equator is E 500 000 m,
  // N 0 m in the north and N 10 000 000 m in the south (false northing).
  it.each([
    ['EPSG:32633', 15, 0, 500000, 0],
    ['EPSG:32733', 15, 0, 500000, 10000000],
    ['EPSG:32601', -177, 0, 500000, 0],
  ])('%s puts lon %d°, lat %d° at E %d, N %d', (crs, lon, lat, e, n) => {
    const p = resolveSiteProjection({ crs });
    expect(p.ok).toBe(true);
    if (!p.ok) return;
    const [x, y] = p.fromLonLat(lon, lat);
    expectNear(x, e, 1e-6);
    expectNear(y, n, 1e-6);
    const [lo, la] = p.toLonLat(e, n);
    expectNear(lo, lon, 1e-9);
    expectNear(la, lat, 1e-9);
  });

  it('EPSG:27700 projection matches the EPSG Guidance Note 7-2 transverse Mercator example (from memory)', () => {
    // GN 7-2 §3.5.3 example, OSGB 1936 / British National Grid: φ = 50°30′N, λ = 00°30′E (on the
    // OSGB 1936 datum) → E = 577 274.99 m, N = 69 740.50 m. Values from memory; the check is on
    // the projection alone, so the source is longitude/latitude on the same Airy datum.
    const def = lookupProjectionDefinition('EPSG:27700')!.def;
    const towgs = /\+towgs84=[^ ]+/.exec(def)![0];
    const onAiry = proj4(`+proj=longlat +ellps=airy ${towgs} +no_defs`, def);
    const [e, n] = onAiry.forward([0.5, 50.5]);
    expectNear(e!, 577274.99, 0.02);
    expectNear(n!, 69740.5, 0.02);
  });

  it('a pasted proj4 definition is used for a code drydig does not ship', () => {
    const p = resolveSiteProjection({ crs: 'EPSG:99999', proj4: '+proj=utm +zone=33 +datum=WGS84 +units=m +no_defs' });
    expect(p.ok).toBe(true);
  });

  it.each([
    [{}, /Local site grid/],
    [{ crs: 'EPSG:99999' }, /EPSG:99999 is not one of the coordinate systems drydig knows.*Paste its proj4 definition/],
    [{ crs: 'EPSG:32633', proj4: '+proj=nonsense' }, /could not be used/],
  ])('explains why there is no projection for %o', (opts, message) => {
    const p = resolveSiteProjection(opts);
    expect(p.ok).toBe(false);
    expect(!p.ok && p.message).toMatch(message);
  });
});
