import { existsSync, mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';

const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
export const ARTIFACTS = fileURLToPath(new URL('../../test-artifacts/', import.meta.url));

/** Flags that keep Chromium from reaching for the internet on a closed network. */
const FLAGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];

export async function launch(): Promise<Browser> {
  if (!existsSync(CHROMIUM)) throw new Error(`Chromium not found at ${CHROMIUM}; .ci/run installs Debian's chromium (or set CHROMIUM_PATH)`);
  return chromium.launch({ executablePath: CHROMIUM, args: FLAGS });
}

export async function newPage(browser: Browser): Promise<{ context: BrowserContext; page: Page; errors: string[] }> {
  const context = await browser.newContext({ viewport: { width: 1440, height: 900 }, acceptDownloads: true });
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  return { context, page, errors };
}

export async function screenshot(page: Page, name: string): Promise<void> {
  mkdirSync(ARTIFACTS, { recursive: true });
  await page.screenshot({ path: `${ARTIFACTS}${name}.png` });
}

/** Write `text` to a fresh temporary directory under `name` and return its path (for `setInputFiles`). */
export function tempFile(name: string, text: string): string {
  const dir = mkdtempSync(join(tmpdir(), 'gluefield-browser-'));
  const path = join(dir, name);
  writeFileSync(path, text);
  return path;
}

/**
 * Record, from now on, whether elements with these test ids ever appear in
 * the page. Short-lived elements (a progress bar shown for a few frames)
 * are caught by a MutationObserver that runs before the next paint, where
 * polling from the test could miss them. Read with {@link seenTestIds}.
 */
export async function watchTestIds(page: Page, ids: string[]): Promise<void> {
  await page.evaluate((wanted) => {
    const w = window as unknown as { __seen?: Record<string, boolean>; __seenObserver?: MutationObserver };
    w.__seenObserver?.disconnect();
    const seen: Record<string, boolean> = Object.fromEntries(wanted.map((id) => [id, false]));
    w.__seen = seen;
    const check = () => {
      for (const id of wanted) if (!seen[id] && document.querySelector(`[data-testid="${id}"]`)) seen[id] = true;
    };
    check();
    w.__seenObserver = new MutationObserver(check);
    w.__seenObserver.observe(document.body, { childList: true, subtree: true });
  }, ids);
}

export async function seenTestIds(page: Page): Promise<Record<string, boolean>> {
  return page.evaluate(() => (window as unknown as { __seen?: Record<string, boolean> }).__seen ?? {});
}

/** The dimensions shown in the Findings table, as text, degree by degree. */
export async function shownDims(page: Page): Promise<string[]> {
  return page.getByTestId('findings-dims').locator('[data-testid^="dim-"]').allTextContents();
}
