import express, { type Express } from 'express';
import { existsSync } from 'node:fs';
import { join } from 'node:path';

/**
 * Serve the built client. Hashed assets are immutable; the page, the
 * service worker and the manifest must revalidate, or an installed app
 * would never see a new version.
 */
export function mountStaticApp(app: Express, distDir: string): void {
  if (!existsSync(join(distDir, 'index.html'))) {
    throw new Error(`no built client in ${distDir}; run "npm run build" first`);
  }
  app.use(
    express.static(distDir, {
      index: false,
      setHeaders(res, path) {
        if (/[\\/]assets[\\/]/.test(path)) res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
        else res.setHeader('Cache-Control', 'no-cache');
      },
    }),
  );
  // Client-side routes: every other GET outside the API answers with the page.
  app.get(/^(?!\/api\/).*/, (_req, res) => {
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(join(distDir, 'index.html'));
  });
}
