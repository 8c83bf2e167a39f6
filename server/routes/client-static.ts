/**
 * Serves the built web client (vite writes it to `client/dist`): `index.html` at `/`, `site.html`
 * for every `/site/…` path (the site team's view), other files by name. Nothing outside the folder
 * can be reached: `..` segments, encoded or not, dotfiles and NUL bytes are refused with the JSON
 * 404 every unknown path gets. Without a build, `/` explains how to make one. API routes are
 * registered as exact paths, so they always win over the wildcard here.
 */
import { existsSync, statSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { FastifyPluginAsync, FastifyReply, FastifyRequest } from 'fastify';
import fastifyStatic from '@fastify/static';

export interface ClientStaticOptions {
  /** Folder with the built client. Default: `client/dist` in the repository. */
  clientDir?: string;
}

/** Where vite builds the client, relative to this file. */
export const DEFAULT_CLIENT_DIR = fileURLToPath(new URL('../../client/dist', import.meta.url));

const NOT_BUILT_PAGE = `<!doctype html>
<html lang="en">
<head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>drydig: client not built</title></head>
<body style="font-family: system-ui, sans-serif; max-width: 40rem; margin: 3rem auto; line-height: 1.5">
<h1>drydig</h1>
<p>The compute service is running, but the web client has not been built.</p>
<p>Run <code>npm run build</code> (or start with <code>npm start</code>, which builds first), then reload this page.</p>
<p>The HTTP API works without it: see <a href="/api/v1/openapi.json">/api/v1/openapi.json</a> and <a href="/api/v1/health">/api/v1/health</a>.</p>
</body>
</html>
`;

/** True when a request path may name a file inside the client folder. */
export function isSafeClientPath(pathname: string): boolean {
  let decoded: string;
  try {
    decoded = decodeURIComponent(pathname);
  } catch {
    return false;
  }
  if (decoded.includes('\0') || decoded.includes('\\')) return false;
  return !decoded.split('/').some((segment) => segment === '..' || (segment.startsWith('.') && segment.length > 0));
}

function sendNotBuilt(reply: FastifyReply): FastifyReply {
  return reply.status(200).type('text/html; charset=utf-8').header('cache-control', 'no-store').send(NOT_BUILT_PAGE);
}

export const clientStatic: FastifyPluginAsync<ClientStaticOptions> = async (app, options) => {
  const root = path.resolve(options.clientDir ?? DEFAULT_CLIENT_DIR);
  const built = existsSync(root) && statSync(root).isDirectory() && existsSync(path.join(root, 'index.html'));

  if (!built) {
    app.get('/', { schema: { hide: true } }, async (_request, reply) => sendNotBuilt(reply));
    app.get('/site', { schema: { hide: true } }, async (_request, reply) => sendNotBuilt(reply));
    app.get('/site/*', { schema: { hide: true } }, async (_request, reply) => sendNotBuilt(reply));
    return;
  }

  await app.register(fastifyStatic, {
    root,
    prefix: '/',
    index: ['index.html'],
    wildcard: true,
    dotfiles: 'ignore',
    redirect: false,
    list: false,
    // Our own cache headers (setHeaders) instead of send's blanket max-age=0.
    cacheControl: false,
    allowedPath: (pathname) => isSafeClientPath(pathname),
    setHeaders: (res, filePath) => {
      // vite fingerprints files under assets/, so they can be cached for good; pages must revalidate.
      const relative = path.relative(root, filePath).split(path.sep);
      if (relative[0] === 'assets') res.setHeader('cache-control', 'public, max-age=31536000, immutable');
      else res.setHeader('cache-control', 'no-cache');
      res.setHeader('x-content-type-options', 'nosniff');
    },
  });

  const sitePage = async (request: FastifyRequest, reply: FastifyReply) => {
    // The client is built with relative asset URLs (vite base './'), so the page at /site/a/b asks
    // for /site/a/assets/x.js: serve those from the one assets folder.
    const rest = (request.params as Record<string, string | undefined>)['*'] ?? '';
    const asset = /(?:^|\/)(assets\/.+)$/.exec(rest)?.[1];
    if (asset !== undefined) {
      if (!isSafeClientPath(asset)) return reply.callNotFound();
      return reply.sendFile(asset);
    }
    if (!existsSync(path.join(root, 'site.html'))) return reply.callNotFound();
    return reply.header('cache-control', 'no-cache').sendFile('site.html');
  };
  app.get('/site', { schema: { hide: true } }, sitePage);
  app.get('/site/*', { schema: { hide: true } }, sitePage);
};
