/**
 * The Content-Security-Policy the web client and site view run under. Same-origin scripts and
 * workers only; inline styles allowed because Leaflet and Lit's style attributes set them; images
 * from data:/blob: (exported plans, canvas) and from an optional map-tile origin.
 */
export interface ContentSecurityPolicyOptions {
  /** Origin of an optional background tile server, e.g. 'https://tile.example.org'. Default none. */
  tileOrigin?: string;
}

// Scheme, host (optionally "*." for a tile server's lettered subdomains) and port; nothing else
// may reach the header, so no path, query or credentials and no "; directive" smuggled in.
const HTTPS_ORIGIN = /^https:\/\/(\*\.)?[a-z0-9-]+(\.[a-z0-9-]+)*(:\d{1,5})?\/?$/i;

/**
 * Checks a map-tile origin for the CSP: an https origin such as 'https://tiles.example.org' (a
 * trailing slash is dropped, the host lower-cased). Returns the origin, or a one-line reason
 * naming `source` (the option or variable it came from) when the text is not one.
 */
export function checkTileOrigin(text: string, source: string): { ok: true; origin: string } | { ok: false; message: string } {
  const trimmed = text.trim();
  if (!HTTPS_ORIGIN.test(trimmed)) {
    return { ok: false, message: `${source}: "${text}" is not an https origin; give scheme, host and optional port only, e.g. https://tiles.example.org` };
  }
  return { ok: true, origin: trimmed.replace(/\/$/, '').toLowerCase() };
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
