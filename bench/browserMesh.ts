/**
 * The mesh kit on a 10^6-triangle torus in headless Chromium against the
 * same read and kit in Node (representative cycles included), measured in
 * one run: builds the client, serves it as
 * `npm start` does, drops the OBJ on the mesh kit, and reports the time
 * from handing over the file to the Betti numbers on screen, the longest
 * main-thread task meanwhile (the kit computes in the Web Worker), the
 * peak resident memory of Chromium's processes, the progress phases shown
 * and how often the bar moved while the file was read, the cycles offered,
 * and whether cancel stops a second run.
 *
 *   npx tsx bench/browserMesh.ts [--json]
 *
 * Environment: CHROMIUM_PATH (default /usr/bin/chromium), MESH_N (default
 * 708: 2·708² = 1 002 528 triangles), SKIP_BUILD=1 to reuse dist/.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type Page } from 'playwright-core';
import { createApp } from '../server/createApp';
import { readObj } from '../shared/import';
import { analyseMeshDataPacked } from '../shared/kits';
import { torusObj } from './torusObj';

const root = fileURLToPath(new URL('..', import.meta.url));
const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
const FLAGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];
const N = Number(process.env.MESH_N ?? 708);
const LONG_WAIT = 10 * 60_000;
const json = process.argv.includes('--json');
const log = (s: string) => (json ? process.stderr : process.stdout).write(s + '\n');

/** Resident memory of every process descended from this one (Chromium's browser, renderers, GPU), in MB. */
function descendantsRssMB(): number {
  const parent = new Map<number, number>();
  for (const d of readdirSync('/proc')) {
    if (!/^\d+$/.test(d)) continue;
    try {
      const stat = readFileSync(`/proc/${d}/stat`, 'utf8');
      parent.set(Number(d), Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[1]));
    } catch {
      // gone meanwhile
    }
  }
  let kb = 0;
  for (const pid of parent.keys()) {
    let p = parent.get(pid);
    while (p !== undefined && p !== process.pid && p > 1) p = parent.get(p);
    if (p !== process.pid) continue;
    try {
      const m = /VmRSS:\s+(\d+)/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'));
      if (m) kb += Number(m[1]);
    } catch {
      // gone meanwhile
    }
  }
  return kb / 1024;
}

interface LongTask {
  start: number;
  duration: number;
}

async function main() {
  if (!existsSync(CHROMIUM)) throw new Error(`Chromium not found at ${CHROMIUM} (set CHROMIUM_PATH)`);
  const text = torusObj(N);
  const triangles = 2 * N * N;
  const dir = mkdtempSync(join(tmpdir(), 'gluefield-bench-mesh-'));
  const file = join(dir, `torus${N}.obj`);
  writeFileSync(file, text);
  log(`mesh: torus ${N}×${N}, ${triangles.toLocaleString('en-US')} triangles, ${(text.length / 1e6).toFixed(1)} MB of OBJ`);

  // The baseline, in this run: the same read and kit in Node as the worker runs them, representative cycles included.
  const n0 = performance.now();
  const read = readObj(text);
  if (!('mesh' in read)) throw new Error('the bench mesh did not read');
  const nodeReadMs = performance.now() - n0;
  const nodeReport = analyseMeshDataPacked(read.mesh);
  const nodeMs = performance.now() - n0;
  log(`Node: read + mesh kit with cycles ${fmt(nodeMs)}, Betti (${nodeReport.betti.join(', ')}), cycles of ${nodeReport.cycles.map((c) => c.cellCount).join(', ')} cells`);
  const m0 = performance.now();
  analyseMeshDataPacked(read.mesh, { cycles: false });
  const nodeNoCyclesMs = nodeReadMs + performance.now() - m0;
  log(`Node: read ${fmt(nodeReadMs)}; read + mesh kit without cycles ${fmt(nodeNoCyclesMs)}`);

  if (!process.env.SKIP_BUILD) {
    log('building the client …');
    execFileSync(process.execPath, [join(root, 'node_modules/vite/bin/vite.js'), 'build', '--logLevel', 'error'], { cwd: root, stdio: json ? ['ignore', 'ignore', 'inherit'] : 'inherit' });
  }
  const app = createApp({ distDir: join(root, 'dist') });
  const server = await new Promise<Server>((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const browser = await chromium.launch({ executablePath: CHROMIUM, args: FLAGS });
  let peakMB = 0;
  const sampler = setInterval(() => (peakMB = Math.max(peakMB, descendantsRssMB())), 250);
  try {
    const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
    await context.addInitScript(() => {
      const w = window as unknown as { __longTasks: LongTask[]; __phases: string[]; __readBar: string[] };
      w.__longTasks = [];
      w.__phases = [];
      w.__readBar = [];
      new PerformanceObserver((list) => {
        for (const e of list.getEntries()) w.__longTasks.push({ start: e.startTime, duration: e.duration });
      }).observe({ type: 'longtask', buffered: true });
      // Every progress text shown, so the bench can say which phases the user saw.
      new MutationObserver(() => {
        const t = document.querySelector('[data-testid="mesh-progress"] p')?.textContent;
        if (t && w.__phases[w.__phases.length - 1] !== t) w.__phases.push(t);
        // Positions of the bar while the file is read: the reader's own progress.
        const bar = document.querySelector('[data-testid="mesh-progress"] [role="progressbar"]')?.getAttribute('aria-valuenow');
        if (t && /: parse\b/.test(t) && bar && w.__readBar[w.__readBar.length - 1] !== bar) w.__readBar.push(bar);
      }).observe(document, { childList: true, subtree: true, characterData: true, attributes: true, attributeFilter: ['aria-valuenow'] });
    });
    const page = await context.newPage();
    const pageErrors: string[] = [];
    page.on('pageerror', (e) => pageErrors.push(e.message));
    await page.goto(`${url}/kits/mesh`);
    await page.getByTestId('mesh-input').waitFor();
    const idleMB = descendantsRssMB();

    const t0Page = await page.evaluate(() => performance.now());
    const t0 = performance.now();
    await page.getByTestId('mesh-input').setInputFiles(file);
    await page.getByTestId('mesh-betti').waitFor({ timeout: LONG_WAIT });
    const browserMs = performance.now() - t0;
    const t1Page = await page.evaluate(() => performance.now());
    const betti = await page.getByTestId('mesh-betti').textContent();
    const note = await page.getByTestId('mesh-draw-note').textContent().catch(() => null);
    const kitMs = /([\d.]+) ms \(cohomology/.exec((await page.getByTestId('kit-settings').textContent()) ?? '');
    await page.waitForTimeout(1000);
    const tasks = await longTasks(page, t0Page, t1Page + 1000);
    const phases = await page.evaluate(() => (window as unknown as { __phases: string[] }).__phases);
    const readBar = await page.evaluate(() => (window as unknown as { __readBar: string[] }).__readBar);
    const cycleOptions = await page.locator('#mesh-cycle option').allTextContents();
    const skipped = await page.getByTestId('mesh-cycles-skipped').count();

    // Keep it in a project: the 35 MB file is packed and stored from the page.
    const s0Page = await page.evaluate(() => performance.now());
    const s0 = performance.now();
    await page.getByTestId('kit-save-button').click();
    await page.getByTestId('kit-saved').waitFor({ timeout: LONG_WAIT });
    const saveMs = performance.now() - s0;
    const saveTasks = await longTasks(page, s0Page, await page.evaluate(() => performance.now()));

    // Cancel: start the same mesh again and stop it a second in.
    let cancelMs: number | null = null;
    let cancelledShown = false;
    try {
      await page.getByTestId('mesh-input').setInputFiles(file);
      await page.getByTestId('mesh-cancel').waitFor({ timeout: 30_000 });
      await page.waitForTimeout(1000);
      const c0 = performance.now();
      await page.getByTestId('mesh-cancel').click();
      await page.getByTestId('mesh-progress').waitFor({ state: 'detached', timeout: 30_000 });
      cancelMs = performance.now() - c0;
      cancelledShown = (await page.getByRole('status').allTextContents()).some((t) => /cancelled/i.test(t));
    } catch (err) {
      log(`cancel could not be tried: ${(err as Error).message.split('\n')[0]}`);
    }
    await context.close();

    const longest = tasks.length ? Math.max(...tasks.map((t) => t.duration)) : 0;
    const result = {
      triangles,
      objMB: Math.round(text.length / 1e5) / 10,
      nodeMs: Math.round(nodeMs),
      nodeReadMs: Math.round(nodeReadMs),
      nodeNoCyclesMs: Math.round(nodeNoCyclesMs),
      cycles: cycleOptions,
      cyclesSkipped: skipped > 0,
      readBarPositions: readBar.length,
      browserMs: Math.round(browserMs),
      kitMsInWorker: kitMs ? Number(kitMs[1]) : null,
      ratio: Math.round((browserMs / nodeMs) * 100) / 100,
      longestTaskMs: Math.round(longest),
      longTasks: tasks.length,
      peakMB: Math.round(peakMB),
      idleMB: Math.round(idleMB),
      betti,
      drawNote: note,
      phases,
      cancelMs: cancelMs === null ? null : Math.round(cancelMs),
      saveMs: Math.round(saveMs),
      saveLongestTaskMs: Math.round(saveTasks.length ? Math.max(...saveTasks.map((t) => t.duration)) : 0),
      cancelledShown,
      pageErrors,
    };
    log('');
    log(`browser: file handed over → Betti numbers on screen  ${fmt(browserMs)}  ${betti}  (kit in the worker: ${result.kitMsInWorker ?? '?'} ms)`);
    log(`browser / Node                                         ${result.ratio}×`);
    log(`longest main-thread task meanwhile                     ${longest.toFixed(0)} ms (${tasks.length} tasks > 50 ms)`);
    log(`peak resident memory of Chromium's processes           ${result.peakMB} MB (idle on the kit page: ${result.idleMB} MB)`);
    log(`progress shown                                         ${phases.join(' | ')}`);
    log(`bar positions while the file is read                   ${readBar.length} (${readBar.join(', ')} %)`);
    log(`representative cycles on screen                        ${skipped ? 'skipped' : cycleOptions.join(' | ')}`);
    log(`picture                                                ${note ?? '(no note)'}`);
    log(`save input and report to a project                  ${fmt(saveMs)} (longest main-thread task ${result.saveLongestTaskMs} ms)`);
    log(`cancel a second run after 1 s                          stopped in ${cancelMs === null ? '—' : fmt(cancelMs)}, said on screen: ${cancelledShown}`);
    if (pageErrors.length) log(`page errors: ${pageErrors.join(' | ')}`);
    if (json) process.stdout.write(JSON.stringify(result) + '\n');
  } finally {
    clearInterval(sampler);
    await browser.close();
    await new Promise<void>((resolve) => server.close(() => resolve()));
    rmSync(dir, { recursive: true, force: true });
  }
}

async function longTasks(page: Page, from: number, to: number): Promise<LongTask[]> {
  return page.evaluate(([a, b]) => (window as unknown as { __longTasks: LongTask[] }).__longTasks.filter((x) => x.start + x.duration >= a && x.start <= b), [from, to]);
}

function fmt(ms: number): string {
  return ms >= 10_000 ? `${(ms / 1000).toFixed(1)} s` : `${Math.round(ms)} ms`;
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
