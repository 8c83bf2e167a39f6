/**
 * GeoJSON features from contour results, for export and for map layers.
 *
 * RFC 7946 §4 requires WGS 84 longitude/latitude. Pass `toLonLat` (e.g. a proj4 inverse of the
 * scenario's CRS) to get conforming output; without it coordinates stay in site metres and the
 * collection says so in its `drydig:coordinates` member, so nobody mistakes metres for degrees.
 */
import type { ContourArea, ContourSet } from './contour-grid';
import type { XY } from './grid-frame';

/** Options for `contourSetToGeoJSON`. */
export interface ContourGeoJSONOptions {
  /** Property name for the contoured value, e.g. `drawdown_m` or `level_m` (default `value`). */
  valueName?: string;
  /** Site metres → [longitude, latitude] degrees. Absent: coordinates stay in site metres. */
  toLonLat?: (x: number, y: number) => [number, number];
  /** Include the filled areas as well as the lines (default false). */
  includeAreas?: boolean;
}

/** A GeoJSON FeatureCollection (loosely typed: plain JSON). */
export interface FeatureCollectionJson {
  type: 'FeatureCollection';
  features: Array<{ type: 'Feature'; geometry: { type: string; coordinates: unknown }; properties: Record<string, unknown> }>;
  'drydig:coordinates': 'lonlat' | 'site-metres';
}

/** Wraps a `ContourSet` as GeoJSON: one MultiLineString per level (and one MultiPolygon per area). */
export function contourSetToGeoJSON(set: ContourSet, options: ContourGeoJSONOptions = {}): FeatureCollectionJson {
  const name = options.valueName ?? 'value';
  const t = options.toLonLat;
  const mapPoint = (p: XY): XY => (t ? t(p[0], p[1]) : [p[0], p[1]]);
  const features: FeatureCollectionJson['features'] = set.lines.map((line) => ({
    type: 'Feature',
    geometry: { type: 'MultiLineString', coordinates: line.coordinates.map((l) => l.map(mapPoint)) },
    properties: { kind: 'contour', [name]: line.level },
  }));
  if (options.includeAreas) {
    for (const area of set.areas) features.push(areaFeature(area, name, mapPoint));
  }
  return { type: 'FeatureCollection', features, 'drydig:coordinates': t ? 'lonlat' : 'site-metres' };
}

function areaFeature(area: ContourArea, name: string, mapPoint: (p: XY) => XY): FeatureCollectionJson['features'][number] {
  return {
    type: 'Feature',
    geometry: { type: 'MultiPolygon', coordinates: area.coordinates.map((poly) => poly.map((ring) => ring.map(mapPoint))) },
    properties: { kind: 'at-or-above', [name]: area.level, area_m2: area.area_m2 },
  };
}
