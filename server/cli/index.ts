/**
 * The `drydig` command line (`bin/drydig.js` calls `runCli`). Every command takes a `CliIo` so
 * tests capture its output in-process. Bad input ends with exit code 2 and one line on stderr,
 * `CODE: message`; nothing a user typed can produce a stack trace.
 */
import { DrydigError } from '../../shared/schema';
import { processIo, type CliCommand, type CliIo } from './cli-io';
import { readPackageVersion } from '../routes/health';
import { EVALUATE_HELP, SERVE_HELP, USAGE } from './usage-text';

export type { CliCommand, CliIo } from './cli-io';
export { processIo } from './cli-io';

/** Exit codes: 0 done, 1 unexpected failure, 2 bad input. */
export const EXIT_OK = 0;
export const EXIT_FAILURE = 1;
export const EXIT_BAD_INPUT = 2;

// Loaded on demand: `evaluate` need not start up the web server, SQLite and the design solver.
const COMMANDS: Record<string, () => Promise<CliCommand>> = {
  evaluate: async () => (await import('./evaluate-command')).runEvaluateCommand,
  serve: async () => (await import('./serve-command')).runServeCommand,
  design: async () => (await import('./design-command')).runDesignCommand,
  validate: async () => (await import('./validate-command')).runValidateCommand,
  'pumping-test': async () => (await import('./pumping-test-command')).runPumpingTestCommand,
  import: async () => (await import('./import-command')).runImportCommand,
  section: async () => (await import('./section-command')).runSectionCommand,
  user: async () => (await import('./user-command')).runUserCommand,
  backup: async () => (await import('./backup-command')).runBackupCommand,
  restore: async () => (await import('./backup-command')).runRestoreCommand,
};

const HELP: Record<string, string> = { evaluate: EVALUATE_HELP, serve: SERVE_HELP };

/** One line, whatever the message holds. */
function oneLine(text: string): string {
  return text.replace(/\s*[\r\n]+\s*/g, ' ').trim();
}

/** Runs `drydig <argv…>`, returning the exit code. Never throws. */
export async function runCli(argv: readonly string[], io: CliIo = processIo()): Promise<number> {
  const [command, ...args] = argv;
  try {
    if (command === undefined) {
      io.stderr(USAGE);
      return EXIT_BAD_INPUT;
    }
    if (command === '--help' || command === '-h' || command === 'help') {
      const topic = command === 'help' ? args[0] : undefined;
      if (topic !== undefined && !(topic in COMMANDS)) throw new DrydigError('DRYDIG_ERR_CLI_USAGE', `help: unknown command "${topic}" (commands: ${Object.keys(COMMANDS).join(', ')})`);
      if (topic !== undefined && HELP[topic] === undefined) return await (await COMMANDS[topic]!())(['--help'], io);
      io.stdout(topic !== undefined ? (HELP[topic] ?? USAGE) : USAGE);
      return EXIT_OK;
    }
    if (command === '--version' || command === 'version') {
      io.stdout(`drydig ${readPackageVersion()}\n`);
      return EXIT_OK;
    }
    const load = COMMANDS[command];
    if (!load) {
      io.stderr(`DRYDIG_ERR_CLI_USAGE: unknown command "${oneLine(command).slice(0, 80)}"; commands: ${Object.keys(COMMANDS).join(', ')}, help (drydig --help shows their options)\n`);
      return EXIT_BAD_INPUT;
    }
    const run = await load();
    return await run(args, io);
  } catch (error) {
    // A damaged database is told as it is (which file, how to restore), with no stack.
    if (error instanceof DrydigError && error.code === 'DRYDIG_ERR_STORED_DATA_DAMAGED') {
      io.stderr(`${error.code}: ${oneLine(error.message)}\n`);
      return EXIT_FAILURE;
    }
    if (error instanceof DrydigError && error.status < 500) {
      io.stderr(`${error.code}: ${oneLine(error.message)}\n`);
      return EXIT_BAD_INPUT;
    }
    const detail = error instanceof Error ? error.message : String(error);
    io.stderr(`DRYDIG_ERR_INTERNAL: ${oneLine(detail)} (a bug in drydig; please report it with the command and files used)\n`);
    if (process.env.DRYDIG_DEBUG && error instanceof Error && error.stack) io.stderr(`${error.stack}\n`);
    return EXIT_FAILURE;
  }
}
