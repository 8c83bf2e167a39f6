/**
 * Host allow-list (against DNS rebinding): a page on another site can point its own name at this
 * service's address and have a browser send requests that carry the service's cookies but the
 * other name in `Host`. Only the configured host names are answered; any other `Host` gets 421
 * DRYDIG_ERR_HOST_NOT_ALLOWED before any route runs.
 */
import { networkInterfaces } from 'node:os';
import type { FastifyInstance } from 'fastify';
import { DrydigError } from '../../shared/schema';

/** Names every service answers to on its own machine. */
export const LOOPBACK_HOST_NAMES: readonly string[] = ['localhost', '127.0.0.1', '::1'];

/** The host part of a Host header, lower case, without port or IPv6 brackets. */
export function hostNameOf(header: string): string {
  const text = header.trim().toLowerCase();
  if (text.startsWith('[')) return text.slice(1, text.indexOf(']') > 0 ? text.indexOf(']') : undefined);
  const colon = text.indexOf(':');
  return colon >= 0 && text.indexOf(':', colon + 1) < 0 ? text.slice(0, colon) : text;
}

/**
 * The host names a service listening on `bindHost` answers to by default: the bind address and
 * localhost; on a wildcard bind (0.0.0.0, ::) every address of this machine's interfaces.
 */
export function defaultHostNames(bindHost: string): string[] {
  const names = new Set(LOOPBACK_HOST_NAMES);
  const bind = hostNameOf(bindHost);
  if (bind === '0.0.0.0' || bind === '::') {
    for (const list of Object.values(networkInterfaces())) for (const entry of list ?? []) names.add(entry.address.toLowerCase());
  } else names.add(bind);
  return [...names];
}

/** Refuses requests whose Host is not one of `names` (421). */
export function installHostAllowList(app: FastifyInstance, names: readonly string[]): void {
  const allowed = new Set(names.map((n) => hostNameOf(n)));
  app.addHook('onRequest', async (request) => {
    const host = hostNameOf(request.headers.host ?? '');
    if (!allowed.has(host)) {
      const shown = host.slice(0, 80) || '(none)';
      throw new DrydigError('DRYDIG_ERR_HOST_NOT_ALLOWED', `this service does not answer for host "${shown}"; it answers for ${[...allowed].slice(0, 6).join(', ')}`, [{ path: '/headers/host', message: 'is not one of the service host names' }]);
    }
  });
}
