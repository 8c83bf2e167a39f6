/**
 * GeoJSON of the plan: wells, excavations, boundaries, piezometers, groundwater-level contours and
 * flagged grid nodes. Georeferenced scenarios give RFC 7946 output (WGS 84 longitude/latitude,
 * site easting/northing kept in each feature's properties); a local grid keeps site metres and
 * says so in `drydig:coordinates`, since RFC 7946 has no place for a local CRS.
 */
import type { Scenario } from '../schema';
import { contourSetToGeoJSON, type FeatureCollectionJson } from '../contours';
import { cautionsText } from './design-cautions';
import type { PlanResults } from './plan-results';
import type { SiteProjection } from '../crs';

type Feature = FeatureCollectionJson['features'][number];

/** Options for `writeGeoJson`. */
export interface GeoJsonOptions {
  scenario: Scenario;
  /** Computed plan (contours, flags); absent: geometry only. */
  results?: PlanResults;
  projection: SiteProjection | null;
  /** Revision shown in the collection's metadata. */
  revision?: number;
}

/** The GeoJSON FeatureCollection object (stringify it for the file). */
export function buildGeoJson(options: GeoJsonOptions): FeatureCollectionJson & Record<string, unknown> {
  const { scenario, projection, results } = options;
  const map = (x: number, y: number): [number, number] => (projection ? projection.toLonLat(x, y) : [x, y]);
  const features: Feature[] = [];

  scenario.excavations.forEach((e) => {
    const ring = e.outline.map(([x, y]) => map(x, y));
    // RFC 7946 §3.1.6: exterior rings counter-clockwise, first point repeated at the end.
    let area2 = 0;
    for (let i = 0; i < ring.length; i++) {
      const a = ring[i]!, b = ring[(i + 1) % ring.length]!;
      area2 += a[0] * b[1] - b[0] * a[1];
    }
    if (area2 < 0) ring.reverse();
    ring.push(ring[0]!);
    const check = results?.excavations.find((c) => c.id === e.id);
    features.push({
      type: 'Feature',
      geometry: { type: 'Polygon', coordinates: [ring] },
      properties: {
        kind: 'excavation', id: e.id, formationLevel_m: e.formationLevel_m, margin_m: e.margin_m,
        targetLevel_m: e.formationLevel_m - e.margin_m,
        ...(check ? { highestLevel_m: check.highestLevel_m, shortfall_m: check.shortfall_m, wetArea_m2: check.wetArea_m2 } : {}),
      },
    });
  });

  scenario.wells.forEach((w, i) => {
    features.push({
      type: 'Feature',
      geometry: { type: 'Point', coordinates: map(w.x, w.y) },
      properties: {
        kind: 'well', number: i + 1, id: w.id, wellKind: w.kind, easting_m: w.x, northing_m: w.y, radius_m: w.radius_m,
        rate_m3_s: w.rate_m3_s ?? null, schedule: w.schedule ?? null, screenTop_m: w.screenTop_m ?? null,
        screenBottom_m: w.screenBottom_m ?? null, active: w.active !== false,
      },
    });
  });

  (scenario.boundaries ?? []).forEach((b, i) => {
    features.push({
      type: 'Feature',
      geometry: { type: 'LineString', coordinates: [map(b.from[0], b.from[1]), map(b.to[0], b.to[1])] },
      properties: { kind: 'boundary', number: i + 1, boundaryKind: b.kind, label: b.label ?? '', note: 'the model treats this as an infinite straight line' },
    });
  });

  const monitoring = (scenario as Scenario & { monitoring?: { piezometers: Array<{ id: string; x: number; y: number; label?: string }> } }).monitoring;
  for (const p of monitoring?.piezometers ?? []) {
    features.push({
      type: 'Feature',
      geometry: { type: 'Point', coordinates: map(p.x, p.y) },
      properties: { kind: 'piezometer', id: p.id, label: p.label ?? '', easting_m: p.x, northing_m: p.y },
    });
  }

  if (results) {
    const contours = contourSetToGeoJSON(results.contours, { valueName: 'level_m', toLonLat: projection ? map : undefined });
    features.push(...contours.features);
    for (const [flag, nodes] of Object.entries(results.flaggedNodes)) {
      if (!nodes || nodes.length === 0) continue;
      features.push({
        type: 'Feature',
        geometry: { type: 'MultiPoint', coordinates: nodes.map(([x, y]) => map(x, y)) },
        properties: { kind: 'flag', flag, nodeCount: results.flagCounts[flag as keyof typeof results.flagCounts] ?? nodes.length, shownCount: nodes.length },
      });
    }
  }

  return {
    type: 'FeatureCollection',
    features,
    'drydig:coordinates': projection ? 'lonlat' : 'site-metres',
    'drydig:scenario': { name: scenario.name, crs: scenario.crs ?? null, revision: options.revision ?? null, time_s: results?.time_s ?? scenario.design.time_s, method: results?.model.method ?? null },
    'drydig:cautions': cautionsText(),
  };
}

/** The GeoJSON text. */
export function writeGeoJson(options: GeoJsonOptions): string {
  return JSON.stringify(buildGeoJson(options));
}
