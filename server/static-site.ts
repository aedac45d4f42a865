import fs from 'node:fs';
import path from 'node:path';
import express, { type Router } from 'express';

/**
 * Serves the exported web app (`npx expo export --platform web` → dist/). Hashed bundles are
 * cached for a year; index.html is always revalidated. Any other GET outside /api gets
 * index.html so the app's router can show the page (single-page output).
 */
export function staticSite(staticDir: string): Router {
  const router = express.Router();
  const indexFile = path.resolve(staticDir, 'index.html');
  router.use(
    express.static(staticDir, {
      index: 'index.html',
      dotfiles: 'ignore',
      setHeaders(res, filePath) {
        const hashed = filePath.includes(`${path.sep}_expo${path.sep}static${path.sep}`);
        res.setHeader('Cache-Control', hashed ? 'public, max-age=31536000, immutable' : 'no-cache');
      },
    }),
  );
  router.get('/{*splat}', (req, res, next) => {
    if (req.path === '/api' || req.path.startsWith('/api/')) return next();
    if (!fs.existsSync(indexFile)) {
      res.status(404).type('text/plain').send('The web app has not been built. Run: npx expo export --platform web');
      return;
    }
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(indexFile);
  });
  return router;
}
