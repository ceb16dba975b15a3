/**
 * helmet with a Content-Security-Policy that fits the built client: scripts, styles, fonts and
 * connections from our own origin only; data: images and fonts (inline SVG icons, embedded fonts);
 * blob: images and workers (plot exports, analysis previews). Inline style attributes are allowed
 * because React and D3 set element styles. Upgrade-insecure-requests and HSTS only when the public
 * URL is https (they would break plain http://127.0.0.1).
 */
import type { RequestHandler } from 'express';
import helmet from 'helmet';

export function securityHeaders(options: { https: boolean }): RequestHandler {
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        'default-src': ["'self'"],
        'base-uri': ["'self'"],
        'script-src': ["'self'"],
        'style-src': ["'self'", "'unsafe-inline'"],
        'img-src': ["'self'", 'data:', 'blob:'],
        'font-src': ["'self'", 'data:'],
        'connect-src': ["'self'"],
        'worker-src': ["'self'", 'blob:'],
        'object-src': ["'none'"],
        'frame-ancestors': ["'none'"],
        'form-action': ["'self'"],
        ...(options.https ? { 'upgrade-insecure-requests': [] } : {}),
      },
    },
    strictTransportSecurity: options.https,
  });
}
