/**
 * The cautions shown wherever a design is shown or exported (design.md section 7). One list, so
 * the report, the site view, the CSV and GeoJSON headers all say the same thing.
 */

/** Plain-language cautions, most important first. */
export const DESIGN_CAUTIONS: readonly string[] = [
  'Results are estimates from idealised models: a homogeneous, isotropic aquifer of uniform thickness, infinite except for the boundaries stated, and the published methods named in the assumptions.',
  'Real ground differs. Check every number against site investigation, pumping tests and observed levels, and revise the design when readings depart from the expected levels.',
  'Base stability (uplift, heave, piping), settlement of neighbouring structures and discharge consents need their own checks under the local codes.',
  'A licensed (chartered / professional) engineer must review this design before it is used to build; drydig does not replace that judgement.',
];

/** The cautions as one paragraph (CSV comments, GeoJSON properties). */
export function cautionsText(): string {
  return DESIGN_CAUTIONS.join(' ');
}
