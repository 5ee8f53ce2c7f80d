import { afterAll, beforeAll, expect, inject, test } from 'vitest';
import type { Browser } from 'playwright-core';
import type { AuthResponse, ProjectView } from '../../shared/api/types';
import { launch, newPage, screenshot } from './browser';
import { api, followMailedLink, freshAddress, openAccountPanel, signInThroughUi } from './team';

let browser: Browser;
beforeAll(async () => {
  browser = await launch();
});
afterAll(async () => {
  await browser?.close();
});

const ringText = JSON.stringify({ format: 'gluefield.sheaf', version: 1, name: 'Culvert ring', simplices: [[0, 1], [1, 2], [0, 2]] });

test('a new account is registered through the account panel; a bad server address is refused by name first', async () => {
  const { context, page, errors } = await newPage(browser);
  await page.goto(inject('appUrl'));
  await openAccountPanel(page);
  const server = page.getByRole('form', { name: 'Team server' });
  await server.getByLabel('Team server address').fill('ftp://files.example.org');
  await server.getByRole('button', { name: 'Use' }).click();
  await expect.poll(() => server.getByRole('alert').textContent()).toContain('Team server address: must start with http:// or https://');
  await screenshot(page, 'account-panel-server-address');
  await server.getByLabel('Team server address').fill('');
  await server.getByRole('button', { name: 'Use' }).click();
  await expect.poll(() => server.getByRole('status').textContent()).toBe('Signing in goes to this site.');

  const email = freshAddress('new');
  const form = page.getByRole('form', { name: 'Account' });
  await form.getByRole('button', { name: 'Register' }).click();
  await form.getByLabel('Name').fill('Dana Field');
  await form.getByLabel('E-mail').fill(email);
  await form.getByLabel('Password').fill('staff-gauge-2041');
  await form.getByRole('button', { name: 'Create account' }).click();
  await expect.poll(() => page.getByTestId('signed-in-as').textContent(), { timeout: 20_000 }).toBe('Dana Field');

  // The account is on the server: its password signs in there, a wrong one does not.
  const login = await api<AuthResponse>('POST', '/api/auth/login', { email, password: 'staff-gauge-2041' });
  expect(login.status).toBe(200);
  expect(login.body.user).toMatchObject({ email, name: 'Dana Field', siteRole: 'member' });
  expect((await api('POST', '/api/auth/login', { email, password: 'staff-gauge-2042' })).status).toBe(401);

  // Registering the same address again says why it failed.
  await page.getByRole('button', { name: 'Sign out' }).click();
  const again = await openAccountPanel(page);
  await again.getByRole('button', { name: 'Register' }).click();
  await again.getByLabel('Name').fill('Someone Else');
  await again.getByLabel('E-mail').fill(email);
  await again.getByLabel('Password').fill('staff-gauge-2041');
  await again.getByRole('button', { name: 'Create account' }).click();
  await expect.poll(() => again.getByRole('status').textContent()).toMatch(/already|taken|exists/i);
  expect(errors).toEqual([]);
  await context.close();
});

test('an owner invites an address with no account; the invitation is read in the Mailroom, its link creates the account and the project is there', async () => {
  // Setup through the API: an owner with a project holding one model.
  const ownerEmail = freshAddress('owner');
  const owner = await api<AuthResponse>('POST', '/api/auth/register', { email: ownerEmail, password: 'benchmark-owner-7', name: 'Olu Owner' });
  expect(owner.status).toBe(201);
  const projectName = `Culvert survey ${Date.now().toString(36)}`;
  const project = await api<ProjectView>('POST', '/api/projects', { name: projectName }, owner.body.accessToken);
  const modelId = crypto.randomUUID();
  const pushed = await api<{ accepted: unknown[] }>('POST', `/api/projects/${project.body.id}/changes`, {
    changes: [{ changeId: crypto.randomUUID(), docId: modelId, kind: 'model', baseVersion: 0, body: { name: 'Culvert ring', field: 'rational', cells: [3, 3], cochainDims: [3, 3], bytes: ringText.length, source: 'model', text: ringText } }],
  }, owner.body.accessToken);
  expect(pushed.body.accepted).toHaveLength(1);

  // The owner invites through the Crew screen.
  const a = await newPage(browser);
  await a.page.goto(inject('appUrl'));
  await signInThroughUi(a.page, ownerEmail, 'benchmark-owner-7');
  await a.page.getByRole('button', { name: `Open ${projectName} here` }).click();
  await a.page.waitForURL(/\/p\/[^/]+$/);
  const localId = new URL(a.page.url()).pathname.split('/')[2];
  await a.page.goto(`${inject('appUrl')}/p/${localId}/crew`);
  const invitee = freshAddress('invitee');
  await a.page.getByLabel('Invite e-mail').fill(invitee);
  await a.page.getByLabel('Invite role').selectOption('editor');
  await a.page.getByRole('button', { name: 'Invite' }).click();
  await expect.poll(() => a.page.getByRole('status').textContent(), { timeout: 20_000 }).toBe(`Invitation mailed to ${invitee}.`);
  await a.context.close();

  // The invitee, on another machine with no account, reads the Mailroom and follows the link.
  const b = await newPage(browser);
  await followMailedLink(b.page, invitee, /invites you to/);
  await expect.poll(() => b.page.getByText(`invites ${invitee} to ${projectName} as editor`).count(), { timeout: 20_000 }).toBe(1);
  await screenshot(b.page, 'invitation-page');
  await b.page.getByLabel('Name').fill('Ivo Invitee');
  await b.page.getByLabel('Password').fill('level-staff-3307');
  await b.page.getByRole('button', { name: 'Create account and join' }).click();
  await b.page.waitForURL(/\/p\/[^/]+$/, { timeout: 20_000 });
  await expect.poll(() => b.page.getByTestId('signed-in-as').textContent()).toBe('Ivo Invitee');
  await expect.poll(() => b.page.getByTestId('sync-state').getAttribute('data-state'), { timeout: 20_000 }).toBe('in-step');
  await expect.poll(() => b.page.getByRole('region', { name: 'Models' }).getByText('Culvert ring').count(), { timeout: 20_000 }).toBe(1);
  expect(await b.page.getByText(projectName).count()).toBeGreaterThan(0);

  // The server agrees: the new account is an editor of the project, and the link is spent.
  const joined = await api<AuthResponse>('POST', '/api/auth/login', { email: invitee, password: 'level-staff-3307' });
  expect(joined.status).toBe(200);
  const mine = await api<{ projects: ProjectView[] }>('GET', '/api/projects', undefined, joined.body.accessToken);
  expect(mine.body.projects.map((p) => [p.id, p.role])).toEqual([[project.body.id, 'editor']]);
  expect(b.errors).toEqual([]);
  await b.context.close();
});

test('a password reset asked for in the account panel arrives in the Mailroom; its link sets a new password that signs in, once', async () => {
  const email = freshAddress('forgetful');
  expect((await api('POST', '/api/auth/register', { email, password: 'old-benchmark-11', name: 'Flo Forgetful' })).status).toBe(201);

  const { context, page, errors } = await newPage(browser);
  await page.goto(inject('appUrl'));
  const form = await openAccountPanel(page);
  await form.getByRole('button', { name: 'Forgot password' }).click();
  await form.getByLabel('E-mail').fill(email);
  await form.getByRole('button', { name: 'Send reset link' }).click();
  await expect.poll(() => form.getByRole('status').textContent(), { timeout: 20_000 }).toContain('a reset link is on its way');

  const link = await followMailedLink(page, email, /Reset your Gluefield password/);
  expect(link).toContain('/reset-password/');
  await page.getByLabel('New password').fill('new-benchmark-22');
  await page.getByRole('button', { name: 'Set password' }).click();
  await expect.poll(() => page.getByRole('status').textContent(), { timeout: 20_000 }).toContain('Password changed');

  // The new password works in the app; the old one no longer does.
  await page.goto(inject('appUrl'));
  await signInThroughUi(page, email, 'new-benchmark-22');
  await expect.poll(() => page.getByTestId('signed-in-as').textContent()).toBe('Flo Forgetful');
  expect((await api('POST', '/api/auth/login', { email, password: 'old-benchmark-11' })).status).toBe(401);

  // The link works once.
  await page.goto(link);
  await page.getByLabel('New password').fill('third-benchmark-33');
  await page.getByRole('button', { name: 'Set password' }).click();
  await expect.poll(() => page.getByRole('alert').count(), { timeout: 20_000 }).toBe(1);
  expect((await api('POST', '/api/auth/login', { email, password: 'third-benchmark-33' })).status).toBe(401);
  expect(errors).toEqual([]);
  await context.close();
});
