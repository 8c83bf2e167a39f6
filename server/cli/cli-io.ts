/** What a CLI command writes to and where it runs; tests pass their own to capture output. */
export interface CliIo {
  stdout: (text: string) => void;
  stderr: (text: string) => void;
  /** Folder relative paths are resolved against. */
  cwd: string;
}

/** A CLI sub-command: parses its own arguments, returns the process exit code (0 ok, 2 bad input). */
export type CliCommand = (args: string[], io: CliIo) => Promise<number>;

/** The process's own streams. */
export function processIo(): CliIo {
  return {
    stdout: (t) => void process.stdout.write(t),
    stderr: (t) => void process.stderr.write(t),
    cwd: process.cwd(),
  };
}
