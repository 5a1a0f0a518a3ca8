import fs from 'node:fs';
import path from 'node:path';
import express, { Router } from 'express';
import type { Logger } from 'pino';

/**
 * Serves the built Angular app and answers every other non-API GET with its index.html, so that a
 * deep link such as /bench/<id> reaches the client router. Hashed assets are cached for a year;
 * index.html never, so a new build is picked up at once.
 */
export function clientStatic(clientDir: string, logger: Logger): Router {
  const router = Router();
  const indexPath = path.join(clientDir, 'index.html');
  if (!fs.existsSync(indexPath)) {
    logger.warn({ clientDir }, 'no built client found (run npm run build:client); only the API is served');
    return router;
  }
  router.use(
    express.static(clientDir, {
      index: false,
      // Our own Cache-Control below; serve-static's would replace it.
      cacheControl: false,
      setHeaders: (res, filePath) => {
        const isHashed = /[-.][0-9A-Za-z]{8,}\.(js|css|woff2?|png|svg|jpg)$/.test(filePath) || /\/media\//.test(filePath);
        res.setHeader('Cache-Control', isHashed ? 'public, max-age=31536000, immutable' : 'no-cache');
      },
    }),
  );
  router.get(/^(?!\/api(\/|$)).*/, (req, res, next) => {
    if (!req.accepts('html')) return next();
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(indexPath, { dotfiles: 'allow' });
  });
  return router;
}
