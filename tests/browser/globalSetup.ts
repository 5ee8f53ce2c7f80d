import { execFileSync } from 'node:child_process';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { fileURLToPath } from 'node:url';
import type { TestProject } from 'vitest/node';
import { createApp } from '../../server/createApp';

const root = fileURLToPath(new URL('../..', import.meta.url));
let server: Server | undefined;

/** Build the client once and serve it, as `npm start` does, on a free port. */
export default async function setup(project: TestProject) {
  execFileSync(process.execPath, [`${root}node_modules/vite/bin/vite.js`, 'build', '--logLevel', 'error'], { cwd: root, stdio: 'inherit' });
  const app = createApp({ distDir: `${root}dist` });
  server = await new Promise<Server>((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const { port } = server.address() as AddressInfo;
  project.provide('appUrl', `http://127.0.0.1:${port}`);
  return async () => {
    await new Promise<void>((resolve) => server?.close(() => resolve()));
  };
}

declare module 'vitest' {
  export interface ProvidedContext {
    appUrl: string;
  }
}
