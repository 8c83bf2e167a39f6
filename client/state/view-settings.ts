/**
 * The client's extension of the scenario: an optional top-level `view` object (the schema allows
 * extra top-level fields). It holds what the plan map needs to show a scenario the same way next
 * time — never anything the engine reads. Reading is defensive: a saved file may carry anything.
 */
import { Value } from '@sinclair/typebox/value';
import { ViewSchema, type FieldIssue, type Scenario } from '../../shared/schema';
import type { UnitSystem } from '../../shared/units';

// Value.Check interprets the schema; TypeCompiler would need eval, which the page's CSP forbids.
const viewCheck = { Check: (v: unknown) => Value.Check(ViewSchema, v), Errors: (v: unknown) => Value.Errors(ViewSchema, v) };
const checked = new WeakMap<object, boolean>();

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

/**
 * The view settings of a scenario, or an empty object when there are none or they do not match
 * `ViewSchema` (a hand-edited file must not break the map; `checkViewSettings` says what is wrong).
 */
export function getViewSettings(scenario: Scenario): ViewSettings {
  const v = (scenario as Record<string, unknown>).view;
  if (!v || typeof v !== 'object' || Array.isArray(v)) return {};
  let ok = checked.get(v);
  if (ok === undefined) {
    ok = viewCheck.Check(v);
    checked.set(v, ok);
  }
  return ok ? (v as ViewSettings) : {};
}

/** Problems with a scenario's `view` section, each naming its JSON pointer (at most 5). */
export function checkViewSettings(scenario: Scenario): FieldIssue[] {
  const v = (scenario as Record<string, unknown>).view;
  if (v === undefined) return [];
  if (!v || typeof v !== 'object' || Array.isArray(v)) return [{ path: '/view', message: 'must be an object' }];
  const issues: FieldIssue[] = [];
  for (const e of viewCheck.Errors(v)) {
    issues.push({ path: `/view${e.path}`, message: e.message.replace(/^Expected/, 'must be').toLowerCase() });
    if (issues.length >= 5) break;
  }
  return issues;
}

/** Sets `view` on a draft scenario (inside a store `apply`). */
export function setViewSettings(draft: Scenario, patch: Partial<ViewSettings>): void {
  const record = draft as Record<string, unknown>;
  record.view = { ...getViewSettings(draft), ...patch };
}
