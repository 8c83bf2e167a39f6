/** The data folder of the store commands: --data, else DRYDIG_DATA, else ./data (as `drydig serve`). */
import path from 'node:path';

export function resolveDataDir(value: string | undefined, cwd: string): string {
  return path.resolve(cwd, value ?? (process.env.DRYDIG_DATA || './data'));
}
