/**
 * `drydig serve` and `server/main.ts`: build the app and listen. Options come from the command
 * line first, then the environment (PORT, HOST, DRYDIG_DATA, DRYDIG_TILE_ORIGIN), then defaults:
 * 127.0.0.1:8080, ./data and no tile origin — the service listens on the loopback interface
 * unless told otherwise.
 */
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import type { FastifyInstance } from 'fastify';
import { buildApp, DEFAULT_BODY_LIMIT_BYTES } from '../app';
import { DrydigError } from '../../shared/schema';
import { checkTileOrigin, defaultHostNames } from '../security';
import type { CliCommand, CliIo } from './cli-io';
import { parseOptions, usageError } from './parse-options';
import { SERVE_HELP } from './usage-text';
import { issueSetupToken, setupLinkText } from '../auth';

export const DEFAULT_PORT = 8080;
export const DEFAULT_HOST = '127.0.0.1';
export const DEFAULT_DATA_DIR = './data';

export interface ServeSettings {
  /** TCP port; 0 lets the system choose. Default 8080. */
  port: number;
  /** Listen address. Default 127.0.0.1. */
  host: string;
  /** Data folder, absolute, or ':memory:'. Default ./data. */
  dataDir: string;
  /** Largest request body, bytes. Default 8 MiB. */
  bodyLimit_bytes: number;
  /** Log level (fatal, error, warn, info, debug, trace, silent). Default: DRYDIG_LOG_LEVEL, else info. */
  logLevel?: string;
  /** https origin of a background map-tile server allowed by the CSP. Default: DRYDIG_TILE_ORIGIN, else none. */
  tileOrigin?: string;
  /** Extra host names the service answers for (`--host-name`, repeatable or comma-separated; DRYDIG_HOST_NAMES). */
  hostNames?: string[];
}

const LOG_LEVELS = ['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent'];

function parsePort(text: string, source: string): number {
  if (!/^\d{1,5}$/.test(text.trim()) || Number(text) > 65_535) throw usageError(`${source}: "${text}" is not a port number (0–65535)`);
  return Number(text);
}

/** Resolves serve settings from arguments, then environment, then defaults. */
export function resolveServeSettings(args: readonly string[], env: Record<string, string | undefined>, cwd: string): ServeSettings & { help: boolean } {
  const { positionals, values } = parseOptions(args, { port: 'value', host: 'value', data: 'value', 'body-limit': 'value', 'tile-origin': 'value', 'host-name': 'value', help: 'flag' }, 'serve');
  if (positionals.length > 0) throw usageError(`serve: unexpected argument ${positionals[0]}`);
  const port = values.port !== undefined ? parsePort(values.port, '--port') : env.PORT ? parsePort(env.PORT, 'PORT') : DEFAULT_PORT;
  const host = values.host ?? (env.HOST || DEFAULT_HOST);
  const data = values.data ?? (env.DRYDIG_DATA || DEFAULT_DATA_DIR);
  let bodyLimit_bytes = DEFAULT_BODY_LIMIT_BYTES;
  if (values['body-limit'] !== undefined) {
    const text = values['body-limit'];
    if (!/^\d+$/.test(text) || Number(text) < 1024 || Number(text) > 1024 ** 3) throw usageError(`--body-limit: "${text}" must be a whole number of bytes from 1024 to 1073741824`);
    bodyLimit_bytes = Number(text);
  }
  const logLevel = env.DRYDIG_LOG_LEVEL || 'info';
  if (!LOG_LEVELS.includes(logLevel)) throw usageError(`DRYDIG_LOG_LEVEL: "${logLevel}" is not one of ${LOG_LEVELS.join(', ')}`);
  const tileOrigin = parseTileOrigin(values['tile-origin'], env.DRYDIG_TILE_ORIGIN);
  const hostNames = parseHostNames(values['host-name'] ?? env.DRYDIG_HOST_NAMES);
  return {
    port, host, dataDir: data === ':memory:' ? data : path.resolve(cwd, data), bodyLimit_bytes, logLevel,
    ...(tileOrigin ? { tileOrigin } : {}),
    ...(hostNames ? { hostNames } : {}),
    help: values.help === 'true',
  };
}

/** --host-name NAME[,NAME…]: DNS names or addresses, checked for shape. */
function parseHostNames(text: string | undefined): string[] | undefined {
  if (text === undefined || text.trim() === '') return undefined;
  const names = text.split(',').map((n) => n.trim()).filter((n) => n !== '');
  for (const name of names) {
    if (!/^(\[[0-9a-f:.]+\]|[0-9a-f:]*:[0-9a-f:.]+|[a-z0-9]([a-z0-9.-]{0,251}[a-z0-9])?)$/i.test(name)) throw usageError(`--host-name: "${name.slice(0, 80)}" is not a host name or address`);
  }
  return names;
}

/** --tile-origin, else DRYDIG_TILE_ORIGIN (empty = unset), checked to be an https origin. */
function parseTileOrigin(argument: string | undefined, variable: string | undefined): string | undefined {
  const [text, source] = argument !== undefined ? [argument, '--tile-origin'] : [variable || undefined, 'DRYDIG_TILE_ORIGIN'];
  if (text === undefined) return undefined;
  const checked = checkTileOrigin(text, source);
  if (!checked.ok) throw usageError(checked.message);
  return checked.origin;
}

/** Builds the app with logging on and listens; resolves once listening, with the URL. */
export async function startServer(settings: ServeSettings): Promise<{ app: FastifyInstance; url: string }> {
  if (settings.dataDir !== ':memory:') {
    try {
      mkdirSync(settings.dataDir, { recursive: true });
    } catch (error) {
      throw new DrydigError('DRYDIG_ERR_FILE', `data folder ${settings.dataDir} cannot be created (${(error as NodeJS.ErrnoException).code ?? 'error'})`);
    }
  }
  const app = await buildApp({
    dataDir: settings.dataDir,
    bodyLimit_bytes: settings.bodyLimit_bytes,
    logger: { level: settings.logLevel ?? 'info' },
    ...(settings.tileOrigin ? { tileOrigin: settings.tileOrigin } : {}),
    // The bind address and localhost, and any names given: other Host headers get 421.
    hostNames: [...defaultHostNames(settings.host), ...(settings.hostNames ?? [])],
  });
  try {
    await app.listen({ port: settings.port, host: settings.host });
  } catch (error) {
    await app.close();
    const code = (error as NodeJS.ErrnoException).code;
    if (code === 'EADDRINUSE') throw usageError(`port ${settings.port} on ${settings.host} is already in use; choose another with --port`);
    if (code === 'EACCES') throw usageError(`port ${settings.port} on ${settings.host} needs privileges; choose one above 1023 with --port`);
    if (code === 'EADDRNOTAVAIL' || code === 'ENOTFOUND') throw usageError(`cannot listen on host ${settings.host}; use an address of this machine, e.g. 127.0.0.1`);
    throw error;
  }
  const address = app.server.address();
  const port = typeof address === 'object' && address ? address.port : settings.port;
  const hostForUrl = settings.host.includes(':') ? `[${settings.host}]` : settings.host;
  const url = `http://${hostForUrl}:${port}`;
  app.log.info({ url, dataDir: settings.dataDir }, `drydig is serving ${url}`);
  return { app, url };
}

/** Runs until SIGINT/SIGTERM, then closes the server (finishing requests in flight). */
export async function serveUntilStopped(settings: ServeSettings, io: CliIo): Promise<number> {
  const { app, url } = await startServer(settings);
  io.stderr(`drydig: serving ${url} (data: ${settings.dataDir}); Ctrl-C stops\n`);
  // No default password: with no account yet, a one-time link makes the first admin.
  const setupToken = issueSetupToken(app.scenarioStore);
  if (setupToken) io.stderr(setupLinkText(url, setupToken));
  return new Promise<number>((resolve) => {
    const stop = (signal: string) => {
      process.off('SIGINT', onInt);
      process.off('SIGTERM', onTerm);
      app.log.info(`${signal}: closing`);
      app.close().then(
        () => resolve(0),
        () => resolve(1),
      );
    };
    const onInt = () => stop('SIGINT');
    const onTerm = () => stop('SIGTERM');
    process.on('SIGINT', onInt);
    process.on('SIGTERM', onTerm);
  });
}

export const runServeCommand: CliCommand = async (args, io) => {
  const settings = resolveServeSettings(args, process.env, io.cwd);
  if (settings.help) {
    io.stdout(SERVE_HELP);
    return 0;
  }
  return serveUntilStopped(settings, io);
};
