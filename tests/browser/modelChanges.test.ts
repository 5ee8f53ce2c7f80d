import { afterAll, beforeAll, expect, inject, test } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import type { AuthResponse, ProjectView } from '../../shared/api/types';
import type { PullResponse } from '../../shared/sync/types';
import { launch, newPage, screenshot } from './browser';
import { api, freshAddress, signInThroughUi } from './team';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

const ring = (n: number) => JSON.stringify({ format: 'gluefield.sheaf', version: 1, simplices: Array.from({ length: n }, (_, i) => [i, (i + 1) % n]) });
const modelChange = (docId: string, name: string, n: number) => ({
  changeId: crypto.randomUUID(), docId, kind: 'model', baseVersion: 0,
  body: { name, field: 'rational', cells: [n, n], cochainDims: [n, n], bytes: ring(n).length, source: 'model', text: ring(n) },
});

async function bringHere(page: Page, email: string, password: string, projectName: string): Promise<string> {
  await page.goto(inject('appUrl'));
  await signInThroughUi(page, email, password);
  await page.getByRole('button', { name: `Open ${projectName} here` }).click();
  await page.waitForURL(/\/p\/[^/]+$/);
  await expect.poll(() => page.getByTestId('sync-state').getAttribute('data-state'), { timeout: 20_000 }).toBe('in-step');
  return new URL(page.url()).pathname.split('/')[2];
}

const shelf = (page: Page) => page.getByRole('region', { name: 'Models' });
const modelItem = (page: Page, name: string) => shelf(page).locator('li', { hasText: name });

async function syncNow(page: Page, want = 'in-step') {
  await page.getByRole('button', { name: 'Sync now' }).click();
  await expect.poll(() => page.getByTestId('sync-state').getAttribute('data-state'), { timeout: 20_000 }).toBe(want);
}

test('a model renamed and another deleted on the shelf reach a teammate; deleting what a teammate renamed is At odds until settled', async () => {
  const ownerEmail = freshAddress('shelf-owner');
  const owner = await api<AuthResponse>('POST', '/api/auth/register', { email: ownerEmail, password: 'shelf-owner-pass-1', name: 'Sol Shelf' });
  const projectName = `Shelf changes ${Date.now().toString(36)}`;
  const project = await api<ProjectView>('POST', '/api/projects', { name: projectName }, owner.body.accessToken);
  const [idA, idB] = [crypto.randomUUID(), crypto.randomUUID()];
  await api('POST', `/api/projects/${project.body.id}/changes`, { changes: [modelChange(idA, 'Ring A', 4), modelChange(idB, 'Ring B', 5)] }, owner.body.accessToken);
  expect((await api('POST', `/api/projects/${project.body.id}/members`, { email: 'ben@gluefield.local', role: 'editor' }, owner.body.accessToken)).status).toBe(201);

  const o = await newPage(browser);
  await bringHere(o.page, ownerEmail, 'shelf-owner-pass-1', projectName);
  await modelItem(o.page, 'Ring A').hover();
  await o.page.getByRole('button', { name: 'Rename Ring A' }).click();
  await o.page.getByLabel('Model name').fill('Ring A (north)');
  await o.page.getByRole('button', { name: 'Save name' }).click();
  await expect.poll(() => modelItem(o.page, 'Ring A (north)').count()).toBe(1);
  await modelItem(o.page, 'Ring B').hover();
  await o.page.getByRole('button', { name: 'Delete Ring B' }).click();
  await o.page.getByRole('button', { name: 'Delete model' }).click();
  await expect.poll(() => modelItem(o.page, 'Ring B').count()).toBe(0);
  await expect.poll(() => o.page.getByTestId('sync-state').getAttribute('data-state'), { timeout: 10_000 }).toBe('ahead');
  await syncNow(o.page);

  // On the server: the rename is a new body, the deletion a tombstone.
  const pulled = await api<PullResponse>('GET', `/api/projects/${project.body.id}/changes?since=0`, undefined, owner.body.accessToken);
  expect(pulled.body.changes.find((d) => d.docId === idA)).toMatchObject({ version: 2, body: expect.objectContaining({ name: 'Ring A (north)' }) });
  expect(pulled.body.changes.find((d) => d.docId === idB)).toMatchObject({ version: 2, deleted: true });

  // Ben brings the project here: one model, renamed.
  const b = await newPage(browser);
  await bringHere(b.page, 'ben@gluefield.local', 'fieldbook-ben-1', projectName);
  await expect.poll(() => shelf(b.page).locator('li').count(), { timeout: 20_000 }).toBe(1);
  expect(await modelItem(b.page, 'Ring A (north)').count()).toBe(1);

  // Ben deletes it offline while the owner renames it again: Ben's deletion is At odds, not applied.
  await b.context.setOffline(true);
  await modelItem(b.page, 'Ring A (north)').hover();
  await b.page.getByRole('button', { name: 'Delete Ring A (north)' }).click();
  await b.page.getByRole('button', { name: 'Delete model' }).click();
  await expect.poll(() => shelf(b.page).locator('li').count()).toBe(0);
  await modelItem(o.page, 'Ring A (north)').hover();
  await o.page.getByRole('button', { name: 'Rename Ring A (north)' }).click();
  await o.page.getByLabel('Model name').fill('Ring A (north, checked)');
  await o.page.getByRole('button', { name: 'Save name' }).click();
  await expect.poll(() => o.page.getByTestId('sync-state').getAttribute('data-state'), { timeout: 10_000 }).toBe('ahead');
  await syncNow(o.page);
  await b.context.setOffline(false);
  await syncNow(b.page, 'at-odds');
  await b.page.getByTestId('sync-state').click();
  await b.page.waitForURL(/\/conflicts$/);
  await expect.poll(() => b.page.getByTestId('conflict-mine-deleted').textContent(), { timeout: 10_000 }).toContain('Deleted');
  expect(await b.page.getByTestId('conflict-theirs-name').textContent()).toBe('Ring A (north, checked)');
  expect(await b.page.getByRole('button', { name: 'Keep both' }).count()).toBe(0);
  await screenshot(b.page, 'conflict-deleted-vs-renamed');
  await b.page.getByRole('button', { name: 'Take theirs' }).click();
  await expect.poll(() => b.page.getByTestId('conflict').count(), { timeout: 20_000 }).toBe(0);
  await b.page.getByRole('link', { name: 'Back to the bench' }).click();
  await expect.poll(() => modelItem(b.page, 'Ring A (north, checked)').count(), { timeout: 20_000 }).toBe(1);
  await expect.poll(() => b.page.getByTestId('sync-state').getAttribute('data-state'), { timeout: 20_000 }).toBe('in-step');

  // The server still holds the model, as the owner left it.
  const after = await api<PullResponse>('GET', `/api/projects/${project.body.id}/changes?since=0`, undefined, owner.body.accessToken);
  expect(after.body.changes.find((d) => d.docId === idA)).toMatchObject({ deleted: false, body: expect.objectContaining({ name: 'Ring A (north, checked)' }) });

  expect(o.errors).toEqual([]);
  expect(b.errors).toEqual([]);
  await o.context.close();
  await b.context.close();
});
