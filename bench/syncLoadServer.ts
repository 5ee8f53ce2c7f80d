/**
 * The server under load for bench/syncLoad.ts, in its own process. Prints
 * `PORT n` once listening; on SIGTERM prints one `STATS {json}` line with
 * the time spent handling each route and the longest event-loop stall,
 * so queueing on a busy machine can be told apart from the server's own work.
 */
import { createServer as createHttpServer } from 'node:http';
import type { AddressInfo } from 'node:net';
import { loadConfig } from '../server/config';
import { createServer } from '../server/createServer';

const server = await createServer(loadConfig());
const handling: Record<string, number[]> = {};
const http = createHttpServer((req, res) => {
  const t0 = performance.now();
  res.on('finish', () => {
    const route = `${req.method} ${(req.url ?? '').replace(/\?.*/, '').replace(/[0-9a-f-]{36}/g, ':id')}`;
    (handling[route] ??= []).push(performance.now() - t0);
  });
  server.app(req, res);
});
let last = performance.now();
let stall = 0;
setInterval(() => {
  const now = performance.now();
  stall = Math.max(stall, now - last - 50);
  last = now;
}, 50).unref();
http.listen(0, '127.0.0.1', () => console.log(`PORT ${(http.address() as AddressInfo).port}`));
process.once('SIGTERM', async () => {
  // Exit only once the line is written: at a few thousand requests it is larger than the pipe's buffer, and process.exit would cut it.
  await new Promise((written) => process.stdout.write(`STATS ${JSON.stringify({ handling, stallMs: stall })}\n`, written));
  http.close();
  await server.close();
  process.exit(0);
});
