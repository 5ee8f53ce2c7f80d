import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { PushResponse } from '../../shared/sync';
import { loadConfig } from '../../server/config';
import { createServer, type GluefieldServer } from '../../server/createServer';
import { bearer, freshEmail, freshPgDatabase, PG_URL_VARIABLE, register, testEnv, testPgUrl } from './helpers';

/**
 * PostgreSQL and several server instances on one database. Needs a server
 * to talk to, so it runs only when GLUEFIELD_TEST_PG_URL is set; then every
 * other file in tests/server runs on PostgreSQL as well (see helpers.ts).
 */
const url = testPgUrl();
if (!url) {
  console.info(`tests/server/postgres.test.ts skipped: set ${PG_URL_VARIABLE}=postgres://user@host:port/db (a role that may create databases) to run the server tests on PostgreSQL`);
}

describe.skipIf(!url)('on PostgreSQL, two server instances sharing one database', () => {
  let a: GluefieldServer;
  let b: GluefieldServer;
  let dir: string;
  let drop: () => Promise<void>;

  beforeAll(async () => {
    const db = await freshPgDatabase(url!);
    drop = db.drop;
    dir = mkdtempSync(join(tmpdir(), 'gluefield-pg-'));
    const env = testEnv(dir, { DATABASE_URL: db.url });
    a = await createServer(loadConfig(env));
    // The second instance finds the schema already migrated and runs nothing.
    b = await createServer(loadConfig(env));
  });
  afterAll(async () => {
    await a?.close();
    await b?.close();
    await drop?.();
    rmSync(dir, { recursive: true, force: true });
  });

  it('runs on the postgres driver, migrated once, uploads kept as bytea', async () => {
    expect(a.dataSource.options.type).toBe('postgres');
    expect(await a.dataSource.query('SELECT name FROM migrations')).toEqual([{ name: 'Initial1767225600000' }]);
    const [{ data_type }] = await a.dataSource.query(`SELECT data_type FROM information_schema.columns WHERE table_name = 'uploads' AND column_name = 'data'`);
    expect(data_type).toBe('bytea');

    const owner = await register(a.app);
    const project = await request(a.app).post('/api/projects').set(bearer(owner.accessToken)).send({ name: 'Culvert' }).expect(201);
    const bytes = gzipSync(JSON.stringify({ format: 'gluefield.sheaf', version: 1, simplices: [[0, 1]] }));
    const up = await request(b.app).post(`/api/projects/${project.body.id}/uploads`).set(bearer(owner.accessToken)).attach('file', bytes, { filename: 'm.gz', contentType: 'application/gzip' }).expect(201);
    const back = await request(a.app).get(`/api/uploads/${up.body.id}`).set(bearer(owner.accessToken)).buffer(true)
      .parse((r, done) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => done(null, Buffer.concat(chunks)));
      })
      .expect(200);
    expect(Buffer.compare(back.body as Buffer, bytes)).toBe(0);
  });

  it('a session from one instance works on the other (no state but the database)', async () => {
    const s = await register(a.app, freshEmail('roamer'));
    await request(b.app).get('/api/me').set(bearer(s.accessToken)).expect(200);
    const refreshed = await request(b.app).post('/api/auth/refresh').send({ refreshToken: s.refreshToken }).expect(200);
    // The old refresh token was spent on B: A refuses it.
    await request(a.app).post('/api/auth/refresh').send({ refreshToken: s.refreshToken }).expect(401);
    await request(a.app).get('/api/me').set(bearer(refreshed.body.accessToken)).expect(200);
  });

  it('pushes to one project through both instances at once: every change lands once, at its own revision; one edit wins per base', async () => {
    const owner = await register(a.app);
    const project = await request(a.app).post('/api/projects').set(bearer(owner.accessToken)).send({ name: 'Levels' }).expect(201);
    const id = project.body.id as string;
    const push = (app: GluefieldServer['app'], changes: unknown[]) =>
      request(app).post(`/api/projects/${id}/changes`).set(bearer(owner.accessToken)).send({ changes }).expect(200).then((r) => r.body as PushResponse);
    const results = await Promise.all(
      Array.from({ length: 30 }, (_, i) => push(i % 2 ? a.app : b.app, [{ changeId: `c-${i}`, docId: `d-${i}`, kind: 'note', baseVersion: 0, body: i }])),
    );
    const revisions = results.flatMap((r) => r.accepted.map((x) => x.revision)).sort((x, y) => x - y);
    expect(revisions).toEqual(Array.from({ length: 30 }, (_, i) => i + 1));

    const shared = await Promise.all(
      Array.from({ length: 10 }, (_, i) => push(i % 2 ? a.app : b.app, [{ changeId: `e-${i}`, docId: 'd-0', kind: 'note', baseVersion: 1, body: `edit ${i}` }])),
    );
    expect(shared.filter((r) => r.accepted.length === 1)).toHaveLength(1);
    expect(shared.filter((r) => r.conflicts[0]?.reason === 'stale')).toHaveLength(9);
    const pulled = await request(b.app).get(`/api/projects/${id}/changes?since=0`).set(bearer(owner.accessToken)).expect(200);
    expect(pulled.body.revision).toBe(31);
    expect(pulled.body.changes).toHaveLength(30);
  });
});
