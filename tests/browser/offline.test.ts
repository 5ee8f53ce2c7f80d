import { afterAll, beforeAll, expect, inject, test } from 'vitest';
import type { Browser } from 'playwright-core';
import { launch, newPage, screenshot, shownDims } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

test('after one online visit the app reloads and computes with the network off: the ridge-line ring still reads H^0 = 1, H^1 = 3 (12 − 10 + 1 = 3 loops, common practice)', async () => {
  // newPage makes a fresh context: a profile with no service worker and no IndexedDB yet.
  const { page, context, errors } = await newPage(browser);
  await page.goto(inject('appUrl'));
  expect(await page.getByTestId('network-state').textContent()).toBe('online');

  // The service worker installs and precaches the app; it controls the page from the next load on.
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  await expect.poll(() => page.getByTestId('offline-ready').isVisible(), { timeout: 20_000 }).toBe(true);
  for (let i = 0; i < 5 && !(await page.evaluate(() => navigator.serviceWorker.controller !== null)); i++) {
    await page.reload();
    await page.evaluate(async () => {
      await navigator.serviceWorker.ready;
    });
  }
  expect(await page.evaluate(() => navigator.serviceWorker.controller !== null)).toBe(true);
  // The demo project is seeded on the first visit and is there to open offline.
  await expect.poll(() => page.getByRole('link', { name: /Demo:/ }).count()).toBe(1);

  await context.setOffline(true);
  await page.reload();
  await expect.poll(() => page.getByTestId('network-state').textContent()).toContain('offline');
  expect(await page.evaluate(() => navigator.onLine)).toBe(false);
  await screenshot(page, 'desk-offline');

  await page.getByRole('link', { name: /Demo:/ }).click();
  await page.getByRole('link', { name: /Ridge line ring/ }).click();
  await expect.poll(() => page.getByTestId('model-name').textContent()).toMatch(/Ridge line ring/);
  // A fresh worker has to start from the cache: the engine chunk must be precached too.
  await page.getByTestId('solve-start').click();
  await expect.poll(() => shownDims(page), { timeout: 30_000 }).toEqual(['1', '3']);
  await expect.poll(() => page.getByTestId('run-history').textContent()).toContain('[1, 3]');
  await screenshot(page, 'bench-offline-ridge-line');

  // Really offline: a request that the service worker does not answer fails.
  const health = await page.evaluate(() =>
    fetch('/api/health').then(
      (r) => r.status,
      () => 'failed',
    ),
  );
  expect(health).toBe('failed');

  expect(errors).toEqual([]);
  await context.close();
});
