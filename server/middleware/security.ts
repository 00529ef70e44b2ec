import helmet from 'helmet';
import type { RequestHandler } from 'express';

/**
 * helmet with a CSP that allows only our own origin, plus what the built client needs:
 * inline styles (Quasar and Konva set style attributes), blob: workers (the sweep runs in a
 * Web Worker), data:/blob: images (canvas exports, tracing photos read locally) and data: fonts.
 */
export function securityHeaders(opts: { https: boolean }): RequestHandler {
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        defaultSrc: ["'self'"],
        scriptSrc: ["'self'"],
        styleSrc: ["'self'", "'unsafe-inline'"],
        imgSrc: ["'self'", 'data:', 'blob:'],
        fontSrc: ["'self'", 'data:'],
        connectSrc: ["'self'"],
        workerSrc: ["'self'", 'blob:'],
        objectSrc: ["'none'"],
        baseUri: ["'self'"],
        formAction: ["'self'"],
        frameAncestors: ["'none'"],
        // Upgrading would break plain-http local use (http://localhost:3000).
        ...(opts.https ? { upgradeInsecureRequests: [] } : {}),
      },
    },
    strictTransportSecurity: opts.https,
  });
}
