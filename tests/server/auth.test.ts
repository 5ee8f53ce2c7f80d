import jwt from 'jsonwebtoken';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { RefreshTokenSchema, UserSchema } from '../../server/db/entities';
import { bearer, freshEmail, makeAdmin, PASSWORD, register, startTestServer, type TestServer } from './helpers';

let t: TestServer;
beforeAll(async () => {
  t = await startTestServer();
});
afterAll(() => t.stop());

describe('register and sign in', () => {
  it('registers with 201 {user, accessToken, refreshToken}, never showing the hash', async () => {
    const email = freshEmail();
    const res = await request(t.app).post('/api/auth/register').send({ email: email.toUpperCase(), password: PASSWORD, name: 'Ada' }).expect(201);
    expect(res.body.user).toMatchObject({ email, name: 'Ada', siteRole: 'member' });
    expect(res.body.user.passwordHash).toBeUndefined();
    expect(typeof res.body.accessToken).toBe('string');
    expect(typeof res.body.refreshToken).toBe('string');
    const me = await request(t.app).get('/api/me').set(bearer(res.body.accessToken)).expect(200);
    expect(me.body.user.id).toBe(res.body.user.id);
  });

  it('answers 409 to a duplicate e-mail, whatever its case', async () => {
    const email = freshEmail();
    await register(t.app, email);
    const res = await request(t.app).post('/api/auth/register').send({ email: ` ${email.toUpperCase()} `, password: PASSWORD, name: 'Twin' }).expect(409);
    expect(res.body.error).toMatch(/already exists/);
  });

  it.each([
    ['a bad e-mail', { email: 'not-an-address', password: PASSWORD, name: 'X' }],
    ['a short password', { email: 'short@example.test', password: 'abc12', name: 'X' }],
    ['a common password', { email: 'common@example.test', password: 'password123', name: 'X' }],
    ['a repetitive password', { email: 'rep@example.test', password: 'aaaaaaaaaaab', name: 'X' }],
    ['no name', { email: 'noname@example.test', password: PASSWORD }],
    ['a password past 72 bytes', { email: 'long@example.test', password: 'é'.repeat(40), name: 'X' }],
  ])('answers 400 with {error} to %s', async (_what, body) => {
    const res = await request(t.app).post('/api/auth/register').send(body).expect(400);
    expect(typeof res.body.error).toBe('string');
  });

  it('answers 400 to a body that is not JSON', async () => {
    const res = await request(t.app).post('/api/auth/register').set('Content-Type', 'application/json').send('{"email":').expect(400);
    expect(res.body.error).toMatch(/JSON/);
  });

  it('signs in with 200 and answers 401 to a wrong password or an unknown account', async () => {
    const { user } = await register(t.app);
    const ok = await request(t.app).post('/api/auth/login').send({ email: user.email, password: PASSWORD }).expect(200);
    expect(ok.body.user.id).toBe(user.id);
    await request(t.app).post('/api/auth/login').send({ email: user.email, password: 'wrong-password-1' }).expect(401);
    await request(t.app).post('/api/auth/login').send({ email: freshEmail(), password: PASSWORD }).expect(401);
  });

  it('a disabled account can neither sign in nor use its tokens', async () => {
    const someone = await register(t.app);
    const admin = await register(t.app);
    await makeAdmin(t, admin.user.id);
    await request(t.app).patch(`/api/admin/users/${someone.user.id}`).set(bearer(admin.accessToken)).send({ disabled: true }).expect(200);
    await request(t.app).post('/api/auth/login').send({ email: someone.user.email, password: PASSWORD }).expect(403);
    await request(t.app).get('/api/me').set(bearer(someone.accessToken)).expect(401);
    await request(t.app).post('/api/auth/refresh').send({ refreshToken: someone.refreshToken }).expect(401);
  });

  it('the site keeps its last enabled admin', async () => {
    const users = t.server.dataSource.getRepository(UserSchema);
    const admins = await users.findBy({ siteRole: 'admin' });
    const admin = await register(t.app);
    await users.update({ siteRole: 'admin' }, { siteRole: 'member' });
    await makeAdmin(t, admin.user.id);
    await request(t.app).patch(`/api/admin/users/${admin.user.id}`).set(bearer(admin.accessToken)).send({ siteRole: 'member' }).expect(409);
    for (const { id } of admins) await makeAdmin(t, id);
  });
});

describe('access tokens', () => {
  it('rejects a missing, malformed, tampered, foreign-key or expired token with 401', async () => {
    const { accessToken, user } = await register(t.app);
    const [head, payload, signature] = accessToken.split('.');
    const forged = Buffer.from(JSON.stringify({ ...JSON.parse(Buffer.from(payload, 'base64url').toString()), sub: 'someone-else' })).toString('base64url');
    const secret = t.server.config.jwt.secret;
    const expired = jwt.sign({}, secret, { algorithm: 'HS256', subject: user.id, issuer: 'gluefield', audience: 'gluefield-api', expiresIn: -10 });
    const otherKey = jwt.sign({}, 'another-secret-another-secret-another', { algorithm: 'HS256', subject: user.id, issuer: 'gluefield', audience: 'gluefield-api' });
    const unsigned = `${Buffer.from('{"alg":"none","typ":"JWT"}').toString('base64url')}.${payload}.`;
    const flipped = `${head}.${payload}.${signature.slice(0, -2)}${signature.endsWith('AA') ? 'BB' : 'AA'}`;
    await request(t.app).get('/api/me').expect(401);
    for (const token of [`${head}.${forged}.${signature}`, flipped, expired, otherKey, unsigned, 'garbage']) {
      const res = await request(t.app).get('/api/me').set(bearer(token)).expect(401);
      expect(typeof res.body.error).toBe('string');
    }
    const res = await request(t.app).get('/api/me').set(bearer(expired));
    expect(res.body.error).toMatch(/expired/);
  });
});

describe('refresh tokens', () => {
  it('rotate: each refresh returns a new pair and retires the old refresh token', async () => {
    const first = await register(t.app);
    const second = await request(t.app).post('/api/auth/refresh').send({ refreshToken: first.refreshToken }).expect(200);
    expect(second.body.refreshToken).not.toBe(first.refreshToken);
    await request(t.app).get('/api/me').set(bearer(second.body.accessToken)).expect(200);
    const third = await request(t.app).post('/api/auth/refresh').send({ refreshToken: second.body.refreshToken }).expect(200);
    expect(third.body.user.id).toBe(first.user.id);
  });

  it('reuse of a rotated token revokes the whole family, including the newest token', async () => {
    const first = await register(t.app);
    const second = await request(t.app).post('/api/auth/refresh').send({ refreshToken: first.refreshToken }).expect(200);
    const reuse = await request(t.app).post('/api/auth/refresh').send({ refreshToken: first.refreshToken }).expect(401);
    expect(reuse.body.error).toMatch(/already used/);
    await request(t.app).post('/api/auth/refresh').send({ refreshToken: second.body.refreshToken }).expect(401);
  });

  it('reuse revokes only that session: another sign-in of the same account goes on', async () => {
    const first = await register(t.app);
    const other = await request(t.app).post('/api/auth/login').send({ email: first.user.email, password: PASSWORD }).expect(200);
    await request(t.app).post('/api/auth/refresh').send({ refreshToken: first.refreshToken }).expect(200);
    await request(t.app).post('/api/auth/refresh').send({ refreshToken: first.refreshToken }).expect(401);
    await request(t.app).post('/api/auth/refresh').send({ refreshToken: other.body.refreshToken }).expect(200);
  });

  it('sign-out revokes the session; signing out twice is harmless', async () => {
    const s = await register(t.app);
    const rotated = await request(t.app).post('/api/auth/refresh').send({ refreshToken: s.refreshToken }).expect(200);
    await request(t.app).post('/api/auth/logout').send({ refreshToken: rotated.body.refreshToken }).expect(204);
    await request(t.app).post('/api/auth/logout').send({ refreshToken: rotated.body.refreshToken }).expect(204);
    await request(t.app).post('/api/auth/refresh').send({ refreshToken: rotated.body.refreshToken }).expect(401);
  });

  it('an expired or unknown refresh token is refused', async () => {
    const s = await register(t.app);
    await t.server.dataSource.getRepository(RefreshTokenSchema).update({ userId: s.user.id }, { expiresAt: '2000-01-01T00:00:00.000Z' });
    const res = await request(t.app).post('/api/auth/refresh').send({ refreshToken: s.refreshToken }).expect(401);
    expect(res.body.error).toMatch(/expired/);
    await request(t.app).post('/api/auth/refresh').send({ refreshToken: 'x'.repeat(43) }).expect(401);
    await request(t.app).post('/api/auth/refresh').send({}).expect(400);
  });

  it('are stored hashed, never as given', async () => {
    const s = await register(t.app);
    const rows = await t.server.dataSource.getRepository(RefreshTokenSchema).findBy({ userId: s.user.id });
    expect(rows.map((r) => r.tokenHash)).not.toContain(s.refreshToken);
    expect(rows[0].tokenHash).toMatch(/^[0-9a-f]{64}$/);
  });
});

describe('hardening', () => {
  it('limits sign-in attempts per address and account with 429', async () => {
    const limited = await startTestServer({ RATE_LIMIT_LOGIN: '3' });
    try {
      const { user } = await register(limited.app);
      for (let i = 0; i < 3; i++) await request(limited.app).post('/api/auth/login').send({ email: user.email, password: 'wrong-password-1' }).expect(401);
      const res = await request(limited.app).post('/api/auth/login').send({ email: user.email, password: PASSWORD }).expect(429);
      expect(res.body.error).toMatch(/too many/);
      await request(limited.app).post('/api/auth/password-reset').send({ email: user.email }).expect(202);
    } finally {
      await limited.stop();
    }
  });

  it('sends security headers and allows CORS only from the app origin', async () => {
    const res = await request(t.app).get('/api/health').set('Origin', 'http://app.test').expect(200);
    expect(res.body).toEqual({ ok: true });
    expect(res.headers['access-control-allow-origin']).toBe('http://app.test');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    const foreign = await request(t.app).get('/api/health').set('Origin', 'http://evil.test');
    expect(foreign.headers['access-control-allow-origin']).toBeUndefined();
  });

  it('answers unknown API routes with 404 {error}', async () => {
    const res = await request(t.app).get('/api/nothing-here').expect(404);
    expect(res.body.error).toBeTruthy();
  });
});
