import { existsSync } from 'node:fs';
import path from 'node:path';
import express, { Router } from 'express';

const NOT_BUILT = `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>Pulsewright</title></head>
<body style="font-family: sans-serif; max-width: 40rem; margin: 4rem auto; line-height: 1.5">
<h1>Pulsewright</h1>
<p>The dashboard is not built yet (apps/web/dist is missing). The API is running:
see <a href="/api/docs">the API documentation</a> and <a href="/api/health">the health check</a>.</p>
</body></html>`;

/**
 * Serves the built dashboard from `webDist` with a fallback to index.html for every non-/api
 * path (client-side routes), or a plain page saying the dashboard is not built.
 */
export function staticWeb(webDist: string): Router {
  const router = Router();
  const index = path.join(webDist, 'index.html');
  router.use(express.static(webDist, { index: false, fallthrough: true, maxAge: '1h' }));
  router.get(['/', '/*splat'], (req, res, next) => {
    if (req.path === '/api' || req.path.startsWith('/api/')) {
      next();
      return;
    }
    // Checked per request, so a dashboard built after start-up is served without a restart.
    if (existsSync(index)) res.sendFile(index);
    else res.type('html').send(NOT_BUILT);
  });
  return router;
}
