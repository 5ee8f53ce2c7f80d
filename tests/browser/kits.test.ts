import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, expect, inject, test } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { ARTIFACTS, launch, newPage, screenshot, seenTestIds, tempFile, watchTestIds } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

const demo = (name: string) => tempFile(name, readFileSync(new URL(`../../shared/kits/demo/${name}`, import.meta.url), 'utf8'));

/** An OBJ torus of n × m squares, each cut in two (Betti numbers 1, 2, 1). */
function torusObj(n: number, m: number): string {
  const lines: string[] = [];
  for (let i = 0; i < n; i++)
    for (let j = 0; j < m; j++) {
      const u = (2 * Math.PI * i) / n;
      const w = (2 * Math.PI * j) / m;
      lines.push(`v ${((3 + Math.cos(w)) * Math.cos(u)).toFixed(4)} ${((3 + Math.cos(w)) * Math.sin(u)).toFixed(4)} ${Math.sin(w).toFixed(4)}`);
    }
  const id = (i: number, j: number) => (i % n) * m + (j % m) + 1;
  for (let i = 0; i < n; i++) for (let j = 0; j < m; j++) lines.push(`f ${id(i, j)} ${id(i + 1, j)} ${id(i + 1, j + 1)}`, `f ${id(i, j)} ${id(i + 1, j + 1)} ${id(i, j + 1)}`);
  return lines.join('\n') + '\n';
}

/** Click the report's JSON export and read back the downloaded file. */
async function exportedJson(page: Page, expectedName: RegExp): Promise<Record<string, unknown>> {
  const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('export-json').click()]);
  expect(download.suggestedFilename()).toMatch(expectedName);
  return JSON.parse(readFileSync(await download.path(), 'utf8')) as Record<string, unknown>;
}

/** The canvas is on the page with a drawn area and something painted on it. */
async function drawn(page: Page, testId: string): Promise<boolean> {
  return page.getByTestId(testId).evaluate((c: HTMLCanvasElement) => {
    if (c.width < 50 || c.height < 50) return false;
    const data = c.getContext('2d')!.getImageData(0, 0, c.width, c.height).data;
    for (let i = 3; i < data.length; i += 4) if (data[i] !== 0) return true;
    return false;
  });
}

test('each kit goes from uploaded files to a drawn result and a JSON export; a bad CSV shows located problems', async () => {
  const { page, context, errors } = await newPage(browser);
  await page.goto(inject('appUrl'));
  await page.getByRole('link', { name: 'Kits', exact: true }).click();
  await page.waitForURL(/\/kits$/);

  // Levelling net: the invented ridge-line net, second order class II by default.
  await page.getByRole('navigation', { name: 'Kits' }).getByRole('link', { name: 'Levelling net' }).click();
  await page.getByTestId('stations-input').setInputFiles(demo('ridge-line-stations.csv'));
  await page.getByTestId('lines-input').setInputFiles(demo('ridge-line-lines.csv'));
  await expect.poll(() => page.getByTestId('levelling-loop-count').textContent(), { timeout: 15_000 }).toBe('5');
  expect(await page.getByTestId('levelling-loops-failing').textContent()).toBe('2');
  expect(await page.getByTestId('levelling-dof').textContent()).toBe('6');
  // Standardised residuals with the a-posteriori σ0: |w| ≤ √6 < 3.29, said on screen; the blunder has the largest |w|.
  expect(await page.getByTestId('levelling-test-note').textContent()).toContain('√dof = 2.45');
  expect(await page.getByTestId('levelling-largest-w').textContent()).toContain('RL-04 → RL-07');
  expect(await page.getByTestId('levelling-redundancy-sum').textContent()).toBe('6.000');
  expect(await page.getByTestId('levelling-flagged').count()).toBe(0);
  // An a-priori σ0 of 3 mm per √km (the demo's invented setting) flags the blunder alone.
  await page.getByLabel('a-priori sigma0 in millimetres').fill('3');
  await page.getByTestId('levelling-compute').click();
  await expect.poll(() => page.getByTestId('levelling-flag-count').textContent(), { timeout: 15_000 }).toBe('1');
  expect(await page.getByTestId('levelling-flagged').textContent()).toContain('RL-04 → RL-07 (line 13) w = -4.87');
  expect(await page.getByTestId('kit-settings').textContent()).toContain('3.00 mm per √km (a-priori)');
  // A critical value that is not a number is a located problem.
  await page.getByLabel('critical value of w').fill('abc');
  await page.getByTestId('levelling-compute').click();
  await expect.poll(() => page.getByRole('alert').textContent(), { timeout: 15_000 }).toContain('residual test');
  await page.getByLabel('critical value of w').fill('3.29');
  await page.getByTestId('levelling-compute').click();
  await expect.poll(() => page.getByTestId('levelling-flag-count').textContent(), { timeout: 15_000 }).toBe('1');
  expect(await page.getByTestId('kit-settings').textContent()).toContain('second order, class II');
  expect(await page.getByRole('complementary', { name: 'Cautions' }).textContent()).toContain('Defer to licensed engineers');
  await expect.poll(() => drawn(page, 'levelling-sketch')).toBe(true);
  await screenshot(page, 'kits-levelling');
  // On paper: the controls go, the report keeps its standard and the cautions.
  await page.emulateMedia({ media: 'print' });
  expect(await page.getByTestId('export-json').isVisible()).toBe(false);
  expect(await page.getByTestId('stations-input-drop').isVisible()).toBe(false);
  expect(await page.getByRole('complementary', { name: 'Cautions' }).isVisible()).toBe(true);
  expect(await page.getByTestId('kit-settings').isVisible()).toBe(true);
  await page.screenshot({ path: `${ARTIFACTS}kits-levelling-print.png`, fullPage: true });
  await page.emulateMedia({ media: 'screen' });
  const levelling = await exportedJson(page, /levelling\.json$/);
  expect((levelling.loops as unknown[]).length).toBe(5);
  expect((levelling.standard as { key: string }).key).toBe('second-II');

  // Another standard: the report names the one used.
  await page.getByLabel('Tolerance standard').selectOption('third');
  await expect.poll(() => page.getByTestId('kit-settings').textContent(), { timeout: 15_000 }).toContain('third order');

  // A lines file with a bad number: the problem is located to its file and line.
  await page.getByTestId('lines-input').setInputFiles(tempFile('bad-lines.csv', 'from,to,rise,length_km\nRL-01,RL-02,7.4997,0.82\nRL-02,RL-03,seven,0.95\n'));
  await expect.poll(() => page.getByRole('alert').textContent(), { timeout: 15_000 }).toContain('bad-lines.csv line 3');

  // Frame check: the footbridge with its counter-diagonal, one state of self-stress.
  await page.getByRole('navigation', { name: 'Kits' }).getByRole('link', { name: 'Frame check' }).click();
  await page.getByTestId('joints-input').setInputFiles(demo('footbridge-joints.csv'));
  await page.getByTestId('bars-input').setInputFiles(demo('footbridge-bars-extra-diagonal.csv'));
  await expect.poll(() => page.getByTestId('frame-dims').textContent(), { timeout: 15_000 }).toBe('[0, 1]');
  expect(await page.getByTestId('frame-classification').textContent()).toContain('statically indeterminate to degree 1');
  expect(await page.getByTestId('frame-self-stresses').textContent()).toBe('1');
  await expect.poll(() => drawn(page, 'frame-sketch')).toBe(true);
  await screenshot(page, 'kits-frame');
  const frame = await exportedJson(page, /frame\.json$/);
  expect(frame.dims).toEqual([0, 1]);

  // A square panel without a diagonal, its bars dropped on the picker: one mechanism, drawn as arrows.
  await page.getByTestId('joints-input').setInputFiles(tempFile('square-joints.csv', 'id,x,y,fixed\nA,0,0,xy\nB,4,0,y\nC,4,3,\nD,0,3,\n'));
  await page.getByTestId('bars-input-drop').evaluate((el, text) => {
    const dt = new DataTransfer();
    dt.items.add(new File([text], 'square-bars.csv', { type: 'text/csv' }));
    el.dispatchEvent(new DragEvent('drop', { dataTransfer: dt, bubbles: true, cancelable: true }));
  }, 'id,from,to\nAB,A,B\nBC,B,C\nCD,C,D\nDA,D,A\n');
  await expect.poll(() => page.getByTestId('frame-mechanisms').textContent(), { timeout: 15_000 }).toBe('1');
  expect(await page.getByTestId('frame-dims').textContent()).toBe('[1, 0]');
  expect(await page.getByLabel('Show').inputValue()).toBe('mechanism:0');
  await expect.poll(() => drawn(page, 'frame-sketch')).toBe(true);
  await screenshot(page, 'kits-frame-mechanism');

  // Mesh topology: the culvert ring, a torus.
  await page.getByRole('navigation', { name: 'Kits' }).getByRole('link', { name: 'Mesh topology' }).click();
  await page.getByTestId('mesh-input').setInputFiles(demo('culvert-ring.obj'));
  await expect.poll(() => page.getByTestId('mesh-betti').textContent(), { timeout: 20_000 }).toBe('(1, 2, 1)');
  expect(await page.getByTestId('mesh-closed').textContent()).toBe('yes');
  expect(await page.getByTestId('mesh-orientable').textContent()).toBe('yes');
  await expect.poll(() => drawn(page, 'mesh-sketch')).toBe(true);
  await screenshot(page, 'kits-mesh');
  const mesh = await exportedJson(page, /mesh\.json$/);
  expect(mesh.betti).toEqual([1, 2, 1]);
  // The export has the cycles as the command line gives them: each cell a list of vertex ids.
  const cycles = mesh.cycles as { degree: number; cells: number[][] }[];
  expect(cycles.map((c) => c.degree)).toEqual([1, 1, 2]);
  expect(cycles[0].cells[0]).toHaveLength(2);

  // A torus of 217,800 triangles: computed in the worker with a progress note, cycles included.
  await watchTestIds(page, ['mesh-progress']);
  await page.getByTestId('mesh-input').setInputFiles(tempFile('big-torus.obj', torusObj(330, 330)));
  await expect.poll(() => page.getByTestId('mesh-betti').textContent(), { timeout: 30_000 }).toBe('(1, 2, 1)');
  expect(await page.getByTestId('mesh-cycles-skipped').count()).toBe(0);
  // The void's representative is the whole closed surface (Hatcher 2002, ch. 2: H_2 of the torus is its fundamental class).
  expect(await page.locator('#mesh-cycle option').allTextContents()).toEqual(expect.arrayContaining([expect.stringMatching(/^void surface 3 \(217,800 triangles\)$/)]));
  await page.locator('#mesh-cycle').selectOption({ index: 2 });
  expect(await page.getByTestId('mesh-cycle-note').textContent()).toContain('drawn by every 11th of its 217,800 cells');
  expect((await seenTestIds(page))['mesh-progress']).toBe(true);
  // Not every edge is drawn at this size, and the picture says so.
  expect(await page.getByTestId('mesh-draw-note').textContent()).toMatch(/a sample: [\d,]+ of 326,700 edges drawn \(the edges of every 11th cell of the file\)/);
  await screenshot(page, 'kits-mesh-large');

  // Cancel: the same mesh again, stopped while it computes; the next computation starts a fresh worker.
  await page.getByTestId('mesh-input').setInputFiles(tempFile('big-torus-again.obj', torusObj(330, 330)));
  await page.getByTestId('mesh-cancel').click();
  await expect.poll(() => page.getByTestId('kit-cancelled').count(), { timeout: 10_000 }).toBe(1);
  expect(await page.getByTestId('mesh-progress').count()).toBe(0);
  expect(await page.getByTestId('mesh-betti').count()).toBe(0);
  await page.getByRole('button', { name: 'Load the invented culvert ring' }).click();
  await expect.poll(() => page.getByTestId('mesh-betti').textContent(), { timeout: 20_000 }).toBe('(1, 2, 1)');
  expect(await page.getByTestId('kit-cancelled').count()).toBe(0);

  expect(errors).toEqual([]);
  await context.close();
});

test('a kit result saved into a project is listed there with its inputs, engine version and time, and survives a reload', async () => {
  const { page, context, errors } = await newPage(browser);
  await page.goto(inject('appUrl'));
  await page.getByRole('link', { name: /Demo:/ }).waitFor();
  await page.getByRole('link', { name: 'Kits', exact: true }).click();
  await page.getByRole('navigation', { name: 'Kits' }).getByRole('link', { name: 'Levelling net' }).click();
  await page.getByRole('button', { name: 'Load the invented ridge-line demo' }).click();
  await expect.poll(() => page.getByTestId('levelling-flag-count').textContent(), { timeout: 15_000 }).toBe('1');
  expect(await page.getByLabel('Project to keep the result in').locator('option:checked').textContent()).toMatch(/^Demo:/);
  const before = Date.now();
  await page.getByTestId('kit-save-button').click();
  await expect.poll(() => page.getByTestId('kit-saved').textContent(), { timeout: 10_000 }).toMatch(/Saved to Demo:/);
  // The saved copy is the one in the project, not this screen: open it from there.
  await page.getByTestId('kit-saved').getByRole('link').click();
  await page.waitForURL(/\/p\/[^/]+$/);
  const entry = page.getByTestId('kit-shelf').getByRole('link', { name: /Levelling net: ridge-line-lines\.csv/ });
  await entry.waitFor();
  expect(await entry.textContent()).toContain('engine 0.1.0');
  await page.reload();
  await entry.click();
  await page.waitForURL(/\/p\/[^/]+\/k\/[^/]+$/);
  const summary = await page.getByTestId('saved-kit-summary').textContent();
  expect(summary).toContain('12 stations · 16 lines · dof 6 · 2 of 5 loops over tolerance · 1 line flagged');
  const provenance = (await page.getByTestId('saved-kit-provenance').textContent())!;
  expect(provenance).toContain('Gluefield engine 0.1.0');
  expect(provenance).toContain('ridge-line-stations.csv');
  expect(provenance).toContain('ridge-line-lines.csv');
  expect(provenance).toContain('a-priori');
  expect(await page.getByTestId('saved-kit-headline').textContent()).toContain('RL-04 → RL-07 (w = -4.87)');
  expect(await page.getByTestId('kit-caution').textContent()).toContain('local survey regulations');
  expect(await page.getByRole('complementary', { name: 'Cautions' }).textContent()).toContain('Defer to licensed engineers');
  // The report kept is the whole report, exported as it was saved.
  const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('saved-kit-export').click()]);
  const saved = JSON.parse(readFileSync(await download.path(), 'utf8')) as { flagged: { from: string }[]; test: { sigma0_mm: number } };
  expect(saved.flagged.map((f) => f.from)).toEqual(['RL-04']);
  expect(saved.test.sigma0_mm).toBe(3);
  // And the input as it was read.
  const [input] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Download ridge-line-lines.csv' }).click()]);
  expect(readFileSync(await input.path(), 'utf8')).toBe(readFileSync(new URL('../../shared/kits/demo/ridge-line-lines.csv', import.meta.url), 'utf8'));
  // Saved when we saved it: the store's stamp is shown in local time.
  const stampText = await page.evaluate(() => document.querySelector('[data-testid="saved-kit-provenance"] dd:nth-of-type(2)')?.textContent ?? '');
  expect(Math.abs(new Date(stampText).getTime() - before)).toBeLessThan(120_000);
  await screenshot(page, 'kits-saved-in-project');
  expect(errors).toEqual([]);
  await context.close();
});

test('the mesh kit offers the rationals: a Klein bottle is (1, 2, 1) over GF(2) and (1, 1, 0) over the rationals (Hatcher 2002)', async () => {
  const { page, context, errors } = await newPage(browser);
  await page.goto(`${inject('appUrl')}/kits/mesh`);
  // Klein bottle: a 6 × 6 grid, sides j glued straight, sides i with the flip (6, j) ~ (0, 6 − j).
  const n = 6;
  const v = (i: number, j: number) => (i === n ? ((n - (j % n)) % n) : i * n + (j % n)) + 1;
  const lines: string[] = [];
  for (let k = 0; k < n * n; k++) lines.push(`v ${k % n} ${Math.floor(k / n)} ${(k * 7) % 5}`);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) lines.push(`f ${v(i, j)} ${v(i + 1, j)} ${v(i + 1, j + 1)}`, `f ${v(i, j)} ${v(i + 1, j + 1)} ${v(i, j + 1)}`);
  await page.getByTestId('mesh-input').setInputFiles(tempFile('klein.obj', lines.join('\n') + '\n'));
  await expect.poll(() => page.getByTestId('mesh-betti').textContent(), { timeout: 20_000 }).toBe('(1, 2, 1)');
  expect(await page.getByTestId('mesh-orientable').textContent()).toBe('no');
  expect(await page.getByTestId('kit-caution').textContent()).toContain('GF(2)');
  await page.getByLabel('Coefficients').selectOption('rational');
  await expect.poll(() => page.getByTestId('mesh-betti').textContent(), { timeout: 20_000 }).toBe('(1, 1, 0)');
  expect(await page.getByTestId('mesh-orientable').textContent()).toBe('no');
  expect(await page.getByTestId('kit-settings').textContent()).toContain('rational');
  expect(await page.getByTestId('kit-caution').textContent()).toContain('non-orientable one has b₂ = 0');
  // The culvert ring is orientable: over the rationals its void stays (1, 2, 1).
  await page.getByRole('button', { name: 'Load the invented culvert ring' }).click();
  await expect.poll(() => page.getByTestId('kit-settings').textContent(), { timeout: 20_000 }).toContain('rational');
  await expect.poll(() => page.getByTestId('mesh-betti').textContent(), { timeout: 20_000 }).toBe('(1, 2, 1)');
  expect(await page.getByTestId('mesh-orientable').textContent()).toBe('yes');
  await screenshot(page, 'kits-mesh-rational');
  expect(errors).toEqual([]);
  await context.close();
});
