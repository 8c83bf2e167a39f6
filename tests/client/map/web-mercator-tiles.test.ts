import { describe, expect, it } from 'vitest';
import { lonLatToTile, tileToLonLat } from '../../../client/map/web-mercator-tiles';

function expectNear(a: number, b: number, tol = 1e-9) {
  expect(Math.abs(a - b), `${a} vs ${b}`).toBeLessThanOrEqual(tol);
}

describe('Web Mercator tile numbering (the {z}/{x}/{y} scheme)', () => {
  // Exact properties of the scheme: tile (0, 0) spans longitude −180…180 at z = 0; its top edge is
  // latitude atan(sinh π) = 85.0511287798…°, the Web Mercator limit; (0°, 0°) is the corner of the
  // four tiles at z = 1.
  it('maps the corners of the world and the origin', () => {
    const [lon, lat] = tileToLonLat(0, 0, 0);
    expectNear(lon, -180);
    expectNear(lat, (Math.atan(Math.sinh(Math.PI)) * 180) / Math.PI);
    expectNear(lat, 85.0511287798066, 1e-9);
    const [x, y] = lonLatToTile(0, 0, 1);
    expectNear(x, 1);
    expectNear(y, 1);
  });
  it('is its own inverse', () => {
    for (const [lon, lat, z] of [[13.3674, 52.5136, 17], [-70.6, -33.45, 12], [151.2, -33.86, 19]] as const) {
      const [tx, ty] = lonLatToTile(lon, lat, z);
      const [lo, la] = tileToLonLat(tx, ty, z);
      expectNear(lo, lon, 1e-9);
      expectNear(la, lat, 1e-9);
    }
  });
});
