import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { DEFAULT_SMTP_PORT, loadConfig } from '../../server/config';
import { createServer } from '../../server/createServer';
import { DEMO_PROJECT_NAME, DEMO_USERS } from '../../server/db/seedDemo';
import { bearer, testEnv } from './helpers';

const dir = mkdtempSync(join(tmpdir(), 'gluefield-startup-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('configuration', () => {
  it('has safe development defaults', () => {
    const config = loadConfig({}, '/srv/app');
    expect(config.port).toBe(8080);
    expect(config.db).toEqual({ kind: 'sqlite', file: '/srv/app/data/gluefield.sqlite' });
    expect(config.smtp).toMatchObject({ host: '127.0.0.1', port: DEFAULT_SMTP_PORT });
    expect(config.smtpSink).toBe(true);
    expect(config.appOrigin).toBe('http://localhost:8080');
    expect(config.jwt.accessTtlSeconds).toBeLessThanOrEqual(15 * 60);
  });

  it('follows the environment: port, database URL, a real relay', () => {
    const config = loadConfig({ PORT: '9000', DATABASE_URL: 'postgres://u:p@db/gluefield', SMTP_HOST: 'smtp.example.org', SMTP_PORT: '587', APP_ORIGIN: 'https://field.example.org/' });
    expect(config.port).toBe(9000);
    expect(config.db).toEqual({ kind: 'postgres', url: 'postgres://u:p@db/gluefield', poolSize: 10 });
    expect(loadConfig({ DATABASE_URL: 'postgres://u:p@db/gluefield', DATABASE_POOL_SIZE: '24' }).db).toMatchObject({ poolSize: 24 });
    expect(config.smtpSink).toBe(false);
    expect(config.appOrigin).toBe('https://field.example.org');
  });

  it('refuses to run in production with the development secret', () => {
    expect(() => loadConfig({ NODE_ENV: 'production' })).toThrow(/JWT_SECRET/);
    expect(() => loadConfig({ PORT: 'eighty' })).toThrow(/PORT/);
    expect(() => loadConfig({ DATABASE_URL: 'postgres://u:p@db/gluefield', DATABASE_POOL_SIZE: '0' })).toThrow(/DATABASE_POOL_SIZE/);
  });
});

describe('first start', () => {
  it('creates the database folder, migrates, and seeds the demo crew once', async () => {
    const env = { ...testEnv(dir), GLUEFIELD_DB: join(dir, 'nested', 'folder', 'g.sqlite'), GLUEFIELD_SEED_DEMO: '1' };
    let server = await createServer(loadConfig(env));
    expect(existsSync(env.GLUEFIELD_DB)).toBe(true);
    const [{ journal_mode }] = await server.dataSource.query('PRAGMA journal_mode');
    expect(journal_mode).toBe('wal');
    const [migration] = await server.dataSource.query('SELECT name FROM migrations');
    expect(migration.name).toMatch(/^Initial/);

    const sessions: Record<string, string> = {};
    for (const demo of DEMO_USERS) {
      const res = await request(server.app).post('/api/auth/login').send({ email: demo.email, password: demo.password }).expect(200);
      expect(res.body.user.siteRole).toBe(demo.siteRole);
      sessions[demo.email] = res.body.accessToken;
    }
    const ada = await request(server.app).get('/api/projects').set(bearer(sessions['ada@gluefield.local'])).expect(200);
    expect(ada.body.projects).toEqual([expect.objectContaining({ name: DEMO_PROJECT_NAME, role: 'owner' })]);
    const projectId = ada.body.projects[0].id;
    const crew = await request(server.app).get(`/api/projects/${projectId}/members`).set(bearer(sessions['cleo@gluefield.local'])).expect(200);
    expect(crew.body.members.map((m: { role: string }) => m.role)).toEqual(['owner', 'editor', 'viewer']);
    const models = await request(server.app).get(`/api/projects/${projectId}/changes?since=0`).set(bearer(sessions['ben@gluefield.local'])).expect(200);
    expect(models.body.changes.length).toBe(5);
    await server.close();

    server = await createServer(loadConfig(env));
    const admin = await request(server.app).post('/api/auth/login').send({ email: 'admin@gluefield.local', password: 'fieldbook-admin-1' }).expect(200);
    const users = await request(server.app).get('/api/admin/users').set(bearer(admin.body.accessToken)).expect(200);
    expect(users.body.users).toHaveLength(DEMO_USERS.length);
    const all = await request(server.app).get('/api/projects?scope=all').set(bearer(admin.body.accessToken)).expect(200);
    expect(all.body.projects).toEqual([expect.objectContaining({ name: DEMO_PROJECT_NAME, role: 'admin', revision: 5 })]);
    await server.close();
  });
});
