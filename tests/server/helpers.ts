import { randomUUID } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Express } from 'express';
import request from 'supertest';
import { DataSource } from 'typeorm';
import type { AuthResponse } from '../../shared/api/types';
import { loadConfig } from '../../server/config';
import { createServer, type GluefieldServer } from '../../server/createServer';
import { UserSchema } from '../../server/db/entities';
import type { Clock } from '../../server/services/clock';

export interface TestServer {
  server: GluefieldServer;
  app: Express;
  dir: string;
  file: string;
  /** Close and reopen the server on the same database file. */
  restart(): Promise<void>;
  stop(): Promise<void>;
}

/** Environment every test server shares: a fresh SQLite file, fast bcrypt, an in-process mail sink on a free port. */
export function testEnv(dir: string, extra: Record<string, string> = {}): Record<string, string> {
  return {
    GLUEFIELD_DB: join(dir, 'gluefield.sqlite'),
    GLUEFIELD_SEED_DEMO: '0',
    BCRYPT_ROUNDS: '4',
    SMTP_PORT: '0',
    SMTP_SINK: '1',
    APP_ORIGIN: 'http://app.test',
    RATE_LIMIT_LOGIN: '10000',
    RATE_LIMIT_RESET: '10000',
    ...extra,
  };
}

/**
 * Set to a PostgreSQL URL (`postgres://user@host:port/db`, a role that may
 * create databases) to run the server tests on PostgreSQL: every test
 * server then gets a database of its own there, dropped when it stops.
 */
export const PG_URL_VARIABLE = 'GLUEFIELD_TEST_PG_URL';
export const testPgUrl = (): string | undefined => process.env[PG_URL_VARIABLE] || undefined;

/** Run SQL on the PostgreSQL server named by `url` (its maintenance connection). */
export async function onPgServer<T>(url: string, work: (ds: DataSource) => Promise<T>): Promise<T> {
  const ds = await new DataSource({ type: 'postgres', url }).initialize();
  try {
    return await work(ds);
  } finally {
    await ds.destroy();
  }
}

/** A fresh, empty PostgreSQL database on the server of `url`; returns its URL and how to drop it. */
export async function freshPgDatabase(url: string): Promise<{ url: string; drop(): Promise<void> }> {
  const name = `gluefield_test_${randomUUID().replace(/-/g, '').slice(0, 16)}`;
  await onPgServer(url, (ds) => ds.query(`CREATE DATABASE ${name}`));
  const at = new URL(url);
  at.pathname = `/${name}`;
  return { url: at.href, drop: () => onPgServer(url, (ds) => ds.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`)).then(() => undefined) };
}

/** A server on a new SQLite file in a temporary folder (or a new PostgreSQL database, see {@link PG_URL_VARIABLE}), migrated from scratch. */
export async function startTestServer(extra: Record<string, string> = {}, clock?: Clock): Promise<TestServer> {
  const dir = mkdtempSync(join(tmpdir(), 'gluefield-server-'));
  const pgUrl = testPgUrl();
  const pg = pgUrl ? await freshPgDatabase(pgUrl) : undefined;
  const env = testEnv(dir, { ...(pg ? { DATABASE_URL: pg.url } : {}), ...extra });
  const t: TestServer = {
    server: await createServer(loadConfig(env), clock),
    get app() {
      return this.server.app;
    },
    dir,
    file: env.GLUEFIELD_DB,
    async restart() {
      await this.server.close();
      this.server = await createServer(loadConfig(env), clock);
    },
    async stop() {
      await this.server.close();
      await pg?.drop();
      rmSync(dir, { recursive: true, force: true });
    },
  };
  return t;
}

export const bearer = (token: string) => ({ Authorization: `Bearer ${token}` });

let counter = 0;
/** A unique address for this test run. */
export function freshEmail(prefix = 'user'): string {
  counter += 1;
  return `${prefix}-${counter}-${Math.random().toString(36).slice(2, 8)}@example.test`;
}

export const PASSWORD = 'levelling-net-42';

export async function register(app: Express, email = freshEmail(), name = 'Test Person'): Promise<AuthResponse> {
  const res = await request(app).post('/api/auth/register').send({ email, password: PASSWORD, name });
  if (res.status !== 201) throw new Error(`register failed: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body as AuthResponse;
}

/** Make an account a site admin directly in the database (there is no API to become the first admin). */
export async function makeAdmin(t: TestServer, userId: string): Promise<void> {
  await t.server.dataSource.getRepository(UserSchema).update({ id: userId }, { siteRole: 'admin' });
}

export interface Crew {
  projectId: string;
  admin: AuthResponse;
  owner: AuthResponse;
  editor: AuthResponse;
  viewer: AuthResponse;
  outsider: AuthResponse;
}

/** A project with an owner, an editor and a viewer, plus a site admin and an outsider who are not members. */
export async function makeCrew(t: TestServer): Promise<Crew> {
  const [admin, owner, editor, viewer, outsider] = await Promise.all(
    ['admin', 'owner', 'editor', 'viewer', 'outsider'].map((r) => register(t.app, freshEmail(r), `The ${r}`)),
  );
  await makeAdmin(t, admin.user.id);
  const project = await request(t.app).post('/api/projects').set(bearer(owner.accessToken)).send({ name: 'Levelling net' });
  const projectId = project.body.id as string;
  for (const [who, role] of [[editor, 'editor'], [viewer, 'viewer']] as const) {
    const res = await request(t.app).post(`/api/projects/${projectId}/members`).set(bearer(owner.accessToken)).send({ email: who.user.email, role });
    if (res.status !== 201) throw new Error(`adding ${role} failed: ${res.status}`);
  }
  return { projectId, admin, owner, editor, viewer, outsider };
}

/** The one-time link in the newest captured message to `to`. */
export function linkInMail(t: TestServer, to: string): string {
  const message = t.server.sink!.messages().find((m) => m.to.includes(to));
  if (!message) throw new Error(`no mail to ${to}`);
  const match = /(https?:\/\/\S+)/.exec(message.text);
  if (!match) throw new Error('no link in the mail');
  return match[1];
}
