/**
 * Messages between the page and the import worker: site files read off the main thread, so a
 * DXF of 10⁵ entities never freezes the plan. The worker answers with what the import panel
 * previews — layers, geometry in site metres simplified for display, boreholes — and the file's
 * SHA-256. Nothing enters the scenario here.
 */
import type { Borehole, DxfLayerSummary, DxfMark, DxfPolyline, DxfText } from '../../shared/import';
import type { PackedLines } from './packed-lines';

export interface DxfImportRequest {
  kind: 'dxf';
  id: number;
  text: string;
  /** Metres per drawing unit when chosen (the header's $INSUNITS otherwise). */
  toMetre?: number;
  /** Display simplification tolerance, m (Douglas–Peucker). */
  tolerance_m: number;
}

export interface AgsImportRequest {
  kind: 'ags';
  id: number;
  text: string;
}

export type ImportRequest = DxfImportRequest | AgsImportRequest;

export interface DxfImportResult {
  kind: 'dxf';
  id: number;
  sha256: string;
  units: { code: number | null; name: string; toMetre: number; fromHeader: boolean };
  layers: DxfLayerSummary[];
  /** The closed polylines as read (outlines are taken from these, unsimplified). */
  polylines: DxfPolyline[];
  /** Every polyline simplified for drawing, packed (transferred, not copied). */
  display: PackedLines;
  marks: DxfMark[];
  texts: DxfText[];
  skipped: Record<string, number>;
  /** Vertices before and after simplification. */
  vertices: { read: number; drawn: number };
}

export interface AgsImportResult {
  kind: 'ags';
  id: number;
  sha256: string;
  groups: string[];
  boreholes: Borehole[];
}

export interface ImportFailure {
  kind: 'error';
  id: number;
  message: string;
}

export type ImportResponse = DxfImportResult | AgsImportResult | ImportFailure;
