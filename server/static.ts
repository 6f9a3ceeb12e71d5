import fs from 'node:fs';
import path from 'node:path';
import express, { type Express } from 'express';

/**
 * Serves the built client: hashed assets cached for good, the service worker and the page
 * always revalidated (so an update is seen), and an SPA fallback that never answers /api.
 */
export function serveClient(app: Express, distDir: string) {
  const indexFile = path.join(distDir, 'index.html');
  if (!fs.existsSync(indexFile)) return;
  app.use(
    express.static(distDir, {
      index: false,
      setHeaders(res, file) {
        const rel = path.relative(distDir, file);
        if (rel.startsWith('assets' + path.sep))
          res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
        else res.setHeader('Cache-Control', 'no-cache');
        if (rel.endsWith('.webmanifest')) res.type('application/manifest+json');
      },
    }),
  );
  app.get(/^(?!\/api(\/|$)).*/, (req, res, next) => {
    if (req.method !== 'GET' || !req.accepts('html')) return next();
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(indexFile);
  });
}
