/**
 * `drydig import FILE.ags | FILE.dxf [--unit M] [--borehole ID[,ID…] [--at x,y]] [--pretty]`:
 * reads a site file as it arrives and prints what drydig found in it — AGS boreholes with strata
 * and water strikes (and, with --borehole, the suggested ground profile), or a DXF's layers with
 * entity counts, outlines and marks — so the designer can check before anything enters a scenario.
 */
import { buildGroundFromBoreholes, parseAgs4, readBoreholes, readDxfSitePlan } from '../../shared/import';
import type { CliCommand } from './cli-io';
import { parseOptions, usageError } from './parse-options';
import { readTextFile } from './read-scenario-file';

export const IMPORT_HELP = `drydig import FILE.ags | FILE.dxf [options] [--pretty]

  FILE.ags          AGS4 ground investigation: boreholes (LOCA), strata (GEOL), water strikes
                    (WSTG, WSTD), printed with levels (ground level − depth)
  --borehole ID     with an AGS file: the suggested ground profile from that hole, or from
                    several (ID,ID…) interpolated at --at x,y (inverse-distance weighting)
  FILE.dxf          ASCII DXF site plan: layers with entity counts, closed outlines and marks
  --unit M          DXF: metres per drawing unit when $INSUNITS is missing (e.g. 0.001 for mm)
  --pretty          indent the JSON

Kinds and unit weights of suggested layers are guesses from the descriptions: confirm each.
`;

export const runImportCommand: CliCommand = async (args, io) => {
  const { positionals, values } = parseOptions(args, { unit: 'value', borehole: 'value', at: 'value', pretty: 'flag', help: 'flag' }, 'import');
  if (values.help) {
    io.stdout(IMPORT_HELP);
    return 0;
  }
  const [file, ...extra] = positionals;
  if (!file) throw usageError('import: give a file: drydig import FILE.ags | FILE.dxf');
  if (extra.length > 0) throw usageError(`import: one file only (also got ${extra.join(' ')})`);
  const text = readTextFile(file, io.cwd, 'site file', 64 * 1024 * 1024);
  const lower = file.toLowerCase();
  let out: unknown;
  if (lower.endsWith('.ags')) {
    const boreholes = readBoreholes(parseAgs4(text, file), file);
    let at: [number, number] | undefined;
    if (values.at !== undefined) {
      const parts = values.at.split(',').map(Number);
      if (parts.length !== 2 || !parts.every(Number.isFinite)) throw usageError(`import: --at must be x,y in metres (got "${values.at}")`);
      at = [parts[0]!, parts[1]!];
    }
    const ids = values.borehole?.split(',').map((s) => s.trim()).filter(Boolean);
    if (ids && ids.length > 1 && !at) throw usageError('import: several boreholes are interpolated at a point: give --at x,y');
    out = { kind: 'ags', boreholes, ...(ids ? { ground: buildGroundFromBoreholes({ boreholes, ids, ...(at ? { at } : {}) }) } : {}) };
  } else if (lower.endsWith('.dxf')) {
    const toMetre = values.unit !== undefined ? Number(values.unit) : undefined;
    if (toMetre !== undefined && !(toMetre > 0)) throw usageError(`import: --unit must be metres per drawing unit, > 0 (got "${values.unit}")`);
    const plan = readDxfSitePlan(text, { source: file, ...(toMetre !== undefined ? { toMetre } : {}) });
    out = { kind: 'dxf', units: plan.units, layers: plan.layers, outlines: plan.polylines.filter((l) => l.closed).length, marks: plan.marks, texts: plan.texts.length, skipped: plan.skipped };
  } else throw usageError(`import: ${file}: drydig reads .ags (AGS4) and .dxf (ASCII DXF) files`);
  io.stdout(`${JSON.stringify(out, null, values.pretty ? 2 : undefined)}\n`);
  return 0;
};
