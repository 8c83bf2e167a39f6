/**
 * Starts the drydig service: `tsx server/main.ts [--port N] [--host H] [--data DIR] [--tile-origin URL]`,
 * or through `npm start` / `drydig serve`. Defaults: 127.0.0.1:8080 (PORT, HOST), data in ./data
 * (DRYDIG_DATA), no map-tile origin in the CSP (DRYDIG_TILE_ORIGIN).
 * The app itself is built by `buildApp()` in app.ts; this file only listens.
 */
import { runCli } from './cli';

process.exitCode = await runCli(['serve', ...process.argv.slice(2)]);
