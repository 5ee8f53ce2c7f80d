import { afterAll, beforeAll, expect, inject, test } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { launch, newPage, screenshot } from './browser';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

const DEMO = 'Ridge-line survey (demo)';

async function signInAndBringDemo(page: Page, email: string, password: string): Promise<string> {
  await page.goto(inject('appUrl'));
  await page.getByRole('banner').getByRole('button', { name: 'Sign in' }).click();
  const form = page.getByRole('form', { name: 'Account' });
  await form.getByLabel('E-mail').fill(email);
  await form.getByLabel('Password').fill(password);
  await form.locator('button[type=submit]').click();
  await expect.poll(() => page.getByTestId('signed-in-as').isVisible()).toBe(true);
  await page.getByRole('button', { name: `Open ${DEMO} here` }).click();
  await page.waitForURL(/\/p\/[^/]+$/);
  const id = new URL(page.url()).pathname.split('/')[2];
  await expect.poll(() => page.getByTestId('sync-state').getAttribute('data-state'), { timeout: 20_000 }).toBe('in-step');
  await page.goto(inject('appUrl'));
  return id;
}

async function renameOnDesk(page: Page, from: string, to: string) {
  await page.getByRole('button', { name: `Rename ${from}` }).click();
  await page.getByLabel('Project name', { exact: true }).fill(to);
  await page.getByRole('button', { name: 'Save' }).click();
  await expect.poll(() => page.getByRole('link', { name: new RegExp(to.replace(/[()]/g, '\\$&')) }).count(), { timeout: 10_000 }).toBe(1);
}

const row = (page: Page, id: string) => page.locator('li', { has: page.locator(`a[href="/p/${id}"]`) });

test('two users edit the same linked project offline, reconnect, the conflict is shown and settled, and both end with the same data', async () => {
  const a = await newPage(browser);
  const b = await newPage(browser);
  const id = await signInAndBringDemo(a.page, 'ada@gluefield.local', 'fieldbook-ada-1');
  const idB = await signInAndBringDemo(b.page, 'ben@gluefield.local', 'fieldbook-ben-1');
  expect(idB).toBe(id);

  await a.context.setOffline(true);
  await b.context.setOffline(true);
  await renameOnDesk(a.page, DEMO, 'Ridge-line survey (ada)');
  await renameOnDesk(b.page, DEMO, 'Ridge-line survey (ben)');
  await expect.poll(() => row(a.page, id).getByTestId('sync-state').getAttribute('data-state'), { timeout: 10_000 }).toBe('ahead');
  await expect.poll(() => row(b.page, id).getByTestId('sync-state').getAttribute('data-state'), { timeout: 10_000 }).toBe('ahead');

  // Ada reconnects first: her rename goes through.
  await a.context.setOffline(false);
  await row(a.page, id).getByRole('button', { name: 'Sync now' }).click();
  await expect.poll(() => row(a.page, id).getByTestId('sync-state').getAttribute('data-state'), { timeout: 20_000 }).toBe('in-step');

  // Ben reconnects: his push is refused as stale and shown as a conflict; nothing of his is overwritten.
  await b.context.setOffline(false);
  await row(b.page, id).getByRole('button', { name: 'Sync now' }).click();
  await expect.poll(() => row(b.page, id).getByTestId('sync-state').getAttribute('data-state'), { timeout: 20_000 }).toBe('at-odds');
  expect(await b.page.getByRole('link', { name: /Ridge-line survey \(ben\)/ }).count()).toBe(1);
  await row(b.page, id).getByTestId('sync-state').click();
  await b.page.waitForURL(/\/conflicts$/);
  await expect.poll(() => b.page.getByTestId('conflict-mine-name').textContent()).toBe('Ridge-line survey (ben)');
  await expect.poll(() => b.page.getByTestId('conflict-theirs-name').textContent()).toBe('Ridge-line survey (ada)');
  await screenshot(b.page, 'conflict-two-users');
  await b.page.getByRole('button', { name: 'Keep mine' }).click();
  await expect.poll(() => b.page.getByTestId('conflict').count(), { timeout: 20_000 }).toBe(0);

  // Ada syncs again and takes Ben's name; both desks agree.
  await b.page.goto(inject('appUrl'));
  await expect.poll(() => row(b.page, id).getByTestId('sync-state').getAttribute('data-state'), { timeout: 20_000 }).toBe('in-step');
  await row(a.page, id).getByRole('button', { name: 'Sync now' }).click();
  await expect.poll(() => a.page.getByRole('link', { name: /Ridge-line survey \(ben\)/ }).count(), { timeout: 20_000 }).toBe(1);
  await expect.poll(() => row(a.page, id).getByTestId('sync-state').getAttribute('data-state'), { timeout: 20_000 }).toBe('in-step');

  // Same models on both machines.
  const models = async (page: Page) => {
    await page.goto(`${inject('appUrl')}/p/${id}`);
    await expect.poll(() => page.getByTestId('sync-state').getAttribute('data-state'), { timeout: 20_000 }).toBe('in-step');
    return page.evaluate(async (pid) => {
      const open = indexedDB.open('gluefield');
      const db: IDBDatabase = await new Promise((res, rej) => {
        open.onsuccess = () => res(open.result);
        open.onerror = () => rej(open.error);
      });
      const rows: { projectId: string; name: string; hash: string }[] = await new Promise((res) => {
        const req = db.transaction('models').objectStore('models').getAll();
        req.onsuccess = () => res(req.result);
      });
      db.close();
      return rows.filter((r) => r.projectId === pid).map((r) => `${r.name}:${r.hash}`).sort();
    }, id);
  };
  const ma = await models(a.page);
  expect(ma.length).toBeGreaterThan(0);
  expect(await models(b.page)).toEqual(ma);

  // The Logbook shows who changed what.
  await a.page.goto(`${inject('appUrl')}/p/${id}/logbook`);
  await expect.poll(() => a.page.getByTestId('logbook-entry').count(), { timeout: 20_000 }).toBeGreaterThan(0);
  await a.page.goto(`${inject('appUrl')}/p/${id}/crew`);
  await expect.poll(() => a.page.getByTestId('crew-member').count(), { timeout: 20_000 }).toBeGreaterThanOrEqual(3);

  expect(a.errors).toEqual([]);
  expect(b.errors).toEqual([]);
  await a.context.close();
  await b.context.close();
});
