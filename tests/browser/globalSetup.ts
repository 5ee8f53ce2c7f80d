import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer as createNetServer } from 'node:net';
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
  // The links in mailed invitations and resets start with APP_ORIGIN, so the server must know its port before it starts.
  const port = await freePort();
  const appUrl = `http://127.0.0.1:${port}`;
  const config = loadConfig({
    GLUEFIELD_DB: join(dir, 'gluefield.sqlite'), SMTP_PORT: '0', SMTP_SINK: '1', BCRYPT_ROUNDS: '4', RATE_LIMIT_LOGIN: '1000', RATE_LIMIT_RESET: '1000', APP_ORIGIN: appUrl,
  });
  server = await createServer({ ...config, distDir: `${root}dist` });
  await server.listen(port, '127.0.0.1');
  project.provide('appUrl', appUrl);
  return async () => {
    await server?.close();
    rmSync(dir, { recursive: true, force: true });
  };
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createNetServer();
    probe.on('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as { port: number };
      probe.close(() => resolve(port));
    });
  });
}

declare module 'vitest' {
  export interface ProvidedContext {
    appUrl: string;
  }
}
