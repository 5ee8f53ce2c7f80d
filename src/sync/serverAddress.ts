/**
 * The team server's address as the user types it in the account panel.
 * Empty means the app's own origin (the server serves the app); anything
 * else must be an absolute http(s) URL, kept without a trailing slash so
 * API paths can be appended as they are.
 */
export type ServerAddress = { ok: true; value: string } | { ok: false; message: string };

export function checkServerAddress(input: string): ServerAddress {
  const text = input.trim();
  if (text === '') return { ok: true, value: '' };
  let url: URL;
  try {
    url = new URL(text);
  } catch {
    return { ok: false, message: `Team server address: "${text}" is not a URL; write it in full, like https://team.example.org` };
  }
  if (url.protocol !== 'http:' && url.protocol !== 'https:') {
    return { ok: false, message: `Team server address: must start with http:// or https://, not ${url.protocol}//` };
  }
  if (url.username || url.password) return { ok: false, message: 'Team server address: must not carry a user name or password' };
  if (url.search || url.hash) return { ok: false, message: 'Team server address: must not carry a query (?…) or fragment (#…)' };
  return { ok: true, value: `${url.origin}${url.pathname.replace(/\/+$/, '')}` };
}
