#!/usr/bin/env node
// The `drydig` command: loads the TypeScript CLI through tsx so no build step is needed.
import { register } from 'tsx/esm/api';
register();
const { runCli } = await import('../server/cli/index.ts');
process.exitCode = await runCli(process.argv.slice(2));
