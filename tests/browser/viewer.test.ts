import { afterAll, beforeAll, expect, inject, test } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launch, newPage, screenshot } from './browser';
import { signInThroughUi } from './team';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

/** Sign in with a demo account and bring the demo project here (another test may have renamed it). */
async function openDemo(page: Page, email: string, password: string): Promise<string> {
  await page.goto(inject('appUrl'));
  await signInThroughUi(page, email, password);
  await page.getByRole('button', { name: /^Open Ridge-line survey.* here$/ }).click();
  await page.waitForURL(/\/p\/[^/]+$/);
  await expect.poll(() => page.getByTestId('sync-state').getAttribute('data-state'), { timeout: 20_000 }).toBe('in-step');
  return new URL(page.url()).pathname.split('/')[2];
}

test('a viewer sees a read-only bench that says why, with import, editing, saving and running off; an editor of the same project does not', async () => {
  const v = await newPage(browser);
  const id = await openDemo(v.page, 'cleo@gluefield.local', 'fieldbook-cleo-1');
  const banner = v.page.getByTestId('read-only-banner');
  await expect.poll(() => banner.isVisible(), { timeout: 20_000 }).toBe(true);
  expect(await banner.textContent()).toContain('You are a viewer in this team project');
  const shelf = v.page.getByRole('region', { name: 'Models' });
  expect(await shelf.getByRole('button', { name: /^Import/ }).isDisabled()).toBe(true);

  // Open a model: reading works, writing does not.
  await shelf.locator('a[href^="/p/"]').first().click();
  await v.page.waitForURL(/\/m\//);
  await expect.poll(() => v.page.getByTestId('model-name').isVisible()).toBe(true);
  expect(await v.page.getByTestId('solve-start').isDisabled()).toBe(true);
  await v.page.keyboard.press('Control+Enter');
  expect(await v.page.getByTestId('solve-progress').count()).toBe(0);
  await shelf.locator('li').first().hover();
  expect(await shelf.getByRole('button', { name: /^Rename / }).count()).toBe(0);
  expect(await shelf.getByRole('button', { name: /^Delete / }).count()).toBe(0);
  expect(await shelf.getByRole('button', { name: 'Export' }).first().isVisible()).toBe(true);
  await v.page.getByRole('tab', { name: /Stalks & maps/ }).click();
  const editor = v.page.getByRole('group', { name: 'Stalks and maps' });
  await expect.poll(() => editor.count(), { timeout: 20_000 }).toBe(1);
  expect(await editor.getAttribute('disabled')).not.toBeNull();
  expect(await v.page.getByTestId('editor-save').isDisabled()).toBe(true);
  expect(await editor.locator('input').first().isDisabled()).toBe(true);
  // Readings: a viewer sees and may check them, but not import (the import would be saved to the project).
  await v.page.getByRole('tab', { name: 'Readings' }).click();
  const readings = v.page.getByRole('region', { name: 'Readings' });
  expect(await readings.getByRole('button', { name: 'Import readings' }).isDisabled()).toBe(true);
  expect(await readings.textContent()).toContain('Viewers can check and export the readings kept here, but not import, rename or delete them.');
  await screenshot(v.page, 'viewer-read-only');

  // Nothing was queued for a push that the server would refuse.
  const pending = await v.page.evaluate(async () => {
    const open = indexedDB.open('gluefield');
    const db: IDBDatabase = await new Promise((res, rej) => {
      open.onsuccess = () => res(open.result);
      open.onerror = () => rej(open.error);
    });
    const n: number = await new Promise((res) => {
      const req = db.transaction('outbox').objectStore('outbox').count();
      req.onsuccess = () => res(req.result);
    });
    db.close();
    return n;
  });
  expect(pending).toBe(0);
  await v.page.goto(inject('appUrl'));
  const row = v.page.locator('li', { has: v.page.locator(`a[href="/p/${id}"]`) });
  await expect.poll(() => row.getByTestId('sync-state').getAttribute('data-state'), { timeout: 20_000 }).toBe('in-step');
  expect(await v.page.getByRole('button', { name: /^Rename Ridge-line survey/ }).count()).toBe(0);

  const e = await newPage(browser);
  await openDemo(e.page, 'ben@gluefield.local', 'fieldbook-ben-1');
  await expect.poll(() => e.page.getByRole('region', { name: 'Models' }).getByRole('button', { name: /^Import/ }).isEnabled(), { timeout: 20_000 }).toBe(true);
  expect(await e.page.getByTestId('read-only-banner').count()).toBe(0);

  expect(v.errors).toEqual([]);
  expect(e.errors).toEqual([]);
  await v.context.close();
  await e.context.close();
});
