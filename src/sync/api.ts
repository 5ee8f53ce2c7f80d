/**
 * The team server's HTTP edge: JSON requests with the access token, one
 * refresh (rotating refresh token) on a 401, and the session kept in the
 * settings table so it survives reloads. Signed out, nothing here is called.
 */
import type { AuthResponse, UserView } from '../../shared/api/types';
import { getSetting, setSetting, type GluefieldDb } from '../store';
import { checkServerAddress } from './serverAddress';

export const SESSION_KEY = 'team.session';
export const SERVER_KEY = 'team.server';

export interface Session {
  user: UserView;
  accessToken: string;
  refreshToken: string;
}

export class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
  ) {
    super(message);
  }
}

export async function getSession(db: GluefieldDb): Promise<Session | null> {
  return getSetting<Session | null>(db, SESSION_KEY, null);
}

export async function saveSession(db: GluefieldDb, auth: Session | null): Promise<void> {
  await setSetting(db, SESSION_KEY, auth ? { user: auth.user, accessToken: auth.accessToken, refreshToken: auth.refreshToken } : null);
}

/** The server's base URL; '' is the app's own origin (the server serves the app). */
export async function serverBase(db: GluefieldDb): Promise<string> {
  return getSetting<string>(db, SERVER_KEY, '');
}

/**
 * Store the team server's address, checked first (see `checkServerAddress`).
 * A session belongs to the server that issued it, so this is refused while signed in.
 */
export async function setServerBase(db: GluefieldDb, input: string): Promise<string> {
  const checked = checkServerAddress(input);
  if (!checked.ok) throw new Error(checked.message);
  if (await getSession(db)) throw new Error('Team server address: sign out before changing the server');
  await setSetting(db, SERVER_KEY, checked.value);
  return checked.value;
}

type Fetch = typeof fetch;

export interface Api {
  request<T>(method: string, path: string, body?: unknown, opts?: { auth?: boolean }): Promise<T>;
  upload(path: string, data: Uint8Array, filename: string): Promise<{ id: string }>;
  download(path: string): Promise<Uint8Array>;
}

/** An API client over `db`'s session. `fetchImpl` lets tests talk to a server in-process. */
export function createApi(db: GluefieldDb, fetchImpl: Fetch = (...a) => fetch(...a)): Api {
  // One refresh at a time: a refresh token is good once, so parallel 401s share the same refresh.
  let refreshing: Promise<Session | null> | null = null;
  async function raw(method: string, path: string, init: { body?: BodyInit; json?: unknown; token?: string | null }): Promise<Response> {
    const base = await serverBase(db);
    const headers: Record<string, string> = {};
    if (init.json !== undefined) headers['content-type'] = 'application/json';
    if (init.token) headers.authorization = `Bearer ${init.token}`;
    return fetchImpl(`${base}${path}`, { method, headers, body: init.json !== undefined ? JSON.stringify(init.json) : init.body });
  }

  async function refresh(old: Session): Promise<Session | null> {
    refreshing ??= (async () => {
      try {
        const res = await raw('POST', '/api/auth/refresh', { json: { refreshToken: old.refreshToken } });
        if (!res.ok) {
          if (res.status === 401) await saveSession(db, null);
          return null;
        }
        const a = (await res.json()) as AuthResponse;
        const next = { user: a.user, accessToken: a.accessToken, refreshToken: a.refreshToken };
        await saveSession(db, next);
        return next;
      } finally {
        refreshing = null;
      }
    })();
    return refreshing;
  }

  async function authed(method: string, path: string, init: { body?: BodyInit; json?: unknown }, auth: boolean): Promise<Response> {
    const session = auth ? await getSession(db) : null;
    let res = await raw(method, path, { ...init, token: session?.accessToken });
    if (res.status === 401 && session) {
      const next = await refresh(session);
      if (next) res = await raw(method, path, { ...init, token: next.accessToken });
    }
    return res;
  }

  async function check(res: Response): Promise<Response> {
    if (res.ok) return res;
    let message = `${res.status} ${res.statusText}`;
    try {
      message = ((await res.json()) as { error?: string }).error ?? message;
    } catch {
      /* not JSON */
    }
    throw new ApiError(res.status, message);
  }

  return {
    async request<T>(method: string, path: string, body?: unknown, opts?: { auth?: boolean }): Promise<T> {
      const res = await check(await authed(method, path, { json: body }, opts?.auth ?? true));
      if (res.status === 204) return undefined as T;
      return (await res.json()) as T;
    },
    async upload(path, data, filename) {
      const form = new FormData();
      form.append('file', new Blob([data as BlobPart], { type: 'application/gzip' }), filename);
      const res = await check(await authed('POST', path, { body: form }, true));
      return (await res.json()) as { id: string };
    },
    async download(path) {
      const res = await check(await authed('GET', path, {}, true));
      return new Uint8Array(await res.arrayBuffer());
    },
  };
}

/** Sign in or register: keep the session. */
export async function signIn(db: GluefieldDb, api: Api, email: string, password: string, register?: { name: string }): Promise<Session> {
  const a = register
    ? await api.request<AuthResponse>('POST', '/api/auth/register', { email, password, name: register.name }, { auth: false })
    : await api.request<AuthResponse>('POST', '/api/auth/login', { email, password }, { auth: false });
  const s = { user: a.user, accessToken: a.accessToken, refreshToken: a.refreshToken };
  await saveSession(db, s);
  return s;
}

/** Revoke the session on the server when reachable; forget it locally either way. Local projects stay. */
export async function signOut(db: GluefieldDb, api: Api): Promise<void> {
  const s = await getSession(db);
  if (s) await api.request('POST', '/api/auth/logout', { refreshToken: s.refreshToken }, { auth: false }).catch(() => undefined);
  await saveSession(db, null);
}
