import { existsSync } from 'node:fs';
import { join } from 'node:path';
import express, { Router } from 'express';

/**
 * Serve a built single-page app at `mount`: hashed assets cached for a year, index.html
 * never cached, and any other path under the mount answered with index.html so the
 * client-side router can take it.
 */
export function staticApp(mount: string, dir: string): Router {
  const router = Router();
  const index = join(dir, 'index.html');
  if (!existsSync(index)) return router;
  router.use(
    mount,
    express.static(dir, {
      index: false,
      setHeaders: (res, path) => {
        if (path.includes(`${join(dir, 'assets')}`)) res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
      },
    }),
  );
  const fallbackPath = mount === '/' ? '/{*rest}' : `${mount}{/*rest}`;
  router.get(fallbackPath, (req, res, next) => {
    if (req.path.startsWith('/api/')) return next();
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index);
  });
  return router;
}
