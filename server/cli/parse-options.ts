/**
 * A small, strict command-line option parser: `--name value`, `--name=value` and `--flag`.
 * Unknown options, missing values and repeats are usage errors that name the option, so a typo
 * never silently falls back to a default.
 */
import { DrydigError } from '../../shared/schema';

/** How each option of a command is written. */
export type OptionSpec = Record<string, 'value' | 'flag'>;

export interface ParsedOptions {
  /** Arguments that are not options, in order. */
  positionals: string[];
  /** Option values by name (without the leading dashes); flags are present as 'true'. */
  values: Record<string, string>;
}

/** A usage error (exit 2): `DRYDIG_ERR_CLI_USAGE: <message>`. */
export function usageError(message: string): DrydigError {
  return new DrydigError('DRYDIG_ERR_CLI_USAGE', message);
}

/** Splits `args` by `spec`; `--` ends the options. Throws a usage error naming the bad option. */
export function parseOptions(args: readonly string[], spec: OptionSpec, command: string): ParsedOptions {
  const positionals: string[] = [];
  const values: Record<string, string> = {};
  let onlyPositionals = false;
  for (let i = 0; i < args.length; i++) {
    const arg = args[i]!;
    if (onlyPositionals || !arg.startsWith('--')) {
      // A lone "-x" is not an option we know; say so rather than taking it as a file name.
      if (!onlyPositionals && /^-[A-Za-z]/.test(arg) && arg !== '-h') throw usageError(`${command}: unknown option ${arg} (options are written --name)`);
      if (!onlyPositionals && arg === '-h') {
        values.help = 'true';
        continue;
      }
      positionals.push(arg);
      continue;
    }
    if (arg === '--') {
      onlyPositionals = true;
      continue;
    }
    const eq = arg.indexOf('=');
    const name = arg.slice(2, eq === -1 ? undefined : eq);
    const kind = spec[name];
    if (!kind) {
      const known = Object.keys(spec).map((k) => `--${k}`).join(', ');
      throw usageError(`${command}: unknown option --${name} (known: ${known})`);
    }
    if (name in values) throw usageError(`${command}: --${name} is given more than once`);
    if (kind === 'flag') {
      if (eq !== -1) throw usageError(`${command}: --${name} takes no value`);
      values[name] = 'true';
      continue;
    }
    let value: string | undefined;
    if (eq !== -1) value = arg.slice(eq + 1);
    else {
      value = args[i + 1];
      i++;
    }
    if (value === undefined || value === '') throw usageError(`${command}: --${name} needs a value`);
    values[name] = value;
  }
  return { positionals, values };
}
