import fs from 'node:fs';
import path from 'node:path';
import type { NestExpressApplication } from '@nestjs/platform-express';
import express, { type NextFunction, type Request, type Response } from 'express';

const isApi = (p: string) => p === '/api' || p.startsWith('/api/');

/**
 * Serves the built web app from `dir` when it holds an index.html: files as
 * they are (hashed assets cached for a year), and index.html for every other
 * GET outside /api so the client router can take deep links. Paths with a
 * file extension that do not exist stay 404.
 * Returns whether a build was found.
 */
export function serveWebApp(app: NestExpressApplication, dir: string): boolean {
  const index = path.join(dir, 'index.html');
  if (!fs.existsSync(index)) return false;
  const files = express.static(dir, {
    index: false,
    setHeaders: (res, file) => {
      const rel = path.relative(dir, file);
      res.setHeader('Cache-Control', rel.startsWith(`assets${path.sep}`) ? 'public, max-age=31536000, immutable' : 'no-cache');
    },
  });
  // Never for /api: looking for a file there costs a file-system call on every api request.
  app.use((req: Request, res: Response, next: NextFunction) => (isApi(req.path) ? next() : files(req, res, next)));
  app.use((req: Request, res: Response, next: NextFunction) => {
    if ((req.method !== 'GET' && req.method !== 'HEAD') || isApi(req.path) || path.extname(req.path)) return next();
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index);
  });
  return true;
}
