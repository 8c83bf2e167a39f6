/** resolveServeSettings and `drydig serve` start-up failures. */
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli } from '../../server/cli';
import { resolveServeSettings, startServer } from '../../server/cli/serve-command';
import { captureIo } from './capture-io';

describe('resolveServeSettings(args, env, cwd)', () => {
  const cases: Array<{ name: string; args: string[]; env: Record<string, string>; expected: { port: number; host: string; dataDir: string; bodyLimit_bytes: number } }> = [
    { name: 'defaults: loopback, 8080, ./data', args: [], env: {}, expected: { port: 8080, host: '127.0.0.1', dataDir: '/srv/x/data', bodyLimit_bytes: 8 * 1024 * 1024 } },
    { name: 'the environment', args: [], env: { PORT: '9000', HOST: '::1', DRYDIG_DATA: '/var/drydig' }, expected: { port: 9000, host: '::1', dataDir: '/var/drydig', bodyLimit_bytes: 8 * 1024 * 1024 } },
    { name: 'arguments over the environment', args: ['--port', '7000', '--data', 'store', '--host=127.0.0.2', '--body-limit', '2048'], env: { PORT: '9000', DRYDIG_DATA: '/var/drydig' }, expected: { port: 7000, host: '127.0.0.2', dataDir: '/srv/x/store', bodyLimit_bytes: 2048 } },
    { name: 'an in-memory store', args: ['--data', ':memory:', '--port', '0'], env: {}, expected: { port: 0, host: '127.0.0.1', dataDir: ':memory:', bodyLimit_bytes: 8 * 1024 * 1024 } },
  ];
  it.each(cases)('takes $name', ({ args, env, expected }) => {
    const { help: _help, logLevel, ...settings } = resolveServeSettings(args, env, '/srv/x');
    expect(logLevel).toBe('info');
    expect({ ...settings, dataDir: settings.dataDir.split(path.sep).join('/') }).toEqual(expected);
  });

  const bad: Array<[string[], Record<string, string>, string]> = [
    [['--port', '70000'], {}, '--port: "70000" is not a port number'],
    [['--port', '-1'], {}, '--port: "-1" is not a port number'],
    [[], { PORT: 'http' }, 'PORT: "http" is not a port number'],
    [['--body-limit', '10'], {}, '--body-limit: "10" must be a whole number of bytes'],
    [['extra'], {}, 'serve: unexpected argument extra'],
    [[], { DRYDIG_LOG_LEVEL: 'loud' }, 'DRYDIG_LOG_LEVEL: "loud" is not one of'],
    [['--tile-origin', 'http://tiles.example.org'], {}, '--tile-origin: "http://tiles.example.org" is not an https origin'],
    [['--tile-origin', 'https://tiles.example.org/{z}/{x}/{y}.png'], {}, '--tile-origin: "https://tiles.example.org/{z}/{x}/{y}.png" is not an https origin'],
    [[], { DRYDIG_TILE_ORIGIN: 'https://user@tiles.example.org' }, 'DRYDIG_TILE_ORIGIN: "https://user@tiles.example.org" is not an https origin'],
  ];
  it.each(bad)('refuses %j (env %j)', (args, env, says) => {
    expect(() => resolveServeSettings(args, env, '/srv/x')).toThrow(says);
  });
});

describe('resolveServeSettings tile origin', () => {
  it.each([
    { name: 'none by default', args: [], env: {}, expected: undefined },
    { name: 'the environment', args: [], env: { DRYDIG_TILE_ORIGIN: 'https://tiles.example.org' }, expected: 'https://tiles.example.org' },
    { name: 'an empty variable as unset', args: [], env: { DRYDIG_TILE_ORIGIN: '' }, expected: undefined },
    { name: 'the argument over the environment, without its trailing slash', args: ['--tile-origin', 'https://*.tiles.example.org/'], env: { DRYDIG_TILE_ORIGIN: 'https://other.example.org' }, expected: 'https://*.tiles.example.org' },
  ])('takes $name', ({ args, env, expected }) => {
    expect(resolveServeSettings(args, env, '/srv/x').tileOrigin).toBe(expected);
  });
});

describe('drydig serve start-up', () => {
  it('sends the --tile-origin in the Content-Security-Policy of the started server', async () => {
    const settings = resolveServeSettings(['--port', '0', '--data', ':memory:', '--tile-origin', 'https://tiles.example.org'], {}, process.cwd());
    const { app, url } = await startServer({ ...settings, logLevel: 'silent' });
    try {
      const csp = (await fetch(`${url}/api/v1/health`)).headers.get('content-security-policy') ?? '';
      expect(csp).toContain("img-src 'self' data: blob: https://tiles.example.org;");
      expect(csp).toContain("connect-src 'self' https://tiles.example.org;");
    } finally {
      await app.close();
    }
  });

  it.each([
    [['--tile-origin', 'http://tiles.example.org'], {}, 'DRYDIG_ERR_CLI_USAGE: --tile-origin: "http://tiles.example.org" is not an https origin; give scheme, host and optional port only, e.g. https://tiles.example.org'],
    [[], { DRYDIG_TILE_ORIGIN: 'ftp://tiles.example.org' }, 'DRYDIG_ERR_CLI_USAGE: DRYDIG_TILE_ORIGIN: "ftp://tiles.example.org" is not an https origin; give scheme, host and optional port only, e.g. https://tiles.example.org'],
  ])('exits 2 with one line for %j (env %j)', async (args, env, line) => {
    const io = captureIo(process.cwd());
    const previous = process.env.DRYDIG_TILE_ORIGIN;
    Object.assign(process.env, env);
    const code = await runCli(['serve', '--port', '0', '--data', ':memory:', ...args], io).finally(() => {
      if (previous === undefined) delete process.env.DRYDIG_TILE_ORIGIN;
      else process.env.DRYDIG_TILE_ORIGIN = previous;
    });
    expect(code).toBe(2);
    expect(io.err().split('\n').filter(Boolean)).toHaveLength(1);
    expect(io.err().trim()).toBe(line);
  });

  it('exits 2 with one line when the port is taken', async () => {
    const { app, url } = await startServer({ port: 0, host: '127.0.0.1', dataDir: ':memory:', bodyLimit_bytes: 1 << 20, logLevel: 'silent' });
    try {
      const port = new URL(url).port;
      const io = captureIo(process.cwd());
      const previous = process.env.DRYDIG_LOG_LEVEL;
      process.env.DRYDIG_LOG_LEVEL = 'silent';
      const code = await runCli(['serve', '--port', port, '--data', ':memory:'], io).finally(() => {
        if (previous === undefined) delete process.env.DRYDIG_LOG_LEVEL;
        else process.env.DRYDIG_LOG_LEVEL = previous;
      });
      expect(code).toBe(2);
      expect(io.err().trim()).toBe(`DRYDIG_ERR_CLI_USAGE: port ${port} on 127.0.0.1 is already in use; choose another with --port`);
    } finally {
      await app.close();
    }
  });
});
