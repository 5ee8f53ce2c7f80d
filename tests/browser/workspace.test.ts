import { afterAll, beforeAll, expect, inject, test } from 'vitest';
import type { Browser } from 'playwright-core';
import { launch, newPage, screenshot } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

test('the demo ridge-line ring reads H^0 = 1 and H^1 = 3 after reduce & solve (a graph with 10 stations and 12 links: 12 − 10 + 1 = 3 independent loops, common practice)', async () => {
  const { page, context, errors } = await newPage(browser);
  await page.goto(inject('appUrl'));
  await page.getByRole('link', { name: /Demo:/ }).click();
  await page.getByRole('link', { name: /Ridge line ring/ }).click();
  await page.getByTestId('solve-start').click();
  await expect.poll(() => page.getByTestId('dim-0').textContent(), { timeout: 30_000 }).toBe('1');
  expect(await page.getByTestId('dim-1').textContent()).toBe('3');
  await screenshot(page, 'bench-ridge-line');
  expect(errors).toEqual([]);
  await context.close();
});
