import { afterAll, beforeAll, expect, inject, test } from 'vitest';
import type { Browser } from 'playwright-core';
import { constantTorus } from '../../bench/torusModel';
import { launch, newPage, screenshot, seenTestIds, shownDims, tempFile, watchTestIds } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

const N = 129; // 6·129² = 99 846 cells

test('a 10^5-cell torus over GF(32003) imports with progress, solves with progress to H = (1, 2, 1) (Hatcher 2002, the torus), and a direct run can be cancelled and followed by a new run', async () => {
  const { page, context, errors } = await newPage(browser);
  await page.goto(inject('appUrl'));
  await page.getByLabel('New project name').fill('Large torus');
  await page.getByRole('button', { name: /Create/ }).click();
  await page.waitForURL(/\/p\/[^/]+$/);

  const file = tempFile('torus129.sheaf.json', JSON.stringify(constantTorus(N, 1, { kind: 'prime', p: 32003 })));
  await watchTestIds(page, ['import-progress']);
  await page.getByTestId('import-input').setInputFiles(file);
  await page.waitForURL(/\/m\//, { timeout: 60_000 });
  await expect.poll(() => page.getByTestId('model-name').textContent()).toBe(`torus ${N}×${N}, stalk 1`);
  expect((await seenTestIds(page))['import-progress']).toBe(true);
  await expect.poll(() => page.getByTestId('import-progress').count()).toBe(0);
  await expect.poll(() => page.getByRole('region', { name: 'Models' }).textContent()).toContain(`${(6 * N * N).toLocaleString('en-US')} cells · prime:32003 · v1`);

  // Reduce & solve: the progress shows while the worker runs, the dims at the end.
  await watchTestIds(page, ['solve-progress']);
  await page.getByTestId('solve-start').click();
  await expect.poll(() => shownDims(page), { timeout: 90_000 }).toEqual(['1', '2', '1']);
  expect((await seenTestIds(page))['solve-progress']).toBe(true);
  await expect.poll(() => page.getByTestId('solve-progress').count()).toBe(0);
  await screenshot(page, 'bench-large-torus');

  // Cancel a direct-elimination run: the worker is terminated, nothing is saved.
  await page.locator('#solve-method').selectOption('direct');
  await page.getByTestId('solve-start').click();
  await page.getByTestId('solve-progress').waitFor({ state: 'visible' });
  await page.getByTestId('solve-cancel').click();
  await page.getByTestId('solve-progress').waitFor({ state: 'detached' });
  await expect.poll(() => page.getByRole('region', { name: 'Reduce and solve' }).getByRole('status').textContent()).toContain('Cancelled');
  await screenshot(page, 'bench-large-cancelled');
  // Only the first run is in the history.
  expect(await page.getByTestId('run-history').locator('li').count()).toBe(1);

  // A new run starts a fresh worker and finishes.
  await watchTestIds(page, ['solve-progress']);
  await page.getByTestId('solve-start').click();
  await expect.poll(() => page.getByTestId('run-history').locator('li').count(), { timeout: 90_000 }).toBe(2);
  expect((await seenTestIds(page))['solve-progress']).toBe(true);
  await expect.poll(() => page.getByTestId('solve-progress').count()).toBe(0);
  expect(await page.getByText('Cancelled').count()).toBe(0);
  expect(await page.getByTestId('run-history').locator('li').first().textContent()).toMatch(/direct\s*\[1, 2, 1\]/);
  expect(await shownDims(page)).toEqual(['1', '2', '1']);
  expect(await page.getByRole('region', { name: 'Findings' }).textContent()).toContain('prime:32003 · direct');

  expect(errors).toEqual([]);
  await context.close();
});
