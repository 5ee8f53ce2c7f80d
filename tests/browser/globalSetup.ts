import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { TestProject } from 'vitest/node';
import { loadConfig } from '../../server/config';
import { createServer, type GluefieldServer } from '../../server/createServer';

const root = fileURLToPath(new URL('../..', import.meta.url));
let server: GluefieldServer | undefined;

/**
 * Build the client once and serve it, as `npm start` does, on a free port:
 * the whole server, on a SQLite file in a temporary folder with the demo
 * accounts seeded and mail going to an in-process sink.
 */
export default async function setup(project: TestProject) {
  execFileSync(process.execPath, [`${root}node_modules/vite/bin/vite.js`, 'build', '--logLevel', 'error'], { cwd: root, stdio: 'inherit' });
  const dir = mkdtempSync(join(tmpdir(), 'gluefield-browser-'));
  const config = loadConfig({ GLUEFIELD_DB: join(dir, 'gluefield.sqlite'), SMTP_PORT: '0', SMTP_SINK: '1', BCRYPT_ROUNDS: '4', RATE_LIMIT_LOGIN: '1000' });
  server = await createServer({ ...config, distDir: `${root}dist` });
  const { port } = await server.listen(0, '127.0.0.1');
  project.provide('appUrl', `http://127.0.0.1:${port}`);
  return async () => {
    await server?.close();
    rmSync(dir, { recursive: true, force: true });
  };
}

declare module 'vitest' {
  export interface ProvidedContext {
    appUrl: string;
  }
}
