/**
 * Excavation outlines from a GeoJSON file. RFC 7946 coordinates are WGS 84 longitude/latitude
 * (§4), so each position is transformed into the site CRS; a file without a usable CRS is
 * refused with a message rather than read as metres.
 */

/** One outline read from a file, in site metres, with the feature's name if it had one. */
export interface ImportedOutline {
  name?: string;
  outline: Array<[number, number]>;
}

/** Result of an import: outlines, or problems naming where in the file they are. */
export type OutlineImport = { ok: true; outlines: ImportedOutline[]; notes: string[] } | { ok: false; message: string };

/** Options for `parseGeoJsonOutlines`. */
export interface ParseGeoJsonOutlinesOptions {
  /** The file's text. */
  text: string;
  /** WGS 84 lon/lat → site metres; absent when the scenario has no CRS (import is refused). */
  fromLonLat?: (lon: number, lat: number) => [number, number];
}

/**
 * Reads Polygon and MultiPolygon geometries (FeatureCollection, Feature or bare geometry).
 * Exterior rings only: holes in an excavation outline are not part of the v1 scenario model, and
 * the notes say when some were dropped.
 */
export function parseGeoJsonOutlines(options: ParseGeoJsonOutlinesOptions): OutlineImport {
  let doc: unknown;
  try {
    doc = JSON.parse(options.text);
  } catch (error) {
    return { ok: false, message: `The file is not valid JSON: ${(error as Error).message}` };
  }
  const { fromLonLat } = options;
  if (!fromLonLat) {
    return {
      ok: false,
      message: 'GeoJSON positions are longitude/latitude (RFC 7946), but this scenario has no coordinate system to place them in. Set the scenario CRS in Backdrop first, or import a CSV of easting/northing instead.',
    };
  }
  const outlines: ImportedOutline[] = [];
  const notes: string[] = [];
  const problems: string[] = [];

  const readRing = (ring: unknown, where: string): Array<[number, number]> | null => {
    if (!Array.isArray(ring)) {
      problems.push(`${where} is not an array of positions`);
      return null;
    }
    const pts: Array<[number, number]> = [];
    for (let i = 0; i < ring.length; i++) {
      const p = ring[i] as unknown;
      if (!Array.isArray(p) || typeof p[0] !== 'number' || typeof p[1] !== 'number' || !Number.isFinite(p[0]) || !Number.isFinite(p[1])) {
        problems.push(`${where}/${i} is not a [longitude, latitude] position`);
        return null;
      }
      const [lon, lat] = p as [number, number];
      if (Math.abs(lon) > 180 || Math.abs(lat) > 90) {
        problems.push(`${where}/${i} = [${lon}, ${lat}] is outside longitude/latitude range — is the file in projected metres? RFC 7946 GeoJSON must be WGS 84 degrees; use the CSV import for easting/northing`);
        return null;
      }
      pts.push(fromLonLat(lon, lat));
    }
    const first = pts[0];
    const last = pts[pts.length - 1];
    if (first && last && pts.length > 1 && first[0] === last[0] && first[1] === last[1]) pts.pop();
    if (pts.length < 3) {
      problems.push(`${where} has fewer than 3 distinct positions`);
      return null;
    }
    return pts.map(([x, y]) => [round3(x), round3(y)]);
  };

  const readGeometry = (g: unknown, where: string, name?: string) => {
    const geom = g as { type?: unknown; coordinates?: unknown } | null;
    if (!geom || typeof geom !== 'object') return;
    if (geom.type === 'Polygon' && Array.isArray(geom.coordinates)) {
      if (geom.coordinates.length > 1) notes.push(`${where}: holes dropped (outlines are single rings)`);
      const ring = readRing(geom.coordinates[0], `${where}/coordinates/0`);
      if (ring) outlines.push({ name, outline: ring });
    } else if (geom.type === 'MultiPolygon' && Array.isArray(geom.coordinates)) {
      geom.coordinates.forEach((poly: unknown, k: number) => {
        if (!Array.isArray(poly)) return;
        if (poly.length > 1) notes.push(`${where}/coordinates/${k}: holes dropped`);
        const ring = readRing(poly[0], `${where}/coordinates/${k}/0`);
        if (ring) outlines.push({ name: name ? `${name}-${k + 1}` : undefined, outline: ring });
      });
    } else if (geom.type === 'GeometryCollection' && Array.isArray((geom as { geometries?: unknown }).geometries)) {
      ((geom as { geometries: unknown[] }).geometries).forEach((child, k) => readGeometry(child, `${where}/geometries/${k}`, name));
    } else if (typeof geom.type === 'string') {
      notes.push(`${where}: ${geom.type} skipped (only polygons become outlines)`);
    }
  };

  const root = doc as { type?: unknown; features?: unknown; geometry?: unknown; properties?: unknown };
  if (root?.type === 'FeatureCollection' && Array.isArray(root.features)) {
    root.features.forEach((f: unknown, i: number) => {
      const feature = f as { geometry?: unknown; properties?: Record<string, unknown> | null };
      readGeometry(feature?.geometry, `/features/${i}/geometry`, featureName(feature?.properties));
    });
  } else if (root?.type === 'Feature') {
    readGeometry(root.geometry, '/geometry', featureName(root.properties as Record<string, unknown> | null));
  } else if (typeof root?.type === 'string') {
    readGeometry(root, '');
  } else {
    return { ok: false, message: 'The file is JSON but not GeoJSON: expected a FeatureCollection, Feature or Polygon ("type" member).' };
  }
  if (problems.length > 0) return { ok: false, message: problems.slice(0, 3).join('; ') };
  if (outlines.length === 0) return { ok: false, message: 'The GeoJSON holds no Polygon or MultiPolygon to use as an outline.' };
  return { ok: true, outlines, notes };
}

function featureName(props: Record<string, unknown> | null | undefined): string | undefined {
  const v = props?.id ?? props?.name;
  return typeof v === 'string' && v.trim() ? v.trim().slice(0, 64) : undefined;
}

/** Millimetre precision: enough for setting out, keeps the scenario file readable. */
function round3(v: number): number {
  return Math.round(v * 1000) / 1000;
}
