import helmet from 'helmet';
import type { RequestHandler } from 'express';

/**
 * Security headers. The Content-Security-Policy allows only our own origin; 'unsafe-inline' styles are
 * needed because Angular injects component styles as <style> elements, and blob: images and workers
 * because the Bench and pdf.js build them in the page.
 */
export function securityHeaders(): RequestHandler {
  return helmet({
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
