/** A CliIo that records what a command writes, for in-process CLI tests. */
import type { CliIo } from '../../server/cli';

export interface CapturedIo extends CliIo {
  out: () => string;
  err: () => string;
}

export function captureIo(cwd: string): CapturedIo {
  let out = '';
  let err = '';
  return {
    stdout: (t) => void (out += t),
    stderr: (t) => void (err += t),
    cwd,
    out: () => out,
    err: () => err,
  };
}
