import helmet from 'helmet';
import type { RequestHandler } from 'express';

/**
 * Security headers. The Content-Security-Policy allows only our own origin; 'unsafe-inline' styles are
 * needed because Angular injects component styles as <style> elements, and blob: images and workers
 * because the Bench and pdf.js build them in the page.
 */
export function securityHeaders(options: { behindTls: boolean }): RequestHandler {
  return helmet({
    // Strict-Transport-Security means something only over HTTPS; over plain HTTP it is ignored at best and
    // pins a name to HTTPS that may not have it at worst. Sent only when a TLS proxy fronts the app.
    strictTransportSecurity: options.behindTls ? { maxAge: 31536000, includeSubDomains: false } : false,
    // One frame rule: no page of Isallo may be framed. X-Frame-Options (older browsers) says the same as frame-ancestors 'none'.
    xFrameOptions: { action: 'deny' },
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        defaultSrc: ["'self'"],
        scriptSrc: ["'self'"],
        styleSrc: ["'self'", "'unsafe-inline'"],
        imgSrc: ["'self'", 'data:', 'blob:'],
        fontSrc: ["'self'"],
        connectSrc: ["'self'"],
        workerSrc: ["'self'", 'blob:'],
        objectSrc: ["'none'"],
        baseUri: ["'self'"],
        formAction: ["'self'"],
        frameAncestors: ["'none'"],
      },
    },
  });
}
