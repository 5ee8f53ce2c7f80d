import { gzipSync } from 'node:zlib';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bearer, freshEmail, makeCrew, register, startTestServer, type Crew, type TestServer } from './helpers';

type Who = 'admin' | 'owner' | 'editor' | 'viewer' | 'outsider' | 'anonymous';
const WHO: Who[] = ['admin', 'owner', 'editor', 'viewer', 'outsider', 'anonymous'];

interface Call {
  method: 'get' | 'post' | 'patch' | 'delete';
  path: string;
  body?: object;
  file?: Buffer;
}

interface Row {
  route: string;
  /** Expected status for admin, owner, editor, viewer, outsider (non-member), anonymous. */
  expect: [number, number, number, number, number, number];
  /** Build the request; runs fresh for every cell, so a cell's write never changes another's outcome. */
  call: (ctx: { t: TestServer; crew: Crew; who: Who }) => Promise<Call> | Call;
}

let t: TestServer;
let crew: Crew;
let uploadId: string;

const p = () => `/api/projects/${crew.projectId}`;
const tokenOf = (who: Who) => (who === 'anonymous' ? null : crew[who].accessToken);
let seq = 0;
const next = () => `cell-${++seq}`;

async function ownerAdds(role: 'viewer' | 'editor'): Promise<string> {
  const someone = await register(t.app, freshEmail('extra'));
  await request(t.app).post(`${p()}/members`).set(bearer(crew.owner.accessToken)).send({ email: someone.user.email, role }).expect(201);
  return someone.user.id;
}

async function ownerInvites(): Promise<string> {
  const res = await request(t.app).post(`${p()}/members`).set(bearer(crew.owner.accessToken)).send({ email: freshEmail('invitee'), role: 'viewer' }).expect(202);
  return res.body.invitation.id;
}

const ROWS: Row[] = [
  { route: 'GET /api/me', expect: [200, 200, 200, 200, 200, 401], call: () => ({ method: 'get', path: '/api/me' }) },
  { route: 'GET /api/projects', expect: [200, 200, 200, 200, 200, 401], call: () => ({ method: 'get', path: '/api/projects' }) },
  { route: 'POST /api/projects', expect: [201, 201, 201, 201, 201, 401], call: () => ({ method: 'post', path: '/api/projects', body: { name: next() } }) },
  { route: 'GET /api/projects/:id', expect: [200, 200, 200, 200, 404, 401], call: () => ({ method: 'get', path: p() }) },
  { route: 'PATCH /api/projects/:id', expect: [200, 200, 403, 403, 404, 401], call: () => ({ method: 'patch', path: p(), body: { name: 'Levelling net' } }) },
  { route: 'GET /api/projects/:id/members', expect: [200, 200, 200, 200, 404, 401], call: () => ({ method: 'get', path: `${p()}/members` }) },
  {
    route: 'POST /api/projects/:id/members (existing account)',
    expect: [201, 201, 403, 403, 404, 401],
    call: async () => ({ method: 'post', path: `${p()}/members`, body: { email: (await register(t.app, freshEmail('grantee'))).user.email, role: 'viewer' } }),
  },
  {
    route: 'POST /api/projects/:id/members (invitation)',
    expect: [202, 202, 403, 403, 404, 401],
    call: () => ({ method: 'post', path: `${p()}/members`, body: { email: freshEmail('invitee'), role: 'editor' } }),
  },
  {
    route: 'PATCH /api/projects/:id/members/:userId',
    expect: [200, 200, 403, 403, 404, 401],
    call: async () => ({ method: 'patch', path: `${p()}/members/${await ownerAdds('viewer')}`, body: { role: 'editor' } }),
  },
  {
    route: 'DELETE /api/projects/:id/members/:userId',
    expect: [204, 204, 403, 403, 404, 401],
    call: async () => ({ method: 'delete', path: `${p()}/members/${await ownerAdds('editor')}` }),
  },
  {
    route: 'DELETE /api/projects/:id/invitations/:invitationId',
    expect: [204, 204, 403, 403, 404, 401],
    call: async () => ({ method: 'delete', path: `${p()}/invitations/${await ownerInvites()}` }),
  },
  { route: 'GET /api/projects/:id/changes', expect: [200, 200, 200, 200, 404, 401], call: () => ({ method: 'get', path: `${p()}/changes?since=0` }) },
  {
    route: 'POST /api/projects/:id/changes',
    expect: [200, 200, 200, 403, 404, 401],
    call: () => ({ method: 'post', path: `${p()}/changes`, body: { changes: [{ changeId: next(), docId: next(), kind: 'note', baseVersion: 0, body: { text: 'x' } }] } }),
  },
  {
    route: 'POST /api/projects/:id/uploads',
    expect: [201, 201, 201, 403, 404, 401],
    call: () => ({ method: 'post', path: `${p()}/uploads`, file: gzipSync('{"format":"gluefield.sheaf"}') }),
  },
  { route: 'GET /api/uploads/:id', expect: [200, 200, 200, 200, 404, 401], call: () => ({ method: 'get', path: `/api/uploads/${uploadId}` }) },
  { route: 'GET /api/projects/:id/audit', expect: [200, 200, 200, 200, 404, 401], call: () => ({ method: 'get', path: `${p()}/audit` }) },
  { route: 'GET /api/admin/users', expect: [200, 403, 403, 403, 403, 401], call: () => ({ method: 'get', path: '/api/admin/users' }) },
  {
    route: 'PATCH /api/admin/users/:id',
    expect: [200, 403, 403, 403, 403, 401],
    call: ({ crew: c }) => ({ method: 'patch', path: `/api/admin/users/${c.outsider.user.id}`, body: { name: 'The outsider' } }),
  },
];

beforeAll(async () => {
  t = await startTestServer();
  crew = await makeCrew(t);
  const up = await request(t.app).post(`${p()}/uploads`).set(bearer(crew.editor.accessToken)).attach('file', gzipSync('{}'), { filename: 'm.json.gz', contentType: 'application/gzip' });
  uploadId = up.body.id;
});
afterAll(() => t.stop());

describe.each(ROWS)('$route', (row) => {
  it.each(WHO.map((who, i) => ({ who, status: row.expect[i] })))('answers $status to $who', async ({ who, status }) => {
    const call = await row.call({ t, crew, who });
    let req = request(t.app)[call.method](call.path);
    const token = tokenOf(who);
    if (token) req = req.set(bearer(token));
    const res = call.file
      ? await req.attach('file', call.file, { filename: 'model.sheaf.json.gz', contentType: 'application/gzip' })
      : call.body
        ? await req.send(call.body)
        : await req;
    expect(res.status, JSON.stringify(res.body)).toBe(status);
    if (status >= 400) expect(typeof res.body.error).toBe('string');
  });
});

describe('ids that name nothing', () => {
  it.each(['admin', 'owner', 'outsider'] as const)('a well-formed unknown project id is 404 to %s, as is a malformed one', async (who) => {
    const token = crew[who].accessToken;
    await request(t.app).get('/api/projects/8a0c3a8e-2f52-4f0e-9d0e-2d8f6f1f0b11/changes').set(bearer(token)).expect(404);
    await request(t.app).get('/api/projects/not-an-id/members').set(bearer(token)).expect(404);
    await request(t.app).get('/api/uploads/8a0c3a8e-2f52-4f0e-9d0e-2d8f6f1f0b11').set(bearer(token)).expect(404);
  });

  it('a non-member learns nothing: the same answer for an existing project as for none', async () => {
    const real = await request(t.app).get(`${p()}/changes`).set(bearer(crew.outsider.accessToken));
    const none = await request(t.app).get('/api/projects/8a0c3a8e-2f52-4f0e-9d0e-2d8f6f1f0b11/changes').set(bearer(crew.outsider.accessToken));
    expect([real.status, real.body]).toEqual([none.status, none.body]);
  });

  it('a member may leave a project without being an owner', async () => {
    const leaver = await register(t.app, freshEmail('leaver'));
    await request(t.app).post(`${p()}/members`).set(bearer(crew.owner.accessToken)).send({ email: leaver.user.email, role: 'viewer' }).expect(201);
    await request(t.app).delete(`${p()}/members/${leaver.user.id}`).set(bearer(leaver.accessToken)).expect(204);
    await request(t.app).get(p()).set(bearer(leaver.accessToken)).expect(404);
  });

  it('the last owner can be neither demoted nor removed', async () => {
    const path = `${p()}/members/${crew.owner.user.id}`;
    await request(t.app).patch(path).set(bearer(crew.admin.accessToken)).send({ role: 'viewer' }).expect(409);
    await request(t.app).delete(path).set(bearer(crew.owner.accessToken)).expect(409);
  });

  it('viewers see the crew but not the pending invitations', async () => {
    const asViewer = await request(t.app).get(`${p()}/members`).set(bearer(crew.viewer.accessToken)).expect(200);
    const asOwner = await request(t.app).get(`${p()}/members`).set(bearer(crew.owner.accessToken)).expect(200);
    expect(asViewer.body.invitations).toEqual([]);
    expect(asOwner.body.invitations.length).toBeGreaterThan(0);
    expect(asViewer.body.members.map((m: { role: string }) => m.role)).toContain('owner');
  });
});
