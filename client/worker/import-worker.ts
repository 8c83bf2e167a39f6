/**
 * The Web Worker that reads site files (DXF, AGS) with the shared import engine, so parsing a
 * large drawing happens off the main thread. One job at a time; every failure comes back as the
 * engine's plain message, never a thrown error.
 */
import { parseAgs4, readBoreholes, readDxfSitePlan, sha256Hex, simplifyForDisplay } from '../../shared/import';
import type { ImportRequest, ImportResponse } from './import-protocol';
import { packLines, packedBuffers } from './packed-lines';

const scope = self as unknown as DedicatedWorkerGlobalScope;

function run(req: ImportRequest): ImportResponse {
  const sha256 = sha256Hex(req.text);
  if (req.kind === 'ags') {
    const groups = parseAgs4(req.text, 'AGS file');
    return { kind: 'ags', id: req.id, sha256, groups: [...groups.keys()], boreholes: readBoreholes(groups, 'AGS file') };
  }
  const plan = readDxfSitePlan(req.text, { source: 'DXF file', ...(req.toMetre !== undefined ? { toMetre: req.toMetre } : {}) });
  const simplified = simplifyForDisplay(plan.polylines, req.tolerance_m);
  const count = (lines: typeof simplified) => lines.reduce((n, l) => n + l.points.length, 0);
  const display = packLines(simplified);
  // Only closed polylines travel unsimplified (outlines are taken from them); the rest is drawn from the display copy.
  return { kind: 'dxf', id: req.id, sha256, ...plan, polylines: plan.polylines.filter((l) => l.closed), display, vertices: { read: count(plan.polylines), drawn: count(simplified) } };
}

scope.onmessage = (event: MessageEvent<ImportRequest>) => {
  const req = event.data;
  let res: ImportResponse;
  try {
    res = run(req);
  } catch (error) {
    res = { kind: 'error', id: req.id, message: error instanceof Error ? error.message : String(error) };
  }
  scope.postMessage(res, res.kind === 'dxf' ? packedBuffers(res.display) : []);
};
