/**
 * Keeps share tokens out of logs: any path segment after `/links/` or `/site/` is replaced, so a
 * log line shows `/api/v1/links/[token]/readings`, never the token itself.
 */
const TOKEN_SEGMENT = /(\/(?:links|site)\/)[^/?#]+/gi;

/** The URL with share tokens replaced by `[token]`. */
export function redactTokens(url: string): string {
  return url.replace(TOKEN_SEGMENT, '$1[token]');
}

/** Fastify logger serializers that redact tokens from request URLs (use in `Fastify({ logger })`). */
export const redactingSerializers = {
  req(request: { method?: string; url?: string; hostname?: string; ip?: string }) {
    return { method: request.method, url: redactTokens(request.url ?? ''), hostname: request.hostname, remoteAddress: request.ip };
  },
};

/**
 * Logger options with token redaction; `base` is the caller's logger option (true or an object).
 * Returns false unchanged.
 */
export function withRedactedLogging(base: boolean | object): boolean | object {
  if (base === false) return false;
  const options = typeof base === 'object' ? base : {};
  const existing = (options as { serializers?: object }).serializers ?? {};
  return { ...options, serializers: { ...existing, ...redactingSerializers } };
}
