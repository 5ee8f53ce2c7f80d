import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, expect, inject, test } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launch, newPage, screenshot, seenTestIds, tempFile, watchTestIds } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

/**
 * Ridge line stations RL-01, RL-02, RL-03 (ids 0, 1, 2) read 10 m, the links between them 10.3 and 10.1.
 * Constant sheaf, identity maps: the pairs 0<0-1 and 1<0-1 are off by 0.3, 1<1-2 and 2<1-2 by 0.1, so the
 * consistency radius is 0.3 and its RMS √((2·0.09 + 2·0.01)/4) = √0.05 ≈ 0.224 (hand computation).
 */
const RIDGE_CSV = 'cell,value,weight\n0,10\n1,10\n2,10\n0-1,10.3\n1-2,10.1\n';

async function openDemoModel(page: Page, name: RegExp) {
  await page.getByRole('region', { name: 'Models' }).getByRole('link', { name }).click();
  await page.waitForURL(/\/m\//);
  await expect.poll(() => page.getByTestId('model-name').textContent()).toMatch(name);
  await page.getByRole('tab', { name: 'Readings' }).click();
}

async function downloaded(page: Page, testId: string): Promise<{ name: string; text: string }> {
  const [d] = await Promise.all([page.waitForEvent('download'), page.getByTestId(testId).click()]);
  return { name: d.suggestedFilename(), text: readFileSync(await d.path(), 'utf8') };
}

test('readings for a demo model: a bad CSV (picked) is refused by line and cell, a good one (dropped) is checked in the worker, its worst pair is shown, picked on the Sketch and exported', async () => {
  const { page, context, errors } = await newPage(browser);
  await page.goto(inject('appUrl'));
  await page.getByRole('link', { name: /Demo:/ }).click();
  await page.waitForURL(/\/p\/[^/]+$/);
  await openDemoModel(page, /Ridge line ring/);
  const panel = page.getByRole('region', { name: 'Readings' });

  // No readings yet: the empty state offers a sample to fill in.
  await expect.poll(() => page.getByTestId('readings-empty').isVisible()).toBe(true);
  const sample = await downloaded(page, 'readings-sample');
  expect(sample.name).toBe('Ridge-line-ring-readings-sample.csv');
  expect(sample.text.split('\n').slice(0, 2)).toEqual(['cell,value,weight', '0,0,1']);

  // A file naming a link that is not in the model, and a weight of zero: both rows named, nothing saved.
  await page.getByTestId('readings-input').setInputFiles(tempFile('bad-heights.csv', 'cell,value,weight\n0,10\n0-5,10.2\n1,10,0\n'));
  const alert = panel.getByRole('alert');
  await expect.poll(() => alert.textContent(), { timeout: 15_000 }).toContain('bad-heights.csv was not imported; nothing saved was changed.');
  expect(await alert.textContent()).toContain('line 3, cell 0-5[0,5] is not a cell of the complex');
  expect(await alert.textContent()).toContain('line 4, weight, cell 1"0" is not a positive number');
  expect(await page.getByTestId('readings-empty').isVisible()).toBe(true);
  await screenshot(page, 'readings-bad-csv');

  // The good file, dropped on the panel: listed with its count.
  await page.getByTestId('readings-panel').evaluate((el, text) => {
    const dt = new DataTransfer();
    dt.items.add(new File([text], 'heights.csv', { type: 'text/csv' }));
    el.dispatchEvent(new DragEvent('drop', { dataTransfer: dt, bubbles: true, cancelable: true }));
  }, RIDGE_CSV);
  await expect.poll(() => page.getByTestId('readings-list').textContent(), { timeout: 15_000 }).toContain('heights5 readings');
  expect(await alert.count()).toBe(0);

  // Check in the worker: progress, then the figures.
  await watchTestIds(page, ['readings-progress']);
  await page.getByTestId('readings-check').click();
  await expect.poll(() => page.getByTestId('readings-radius-max').textContent(), { timeout: 20_000 }).toBe('0.3');
  expect((await seenTestIds(page))['readings-progress']).toBe(true);
  expect(await page.getByTestId('readings-radius-rms').textContent()).toBe('0.224');
  expect(await page.getByTestId('readings-pairs').textContent()).toBe('4');
  // Constant sheaf on a connected graph: one free parameter, the fit is the mean 10.08 (hand computation).
  expect(await page.getByTestId('readings-section').textContent()).toContain('dim H⁰ 1');
  expect(await page.getByTestId('readings-spectrum').textContent()).toMatch(/^≈ 0, /);
  expect(await page.getByTestId('readings-headline').textContent()).toContain('the worst pair is RL-01 against RL-01 – RL-02, off by 0.3');

  // The worst pair heads the table; picking it points out both cells on the Sketch.
  const rows = page.getByTestId('worst-pairs').getByTestId('readings-row');
  expect(await rows.count()).toBe(4);
  const worst = rows.first();
  expect(await worst.textContent()).toBe('RL-01RL-01 – RL-020.3');
  const sketch = page.getByTestId('sketch');
  expect(await sketch.getAttribute('data-shaded')).toBe('5');
  expect(await page.getByTestId('sketch-legend').textContent()).toContain('residual ‖r‖');
  expect(await sketch.getAttribute('data-highlight')).toBeNull();
  await worst.click();
  await expect.poll(() => worst.getAttribute('aria-selected')).toBe('true');
  await expect.poll(() => sketch.getAttribute('data-highlight')).toBe('0:0 1:0');
  await screenshot(page, 'readings-worst-pair-picked');

  // Sorting by mismatch, smallest first, brings a 0.1 pair to the top.
  await page.getByRole('button', { name: /^mismatch/ }).click();
  expect(await rows.first().locator('td').last().textContent()).toBe('0.1');
  // The residuals table: the link read 10.3 is furthest from the mean, 0.22.
  await page.getByRole('tab', { name: /^Residuals/ }).click();
  const residuals = page.getByTestId('residuals').getByTestId('readings-row');
  expect(await residuals.first().getAttribute('data-cells')).toBe('0-1');
  expect(await residuals.first().locator('td').last().textContent()).toBe('0.22');

  // Export: the same figures in JSON, and CSV rows in the import's cell notation.
  const json = JSON.parse((await downloaded(page, 'readings-export-json')).text) as { consistencyRadius: { max: number; rms: number }; worstPairs: { face: number[]; coface: number[] }[]; nearestSection: { readings: { fitted: number[] }[] } };
  expect(json.consistencyRadius.max).toBeCloseTo(0.3, 12);
  expect(json.consistencyRadius.rms).toBeCloseTo(Math.sqrt(0.05), 12);
  expect(json.worstPairs[0]).toEqual({ face: [0], coface: [0, 1], mismatch: expect.closeTo(0.3, 12) });
  expect(json.nearestSection.readings[0].fitted[0]).toBeCloseTo(10.08, 12);
  const csv = await downloaded(page, 'readings-export-csv');
  expect(csv.name).toBe('Ridge-line-ring-heights-check.csv');
  expect(csv.text.split('\r\n')[0]).toBe('kind,cell,coface,weight,reading,fitted,residual,norm');
  expect(csv.text).toMatch(/\r\npair,0,0-1,,,,,0\.3\d*\r\n/);

  // The cautions stand beside the numbers.
  expect(await page.getByTestId('readings-caution').textContent()).toContain('licensed engineers and surveyors');
  expect(await panel.getByRole('complementary', { name: 'Cautions' }).textContent()).toContain('Defer to licensed engineers');

  // Rename, then delete after the question; the model's empty state comes back.
  await page.getByTestId('readings-list').locator('li').first().hover();
  await page.getByRole('button', { name: 'Rename readings heights' }).click();
  await page.getByLabel('Readings name').fill('Ridge heights, week 3');
  await page.getByRole('button', { name: 'Save name' }).click();
  await expect.poll(() => page.getByTestId('readings-list').textContent()).toContain('Ridge heights, week 3');
  await page.getByTestId('readings-list').locator('li').first().hover();
  await page.getByRole('button', { name: 'Delete readings Ridge heights, week 3' }).click();
  await page.getByRole('button', { name: 'Keep' }).click();
  expect(await page.getByTestId('readings-list').textContent()).toContain('Ridge heights, week 3');
  await page.getByTestId('readings-list').locator('li').first().hover();
  await page.getByRole('button', { name: 'Delete readings Ridge heights, week 3' }).click();
  await page.getByRole('button', { name: 'Delete readings', exact: true }).click();
  await expect.poll(() => page.getByTestId('readings-empty').isVisible()).toBe(true);
  // Its check goes with it: no figures, no colours left on the Sketch.
  await expect.poll(() => sketch.getAttribute('data-shaded')).toBeNull();
  expect(await page.getByTestId('readings-findings').count()).toBe(0);

  expect(errors).toEqual([]);
  await context.close();
});

test('the invented wind readings of the weather station ring find the miswired station WS-04', async () => {
  const { page, context, errors } = await newPage(browser);
  await page.goto(inject('appUrl'));
  await page.getByRole('link', { name: /Demo:/ }).click();
  await page.waitForURL(/\/p\/[^/]+$/);
  await openDemoModel(page, /Weather station ring \(consistent\)/);
  await page.getByTestId('readings-demo').click();
  await expect.poll(() => page.getByTestId('readings-list').textContent(), { timeout: 15_000 }).toContain('Wind, week 3 (invented)12 readings');
  await page.getByTestId('readings-check').click();
  await expect.poll(() => page.getByTestId('readings-headline').textContent(), { timeout: 20_000 }).toContain('the worst pair is WS-04 against WS-03 – WS-04');
  expect(await page.getByTestId('readings-section').textContent()).toContain('dim H⁰ 2');
  await page.getByRole('tab', { name: /^Residuals/ }).click();
  const top = page.getByTestId('residuals').getByTestId('readings-row').first();
  expect(await top.getAttribute('data-cells')).toBe('3');
  await top.click();
  await expect.poll(() => page.getByTestId('sketch').getAttribute('data-highlight')).toBe('0:3');
  await screenshot(page, 'readings-weather-ring');
  expect(errors).toEqual([]);
  await context.close();
});
