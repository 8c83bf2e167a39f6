/**
 * The export writers' view of the site projection: a scenario in, a projection or null out. A
 * scenario without a CRS is a local grid and has no projection; nothing is invented for it.
 */
import proj4 from 'proj4';
import type { Scenario } from '../schema';
import { lookupProjectionDefinition } from './lookup-projection-definition';
import { resolveSiteProjection, type SiteProjection } from './resolve-site-projection';

/**
 * The transform for a scenario (its `proj4` text, else drydig's definition for its `crs`, else
 * one proj4 carries itself such as EPSG:4326 or the UPS zones), or null for a local grid or a
 * CRS that cannot be resolved.
 */
export function createSiteProjection(scenario: Pick<Scenario, 'crs' | 'proj4'>): SiteProjection | null {
  const crs = scenario.crs;
  if (!crs) return null;
  // Exports have always accepted the codes proj4 knows by name; the registry covers the rest.
  const byName = scenario.proj4 === undefined && !lookupProjectionDefinition(crs) && proj4.defs(crs) ? crs : undefined;
  const resolved = resolveSiteProjection({ crs, proj4: scenario.proj4 ?? byName });
  return resolved.ok ? resolved : null;
}
