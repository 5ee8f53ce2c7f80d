import { afterAll, beforeAll, expect, inject, test } from 'vitest';
import type { Browser } from 'playwright-core';
import { constantTorus } from '../../bench/torusModel';
import { launch, newPage, screenshot, shownDims, tempFile } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

const TORUS_NAME = 'torus 6×6, stalk 1';

test('a new project imports a torus model file and reads H = (1, 2, 1) (Hatcher 2002, the torus); broken files are refused with a located message and leave the earlier model intact', async () => {
  const { page, context, errors } = await newPage(browser);
  await page.goto(inject('appUrl'));

  // The desk: create a project by name.
  await page.getByLabel('New project name').fill('Torus import');
  await page.getByRole('button', { name: /Create/ }).click();
  await page.waitForURL(/\/p\/[^/]+$/);
  const projectUrl = page.url();
  await expect.poll(() => page.getByText('No models yet').isVisible()).toBe(true);

  // Import a model file through the hidden picker.
  await page.getByTestId('import-input').setInputFiles(tempFile('torus6.sheaf.json', JSON.stringify(constantTorus(6, 1, { kind: 'rational' }))));
  await page.waitForURL(/\/p\/[^/]+\/m\/[^/]+$/);
  const modelUrl = page.url();
  await expect.poll(() => page.getByTestId('model-name').textContent()).toBe(TORUS_NAME);
  const shelf = page.getByRole('region', { name: 'Models' });
  // 36 vertices, 108 edges, 72 triangles.
  await expect.poll(() => shelf.getByText('216 cells').count()).toBe(1);

  await page.getByTestId('solve-start').click();
  await expect.poll(() => shownDims(page), { timeout: 30_000 }).toEqual(['1', '2', '1']);
  await expect.poll(() => page.getByTestId('run-history').textContent()).toContain('[1, 2, 1]');
  await screenshot(page, 'bench-torus-imported');

  // A map whose matrix has the wrong shape: stalks are 1-dimensional, the matrix is 1×2.
  const wrongShape = constantTorus(6, 1, { kind: 'rational' });
  wrongShape.name = 'torus with a wrong map';
  wrongShape.maps = { default: 'identity', entries: [{ face: [0], coface: [0, 1], matrix: [['1', '2']] }] };
  await page.getByTestId('import-input').setInputFiles(tempFile('wrong-shape.sheaf.json', JSON.stringify(wrongShape)));
  const alert = page.getByRole('alert');
  await expect.poll(() => alert.textContent(), { timeout: 15_000 }).toContain('[0] ◁ [0,1]');
  const shapeText = (await alert.textContent()) ?? '';
  expect(shapeText).toContain('wrong-shape.sheaf.json was not imported');
  expect(shapeText).toContain('must have 1 entries, got 2');
  expect(page.url()).toBe(modelUrl);
  // The import is over: no progress bar is left behind next to the message.
  await expect.poll(() => page.getByTestId('import-progress').count()).toBe(0);
  await screenshot(page, 'bench-import-wrong-shape');

  // A file that is not JSON at all.
  await page.getByTestId('import-input').setInputFiles(tempFile('truncated.sheaf.json', '{"format": "gluefield.sheaf", "version": 1, "simplices": [[0, 1], '));
  await expect.poll(() => alert.textContent(), { timeout: 15_000 }).toContain('not valid JSON');
  expect(await alert.textContent()).toContain('truncated.sheaf.json was not imported');
  await expect.poll(() => page.getByTestId('import-progress').count()).toBe(0);
  await screenshot(page, 'bench-import-invalid-json');

  // Nothing was added: the project still holds exactly its first model.
  await expect.poll(() => shelf.locator('a[href*="/m/"]').allTextContents()).toEqual([expect.stringContaining(TORUS_NAME)]);

  // Back on the desk, the project lists one model; reopening it shows the saved dims.
  await page.getByRole('link', { name: 'Desk' }).first().click();
  await page.waitForURL(/\/$/);
  const item = page.getByRole('link', { name: /Torus import/ });
  await expect.poll(() => item.textContent()).toContain('1 model ·');
  await screenshot(page, 'desk-after-import');
  await item.click();
  await page.waitForURL(projectUrl);
  await page.getByRole('link', { name: new RegExp(TORUS_NAME) }).click();
  await page.waitForURL(modelUrl);
  await expect.poll(() => shownDims(page)).toEqual(['1', '2', '1']);
  expect(await page.getByTestId('model-name').textContent()).toBe(TORUS_NAME);
  await screenshot(page, 'bench-torus-reopened');

  expect(errors).toEqual([]);
  await context.close();
});
