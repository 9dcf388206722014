import { existsSync } from 'node:fs';
import { dirname, extname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import express, { type Express, type NextFunction, type Request, type Response } from 'express';
import { findPrecompressed, type PrecompressedIndex } from './precompressed.js';

export function defaultWebDist(): string {
  return resolve(dirname(fileURLToPath(import.meta.url)), '../../../mobile-web/dist');
}

const IMMUTABLE = 'public, max-age=31536000, immutable';
const REVALIDATE = 'no-cache';

/**
 * Files whose names carry a content hash never change under the same name: Vite's assets/ folder
 * and workbox's runtime (workbox-<hash>.js). Everything else (index.html, the manifest, the service
 * worker, icons) is revalidated so a deploy reaches phones.
 */
export function isHashedAsset(urlPath: string): boolean {
  return urlPath.startsWith('/assets/') || /^\/workbox-[0-9a-f]{8,}\.js$/.test(urlPath);
}

/**
 * Picks the precompressed variant the client accepts (brotli before gzip), rewrites the request to
 * it and sets the headers express.static would otherwise guess from the `.br`/`.gz` name.
 */
function servePrecompressed(index: PrecompressedIndex) {
  return (req: Request, res: Response, next: NextFunction) => {
    if (req.method !== 'GET' && req.method !== 'HEAD') return next();
    const entry = index.get(req.path);
    if (!entry) return next();
    res.vary('Accept-Encoding');
    const accepted = req.acceptsEncodings([...entry.encodings, 'identity']);
    if (!accepted || accepted === 'identity') return next();
    const suffix = accepted === 'br' ? '.br' : '.gz';
    res.type(extname(req.path));
    res.setHeader('Content-Encoding', accepted);
    req.url = req.url.replace(/^[^?]*/, (path) => path + suffix);
    next();
  };
}

/**
 * Serves the built PWA from the same origin as the API, with the brotli and gzip files the build
 * emitted beside each compressible asset.
 */
export function mountWebApp(app: Express, dist = defaultWebDist()): boolean {
  if (!existsSync(join(dist, 'index.html'))) return false;
  const precompressed = servePrecompressed(findPrecompressed(dist));
  const files = express.static(dist, {
    index: false,
    setHeaders(res, path) {
      const urlPath = '/' + path.slice(dist.length + 1).replace(/\\/g, '/').replace(/\.(br|gz)$/, '');
      res.setHeader('Cache-Control', isHashedAsset(urlPath) ? IMMUTABLE : REVALIDATE);
    },
  });
  app.use(precompressed, files);
  // A first visit to /sign-in gets the page drawn at build time (no script needed to paint it);
  // any other page the browser asks for gets the app shell (compressed too); the router takes over.
  const signInPage = existsSync(join(dist, 'sign-in.html'));
  app.use((req: Request, res: Response, next: NextFunction) => {
    if (req.method !== 'GET' && req.method !== 'HEAD') return next();
    if (req.path === '/api' || req.path.startsWith('/api/')) return next();
    if (!req.accepts('html')) return next();
    req.url = signInPage && (req.path === '/sign-in' || req.path === '/sign-in/') ? '/sign-in.html' : '/index.html';
    precompressed(req, res, (error?: unknown) => (error ? next(error) : files(req, res, next)));
  });
  return true;
}
