/**
 * The client's extension of the scenario: an optional top-level `view` object (the schema allows
 * extra top-level fields). It holds what the plan map needs to show a scenario the same way next
 * time — never anything the engine reads. Reading is defensive: a saved file may carry anything.
 */
import type { Scenario } from '../../shared/schema';
import type { UnitSystem } from '../../shared/units';

/** A site-plan image placed by two reference points: image pixel → site metres. */
export interface UnderlaySettings {
  /** The image as a data: URL (kept in the scenario so it travels with the file). */
  imageDataUrl: string;
  /** Natural size of the image, px. */
  width_px: number;
  height_px: number;
  /** Two reference points: `pixel` in the image (x right, y down), `site` in site metres. */
  refs: [UnderlayRef, UnderlayRef];
  /** 0–1, default 0.6. */
  opacity?: number;
}

/** One reference point of an underlay. */
export interface UnderlayRef {
  pixel: [number, number];
  site: [number, number];
}

/** A section line drawn on the plan, site metres. */
export interface SectionLine {
  from: [number, number];
  to: [number, number];
}

/** What the contours show. */
export type ContourQuantity = 'drawdown' | 'level';

/** Everything under `scenario.view`. */
export interface ViewSettings {
  units?: { system?: UnitSystem; rate?: string; velocity?: string };
  contour?: { quantity?: ContourQuantity; step_m?: number };
  underlay?: UnderlaySettings;
  /** Web-map tile URL template with {z}/{x}/{y}, for georeferenced scenarios when online. */
  tileUrl?: string;
  sections?: SectionLine[];
}

/** The view settings of a scenario, or an empty object. */
export function getViewSettings(scenario: Scenario): ViewSettings {
  const v = (scenario as Record<string, unknown>).view;
  return v && typeof v === 'object' && !Array.isArray(v) ? (v as ViewSettings) : {};
}

/** Sets `view` on a draft scenario (inside a store `apply`). */
export function setViewSettings(draft: Scenario, patch: Partial<ViewSettings>): void {
  const record = draft as Record<string, unknown>;
  record.view = { ...getViewSettings(draft), ...patch };
}
