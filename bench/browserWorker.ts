/**
 * The engine in the browser against the engine in Node, on a 10^6-cell
 * torus: builds the client, serves it as `npm start` does, drives Debian's
 * Chromium through the UI (import, reduce & solve) and prints the times and
 * the longest main-thread task seen during the computation (which runs in
 * the Web Worker, so the page should stay responsive).
 *
 *   npx tsx bench/browserWorker.ts
 *
 * Environment: CHROMIUM_PATH (default /usr/bin/chromium), TORUS_N (default
 * 408: 6·408² = 998 784 cells), TORUS_D (stalk dimension, default 3).
 */
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type Page } from 'playwright-core';
import { createApp } from '../server/createApp';
import { cohomology } from '../shared/engine';
import { constantTorus } from './torusModel';

const root = fileURLToPath(new URL('..', import.meta.url));
const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
const FLAGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];
const N = Number(process.env.TORUS_N ?? 408);
const D = Number(process.env.TORUS_D ?? 3);
const P = 1000003;
const LONG_WAIT = 15 * 60_000;

interface LongTask {
  start: number;
  duration: number;
}

async function main() {
  if (!existsSync(CHROMIUM)) throw new Error(`Chromium not found at ${CHROMIUM} (set CHROMIUM_PATH)`);
  const model = constantTorus(N, D, { kind: 'prime', p: P });
  const text = JSON.stringify(model);
  const cells = 6 * N * N;
  const dir = mkdtempSync(join(tmpdir(), 'gluefield-bench-'));
  const file = join(dir, `torus${N}.sheaf.json`);
  writeFileSync(file, text);
  console.log(`model: ${model.name}, GF(${P}), ${cells.toLocaleString('en-US')} cells, ${(cells * D).toLocaleString('en-US')} cochain coordinates, ${(text.length / 1e6).toFixed(1)} MB of JSON`);

  console.log('building the client …');
  execFileSync(process.execPath, [join(root, 'node_modules/vite/bin/vite.js'), 'build', '--logLevel', 'error'], { cwd: root, stdio: 'inherit' });
  const app = createApp({ distDir: join(root, 'dist') });
  const server = await new Promise<Server>((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const browser = await chromium.launch({ executablePath: CHROMIUM, args: FLAGS });
  try {
    const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
    // Every long task (> 50 ms on the main thread) from the first script on.
    await context.addInitScript(() => {
      const w = window as unknown as { __longTasks: { start: number; duration: number }[] };
      w.__longTasks = [];
      new PerformanceObserver((list) => {
        for (const e of list.getEntries()) w.__longTasks.push({ start: e.startTime, duration: e.duration });
      }).observe({ type: 'longtask', buffered: true });
    });
    const page = await context.newPage();
    const pageErrors: string[] = [];
    page.on('pageerror', (e) => pageErrors.push(e.message));
    await page.goto(url);
    await page.getByLabel('New project name').fill('Browser bench');
    await page.getByRole('button', { name: /Create/ }).click();
    await page.waitForURL(/\/p\/[^/]+$/);

    // Import: from handing the file to the picker until the model is open.
    const importStart = performance.now();
    await page.getByTestId('import-input').setInputFiles(file);
    await page.getByTestId('model-name').filter({ hasText: model.name! }).waitFor({ timeout: LONG_WAIT });
    const importMs = performance.now() - importStart;
    const importTasks = await longTasks(page, 0);

    // The sketch's layout runs in the same worker; let it finish so the run does not queue behind it.
    const sketchStart = performance.now();
    await page.getByTestId('sketch').waitFor({ timeout: LONG_WAIT });
    await page.waitForTimeout(500);
    const sketchMs = performance.now() - sketchStart;

    // Reduce & solve: from the click until the dims are on screen.
    const t0Page = await page.evaluate(() => performance.now());
    const t0 = performance.now();
    await page.getByTestId('solve-start').click();
    await page.getByTestId('dim-0').waitFor({ timeout: LONG_WAIT });
    const computeMs = performance.now() - t0;
    const t1Page = await page.evaluate(() => performance.now());
    const dims = await page.getByTestId('findings-dims').locator('[data-testid^="dim-"]').allTextContents();
    const findings = (await page.getByRole('region', { name: 'Findings' }).textContent()) ?? '';
    const runMs = /(\d+) ms \(build ([\d.]+), reduce ([\d.]+), solve ([\d.]+)\)/.exec(findings);
    // Paints of the sketch that follow the findings are part of the user's wait too: give them a moment.
    await page.waitForTimeout(1000);
    const computeTasks = (await longTasks(page, t0Page)).filter((t) => t.start <= t1Page + 1000);
    await context.close();

    // The same model in Node: parse the same text, then the whole job.
    const n0 = performance.now();
    const report = cohomology(JSON.parse(text));
    const nodeMs = performance.now() - n0;

    const longest = (ts: LongTask[]) => (ts.length ? Math.max(...ts.map((t) => t.duration)) : 0);
    console.log('');
    console.log(`import (file picker → model open):          ${fmt(importMs)}`);
    console.log(`  longest main-thread task during import:   ${fmt(longest(importTasks))} (${importTasks.length} tasks > 50 ms)`);
    console.log(`sketch ready after import (layout, draw):   ${fmt(sketchMs)}`);
    console.log(`browser compute wall (click → dims shown):  ${fmt(computeMs)}   dims [${dims.join(', ')}]`);
    console.log(`  run's own time (Findings):                ${runMs ? `${runMs[1]} ms (build ${runMs[2]}, reduce ${runMs[3]}, solve ${runMs[4]})` : 'not found'}`);
    console.log(`Node, cohomology() on the parsed JSON:      ${fmt(nodeMs)}   dims [${report.dims.join(', ')}]  (engine: build ${report.ms.build}, reduce ${report.ms.reduce}, solve ${report.ms.solve} ms)`);
    console.log(`longest main-thread task during compute:    ${fmt(longest(computeTasks))} (${computeTasks.length} tasks > 50 ms, ${fmt(computeTasks.reduce((a, t) => a + t.duration, 0))} in all)`);
    if (pageErrors.length) console.log(`page errors: ${pageErrors.join(' | ')}`);
  } finally {
    await browser.close();
    await new Promise<void>((resolve) => server.close(() => resolve()));
    rmSync(dir, { recursive: true, force: true });
  }
}

async function longTasks(page: Page, since: number): Promise<LongTask[]> {
  return page.evaluate((t) => (window as unknown as { __longTasks: LongTask[] }).__longTasks.filter((x) => x.start + x.duration >= t), since);
}

function fmt(ms: number): string {
  return ms >= 10_000 ? `${(ms / 1000).toFixed(1)} s` : `${Math.round(ms)} ms`;
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
