import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { InvitationSchema, PasswordResetSchema } from '../../server/db/entities';
import { bearer, freshEmail, linkInMail, makeCrew, PASSWORD, register, startTestServer, type Crew, type TestServer } from './helpers';

let t: TestServer;
let crew: Crew;
beforeAll(async () => {
  t = await startTestServer();
  crew = await makeCrew(t);
});
afterAll(() => t.stop());

const tokenOf = (link: string) => link.split('/').pop()!;

describe('invitations by e-mail', () => {
  it('mail a one-time link under APP_ORIGIN that creates the account and joins the project', async () => {
    const email = freshEmail('newcomer');
    const res = await request(t.app).post(`/api/projects/${crew.projectId}/members`).set(bearer(crew.owner.accessToken)).send({ email, role: 'editor' }).expect(202);
    expect(res.body).toMatchObject({ invitation: { email, role: 'editor' }, mailed: true });

    const mail = t.server.sink!.messages().find((m) => m.to.includes(email))!;
    expect(mail.subject).toContain('Levelling net');
    expect(mail.text).toContain(crew.owner.user.name);
    const link = linkInMail(t, email);
    expect(link).toMatch(/^http:\/\/app\.test\/invitations\/[A-Za-z0-9_-]{43}$/);
    expect(mail.html).toContain(link);

    const token = tokenOf(link);
    const preview = await request(t.app).get(`/api/invitations/${token}`).expect(200);
    expect(preview.body).toMatchObject({ projectName: 'Levelling net', email, role: 'editor', hasAccount: false });

    const accepted = await request(t.app).post(`/api/invitations/${token}/accept`).send({ name: 'New Comer', password: PASSWORD }).expect(200);
    expect(accepted.body.project).toMatchObject({ id: crew.projectId, role: 'editor' });
    expect(accepted.body.user.email).toBe(email);
    await request(t.app).get(`/api/projects/${crew.projectId}/changes`).set(bearer(accepted.body.accessToken)).expect(200);
    await request(t.app).post('/api/auth/login').send({ email, password: PASSWORD }).expect(200);

    // One time only.
    await request(t.app).post(`/api/invitations/${token}/accept`).send({ name: 'Again', password: PASSWORD }).expect(410);
    await request(t.app).get(`/api/invitations/${token}`).expect(410);
  });

  it('can be accepted by signing in first, with the invited address only', async () => {
    const email = freshEmail('later');
    await request(t.app).post(`/api/projects/${crew.projectId}/members`).set(bearer(crew.owner.accessToken)).send({ email, role: 'viewer' }).expect(202);
    const token = tokenOf(linkInMail(t, email));
    const someoneElse = await register(t.app);
    await request(t.app).post(`/api/invitations/${token}/accept`).set(bearer(someoneElse.accessToken)).expect(403);
    const invited = await register(t.app, email);
    const res = await request(t.app).post(`/api/invitations/${token}/accept`).set(bearer(invited.accessToken)).expect(200);
    expect(res.body.project.role).toBe('viewer');
    expect(res.body.accessToken).toBeUndefined();
    const members = await request(t.app).get(`/api/projects/${crew.projectId}/members`).set(bearer(invited.accessToken)).expect(200);
    expect(members.body.members.find((m: { email: string }) => m.email === email).role).toBe('viewer');
  });

  it('expire, can be withdrawn, and are logged', async () => {
    const expiring = freshEmail('expiring');
    await request(t.app).post(`/api/projects/${crew.projectId}/members`).set(bearer(crew.owner.accessToken)).send({ email: expiring, role: 'viewer' }).expect(202);
    await t.server.dataSource.getRepository(InvitationSchema).update({ email: expiring }, { expiresAt: '2000-01-01T00:00:00.000Z' });
    await request(t.app).post(`/api/invitations/${tokenOf(linkInMail(t, expiring))}/accept`).send({ name: 'Late', password: PASSWORD }).expect(410);

    const withdrawn = freshEmail('withdrawn');
    const made = await request(t.app).post(`/api/projects/${crew.projectId}/members`).set(bearer(crew.admin.accessToken)).send({ email: withdrawn, role: 'viewer' }).expect(202);
    await request(t.app).delete(`/api/projects/${crew.projectId}/invitations/${made.body.invitation.id}`).set(bearer(crew.owner.accessToken)).expect(204);
    await request(t.app).post(`/api/invitations/${tokenOf(linkInMail(t, withdrawn))}/accept`).send({ name: 'No', password: PASSWORD }).expect(410);
    await request(t.app).get(`/api/invitations/${'A'.repeat(43)}`).expect(404);

    const audit = await request(t.app).get(`/api/projects/${crew.projectId}/audit?limit=500`).set(bearer(crew.viewer.accessToken)).expect(200);
    const actions = audit.body.entries.map((e: { action: string }) => e.action);
    expect(actions).toEqual(expect.arrayContaining(['invitation.create', 'invitation.accept', 'invitation.revoke', 'member.add', 'project.create']));
  });

  it('stores only a hash of the token', async () => {
    const email = freshEmail('hashed');
    await request(t.app).post(`/api/projects/${crew.projectId}/members`).set(bearer(crew.owner.accessToken)).send({ email, role: 'viewer' }).expect(202);
    const row = await t.server.dataSource.getRepository(InvitationSchema).findOneByOrFail({ email });
    expect(row.tokenHash).not.toBe(tokenOf(linkInMail(t, email)));
  });
});

describe('password reset by e-mail', () => {
  it('mails a one-time link that sets the new password and signs every session out', async () => {
    const someone = await register(t.app);
    await request(t.app).post('/api/auth/password-reset').send({ email: someone.user.email }).expect(202);
    const link = linkInMail(t, someone.user.email);
    expect(link).toMatch(/^http:\/\/app\.test\/reset-password\/[A-Za-z0-9_-]{43}$/);

    const newPassword = 'traverse-closure-7';
    await request(t.app).post('/api/auth/password-reset/confirm').send({ token: tokenOf(link), password: newPassword }).expect(200);
    await request(t.app).post('/api/auth/login').send({ email: someone.user.email, password: PASSWORD }).expect(401);
    await request(t.app).post('/api/auth/login').send({ email: someone.user.email, password: newPassword }).expect(200);
    await request(t.app).post('/api/auth/refresh').send({ refreshToken: someone.refreshToken }).expect(401);
    await request(t.app).post('/api/auth/password-reset/confirm').send({ token: tokenOf(link), password: 'another-one-99' }).expect(400);
  });

  it('answers the same for an unknown address and mails nothing', async () => {
    const before = t.server.sink!.messages().length;
    const res = await request(t.app).post('/api/auth/password-reset').send({ email: freshEmail('nobody') }).expect(202);
    expect(res.body).toEqual({ ok: true });
    expect(t.server.sink!.messages().length).toBe(before);
  });

  it('refuses an expired link, a weak new password and a made-up token', async () => {
    const someone = await register(t.app);
    await request(t.app).post('/api/auth/password-reset').send({ email: someone.user.email }).expect(202);
    const token = tokenOf(linkInMail(t, someone.user.email));
    await request(t.app).post('/api/auth/password-reset/confirm').send({ token, password: 'short' }).expect(400);
    await t.server.dataSource.getRepository(PasswordResetSchema).update({ userId: someone.user.id }, { expiresAt: '2000-01-01T00:00:00.000Z' });
    await request(t.app).post('/api/auth/password-reset/confirm').send({ token, password: 'traverse-closure-7' }).expect(400);
    await request(t.app).post('/api/auth/password-reset/confirm').send({ token: 'B'.repeat(43), password: 'traverse-closure-7' }).expect(400);
  });
});

describe('the Mailroom', () => {
  it('lists what the sink caught, newest first', async () => {
    const res = await request(t.app).get('/api/mailroom').expect(200);
    expect(res.body.messages.length).toBeGreaterThan(3);
    const [newest, older] = res.body.messages;
    expect(newest.receivedAt >= older.receivedAt).toBe(true);
    expect(newest).toMatchObject({ from: 'no-reply@gluefield.local', subject: expect.any(String), text: expect.any(String) });
  });

  it('is not there when mail goes to a real relay', async () => {
    const relay = await startTestServer({ SMTP_SINK: '0', SMTP_PORT: '1' });
    try {
      await request(relay.app).get('/api/mailroom').expect(404);
      // A relay that refuses does not undo the invitation; the answer says the mail was not sent.
      const c = await makeCrew(relay);
      const res = await request(relay.app).post(`/api/projects/${c.projectId}/members`).set(bearer(c.owner.accessToken)).send({ email: freshEmail(), role: 'viewer' }).expect(202);
      expect(res.body.mailed).toBe(false);
    } finally {
      await relay.stop();
    }
  });
});
