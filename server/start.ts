import { fileURLToPath } from 'node:url';
import { createApp } from './createApp';

const port = Number(process.env.PORT ?? 8080);
const distDir = fileURLToPath(new URL('../dist', import.meta.url));
const app = createApp({ distDir });
app.listen(port, () => {
  console.log(`Gluefield is running at http://localhost:${port}`);
});
