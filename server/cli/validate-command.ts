/**
 * `drydig validate SCENARIO.json [--pretty]`: checks a scenario without computing. A scenario that
 * cannot run ends with exit code 2 and `CODE: message` naming the field (as every command); a
 * runnable one prints `{ "ok": true, "warnings": [ { "code", "path", "message" } ] }`.
 */
import { findScenarioWarnings } from '../../shared/schema';
import type { CliCommand } from './cli-io';
import { parseOptions, usageError } from './parse-options';
import { readScenarioFile } from './read-scenario-file';

export const VALIDATE_HELP = `drydig validate SCENARIO.json [--pretty]

Checks the scenario against format v1 and its cross-field rules. Errors: exit code 2 and one line
naming the field. Otherwise prints {"ok":true,"warnings":[{"code","path","message"}]}: fields that
are accepted but probably not meant (two wells at one spot, a screen above the water table, water
above ground, a well radius over 1 m).
`;

export const runValidateCommand: CliCommand = async (args, io) => {
  const { positionals, values } = parseOptions(args, { pretty: 'flag', help: 'flag' }, 'validate');
  if (values.help) {
    io.stdout(VALIDATE_HELP);
    return 0;
  }
  const [file, ...extra] = positionals;
  if (!file) throw usageError('validate: give a scenario file: drydig validate SCENARIO.json');
  if (extra.length > 0) throw usageError(`validate: one scenario file only (also got ${extra.join(' ')})`);
  const scenario = readScenarioFile(file, io.cwd);
  io.stdout(`${JSON.stringify({ ok: true, warnings: findScenarioWarnings(scenario) }, null, values.pretty ? 2 : undefined)}\n`);
  return 0;
};
