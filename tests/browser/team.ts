/** Helpers for browser tests that use the team server: sign-in through the UI, the API from Node, the Mailroom. */
import { expect, inject } from 'vitest';
import type { Page } from 'playwright-core';

let counter = 0;
export function freshAddress(prefix: string): string {
  counter += 1;
  return `${prefix}-${Date.now().toString(36)}-${counter}@example.test`;
}

/** Call the API from Node (setup and checks that do not belong to the page under test). */
export async function api<T = unknown>(method: string, path: string, body?: unknown, token?: string): Promise<{ status: number; body: T }> {
  const res = await fetch(`${inject('appUrl')}${path}`, {
    method,
    headers: { ...(body === undefined ? {} : { 'content-type': 'application/json' }), ...(token ? { authorization: `Bearer ${token}` } : {}) },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  const text = await res.text();
  return { status: res.status, body: (text ? JSON.parse(text) : undefined) as T };
}

export async function openAccountPanel(page: Page) {
  await page.getByRole('banner').getByRole('button', { name: 'Sign in' }).click();
  return page.getByRole('form', { name: 'Account' });
}

export async function signInThroughUi(page: Page, email: string, password: string): Promise<void> {
  const form = await openAccountPanel(page);
  await form.getByLabel('E-mail').fill(email);
  await form.getByLabel('Password').fill(password);
  await form.locator('button[type=submit]').click();
  await expect.poll(() => page.getByTestId('signed-in-as').isVisible(), { timeout: 20_000 }).toBe(true);
}

/** Open the newest Mailroom message to `to` whose subject matches, and follow its link. */
export async function followMailedLink(page: Page, to: string, subject: RegExp): Promise<string> {
  await page.goto(`${inject('appUrl')}/mailroom`);
  const item = page.getByTestId('mailroom').locator('li', { hasText: `to ${to}` }).filter({ hasText: subject }).first();
  await expect.poll(() => item.count(), { timeout: 20_000 }).toBe(1);
  await item.getByRole('button').click();
  const link = item.locator('a[href^="http"]');
  const href = (await link.getAttribute('href'))!;
  expect(href.startsWith(inject('appUrl'))).toBe(true);
  await link.click();
  await page.waitForURL((u) => u.href === href);
  return href;
}
