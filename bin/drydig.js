#!/usr/bin/env node
// The `drydig` command. It runs the built CLI (dist/cli, written by `npm run build`) when that is
// there and not older than the sources it came from, so it starts without compiling TypeScript;
// otherwise it loads the TypeScript through tsx (a fresh clone, or sources edited since the build).
// DRYDIG_CLI=source forces the TypeScript.
import { existsSync, readdirSync, statSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
const built = `${root}dist/cli/drydig.mjs`;

/** Newest modification time (ms) of the files under `dir` (the CLI's sources). */
function newestUnder(dir) {
  let newest = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const path = `${dir}/${entry.name}`;
    if (entry.isDirectory()) newest = Math.max(newest, newestUnder(path));
    else newest = Math.max(newest, statSync(path).mtimeMs);
  }
  return newest;
}

function builtIsCurrent() {
  if (process.env.DRYDIG_CLI === 'source' || !existsSync(built)) return false;
  const builtAt = statSync(built).mtimeMs;
  return ['shared', 'server'].every((dir) => newestUnder(`${root}${dir}`) <= builtAt) && statSync(`${root}package.json`).mtimeMs <= builtAt;
}

let runCli;
if (builtIsCurrent()) {
  ({ runCli } = await import(built));
} else {
  const { register } = await import('tsx/esm/api');
  register();
  ({ runCli } = await import('../server/cli/index.ts'));
}
process.exitCode = await runCli(process.argv.slice(2));
