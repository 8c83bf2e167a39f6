/**
 * `drydig section FILE.json [options]`: steady seepage in a vertical section — flow, the floor
 * profile and exit gradient, Terzaghi heave, slab and plug uplift — as the JSON of design.md §8.
 * FILE is a section document (format drydig.section) or a scenario (format drydig.scenario), from
 * whose excavation a half-section is built.
 */
import { writeSectionFloorCsv } from '../../shared/exports';
import { runSectionJob, type SectionJob } from '../../shared/section';
import type { CliCommand } from './cli-io';
import { parseOptions, usageError } from './parse-options';
import { parseStrictNumber } from './points-argument';
import { parseJsonText, readTextFile } from './read-scenario-file';

export const SECTION_HELP = `drydig section FILE.json [--compare] [--flow-net] [--pretty | --csv]
                          [--excavation ID] [--toe LEVEL] [--outside-head LEVEL] [--inside-head LEVEL]

  FILE.json            a section document (format drydig.section, version 1; see the README),
                       or a scenario (format drydig.scenario): a half-section is built across
                       its excavation (ground profile when present, wall, floor, outside level)
  --compare            also solve the options side by side: the wall toe deeper (a sweep),
                       a row of relief wells, a lower inside level
  --flow-net           include the flow net (equipotentials and flow lines as segments)
  --pretty             indent the JSON
  --csv                write the floor profile as CSV instead of JSON
  From a scenario only:
  --excavation ID      the excavation (default the first)
  --toe LEVEL          wall toe, m (default formation − max(2 m, retained head))
  --outside-head LEVEL outside water level, m (e.g. the plan model's head at the edge;
                       default the static level)
  --inside-head LEVEL  water level held on the floor, m (default the formation level)

Prints {"flow_m3_s_per_m" (axisymmetric: "flow_m3_s"), "split", "exitGradient":{"max","x_m",
"criticalGradient","fs"}, "floor":[{"x_m","head_m","gradient",…}], "heave":{"method":"Terzaghi
prism","fs"} | null, "uplift", "plug", "mesh", "solver", "flags", "cautions", …}.
Results are estimates from an idealised section; confirm with site investigation, local codes
and a licensed engineer.
`;

const LEVEL_FLAGS = { toe: 'toe_m', 'outside-head': 'outsideHead_m', 'inside-head': 'insideHead_m' } as const;

export const runSectionCommand: CliCommand = async (args, io) => {
  const spec = { compare: 'flag', 'flow-net': 'flag', pretty: 'flag', csv: 'flag', help: 'flag', excavation: 'value', toe: 'value', 'outside-head': 'value', 'inside-head': 'value' } as const;
  const { positionals, values } = parseOptions(args, spec, 'section');
  if (values.help) {
    io.stdout(SECTION_HELP);
    return 0;
  }
  const [file, ...extra] = positionals;
  if (!file) throw usageError('section: give a section or scenario file: drydig section FILE.json');
  if (extra.length > 0) throw usageError(`section: one file only (also got ${extra.join(' ')})`);
  if (values.csv && values.pretty) throw usageError('section: --pretty is for JSON; leave it out with --csv');
  const fromScenario: NonNullable<SectionJob['fromScenario']> = {};
  for (const [flag, key] of Object.entries(LEVEL_FLAGS)) {
    const text = values[flag];
    if (text === undefined) continue;
    const v = parseStrictNumber(text);
    if (v === undefined || Math.abs(v) > 20_000) throw usageError(`section: --${flag} must be a level in metres (got "${text}")`);
    fromScenario[key] = v;
  }
  if (values.excavation !== undefined) fromScenario.excavationId = values.excavation;
  const value = parseJsonText(readTextFile(file, io.cwd, 'section file'), file);
  const isScenario = typeof value === 'object' && value !== null && (value as { format?: unknown }).format === 'drydig.scenario';
  if (!isScenario && Object.keys(fromScenario).length > 0) throw usageError('section: --excavation, --toe, --outside-head and --inside-head apply to a scenario file only');
  const answer = runSectionJob({
    ...(isScenario ? { scenario: value, fromScenario } : { section: value }),
    compare: Boolean(values.compare),
    flowNet: Boolean(values['flow-net']),
  }, { pointers: 'document' });
  if (values.csv) {
    io.stdout(writeSectionFloorCsv(answer));
    return 0;
  }
  // The built section goes out only when it was built here; a given one the caller has.
  const out = isScenario ? answer : { ...answer, section: undefined };
  io.stdout(`${JSON.stringify(out, (_k, v: unknown) => (typeof v === 'number' && !Number.isFinite(v) ? null : v), values.pretty ? 2 : undefined)}\n`);
  return 0;
};
