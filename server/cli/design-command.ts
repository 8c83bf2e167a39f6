/** Placeholder for `drydig design`: filled in by the design issue. */
import type { CliCommand } from './cli-io';

export const runDesignCommand: CliCommand = async (_args, io) => {
  io.stderr('DRYDIG_ERR_CLI_USAGE: `drydig design` is not built yet\n');
  return 2;
};
