/**
 * DXF drawing of the plan for CAD (dxf-writer): wells (circle, point and "number id" label),
 * excavation outlines, boundaries, piezometers and groundwater-level contours as 3D polylines at
 * their elevation, all in site coordinates (metres, the scenario CRS), one layer per kind.
 */
import Drawing from 'dxf-writer';
import type { Scenario } from '../schema';
import { planExtent, type PlanResults } from './plan-results';

/** Layer names in the DXF (our own; upper case for CAD convention). */
export const DXF_LAYERS = {
  wells: 'DD_WELLS',
  wellLabels: 'DD_WELL_LABELS',
  excavations: 'DD_EXCAVATIONS',
  boundaries: 'DD_BOUNDARIES',
  piezometers: 'DD_PIEZOMETERS',
  contours: 'DD_GW_CONTOURS',
  contourLabels: 'DD_GW_CONTOUR_LABELS',
  notes: 'DD_NOTES',
} as const;

/** Options for `writeDxf`. */
export interface DxfOptions {
  scenario: Scenario;
  /** Computed plan; absent: no contours. */
  results?: PlanResults;
}

/** DXF text cannot hold control characters; keep labels to printable text. */
function dxfText(text: string): string {
  return Array.from(text, (c) => (c.charCodeAt(0) < 32 || c.charCodeAt(0) === 127 ? ' ' : c)).join('').slice(0, 250);
}

/** The DXF file text. */
export function writeDxf(options: DxfOptions): string {
  const { scenario, results } = options;
  const d = new Drawing();
  d.setUnits('Meters');
  d.addLayer(DXF_LAYERS.wells, Drawing.ACI.BLUE, 'CONTINUOUS');
  d.addLayer(DXF_LAYERS.wellLabels, Drawing.ACI.BLUE, 'CONTINUOUS');
  d.addLayer(DXF_LAYERS.excavations, Drawing.ACI.RED, 'CONTINUOUS');
  d.addLayer(DXF_LAYERS.boundaries, Drawing.ACI.MAGENTA, 'DASHED');
  d.addLayer(DXF_LAYERS.piezometers, Drawing.ACI.GREEN, 'CONTINUOUS');
  d.addLayer(DXF_LAYERS.contours, Drawing.ACI.CYAN, 'CONTINUOUS');
  d.addLayer(DXF_LAYERS.contourLabels, Drawing.ACI.CYAN, 'CONTINUOUS');
  d.addLayer(DXF_LAYERS.notes, Drawing.ACI.WHITE, 'CONTINUOUS');

  const { min, max } = planExtent(scenario);
  const size = Math.max(max[0] - min[0], max[1] - min[1]);
  const textHeight = Math.max(0.2, size / 200);
  // Well radii are centimetres; draw at least a visible symbol, the true radius in the label layer.
  const symbolRadius = Math.max(textHeight * 0.6, 0.1);

  d.setActiveLayer(DXF_LAYERS.excavations);
  for (const e of scenario.excavations) {
    d.drawPolyline(e.outline.map(([x, y]) => [x, y] as [number, number]), true);
    const first = e.outline[0];
    if (first) d.drawText(first[0], first[1] + textHeight, textHeight, 0, dxfText(`${e.id} formation ${e.formationLevel_m} m, target ${(e.formationLevel_m - e.margin_m).toFixed(2)} m`));
  }

  d.setActiveLayer(DXF_LAYERS.boundaries);
  for (const b of scenario.boundaries ?? []) d.drawLine(b.from[0], b.from[1], b.to[0], b.to[1]);

  scenario.wells.forEach((w, i) => {
    d.setActiveLayer(DXF_LAYERS.wells);
    d.drawCircle(w.x, w.y, Math.max(symbolRadius, w.radius_m));
    d.drawPoint(w.x, w.y);
    d.setActiveLayer(DXF_LAYERS.wellLabels);
    d.drawText(w.x + symbolRadius * 1.5, w.y + symbolRadius * 0.5, textHeight, 0, dxfText(`${i + 1} ${w.id}`));
  });

  const monitoring = (scenario as Scenario & { monitoring?: { piezometers: Array<{ id: string; x: number; y: number }> } }).monitoring;
  d.setActiveLayer(DXF_LAYERS.piezometers);
  for (const p of monitoring?.piezometers ?? []) {
    const s = symbolRadius;
    d.drawPolyline([[p.x - s, p.y - s], [p.x + s, p.y - s], [p.x + s, p.y + s], [p.x - s, p.y + s]], true);
    d.drawText(p.x + s * 1.5, p.y - s, textHeight, 0, dxfText(p.id));
  }

  if (results) {
    for (const line of results.contours.lines) {
      d.setActiveLayer(DXF_LAYERS.contours);
      for (const part of line.coordinates) {
        if (part.length < 2) continue;
        d.drawPolyline3d(part.map(([x, y]) => [x, y, line.level] as [number, number, number]));
      }
      d.setActiveLayer(DXF_LAYERS.contourLabels);
      const text = String(Number(line.level.toFixed(3)));
      for (const label of line.labels) d.drawText(label.x, label.y, textHeight * 0.8, (label.angle_rad * 180) / Math.PI, text, 'center', 'middle');
    }
  }

  d.setActiveLayer(DXF_LAYERS.notes);
  d.drawText(min[0], min[1] - 2 * textHeight, textHeight, 0, dxfText(`${scenario.name} - ${scenario.crs ?? 'local site grid'} - levels m above site datum - idealised model, check against site data`));
  return d.toDxfString();
}
