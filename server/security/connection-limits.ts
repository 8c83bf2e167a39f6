/**
 * Slow and greedy clients: without limits, 1 100 half-sent connections use up a 1 024
 * file-descriptor limit and lock out everyone else. The server gives a client a fixed time to
 * send its headers and its whole request, closes idle keep-alive connections, and holds at most
 * `maxPerAddress` open connections from one address (more are closed at once).
 */
import type { Server, Socket } from 'node:net';

export interface ConnectionLimits {
  /** Time to receive the request headers, ms. Default 10 000. */
  headersTimeout_ms?: number;
  /** Time to receive the whole request, ms. Default 30 000. */
  requestTimeout_ms?: number;
  /** Idle keep-alive connections are closed after this, ms. Default 5 000. */
  keepAliveTimeout_ms?: number;
  /** Open connections one client address may hold. Default 64. */
  maxPerAddress?: number;
}

export const DEFAULT_CONNECTION_LIMITS = {
  headersTimeout_ms: 10_000,
  requestTimeout_ms: 30_000,
  keepAliveTimeout_ms: 5_000,
  maxPerAddress: 64,
} as const satisfies Required<ConnectionLimits>;

/** Fastify's server options for the time-outs. */
export function connectionTimeoutOptions(limits: ConnectionLimits = {}) {
  const l = { ...DEFAULT_CONNECTION_LIMITS, ...limits };
  // Not connectionTimeout: an idle socket while a long computation runs is normal. Node checks
  // the header and request time-outs every connectionsCheckingInterval (30 s by default).
  const checkEvery_ms = Math.max(100, Math.min(l.headersTimeout_ms, l.requestTimeout_ms, 30_000) / 4);
  return { requestTimeout: l.requestTimeout_ms, keepAliveTimeout: l.keepAliveTimeout_ms, http: { connectionsCheckingInterval: checkEvery_ms } };
}

/** Sets the header time-out and caps connections per address on the HTTP server. */
export function limitConnections(server: Server & { headersTimeout?: number }, limits: ConnectionLimits = {}): void {
  const l = { ...DEFAULT_CONNECTION_LIMITS, ...limits };
  server.headersTimeout = l.headersTimeout_ms;
  const open = new Map<string, number>();
  server.on('connection', (socket: Socket) => {
    const address = socket.remoteAddress ?? '';
    const count = (open.get(address) ?? 0) + 1;
    if (count > l.maxPerAddress) {
      socket.destroy();
      return;
    }
    open.set(address, count);
    socket.once('close', () => {
      const left = (open.get(address) ?? 1) - 1;
      if (left <= 0) open.delete(address);
      else open.set(address, left);
    });
  });
}
