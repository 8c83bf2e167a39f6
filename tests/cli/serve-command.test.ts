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
  ];
  it.each(bad)('refuses %j (env %j)', (args, env, says) => {
    expect(() => resolveServeSettings(args, env, '/srv/x')).toThrow(says);
  });
});

describe('drydig serve start-up', () => {
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
