/** What a CLI command writes to and where it runs; tests pass their own to capture output. */
export interface CliIo {
  stdout: (text: string) => void;
  stderr: (text: string) => void;
  /** Folder relative paths are resolved against. */
  cwd: string;
}

/** A CLI sub-command: parses its own arguments, returns the process exit code (0 ok, 2 bad input). */
export type CliCommand = (args: string[], io: CliIo) => Promise<number>;

let streamGuardInstalled = false;

/**
 * A reader that closes the pipe early (`drydig evaluate … | head`) makes stdout emit EPIPE; without
 * a listener Node prints a stack trace. Stop quietly instead, as command-line tools do.
 */
function guardStdout(): void {
  if (streamGuardInstalled) return;
  streamGuardInstalled = true;
  process.stdout.on('error', (error: NodeJS.ErrnoException) => {
    if (error.code === 'EPIPE') process.exit(0);
    process.stderr.write(`DRYDIG_ERR_INTERNAL: cannot write the output (${error.code ?? error.message})\n`);
    process.exit(1);
  });
}

/** The process's own streams. */
export function processIo(): CliIo {
  guardStdout();
  return {
    stdout: (t) => void process.stdout.write(t),
    stderr: (t) => void process.stderr.write(t),
    cwd: process.cwd(),
  };
}
