/** The words of the Import tab, in one place. */
export const IMPORT_WORDS = {
  intro: 'Bring the site in as it arrives: the site plan as DXF, the ground investigation as AGS, logger readings as CSV. Files are read in the browser; nothing enters the scenario until you apply it, and each applied file is kept by its SHA-256.',
  dxfHint: 'ASCII DXF (R12 … 2018) in the site grid. Pick the layer whose closed polylines are the excavation outlines, the layer whose points or blocks are existing wells or receptors, and the layers to draw as a backdrop.',
  agsHint: 'AGS4 file: boreholes (LOCA), strata (GEOL) and water strikes (WSTG, WSTD). Pick a borehole, or several to interpolate between, and confirm each layer before it becomes the ground profile.',
  loggerHint: 'Logger CSV with a time column (ISO 8601 or elapsed) and a level, drawdown or pressure column. Map the columns, check the preview, then send the readings on.',
  confirmLayer: 'Kind and unit weights (γsat, γ in kN/m³) are suggestions from the description: confirm each layer against the log and the laboratory results.',
  caution: 'Imported data are only as good as their source: check outlines against the setting-out drawings and the ground profile against the full logs, and have the design reviewed by a licensed engineer.',
  strikesCaution: 'A water strike rises while the hole stands and may be sealed off by casing: rest levels from strikes are indications, to be confirmed by standpipe or piezometer readings over time.',
} as const;

/** Roles a DXF layer can play. */
export const DXF_ROLE_LABELS = { outlines: 'Outlines', marks: 'Wells', backdrop: 'Backdrop' } as const;
