import express, { type Router } from 'express';
import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';

/** Serves the built dashboard, with index.html for every client-side route. */
export function createWebHosting(distFolder: string): Router | undefined {
  const root = resolve(distFolder);
  if (!existsSync(join(root, 'index.html'))) return undefined;
  const router = express.Router();
  router.use(express.static(root, { index: false, maxAge: '1h' }));
  router.get(/^(?!\/api\/).*/, (_req, res) => res.sendFile(join(root, 'index.html')));
  return router;
}
