import express, { type Express } from 'express';
import { mountStaticApp } from './staticApp';

export interface AppOptions {
  distDir?: string;
}

/** The one process users start: the API under /api and the built client. */
export function createApp(options: AppOptions = {}): Express {
  const app = express();
  app.disable('x-powered-by');
  app.get('/api/health', (_req, res) => {
    res.json({ ok: true });
  });
  app.use('/api', (_req, res) => {
    res.status(404).json({ error: 'no such API route' });
  });
  if (options.distDir) mountStaticApp(app, options.distDir);
  return app;
}
