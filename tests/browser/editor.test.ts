import { afterAll, beforeAll, expect, inject, test } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import type { ModelFile } from '../../shared/engine';
import { launch, newPage, screenshot, tempFile } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

const VALID = 'Valid: shapes and the sheaf condition hold.';

async function openEditor(page: Page) {
  // Focus must not sit in a field, or the plain-key shortcut is (rightly) ignored.
  await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
  await page.keyboard.press('3');
  await expect.poll(() => page.getByRole('tab', { name: /Stalks & maps/ }).getAttribute('aria-selected')).toBe('true');
}

/** The versions of a model's text kept in IndexedDB (read directly, as a second opinion on the UI). */
function storedVersions(page: Page, modelId: string): Promise<number[]> {
  return page.evaluate(
    (id) =>
      new Promise<number[]>((resolve, reject) => {
        const open = indexedDB.open('gluefield');
        open.onerror = () => reject(open.error);
        open.onsuccess = () => {
          const db = open.result;
          const get = db.transaction('modelTexts').objectStore('modelTexts').index('modelId').getAll(id);
          get.onerror = () => reject(get.error);
          get.onsuccess = () => {
            db.close();
            resolve((get.result as { version: number }[]).map((r) => r.version).sort((a, b) => a - b));
          };
        };
      }),
    modelId,
  );
}

test('editing a restriction map of the consistent weather ring stays valid, saves as version 2, and ctrl+z brings the previous entry back (graphs have no diamonds, so any 2×2 map is a sheaf: Curry 2014)', async () => {
  const { page, context, errors } = await newPage(browser);
  await page.goto(inject('appUrl'));
  await page.getByRole('link', { name: /Demo:/ }).click();
  await page.getByRole('link', { name: /Weather station ring \(consistent\)/ }).click();
  await expect.poll(() => page.getByTestId('model-name').textContent()).toBe('Weather station ring (consistent)');
  // Shift+/ is "?": the shortcut list, which names the undo and redo keys used below.
  await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur());
  await page.keyboard.press('Shift+Slash');
  const help = page.getByRole('dialog', { name: 'Keyboard shortcuts' });
  await expect.poll(() => help.textContent()).toContain('mod+z / mod+shift+z');
  await page.keyboard.press('Escape');
  await expect.poll(() => help.count()).toBe(0);
  await openEditor(page);

  // Row 1 is the link WS-01 → WS-02: a rotation by 53.13° (3, 4, 5).
  const entry = page.getByLabel('map row 1 entries');
  const before = await entry.inputValue();
  expect(before).toBe('0.6, -0.8; 0.8, 0.6');
  expect(await page.getByLabel('map row 1 face').inputValue()).toBe('0');
  expect(await page.getByLabel('map row 1 coface').inputValue()).toBe('0, 1');
  await expect.poll(() => page.getByText(VALID).isVisible()).toBe(true);

  // A rotation by 90° instead: still a 2×2 map, still a sheaf.
  await entry.fill('0, -1; 1, 0');
  await expect.poll(() => page.getByTestId('editor-save').isEnabled()).toBe(true);
  // Let the worker's full check (debounced) answer before trusting "Valid".
  await page.waitForTimeout(600);
  expect(await page.getByText(VALID).isVisible()).toBe(true);
  expect(await page.getByRole('alert').count()).toBe(0);
  await screenshot(page, 'editor-weather-ring-edited');

  await page.getByTestId('editor-save').click();
  await expect.poll(() => page.getByText('Saved as version 2.').isVisible()).toBe(true);
  const listed = page.getByRole('region', { name: 'Models' }).getByRole('link', { name: /Weather station ring \(consistent\)/ });
  await expect.poll(() => listed.textContent()).toContain('v2');
  // Saving keeps the form as typed; there is nothing new to save until the next edit.
  expect(await entry.inputValue()).toBe('0, -1; 1, 0');
  await expect.poll(() => page.getByTestId('editor-save').isDisabled()).toBe(true);
  await screenshot(page, 'editor-weather-ring-saved');

  // Undo the edit from the keyboard, after the save: the entry text from before comes back,
  // and it differs from the newest version, so it can be saved again.
  await page.keyboard.press('Control+z');
  await expect.poll(() => entry.inputValue()).toBe(before);
  await expect.poll(() => page.getByText(VALID).isVisible()).toBe(true);
  await expect.poll(() => page.getByTestId('editor-save').isEnabled()).toBe(true);
  // Redo reapplies it, which is what version 2 holds.
  await page.keyboard.press('Control+Shift+z');
  await expect.poll(() => entry.inputValue()).toBe('0, -1; 1, 0');
  await expect.poll(() => page.getByTestId('editor-save').isDisabled()).toBe(true);
  // Version 1 is kept next to version 2 in the local store.
  const modelId = new URL(page.url()).pathname.split('/').pop()!;
  expect(await storedVersions(page, modelId)).toEqual([1, 2]);

  expect(errors).toEqual([]);
  await context.close();
});

test('on a triangle with stalks R, a map 2 on one edge-to-triangle pair breaks the sheaf condition and the failing diamonds are listed (F(τ1◁ω)F(σ◁τ1) = F(τ2◁ω)F(σ◁τ2): Curry 2014)', async () => {
  const { page, context, errors } = await newPage(browser);
  await page.goto(inject('appUrl'));
  await page.getByLabel('New project name').fill('Triangle');
  await page.getByRole('button', { name: /Create/ }).click();
  await page.waitForURL(/\/p\/[^/]+$/);

  // A valid start: every map the identity, one of them given explicitly.
  const triangle: ModelFile = {
    format: 'gluefield.sheaf',
    version: 1,
    name: 'one triangle',
    field: { kind: 'rational' },
    simplices: [[0, 1, 2]],
    stalks: { default: 1 },
    maps: { default: 'identity', entries: [{ face: [0, 1], coface: [0, 1, 2], scalar: '1' }] },
  };
  await page.getByTestId('import-input').setInputFiles(tempFile('triangle.sheaf.json', JSON.stringify(triangle)));
  await expect.poll(() => page.getByTestId('model-name').textContent()).toBe('one triangle');
  await openEditor(page);

  const entry = page.getByLabel('map row 1 entries');
  expect(await entry.inputValue()).toBe('1');
  expect(await page.getByLabel('map row 1 kind').inputValue()).toBe('scalar');
  await expect.poll(() => page.getByText(VALID).isVisible()).toBe(true);

  await entry.fill('2');
  const alert = page.getByRole('alert');
  await expect.poll(() => alert.textContent(), { timeout: 10_000 }).toContain('sheaf condition fails');
  const text = (await alert.textContent()) ?? '';
  // Both diamonds through the edge [0,1] fail: at the vertex 0 (with [0,2]) and at the vertex 1 (with [1,2]).
  expect(text).toMatch(/\[0\] ◁ \[0,1\] ◁ \[0,1,2\] differs from \[0\] ◁ \[0,2\] ◁ \[0,1,2\]|\[0\] ◁ \[0,2\] ◁ \[0,1,2\] differs from \[0\] ◁ \[0,1\] ◁ \[0,1,2\]/);
  expect(text).toMatch(/\[1\] ◁ \[0,1\] ◁ \[0,1,2\] differs from \[1\] ◁ \[1,2\] ◁ \[0,1,2\]|\[1\] ◁ \[1,2\] ◁ \[0,1,2\] differs from \[1\] ◁ \[0,1\] ◁ \[0,1,2\]/);
  // The diamond at the vertex 2 does not touch [0,1] and commutes.
  expect(text).not.toContain('[2] ◁');
  expect(await page.getByText(VALID).count()).toBe(0);
  expect(await page.getByTestId('editor-save').isDisabled()).toBe(true);
  await screenshot(page, 'editor-triangle-failing-diamond');

  // Undo makes it valid again.
  await page.keyboard.press('Control+z');
  await expect.poll(() => entry.inputValue()).toBe('1');
  await expect.poll(() => alert.count()).toBe(0);

  expect(errors).toEqual([]);
  await context.close();
});
