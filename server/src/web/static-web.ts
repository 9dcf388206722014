import { existsSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import express, { type Express, type NextFunction, type Request, type Response } from 'express';

export function defaultWebDist(): string {
  return resolve(dirname(fileURLToPath(import.meta.url)), '../../../mobile-web/dist');
}

/**
 * Serves the built PWA from the same origin as the API. Hashed assets are immutable; the
 * service worker, manifest and index.html are revalidated so a deploy reaches phones.
 */
export function mountWebApp(app: Express, dist = defaultWebDist()): boolean {
  if (!existsSync(join(dist, 'index.html'))) return false;
  app.use(
    express.static(dist, {
      index: false,
      setHeaders(res, path) {
        if (/[\\/]assets[\\/]/.test(path)) res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
        else res.setHeader('Cache-Control', 'no-cache');
      },
    }),
  );
  const indexHtml = join(dist, 'index.html');
  app.use((req: Request, res: Response, next: NextFunction) => {
    if (req.method !== 'GET' && req.method !== 'HEAD') return next();
    if (req.path === '/api' || req.path.startsWith('/api/')) return next();
    if (!req.accepts('html')) return next();
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(indexHtml);
  });
  return true;
}
