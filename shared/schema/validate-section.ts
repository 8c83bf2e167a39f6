/**
 * Validates a section document: structure against the schema, then the geometry together
 * (layers contiguous top-down, surface segments covering the extent, walls, wells and drains
 * inside the soil, at least one fixed head). Every issue names the JSON pointer of the field.
 */
import { SectionDocumentSchema, type SectionDocument } from './section-schema';
import { DrydigError, summariseIssues, type FieldIssue } from './error-table';
import { structuralIssuesOf } from './structural-issues';

const EPS_M = 1e-9;

/** Ground level of the section at x (the segment containing x; at a shared end, the lower one). */
export function surfaceLevelAt(doc: Pick<SectionDocument, 'surface'>, x_m: number): number {
  let level = Number.POSITIVE_INFINITY;
  for (const s of doc.surface) if (x_m >= s.x0_m - EPS_M && x_m <= s.x1_m + EPS_M) level = Math.min(level, s.level_m);
  return level;
}

function structural(input: unknown, prefix: string): FieldIssue[] {
  return structuralIssuesOf(SectionDocumentSchema, input, { prefix });
}

function layerIssues(doc: SectionDocument, add: (path: string, message: string) => void): void {
  doc.layers.forEach((l, i) => {
    if (l.top_m <= l.bottom_m) add(`/layers/${i}/bottom_m`, `layer bottom (${l.bottom_m} m) must lie below its top (${l.top_m} m)`);
    const above = doc.layers[i - 1];
    if (above && Math.abs(above.bottom_m - l.top_m) > 1e-6)
      add(`/layers/${i}/top_m`, `layers run top down without gaps: this top (${l.top_m} m) must equal the bottom of layer ${i - 1} (${above.bottom_m} m)`);
  });
}

function surfaceIssues(doc: SectionDocument, top: number, base: number, add: (path: string, message: string) => void): void {
  const { x0_m, x1_m } = doc.extent;
  doc.surface.forEach((s, i) => {
    if (s.x1_m <= s.x0_m) add(`/surface/${i}/x1_m`, `segment end (${s.x1_m} m) must lie right of its start (${s.x0_m} m)`);
    const prev = doc.surface[i - 1];
    if (i === 0 && Math.abs(s.x0_m - x0_m) > 1e-6) add(`/surface/0/x0_m`, `the first segment starts at the extent’s left edge (${x0_m} m)`);
    if (prev && Math.abs(prev.x1_m - s.x0_m) > 1e-6) add(`/surface/${i}/x0_m`, `segments run left to right without gaps: must equal the end of segment ${i - 1} (${prev.x1_m} m)`);
    if (i === doc.surface.length - 1 && Math.abs(s.x1_m - x1_m) > 1e-6) add(`/surface/${i}/x1_m`, `the last segment ends at the extent’s right edge (${x1_m} m)`);
    if (s.level_m > top + 1e-6) add(`/surface/${i}/level_m`, `ground level (${s.level_m} m) is above the top layer’s top (${top} m)`);
    if (s.level_m <= base) add(`/surface/${i}/level_m`, `ground level (${s.level_m} m) must stand above the base (${base} m)`);
  });
}

function inSection(doc: SectionDocument, x: number, pathX: string, add: (path: string, message: string) => void): boolean {
  if (x < doc.extent.x0_m - EPS_M || x > doc.extent.x1_m + EPS_M) {
    add(pathX, `${x} m lies outside the extent (${doc.extent.x0_m} … ${doc.extent.x1_m} m)`);
    return false;
  }
  return true;
}

function featureIssues(doc: SectionDocument, base: number, add: (path: string, message: string) => void): void {
  const { x0_m, x1_m } = doc.extent;
  doc.walls?.forEach((w, i) => {
    if (w.x_m <= x0_m + EPS_M || w.x_m >= x1_m - EPS_M) add(`/walls/${i}/x_m`, `a wall stands inside the extent (${x0_m} … ${x1_m} m), not on its edge`);
    if (w.top_m <= w.toe_m) add(`/walls/${i}/toe_m`, `wall toe (${w.toe_m} m) must lie below the wall top (${w.top_m} m)`);
    if (w.toe_m < base - EPS_M) add(`/walls/${i}/toe_m`, `wall toe (${w.toe_m} m) is below the impermeable base (${base} m); a wall keyed into the base has its toe at ${base} m`);
    else if (w.x_m > x0_m && w.x_m < x1_m && w.toe_m >= surfaceLevelAt(doc, w.x_m)) add(`/walls/${i}/toe_m`, `wall toe (${w.toe_m} m) must reach below the ground at the wall (${surfaceLevelAt(doc, w.x_m)} m)`);
  });
  doc.drains?.forEach((d, i) => {
    if (!inSection(doc, d.x_m, `/drains/${i}/x_m`, add)) return;
    const ground = surfaceLevelAt(doc, d.x_m);
    if (d.level_m > ground + EPS_M || d.level_m <= base) add(`/drains/${i}/level_m`, `drain level (${d.level_m} m) must lie in the soil, between the base (${base} m) and the ground (${ground} m)`);
  });
  doc.wells?.forEach((w, i) => {
    const path = `/wells/${i}`;
    const rateField = doc.geometry === 'plane' ? 'rate_m3_s_per_m' : 'rate_m3_s';
    const wrongRate = doc.geometry === 'plane' ? 'rate_m3_s' : 'rate_m3_s_per_m';
    if (w[wrongRate] !== undefined) add(`${path}/${wrongRate}`, `a ${doc.geometry} section gives a well’s rate as ${rateField}`);
    const given = [w.head_m !== undefined, w[rateField] !== undefined].filter(Boolean).length;
    if (given !== 1) add(`${path}/head_m`, `give either head_m or ${rateField} (exactly one)`);
    if (w.screenTop_m <= w.screenBottom_m) add(`${path}/screenBottom_m`, `screen bottom (${w.screenBottom_m} m) must lie below the screen top (${w.screenTop_m} m)`);
    if (!inSection(doc, w.x_m, `${path}/x_m`, add)) return;
    if (doc.geometry === 'axisymmetric' && w.x_m <= EPS_M) add(`${path}/x_m`, 'a well on the axis has no area to flow through: start the extent at the well’s radius (x0_m = r_w) and put the well there');
    const ground = surfaceLevelAt(doc, w.x_m);
    if (w.screenBottom_m < base - EPS_M) add(`${path}/screenBottom_m`, `screen bottom (${w.screenBottom_m} m) is below the base (${base} m)`);
    if (w.screenTop_m > ground + EPS_M) add(`${path}/screenTop_m`, `screen top (${w.screenTop_m} m) is above the ground at the well (${ground} m)`);
  });
  if (doc.slab) {
    const s = doc.slab;
    if (s.x1_m <= s.x0_m) add('/slab/x1_m', `slab end (${s.x1_m} m) must lie right of its start (${s.x0_m} m)`);
    inSection(doc, s.x0_m, '/slab/x0_m', add);
    inSection(doc, s.x1_m, '/slab/x1_m', add);
  }
  if (doc.floor) {
    if (doc.floor.x1_m <= doc.floor.x0_m) add('/floor/x1_m', `floor end (${doc.floor.x1_m} m) must lie right of its start (${doc.floor.x0_m} m)`);
    inSection(doc, doc.floor.x0_m, '/floor/x0_m', add);
    inSection(doc, doc.floor.x1_m, '/floor/x1_m', add);
  }
  const m = doc.mesh;
  if (m?.minSize_m !== undefined && m.maxSize_m !== undefined && m.minSize_m > m.maxSize_m) add('/mesh/minSize_m', `must not exceed maxSize_m (${m.maxSize_m} m)`);
}

function semantic(doc: SectionDocument): FieldIssue[] {
  const issues: FieldIssue[] = [];
  const add = (path: string, message: string) => issues.push({ path, message });
  const { x0_m, x1_m } = doc.extent;
  if (x1_m <= x0_m) add('/extent/x1_m', `right edge (${x1_m} m) must lie right of the left edge (${x0_m} m)`);
  if (doc.geometry === 'axisymmetric' && x0_m < 0) add('/extent/x0_m', 'an axisymmetric section starts at a radius ≥ 0');
  layerIssues(doc, add);
  if (issues.length > 0) return issues;
  const top = doc.layers[0]!.top_m;
  const base = doc.layers[doc.layers.length - 1]!.bottom_m;
  surfaceIssues(doc, top, base, add);
  if (issues.length > 0) return issues;
  featureIssues(doc, base, add);
  const fixed = doc.surface.some((s) => s.head_m !== null) || (doc.drains?.length ?? 0) > 0 || (doc.wells ?? []).some((w) => w.head_m !== undefined);
  if (!fixed) add('/surface', 'the section needs at least one fixed head (a surface segment with head_m, a drain or a well with head_m): with rates alone steady flow has no solution');
  return issues;
}

export type SectionValidation = { ok: true; section: SectionDocument } | { ok: false; issues: FieldIssue[] };

/** Checks a parsed JSON value against section format v1; never throws. Pointers start with `prefix`. */
export function validateSection(input: unknown, prefix = ''): SectionValidation {
  const s = structural(input, prefix);
  if (s.length > 0) return { ok: false, issues: s };
  const section = input as SectionDocument;
  const issues = semantic(section).map((i) => ({ ...i, path: `${prefix}${i.path}` }));
  return issues.length > 0 ? { ok: false, issues } : { ok: true, section };
}

/** Like validateSection, but throws DRYDIG_ERR_INVALID_SECTION naming the field. */
export function parseSection(input: unknown, prefix = ''): SectionDocument {
  const result = validateSection(input, prefix);
  if (!result.ok) throw new DrydigError('DRYDIG_ERR_INVALID_SECTION', summariseIssues(result.issues), result.issues);
  return result.section;
}
