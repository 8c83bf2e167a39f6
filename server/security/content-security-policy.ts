/**
 * The Content-Security-Policy the web client and site view run under. Same-origin scripts and
 * workers only; inline styles allowed because Leaflet and Lit's style attributes set them; images
 * from data:/blob: (exported plans, canvas) and from an optional map-tile origin.
 */
export interface ContentSecurityPolicyOptions {
  /** Origin of an optional background tile server, e.g. 'https://tile.example.org'. Default none. */
  tileOrigin?: string;
}

/** Helmet `contentSecurityPolicy.directives` for drydig. */
export function buildCspDirectives(options: ContentSecurityPolicyOptions = {}): Record<string, string[]> {
  const tiles = options.tileOrigin ? [options.tileOrigin] : [];
  return {
    'default-src': ["'self'"],
    'script-src': ["'self'"],
    'worker-src': ["'self'", 'blob:'],
    'style-src': ["'self'", "'unsafe-inline'"],
    'img-src': ["'self'", 'data:', 'blob:', ...tiles],
    'connect-src': ["'self'", ...tiles],
    'font-src': ["'self'", 'data:'],
    'object-src': ["'none'"],
    'base-uri': ["'self'"],
    'form-action': ["'self'"],
    'frame-ancestors': ["'none'"],
  };
}
