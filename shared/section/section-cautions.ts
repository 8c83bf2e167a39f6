/** The cautions that travel with every section result (design.md §7), one list for the CLI, API, panel and report. */
export const SECTION_CAUTIONS: readonly string[] = [
  'Steady seepage in an idealised section: layers of uniform permeability, walls without leaks at clutches or joints, heads held exactly where fixed, no transient or unsaturated flow.',
  'Exit gradients and heave factors depend strongly on thin low-permeability layers and on the real wall toe level: confirm both by site investigation and monitor pore pressures in the floor.',
  'Factors of safety are unfactored ratios; apply the partial factors of your local code (e.g. EN 1997-1 UPL and HYD with its national annex) before relying on them.',
  'A licensed (chartered / professional) engineer must review this section before it is used to build; drydig does not replace that judgement.',
];
