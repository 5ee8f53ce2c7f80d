import { fileURLToPath } from 'node:url';
import { loadConfig } from './config';
import { createServer } from './createServer';

const config = { ...loadConfig(), distDir: fileURLToPath(new URL('../dist', import.meta.url)) };
const server = await createServer(config);
const { port } = await server.listen().catch(async (error: Error) => {
  console.error(`Gluefield could not listen on port ${config.port}: ${error.message}`);
  await server.close();
  process.exit(1);
});
console.log(`Gluefield is running at http://localhost:${port}`);
if (server.sink) console.log(`Mail goes to the local sink on 127.0.0.1:${server.sink.port}; read it at ${config.appOrigin}/api/mailroom`);
if (config.db.kind === 'sqlite') console.log(`Database: ${config.db.file}`);

const stop = async () => {
  await server.close();
  process.exit(0);
};
process.once('SIGINT', stop);
process.once('SIGTERM', stop);
